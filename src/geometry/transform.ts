/**
 * Affine maps of segments, for SVG `transform` attributes and the SVG viewport mapping.
 * A map m = [a, b, c, d, e, f] sends (x, y) to (a x + c y + e, b x + d y + f), the SVG matrix order
 * (SVG 1.1, section 7.4 "The 'transform' attribute").
 */
import type { EllipticalArcSegment } from './curves.js';
import type { Segment } from './segments.js';

export type Affine = [a: number, b: number, c: number, d: number, e: number, f: number];

export const IDENTITY: Affine = [1, 0, 0, 1, 0, 0];

/** The map "first n, then m" (matrix product m·n). */
export function composeAffine(m: Affine, n: Affine): Affine {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

export function applyAffine(m: Affine, x: number, y: number): [number, number] {
  return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
}

function isIdentity(m: Affine): boolean {
  return m[0] === 1 && m[1] === 0 && m[2] === 0 && m[3] === 1 && m[4] === 0 && m[5] === 0;
}

/**
 * Image of an elliptical arc c + A(cos θ, sin θ), A = R(phi)·diag(rx, ry), under m: the new matrix M·A is
 * split as R(phi')·diag(sx, sy)·R(w) (closed-form 2×2 singular value decomposition). When sy < 0 the
 * right factor is a reflection, which reverses the parameter: θ' = −θ − w; otherwise θ' = θ + w.
 */
function transformEllipse(s: EllipticalArcSegment, m: Affine): EllipticalArcSegment {
  const cp = Math.cos(s.phi), sp = Math.sin(s.phi);
  // A = R(phi) diag(rx, ry), columns (rx cp, rx sp) and (−ry sp, ry cp)
  const a00 = s.rx * cp, a10 = s.rx * sp, a01 = -s.ry * sp, a11 = s.ry * cp;
  const m00 = m[0] * a00 + m[2] * a10, m10 = m[1] * a00 + m[3] * a10;
  const m01 = m[0] * a01 + m[2] * a11, m11 = m[1] * a01 + m[3] * a11;
  const E = (m00 + m11) / 2, F = (m00 - m11) / 2, G = (m10 + m01) / 2, H = (m10 - m01) / 2;
  const Q = Math.hypot(E, H), R = Math.hypot(F, G);
  const sx = Q + R, sy = Q - R;
  const a1 = Math.atan2(G, F), a2 = Math.atan2(H, E);
  const w = (a2 - a1) / 2, phi = (a2 + a1) / 2;
  const [cx, cy] = applyAffine(m, s.cx, s.cy);
  if (sy >= 0) return { kind: 'ellipticalArc', cx, cy, rx: sx, ry: sy, phi, t0: s.t0 + w, t1: s.t1 + w };
  return { kind: 'ellipticalArc', cx, cy, rx: sx, ry: -sy, phi, t0: -s.t0 - w, t1: -s.t1 - w };
}

/**
 * Image of a segment under an affine map. Lines stay lines, Béziers stay Béziers (control points map),
 * a circular arc stays an `arc` under a similarity (rotation, uniform scale, reflection, translation)
 * and becomes an `ellipticalArc` otherwise; elliptical arcs stay elliptical arcs. The traversal
 * direction follows the points, so a reflection reverses the sense of rotation as it should.
 */
export function transformSegment(seg: Segment, m: Affine): Segment {
  if (isIdentity(m)) return seg;
  const P = (x: number, y: number) => applyAffine(m, x, y);
  switch (seg.kind) {
    case 'line': {
      const [x0, y0] = P(seg.x0, seg.y0), [x1, y1] = P(seg.x1, seg.y1);
      return { kind: 'line', x0, y0, x1, y1 };
    }
    case 'quadratic': {
      const [x0, y0] = P(seg.x0, seg.y0), [x1, y1] = P(seg.x1, seg.y1), [x2, y2] = P(seg.x2, seg.y2);
      return { kind: 'quadratic', x0, y0, x1, y1, x2, y2 };
    }
    case 'cubic': {
      const [x0, y0] = P(seg.x0, seg.y0), [x1, y1] = P(seg.x1, seg.y1);
      const [x2, y2] = P(seg.x2, seg.y2), [x3, y3] = P(seg.x3, seg.y3);
      return { kind: 'cubic', x0, y0, x1, y1, x2, y2, x3, y3 };
    }
    case 'arc': {
      const [a, b, c, d] = m;
      const scale = Math.max(Math.abs(a), Math.abs(b), Math.abs(c), Math.abs(d));
      const tol = 1e-14 * scale;
      const [cx, cy] = P(seg.cx, seg.cy);
      if (Math.abs(a - d) <= tol && Math.abs(b + c) <= tol) {
        // rotation by psi and uniform scale: angle α goes to α + psi
        const psi = Math.atan2(b, a);
        return { kind: 'arc', cx, cy, r: seg.r * Math.hypot(a, b), a0: seg.a0 + psi, a1: seg.a1 + psi };
      }
      if (Math.abs(a + d) <= tol && Math.abs(b - c) <= tol) {
        // reflection across the line at angle psi/2, with uniform scale: angle α goes to psi − α
        const psi = Math.atan2(b, a);
        return { kind: 'arc', cx, cy, r: seg.r * Math.hypot(a, b), a0: psi - seg.a0, a1: psi - seg.a1 };
      }
      return transformEllipse({ kind: 'ellipticalArc', cx: seg.cx, cy: seg.cy, rx: seg.r, ry: seg.r, phi: 0, t0: seg.a0, t1: seg.a1 }, m);
    }
    case 'ellipticalArc':
      return transformEllipse(seg, m);
  }
}
