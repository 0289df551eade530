/**
 * The one triangle kernel (integrateTriangle) against closed forms, on straight and curved triangles.
 *
 * Reference values and where they come from:
 *  - Monomials over a triangle: with barycentric l_i, ∫ l1^a l2^b l3^c dA = 2A·a!·b!·c!/(a + b + c + 2)!
 *    (the simplex integration formula, e.g. Zienkiewicz, Taylor & Zhu, The Finite Element Method: Its
 *    Basis and Fundamentals, 7th ed., §6.5). With x = Σ x_i l_i it gives ∫ x dA = A·x̄ and
 *    ∫ x² dA = (A/6)(Σ x_i² + Σ_{i<j} x_i x_j), likewise for xy and y²; over the unit right triangle
 *    ∫ x^a y^b dA = a!·b!/(a + b + 2)!.
 *  - ∫ e^(x+y) dA over the unit right triangle: the line x + y = s crosses it in a segment whose projection on
 *    the x axis has length s, so the integral is ∫_0^1 s·e^s ds = [e^s(s − 1)]_0^1 = 1 (derived here).
 *  - Circular segment of angle θ on radius R: sector R²θ/2 minus the isosceles triangle R² sin θ/2, so area
 *    R²(θ − sin θ)/2, centroid on the bisector at 4R sin³(θ/2)/(3(θ − sin θ)) from the centre (elementary
 *    geometry; the centroid from ∫ over the sector minus the triangle's centroid at (2/3)R cos(θ/2)).
 *    A curved triangle whose edge P1→P2 follows the arc has area = straight triangle ∓ segment: minus when
 *    the arc bulges into the triangle (apex beyond the chord, outside the circle), plus when it bulges out.
 */
import { describe, expect, it } from 'vitest';
import type { ArcSegment } from '../../src/geometry/segments.js';
import { type MeshView, TriangleMap } from '../../src/mesh/mesh.js';
import { type PointFunction, integrate, integrateTriangle, makeKernel } from '../../src/quadrature/integrate.js';
import { getRule } from '../../src/quadrature/rules.js';

/** One straight triangle as a MeshView literal (the structural type needs no Mesh, no cast). */
function straight(p: [number, number][], origin: [number, number] = [0, 0]): MeshView {
  return {
    origin, coords: Float64Array.from(p.flat()), triangles: Uint32Array.from([0, 1, 2]),
    edgeCurve: Int32Array.from([-1, -1, -1]), curveSeg: new Uint32Array(0), curveS0: new Float64Array(0), curveS1: new Float64Array(0),
    segments: [], count: 1,
  };
}

/** Apex P0 and an edge on the arc of radius R about (cx, cy) from angle a0 to a1, counter-clockwise. */
function arcTriangle(apex: [number, number], cx: number, cy: number, R: number, a0: number, a1: number): MeshView {
  const arc: ArcSegment = { kind: 'arc', cx, cy, r: R, a0, a1 };
  const p1: [number, number] = [cx + R * Math.cos(a0), cy + R * Math.sin(a0)];
  const p2: [number, number] = [cx + R * Math.cos(a1), cy + R * Math.sin(a1)];
  const det = (p1[0] - apex[0]) * (p2[1] - apex[1]) - (p2[0] - apex[0]) * (p1[1] - apex[1]);
  const [q1, q2, s0, s1] = det > 0 ? [p1, p2, 0, 1] : [p2, p1, 1, 0];
  return {
    origin: [0, 0], coords: Float64Array.from([...apex, ...q1, ...q2]), triangles: Uint32Array.from([0, 1, 2]),
    edgeCurve: Int32Array.from([-1, 0, -1]), curveSeg: Uint32Array.from([0]), curveS0: Float64Array.from([s0]), curveS1: Float64Array.from([s1]),
    segments: [arc], count: 1,
  };
}

/** Closed-form area and first moments of the curved triangle above (see the file comment). */
function arcTriangleClosedForm(apex: [number, number], cx: number, cy: number, R: number, a0: number, a1: number) {
  const p1 = [cx + R * Math.cos(a0), cy + R * Math.sin(a0)], p2 = [cx + R * Math.cos(a1), cy + R * Math.sin(a1)];
  const triA = Math.abs((p1[0] - apex[0]) * (p2[1] - apex[1]) - (p2[0] - apex[0]) * (p1[1] - apex[1])) / 2;
  const th = a1 - a0, mid = (a0 + a1) / 2;
  const segA = R * R * (th - Math.sin(th)) / 2;
  const d = 4 * R * Math.sin(th / 2) ** 3 / (3 * (th - Math.sin(th)));
  const sgn = Math.hypot(apex[0] - cx, apex[1] - cy) > R ? -1 : 1;
  return {
    area: triA + sgn * segA,
    mx: triA * (apex[0] + p1[0] + p2[0]) / 3 + sgn * segA * (cx + d * Math.cos(mid)),
    my: triA * (apex[1] + p1[1] + p2[1]) / 3 + sgn * segA * (cy + d * Math.sin(mid)),
  };
}

