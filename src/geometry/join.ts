/**
 * Joining loose pieces (chains of exact segments, such as DXF LINE and ARC entities) into contours.
 *
 * - Pieces are joined only with pieces of the same layer, end to end, when the ends lie within the
 *   tolerance. Curves are never moved: at a joint, a straight line's end point is snapped onto the curve's
 *   end; where two curves meet with a gap (within the tolerance) a tiny connecting line is inserted and
 *   the joint is recorded as a bridged gap. Line snaps larger than round-off are recorded too, so no gap is
 *   ever bridged silently.
 * - Ends farther apart than the tolerance but within NEAR_MISS_FACTOR × tolerance are reported as open
 *   gaps (they look like intended joints). Ends with no partner are dangling. Three or more ends at one
 *   point are a branch. Pieces that trace the same geometry as another piece are duplicates (the later one
 *   is dropped from joining); segments that retrace part of another segment (collinear lines, concentric
 *   equal arcs) are overlaps. All of these are data (kind, location, piece indices); words are chosen by
 *   the output layer.
 * - No quadratic step: end points go into a uniform grid of cell NEAR_MISS_FACTOR × tolerance, hashed into
 *   a counting-sorted table (the economy of boxgrid.ts); overlaps use boxgrid's overlappingPairs.
 *
 * Default tolerance (defaultJoinTolerance): max(1e-9 × drawing size, 64 ε × largest |coordinate|).
 * The first term accepts coordinates written with about ten significant digits relative to the drawing;
 * the second covers the round-off of end points the readers compute (cos/sin of arc angles, bulge centres,
 * block transforms: each a few ulps of the coordinates' magnitude) at site coordinates far from the origin.
 */
import { exactOverlap } from './kinds/index.js';
import { overlappingPairs } from './boxgrid.js';
import { type Segment, ops, segmentEnd, segmentPoint, segmentStart } from './segments.js';

export interface JoinPiece {
  /** A chain of exact segments, each starting where the previous one ends. */
  segments: Segment[];
  layer?: string;
  /** Entity handles (or ids) the piece came from. */
  sources?: string[];
  where: string;
  /** The source entity is closed by definition (circle, closed polyline, full ellipse). */
  closed?: boolean;
}

export interface JoinedContour {
  segments: Segment[];
  closed: boolean;
  /** Indices of the pieces, in chain order. */
  pieces: number[];
}

export type JoinIssue =
  /** Ends within the tolerance joined by a connecting line (curve to curve) or a line snap above round-off. */
  | { kind: 'gap-bridged'; x: number; y: number; gap: number; pieces: [number, number] }
  /** Ends farther apart than the tolerance but closer than NEAR_MISS_FACTOR × tolerance: not joined. */
  | { kind: 'gap-open'; x: number; y: number; gap: number; pieces: [number, number] }
  /** An end with no partner. */
  | { kind: 'dangling'; x: number; y: number; piece: number }
  /** More than two ends within the tolerance of one point (joined closest first). */
  | { kind: 'branch'; x: number; y: number; pieces: number[] }
  /** Piece `pieces[1]` traces the same geometry as `pieces[0]`; it was left out of joining. */
  | { kind: 'duplicate'; x: number; y: number; pieces: [number, number] }
  /** Two segments cover the same stretch for `length` (collinear lines, concentric equal arcs). */
  | { kind: 'overlap'; x: number; y: number; length: number; pieces: [number, number] };

export interface JoinResult {
  tolerance: number;
  contours: JoinedContour[];
  issues: JoinIssue[];
  /** Indices of pieces dropped as duplicates. */
  dropped: number[];
}

/** Open gaps are reported for ends closer than this many tolerances. */
export const NEAR_MISS_FACTOR = 100;

const EPS = Number.EPSILON;

export function defaultJoinTolerance(pieces: readonly JoinPiece[]): number {
  let xMin = Infinity, yMin = Infinity, xMax = -Infinity, yMax = -Infinity;
  for (const p of pieces) {
    for (const s of p.segments) {
      const b = ops(s).bbox(s);
      if (b[0] < xMin) xMin = b[0];
      if (b[1] < yMin) yMin = b[1];
      if (b[2] > xMax) xMax = b[2];
      if (b[3] > yMax) yMax = b[3];
    }
  }
  if (!(xMax >= xMin)) return 1e-12;
  const size = Math.max(xMax - xMin, yMax - yMin);
  const big = Math.max(Math.abs(xMin), Math.abs(xMax), Math.abs(yMin), Math.abs(yMax));
  return Math.max(1e-9 * size, 64 * EPS * big, 1e-300);
}

function roundoffOf(x: number, y: number): number {
  return 64 * EPS * Math.max(Math.abs(x), Math.abs(y), 1e-300);
}

