/**
 * `platewise batch` through the built command line (workers load the bundled dist/cli/worker.js; build
 * with `npm run build` first): generated parts with closed-form figures, one malformed part, exit statuses,
 * identical results with 1 and 2 workers, output-file rules.
 */
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';
import { parseCsvRecords } from '../../src/base/csv.js';
import { generateParts } from './generate.js';

const dir = mkdtempSync(join(tmpdir(), 'platewise-batch-'));

const platewise = (args: string[]) => runCli(args, undefined, { cwd: dir });

// 30 generated parts (invented) and one malformed file, listed in a manifest with quantities 1..3,
// 8 mm steel (7850 kg/m³, EN 1993-1-1, 3.2.6) on the command line, 10 mm for every fifth row.
const partsDir = join(dir, 'parts');
mkdirSync(partsDir);
const parts = generateParts(partsDir, 30, 7);
writeFileSync(join(partsDir, 'broken.json'), '{"part": "broken (invented)", "outline": {"circle": {"center": [0, 0]}}}');
const rows = parts.map((p, i) => ({ ...p, q: 1 + (i % 3), t: i % 5 === 0 ? 10 : 8 }));
const manifest = ['file,quantity,thickness [mm],note']
  .concat(rows.map((r, i) => `parts/${r.file},${r.q},${r.t === 10 ? '10' : ''},"generated, row ${i + 1}"`))
  .concat(['parts/broken.json,2,,malformed on purpose'])
  .join('\r\n') + '\r\n';
writeFileSync(join(dir, 'job.csv'), manifest);

function sortedRows(csv: string) {
  return parseCsvRecords(csv, 'out').records.sort((a, b) => Number(a.row) - Number(b.row));
}

describe('batch of generated parts with one malformed', () => {
  const one = platewise(['batch', 'job.csv', '--jobs', '1', '--material', 'steel', '--thickness', '8 mm', '-o', 'one.csv']);
  const two = platewise(['batch', 'job.csv', '--jobs', '2', '--material', 'steel', '--thickness', '8 mm', '-o', 'two.csv']);

  it('exit 1 (a part failed), every row written, the failure in its own row', () => {
    expect(one.status, one.stderr).toBe(1);
    expect(one.stdout).toBe('');
    const recs = sortedRows(readFileSync(join(dir, 'one.csv'), 'utf8'));
    expect(recs).toHaveLength(31);
    const bad = recs.find((r) => r.file === 'parts/broken.json')!;
    expect(bad.row).toBe('31');
    expect(bad.status).toBe('failed');
    expect(bad.error).toMatch(/outline\.circle\.diameter: expected a positive number, got nothing/);
    expect(recs.filter((r) => r.status === 'ok')).toHaveLength(30);
  });

  it('each row matches the closed forms (area, cut length, pierces, net mass)', () => {
    const recs = sortedRows(readFileSync(join(dir, 'one.csv'), 'utf8'));
    rows.forEach((p, i) => {
      const r = recs[i];
      expect(r.file).toBe(`parts/${p.file}`);
      expect(Number(r.quantity)).toBe(p.q);
      expect(Math.abs(Number(r['area [mm2]']) - p.area) / p.area).toBeLessThan(1e-11);
      expect(Math.abs(Number(r['cutLength [mm]']) - p.cut) / p.cut).toBeLessThan(1e-12);
      expect(Number(r.pierces)).toBe(p.pierces);
      expect(Number(r['thickness [mm]'])).toBe(p.t);
      // blank of a rectangle is the rectangle itself (minimum-area rectangle, Freeman & Shapira 1975, from memory)
      expect(Number(r['blankArea [mm2]'])).toBeCloseTo(p.w * p.h, 6);
      const mass = p.area * p.t * 1e-9 * 7850;
      expect(Math.abs(Number(r['netMass [kg]']) - mass) / mass).toBeLessThan(1e-11);
    });
  });

  it('the summary file holds totals × quantity and the counts', () => {
    const s = JSON.parse(readFileSync(join(dir, 'one.summary.json'), 'utf8')).summary;
    expect(s.rows).toBe(31);
    expect(s.partsMeasured).toBe(30);
    expect(s.partsFailed).toBe(1);
    expect(s.pieces).toBe(rows.reduce((a, r) => a + r.q, 0));
    expect(s.pierces).toBe(rows.reduce((a, r) => a + r.pierces * r.q, 0));
    const cut = rows.reduce((a, r) => a + (r.cut / 1000) * r.q, 0);
    expect(Math.abs(s.cutLengthM - cut) / cut).toBeLessThan(1e-12);
    const mass = rows.reduce((a, r) => a + r.area * r.t * 1e-9 * 7850 * r.q, 0);
    expect(Math.abs(s.netMassKg - mass) / mass).toBeLessThan(1e-11);
    expect(s.verdicts).toEqual({ pass: 0, fail: 0, inconclusive: 0, none: 30 });
    expect(one.stderr).toMatch(/batch: 31 files, 31 parts: 30 measured, 1 failed/);
  });

  it('--jobs 1 and --jobs 2 write the same file, rows in manifest order; the same totals to the last digit', () => {
    expect(two.status).toBe(1);
    const a = readFileSync(join(dir, 'one.csv'), 'utf8');
    expect(readFileSync(join(dir, 'two.csv'), 'utf8')).toBe(a);
    expect(parseCsvRecords(a, 'out').records.map((r) => Number(r.row))).toEqual(rows.map((_, i) => i + 1).concat([31]));
    const totals = (f: string) => { const { seconds, partsPerSecond, jobs, ...rest } = JSON.parse(readFileSync(join(dir, f), 'utf8')).summary; return rest; };
    expect(totals('two.summary.json')).toEqual(totals('one.summary.json'));
  });
});

