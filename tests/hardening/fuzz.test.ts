/**
 * Seeded parser fuzzing (reproducible: mulberry32 from tests/helpers.ts, fixed seeds). Each case must either
 * succeed or throw InputError; anything else fails the test with the seed, case number and input printed.
 * Every case is timed and must finish within 1 s (a bound on hangs, not a benchmark).
 * Targets: SVG path data (parsePathData), whole SVG documents (readSvg + preparePart + measureSection),
 * the expression language (compileExpression + evaluate), part files (readPlateModel/readParts +
 * preparePart + measureSection) and GeoJSON/WKT text (readParts + preparePart).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { measureSection, preparePart } from '../../src/analysis/measure.js';
import { InputError, MethodError } from '../../src/base/errors.js';
import { compileExpression } from '../../src/expr/index.js';
import { type Part, loopSignedArea } from '../../src/geometry/part.js';
import { readPlateModel } from '../../src/read/partJson.js';
import { readParts } from '../../src/read/read.js';
import { parsePathData, readSvg } from '../../src/read/svg.js';
import { rng } from '../helpers.js';

const ROOT = join(import.meta.dirname, '..', '..');
const sample = (f: string) => readFileSync(join(ROOT, 'samples', f), 'utf8');
type Rand = () => number;
const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;
const int = (r: Rand, n: number) => Math.floor(r() * n);

export const fuzzCounts: Record<string, { cases: number; accepted: number; refused: number; slowestMs: number }> = {};

/** Run `n` cases; `make(r, i)` builds the input, `run(input)` exercises the code under test. */
function fuzz<T>(name: string, seed: number, n: number, make: (r: Rand, i: number) => T, run: (input: T) => void): void {
  const r = rng(seed);
  const c = { cases: 0, accepted: 0, refused: 0, slowestMs: 0 };
  fuzzCounts[name] = c;
  for (let i = 0; i < n; i++) {
    const input = make(r, i);
    const t0 = performance.now();
    try {
      run(input);
      c.accepted++;
    } catch (e) {
      // bad input (InputError) or a method giving up on what it was given (MethodError, e.g. the triangulator)
      if (!(e instanceof InputError) && !(e instanceof MethodError)) {
        throw new Error(`${name}: seed ${seed}, case ${i}: ${(e as Error)?.stack ?? e}\ninput: ${JSON.stringify(input).slice(0, 4000)}`);
      }
      // the message is one line naming a place
      if (e.message.includes('\n')) throw new Error(`${name}: seed ${seed}, case ${i}: message of several lines: ${JSON.stringify(e.message)}`);
      c.refused++;
    }
    const ms = performance.now() - t0;
    c.slowestMs = Math.max(c.slowestMs, ms);
    c.cases++;
    // no wall-clock assertion (tests never assert on time): the slowest case is printed, and a hang ends at the test timeout
  }
}

/** Measure every part (small meshes only: the fuzz is about crashes and hangs, not accuracy). */
function measureAll(parts: Part[]): void {
  for (const p of parts) {
    const res = measureSection(p);
    const q = res.quantities;
    // invariant: the measured area equals the exact boundary area (Green's theorem on the exact curves)
    let exact = 0;
    for (const r of res.geometry.part.regions) exact += Math.abs(loopSignedArea(r.outer)) - r.holes.reduce((a, h) => a + Math.abs(loopSignedArea(h)), 0);
    if (!(Math.abs(q.area.value - exact) <= q.area.error + 1e-9 * Math.abs(exact))) throw new Error(`measured area ${q.area.value} ± ${q.area.error}, exact boundary area ${exact}`);
    for (const [k, v] of Object.entries(q)) {
      if (!Number.isFinite(v.value) && k !== 'principalAngle') throw new Error(`measure gave ${k} = ${v.value} for an accepted part`);
    }
  }
}

