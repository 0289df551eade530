/**
 * The catalogue of bad inputs (tests/hardening/bad/cases.json): each case runs the built command line
 * (dist/cli/main.js, made by `npx tsc -p .`) and must end with exit status 2, exactly one line on standard
 * error ("platewise: <where>: <what>") matching the expected message, no stack trace, nothing on standard
 * output, no output file (when -o is given) and no leftover temporary file, within 2 s (a bound on hangs,
 * not a benchmark). Requirements: the project's own rule for bad input (one line, exit 2, never partial
 * output) — common practice, no source.
 */
import { spawn } from 'node:child_process';
import { closeSync, mkdirSync, mkdtempSync, openSync, readdirSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const BAD = join(import.meta.dirname, 'bad');

interface Case { name: string; args: string[]; stderr: string; stdin?: string; output?: string; generate?: 'big-json' | 'big-svg' }
const { cases } = JSON.parse(readFileSync(join(BAD, 'cases.json'), 'utf8')) as { cases: Case[] };

let tmp = '';
let out = '';

/** Write `total` bytes made of `head`, filler and `tail` without holding them all in memory twice. */
function writeBig(path: string, head: string, fill: string, tail: string, total: number): void {
  const fd = openSync(path, 'w');
  try {
    writeSync(fd, head);
    const chunk = fill.repeat(Math.ceil((1 << 20) / fill.length)).slice(0, 1 << 20);
    let left = total - head.length - tail.length;
    while (left > 0) { const piece = left >= chunk.length ? chunk : chunk.slice(0, left); writeSync(fd, piece); left -= piece.length; }
    writeSync(fd, tail);
  } finally { closeSync(fd); }
}

beforeAll(() => {
  tmp = mkdtempSync(join(tmpdir(), 'platewise-hardening-'));
  out = join(tmp, 'out');
  // 50 MB part file: a valid part whose note is huge (over the 32 MiB file limit)
  writeBig(join(tmp, 'big.json'), '{"outline": {"rectangle": {"corner": [0, 0], "size": [100, 60]}}, "note": "', 'x', '"}\n', 50 * 1024 * 1024);
  // 25 MB SVG: under the file limit, over the 20 MiB XML limit
  // 32 MiB WKT of identical points (just under the file limit): refused by the token limit within 1 GB
  writeBig(join(tmp, 'big.wkt'), 'POLYGON((', '0 0,', '0 0))\n', 32 * 1024 * 1024 - 64);
  writeBig(join(tmp, 'big.svg'), '<svg xmlns="http://www.w3.org/2000/svg"><path d="M0 0 H100 V60 H0 Z"/>', '<!-- padding -->', '</svg>\n', 25 * 1024 * 1024);
});
afterAll(() => {
  if (tmp) rmSync(tmp, { recursive: true, force: true });
  const times = [...outcomes.values()].map((o) => o.ms).sort((a, b) => a - b);
  if (times.length) console.log(`hardening bad inputs: ${times.length} spawns, median ${times[times.length >> 1].toFixed(0)} ms, slowest ${times[times.length - 1].toFixed(0)} ms`);
});

const fill = (a: string) => a.replaceAll('{bad}', BAD).replaceAll('{out}', out).replaceAll('{tmp}', tmp);

interface Outcome { status: number | null; signal: string | null; stdout: string; stderr: string; ms: number; outFiles: string[] }
const outcomes = new Map<string, Outcome>();

/** Run one case in its own empty output folder; the time is the child's wall time. */
function runCase(c: Case, i: number): Promise<Outcome> {
  const outDir = join(out, String(i));
  mkdirSync(outDir, { recursive: true });
  const args = c.args.map((a) => a.replaceAll('{out}', outDir)).map(fill);
  return new Promise((done) => {
    const t0 = performance.now();
    const child = spawn(process.execPath, [CLI, ...args], { cwd: ROOT, stdio: ['pipe', 'pipe', 'pipe'] });
    let stdout = '', stderr = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => { stdout += d; });
    child.stderr.setEncoding('utf8').on('data', (d: string) => { stderr += d; });
    const timer = setTimeout(() => child.kill('SIGKILL'), 20000);
    child.on('close', (status, signal) => {
      clearTimeout(timer);
      done({ status, signal, stdout, stderr, ms: performance.now() - t0, outFiles: readdirSync(outDir) });
    });
    child.stdin.end(c.stdin ? readFileSync(join(BAD, c.stdin)) : undefined);
  });
}

describe('bad inputs: exit 2, one located line, no output (spawn times printed, not asserted)', () => {
  beforeAll(async () => {
    // two children at a time (the machine has two cores); each case is timed on its own
    let next = 0;
    const worker = async () => { for (let i = next++; i < cases.length; i = next++) outcomes.set(cases[i].name, await runCase(cases[i], i)); };
    await Promise.all([worker(), worker()]);
  }, 300000);

  it('the catalogue holds at least 40 cases with distinct names, and every case file exists', () => {
    expect(cases.length).toBeGreaterThanOrEqual(40);
    expect(new Set(cases.map((c) => c.name)).size).toBe(cases.length);
    const files = new Set(readdirSync(BAD));
    for (const c of cases) for (const a of c.args) {
      const m = /^\{bad\}\/(.+)$/.exec(a);
      if (m && !m[1].startsWith('no-such')) expect(files.has(m[1]), `${c.name}: ${m[1]}`).toBe(true);
    }
  });
  for (const c of cases) {
    it(c.name, () => {
      const r = outcomes.get(c.name)!;
      expect(r.signal, `${c.name}: killed (hang?)`).toBeNull();
      expect(r.status, `${c.name}: ${r.stderr}`).toBe(2);
      expect(r.stdout).toBe('');
      const lines = r.stderr.split('\n');
      expect(lines.length, `one line then a newline: ${JSON.stringify(r.stderr)}`).toBe(2);
      expect(lines[1]).toBe('');
      expect(r.stderr).not.toMatch(/\n\s+at |internal error|Error:/);
      // file names may be printed with their folder
      expect(lines[0]).toMatch(new RegExp(`^platewise: (?:[^ ]*/)?(?:${c.stderr})`));
      if (c.output) expect(r.outFiles, 'nothing written, no temporary file left').toEqual([]);
    });
  }
});