export function joinPieces(pieces: readonly JoinPiece[], tolerance?: number): JoinResult {
  const tol = tolerance ?? defaultJoinTolerance(pieces);
  if (!(tol >= 0) || !Number.isFinite(tol)) throw new RangeError(`join tolerance must be a finite number ≥ 0, got ${tol}`);
  const n = pieces.length;
  const issues: JoinIssue[] = [];
  const contours: JoinedContour[] = [];
  const ex = new Float64Array(2 * n), ey = new Float64Array(2 * n);
  const isOpen = new Uint8Array(n);
  const layerId = new Int32Array(n);
  const layerIds = new Map<string, number>();
  for (let i = 0; i < n; i++) {
    const p = pieces[i];
    const key = p.layer ?? '\u0000';
    let id = layerIds.get(key);
    if (id === undefined) { id = layerIds.size; layerIds.set(key, id); }
    layerId[i] = id;
    if (p.segments.length === 0) continue;
    const a = segmentStart(p.segments[0]), b = segmentEnd(p.segments[p.segments.length - 1]);
    ex[2 * i] = a[0]; ey[2 * i] = a[1]; ex[2 * i + 1] = b[0]; ey[2 * i + 1] = b[1];
    const d = Math.hypot(b[0] - a[0], b[1] - a[1]);
    isOpen[i] = p.closed || d <= tol ? 0 : 1;
  }

  // ---- candidate end pairs within the near-miss radius, through a hashed uniform grid
  const R = Math.max(NEAR_MISS_FACTOR * tol, 1e-300);
  const cellX = new Float64Array(2 * n), cellY = new Float64Array(2 * n);
  let nEnds = 0;
  for (let i = 0; i < n; i++) if (isOpen[i]) nEnds += 2;
  let size = 1;
  while (size < 2 * nEnds) size <<= 1;
  const mask = size - 1;
  const hash = (cx: number, cy: number) => ((Math.imul(cx | 0, 0x9e3779b1) ^ Math.imul(cy | 0, 0x85ebca77)) >>> 0) & mask;
  const start = new Int32Array(size + 1);
  for (let e = 0; e < 2 * n; e++) {
    if (!isOpen[e >> 1]) continue;
    cellX[e] = Math.floor(ex[e] / R); cellY[e] = Math.floor(ey[e] / R);
    start[hash(cellX[e], cellY[e]) + 1]++;
  }
  for (let k = 1; k <= size; k++) start[k] += start[k - 1];
  const items = new Int32Array(nEnds);
  const fill = start.slice(0, size);
  for (let e = 0; e < 2 * n; e++) if (isOpen[e >> 1]) items[fill[hash(cellX[e], cellY[e])]++] = e;
  const pa: number[] = [], pb: number[] = [], pd: number[] = [];
  for (let e = 0; e < 2 * n; e++) {
    if (!isOpen[e >> 1]) continue;
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const qx = cellX[e] + dx, qy = cellY[e] + dy;
        const h = hash(qx, qy);
        for (let k = start[h]; k < start[h + 1]; k++) {
          const f = items[k];
          if (f <= e || cellX[f] !== qx || cellY[f] !== qy) continue;
          if (layerId[f >> 1] !== layerId[e >> 1]) continue;
          const d = Math.hypot(ex[f] - ex[e], ey[f] - ey[e]);
          if (d <= R) { pa.push(e); pb.push(f); pd.push(d); }
        }
      }
    }
  }
  const order = Array.from(pd.keys()).sort((a, b) => pd[a] - pd[b]);

  // ---- duplicates among open pieces
  const dropped = new Uint8Array(n);
  const droppedList: number[] = [];
  for (const k of order) {
    if (pd[k] > tol) break;
    const e = pa[k], f = pb[k];
    const i = e >> 1, j = f >> 1;
    if (i === j || dropped[i] || dropped[j]) continue;
    const eo = e ^ 1, fo = f ^ 1;
    if (Math.hypot(ex[eo] - ex[fo], ey[eo] - ey[fo]) > tol) continue;
    const reversed = (e & 1) !== (f & 1);
    if (!sameGeometry(pieces[i].segments, pieces[j].segments, reversed, tol)) continue;
    const keep = Math.min(i, j), drop = Math.max(i, j);
    dropped[drop] = 1; droppedList.push(drop);
    const m = segmentPoint(pieces[keep].segments[0], 0.5);
    issues.push({ kind: 'duplicate', x: m[0], y: m[1], pieces: [keep, drop] });
  }

  // ---- matching: closest first
  const partner = new Int32Array(2 * n).fill(-1);
  const branchReported = new Uint8Array(2 * n);
  for (const k of order) {
    if (pd[k] > tol) break;
    const e = pa[k], f = pb[k];
    if (dropped[e >> 1] || dropped[f >> 1]) continue;
    if (partner[e] < 0 && partner[f] < 0) { partner[e] = f; partner[f] = e; continue; }
    // a third end at a joint
    const at = partner[e] >= 0 ? e : f;
    if (!branchReported[at]) {
      branchReported[at] = 1;
      const other = partner[at];
      const ps = [at >> 1, other >> 1, (at === e ? f : e) >> 1];
      issues.push({ kind: 'branch', x: ex[at], y: ey[at], pieces: ps });
    }
  }
  // near misses between ends that stayed unmatched
  const nearReported = new Uint8Array(2 * n);
  for (const k of order) {
    if (pd[k] <= tol) continue;
    const e = pa[k], f = pb[k];
    if (dropped[e >> 1] || dropped[f >> 1] || partner[e] >= 0 || partner[f] >= 0) continue;
    if (nearReported[e] || nearReported[f]) continue;
    nearReported[e] = nearReported[f] = 1;
    issues.push({ kind: 'gap-open', x: (ex[e] + ex[f]) / 2, y: (ey[e] + ey[f]) / 2, gap: pd[k], pieces: [e >> 1, f >> 1] });
  }

  // ---- chains
  const visited = new Uint8Array(n);
  const walk = (first: number, entry: number, cyclic: boolean): void => {
    const segs: Segment[] = [];
    const order: number[] = [];
    let c = first, ein = entry;
    let prevPiece = -1;
    for (;;) {
      visited[c] = 1;
      order.push(c);
      const src = pieces[c].segments;
      const rev = (ein & 1) === 1;
      const add: Segment[] = rev ? src.map((s) => ops(s).reverse(s)).reverse() : src.slice();
      appendChain(segs, add, tol, issues, prevPiece, c);
      prevPiece = c;
      const eout = ein ^ 1;
      const nx = partner[eout];
      if (nx < 0) break;
      if (cyclic && (nx >> 1) === first) {
        closeChain(segs, tol, issues, c, first);
        break;
      }
      c = nx >> 1; ein = nx;
      if (visited[c]) break; // cannot happen with a consistent matching
    }
    contours.push({ segments: segs, closed: cyclic, pieces: order });
  };
  for (let i = 0; i < n; i++) {
    if (dropped[i] || pieces[i].segments.length === 0) continue;
    if (!isOpen[i]) {
      visited[i] = 1;
      const segs: Segment[] = [];
      appendChain(segs, pieces[i].segments.slice(), tol, issues, -1, i);
      closeChain(segs, tol, issues, i, i);
      contours.push({ segments: segs, closed: true, pieces: [i] });
    }
  }
  for (let i = 0; i < n; i++) {
    if (visited[i] || dropped[i] || !isOpen[i]) continue;
    let entry = -1;
    if (partner[2 * i] < 0) entry = 2 * i;
    else if (partner[2 * i + 1] < 0) entry = 2 * i + 1;
    if (entry < 0) continue;
    issues.push({ kind: 'dangling', x: ex[entry], y: ey[entry], piece: i });
    const before = contours.length;
    walk(i, entry, false);
    const last = contours[before].pieces[contours[before].pieces.length - 1];
    // the far end of the chain
    const c = contours[before];
    const endPt = segmentEnd(c.segments[c.segments.length - 1]);
    issues.push({ kind: 'dangling', x: endPt[0], y: endPt[1], piece: last });
  }
  for (let i = 0; i < n; i++) {
    if (visited[i] || dropped[i] || !isOpen[i]) continue;
    walk(i, 2 * i, true);
  }

  // ---- overlaps (retraced stretches)
  findOverlaps(pieces, dropped, layerId, tol, issues);

  return { tolerance: tol, contours, issues, dropped: droppedList };
}

