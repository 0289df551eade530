/** Bolt groups checked by hand (unit area per bolt, sums about the group centroid). */
import { describe, expect, it } from 'vitest';
import { preparePart } from '../../src/analysis/measure.js';
import { boltGroup, circularHoles, selectBolts } from '../../src/properties/boltGroup.js';
import { partFromObject } from '../../src/read/partJson.js';

describe('bolt groups', () => {
  it('2 × 4 grid, pitch 70 across and 80 along: by hand Σx² = 8·35² = 9800, Σy² = 2·2·(40² + 120²) = 64000', () => {
    const cut: unknown[] = [];
    for (const x of [65, 135]) for (const y of [40, 120, 200, 280]) cut.push({ circle: { center: [x, y], diameter: 22 } });
    cut.push({ rectangle: { corner: [90, 150], size: [20, 20] } }); // not a bolt
    cut.push({ circle: { center: [100, 20], diameter: 10 } }); // a small hole, excluded by diameter
    const p = preparePart(partFromObject({ outline: { rectangle: { corner: [0, 0], size: [200, 320] } }, cutouts: cut }));
    const holes = circularHoles(p);
    expect(holes.length).toBe(9);
    const g = boltGroup(selectBolts(holes, [22]));
    expect(g.count).toBe(8);
    expect(g.centroid[0]).toBeCloseTo(100, 12);
    expect(g.centroid[1]).toBeCloseTo(160, 12);
    expect(Math.abs(g.sumXX - 9800)).toBeLessThanOrEqual(g.error + 1e-9);
    expect(Math.abs(g.sumYY - 64000)).toBeLessThanOrEqual(g.error + 1e-9);
    expect(Math.abs(g.sumXY)).toBeLessThanOrEqual(g.error + 1e-9);
    expect(g.sumRR).toBeCloseTo(73800, 8);
    expect(g.principalAngle).toBeCloseTo(90, 10);
    // corner bolt: √(35² + 120²) = 125
    expect(Math.max(...g.bolts.map((b) => b.distance))).toBeCloseTo(125, 10);
  });

  it('ring of 6 bolts on a pitch circle of radius 50: Σr² = 6·50² = 15000, Σx² = Σy² = 7500, every distance 50', () => {
    const cut = Array.from({ length: 6 }, (_, i) => ({ circle: { center: [200 + 50 * Math.cos(i * Math.PI / 3 + 0.2), 100 + 50 * Math.sin(i * Math.PI / 3 + 0.2)], diameter: 18 } }));
    const p = preparePart(partFromObject({ outline: { circle: { center: [200, 100], diameter: 160 } }, cutouts: cut }));
    const g = boltGroup(circularHoles(p));
    expect(g.count).toBe(6);
    expect(g.sumRR).toBeCloseTo(15000, 9);
    expect(g.sumXX).toBeCloseTo(7500, 9);
    expect(g.sumYY).toBeCloseTo(7500, 9);
    for (const b of g.bolts) expect(b.distance).toBeCloseTo(50, 11);
  });
});
