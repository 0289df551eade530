/**
 * `platewise measure --fabrication` (cli/commands/measureFabrication.ts) through the built CLI: the block's
 * figures against closed forms, its JSON, and that it is absent unless asked for.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';

const run = (args: string[]) => runCli(args);

// samples/job/endplate-e2.json (invented): 250 × 150 with R10 corners, six Ø18 holes, one 40 × 18 slot.
// Cut length: outer 2(250 + 150) − 8·10 + 2π·10, holes 6·π·18, slot 2·40 + π·18 (closed forms);
// pierces: one per contour (common practice, no source); the blank of a rectangle with rounded corners is its
// 250 × 150 bounding rectangle.
const outer = 800 - 80 + 20 * Math.PI;
const inner = 6 * 18 * Math.PI + 80 + 18 * Math.PI;

describe('measure --fabrication', () => {
  it('prints the block with closed-form cut lengths and pierces', () => {
    const r = run(['measure', 'samples/job/endplate-e2.json', '--fabrication']);
    expect(r.status, r.stderr).toBe(0);
    const block = r.stdout.slice(r.stdout.indexOf('fabrication figures'));
    const val = (k: string) => Number(new RegExp(`^${k}\\s+(\\S+)`, 'm').exec(block)![1]);
    expect(val('cutLengthOuter')).toBeCloseTo(outer, 6);
    expect(val('cutLengthInner')).toBeCloseTo(inner, 6);
    expect(val('cutLength')).toBeCloseTo(outer + inner, 6);
    expect(val('pierces')).toBe(8);
    expect(val('blankArea')).toBeCloseTo(37500, 6);
    expect(block).toMatch(/masses: not computed/);
  });
  it('JSON: a fabrication object beside the area properties', () => {
    const r = run(['measure', 'samples/job/endplate-e2.json', '--fabrication', '--json']);
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.fabrication.quantities.pierces).toEqual({ value: 8, error: 0 });
    expect(Math.abs(doc.fabrication.quantities.cutLength.value - (outer + inner))).toBeLessThan(1e-9);
    expect(doc.fabrication.box).toEqual({ xMin: 0, yMin: 0, xMax: 250, yMax: 150, width: 250, height: 150 });
    expect(doc.fabrication.blank.width).toBeCloseTo(250, 9);
    expect(doc.fabrication.blank.height).toBeCloseTo(150, 9);
    expect(doc.fabrication.plate).toBeNull();
  });
  it('absent without --fabrication or plate settings', () => {
    const r = run(['measure', 'samples/job/endplate-e2.json']);
    expect(r.status).toBe(0);
    expect(r.stdout).not.toMatch(/fabrication figures/);
    expect(JSON.parse(run(['measure', 'samples/job/endplate-e2.json', '--json']).stdout).fabrication).toBeUndefined();
  });
});
