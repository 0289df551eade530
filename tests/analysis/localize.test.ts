/**
 * A mesh only where the integrand matters (src/analysis/localize.ts): a narrow Gaussian bump on the
 * 2000 × 1000 mm panel with 1,250 holes Ø20 at a 40 mm pitch is meshed only in a box around the bump, the rest
 * bounded by interval arithmetic. Each case has a closed form (elementary polar and product integrals of
 * exp(−r²/2σ²), common practice, no source):
 *  - centred at (40, 40), between four holes: the plane's 2πσ², the edges 20σ away (erfc(14) < 1e-86) and the
 *    holes' rims 18.28 = 9.1σ away (their share below 1e-17 relative);
 *  - centred at the corner (0, 0): a quarter of the plane, πσ²/2, the nearest rim 18.28 away;
 *  - centred on a hole's centre (20, 20): the plane less the disc of radius 10 about the centre,
 *    2πσ²·exp(−10²/2σ²), the other rims and the edges farther away than 20 = 10σ.
 * Every estimate must cover the true error, the default tolerance (1e-12) must be met with a true error below
 * 1e-13 relative, and the mesh must have been limited to a small box (the case is not the whole panel again).
 */
import { describe, expect, it } from 'vitest';
import { DEFAULT_INTEGRAL_TOLERANCE, integrateExpression } from '../../src/analysis/plate.js';
import { localPiece } from '../../src/analysis/localize.js';
import { compileExpression } from '../../src/expr/index.js';
import { preparePart } from '../../src/analysis/measure.js';
import { partFromObject } from '../../src/read/partJson.js';

const cutouts: unknown[] = [];
for (let i = 0; i < 50; i++) for (let j = 0; j < 25; j++) cutouts.push({ circle: { center: [(i + 0.5) * 40, (j + 0.5) * 40], diameter: 20 } });
const panel = () => partFromObject({ part: 'panel 1250 holes (invented test part)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [2000, 1000] } }, cutouts });
const sigma = 2;
const bump = (cx: number, cy: number) => `exp(-((x-${cx})^2+(y-${cy})^2)/${2 * sigma * sigma})`;

const CASES = [
  { name: 'between four holes, (40, 40)', cx: 40, cy: 40, exact: 2 * Math.PI * sigma ** 2 },
  { name: 'at the corner, (0, 0)', cx: 0, cy: 0, exact: Math.PI * sigma ** 2 / 2 },
  { name: 'on a hole centre, (20, 20)', cx: 20, cy: 20, exact: 2 * Math.PI * sigma ** 2 * Math.exp(-100 / (2 * sigma ** 2)) },
];

describe('integrate meshes only where the integrand is not negligible', () => {
  const part = panel();
  for (const k of CASES) {
    it(`σ = 2 bump ${k.name}: true error ≤ 1e-13 relative, covered by the estimate, mesh limited to a box`, () => {
      const r = integrateExpression(part, bump(k.cx, k.cy), {});
      const trueErr = Math.abs(r.integral.value - k.exact);
      expect(r.method.meshedBox).toBeDefined();
      const [x0, y0, x1, y1] = r.method.meshedBox!;
      expect(x0 <= k.cx && k.cx <= x1 && y0 <= k.cy && k.cy <= y1).toBe(true);
      expect((x1 - x0) * (y1 - y0)).toBeLessThan(0.01 * 2000 * 1000);
      expect(r.method.stopped).toBe('tolerance');
      expect(r.method.tolerance).toBe(DEFAULT_INTEGRAL_TOLERANCE);
      expect(trueErr).toBeLessThanOrEqual(1e-13 * k.exact);
      expect(r.integral.error).toBeGreaterThanOrEqual(trueErr);
      // the point of action of a bump whole or symmetric about its centre is the centre (by symmetry)
      if (k.cx !== 0) {
        expect(Math.abs(r.pointX!.value - k.cx)).toBeLessThanOrEqual(r.pointX!.error);
        expect(Math.abs(r.pointY!.value - k.cy)).toBeLessThanOrEqual(r.pointY!.error);
      }
    });
  }

  it('the bound of what lies outside the box covers a function with a closed form there', () => {
    // f = exp(−(x − 40)/5) on the plain 2000 × 1000 rectangle: beyond the box's right edge X its integral is
    // 1000·5·(exp(−(X − 40)/5) − exp(−1960/5)) (elementary), small but not zero; the bound must be at least that
    const plate = preparePart(partFromObject({ part: 'plain rectangle (invented test part)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [2000, 1000] } } }));
    const tree = compileExpression('exp(-(x-40)/5)', 'test').tree;
    const piece = localPiece(plate, tree);
    expect(piece).not.toBeNull();
    const X = piece!.box[2];
    expect(piece!.box[0]).toBe(0);
    expect(piece!.box[3]).toBe(1000);
    const beyond = 1000 * 5 * (Math.exp(-(X - 40) / 5) - Math.exp(-1960 / 5));
    expect(beyond).toBeGreaterThan(0);
    const [o0] = piece!.outside(0, 0);
    expect(o0).toBeGreaterThanOrEqual(beyond);
    expect(o0).toBeLessThan(1e-12 * 1000 * 5 * Math.exp(40 / 5)); // and it is small against the whole integral
  });

  it('a function that cannot be bounded on some cell (a pole) meshes the whole part, so the pole is named', () => {
    const plate = preparePart(partFromObject({ part: 'plain rectangle (invented test part)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [200, 100] } } }));
    expect(localPiece(plate, compileExpression('1/(x - 150.5)', 'test').tree)).toBeNull();
    expect(() => integrateExpression(plate, '1/(x - 150.5)', {})).toThrow(/150\.5|pole|finite/);
  });
});
