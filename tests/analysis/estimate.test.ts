/**
 * The promises of the error estimate: it never understates the true error (checked against closed forms at
 * rule degrees where the error is visible), and where the result is exact it falls to round-off level.
 * Closed forms: handbook section properties (from memory), as in tests/reference/handbook-sections.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { SECTION_QUANTITIES } from '../../src/properties/quantities.js';
import { measureObj } from '../helpers.js';

interface Case { name: string; part: unknown; exact: Record<string, number> }

const D = 400, d = 200, bolt = 22, pcd = 300;
const a = Math.PI * bolt * bolt / 4;
const cases: Case[] = [
  {
    name: 'circle d = 50 at (−7, 3)',
    part: { outline: { circle: { center: [-7, 3], diameter: 50 } } },
    exact: { area: Math.PI * 625, Ix: Math.PI * 50 ** 4 / 64, Iy: Math.PI * 50 ** 4 / 64, centroidX: -7, centroidY: 3, IxOrigin: Math.PI * 50 ** 4 / 64 + Math.PI * 625 * 9 },
  },
  {
    name: 'annulus with six bolt holes',
    part: {
      outline: { circle: { center: [0, 0], diameter: D } },
      cutouts: [{ circle: { center: [0, 0], diameter: d } },
        ...Array.from({ length: 6 }, (_, i) => ({ circle: { center: [pcd / 2 * Math.cos(i * Math.PI / 3), pcd / 2 * Math.sin(i * Math.PI / 3)], diameter: bolt } }))],
    },
    exact: {
      area: Math.PI * (D * D - d * d) / 4 - 6 * a,
      Ix: Math.PI * (D ** 4 - d ** 4) / 64 - 6 * Math.PI * bolt ** 4 / 64 - a * 3 * (pcd / 2) ** 2,
    },
  },
  {
    name: 'semicircle R = 40',
    part: { outline: { path: { start: [40, 0], segments: [{ to: [-40, 0], center: [0, 0], turn: 'ccw' }] } } },
    exact: { area: Math.PI * 800, centroidY: 160 / (3 * Math.PI), Ix: (Math.PI / 8 - 8 / (9 * Math.PI)) * 40 ** 4, Iy: Math.PI * 40 ** 4 / 8 },
  },
  {
    // issue 13, item 6: at degree 1 the two-level difference was 0.24× the centroid's true error here
    name: 'quarter disc R = 30 (corner at the origin)',
    part: { outline: { path: { start: [0, 0], segments: [{ to: [30, 0] }, { to: [0, 30], center: [0, 0], turn: 'ccw' }] } } },
    exact: { area: Math.PI * 225, centroidX: 40 / Math.PI, centroidY: 40 / Math.PI, IxOrigin: Math.PI * 30 ** 4 / 16, IxyOrigin: 30 ** 4 / 8 },
  },
];

describe('error estimates never understate the true error', () => {
  for (const c of cases) {
    // the mesh path at every rule degree, and the boundary path (exact integrals: round-off alone)
    for (const degree of [1, 2, 4, 5, 6, 8, 10, 12, 0]) {
      it(`${c.name}, ${degree ? `mesh, degree ${degree}` : 'boundary path'}`, () => {
        const r = measureObj(c.part, degree ? { degree, method: 'mesh' } : {});
        expect(r.method.path).toBe(degree ? 'mesh' : 'boundary');
        for (const [k, exact] of Object.entries(c.exact)) {
          const q = (r.quantities as Record<string, { value: number; error: number }>)[k];
          const trueErr = Math.abs(q.value - exact);
          expect(q.error, `${k}: estimate ${q.error.toExponential(2)} vs true ${trueErr.toExponential(2)}`).toBeGreaterThanOrEqual(trueErr);
        }
      });
    }
  }

  it('the estimate is informative: on a coarse rule it is within a few orders of the true error, not a blanket bound', () => {
    const r = measureObj(cases[0].part, { degree: 2, method: 'mesh' });
    const trueErr = Math.abs(r.quantities.area.value - cases[0].exact.area);
    expect(trueErr).toBeGreaterThan(0);
    expect(r.quantities.area.error / trueErr).toBeLessThan(1e4);
  });
});

describe('exact cases: the estimate falls to round-off', () => {
  it('straight-edged plate with a polygonal cut-out: every estimate below 1e-13 of its natural scale', () => {
    const r = measureObj({ outline: { polygon: [[0, 0], [400, 0], [400, 250], [150, 300], [0, 250]] }, cutouts: [{ polygon: [[100, 100], [200, 80], [180, 160]] }] });
    const A = r.quantities.area.value;
    const L = 400;
    for (const info of SECTION_QUANTITIES) {
      const q = r.quantities[info.key as keyof typeof r.quantities];
      const scale = info.dimension === 'length4' ? A * L * L : info.dimension === 'length3' ? A * L : info.dimension === 'area' ? A : info.dimension === 'angle' ? 90 : L;
      expect(q.error / scale, info.key).toBeLessThan(1e-13);
      expect(q.error, info.key).toBeGreaterThan(0);
    }
  });

  it('a circle at the default degree: area and second moments estimated below 1e-12 relative', () => {
    const r = measureObj(cases[0].part, { method: 'mesh' });
    expect(r.quantities.area.error / r.quantities.area.value).toBeLessThan(1e-12);
    expect(r.quantities.Ix.error / r.quantities.Ix.value).toBeLessThan(1e-11);
  });
});
