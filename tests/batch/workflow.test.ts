/**
 * Batch workflow details a shop meets (common practice, no source): a folder is read again after a run wrote
 * its summary into it (the summary is not a part), DXF drawings in a folder are parts, the mass column is
 * filled for constant plates (mass = net area × thickness × density, closed form), and a semicolon
 * manifest gets a hint. The parts are invented samples.
 */
import { copyFileSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli } from '../helpers.js';

describe('batch workflow', () => {
  it('a folder batched twice: the first run\'s summary is not read as a part; DXF files are parts; mass equals netMass', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-flow-'));
    copyFileSync(join(ROOT, 'samples', 'job', 'cleat-c1.json'), join(dir, 'cleat-c1.json'));
    copyFileSync(join(ROOT, 'tests', 'fixtures', 'dxf', 'lwpolyline-plate.dxf'), join(dir, 'plate.dxf'));
    const first = runCli(['batch', dir, '--thickness', '6', '--material', 'steel', '-o', join(dir, 'out.csv')]);
    expect(first.status, first.stderr).toBe(0);
    const again = runCli(['batch', dir, '--thickness', '6', '--material', 'steel', '--jsonl']);
    expect(again.status, again.stderr).toBe(0);
    const rows = again.stdout.trim().split('\n').map((l) => JSON.parse(l)).filter((o) => o.row !== undefined); // the last line is the summary
    expect(rows.map((r) => r.file).sort()).toEqual(['cleat-c1.json', 'plate.dxf']);
    for (const r of rows) {
      // 6 mm steel, 7850 kg/m³ (EN 1993-1-1, 3.2.6): mass = A · 6 mm · 7850 kg/m³
      const m = r.quantities.area.value * 6 * 7850 * 1e-9;
      expect(Math.abs(r.quantities.mass.value - m) / m).toBeLessThan(1e-12);
      expect(Math.abs(r.quantities.netMass.value - m) / m).toBeLessThan(1e-12);
    }
  });
  it('a manifest saved with semicolons gets one line saying so', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-semi-'));
    writeFileSync(join(dir, 'job.csv'), 'file;quantity;material\ncleat.json;2;steel\n');
    const r = runCli(['batch', join(dir, 'job.csv')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/line 1: the columns are separated by semicolons; a manifest is CSV with commas/);
  });
});