// ---------------------------------------------------------------------------------------------
const PATH_TOKENS = ['M', 'm', 'L', 'l', 'H', 'h', 'V', 'v', 'C', 'c', 'S', 's', 'Q', 'q', 'T', 't', 'A', 'a', 'Z', 'z', 'X', 'B', 'R',
  ' ', ',', ' ', '-', '.', 'e', 'E', '+', '0', '1', '10', '-5', '.5', '1e3', '1e-3', '1e999', '-1e999', '1e308', '1e-400', 'NaN', 'Infinity',
  '100', '50.5', '0 0', '1 1', '1 0 0 1 1', '0.5.5', '1e', '--1', '\t', '\n', '\u00a0', '#', '(', ')', '1,', '5 5 0 1 0 10 10'];

function randomPath(r: Rand): string {
  const n = 1 + int(r, 40);
  let s = r() < 0.8 ? 'M' + int(r, 100) + ' ' + int(r, 100) + ' ' : '';
  for (let i = 0; i < n; i++) s += pick(r, PATH_TOKENS) + (r() < 0.5 ? ' ' : '');
  if (r() < 0.5) s += 'Z';
  return s;
}

/** A plausible closed path: random commands with sensible numbers (exercises the geometry, not the lexer). */
function plausiblePath(r: Rand): string {
  const cmds = ['L', 'H', 'V', 'C', 'S', 'Q', 'T', 'A', 'l', 'c', 'a', 'q'];
  const num = () => (r() * 200 - 50).toFixed(int(r, 4));
  const args: Record<string, () => string> = {
    L: () => `${num()} ${num()}`, l: () => `${num()} ${num()}`, H: num, V: num,
    C: () => Array.from({ length: 6 }, num).join(' '), c: () => Array.from({ length: 6 }, num).join(' '),
    S: () => Array.from({ length: 4 }, num).join(' '), Q: () => Array.from({ length: 4 }, num).join(' '), q: () => Array.from({ length: 4 }, num).join(' '),
    T: () => `${num()} ${num()}`,
    A: () => `${Math.abs(+num())} ${Math.abs(+num())} ${int(r, 360)} ${int(r, 2)} ${int(r, 2)} ${num()} ${num()}`,
    a: () => `${Math.abs(+num())} ${Math.abs(+num())} ${int(r, 360)} ${int(r, 2)} ${int(r, 2)} ${num()} ${num()}`,
  };
  let s = `M${num()} ${num()}`;
  const n = 2 + int(r, 8);
  for (let i = 0; i < n; i++) { const c = pick(r, cmds); s += ` ${c}${args[c]()}`; }
  return s + ' Z';
}

function mutateText(r: Rand, text: string, alphabet: readonly string[]): string {
  let t = text;
  const k = 1 + int(r, 4);
  for (let j = 0; j < k; j++) {
    const a = int(r, t.length + 1), b = Math.min(t.length, a + int(r, 30));
    switch (int(r, 5)) {
      case 0: t = t.slice(0, a) + t.slice(b); break; // delete a range
      case 1: t = t.slice(0, a) + pick(r, alphabet) + t.slice(a); break; // insert a token
      case 2: t = t.slice(0, a) + t.slice(a, b) + t.slice(a); break; // duplicate a range
      case 3: t = t.slice(0, a) + pick(r, alphabet) + t.slice(b); break; // replace a range
      default: t = t.slice(0, a); break; // truncate
    }
  }
  return t;
}

const SVG_TOKENS = ['<', '>', '/>', '</g>', '<g>', '<g transform="scale(0)">', '<g transform="rotate(45) scale(1e6)">', '"', "'", '=', '&amp;', '&#x41;', '&bogus;',
  '<!DOCTYPE svg>', '<!ENTITY a "b">', '<![CDATA[x]]>', '<!-- c -->', '<?pi x?>', ' d="M0 0 L10 0 L10 10 Z"', '<circle r="5" cx="1e308"/>',
  '<rect width="-1" height="5"/>', '<path d="M0 0 A 1e-9 1e-9 0 0 1 10 0 Z"/>', ' transform="matrix(1 0 0 1 NaN 0)"', 'viewBox="0 0 0 0"', '1e999', 'NaN', 'mm', 'px', '%',
  '<use href="#x"/>', '<ellipse rx="5" ry="0"/>', '<polygon points="0,0 10,0"/>', '\u0000', '\ud800', ' ', '\n'];

