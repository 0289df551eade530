/**
 * Mass properties from the boundary, without a mesh, for layers of constant thickness and density: every
 * raw mass sum is then a constant times an area moment (ρt·∫{1, x, y, x², xy, y²}, ρ(z0·t + t²/2)·∫{1, x, y},
 * ρ((z0 + t)³ − z0³)/3·∫1), and the section step has those moments exactly from the boundary
 * (src/properties/boundary.ts). Estimates: the boundary integrals' round-off bound and the representation
 * allowance of the boundary (δ·L times the largest |integrand| over the part), times each constant,
 * propagated through every derived quantity like the mesh path's estimates (propagateErrors).
 *
 * Thickness and density that vary as polynomials (the expression analyser gives their degree) and that interval
 * arithmetic proves positive over the part's box: the ten mass integrands are polynomials too, integrated
 * exactly from the boundary (src/properties/boundaryPolynomial.ts) with their round-off bound. Anything
 * else — a non-polynomial field, one not proved positive (the mesh path then finds the offending point), a
 * degree above MAX_BOUNDARY_DEGREE, or a section measured on the mesh (`--method mesh`) — takes the mesh
 * (src/analysis/plate.ts).
 */
import { compileExpression } from '../expr/index.js';
import { rangeOnBox, roundingOnBox } from '../expr/smooth.js';
import { type Field, fieldError, type ResolvedLayer } from '../model/plate.js';
import { partBox } from '../geometry/part.js';
import { type Bound, MAX_BOUNDARY_DEGREE, type PolynomialIntegrand, boundAdd, boundCoordinate, boundMul, boundaryPolynomialIntegrals } from '../properties/boundaryPolynomial.js';
import type { LengthUnit } from '../base/units.js';
import { MASS_KEYS, MASS_SUMS, type MassKey, type MassValues, massFromSums, propagateErrors, shiftMassSums } from '../properties/mass.js';
import type { Quantity } from '../properties/quantities.js';
import type { SectionResult } from './measure.js';
import type { LayerMass, MassResult } from './plate.js';

const toQuantities = (values: MassValues, errors: MassValues): Record<MassKey, Quantity> => {
  const q = {} as Record<MassKey, Quantity>;
  for (const k of MASS_KEYS) q[k] = { value: values[k], error: errors[k] };
  return q;
};

/** Degree of each of the six area moments' integrands. */
const DEG = [0, 1, 1, 2, 2, 2];

/**
 * A field as a polynomial: its degree, its evaluator and its running error bound over a box (part
 * coordinates, inputs off by up to `inputError`), or null when it is not one or not proved positive and
 * finite on the part's box.
 */
interface PolyField { degree: number; evaluate: (x: number, y: number) => number; bound: (box: [number, number, number, number], inputError: number) => Bound | null }
function polyField(f: Field, partBox: [number, number, number, number]): PolyField | null {
  if (f.constant !== undefined) { const v = f.constant; return { degree: 0, evaluate: () => v, bound: () => [Math.abs(v), 0] }; }
  const c = compileExpression(f.text, f.where);
  if (c.polynomialDegree === null) return null;
  const range = rangeOnBox(c.tree, partBox);
  if (range === null || !(range[0] > 0) || !Number.isFinite(range[1])) return null;
  return {
    degree: c.polynomialDegree, evaluate: c.evaluate,
    bound: (box, inputError) => { const r = roundingOnBox(c.tree, box, inputError); return r && [r.max, r.error]; },
  };
}

/**
 * The ten raw mass integrands of a layer with polynomial thickness T and density P (local coordinates lx, ly):
 * a = PT times 1, x, y, x², xy, y²; P(z0·T + T²/2) times 1, x, y; P((z0 + T)³ − z0³)/3 — or null when a field
 * is not a polynomial proved positive on the part's box, or the degree is above MAX_BOUNDARY_DEGREE. The
 * bounds follow the evaluation in `fill` operation by operation (boundMul, boundAdd).
 */
