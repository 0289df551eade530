/**
 * A mesh only where the integrand matters: for an integrand that interval arithmetic shows negligible over
 * most of a part (a load patch, a bump), the part is cut down to a box around where it is not, and only that
 * piece is meshed; everything outside the box is bounded, not integrated.
 *
 * The part's box is covered by a grid of GRID cells along its longer side. On each cell interval arithmetic
 * (src/expr/smooth.ts `rangeOnBox`, outward rounded) bounds |f|; a cell's bound times its area bounds the
 * integral of |f| over the part's share of the cell. The cells whose bound exceeds the negligible share
 * (`negligibleBound` of src/analysis/adaptive.ts: ROUNDOFF·S/n, S the sum of the n cells' bounds) are kept,
 * with one cell more all round; the part is cut along the four sides of their box (src/analysis/kinks.ts
 * `cutAlongLines`: exact booleans, curves kept; regions and holes clear of the box are left out first, since
 * they do not change part ∩ box) and the pieces inside are integrated. What lies outside is at most the sum
 * of the other cells' bounds, per component (with |x − ox| and |y − oy| at their largest on each cell for the
 * first moments about the mesh origin): that sum goes into the estimate, and the caller falls back to the
 * whole part when it would take more than a tenth of the tolerance.
 *
 * Not used when a cell cannot be bounded (the integrand undefined or unbounded there: the whole part is then
 * meshed as before, so a pole is still found and named), when the box would cover more than a quarter of the
 * part's box, or when the cut fails.
 */
import type { ExprNode } from '../expr/index.js';
import { rangeOnBox } from '../expr/smooth.js';
import { type Part, type Region, loopBox, normalizePart, partBox } from '../geometry/part.js';
import { cutAlongLines } from './kinks.js';
import { negligibleBound } from './adaptive.js';

/** Cells along the part box's longer side. */
export const GRID = 64;
/** The box kept may cover at most this share of the part's box, or the whole part is meshed. */
const MAX_SHARE = 0.25;

export interface LocalPiece {
  /** The part cut down to `box` (its regions inside the box). */
  part: Part;
  box: [number, number, number, number];
  /**
   * Bounds of |∫ f|, |∫ f·(x − ox)|, |∫ f·(y − oy)| over the part outside the box, about the origin (ox, oy).
   */
  outside(ox: number, oy: number): [number, number, number];
}

/** The piece of the part where the integrand `tree` is not negligible, or null (see the file comment). */
export function localPiece(part: Part, tree: ExprNode): LocalPiece | null {
  const [X0, Y0, X1, Y1] = partBox(part);
  const W = X1 - X0, H = Y1 - Y0;
  if (!(W > 0 && H > 0)) return null;
  const h = Math.max(W, H) / GRID;
  const nx = Math.max(1, Math.ceil(W / h)), ny = Math.max(1, Math.ceil(H / h));
  const hx = W / nx, hy = H / ny;
  const cellBox = (i: number, j: number): [number, number, number, number] => [
    X0 + i * hx, Y0 + j * hy, i === nx - 1 ? X1 : X0 + (i + 1) * hx, j === ny - 1 ? Y1 : Y0 + (j + 1) * hy,
  ];
  const bound = new Float64Array(nx * ny);
  let total = 0;
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) {
    const b = cellBox(i, j);
    const r = rangeOnBox(tree, b);
    if (r === null) return null;
    const v = Math.max(Math.abs(r[0]), Math.abs(r[1])) * (b[2] - b[0]) * (b[3] - b[1]) * (1 + 1e-12);
    if (!Number.isFinite(v)) return null;
    bound[j * nx + i] = v;
    total += v;
  }
  if (total === 0) return null;
  const tau = negligibleBound(total, nx * ny);
  let i0 = nx, i1 = -1, j0 = ny, j1 = -1;
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) {
    if (bound[j * nx + i] <= tau) continue;
    if (i < i0) i0 = i; if (i > i1) i1 = i; if (j < j0) j0 = j; if (j > j1) j1 = j;
  }
  if (i1 < 0) return null;
  i0 = Math.max(0, i0 - 1); j0 = Math.max(0, j0 - 1); i1 = Math.min(nx - 1, i1 + 1); j1 = Math.min(ny - 1, j1 + 1);
  if ((i1 - i0 + 1) * (j1 - j0 + 1) > MAX_SHARE * nx * ny) return null;
  const box: [number, number, number, number] = [cellBox(i0, j0)[0], cellBox(i0, j0)[1], cellBox(i1, j1)[2], cellBox(i1, j1)[3]];
  // the four sides of the box that lie inside the part's box, as lines g = a(x − x0) + b(y − y0) + c = 0
  const lines = [];
  if (i0 > 0) lines.push({ a: 1, b: 0, c: 0, x0: box[0], y0: 0 });
  if (i1 < nx - 1) lines.push({ a: 1, b: 0, c: 0, x0: box[2], y0: 0 });
  if (j0 > 0) lines.push({ a: 0, b: 1, c: 0, x0: 0, y0: box[1] });
  if (j1 < ny - 1) lines.push({ a: 0, b: 1, c: 0, x0: 0, y0: box[3] });
  // only what meets the box matters for part ∩ box: regions and holes clear of it are left out of the cut
  const meets = (b: readonly number[]) => b[0] <= box[2] && b[2] >= box[0] && b[1] <= box[3] && b[3] >= box[1];
  const near: Region[] = [];
  for (const r of part.regions) if (meets(loopBox(r.outer))) near.push({ ...r, holes: r.holes.filter((h) => meets(loopBox(h))) });
  if (near.length === 0) return null;
  let pieces: Part[] | null;
  try {
    pieces = cutAlongLines(normalizePart({ ...part, regions: near }), lines);
  } catch {
    return null; // the booleans refused this cut: mesh the whole part
  }
  if (pieces === null) return null;
  const mx = (box[0] + box[2]) / 2, my = (box[1] + box[3]) / 2, rx = (box[2] - box[0]) / 2, ry = (box[3] - box[1]) / 2;
  const inside = pieces.filter((p) => {
    const b = partBox(p);
    const cx = (b[0] + b[2]) / 2, cy = (b[1] + b[3]) / 2;
    return Math.abs(cx - mx) <= rx && Math.abs(cy - my) <= ry;
  });
  if (inside.length === 0) return null;
  const kept = normalizePart({ ...part, regions: inside.flatMap((p) => p.regions) });
  return {
    part: kept,
    box,
    outside(ox, oy) {
      let s0 = 0, s1 = 0, s2 = 0;
      for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) {
        if (i >= i0 && i <= i1 && j >= j0 && j <= j1) continue;
        const b = cellBox(i, j), v = bound[j * nx + i];
        s0 += v;
        s1 += v * Math.max(Math.abs(b[0] - ox), Math.abs(b[2] - ox));
        s2 += v * Math.max(Math.abs(b[1] - oy), Math.abs(b[3] - oy));
      }
      const m = 1 + 1e-12;
      return [s0 * m, s1 * m, s2 * m];
    },
  };
}