/** Run the kernel once on triangle 0 of m. */
function kernelOnce(m: MeshView, degree: number, K: number, moments: boolean, fill: PointFunction | null) {
  const map = new TriangleMap().load(m, 0);
  const kernel = makeKernel(K, moments, fill, m.origin);
  const acc = new Float64Array(K + 2).fill(NaN);
  integrateTriangle(map, getRule(degree), kernel, acc, 1);
  return { values: acc.subarray(1, 1 + K), acc, kernel };
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('integrateTriangle on straight triangles (simplex monomial formula)', () => {
  const P: [number, number][] = [[1.5, -0.25], [7.25, 2], [2.5, 5.5]];
  const A = ((P[1][0] - P[0][0]) * (P[2][1] - P[0][1]) - (P[2][0] - P[0][0]) * (P[1][1] - P[0][1])) / 2;
  const sq = (i: 0 | 1) => P.reduce((s, p) => s + p[i] * p[i], 0) + P[0][i] * P[1][i] + P[1][i] * P[2][i] + P[2][i] * P[0][i];
  const xy = P.reduce((s, p) => s + 2 * p[0] * p[1], 0) + P[0][0] * P[1][1] + P[1][0] * P[0][1] + P[1][0] * P[2][1] + P[2][0] * P[1][1] + P[2][0] * P[0][1] + P[0][0] * P[2][1];
  const exact = [A, A * (P[0][0] + P[1][0] + P[2][0]) / 3, A * (P[0][1] + P[1][1] + P[2][1]) / 3, (A / 6) * sq(0), (A / 12) * xy, (A / 6) * sq(1)];

  it('the six raw moments, exact with the degree-2 rule, written at the given offset only', () => {
    const { values, acc } = kernelOnce(straight(P), 2, 6, true, null);
    for (let k = 0; k < 6; k++) expect(rel(values[k], exact[k])).toBeLessThan(4e-16 * 8);
    expect(Number.isNaN(acc[0]) && Number.isNaN(acc[7])).toBe(true);
  });

  it('degree 1 is not exact for the second moments (the check above can fail)', () => {
    const { values } = kernelOnce(straight(P), 1, 6, true, null);
    expect(rel(values[3], exact[3])).toBeGreaterThan(1e-3);
  });

  it('a point function after the moments gets part coordinates and local ones (origin added once)', () => {
    // the same triangle stored about origin (100, −50): moments stay local, the function sees part coordinates
    const origin: [number, number] = [100, -50];
    const local = P.map(([x, y]) => [x - origin[0], y - origin[1]] as [number, number]);
    const fill: PointFunction = (x, y, lx, ly, out) => { out[6] = x; out[7] = (x - lx) * (y - ly); };
    const { values } = kernelOnce(straight(local, origin), 2, 8, true, fill);
    // ∫ x dA in part coordinates, and ∫ ox·oy dA = ox·oy·A
    expect(rel(values[6], exact[1])).toBeLessThan(1e-14);
    expect(rel(values[7], origin[0] * origin[1] * A)).toBeLessThan(1e-14);
    expect(rel(values[0], A)).toBeLessThan(1e-15);
  });

  it('unit right triangle: ∫ x³y² = 1/420 exact with degree 5 (not 4), ∫ e^(x+y) = 1 to 1e-14 with degree 10', () => {
    const U: [number, number][] = [[0, 0], [1, 0], [0, 1]];
    const poly = kernelOnce(straight(U), 5, 1, false, (x, y, _lx, _ly, out) => { out[0] = x ** 3 * y * y; });
    // exact up to the precision of the published rule data (tests/quadrature/rules.test.ts: 1e-14 absolute)
    expect(Math.abs(poly.values[0] - 6 * 2 / 5040)).toBeLessThan(1e-14);
    const poly4 = kernelOnce(straight(U), 4, 1, false, (x, y, _lx, _ly, out) => { out[0] = x ** 3 * y * y; });
    expect(Math.abs(poly4.values[0] - 6 * 2 / 5040)).toBeGreaterThan(1e-7); // degree 4 is not exact for degree 5
    const e10 = kernelOnce(straight(U), 10, 1, false, (x, y, _lx, _ly, out) => { out[0] = Math.exp(x + y); });
    expect(Math.abs(e10.values[0] - 1)).toBeLessThan(1e-14); // measured 6.7e-16; degree 8: 2.4e-12
    const e2 = kernelOnce(straight(U), 2, 1, false, (x, y, _lx, _ly, out) => { out[0] = Math.exp(x + y); });
    expect(Math.abs(e2.values[0] - 1)).toBeGreaterThan(1e-4); // a low rule is visibly off: the bound above is not idle
  });

  it('a straight triangle leaves minRatio alone', () => {
    expect(kernelOnce(straight(P), 4, 6, true, null).kernel.minRatio).toBe(Infinity);
  });
});

describe('integrateTriangle on curved triangles (straight triangle ± circular segment)', () => {
  const cases: { name: string; apex: [number, number]; cx: number; cy: number; R: number; a0: number; a1: number; tol: number }[] = [
    // arc bulges into the triangle: apex outside the circle, far from the centre
    { name: '90° arc, R 1 about the origin, apex (2.2, 2.2)', apex: [2.2, 2.2], cx: 0, cy: 0, R: 1, a0: 0, a1: Math.PI / 2, tol: 1e-13 },
    // arc bulges out of the triangle: apex inside the circle, off the centre
    { name: '60° arc, R 40 about (10, −5), apex inside at (22, 3)', apex: [22, 3], cx: 10, cy: -5, R: 40, a0: 0.4, a1: 0.4 + Math.PI / 3, tol: 1e-14 },
    { name: '30° arc, R 250 about (−80, 40), apex outside at (260, 190)', apex: [260, 190], cx: -80, cy: 40, R: 250, a0: 0.1, a1: 0.1 + Math.PI / 6, tol: 1e-14 },
  ];
  for (const c of cases) {
    it(`${c.name}: area and first moments with degree 12; degree 2 is visibly off`, () => {
      const m = arcTriangle(c.apex, c.cx, c.cy, c.R, c.a0, c.a1);
      const cf = arcTriangleClosedForm(c.apex, c.cx, c.cy, c.R, c.a0, c.a1);
      const { values, kernel } = kernelOnce(m, 12, 6, true, null);
      expect(rel(values[0], cf.area)).toBeLessThan(c.tol);
      expect(Math.abs(values[1] - cf.mx)).toBeLessThan(c.tol * 10 * Math.abs(cf.area) * (Math.hypot(c.cx, c.cy) + c.R));
      expect(Math.abs(values[2] - cf.my)).toBeLessThan(c.tol * 10 * Math.abs(cf.area) * (Math.hypot(c.cx, c.cy) + c.R));
      expect(kernel.minRatio).toBeGreaterThan(0);
      expect(kernel.minRatio).toBeLessThan(Infinity);
      const low = kernelOnce(m, 2, 6, true, null).values;
      expect(rel(low[0], cf.area)).toBeGreaterThan(100 * c.tol);
    });
  }

  it('a folded map is reported, not hidden: 90° arc, apex (2.2, 0.7) (the arc leaves (0, 1) at 45° to its chord, the corner there is 37°)', () => {
    // The signed integral of the Jacobian is still the signed area, so the closed form matches; but the map
    // folds near (0, 1) and the kernel's smallest Jacobian ratio says so (buildMesh would split this chord).
    const apex: [number, number] = [2.2, 0.7];
    const m = arcTriangle(apex, 0, 0, 1, 0, Math.PI / 2);
    const { values, kernel } = kernelOnce(m, 12, 6, true, null);
    expect(rel(values[0], arcTriangleClosedForm(apex, 0, 0, 1, 0, Math.PI / 2).area)).toBeLessThan(1e-13);
    expect(kernel.minRatio).toBeLessThan(0);
  });

  it('integrate() on a one-triangle mesh returns the kernel\'s numbers to the bit (one engine)', () => {
    const c = cases[1];
    const m = arcTriangle(c.apex, c.cx, c.cy, c.R, c.a0, c.a1);
    const fn = (x: number, y: number) => Math.sin(x / 7) * y;
    const viaIntegrate = integrate(m, { degree: 10, functions: [fn], polynomialDegree: null });
    const viaKernel = kernelOnce(m, 10, 7, true, (x, y, _lx, _ly, out) => { out[6] = fn(x, y); }).values;
    expect(Array.from(viaIntegrate.sums)).toEqual(Array.from(viaKernel));
  });
});
