/**
 * `npm run bench`: platewise against peers measured in the same run. Prints a Markdown table (paste it into
 * the README's performance section) and writes bench-results.json. Never part of `npm test`.
 *
 * Usage: node dist/tests/bench/run.js [--quick] [--only name,name]
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ConstrainautorModule from '@kninnug/constrainautor';
import Delaunator from 'delaunator';
import earcut from 'earcut';
import { measureSection, preparePart } from '../../src/analysis/measure.js';
import { compileExpression } from '../../src/expr/index.js';
import { chordedBoundary } from '../../src/mesh/build.js';
import { panel, writePanel1250 } from './cases.js';
import { writeFormats, writeHolePlate, writeLoosePlate } from './drawings.js';
import { readFileSync } from 'node:fs';
import { pageBench } from './page.js';

const Constrainautor = ConstrainautorModule as unknown as new (del: Delaunator<ArrayLike<number>>) => { constrainOne(a: number, b: number): void };
const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');
const args = process.argv.slice(2);
const quick = args.includes('--quick');
const onlyArg = args.indexOf('--only');
const only = onlyArg >= 0 ? new Set(args[onlyArg + 1].split(',')) : null;
const want = (name: string) => only === null || only.has(name);

/** Median wall time in ms of `reps` runs after one warm-up; a run slower than 2 s is timed once. */
function time(fn: () => unknown, reps = quick ? 3 : 7): number {
  const t0 = performance.now();
  fn();
  const first = performance.now() - t0;
  if (first > 2000) return first;
  const ts: number[] = [];
  for (let i = 0; i < reps; i++) {
    const t = performance.now();
    fn();
    ts.push(performance.now() - t);
  }
  ts.sort((a, b) => a - b);
  return ts[ts.length >> 1];
}

/** A table row; `inProcess` rows time code inside one process (diagnosis), printed in a second, labelled table. */
interface Row { case: string; ours: string; peer: string; ratio: string; target: string; met: string; inProcess?: true }
const rows: Row[] = [];
const results: Record<string, unknown> = {};
const f = (ms: number) => ms < 10 ? ms.toFixed(2) : ms.toFixed(0);

function peerTriangulations(coords: Float64Array, loopStarts: number[]) {
  const n = coords.length / 2;
  const holes = loopStarts.slice(1);
  const flat = Array.from(coords);
  const edges: [number, number][] = [];
  for (let l = 0; l < loopStarts.length; l++) {
    const a = loopStarts[l], b = l + 1 < loopStarts.length ? loopStarts[l + 1] : n;
    for (let i = a; i < b; i++) edges.push([i, i + 1 < b ? i + 1 : a]);
  }
  const tEarcut = time(() => earcut(flat, holes));
  const tDel = time(() => {
    const d = new Delaunator(coords);
    const c = new Constrainautor(d);
    for (const [a, b] of edges) c.constrainOne(a, b);
  });
  return { tEarcut, tDel };
}

function panelCase(name: string, nx: number, ny: number, d: number) {
  const part = preparePart(panel(2000, 1000, nx, ny, d));
  const { coords, loopStarts } = chordedBoundary(part);
  const { tEarcut, tDel } = peerTriangulations(coords, loopStarts);
  const tOurs = time(() => measureSection(part), quick ? 3 : 5);
  const best = Math.min(tEarcut, tDel);
  const r = tOurs / best;
  results[name] = { vertices: coords.length / 2, oursMs: tOurs, earcutMs: tEarcut, delaunatorConstrainautorMs: tDel, ratio: r };
  rows.push({ case: `${name}: measure vs bare triangulation of the same boundary (${coords.length / 2} vertices)`, ours: f(tOurs), peer: `earcut ${f(tEarcut)}, delaunator+constrainautor ${f(tDel)}`, ratio: r.toFixed(2), target: name === 'panel-1250' ? '≤ 1.5' : '—', met: name === 'panel-1250' ? (r <= 1.5 ? 'yes' : 'no') : '—', inProcess: true });
}

