/**
 * Budgets checked before memory is spent (issue 16, item 3): the shapes all patterns of one part generate,
 * the triangles refinement levels would build, the lines of a stated-values file. Each refusal is one line,
 * exit 2, naming the limit and what to do. The parts are invented for the test.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'pw-budget-'));
const oneLine = (r: { status: number | null; stdout: string; stderr: string }) => {
  expect(r.status).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr.trim().split('\n')).toHaveLength(1);
};

describe('budgets', () => {
  it('patterns: three grids of 100,000 copies each exceed the 250,000 shapes of one part, refused at the third', () => {
    const grid = (y: number) => ({ grid: { start: [1, y], pitch: [2, 0.002], count: [1000, 100], shape: { circle: { center: [0, 0], diameter: 0.5 } } } });
    const f = join(dir, 'patterns.json');
    writeFileSync(f, JSON.stringify({ outline: { rectangle: { corner: [0, 0], size: [2002, 10] } }, cutouts: [grid(1), grid(4), grid(7)] }));
    const r = runCli(['measure', f]);
    oneLine(r);
    expect(r.stderr).toMatch(/cutouts\[2\]\.grid\.count: the patterns of this part would make 300000 shapes, more than 250000 in all; split the part/);
  });
  it('refinement levels: a plate with 2,000 round holes at --levels 6 is refused before the refined meshes are built', () => {
    const f = join(dir, 'holes.json');
    writeFileSync(f, JSON.stringify({ outline: { rectangle: { corner: [0, 0], size: [1000, 800] } }, cutouts: [{ grid: { start: [10, 10], pitch: [20, 20], count: [50, 40], shape: { circle: { center: [0, 0], diameter: 8 } } } }] }));
    const r = runCli(['measure', f, '--levels', '6']);
    oneLine(r);
    expect(r.stderr).toMatch(/^platewise: --levels: 6 refinement levels would make [\d.]+e\+\d+ triangles from this part's \d+ curved ones, more than 2e\+7; use fewer levels/);
  });
  it('a stated-values file of more than 100,000 lines is refused before its records are built', () => {
    const f = join(dir, 'ref.csv');
    writeFileSync(f, 'quantity,value,unit\n' + 'area,1,mm2\n'.repeat(100_001));
    const r = runCli(['compare', 'samples/base-plate-bp1.json', '--reference', f]);
    oneLine(r);
    expect(r.stderr).toMatch(/has more than 100000 lines; a stated-values file holds the values of one part/);
  });
});
