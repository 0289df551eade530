/**
 * Plastic section moduli about the centroidal x/y directions and the principal axes, the plastic neutral
 * axes, the elastic moduli about the principal axes (extreme fibres from the exact support function) and
 * the shape factors, from a validated, oriented part and its section quantities (src/properties/plastic.ts
 * holds the exact side integrals).
 *
 * Extreme fibres: lines and circular arcs have an exact support function (their kinds' `support` op);
 * elliptical arcs and Béziers have none in the kinds, so their extreme n·p is found at the ends and at
 * every zero of n·γ′, bisected to the last bit within pieces of ≤ π/8 turning (round-off accurate; the
 * result says `exactFibres: false`). A bound by sampling is never used.
 */
import type { Part } from '../geometry/part.js';
import { type PlasticKey, type Quantity, type SectionQuantities } from './quantities.js';
import { extent, plasticAxis } from './plastic.js';

export interface PlasticResult {
  quantities: Record<PlasticKey, Quantity>;
  /** false when a fibre distance came from a kind without an exact support function */
  exactFibres: boolean;
}

const relErr = (q: Quantity) => (q.value === 0 ? Infinity : q.error / Math.abs(q.value));

export function plasticSection(part: Part, s: SectionQuantities): PlasticResult {
  const A = s.area.value, cx = s.centroidX.value, cy = s.centroidY.value;
  const Sx = A * cx, Sy = A * cy;
  const th = (s.principalAngle.value * Math.PI) / 180;
  const c = Math.cos(th), sn = Math.sin(th);
  // bending about an axis with direction u: fibres measured along its normal n
  const zx = plasticAxis(part, 0, 1, A, Sx, Sy);
  const zy = plasticAxis(part, 1, 0, A, Sx, Sy);
  const z1 = plasticAxis(part, -sn, c, A, Sx, Sy);
  const z2 = plasticAxis(part, c, sn, A, Sx, Sy);
  // Z scales with the area: the area's own relative error carries into Z (and the first moments')
  const aRel = s.area.error / A + (s.centroidX.error + s.centroidY.error) / Math.max(s.width.value, s.height.value);
  const zq = (z: { Z: number; ZError: number }): Quantity => ({ value: z.Z, error: z.ZError + aRel * Math.abs(z.Z) });
  const e1 = extent(part, -sn, c), e2 = extent(part, c, sn);
  const n1c = -sn * cx + c * cy, n2c = c * cx + sn * cy;
  const f1 = Math.max(e1.max - n1c, n1c - e1.min), f2 = Math.max(e2.max - n2c, n2c - e2.min);
  // fibre distances: centroid error plus the round-off of the support values; the principal angle's error
  // moves the normal: |d(n·p)/dθ| ≤ the part's half-diagonal
  const diag = Math.hypot(s.width.value, s.height.value);
  const angErr = Math.min((s.principalAngle.error * Math.PI) / 180, Math.PI);
  const fErr = s.centroidX.error + s.centroidY.error + 64 * Number.EPSILON * (Math.abs(cx) + Math.abs(cy) + diag);
  const fib1: Quantity = { value: f1, error: fErr + angErr * diag };
  const fib2: Quantity = { value: f2, error: fErr + angErr * diag };
  const S1: Quantity = { value: s.I1.value / f1, error: (s.I1.value / f1) * (relErr(s.I1) + fib1.error / f1) };
  const S2: Quantity = { value: s.I2.value / f2, error: (s.I2.value / f2) * (relErr(s.I2) + fib2.error / f2) };
  const ratio = (z: Quantity, el: Quantity): Quantity => ({ value: z.value / el.value, error: (z.value / el.value) * (relErr(z) + relErr(el)) });
  const minQ = (a: Quantity, b: Quantity): Quantity => (a.value <= b.value ? a : b);
  const Zx = zq(zx), Zy = zq(zy), Z1 = zq(z1), Z2 = zq(z2);
  const pnaErr = (z: { offsetError: number }) => z.offsetError + aRel * diag;
  return {
    exactFibres: e1.exact && e2.exact,
    quantities: {
      Zx, Zy, Z1, Z2,
      plasticAxisY: { value: zx.offset, error: pnaErr(zx) },
      plasticAxisX: { value: zy.offset, error: pnaErr(zy) },
      plasticAxis1: { value: z1.offset - n1c, error: pnaErr(z1) + s.centroidX.error + s.centroidY.error + angErr * diag },
      plasticAxis2: { value: z2.offset - n2c, error: pnaErr(z2) + s.centroidX.error + s.centroidY.error + angErr * diag },
      S1, S2, fibre1: fib1, fibre2: fib2,
      shapeFactorX: ratio(Zx, minQ(s.SxTop, s.SxBottom)),
      shapeFactorY: ratio(Zy, minQ(s.SyRight, s.SyLeft)),
      shapeFactor1: ratio(Z1, S1),
      shapeFactor2: ratio(Z2, S2),
    },
  };
}