const EXPR_TOKENS = ['x', 'y', 'pi', 'e', '1', '0', '2.5', '1e308', '1e-308', '+', '-', '*', '/', '^', '(', ')', ',', 'sin', 'cos', 'sqrt', 'log', 'exp', 'abs', 'min', 'max',
  '<', '>=', '==', '!=', 'constructor', '__proto__', 'prototype', 'process', 'globalThis', 'this', 'require', 'import', 'eval', 'Function', '.', '[', ']', '"', "'", '`',
  '=>', '=', ';', '{', '}', 'return', 'new', '\\', '$', '#', ' ', '\u2212', '×', 'x y', '1 2'];

// part-file mutations ---------------------------------------------------------------------------
type J = null | boolean | number | string | J[] | { [k: string]: J };
const WEIRD: J[] = [null, true, false, 0, -1, -0, 1e308, -1e308, 1e-320, 5e-324, 1e12, 1e13, 0.1, 3, 1e6, '', 'NaN', 'Infinity', '1e999', '10', 'x', '1/(x-50)',
  'log(x-100)', 'constructor', '__proto__', 'steel', 'ccw', 'cw', 'mm', 'in', 'furlong', [], [0], [0, 0], [1e308, 1e308], [0, 0, 0], [[0, 0], [1, 0], [0, 1]], {}, { circle: { center: [0, 0], diameter: 5 } },
  { rectangle: { corner: [0, 0], size: [10, 10] } }, { grid: { start: [0, 0], pitch: [1, 1], count: [3, 3], shape: { circle: { center: [0, 0], diameter: 0.5 } } } }];

function nodes(v: J, out: { parent: J[] | { [k: string]: J }; key: string | number }[] = []): typeof out {
  if (Array.isArray(v)) v.forEach((c, i) => { out.push({ parent: v, key: i }); nodes(c, out); });
  else if (v && typeof v === 'object') for (const k of Object.keys(v)) { out.push({ parent: v, key: k }); nodes(v[k], out); }
  return out;
}

function mutateJson(r: Rand, doc: J): J {
  const d = structuredClone(doc);
  const k = 1 + int(r, 3);
  for (let j = 0; j < k; j++) {
    const all = nodes(d);
    if (all.length === 0) break;
    const { parent, key } = pick(r, all);
    const get = () => (parent as Record<string | number, J>)[key];
    const set = (v: J) => { (parent as Record<string | number, J>)[key] = v; };
    switch (int(r, 7)) {
      case 0: set(pick(r, WEIRD)); break;
      case 1: if (Array.isArray(parent)) parent.splice(key as number, 1); else delete parent[key as string]; break;
      case 2: { const v = get(); if (typeof v === 'number') set(v * pick(r, [-1, 0, 1e-9, 1e9, 1.0000001, 0.5, 2])); else set(pick(r, WEIRD)); break; }
      case 3: if (Array.isArray(parent)) parent.splice(key as number, 0, structuredClone(get())); else set(structuredClone(get())); break;
      case 4: if (!Array.isArray(parent)) parent[pick(r, ['junk', 'cutouts', 'add', 'layers', 'thickness', 'density', 'material', 'regions', 'z'])] = pick(r, WEIRD); break;
      case 5: { const v = get(); if (typeof v === 'number') set(v + (r() - 0.5) * 100); break; }
      default: { const v = get(); if (Array.isArray(v) && v.length > 1) v.reverse(); else set(pick(r, WEIRD)); }
    }
  }
  return d;
}

