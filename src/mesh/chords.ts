/**
 * Boundary chords in flat typed arrays, a static grid over them, and the two chord-level preparations
 * of the mesher: separating curved chords from nearby boundary, and interior points that give each
 * curved chord a well-shaped triangle.
 */
import { type Segment, ops, segmentStart } from '../geometry/segments.js';

/** One boundary vertex: on segment `seg` at parameter `t`. */
export interface BVert { seg: number; t: number }

export interface Chords {
  n: number;
  x0: Float64Array; y0: Float64Array; x1: Float64Array; y1: Float64Array;
  /** deviation of the curve from the chord (0 for straight chords) */
  dev: Float64Array;
  loop: Int32Array;
  /** index of the chord's first vertex within its loop */
  index: Int32Array;
  loopSize: Int32Array;
}

export function collectChords(loops: BVert[][], segments: Segment[]): Chords {
  let n = 0;
  for (const v of loops) n += v.length;
  const c: Chords = {
    n,
    x0: new Float64Array(n), y0: new Float64Array(n), x1: new Float64Array(n), y1: new Float64Array(n),
    dev: new Float64Array(n), loop: new Int32Array(n), index: new Int32Array(n), loopSize: new Int32Array(loops.length),
  };
  const p: [number, number] = [0, 0];
  let k = 0;
  loops.forEach((verts, li) => {
    c.loopSize[li] = verts.length;
    const first = k;
    for (let i = 0; i < verts.length; i++, k++) {
      const v = verts[i];
      const s = segments[v.seg];
      const o = ops(s);
      if (v.t === 0) { const q = segmentStart(s); p[0] = q[0]; p[1] = q[1]; } else o.point(s, v.t, p);
      c.x0[k] = p[0]; c.y0[k] = p[1];
      if (!o.straight) {
        const w = verts[(i + 1) % verts.length];
        c.dev[k] = o.deviation(s, v.t, chordEnd(v, w));
      }
      c.loop[k] = li; c.index[k] = i;
    }
    for (let i = first; i < k; i++) {
      const j = i + 1 < k ? i + 1 : first;
      c.x1[i] = c.x0[j]; c.y1[i] = c.y0[j];
    }
  });
  return c;
}

/** Static uniform grid of chord boxes (compressed rows). */
class ChordGrid {
  private readonly start: Int32Array;
  private readonly items: Int32Array;
  private readonly nx: number; private readonly ny: number;
  private readonly ox: number; private readonly oy: number; private readonly size: number;
  private readonly chords: number;

  constructor(c: Chords, size: number) {
    let xMin = Infinity, yMin = Infinity, xMax = -Infinity, yMax = -Infinity;
    for (let i = 0; i < c.n; i++) {
      xMin = Math.min(xMin, c.x0[i]); xMax = Math.max(xMax, c.x0[i]);
      yMin = Math.min(yMin, c.y0[i]); yMax = Math.max(yMax, c.y0[i]);
    }
    // keep the grid to a sensible number of cells
    const span = Math.max(xMax - xMin, yMax - yMin, 1e-300);
    // and to the number of chords: a few very long chords among tiny ones otherwise cover millions of cells
    size = Math.max(size, span / Math.min(2048, 4 * Math.ceil(Math.sqrt(c.n))));
    this.size = size; this.ox = xMin; this.oy = yMin; this.chords = c.n;
    this.nx = Math.floor((xMax - xMin) / size) + 1;
    this.ny = Math.floor((yMax - yMin) / size) + 1;
    const count = new Int32Array(this.nx * this.ny + 1);
    const each = (i: number, fn: (cell: number) => void) => {
      const i0 = this.cx(Math.min(c.x0[i], c.x1[i])), i1 = this.cx(Math.max(c.x0[i], c.x1[i]));
      const j0 = this.cy(Math.min(c.y0[i], c.y1[i])), j1 = this.cy(Math.max(c.y0[i], c.y1[i]));
      for (let a = i0; a <= i1; a++) for (let b = j0; b <= j1; b++) fn(a * this.ny + b);
    };
    for (let i = 0; i < c.n; i++) each(i, (cell) => { count[cell + 1]++; });
    for (let k = 1; k < count.length; k++) count[k] += count[k - 1];
    this.start = count.slice();
    this.items = new Int32Array(count[count.length - 1]);
    const fill = count;
    for (let i = 0; i < c.n; i++) each(i, (cell) => { this.items[fill[cell]++] = i; });
  }

