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
  it('compare on the end plate: only pierces fails', () => {
    const r = run(['compare', 'samples/job/endplate-e2.json', '--reference', 'samples/job/endplate-e2.ref.csv', '--thickness', '12 mm', '--material', 's355', '--json']);
    expect(r.status).toBe(1);
    const doc = JSON.parse(r.stdout);
    expect(doc.rows.filter((x: { verdict: string }) => x.verdict !== 'pass').map((x: { quantity: string }) => x.quantity)).toEqual(['pierces']);
  });
});