if (want('panel-1250')) panelCase('panel-1250', 50, 25, 20);
if (want('panel-10000') && !quick) panelCase('panel-10000', 200, 50, 6);

if (want('scaling')) {
  // straight-edged parts from 10^3 to 10^6 vertices, each in a fresh process for a clean peak-memory reading
  const sizes = quick ? [1e3, 1e4, 1e5] : [1e3, 1e4, 1e5, 1e6];
  const pts: { n: number; ms: number; greenMs: number; meshMs?: number; rssMB: number }[] = [];
  for (const n of sizes) {
    const r = spawnSync(process.execPath, [join(ROOT, 'dist', 'tests', 'bench', 'child.js'), 'square', String(n)], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`child failed for n=${n}: ${r.stderr}`);
    pts.push(JSON.parse(r.stdout));
  }
  const a = pts[0], b = pts[pts.length - 1];
  const exponent = Math.log(b.ms / a.ms) / Math.log(b.n / a.n);
  results.scaling = { points: pts, exponent };
  for (const p of pts) rows.push({ case: `straight plate, ${p.n} vertices: measure vs Green's-theorem boundary formula`, ours: f(p.ms), peer: `green ${f(p.greenMs)}`, ratio: (p.ms / p.greenMs).toFixed(1), target: '—', met: '—', inProcess: true });
  rows.push({ case: `growth exponent of measure time, ${a.n}→${b.n} vertices`, ours: exponent.toFixed(3), peer: '', ratio: '', target: '≤ 1.15', met: exponent <= 1.15 ? 'yes' : 'no', inProcess: true });
  const meshPts = pts.filter((p) => p.meshMs !== undefined) as { n: number; meshMs: number }[];
  if (meshPts.length >= 2) {
    const m0 = meshPts[0], m1 = meshPts[meshPts.length - 1];
    const e = Math.log(m1.meshMs / m0.meshMs) / Math.log(m1.n / m0.n);
    rows.push({ case: `growth exponent of the mesh path (--method mesh), ${m0.n}→${m1.n} vertices`, ours: e.toFixed(3), peer: meshPts.map((p) => `${p.n}: ${f(p.meshMs)} ms`).join(', '), ratio: '', target: '(≤ 1.15)', met: e <= 1.15 ? 'yes' : 'no', inProcess: true });
  }
  const big = pts.find((p) => p.n >= 1e6);
  if (big) rows.push({ case: 'peak memory (max RSS) at 10^6 vertices', ours: `${big.rssMB.toFixed(0)} MB`, peer: '', ratio: '', target: '< 1024 MB', met: big.rssMB < 1024 ? 'yes' : 'no', inProcess: true });
}

if (want('expression')) {
  const e = compileExpression('20 - 0.025*x + 0.001*x*y', 'bench').evaluate;
  const hand = (x: number, y: number) => 20 - 0.025 * x + 0.001 * x * y;
  const N = quick ? 2e6 : 1e7;
  let sink = 0;
  // two separate loops, so that each call site sees only its own function (a shared call site would
  // turn polymorphic and slow down whichever runs second)
  const runCompiled = () => { let s = 0; for (let i = 0; i < N; i++) s += e(i * 1e-3, 7 - i * 1e-4); sink += s; };
  const runHand = () => { let s = 0; for (let i = 0; i < N; i++) s += hand(i * 1e-3, 7 - i * 1e-4); sink += s; };
  const th = time(runHand), tc = time(runCompiled);
  results.expression = { compiledMs: tc, handMs: th, speed: th / tc, sink };
  rows.push({ case: `expression, ${N} evaluations: compiled vs hand-written JavaScript`, ours: f(tc), peer: `hand ${f(th)}`, ratio: (tc / th).toFixed(2), target: 'speed ≥ 0.5 of hand-written (ratio ≤ 2)', met: tc / th <= 2 ? 'yes' : 'no', inProcess: true });
}

