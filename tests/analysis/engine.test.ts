/**
 * One engine: the adaptive integrator and the whole-mesh pass give the same sums on the same triangles, and
 * every result says why it stopped with one code (src/quadrature/stop.ts), worded only in src/output.
 *
 * Reference values: the plate is a 300 × 200 rectangle with round holes Ø40 at (80, 60) and Ø55 at
 * (200, 120); area 300·200 − π(20² + 27.5²) (rectangle minus disks, elementary geometry).
 */
import { describe, expect, it } from 'vitest';
import { integrateAdaptive } from '../../src/analysis/adaptive.js';
import { measureSection, preparePart } from '../../src/analysis/measure.js';
import { DEFAULT_INTEGRAL_TOLERANCE, integrateExpression } from '../../src/analysis/plate.js';
import { buildMesh } from '../../src/mesh/build.js';
import { refineUniform } from '../../src/mesh/refine.js';
import { MOMENT_COUNT, integrate } from '../../src/quadrature/integrate.js';
import { STOP_REASONS, type StopReason, combineStops, isCap } from '../../src/quadrature/stop.js';
import { partFromObject } from '../../src/read/partJson.js';
import { stopText } from '../../src/output/stopText.js';

const plate = {
  outline: { rectangle: { corner: [0, 0], size: [300, 200] } },
  cutouts: [{ circle: { center: [80, 60], diameter: 40 } }, { circle: { center: [200, 120], diameter: 55 } }],
};
const AREA = 300 * 200 - Math.PI * (20 ** 2 + 27.5 ** 2);

describe('adaptive integrator and integrate() on the same triangles', () => {
  const mesh = buildMesh(preparePart(partFromObject(plate))).mesh;
  const g = (x: number, y: number) => Math.sin(x / 40) * Math.cos(y / 30) + 2;

  it('without a tolerance: fine = uniform refinement, coarse = base mesh (to summation round-off), area within its estimate of the closed form', () => {
    for (const degree of [4, 10]) {
      const r = integrateAdaptive(mesh, 2, (x, y, _lx, _ly, out) => { out[0] = 1; out[1] = g(x, y); }, { degree });
      const fineU = integrate(refineUniform(mesh), { degree, functions: [() => 1, g], polynomialDegree: null }).sums;
      const coarseU = integrate(mesh, { degree, functions: [() => 1, g], polynomialDegree: null }).sums;
      expect(r.stopped).toBe('levels');
      for (let k = 0; k < 2; k++) {
        // both sums are compensated but add in different orders: a few ulps of the summed magnitude apart
        const allowance = 16 * Number.EPSILON * r.scale[k];
        expect(Math.abs(r.fine[k] - fineU[MOMENT_COUNT + k])).toBeLessThanOrEqual(allowance);
        expect(Math.abs(r.coarse[k] - coarseU[MOMENT_COUNT + k])).toBeLessThanOrEqual(allowance);
      }
      // degree 10 meets the closed form closely (degree 4 is measurably off: 5.7e-11 relative)
      if (degree === 10) expect(Math.abs(r.fine[0] - AREA) / AREA).toBeLessThan(1e-12);
      // the area's estimate covers its true error
      expect(r.estimate[0] + 64 * Number.EPSILON * r.scale[0]).toBeGreaterThanOrEqual(Math.abs(r.fine[0] - AREA));
    }
  });
});

describe('one stop code everywhere', () => {
  it('the boundary formula says exact, the mesh path says levels', () => {
    const straight = partFromObject({ outline: { rectangle: { corner: [0, 0], size: [30, 20] } } });
    expect(measureSection(straight).method.stopped).toBe('exact');
    expect(measureSection(straight, { method: 'mesh' }).method.stopped).toBe('levels');
    // curved parts take the boundary path too (exact), unless the mesh is asked for
    expect(measureSection(partFromObject(plate)).method.stopped).toBe('exact');
    expect(measureSection(partFromObject(plate), { method: 'mesh' }).method.stopped).toBe('levels');
  });

  it('adaptive refinement says tolerance, or which cap stopped it', () => {
    const p = partFromObject(plate);
    // a polynomial comes exactly from the boundary; on the mesh, without a tolerance, it stops at the levels;
    // anything else is refined to the default tolerance, or with tolerance null stops at the levels
    expect(integrateExpression(p, 'x*y', {}).method.stopped).toBe('exact');
    expect(integrateExpression(p, 'x*y', { method: 'mesh' }).method.stopped).toBe('levels');
    const smooth = integrateExpression(p, 'sin(x/100)', {});
    expect(smooth.method.stopped).toBe('tolerance');
    expect(smooth.method.tolerance).toBe(DEFAULT_INTEGRAL_TOLERANCE);
    expect(integrateExpression(p, 'sin(x/100)', { tolerance: null }).method.stopped).toBe('levels');
    expect(integrateExpression(p, 'exp(-((x-120)^2+(y-90)^2)/300)', { tolerance: 1e-6 }).method.stopped).toBe('tolerance');
    const capped = integrateExpression(p, '1/sqrt((x-37.3)^2 + (y-21.7)^2 + 1e-6)', { tolerance: 1e-12, maxTriangles: 2000 });
    expect(capped.method.stopped).toBe('triangle-cap');
    expect(isCap(capped.method.stopped)).toBe(true);
    // the library result holds no words for the stop; the writers add them
    expect(capped.warnings.join(' ')).not.toMatch(/cap/);
  });

  it('a combination takes the weakest claim of its parts', () => {
    expect(combineStops(['exact', 'levels'])).toBe('levels');
    expect(combineStops(['tolerance', 'tolerance'])).toBe('tolerance');
    expect(combineStops(['tolerance', 'triangle-cap'])).toBe('triangle-cap');
    expect(combineStops(['time-cap', 'triangle-cap', 'tolerance'])).toBe('time-cap');
    expect(combineStops(['exact'])).toBe('exact');
  });

  it('every code has its own words in src/output', () => {
    const facts = { tolerance: 1e-6, triangles: 2000, millis: 1500 };
    const words = STOP_REASONS.map((s: StopReason) => stopText({ stopped: s, ...facts }));
    expect(new Set(words).size).toBe(STOP_REASONS.length);
    for (const w of words) expect(w.length).toBeGreaterThan(10);
    expect(stopText({ stopped: 'triangle-cap', ...facts })).toMatch(/2000 triangles/);
    expect(stopText({ stopped: 'time-cap', ...facts })).toMatch(/1\.5 s/);
    expect(stopText({ stopped: 'levels', refinementLevels: 3 })).toMatch(/3 uniform refinements/);
  });
});