describe('fuzzing: only InputError or MethodError escapes (slowest case printed)', () => {
  afterAll(() => {
    const total = Object.values(fuzzCounts).reduce((n, c) => n + c.cases, 0);
    console.log(`hardening fuzz: ${total} cases; ${Object.entries(fuzzCounts).map(([k, c]) => `${k}: ${c.cases} (${c.accepted} accepted, ${c.refused} refused, slowest ${c.slowestMs.toFixed(0)} ms)`).join('; ')}`);
  });

  it('SVG path data: random token soup', () => {
    fuzz('svg path tokens', 0xa11ce, 3000, randomPath, (d) => { parsePathData(d, 'fuzz path'); });
    expect(fuzzCounts['svg path tokens'].refused).toBeGreaterThan(0);
  });

  it('SVG path data: plausible paths, read and measured', () => {
    fuzz('svg plausible paths', 0xb0b, 400, plausiblePath, (d) => {
      measureAll(readSvg(`<svg xmlns="http://www.w3.org/2000/svg" width="200mm" height="200mm" viewBox="0 0 200 200"><path d="${d}"/></svg>`));
    });
    expect(fuzzCounts['svg plausible paths'].accepted).toBeGreaterThan(0);
  });

  it('whole SVG documents: mutations of the bracket sample', () => {
    const base = sample('bracket.svg');
    fuzz('svg documents', 0xc0ffee, 500, (r) => mutateText(r, base, SVG_TOKENS), (text) => {
      measureAll(readSvg(text, { fileLabel: 'fuzz.svg' }).map(preparePart));
    });
    expect(fuzzCounts['svg documents'].accepted).toBeGreaterThan(0);
    expect(fuzzCounts['svg documents'].refused).toBeGreaterThan(0);
  });

  it('expressions: token soup with attempts to reach the runtime', () => {
    fuzz('expressions', 0xe4e4, 3000, (r) => Array.from({ length: 1 + int(r, 12) }, () => pick(r, EXPR_TOKENS)).join(r() < 0.5 ? '' : ' '), (text) => {
      const c = compileExpression(text, 'fuzz');
      const v = c.evaluate(1.5, -2.5);
      if (typeof v !== 'number') throw new Error(`evaluate returned ${typeof v}`);
    });
    expect(fuzzCounts.expressions.accepted).toBeGreaterThan(0);
  });

  it('part files: JSON mutations of every part-file sample, read, validated and measured', () => {
    const docs = ['base-plate-bp1.json', 'gusset-g2.json', 'lifting-lug-ll4.json', 'notched-plate.json', 'perforated-panel-pp3.json', 'tapered-doubler-td5.json']
      .map((f) => JSON.parse(sample(f)) as J);
    fuzz('part files', 0xfa11, 800, (r) => JSON.stringify(mutateJson(r, pick(r, docs))), (text) => {
      const model = readPlateModel(text, 'fuzz.json');
      for (const l of model.layers) measureAll([preparePart(l.part)]);
    });
    expect(fuzzCounts['part files'].accepted).toBeGreaterThan(0);
    expect(fuzzCounts['part files'].refused).toBeGreaterThan(0);
  });

  it('GeoJSON and WKT: text mutations of the samples', () => {
    const gj = sample('gusset.geojson'), wkt = sample('baseplate.wkt');
    const tokens = ['[', ']', '{', '}', ',', '"', ':', '0', '-1', '1e999', '1e308', 'null', 'NaN', '"Polygon"', '"MultiPolygon"', '(', ')', 'EMPTY', 'POLYGON', ' ', '1 1', 'Z', 'M'];
    fuzz('geojson', 0x6e0, 400, (r) => mutateText(r, gj, tokens), (t) => { for (const p of readParts(t, 'fuzz.geojson')) preparePart(p); });
    fuzz('wkt', 0x3a7, 400, (r) => mutateText(r, wkt, tokens), (t) => { for (const p of readParts(t, 'fuzz.wkt')) preparePart(p); });
    expect(fuzzCounts.geojson.refused + fuzzCounts.wkt.refused).toBeGreaterThan(0);
  });
});