function massIntegrand(layer: ResolvedLayer, origin: readonly [number, number]): PolynomialIntegrand | null {
  const box = partBox(layer.part) as [number, number, number, number];
  const T = polyField(layer.thickness, box), P = polyField(layer.density, box);
  if (!T || !P) return null;
  const z0 = layer.z0;
  const degree = Math.max(P.degree + T.degree + 2, P.degree + 2 * T.degree + 1, P.degree + 3 * T.degree);
  if (degree > MAX_BOUNDARY_DEGREE) return null;
  const [ox, oy] = origin;
  const tEval = T.evaluate, pEval = P.evaluate;
  return {
    count: MASS_SUMS, degree,
    fill(x, y, lx, ly, out) {
      const t = tEval(x, y), rho = pEval(x, y);
      const a = rho * t, zm = rho * (z0 * t + 0.5 * t * t), top = z0 + t;
      out[0] = a; out[1] = a * lx; out[2] = a * ly;
      out[3] = a * lx * lx; out[4] = a * lx * ly; out[5] = a * ly * ly;
      out[6] = zm; out[7] = zm * lx; out[8] = zm * ly;
      out[9] = rho * (top * top * top - z0 * z0 * z0) / 3;
    },
    bounds(X, Y, posErr, out) {
      // part coordinates ox + λ·lx: the position error, λ·lx's rounding and the sum's
      const ev: [number, number, number, number] = [ox - X, oy - Y, ox + X, oy + Y];
      const input = posErr + 2 * Number.EPSILON * (Math.max(Math.abs(ox), Math.abs(oy)) + Math.max(X, Y));
      const t = T.bound(ev, input), rho = P.bound(ev, input);
      if (!t || !rho) { out.fill(Infinity); return; }
      const lx = boundCoordinate(X, posErr), ly = boundCoordinate(Y, posErr), Z: Bound = [Math.abs(z0), 0];
      const a = boundMul(rho, t);
      const zm = boundMul(rho, boundAdd(boundMul(Z, t), boundMul([0.5, 0], boundMul(t, t))));
      const top = boundAdd(Z, t);
      const zz = boundMul(boundMul(rho, boundAdd(boundMul(boundMul(top, top), top), boundMul(boundMul(Z, Z), Z))), [1 / 3, 0]);
      const all = [a, boundMul(a, lx), boundMul(a, ly), boundMul(boundMul(a, lx), lx), boundMul(boundMul(a, lx), ly), boundMul(boundMul(a, ly), ly), zm, boundMul(zm, lx), boundMul(zm, ly), zz];
      for (let k = 0; k < MASS_SUMS; k++) { out[k] = all[k][0]; out[MASS_SUMS + k] = all[k][1]; }
    },
  };
}