  private cx(x: number) { return Math.min(this.nx - 1, Math.max(0, Math.floor((x - this.ox) / this.size))); }
  private cy(y: number) { return Math.min(this.ny - 1, Math.max(0, Math.floor((y - this.oy) / this.size))); }

  /**
   * Visit chords whose cells overlap the box; stop early when fn returns true. A chord may repeat, and
   * chords outside the box may be visited (callers test the geometry themselves): a box that covers more
   * cells than there are chords visits every chord once instead of walking up to 2048² cells (a tiny
   * median chord and one long chord made the mesher spend seconds here).
   */
  some(x0: number, y0: number, x1: number, y1: number, fn: (i: number) => boolean): boolean {
    const i0 = this.cx(x0), i1 = this.cx(x1), j0 = this.cy(y0), j1 = this.cy(y1);
    if ((i1 - i0 + 1) * (j1 - j0 + 1) > this.chords) {
      for (let i = 0; i < this.chords; i++) if (fn(i)) return true;
      return false;
    }
    for (let a = i0; a <= i1; a++) for (let b = j0; b <= j1; b++) {
      const cell = a * this.ny + b;
      for (let k = this.start[cell]; k < this.start[cell + 1]; k++) if (fn(this.items[k])) return true;
    }
    return false;
  }
}

function medianCurvedLength(c: Chords): number {
  const lens: number[] = [];
  for (let i = 0; i < c.n; i++) if (c.dev[i] > 0) lens.push(Math.hypot(c.x1[i] - c.x0[i], c.y1[i] - c.y0[i]));
  if (lens.length === 0) return 0;
  lens.sort((a, b) => a - b);
  return lens[lens.length >> 1];
}

function adjacent(c: Chords, i: number, j: number): boolean {
  if (i === j) return true;
  if (c.loop[i] !== c.loop[j]) return false;
  const d = Math.abs(c.index[i] - c.index[j]);
  return d === 1 || d === c.loopSize[c.loop[i]] - 1;
}

export function pointSegDist(px: number, py: number, x0: number, y0: number, x1: number, y1: number): number {
  const dx = x1 - x0, dy = y1 - y0;
  const L2 = dx * dx + dy * dy;
  let t = L2 > 0 ? ((px - x0) * dx + (py - y0) * dy) / L2 : 0;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  return Math.hypot(px - x0 - t * dx, py - y0 - t * dy);
}

function cross(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): boolean {
  const o = (px: number, py: number, qx: number, qy: number, rx: number, ry: number) => (qx - px) * (ry - py) - (qy - py) * (rx - px);
  const d1 = o(ax, ay, bx, by, cx, cy), d2 = o(ax, ay, bx, by, dx, dy);
  const d3 = o(cx, cy, dx, dy, ax, ay), d4 = o(cx, cy, dx, dy, bx, by);
  return d1 * d2 <= 0 && d3 * d4 <= 0;
}

function chordDist(c: Chords, i: number, j: number): number {
  if (cross(c.x0[i], c.y0[i], c.x1[i], c.y1[i], c.x0[j], c.y0[j], c.x1[j], c.y1[j])) return 0;
  return Math.min(
    pointSegDist(c.x0[i], c.y0[i], c.x0[j], c.y0[j], c.x1[j], c.y1[j]),
    pointSegDist(c.x1[i], c.y1[i], c.x0[j], c.y0[j], c.x1[j], c.y1[j]),
    pointSegDist(c.x0[j], c.y0[j], c.x0[i], c.y0[i], c.x1[i], c.y1[i]),
    pointSegDist(c.x1[j], c.y1[j], c.x0[i], c.y0[i], c.x1[i], c.y1[i]));
}

/**
 * Chords (as loop, index) whose curve comes within 1.5 × its deviation of a non-adjacent chord: the region
 * between such a chord and its curve may hold other boundary, so the chord must be split.
 */