describe('batch exit statuses and output rules', () => {
  const good = join(dir, 'good');
  mkdirSync(good);
  const gp = generateParts(good, 4, 11);

  it('a folder of good parts: exit 0, CSV on stdout, summary on stderr', () => {
    const r = platewise(['batch', 'good', '--jobs', '2']);
    expect(r.status, r.stderr).toBe(0);
    expect(parseCsvRecords(r.stdout, 'out').records).toHaveLength(4);
    expect(r.stderr).toMatch(/no masses \(give a thickness and a material or density\)/);
  });

  it('references: a deliberate mismatch gives exit 1 and fail counts; JSON Lines ends with the summary', () => {
    const p = gp[0];
    writeFileSync(join(good, p.file.replace('.json', '.ref.json')), JSON.stringify({ values: [{ quantity: 'area', value: p.area, unit: 'mm²' }, { quantity: 'pierces', value: p.pierces + 1 }] }));
    const r = platewise(['batch', 'good', '--jsonl', '--quiet']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines).toHaveLength(5);
    const summary = lines[4].summary;
    expect(summary.verdicts).toEqual({ pass: 0, fail: 1, inconclusive: 0, none: 3 });
    const row = lines.find((l) => l.file === p.file);
    expect(row.counts).toEqual({ pass: 1, fail: 1, inconclusive: 0 });
  });

  it('command-line plate settings fill only what a part file leaves unset; layered parts get the integrated mass', () => {
    const mixed = join(dir, 'mixed');
    mkdirSync(mixed);
    // own 10 mm steel: 0.5 m² × 0.01 m × 7850 kg/m³ = 39.25 kg (EN 1993-1-1, 3.2.6)
    writeFileSync(join(mixed, 'own.json'), JSON.stringify({ part: 'own plate data (invented)', units: 'mm', thickness: 10, material: 'steel', outline: { rectangle: { corner: [0, 0], size: [1000, 500] } } }));
    // none: takes 6 mm aluminium (2700 kg/m³, EN 1999-1-1, 3.2.5): 0.1 m² × 0.006 m × 2700 = 1.62 kg
    writeFileSync(join(mixed, 'plain.json'), JSON.stringify({ part: 'plain (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [500, 200] } } }));
    // two constant layers (invented): 200 × 100 × 10 steel on 100 × 100 × 5 steel = 1.57 + 0.3925 kg
    writeFileSync(join(mixed, 'stack.json'), JSON.stringify({ part: 'stack (invented)', units: 'mm', material: 'steel', layers: [
      { name: 'base', outline: { rectangle: { corner: [0, 0], size: [200, 100] } }, thickness: 10 },
      { name: 'doubler', outline: { rectangle: { corner: [50, 0], size: [100, 100] } }, thickness: 5 },
    ] }));
    const r = platewise(['batch', 'mixed', '--thickness', '6 mm', '--material', 'aluminium', '--jsonl', '--quiet']);
    expect(r.status, r.stdout).toBe(0);
    const byFile = Object.fromEntries(r.stdout.trim().split('\n').map((l) => JSON.parse(l)).filter((l) => l.file).map((l) => [l.file, l]));
    expect(byFile['own.json'].thickness).toBe(10);
    expect(byFile['own.json'].quantities.netMass.value).toBeCloseTo(39.25, 9);
    expect(byFile['plain.json'].thickness).toBe(6);
    expect(byFile['plain.json'].quantities.netMass.value).toBeCloseTo(1.62, 9);
    expect(byFile['stack.json'].quantities.netMass).toBeUndefined();
    expect(byFile['stack.json'].quantities.mass.value).toBeCloseTo(1.57 + 0.3925, 9);
  });

  it('refuses an existing output without --force, an input even with --force; bad manifest writes nothing', () => {
    writeFileSync(join(dir, 'taken.csv'), 'keep me');
    const r = platewise(['batch', 'good', '-o', 'taken.csv']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^platewise: --output: "taken\.csv" already exists; choose a new name or add --force/);
    expect(readFileSync(join(dir, 'taken.csv'), 'utf8')).toBe('keep me');
    const f = platewise(['batch', 'good', '-o', 'taken.csv', '--force', '--quiet']);
    expect(f.status).toBe(1); // the mismatch above
    expect(readFileSync(join(dir, 'taken.csv'), 'utf8')).toMatch(/^row,file,/);
    const inp = platewise(['batch', 'job.csv', '-o', 'job.csv', '--force']);
    expect(inp.status).toBe(2);
    expect(inp.stderr).toMatch(/is an input file of this run/);
    writeFileSync(join(dir, 'bad.csv'), 'file,quantity\r\nparts/p0001.json,-1\r\n');
    const b = platewise(['batch', 'bad.csv', '-o', 'never.csv']);
    expect(b.status).toBe(2);
    expect(b.stderr).toBe('platewise: bad.csv:line 2, column 18: expected how many of this part (a whole number of 1 or more), got "-1"\n');
    expect(existsSync(join(dir, 'never.csv'))).toBe(false);
    expect(platewise(['batch', 'good', '--jobs', '0']).status).toBe(2);
    expect(platewise(['batch', 'no-such-folder']).status).toBe(2);
  });
});