/** Append `add` to `segs`, closing the joint between them (and inside `add`) by the rules above. */
function appendChain(segs: Segment[], add: Segment[], tol: number, issues: JoinIssue[], prevPiece: number, piece: number): void {
  for (let k = 0; k < add.length; k++) {
    if (segs.length === 0) { segs.push(add[k]); continue; }
    joint(segs, add[k], tol, issues, k === 0 ? prevPiece : piece, piece);
  }
}

function closeChain(segs: Segment[], tol: number, issues: JoinIssue[], lastPiece: number, firstPiece: number): void {
  if (segs.length === 0) return;
  const first = segs[0];
  const a = segmentEnd(segs[segs.length - 1]), b = segmentStart(first);
  const d = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (d === 0) return;
  const last = segs[segs.length - 1];
  const ro = roundoffOf(a[0], a[1]);
  // straight ends move to meet (curves never move): the kinds say which can (moveEnd/moveStart)
  const movedEnd = segs.length > 1 ? ops(last).moveEnd(last, b[0], b[1]) : null;
  const movedStart = movedEnd === null && segs.length > 1 ? ops(first).moveStart(first, a[0], a[1]) : null;
  if (movedEnd) {
    segs[segs.length - 1] = movedEnd;
  } else if (movedStart) {
    segs[0] = movedStart;
  } else {
    if (d <= ro) return; // curve ends agree to round-off: nothing to bridge
    segs.push({ kind: 'line', x0: a[0], y0: a[1], x1: b[0], y1: b[1] });
    issues.push({ kind: 'gap-bridged', x: (a[0] + b[0]) / 2, y: (a[1] + b[1]) / 2, gap: d, pieces: [lastPiece, firstPiece] });
    return;
  }
  if (d > ro) issues.push({ kind: 'gap-bridged', x: (a[0] + b[0]) / 2, y: (a[1] + b[1]) / 2, gap: d, pieces: [lastPiece, firstPiece] });
  void tol;
}

