/**
 * Manifest reading (src/batch/manifest.ts): column rules, units in headers, located errors; folder listing;
 * one job run in-process (src/batch/task.ts) against closed forms.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { folderJobs, parseManifest } from '../../src/batch/manifest.js';
import { runJob } from '../../src/batch/task.js';
import { batchCsvRow, BATCH_CSV_HEADER } from '../../src/output/batchRows.js';
import { batchLine } from '../../src/batch/lines.js';
import { parseCsv } from '../../src/base/csv.js';

const base = '/jobs';

describe('parseManifest', () => {
  it('reads fixed columns, units in headers, stated values; numbers rows from 1', () => {
    const text = 'file,quantity,material,thickness [in],density,area [cm²],pierces,note\r\n' +
      'a.json,4,steel,0.5,,12.5,3,"first, with a comma"\r\n' +
      '\r\n' +
      'sub/b.svg,,,,"7.85 g/cm3",,,\r\n';
    const jobs = parseManifest(text, 'm.csv', base);
    expect(jobs).toHaveLength(2);
    const [a, b] = jobs;
    expect(a.row).toBe(1);
    expect(a.path).toBe('/jobs/a.json');
    expect(a.quantity).toBe(4);
    expect(a.plate.material?.text).toBe('steel');
    expect(a.plate.thickness?.text).toBe('0.5 in');
    expect(a.stated.map((s) => [s.quantity, s.value, s.unit.text])).toEqual([['area', 12.5, 'cm²'], ['pierces', 3, '']]);
    expect(b.row).toBe(2); // the blank line is skipped and not counted
    expect(b.line).toBe(4);
    expect(b.quantity).toBe(1);
    expect(b.plate.density?.text).toBe('7.85 g/cm3'); // kept as given; the one settings grammar reads it (tests/model/settings.test.ts)
    expect(b.stated).toEqual([]);
  });
  it('a stated value may carry its own unit under a header without one', () => {
    const [j] = parseManifest('file,centroidX\nx.json,2 in\n', 'm.csv', base);
    expect(j.stated[0].unit.text).toBe('in');
  });
  const bad: [string, string, RegExp][] = [
    ['no file column', 'name,quantity\na,1\n', /m\.csv:line 1, column 1: expected a column named "file"/],
    ['unknown column with a suggestion', 'file,quantty\na.json,1\n', /unknown column "quantty"; did you mean "quantity"\?/],
    ['quantity not whole', 'file,quantity\na.json,2.5\n', /m\.csv:line 2, column 8: expected how many of this part/],
    ['quantity zero', 'file,quantity\na.json,0\n', /expected how many/],
    ['unknown material', 'file,material\na.json,cheese\n', /m\.csv:line 2, column 8: unknown material "cheese"/],
    ['stated value without unit', 'file,area\na.json,12\n', /units are never assumed/],
    ['unit twice', 'file,area [mm²]\na.json,12 mm²\n', /already gives the unit/],
    ['header unit of the wrong kind', 'file,area [mm]\na.json,12\n', /"mm" is a unit of length; expected a unit of area/],
    ['thickness without a length unit', 'file,thickness [kg]\na.json,12\n', /expected a length unit/],
    ['empty file cell', 'file,quantity\n,2\n', /line 2, column 1: expected a part file name/],
    ['ragged row', 'file,quantity\na.json,2,3\n', /expected 2 fields as in the header, got 3/],
    ['no rows', 'file,quantity\n', /expected at least one row/],
    ['same quantity twice', 'file,area [mm²],area [in²]\na.json,1,2\n', /column "area" appears twice/],
  ];
  for (const [name, text, msg] of bad) {
    it(`refuses: ${name}`, () => expect(() => parseManifest(text, 'm.csv', base)).toThrow(msg));
  }
});

describe('folderJobs and runJob', () => {
  const dir = mkdtempSync(join(tmpdir(), 'platewise-manifest-'));
  // 120 × 80 mm plate with one Ø20 hole: A = 9600 − 100π, cut length = 400 + 20π, 2 pierces (closed forms)
  writeFileSync(join(dir, 'b.json'), JSON.stringify({ part: 'B (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [120, 80] } }, cutouts: [{ circle: { center: [60, 40], diameter: 20 } }] }));
  writeFileSync(join(dir, 'b.ref.json'), JSON.stringify({ values: [{ quantity: 'area', value: 9600 - 100 * Math.PI, unit: 'mm²' }, { quantity: 'pierces', value: 3 }] }));
  writeFileSync(join(dir, 'a.json'), '{"part": "broken", "outline": ');
  writeFileSync(join(dir, 'notes.txt'), 'ignored');
  writeFileSync(join(dir, '.hidden.json'), '{}');

  it('lists part files by name, skips hidden and reference files, pairs <stem>.ref.json', () => {
    const jobs = folderJobs(dir);
    expect(jobs.map((j) => [j.row, j.file, j.reference?.label ?? null])).toEqual([[1, 'a.json', null], [2, 'b.json', 'b.ref.json']]);
  });
  it('a malformed file is its row\'s error, not an exception', () => {
    const [row] = runJob(folderJobs(dir)[0], { defaults: {} });
    expect(row.status).toBe('failed');
    expect(row.error).toMatch(/^a\.json:1:\d+: not valid JSON/);
  });
  it('a measured row: closed-form figures, a deliberate mismatch fails, masses from the plate settings', () => {
    // 6 mm steel, 7850 kg/m³ (EN 1993-1-1, 3.2.6)
    const [row] = runJob(folderJobs(dir)[1], { defaults: { thickness: { text: '6 mm', where: '--thickness' }, density: { text: 7850, where: '--density' } } });
    expect(row.status).toBe('ok');
    const A = 9600 - 100 * Math.PI;
    expect(Math.abs(row.quantities.area.value - A) / A).toBeLessThan(1e-12);
    expect(Math.abs(row.quantities.cutLength.value - (400 + 20 * Math.PI))).toBeLessThan(1e-9);
    expect(row.quantities.pierces.value).toBe(2);
    expect(Math.abs(row.quantities.netMass.value - A * 6e-9 * 7850)).toBeLessThan(1e-12);
    expect(row.verdict).toBe('fail');
    expect(row.counts).toEqual({ pass: 1, fail: 1, inconclusive: 0 });
    const rec = parseCsv(batchCsvRow(batchLine(row, undefined)), 'row')[0];
    expect(rec).toHaveLength(BATCH_CSV_HEADER.length);
    expect(rec[BATCH_CSV_HEADER.indexOf('notPassed')]).toMatch(/^pierces fail: stated 3, computed 2 ± 0/);
    expect(Number(rec[BATCH_CSV_HEADER.indexOf('area [mm2]')])).toBe(row.quantities.area.value); // round-trip (a mm part: factor 1)
  });
});
