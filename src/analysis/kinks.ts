/**
 * Cutting a part along the straight kink and jump lines of an integrand (src/expr/smooth.ts `kinkLines`),
 * so that every piece has the integrand smooth and no triangle of the joined mesh straddles a kink.
 *
 * Each region is cut by each line in turn with the exact booleans (src/geometry/booleans.ts
 * `combineShapes`): the piece on one side is the region minus a large polygon covering the other side, so
 * the curves keep their exact form and the cut edges are exact straight segments. A line that misses the
 * material leaves the region whole. Any case the booleans refuse (a piece that falls apart, a sliver, a line
 * along an edge that the clipper cannot settle) and any loss of area beyond round-off gives null: the
 * caller then integrates the whole part and, unable to show that the integrand is smooth on every triangle,
 * says so ('unverified').
 */
import { combineShapes } from '../geometry/booleans.js';
import { type Loop, type Part, type Region, loopBox, loopSignedArea, normalizePart } from '../geometry/part.js';
import { polygonLoop } from '../geometry/shapes.js';
import { ops } from '../geometry/segments.js';
import type { KinkLine } from '../expr/smooth.js';

const regionArea = (r: Region) => Math.abs(loopSignedArea(r.outer)) - r.holes.reduce((s, h) => s + Math.abs(loopSignedArea(h)), 0);

/** The part's regions cut along every line, as one-region parts (same name and units), or null (see above). */
export function cutAlongLines(part: Part, lines: readonly KinkLine[]): Part[] | null {
  let pieces: Region[] = part.regions.slice();
  for (const line of lines) {
    const next: Region[] = [];
    for (const r of pieces) {
      const halves = cutRegion(r, line);
      if (halves === null) return null;
      next.push(...halves);
    }
    pieces = next;
  }
  return pieces.map((r) => normalizePart({ ...part, regions: [r] }));
}

const g = (l: KinkLine, x: number, y: number) => l.a * (x - l.x0) + l.b * (y - l.y0) + l.c;

/** Signs of the line's function on the region's boundary, sampled (ends and 32 points per curve). */
function sides(r: Region, l: KinkLine, tol: number): { neg: boolean; pos: boolean } {
  let neg = false, pos = false;
  const p: [number, number] = [0, 0];
  for (const loop of [r.outer, ...r.holes]) for (const s of loop.segments) {
    const o = ops(s);
    const n = o.straight ? 1 : 32;
    for (let i = 0; i <= n; i++) {
      o.point(s, i / n, p);
      const v = g(l, p[0], p[1]);
      if (v < -tol) neg = true; else if (v > tol) pos = true;
    }
  }
  return { neg, pos };
}

/** The polygon {g ≤ 0} ∩ (a box well beyond the region), or null when empty. */
function halfPlaneLoop(l: KinkLine, box: readonly number[], keepPositive: boolean): Loop | null {
  const m = Math.max(box[2] - box[0], box[3] - box[1]);
  const x0 = box[0] - m, y0 = box[1] - m, x1 = box[2] + m, y1 = box[3] + m;
  const sq: [number, number][] = [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
  // clip the square to the side to be removed (g < 0 when keeping the positive side)
  const sgn = keepPositive ? -1 : 1;
  const outPts: [number, number][] = [];
  for (let i = 0; i < 4; i++) {
    const a = sq[i], b = sq[(i + 1) % 4];
    const ga = sgn * g(l, a[0], a[1]), gb = sgn * g(l, b[0], b[1]);
    if (ga >= 0) outPts.push(a);
    if ((ga >= 0) !== (gb >= 0)) {
      const t = ga / (ga - gb);
      outPts.push([a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t]);
    }
  }
  // a line through a corner of the square gives that corner twice
  const pts = outPts.filter((q, i) => { const n = outPts[(i + 1) % outPts.length]; return q[0] !== n[0] || q[1] !== n[1]; });
  if (pts.length < 3) return null;
  return polygonLoop(pts, 'kink cut');
}

function cutRegion(r: Region, l: KinkLine): Region[] | null {
  const box = loopBox(r.outer);
  const size = Math.max(box[2] - box[0], box[3] - box[1]);
  const tol = 1e-9 * size * Math.hypot(l.a, l.b);
  const s = sides(r, l, tol);
  if (!s.neg || !s.pos) {
    // the boundary lies on one side (or on the line): cut only if the line may still cross a curve between
    // samples, which the booleans decide below; straight boundaries are decided here
    const curved = [r.outer, ...r.holes].some((lp) => lp.segments.some((seg) => !ops(seg).straight));
    if (!curved) return [r];
  }
  const area = regionArea(r);
  const out: Region[] = [];
  let refusals = 0;
  // holes whose box lies strictly on one side need no clipping: kept as they are on their side, dropped on the
  // other; only holes whose box meets the line go through the booleans (a 1,250-hole panel: 4 s → 0.1 s)
  const sideOf = (lp: Loop): number => {
    const b = loopBox(lp);
    let lo = Infinity, hi = -Infinity;
    for (const [x, y] of [[b[0], b[1]], [b[2], b[1]], [b[0], b[3]], [b[2], b[3]]]) {
      const v = g(l, x, y);
      lo = Math.min(lo, v); hi = Math.max(hi, v);
    }
    return lo > tol ? 1 : hi < -tol ? -1 : 0;
  };
  const holeSide = r.holes.map(sideOf);
  for (const keepPositive of [true, false]) {
    const cut = halfPlaneLoop(l, box, keepPositive);
    if (cut === null) { out.push(r); continue; }
    const keep = keepPositive ? 1 : -1;
    const crossing = r.holes.filter((_, i) => holeSide[i] === 0);
    const kept = r.holes.filter((_, i) => holeSide[i] === keep);
    try {
      const piece = combineShapes({ outline: r.outer, cutouts: [...crossing, cut] });
      out.push({ outer: piece.outer, holes: [...piece.holes, ...kept] });
    } catch {
      refusals++;
    }
  }
  if (refusals === 2) return !s.neg || !s.pos ? [r] : null;
  const sum = out.reduce((a, p) => a + regionArea(p), 0);
  // one side refused: acceptable only when the other side kept all the material (the line misses it)
  if (Math.abs(sum - area) > 1e-9 * area) return null;
  return out.filter((p) => regionArea(p) > 1e-12 * area);
}
