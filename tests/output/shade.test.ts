/**
 * Shading: the per-triangle error indicator, function values at triangle centres, and the colour ramp's
 * legibility (WCAG 2.x relative luminance and contrast ratio, W3C Recommendation, "Definitions").
 */
import { describe, expect, it } from 'vitest';
import { measureSection } from '../../src/analysis/measure.js';
import type { Part } from '../../src/geometry/part.js';
import { circleLoop, rectangleLoop } from '../../src/geometry/shapes.js';
import { parseXml } from '../../src/read/xml.js';
import { buildMesh } from '../../src/mesh/build.js';
import { isCurved, triangleCount } from '../../src/mesh/mesh.js';
import { PALETTE, drawPart } from '../../src/output/draw.js';
import { RAMP_STEPS, binValues, contrastRatio, errorIndicator, functionValues, rampColour, relativeLuminance } from '../../src/output/shade.js';

const plate = (holes: boolean): Part => ({
  name: 'p', units: 'mm',
  regions: [{ outer: rectangleLoop([0, 0], [200, 100]), holes: holes ? [circleLoop([60, 50], 40), circleLoop([150, 50], 30)] : [] }],
});

describe('error indicator per triangle', () => {
  it('straight triangles are exact for the moments (Dunavant rules integrate degree-2 polynomials exactly): η at round-off', () => {
    const { mesh } = buildMesh(plate(false));
    const eta = errorIndicator(mesh, 10).values;
    expect(eta.length).toBe(triangleCount(mesh));
    for (const v of eta) expect(v).toBeLessThan(1e-13);
  });

  it('with a low rule degree the curved triangles carry the error, the straight ones none', () => {
    const { mesh } = buildMesh(plate(true));
    const eta = errorIndicator(mesh, 2).values;
    let curvedMax = 0, straightMax = 0;
    for (let t = 0; t < eta.length; t++) {
      if (isCurved(mesh, t)) curvedMax = Math.max(curvedMax, eta[t]); else straightMax = Math.max(straightMax, eta[t]);
    }
    expect(curvedMax).toBeGreaterThan(1e-9);
    expect(straightMax).toBeLessThan(1e-13);
  });

  it('the indicators add up: Σ over triangles of (children − parent) area equals the refined − coarse total', () => {
    // two measureSection levels give the global change; the per-triangle differences must account for it
    const p = plate(true);
    const r = measureSection(p, { degree: 2, method: 'mesh' });
    const { mesh } = buildMesh(p);
    const eta = errorIndicator(mesh, 2).values;
    const globalRel = Math.abs(r.levels[1].values.area - r.levels[0].values.area) / r.levels[0].values.area;
    let sum = 0;
    for (const v of eta) sum += v;
    // η_t ≥ |ΔA_t|/A, and |Σ ΔA_t| ≤ Σ |ΔA_t|
    expect(sum).toBeGreaterThanOrEqual(globalRel * (1 - 1e-9));
  });
});

describe('function values at triangle centres', () => {
  it('a linear function at a straight triangle’s centre is the mean of its vertex values (centroid of a triangle, common practice)', () => {
    const { mesh } = buildMesh(plate(false));
    const f = functionValues(mesh, '7850 + 2*x - 3*y').values;
    const [ox, oy] = mesh.origin;
    for (let t = 0; t < triangleCount(mesh); t++) {
      let sx = 0, sy = 0;
      for (let j = 0; j < 3; j++) { const v = mesh.triangles[3 * t + j]; sx += mesh.coords[2 * v] + ox; sy += mesh.coords[2 * v + 1] + oy; }
      expect(f[t]).toBeCloseTo(7850 + (2 * sx) / 3 - sy, 9);
    }
  });

  it('a value that is not finite is refused with a located message', () => {
    const { mesh } = buildMesh(plate(false));
    expect(() => functionValues(mesh, 'log(x - 100)')).toThrow(/--shade/);
  });

  it('the shaded drawing has one filled triangle per mesh triangle and a legend of every step', async () => {
    const r = measureSection(plate(true), { method: 'mesh' });
    const root = parseXml(await drawPart(r, { shade: '7850 + 0.5*x' }), {}, 'drawing');
    const find = (role: string) => { const out: typeof root[] = []; const walk = (e: typeof root) => { if (e.attrs['data-role'] === role) out.push(e); e.children.forEach(walk); }; walk(root); return out; };
    expect(find('shading')[0].children).toHaveLength(r.method.baseTriangles);
    expect(find('legend')[0].children.filter((c) => c.name === 'rect')).toHaveLength(RAMP_STEPS);
  });
});

describe('colours', () => {
  it('WCAG luminance reference points: white 1, black 0, #777777 fails 4.5:1 on white and #767676 passes (from memory)', () => {
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 12);
    expect(relativeLuminance('#000000')).toBe(0);
    expect(contrastRatio('#777777', '#ffffff')).toBeLessThan(4.5);
    expect(contrastRatio('#767676', '#ffffff')).toBeGreaterThanOrEqual(4.5);
  });

  it('text colours meet WCAG AA (4.5:1) on white and on the title strip', () => {
    for (const c of [PALETTE.ink, PALETTE.axis, PALETTE.frame]) {
      expect(contrastRatio(c, PALETTE.paper)).toBeGreaterThanOrEqual(4.5);
      expect(contrastRatio(c, PALETTE.strip)).toBeGreaterThanOrEqual(4.5);
    }
    expect(contrastRatio(PALETTE.ink, PALETTE.material)).toBeGreaterThanOrEqual(7);
  });

  it('the ramp is ordered in grey: luminance falls strictly from step to step, light end to dark end over 8:1', () => {
    const L = Array.from({ length: RAMP_STEPS }, (_, i) => relativeLuminance(rampColour(i)));
    for (let i = 1; i < L.length; i++) expect(L[i]).toBeLessThan(L[i - 1] * 0.85);
    expect(contrastRatio(rampColour(0), rampColour(RAMP_STEPS - 1))).toBeGreaterThan(8);
  });

  it('log binning puts the largest value in the darkest step and zero in the lightest', () => {
    const b = binValues({ values: Float64Array.from([0, 1e-12, 1e-8, 1e-4]), title: 't', scale: 'log' });
    expect(b.bins[3]).toBe(RAMP_STEPS - 1);
    expect(b.bins[0]).toBe(0);
    expect(b.edges[RAMP_STEPS]).toBeCloseTo(1e-4, 15);
  });
});