function joint(segs: Segment[], next: Segment, tol: number, issues: JoinIssue[], prevPiece: number, piece: number): void {
  const last = segs[segs.length - 1];
  const a = segmentEnd(last), b = segmentStart(next);
  const d = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (d === 0) { segs.push(next); return; }
  const ro = roundoffOf(a[0], a[1]);
  const movedEnd = ops(last).moveEnd(last, b[0], b[1]);
  const movedStart = movedEnd === null ? ops(next).moveStart(next, a[0], a[1]) : null;
  if (movedEnd) {
    segs[segs.length - 1] = movedEnd;
    segs.push(next);
  } else if (movedStart) {
    segs.push(movedStart);
  } else {
    if (d <= ro) { segs.push(next); return; } // curve ends agree to round-off
    segs.push({ kind: 'line', x0: a[0], y0: a[1], x1: b[0], y1: b[1] }, next);
    issues.push({ kind: 'gap-bridged', x: (a[0] + b[0]) / 2, y: (a[1] + b[1]) / 2, gap: d, pieces: [prevPiece, piece] });
    void tol;
    return;
  }
  if (d > ro) issues.push({ kind: 'gap-bridged', x: (a[0] + b[0]) / 2, y: (a[1] + b[1]) / 2, gap: d, pieces: [prevPiece, piece] });
}

const PROBES = [0, 0.25, 0.5, 0.75, 1];

function sameGeometry(a: Segment[], b: Segment[], reversed: boolean, tol: number): boolean {
  if (a.length !== b.length) return false;
  const m = a.length;
  const p: [number, number] = [0, 0], q: [number, number] = [0, 0];
  for (let k = 0; k < m; k++) {
    const sa = a[k], sb = reversed ? b[m - 1 - k] : b[k];
    for (const t of PROBES) {
      ops(sa).point(sa, t, p);
      ops(sb).point(sb, reversed ? 1 - t : t, q);
      if (Math.hypot(p[0] - q[0], p[1] - q[1]) > tol) return false;
    }
  }
  return true;
}

function findOverlaps(pieces: readonly JoinPiece[], dropped: Uint8Array, layerId: Int32Array, tol: number, issues: JoinIssue[]): void {
  const segPiece: number[] = [], segIndex: number[] = [];
  for (let i = 0; i < pieces.length; i++) {
    if (dropped[i]) continue;
    const s = pieces[i].segments;
    for (let k = 0; k < s.length; k++) if (ops(s[k]).overlap !== undefined) { segPiece.push(i); segIndex.push(k); }
  }
  const m = segPiece.length;
  if (m < 2) return;
  const boxes = new Float64Array(4 * m);
  for (let q = 0; q < m; q++) {
    const s = pieces[segPiece[q]].segments[segIndex[q]];
    const b = ops(s).bbox(s);
    boxes[4 * q] = b[0] - tol; boxes[4 * q + 1] = b[1] - tol; boxes[4 * q + 2] = b[2] + tol; boxes[4 * q + 3] = b[3] + tol;
  }
  const seen = new Set<string>();
  overlappingPairs(boxes, (u, v) => {
    const i = segPiece[u], j = segPiece[v];
    if (layerId[i] !== layerId[j]) return;
    const s = pieces[i].segments[segIndex[u]], t = pieces[j].segments[segIndex[v]];
    const o = exactOverlap(s, t, tol);
    if (!o) return;
    const key = i < j ? `${i},${j}` : `${j},${i}`;
    if (seen.has(key)) return;
    seen.add(key);
    issues.push({ kind: 'overlap', x: o[0], y: o[1], length: o[2], pieces: i < j ? [i, j] : [j, i] });
  });
}


