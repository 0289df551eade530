/**
 * The samples/job walk-through (invented demo job) behaves as its description says: every part measured,
 * the manifest-stated cleat area passes, the end plate's reference has exactly one deliberate mismatch
 * (pierces: the drawing's count missed the slot; 6 holes + 1 slot + 1 outer contour = 8, common practice,
 * no source), so both commands exit 1.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseCsvRecords } from '../../src/base/csv.js';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const run = (args: string[]) => spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, encoding: 'utf8' });

describe('samples/job', () => {
  it('batch: 4 parts measured, 1 pass, 1 fail (pierces on E-2), exit 1', () => {
    const out = join(mkdtempSync(join(tmpdir(), 'platewise-job-')), 'results.csv');
    const r = run(['batch', 'samples/job/job.csv', '--jobs', '2', '-o', out]);
    expect(r.status, r.stderr).toBe(1);
    const recs = parseCsvRecords(readFileSync(out, 'utf8'), 'out').records;
    expect(recs.map((x) => x.status)).toEqual(['ok', 'ok', 'ok', 'ok']);
    const byFile = Object.fromEntries(recs.map((x) => [x.file, x]));
    expect(byFile['cleat-c1.json'].verdict).toBe('pass');
    expect(byFile['endplate-e2.json'].verdict).toBe('fail');
    expect(byFile['endplate-e2.json'].notPassed).toBe('pierces fail: stated 7, computed 8 ± 0, tolerance 0');
    // cleat: 120 × 90 − 4·π·7² (closed form)
    expect(Number(byFile['cleat-c1.json']['area [mm2]'])).toBeCloseTo(10800 - 196 * Math.PI, 8);
    expect(r.stderr).toMatch(/verdicts: 1 pass, 1 fail, 0 inconclusive, 2 with nothing stated/);
  });
  it('batch with the invented rates: the cleat\'s line cost by hand, per-material totals summing to the grand total', () => {
    const dir = mkdtempSync(join(tmpdir(), 'platewise-quote-'));
    const out = join(dir, 'quote.csv');
    const r = run(['batch', 'samples/job/job.csv', '--rates', 'samples/job/rates.csv', '-o', out]);
    expect(r.status, r.stderr).toBe(1);
    const cleat = parseCsvRecords(readFileSync(out, 'utf8'), 'out').records[0];
    // by hand (closed form): cut length 2(120 + 90) + 4·π·14 mm, 5 pierces; rates.csv line 3 (invented): 2200 mm/min,
    // 2 s per pierce, 90 EUR/h, 1.10 EUR/kg, 10 min setup; blank 120 × 90 × 10 mm of steel at 7850 kg/m³
    const minutes = (420 + 56 * Math.PI) / 2200 + (5 * 2) / 60;
    const blankKg = 0.12 * 0.09 * 0.01 * 7850;
    const line = 24 * ((minutes / 60) * 90 + blankKg * 1.1) + (10 / 60) * 90;
    expect(cleat.rate).toBe('samples/job/rates.csv:line 3');
    expect(Math.abs(Number(cleat['lineCost [EUR]']) - line)).toBeLessThan(1e-9);
    expect(Math.abs(Number(cleat['lineTime [min]']) - (24 * minutes + 10))).toBeLessThan(1e-9);
    const s = JSON.parse(readFileSync(join(dir, 'quote.summary.json'), 'utf8')).summary;
    const groups: { material: string; thicknessMm: number; netMassKg: number; cost: { totalCost: number } }[] = s.byMaterialAndThickness;
    expect(groups.map((g) => `${g.material} ${g.thicknessMm}`)).toEqual(['steel 10', 'steel 8', 'steel 12', 'stainless-1.4301 6']);
    expect(Math.abs(groups.reduce((a, g) => a + g.netMassKg, 0) - s.netMassKg)).toBeLessThan(1e-12);
    expect(Math.abs(groups.reduce((a, g) => a + g.cost.totalCost, 0) - s.rates.totalCost)).toBeLessThan(1e-9);
    expect(s.rates.partsNotPriced).toBe(0);
  });
  it('compare on the end plate: only pierces fails', () => {
    const r = run(['compare', 'samples/job/endplate-e2.json', '--reference', 'samples/job/endplate-e2.ref.csv', '--thickness', '12 mm', '--material', 's355', '--json']);
    expect(r.status).toBe(1);
    const doc = JSON.parse(r.stdout);
    expect(doc.rows.filter((x: { verdict: string }) => x.verdict !== 'pass').map((x: { quantity: string }) => x.quantity)).toEqual(['pierces']);
  });
});