if (want('startup')) {
  // alternated run by run, so that changing load from others falls on both alike
  const [tn, tm] = wallPair(['-e', '0'], [join(ROOT, 'dist', 'cli', 'main.js'), 'measure', join(ROOT, 'samples', 'base-plate-bp1.json')], quick ? 7 : 15);
  results.startup = { nodeMs: tn, measureMs: tm, ratio: tm / tn };
  rows.push({ case: 'start-up: `platewise measure` of a small part vs `node -e 0` (wall time)', ours: f(tm), peer: `node ${f(tn)}`, ratio: (tm / tn).toFixed(2), target: '≤ 1.8', met: tm / tn <= 1.8 ? 'yes' : 'no' });
}

if (want('batch')) {
  // 1,000 small generated parts (invented), measured by the batch command with one and with two workers
  const dir = join(tmpdir(), `platewise-bench-batch-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const n = quick ? 200 : 1000;
  for (let i = 0; i < n; i++) {
    const w = 100 + (i % 37) * 5, h = 60 + (i % 23) * 4;
    writeFileSync(join(dir, `p${i}.json`), JSON.stringify({ part: `bench ${i}`, note: 'generated for the benchmark', outline: { rectangle: { corner: [0, 0], size: [w, h], cornerRadius: 5 } }, cutouts: [{ circle: { center: [w / 3, h / 2], diameter: 12 } }, { circle: { center: [2 * w / 3, h / 2], diameter: 12 } }] }));
  }
  const run = (jobs: number) => {
    const out = join(dir, `out-${jobs}.csv`);
    rmSync(out, { force: true });
    const t = performance.now();
    const r = spawnSync(process.execPath, [join(ROOT, 'dist', 'cli', 'main.js'), 'batch', dir, '--jobs', String(jobs), '-o', out, '--force'], { encoding: 'utf8' });
    const ms = performance.now() - t;
    if (r.status === null || r.status > 1) throw new Error(`batch failed: ${r.stderr}`);
    return ms;
  };
  // alternated (1, 2, 1, 2, …), medians: the machine is shared, and its load changes within a minute
  const t1s: number[] = [], t2s: number[] = [];
  for (let k = 0; k < (quick ? 3 : 5); k++) { t1s.push(run(1)); t2s.push(run(2)); }
  const median = (a: number[]) => a.sort((x, y) => x - y)[a.length >> 1];
  const t1 = median(t1s), t2 = median(t2s);
  rmSync(dir, { recursive: true, force: true });
  results.batch = { parts: n, oneWorkerMs: t1, twoWorkersMs: t2, speedup: t1 / t2 };
  rows.push({ case: `batch of ${n} small parts: 2 workers vs 1`, ours: `${f(t2)} (2 workers)`, peer: `${f(t1)} (1 worker)`, ratio: (t1 / t2).toFixed(2) + '× faster', target: '≥ 1.6×', met: t1 / t2 >= 1.6 ? 'yes' : 'no' });
}

/** Whole-process wall time (median of `reps`, alternating the commands so that load falls on both alike). */
function wallPair(a: string[], b: string[], reps: number): [number, number] {
  const ta: number[] = [], tb: number[] = [];
  const one = (argv: string[]) => {
    const t = performance.now();
    const r = spawnSync(process.execPath, argv, { cwd: ROOT, encoding: 'utf8', maxBuffer: 1 << 28 });
    if (r.status !== 0) throw new Error(`${argv.join(' ')} failed: ${r.stderr}`);
    return performance.now() - t;
  };
  for (let i = 0; i < reps; i++) { ta.push(one(a)); tb.push(one(b)); }
  ta.sort((x, y) => x - y); tb.sort((x, y) => x - y);
  return [ta[ta.length >> 1], tb[tb.length >> 1]];
}

if (want('torsion')) {
  // whole processes of tests/bench/torsion.js (order 3, the bench plate): wall time, and the child's own
  // line (triangles, iterations, peak RSS); growth exponents of time and memory per 4× triangles
  const run = (minTriangles: number) => {
    const t = performance.now();
    const r = spawnSync(process.execPath, [join(ROOT, 'dist', 'tests', 'bench', 'torsion.js'), String(minTriangles), '3'], { cwd: ROOT, encoding: 'utf8' });
    const ms = performance.now() - t;
    if (r.status !== 0) throw new Error(`torsion bench failed: ${r.stderr}`);
    const tri = Number(/(\d+) triangles/.exec(r.stdout)![1]), rss = Number(/rss (\d+) MiB/.exec(r.stdout)![1]);
    return { minTriangles, ms, tri, rss, line: r.stdout.trim() };
  };
  const pts = (quick ? [1300, 5200] : [1300, 5200, 20800]).map(run);
  results.torsion = pts;
  const p0 = pts[0];
  rows.push({ case: `torsion and shear centre, ${p0.tri} curved-mesh triangles, order 3 (whole process)`, ours: f(p0.ms), peer: '', ratio: '', target: '', met: '' });
  // the mesh sizes come in steps of 4×, so 10^4 triangles is read off the measured points around it
  // (log-log interpolation between the two that bracket it), and said so
  const k4 = pts.findIndex((p) => p.tri >= 1e4);
  if (k4 > 0) {
    const a = pts[k4 - 1], b = pts[k4];
    const at = a.ms * Math.exp((Math.log(b.ms / a.ms) * Math.log(1e4 / a.tri)) / Math.log(b.tri / a.tri));
    rows.push({ case: `torsion and shear centre at 10^4 triangles (interpolated between the measured ${a.tri} and ${b.tri})`, ours: f(at), peer: '', ratio: '', target: '≤ 2000 ms', met: at <= 2000 ? 'yes' : 'no' });
  }
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1], b = pts[i], k = Math.log(b.tri / a.tri);
    const et = Math.log(b.ms / a.ms) / k, em = Math.log(b.rss / a.rss) / k;
    rows.push({ case: `torsion growth ${a.tri}→${b.tri} triangles: time, memory exponents`, ours: `${et.toFixed(2)}, ${em.toFixed(2)}`, peer: `${f(b.ms)} ms, ${b.rss} MiB`, ratio: '', target: '≤ 1.2', met: et <= 1.2 && em <= 1.2 ? 'yes' : 'no' });
  }
}

if (want('drawings')) {
  // reading drawings: the same plate in two formats, whole process against whole process
  const dir = join(tmpdir(), `platewise-bench-drawings-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const cli = join(ROOT, 'dist', 'cli', 'main.js');
  const n = 100_000;
  const h = writeHolePlate(dir, n);
  const [tSvg, tJson] = wallPair([cli, 'measure', h.svg, '--json'], [cli, 'measure', h.json, '--json'], quick ? 3 : 5);
  results.svgHoles = { holes: n, svgMs: tSvg, partJsonMs: tJson, ratio: tSvg / tJson };
  rows.push({ case: `SVG with ${n} holes: read + measure vs the same part as part JSON`, ours: f(tSvg), peer: `part JSON ${f(tJson)}`, ratio: (tSvg / tJson).toFixed(2), target: '≤ 2', met: tSvg / tJson <= 2 ? 'yes' : 'no' });
  const e = 10_000;
  const l = writeLoosePlate(dir, e);
  const [tDxf, tSvg2] = wallPair([cli, 'measure', l.dxf, '--json'], [cli, 'measure', l.svg, '--json'], quick ? 3 : 5);
  results.dxfEntities = { entities: e, dxfMs: tDxf, svgMs: tSvg2, ratio: tDxf / tSvg2 };
  rows.push({ case: `DXF of ${e} loose LINE entities: read, join + measure vs the same geometry as SVG`, ours: f(tDxf), peer: `SVG ${f(tSvg2)}`, ratio: (tDxf / tSvg2).toFixed(2), target: '≤ 2', met: tDxf / tSvg2 <= 2 ? 'yes' : 'no' });
  rmSync(dir, { recursive: true, force: true });
}


/** Whole-process wall times of several commands, alternated run by run (load falls on all alike); medians. */
function wallMany(cmds: string[][], reps: number): number[] {
  const ts: number[][] = cmds.map(() => []);
  for (let i = 0; i < reps; i++) {
    cmds.forEach((argv, k) => {
      const t = performance.now();
      const r = spawnSync(process.execPath, argv, { cwd: ROOT, encoding: 'utf8', maxBuffer: 1 << 28 });
      if (r.status !== 0) throw new Error(`${argv.join(' ')} failed: ${r.stderr}`);
      ts[k].push(performance.now() - t);
    });
  }
  return ts.map((t) => { t.sort((a, b) => a - b); return t[t.length >> 1]; });
}

/** One whole-process run under the in-process wrapper: wall time (ms), peak RSS (MB) and stdout. */
function runWithRss(args: string[]): { ms: number; rssMB: number; stdout: string } {
  const out = join(tmpdir(), `platewise-rss-${process.pid}.txt`);
  const t = performance.now();
  const r = spawnSync(process.execPath, [join(ROOT, 'dist', 'tests', 'bench', 'rss.js'), ...args], { cwd: ROOT, encoding: 'utf8', maxBuffer: 1 << 28, env: { ...process.env, PW_RSS_OUT: out } });
  const ms = performance.now() - t;
  if (r.status !== 0) throw new Error(`${args.join(' ')} failed: ${r.stderr}`);
  const rssMB = Number(readFileSync(out, 'utf8'));
  rmSync(out, { force: true });
  return { ms, rssMB, stdout: r.stdout };
}

if (want('processes')) {
  // issue 14: the 2000 × 1000 panel with 1,250 round holes Ø20, whole process against whole process
  const dir = join(tmpdir(), `platewise-bench-processes-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const file = writePanel1250(dir);
  const cli = join(ROOT, 'dist', 'cli', 'main.js'), peers = join(ROOT, 'dist', 'tests', 'bench', 'peers.js');
  // σ = 2 bump at (40, 40), a corner between four holes: ∫∫ exp(−r²/2σ²) over the plane = 2πσ² = 8π; the
  // rectangle's edges cut it at 40 = 20σ (the erf factors erf(40/(σ√2)) and erf(1960/(σ√2)) are 1 in
  // doubles: erfc(14) < 1e-86) and the holes lie ≥ 18.28 away (their share < 2e-17 relative)
  const bump = 'exp(-((x-40)^2+(y-40)^2)/8)';
  // a polynomial load: over the rectangle ∫∫(1 + 0.001xy) = 2·10⁶ + 0.001·(2000²/2)(1000²/2); over a hole of
  // radius r centred at (cx, cy) πr²(1 + 0.001·cx·cy), since ∫(x − cx)(y − cy) vanishes on a disc (elementary)
  const poly = '1 + 0.001*x*y';
  let polyExact = 2e6 + 0.001 * (2000 ** 2 / 2) * (1000 ** 2 / 2);
  for (let i = 0; i < 50; i++) for (let j = 0; j < 25; j++) polyExact -= Math.PI * 100 * (1 + 0.001 * (i + 0.5) * 40 * (j + 0.5) * 40);
  const cases: [string, string[]][] = [
    ['peer: bare triangulation (Delaunator + Constrainautor, 64 chords per hole)', [peers, 'tri', file]],
    ['peer: exact boundary-integral script', [peers, 'exact', file]],
    ['measure --json', [cli, 'measure', file, '--json']],
    ['measure --json --thickness 8 --material steel (constant)', [cli, 'measure', file, '--json', '--thickness', '8', '--material', 'steel']],
    ['measure --json --thickness "8 + 0.001*x" --material steel (polynomial)', [cli, 'measure', file, '--json', '--thickness', '8 + 0.001*x', '--material', 'steel']],
    ['measure --json --thickness "8 + sin(x/100)" --material steel (not polynomial)', [cli, 'measure', file, '--json', '--thickness', '8 + sin(x/100)', '--material', 'steel']],
    [`integrate --json --expr "${bump}"`, [cli, 'integrate', file, '--json', '--expr', bump]],
    ['measure --json --method mesh', [cli, 'measure', file, '--json', '--method', 'mesh']],
    [`integrate --json --expr "${poly}" (polynomial: boundary path)`, [cli, 'integrate', file, '--json', '--expr', poly]],
  ];
  const ms = wallMany(cases.map((c) => c[1]), quick ? 3 : 7);
  const [tri, exact] = ms;
  const targets: Record<number, [string, number, 'tri' | 'exact']> = { 2: ['≤ 0.5× triangulation', 0.5, 'tri'], 4: ['≤ 0.6× triangulation', 0.6, 'tri'], 5: ['≤ 1.5× triangulation', 1.5, 'tri'], 6: ['≤ 1.5× triangulation', 1.5, 'tri'] };
  const integralOf = (i: number) => JSON.parse(spawnSync(process.execPath, cases[i][1], { cwd: ROOT, encoding: 'utf8' }).stdout).quantities.integral as { value: number; error: number };
  const I = integralOf(6), P = integralOf(8);
  const trueRel = Math.abs(I.value - 8 * Math.PI) / (8 * Math.PI);
  const polyRel = Math.abs(P.value - polyExact) / Math.abs(polyExact);
  results.processes = { panelHoles: 1250, ms: Object.fromEntries(cases.map((c, i) => [c[0], ms[i]])), integral: I, integralTrueRelError: trueRel, polynomialIntegral: P, polynomialTrueRelError: polyRel };
  cases.forEach(([name], i) => {
    if (i < 2) { rows.push({ case: `panel-1250 whole process: ${name}`, ours: '', peer: f(ms[i]), ratio: '', target: '', met: '' }); return; }
    const t = targets[i];
    rows.push({ case: `panel-1250 whole process: ${name}`, ours: f(ms[i]), peer: `tri ${f(tri)}, exact ${f(exact)}`, ratio: `${(ms[i] / tri).toFixed(2)}× tri, ${(ms[i] / exact).toFixed(2)}× exact`, target: t ? t[0] : '—', met: t ? (ms[i] / (t[2] === 'tri' ? tri : exact) <= t[1] ? 'yes' : 'no') : '—' });
  });
  rows.push({ case: 'panel-1250 whole process: measure --json vs the exact boundary-integral script', ours: f(ms[2]), peer: `exact ${f(exact)}`, ratio: (ms[2] / exact).toFixed(2), target: '≤ 2', met: ms[2] / exact <= 2 ? 'yes' : 'no' });
  rows.push({ case: `integrate of the Gaussian bump: true error against 2πσ² (erf factors 1)`, ours: `${trueRel.toExponential(2)} (estimate ${(I.error / I.value).toExponential(2)})`, peer: '', ratio: '', target: '≤ 1e-13', met: trueRel <= 1e-13 ? 'yes' : 'no' });
  rows.push({ case: `integrate of ${poly}: true error against the closed form`, ours: `${polyRel.toExponential(2)} (estimate ${(P.error / Math.abs(P.value)).toExponential(2)})`, peer: '', ratio: '', target: 'estimate ≥ true error', met: Math.abs(P.value - polyExact) <= P.error ? 'yes' : 'no' });
  rmSync(dir, { recursive: true, force: true });
}

if (want('page')) {
  // issue 18: the same panel measured in the page through Chromium, against the command line's whole process
  const dir = join(tmpdir(), `platewise-bench-page-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const p = await pageBench(ROOT, writePanel1250(dir), quick ? 3 : 7);
  results.page = p;
  const ratio = p.pageMs / p.cliMs;
  rows.push({ case: `panel-1250 in the page (Chromium, the page's own clock: open the page → worker ready, plus file taken → figures shown; through Playwright with its round trips ${f(p.harnessMs)}; worker alone ${f(p.workerMs)}; drawing shown too ${f(p.drawnMs)})${p.equal ? '' : ' — AREA DIFFERS'}`, ours: f(p.pageMs), peer: `measure --json ${f(p.cliMs)}`, ratio: ratio.toFixed(2), target: '≤ 2', met: ratio <= 2 && p.equal ? 'yes' : 'no' });
  rmSync(dir, { recursive: true, force: true });
}

if (want('formats')) {
  // growth from 10^5 to 10^6 boundary vertices, the same plate in five formats, one whole process each,
  // with peak memory; boundary path by default, the mesh path for part JSON
  const dir = join(tmpdir(), `platewise-bench-formats-${process.pid}`);
  mkdirSync(dir, { recursive: true });
  const sizes = quick ? [1e4, 1e5] : [1e5, 1e6];
  const files = sizes.map((n) => writeFormats(dir, n));
  const runs: { name: string; args: (p: Record<string, string>) => string[] }[] = [
    { name: 'part JSON', args: (p) => ['measure', p.json, '--json'] },
    { name: 'SVG', args: (p) => ['measure', p.svg, '--json'] },
    { name: 'GeoJSON', args: (p) => ['measure', p.geojson, '--json', '--units', 'mm'] },
    { name: 'WKT', args: (p) => ['measure', p.wkt, '--json', '--units', 'mm'] },
    { name: 'DXF', args: (p) => ['measure', p.dxf, '--json'] },
    { name: 'part JSON, --method mesh', args: (p) => ['measure', p.json, '--json', '--method', 'mesh'] },
  ];
  const fr: Record<string, unknown> = {};
  for (const r of runs) {
    const pts = files.map((p) => runWithRss(r.args(p)));
    const e = Math.log(pts[1].ms / pts[0].ms) / Math.log(sizes[1] / sizes[0]);
    const mesh = r.name.includes('mesh');
    const limit = mesh ? 600 : 300;
    fr[r.name] = { sizes, ms: pts.map((p) => p.ms), rssMB: pts.map((p) => p.rssMB), exponent: e };
    rows.push({ case: `${r.name}: growth ${sizes[0]}→${sizes[1]} vertices (whole process)`, ours: pts.map((p) => f(p.ms)).join(' → '), peer: '', ratio: `exponent ${e.toFixed(2)}`, target: '≤ 1.1', met: e <= 1.1 ? 'yes' : 'no' });
    rows.push({ case: `${r.name}: peak memory at ${sizes[1]} vertices`, ours: `${pts[1].rssMB.toFixed(0)} MB`, peer: '', ratio: '', target: `≤ ${limit} MB`, met: pts[1].rssMB <= limit ? 'yes' : 'no' });
  }
  results.formats = fr;
  rmSync(dir, { recursive: true, force: true });
}

const head = `Run ${new Date().toISOString().slice(0, 10)} on ${availableParallelism()} cores (${cpus()[0]?.model ?? 'unknown CPU'}), Node ${process.version}. Times in ms (median).`;
const tableOf = (rs: Row[]) => ['| case | platewise | peers | ratio | target | met |', '|---|---|---|---|---|---|', ...rs.map((r) => `| ${r.case} | ${r.ours} | ${r.peer} | ${r.ratio} | ${r.target} | ${r.met} |`)].join('\n');
const whole = rows.filter((r) => !r.inProcess), inside = rows.filter((r) => r.inProcess);
console.log(head + '\n\nWhole processes against peer processes of the same run:\n\n' + tableOf(whole)
  + (inside.length > 0 ? '\n\nIn-process figures (code timed inside one process: for diagnosis, and the in-process targets of earlier rounds):\n\n' + tableOf(inside) : ''));
writeFileSync(join(ROOT, 'bench-results.json'), JSON.stringify({ date: new Date().toISOString(), cores: availableParallelism(), results }, null, 2) + '\n');
