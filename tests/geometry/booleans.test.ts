import { describe, it, expect } from 'vitest';
import { measureObj } from '../helpers.js';
import { partFromObject } from '../../src/io/partJson.js';
import { InputError } from '../../src/errors.js';

type M = { A: number; Sx: number; Sy: number; Ixx: number; Iyy: number; Ixy: number }; // raw moments about the origin
const sub = (a: M, b: M): M => ({ A: a.A - b.A, Sx: a.Sx - b.Sx, Sy: a.Sy - b.Sy, Ixx: a.Ixx - b.Ixx, Iyy: a.Iyy - b.Iyy, Ixy: a.Ixy - b.Ixy });
const add = (a: M, b: M): M => ({ A: a.A + b.A, Sx: a.Sx + b.Sx, Sy: a.Sy + b.Sy, Ixx: a.Ixx + b.Ixx, Iyy: a.Iyy + b.Iyy, Ixy: a.Ixy + b.Ixy });
/** Rectangle [x0, x0+w] × [y0, y0+h]: ∫y² = w((y0+h)³ − y0³)/3 etc. (calculus, common practice, no source). */
function rectM(x0: number, y0: number, w: number, h: number): M {
  const x1 = x0 + w, y1 = y0 + h;
  return { A: w * h, Sx: (w * (y1 ** 2 - y0 ** 2)) / 2, Sy: (h * (x1 ** 2 - x0 ** 2)) / 2, Ixx: (w * (y1 ** 3 - y0 ** 3)) / 3, Iyy: (h * (x1 ** 3 - x0 ** 3)) / 3, Ixy: ((x1 ** 2 - x0 ** 2) * (y1 ** 2 - y0 ** 2)) / 4 };
}
/**
 * Circular segment of a circle (centre (cx, cy), radius r) cut off by the line y = cy + h (the part above
 * it, |h| < r), as sector minus triangle with half-angle α = acos(h/r) about the vertical axis through the
 * centre (handbook closed forms, from memory): sector ∫v² dA = r⁴(α + sinα cosα)/4, ∫u² dA = r⁴(α − sinα cosα)/4,
 * ∫v dA = 2r³ sinα/3; triangle (centre, (±c, h)), c = r sinα: ∫v² = c h³/2, ∫u² = c³ h/6, ∫v = 2 c h²/3.
 * Then moved to the origin with the parallel-axis rules (∫(cy+v)² = ∫v² + 2cy∫v + cy² A).
 */
function segmentAbove(cx: number, cy: number, r: number, h: number): M {
  const al = Math.acos(h / r), s = Math.sin(al), c = Math.cos(al);
  const half = r * s;
  const A = r * r * al - half * h;
  const Sv = (2 * r ** 3 * s) / 3 - (2 * half * h * h) / 3;
  const Ivv = (r ** 4 * (al + s * c)) / 4 - (half * h ** 3) / 2;
  const Iuu = (r ** 4 * (al - s * c)) / 4 - (half ** 3 * h) / 6;
  return { A, Sx: cy * A + Sv, Sy: cx * A, Ixx: Ivv + 2 * cy * Sv + cy * cy * A, Iyy: Iuu + cx * cx * A, Ixy: cx * (Sv + cy * A) };
}
function central(m: M) {
  const xc = m.Sy / m.A, yc = m.Sx / m.A;
  return { area: m.A, centroidX: xc, centroidY: yc, Ix: m.Ixx - m.A * yc * yc, Iy: m.Iyy - m.A * xc * xc, Ixy: m.Ixy - m.A * xc * yc };
}
const KEYS = ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy'] as const;

function expectClose(r: ReturnType<typeof measureObj>, ref: ReturnType<typeof central>, size: number, label: string) {
  const iScale = Math.sqrt(Math.abs(ref.Ix * ref.Iy));
  const scales = { area: ref.area, centroidX: size, centroidY: size, Ix: iScale, Iy: iScale, Ixy: iScale };
  const rows: string[] = [];
  for (const k of KEYS) {
    const q = r.quantities[k];
    const err = Math.abs(q.value - ref[k]);
    rows.push(`${k} rel ${(err / scales[k]).toExponential(2)} est ${(q.error / scales[k]).toExponential(2)}`);
    expect(err / scales[k], `${label} ${k}`).toBeLessThanOrEqual(1e-12);
    expect(q.error, `${label} ${k}: estimate ≥ true error`).toBeGreaterThanOrEqual(err);
  }
  console.log(`${label}: ${rows.join('; ')}`);
}

describe('notch cut by a circle at the plate edge keeps the exact arc', () => {
  // plate 200 × 100 from the origin, circle of radius r centred below the top edge (y = 100) at depth d
  for (const [cx, r, d] of [[80, 15, 6], [80, 15, -4], [150.5, 22.25, 0.5], [45, 40, 13]]) {
    it(`circle r=${r} centred ${d} below the top edge at x=${cx}`, () => {
      const part = { units: 'mm', outline: { rectangle: { corner: [0, 0], size: [200, 100] } }, cutouts: [{ circle: { center: [cx, 100 - d], diameter: 2 * r } }] };
      const r0 = measureObj(part);
      // material removed = the circle minus its part above the top edge y = 100 (a line at h = d from the centre)
      const whole = segmentAbove(cx, 100 - d, r, -r); // h = −r: the whole circle
      const above = segmentAbove(cx, 100 - d, r, d); // part of the circle above y = 100
      const ref = central(sub(rectM(0, 0, 200, 100), sub(whole, above)));
      expectClose(r0, ref, 200, `notch r=${r} d=${d}`);
      const outer = r0.geometry.part.regions[0].outer;
      expect(outer.segments.filter((s) => s.kind === 'arc').length).toBeGreaterThanOrEqual(1);
      expect(r0.geometry.part.regions[0].holes.length).toBe(0);
    });
  }
});