/** One layer's raw mass sums about its section's origin, with estimates: a multiple of the area moments, or the polynomial boundary path. */
function layerBoundarySums(l: ResolvedLayer, sec: SectionResult): { fine: Float64Array; estimate: Float64Array; points: number } | null {
  const boundary = sec.geometry.boundary;
  if (!boundary) return null;
  const origin = sec.method.localOrigin;
  const rep = boundary.shiftLength;
  const fine = new Float64Array(MASS_SUMS), estimate = new Float64Array(MASS_SUMS);
  if (l.thickness.constant !== undefined && l.density.constant !== undefined) {
    const t = l.thickness.constant, rho = l.density.constant, z0 = l.z0;
    const q = sec.quantities;
    if (!(t > 0) || !Number.isFinite(t)) throw fieldError(l.thickness, t, q.centroidX.value, q.centroidY.value);
    if (!(rho > 0) || !Number.isFinite(rho)) throw fieldError(l.density, rho, q.centroidX.value, q.centroidY.value);
    const { moments: M, roundoff } = boundary;
    // largest |x|, |y| (local) over the part, for the representation allowance δ·L·max|f|
    const R = Math.max(Math.abs(q.xMax.value - origin[0]), Math.abs(q.xMin.value - origin[0]), Math.abs(q.yMax.value - origin[1]), Math.abs(q.yMin.value - origin[1]));
    const err = (k: number) => roundoff[k] + rep * R ** DEG[k];
    const a = rho * t, zm = rho * (z0 * t + 0.5 * t * t), top = z0 + t, zz = rho * (top * top * top - z0 * z0 * z0) / 3;
    const coef = [a, a, a, a, a, a, zm, zm, zm, zz];
    const src = [0, 1, 2, 3, 4, 5, 0, 1, 2, 0];
    for (let k = 0; k < MASS_SUMS; k++) { fine[k] = coef[k] * M[src[k]]; estimate[k] = Math.abs(coef[k]) * err(src[k]); }
    return { fine, estimate, points: sec.method.vertices };
  }
  const g = massIntegrand(l, origin);
  if (!g) return null;
  const r = boundaryPolynomialIntegrals(l.part, origin, g);
  for (let k = 0; k < MASS_SUMS; k++) { fine[k] = r.sums[k]; estimate[k] = r.roundoff[k] + rep * r.bound[k]; }
  return { fine, estimate, points: r.nodes };
}

/**
 * Mass properties of layers from their sections' boundaries (constant or polynomial thickness and density),
 * or null when some layer needs the mesh (see the file comment).
 */
export function boundaryMass(name: string, units: LengthUnit, layers: ResolvedLayer[], sections: SectionResult[]): MassResult | null {
  if (layers.length === 0) return null;
  for (let i = 0; i < layers.length; i++) if (!sections[i]?.geometry.boundary) return null;
  const started = performance.now();
  const runs: { fine: Float64Array; estimate: Float64Array; points: number }[] = [];
  for (let i = 0; i < layers.length; i++) {
    const r = layerBoundarySums(layers[i], sections[i]);
    if (!r) return null;
    runs.push(r);
  }
  const ref = sections[0].method.localOrigin;
  const total = { fine: new Float64Array(MASS_SUMS), estimate: new Float64Array(MASS_SUMS), scale: new Float64Array(MASS_SUMS) };
  const out: LayerMass[] = [];
  let points = 0;
  for (let i = 0; i < layers.length; i++) {
    const l = layers[i], origin = sections[i].method.localOrigin;
    const { fine, estimate } = runs[i];
    const scale = new Float64Array(MASS_SUMS);
    for (let k = 0; k < MASS_SUMS; k++) scale[k] = Math.abs(fine[k]);
    const { values, errors } = propagateErrors((s) => massFromSums(s, origin, units), fine, fine, estimate, scale);
    out.push({ name: l.name, z0: l.z0, densityFrom: l.densityFrom, material: l.material, thickness: l.thickness.text, quantities: toQuantities(values, errors) });
    const dx = origin[0] - ref[0], dy = origin[1] - ref[1];
    const f = shiftMassSums(fine, dx, dy);
    const e = shiftMassSums(estimate, Math.abs(dx), Math.abs(dy)), s = shiftMassSums(scale, Math.abs(dx), Math.abs(dy));
    for (let k = 0; k < MASS_SUMS; k++) { total.fine[k] += f[k]; total.estimate[k] += e[k]; total.scale[k] += s[k]; }
    points += runs[i].points;
  }
  const { values, errors } = propagateErrors((s) => massFromSums(s, ref, units), total.fine, total.fine, total.estimate, total.scale);
  return {
    part: name, units, quantities: toQuantities(values, errors), layers: out,
    method: {
      degree: 0, rulePoints: 0, estimator: 'exact boundary integrals', stopped: 'exact', tolerance: null,
      baseTriangles: 0, triangles: 0, rounds: 0, points, millis: performance.now() - started, minJacobianRatio: 1,
      errorIsBound: true, unverifiedTriangles: 0, boundedTriangles: 0, kinkCuts: 0,
    },
  };
}
