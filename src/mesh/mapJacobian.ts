/**
 * The curved map of src/mesh/mesh.ts with its full Jacobian matrix, for finite elements (gradients of
 * mapped basis functions need J⁻ᵀ, not only det J). Same map, same formulas as `TriangleMap.at`; kept in a
 * file of its own so the integration kernel's hot path stays as it is. `tests/mesh/mapJacobian.test.ts`
 * checks that point and determinant agree with `TriangleMap` to the last bits and that the matrix matches
 * finite differences of the map.
 *
 * Jacobian with respect to the reference coordinates (u, v) = (l1, l2):
 *   [xu xv]
 *   [yu yv],  det = xu·yv − xv·yu.
 */
import { type Segment, type SegmentOps, ops } from '../geometry/segments.js';
import type { MeshView } from './mesh.js';

export class TriangleMapJacobian {
  x0 = 0; y0 = 0; x1 = 0; y1 = 0; x2 = 0; y2 = 0;
  curved = false;
  private readonly seg: (Segment | null)[] = [null, null, null];
  private readonly segOps: (SegmentOps<Segment> | null)[] = [null, null, null];
  private readonly s0 = new Float64Array(3);
  private readonly s1 = new Float64Array(3);
  private readonly g0 = new Float64Array(6);
  private readonly g1 = new Float64Array(6);
  private readonly p: [number, number] = [0, 0];
  private readonly d: [number, number] = [0, 0];
  /** results of `at`: point, Jacobian matrix and determinant */
  x = 0; y = 0; xu = 0; xv = 0; yu = 0; yv = 0; jac = 0;

  load(m: MeshView, t: number): this {
    const tri = m.triangles, c = m.coords;
    const a = tri[3 * t], b = tri[3 * t + 1], d = tri[3 * t + 2];
    this.x0 = c[2 * a]; this.y0 = c[2 * a + 1];
    this.x1 = c[2 * b]; this.y1 = c[2 * b + 1];
    this.x2 = c[2 * d]; this.y2 = c[2 * d + 1];
    this.curved = false;
    for (let k = 0; k < 3; k++) {
      const rec = m.edgeCurve[3 * t + k];
      if (rec < 0) { this.seg[k] = null; this.segOps[k] = null; continue; }
      this.curved = true;
      const s = m.segments[m.curveSeg[rec]];
      this.seg[k] = s;
      this.s0[k] = m.curveS0[rec];
      this.s1[k] = m.curveS1[rec];
      const o = ops(s);
      this.segOps[k] = o;
      o.point(s, this.s0[k], this.p); this.g0[2 * k] = this.p[0]; this.g0[2 * k + 1] = this.p[1];
      o.point(s, this.s1[k], this.p); this.g1[2 * k] = this.p[0]; this.g1[2 * k + 1] = this.p[1];
    }
    return this;
  }

  /** Evaluate at barycentric (1 − l1 − l2, l1, l2): sets x, y, the Jacobian matrix and jac. */
  at(l1: number, l2: number): void {
    const l0 = 1 - l1 - l2;
    let x = l0 * this.x0 + l1 * this.x1 + l2 * this.x2;
    let y = l0 * this.y0 + l1 * this.y1 + l2 * this.y2;
    let xu = this.x1 - this.x0, yu = this.y1 - this.y0;
    let xv = this.x2 - this.x0, yv = this.y2 - this.y0;
    if (this.curved) {
      for (let k = 0; k < 3; k++) {
        const s = this.seg[k];
        if (s === null) continue;
        const la = k === 0 ? l0 : k === 1 ? l1 : l2;
        const lb = k === 0 ? l1 : k === 1 ? l2 : l0;
        const dau = k === 0 ? -1 : k === 1 ? 1 : 0, dav = k === 0 ? -1 : k === 1 ? 0 : 1;
        const dbu = k === 0 ? 1 : k === 1 ? 0 : -1, dbv = k === 0 ? 0 : k === 1 ? 1 : -1;
        const t = (1 + lb - la) / 2;
        const dtu = (dbu - dau) / 2, dtv = (dbv - dav) / 2;
        const s0 = this.s0[k], s1 = this.s1[k];
        this.segOps[k]!.evaluate(s, s0 + (s1 - s0) * t, this.p, this.d);
        const gx0 = this.g0[2 * k], gy0 = this.g0[2 * k + 1], gx1 = this.g1[2 * k], gy1 = this.g1[2 * k + 1];
        const nx = this.p[0] - ((1 - t) * gx0 + t * gx1);
        const ny = this.p[1] - ((1 - t) * gy0 + t * gy1);
        const dnx = this.d[0] * (s1 - s0) - (gx1 - gx0);
        const dny = this.d[1] * (s1 - s0) - (gy1 - gy0);
        const D = t * (1 - t), dD = 1 - 2 * t;
        const Sx = nx / D, Sy = ny / D;
        const dSx = (dnx * D - nx * dD) / (D * D), dSy = (dny * D - ny * dD) / (D * D);
        const ll = la * lb;
        x += ll * Sx; y += ll * Sy;
        const llu = dau * lb + la * dbu, llv = dav * lb + la * dbv;
        xu += llu * Sx + ll * dSx * dtu; yu += llu * Sy + ll * dSy * dtu;
        xv += llv * Sx + ll * dSx * dtv; yv += llv * Sy + ll * dSy * dtv;
      }
    }
    this.x = x; this.y = y;
    this.xu = xu; this.xv = xv; this.yu = yu; this.yv = yv;
    this.jac = xu * yv - xv * yu;
  }
}
