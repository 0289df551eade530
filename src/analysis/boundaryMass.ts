/**
 * Mass properties from the boundary, without a mesh, for layers of constant thickness and density: every
 * raw mass sum is then a constant times an area moment (ρt·∫{1, x, y, x², xy, y²}, ρ(z0·t + t²/2)·∫{1, x, y},
 * ρ((z0 + t)³ − z0³)/3·∫1), and the section step has those moments exactly from the boundary
 * (src/properties/boundary.ts). Estimates: the boundary integrals' round-off bound and the representation
 * allowance of the boundary (δ·L times the largest |integrand| over the part), times each constant,
 * propagated through every derived quantity like the mesh path's estimates (propagateErrors).
 *
 * Polynomial thickness or density that vary over the part still take the mesh (src/analysis/plate.ts).
 */
import { fieldError, type ResolvedLayer } from '../model/plate.js';
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
 * Mass properties of layers of constant thickness and density from their sections' boundary moments, or
 * null when some layer's thickness or density varies or its section did not take the boundary path.
 */
export function boundaryMass(name: string, units: LengthUnit, layers: ResolvedLayer[], sections: SectionResult[]): MassResult | null {
  if (layers.length === 0) return null;
  for (let i = 0; i < layers.length; i++) {
    const l = layers[i];
    if (l.thickness.constant === undefined || l.density.constant === undefined || !sections[i]?.geometry.boundary) return null;
  }
  const started = performance.now();
  const ref = sections[0].method.localOrigin;
  const total = { fine: new Float64Array(MASS_SUMS), estimate: new Float64Array(MASS_SUMS), scale: new Float64Array(MASS_SUMS) };
  const out: LayerMass[] = [];
  let segments = 0;
  for (let i = 0; i < layers.length; i++) {
    const l = layers[i], sec = sections[i];
    const t = l.thickness.constant!, rho = l.density.constant!, z0 = l.z0;
    const cx = sec.quantities.centroidX.value, cy = sec.quantities.centroidY.value;
    if (!(t > 0) || !Number.isFinite(t)) throw fieldError(l.thickness, t, cx, cy);
    if (!(rho > 0) || !Number.isFinite(rho)) throw fieldError(l.density, rho, cx, cy);
    const { moments: M, roundoff } = sec.geometry.boundary!;
    const origin = sec.method.localOrigin;
    const q = sec.quantities;
    // largest |x|, |y| (local) over the part, for the representation allowance δ·L·max|f|
    const R = Math.max(Math.abs(q.xMax.value - origin[0]), Math.abs(q.xMin.value - origin[0]), Math.abs(q.yMax.value - origin[1]), Math.abs(q.yMin.value - origin[1]));
    const rep = sec.geometry.boundary!.shiftLength;
    const err = (k: number) => roundoff[k] + rep * R ** DEG[k];
    const a = rho * t, zm = rho * (z0 * t + 0.5 * t * t), top = z0 + t, zz = rho * (top * top * top - z0 * z0 * z0) / 3;
    const coef = [a, a, a, a, a, a, zm, zm, zm, zz];
    const src = [0, 1, 2, 3, 4, 5, 0, 1, 2, 0];
    const fine = new Float64Array(MASS_SUMS), estimate = new Float64Array(MASS_SUMS), scale = new Float64Array(MASS_SUMS);
    for (let k = 0; k < MASS_SUMS; k++) {
      fine[k] = coef[k] * M[src[k]];
      estimate[k] = Math.abs(coef[k]) * err(src[k]);
      scale[k] = Math.abs(fine[k]);
    }
    const { values, errors } = propagateErrors((s) => massFromSums(s, origin, units), fine, fine, estimate, scale);
    out.push({ name: l.name, z0: l.z0, densityFrom: l.densityFrom, material: l.material, thickness: l.thickness.text, quantities: toQuantities(values, errors) });
    const dx = origin[0] - ref[0], dy = origin[1] - ref[1];
    const f = shiftMassSums(fine, dx, dy);
    const e = shiftMassSums(estimate, Math.abs(dx), Math.abs(dy)), s = shiftMassSums(scale, Math.abs(dx), Math.abs(dy));
    for (let k = 0; k < MASS_SUMS; k++) { total.fine[k] += f[k]; total.estimate[k] += e[k]; total.scale[k] += s[k]; }
    segments += sec.method.vertices;
  }
  const { values, errors } = propagateErrors((s) => massFromSums(s, ref, units), total.fine, total.fine, total.estimate, total.scale);
  return {
    part: name, units, quantities: toQuantities(values, errors), layers: out,
    method: {
      degree: 0, rulePoints: 0, estimator: 'exact boundary integrals', stopped: 'exact', tolerance: null,
      baseTriangles: 0, triangles: 0, rounds: 0, points: segments, millis: performance.now() - started, minJacobianRatio: 1,
      errorIsBound: true, unverifiedTriangles: 0, kinkCuts: 0,
    },
  };
}