export function crowdedChords(c: Chords): [number, number][] {
  const size = medianCurvedLength(c);
  if (size === 0) return [];
  const grid = new ChordGrid(c, size);
  const mark = new Uint8Array(c.n);
  for (let i = 0; i < c.n; i++) {
    const dev = c.dev[i];
    if (dev === 0) continue;
    const g = 1.5 * dev;
    grid.some(Math.min(c.x0[i], c.x1[i]) - g, Math.min(c.y0[i], c.y1[i]) - g, Math.max(c.x0[i], c.x1[i]) + g, Math.max(c.y0[i], c.y1[i]) + g, (j) => {
      if (adjacent(c, i, j) || c.dev[j] > dev) return false; // the larger-bulge chord makes the test
      if (chordDist(c, i, j) <= g) { mark[i] = 1; return true; }
      return false;
    });
  }
  const out: [number, number][] = [];
  for (let i = 0; i < c.n; i++) if (mark[i]) out.push([c.loop[i], c.index[i]]);
  return out;
}

/**
 * Interior points that give each curved chord a well-shaped triangle: the apex of a near-equilateral
 * triangle on the material side (left of the chord: outer loops run counter-clockwise, holes clockwise),
 * kept only where it is clear of every boundary chord and of the points already kept.
 */
export function interiorPoints(c: Chords): Float64Array {
  const size = medianCurvedLength(c);
  if (size === 0) return new Float64Array(0);
  const grid = new ChordGrid(c, size);
  const out = new Float64Array(2 * c.n);
  const keptH = new Float64Array(c.n);
  let kept = 0;
  // kept points hashed by cell (linked lists)
  const heads = new Map<number, number>();
  const next = new Int32Array(c.n);
  const cellKey = (x: number, y: number) => Math.floor(x / size) * 4194304 + Math.floor(y / size);
  for (let i = 0; i < c.n; i++) {
    if (c.dev[i] === 0) continue;
    const dx = c.x1[i] - c.x0[i], dy = c.y1[i] - c.y0[i];
    const L = Math.hypot(dx, dy);
    const h = 0.8 * L;
    const mx = (c.x0[i] + c.x1[i]) / 2, my = (c.y0[i] + c.y1[i]) / 2;
    const qx = mx - dy / L * h, qy = my + dx / L * h;
    const clear = 0.7 * h;
    const blocked = grid.some(qx - clear, qy - clear, qx + clear, qy + clear, (j) => {
      if (pointSegDist(qx, qy, c.x0[j], c.y0[j], c.x1[j], c.y1[j]) < clear) return true;
      // the stem from the chord's midpoint to the point must cross no other chord
      return j !== i && cross(mx, my, qx, qy, c.x0[j], c.y0[j], c.x1[j], c.y1[j]);
    });
    if (blocked) continue;
    let near = false;
    const ci = Math.floor(qx / size), cj = Math.floor(qy / size);
    const reach = Math.ceil(clear / size);
    if ((2 * reach + 1) ** 2 > kept) {
      // fewer kept points than cells to look in: check them all
      for (let k = 0; k < kept && !near; k++) if (Math.hypot(out[2 * k] - qx, out[2 * k + 1] - qy) < 0.6 * Math.min(h, keptH[k])) near = true;
    } else for (let a = ci - reach; a <= ci + reach && !near; a++) for (let b = cj - reach; b <= cj + reach && !near; b++) {
      for (let k = heads.get(a * 4194304 + b) ?? -1; k >= 0; k = next[k]) {
        if (Math.hypot(out[2 * k] - qx, out[2 * k + 1] - qy) < 0.6 * Math.min(h, keptH[k])) { near = true; break; }
      }
    }
    if (near) continue;
    out[2 * kept] = qx; out[2 * kept + 1] = qy; keptH[kept] = h;
    const key = cellKey(qx, qy);
    next[kept] = heads.get(key) ?? -1;
    heads.set(key, kept);
    kept++;
  }
  return out.slice(0, 2 * kept);
}

/**
 * Parameter at which the chord from vertex a to the next vertex b ends on a's segment: b's parameter when
 * b lies further along the same segment, else the segment's end (1) — also when a loop of a single
 * segment wraps round to its own start.
 */
export function chordEnd(a: BVert, b: BVert): number {
  return b.seg === a.seg && b.t > a.t ? b.t : 1;
}
