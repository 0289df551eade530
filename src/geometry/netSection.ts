/**
 * Net section along a line: where a straight line or a polyline given by the user (a staggered chain through
 * bolt holes, say) runs through the material of a part. Geometry only: which chain governs a design (the
 * s²/4g rule and the like) stays with the user and the governing code.
 *
 * Each piece of the line is intersected with every boundary segment through the segment kinds' own
 * `crossings` operation (closed forms for lines, arcs and elliptical arcs; roots of the distance polynomial
 * for Béziers), so curves stay exact. The crossings split the piece into stretches; the middle of each is
 * classified by the even–odd rule on the exact loops: inside an outer loop (gross) and inside the material
 * (net: inside an outer loop and no hole of its region). Runs of material are merged along the whole line,
 * across the polyline's corners.
 *
 * Error bound. Every boundary point may lie δ = 64 ε·M from where the input puts it (M the largest
 * coordinate magnitude or extent, the project's representation allowance with round-off of the crossing
 * itself). A boundary crossed at angle θ with curvature κ moves along the line by at most x with
 * sinθ·x − κx²/2 ≤ δ, hence x ≤ 4δ / (sinθ + √(2κδ)) (the factor 4 covers the quadratic's root with margin,
 * and at a tangency, where sinθ = 0, a missed or extra chord of length 2√(2δ/κ) is covered by 4/√2 √(δ/κ)
 * counted at the touching point). κ is taken as half the mean curvature over a short stretch around the
 * crossing (a smaller κ only enlarges the bound). Each length's bound is the sum of the bounds of the
 * crossings that end or touch its stretches, plus the summation round-off. A crossing at a shallow angle to
 * a straight edge gets a large bound: that is the true sensitivity, not a fault.
 */
import { InputError } from '../base/errors.js';
import { type Part } from './part.js';
import { type LineSegment, type Segment, exactCrossings, exactOverlap, ops } from './segments.js';

const EPS = Number.EPSILON;

export interface NetLine {
  /** Corner points of the line in the part's coordinates and length unit (at least two). */
  points: [number, number][];
  /** Where the line was given (a flag, a file path), for messages. */
  where: string;
}

export interface NetInterval {
  /** Distance along the line from its first point to the start and the end of a run of material. */
  from: number; to: number;
  /** Bounds on the error of from and to (zero where the run starts or ends at the line's own end, inside the material). */
  fromError: number; toError: number;
  fromPoint: [number, number]; toPoint: [number, number];
}

export interface NetSectionGeometry {
  points: [number, number][];
  /** Length of the line itself (sum of its pieces) and its round-off bound. */
  length: number; lengthError: number;
  /** Length inside the outer outlines, holes counted as material. */
  gross: number; grossError: number;
  /** Length through material (holes excluded). */
  net: number; netError: number;
  /** Runs of material, in order along the line. */
  intervals: NetInterval[];
  /** Places where the line meets the boundary (touches included; a joint of two segments counts once). */
  crossings: number;
  startsInMaterial: boolean; endsInMaterial: boolean;
}

/** Text such as "0,40 120,40" or "0,40; 60,55; 120,40" (x,y pairs in the part's unit) as a line. */
export function parseNetLine(text: string, where: string): NetLine {
  const tokens = text.split(/[;\s]+/).filter((t) => t.length > 0);
  if (tokens.length < 2) throw new InputError(where, `expected at least two points as x,y pairs separated by spaces, e.g. "0,40 120,40"; got ${tokens.length === 0 ? 'an empty text' : `one ("${tokens[0]}")`}`);
  const points = tokens.map((t, i): [number, number] => {
    const m = /^([^,]+),([^,]+)$/.exec(t);
    const x = m ? Number(m[1]) : NaN, y = m ? Number(m[2]) : NaN;
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new InputError(where, `point ${i + 1} "${t}" is not x,y with two finite numbers`);
    return [x, y];
  });
  return { points, where };
}

/**
 * Is (x, y) inside the closed loop? Even–odd count of the crossings of a ray of length R with the loop's
 * segments (each kind's own crossings). A ray through a joint of two segments, along a tangent or through a
 * shared stretch is ambiguous: then the next of several fixed directions (irrational multiples of π, never
 * parallel to an axis or a 45° line) is tried.
 */
function rayInside(x: number, y: number, segs: readonly Segment[], R: number): boolean {
  const d: [number, number] = [0, 0];
  next: for (let k = 1; k <= 16; k++) {
    const th = k * Math.PI * (Math.SQRT2 - 1) * 0.61803398875;
    const ux = Math.cos(th), uy = Math.sin(th);
    const ray: LineSegment = { kind: 'line', x0: x, y0: y, x1: x + R * ux, y1: y + R * uy };
    let n = 0;
    for (const s of segs) {
      const o = ops(s), b = o.bbox(s);
      if (Math.max(b[0], Math.min(x, ray.x1)) > Math.min(b[2], Math.max(x, ray.x1)) || Math.max(b[1], Math.min(y, ray.y1)) > Math.min(b[3], Math.max(y, ray.y1))) continue;
      if (exactOverlap(ray, s, 0)) continue next;
      const hits = exactCrossings(ray, s, 0);
      if (hits === null) throw new Error(`no exact crossing of a line with a ${s.kind} segment`);
      for (const h of hits) {
        if (h.tb < 1e-9 || h.tb > 1 - 1e-9 || h.ta < 1e-12) continue next;
        o.derivative(s, h.tb, d);
        if (Math.abs(d[0] * uy - d[1] * ux) < 1e-9 * Math.hypot(d[0], d[1])) continue next;
        n++;
      }
    }
    return n % 2 === 1;
  }
  throw new Error('no ray direction clear of joints and tangents after 16 tries');
}

interface Hit { s: number; bound: number; outer: boolean }

/** Bound on how far a crossing moves along the line when the boundary moves by δ (see the file header). */
function crossingBound(seg: Parameters<typeof ops>[0], tb: number, ux: number, uy: number, delta: number): number {
  const o = ops(seg);
  const d: [number, number] = [0, 0];
  o.derivative(seg, tb, d);
  const speed = Math.hypot(d[0], d[1]);
  if (!(speed > 0)) return Infinity;
  const sin = Math.abs(d[0] * uy - d[1] * ux) / speed;
  let kappa = 0;
  if (!o.straight) {
    const a = Math.max(0, tb - 1e-4), b = Math.min(1, tb + 1e-4);
    kappa = o.turning(seg, a, b) / (speed * (b - a)) / 2;
  }
  return (4 * delta) / (sin + Math.sqrt(2 * kappa * delta));
}

/**
 * The net section of `part` along `line`; throws an InputError naming `line.where` for a malformed line, and for
 * one that misses the part unless `ifMissed` is 'none' (one part of several: then null).
 */
export function netSection(part: Part, line: NetLine): NetSectionGeometry;
export function netSection(part: Part, line: NetLine, ifMissed: 'refuse' | 'none'): NetSectionGeometry | null;
export function netSection(part: Part, line: NetLine, ifMissed: 'refuse' | 'none' = 'refuse'): NetSectionGeometry | null {
  const P = line.points, where = line.where;
  const pieces: LineSegment[] = [];
  for (let i = 0; i + 1 < P.length; i++) {
    const [x0, y0] = P[i], [x1, y1] = P[i + 1];
    if (x0 === x1 && y0 === y1) throw new InputError(where, `points ${i + 1} and ${i + 2} are the same (${x0}, ${y0}): a piece of the line has no length`);
    pieces.push({ kind: 'line', x0, y0, x1, y1 });
  }
  // magnitude M for the allowance: coordinates of the line and of the part's boxes
  let M = 0;
  for (const [x, y] of P) M = Math.max(M, Math.abs(x), Math.abs(y));
  const loops = part.regions.flatMap((r, ri) => [{ loop: r.outer, region: ri, outer: true }, ...r.holes.map((h) => ({ loop: h, region: ri, outer: false }))]);
  const boxes = loops.map(({ loop }) => {
    let b = [Infinity, Infinity, -Infinity, -Infinity];
    for (const s of loop.segments) { const q = ops(s).bbox(s); b = [Math.min(b[0], q[0]), Math.min(b[1], q[1]), Math.max(b[2], q[2]), Math.max(b[3], q[3])]; }
    M = Math.max(M, ...b.map(Math.abs), b[2] - b[0], b[3] - b[1]);
    return b;
  });
  const delta = 64 * EPS * M;
  // the line must not fold back on itself or cross itself: lengths along it would count twice
  for (let i = 0; i < pieces.length; i++) {
    for (let j = i + 1; j < pieces.length; j++) {
      if (j === i + 1) {
        if (exactOverlap(pieces[i], pieces[j], delta)) throw new InputError(where, `piece ${j + 1} runs back along piece ${i + 1} from point ${i + 2}: the line folds back on itself`);
        continue;
      }
      const c = exactCrossings(pieces[i], pieces[j], delta);
      if (c && c.length > 0) throw new InputError(where, `pieces ${i + 1} and ${j + 1} cross near (${fmt(c[0].x)}, ${fmt(c[0].y)}): the line crosses itself`);
    }
  }
  const extent = Math.max(1, ...boxes.map((b) => Math.max(b[2] - b[0], b[3] - b[1])), ...P.map(([x, y]) => Math.max(Math.abs(x), Math.abs(y))));
  const inMaterial = (x: number, y: number): [boolean, boolean] => {
    const inside = loops.map(({ loop }, li) => {
      const b = boxes[li];
      return x >= b[0] && x <= b[2] && y >= b[1] && y <= b[3] && rayInside(x, y, loop.segments, 4 * extent + 2 * M);
    });
    let gross = false;
    let li = 0;
    for (const r of part.regions) {
      const inOuter = inside[li];
      const inHole = inside.slice(li + 1, li + 1 + r.holes.length).some(Boolean);
      li += 1 + r.holes.length;
      if (!inOuter) continue;
      gross = true;
      if (!inHole) return [true, true];
    }
    return [gross, false];
  };

  let offset = 0, lengthError = 0, crossings = 0;
  // stretches along the whole line: [from, to, gross?, net?], with the hit that starts each
  const stretches: { from: number; to: number; gross: boolean; net: boolean; start?: Hit; end?: Hit }[] = [];
  const hitsAll: Hit[] = [];
  for (let k = 0; k < pieces.length; k++) {
    const c = pieces[k];
    const L = Math.hypot(c.x1 - c.x0, c.y1 - c.y0);
    const ux = (c.x1 - c.x0) / L, uy = (c.y1 - c.y0) / L;
    const cb = [Math.min(c.x0, c.x1) - delta, Math.min(c.y0, c.y1) - delta, Math.max(c.x0, c.x1) + delta, Math.max(c.y0, c.y1) + delta];
    const hits: Hit[] = [];
    loops.forEach(({ loop, outer }, li) => {
      const b = boxes[li];
      if (b[0] > cb[2] || b[2] < cb[0] || b[1] > cb[3] || b[3] < cb[1]) return;
      for (const seg of loop.segments) {
        const q = ops(seg).bbox(seg);
        if (q[0] > cb[2] || q[2] < cb[0] || q[1] > cb[3] || q[3] < cb[1]) continue;
        const ov = exactOverlap(c, seg, delta);
        if (ov) throw new InputError(where, `piece ${k + 1} runs along the part's boundary for ${fmt(ov[2])} near (${fmt(ov[0])}, ${fmt(ov[1])}): a net section is taken across the part; move the line off the edge`);
        const xs = exactCrossings(c, seg, delta);
        if (xs === null) throw new Error(`no exact crossing of a line with a ${seg.kind} segment`);
        for (const h of xs) hits.push({ s: Math.min(L, Math.max(0, h.ta * L)), bound: crossingBound(seg, h.tb, ux, uy, delta), outer });
      }
    });
    hits.sort((p, q) => p.s - q.s);
    // a crossing at the joint of two segments is found by both: count places, not reports
    crossings += hits.filter((h, i) => i === 0 || h.s - hits[i - 1].s > 2 * delta).length;
    hitsAll.push(...hits.map((h) => ({ ...h, s: offset + h.s })));
    // stretches between consecutive distinct breakpoints
    const cuts = [0, ...hits.map((h) => h.s), L];
    for (let i = 0; i + 1 < cuts.length; i++) {
      const a = cuts[i], b = cuts[i + 1];
      if (!(b > a)) continue;
      // a stretch within the crossings' own uncertainty (a line through a joint of two segments) joins its
      // neighbour: its midpoint would sit on the boundary, and its length is inside the bounds of its ends
      const prev = stretches[stretches.length - 1];
      if (b - a <= 2 * delta && prev && prev.to === offset + a) { prev.to = offset + b; continue; }
      const m = (a + b) / 2;
      const [gross, net] = inMaterial(c.x0 + ux * m, c.y0 + uy * m);
      stretches.push({ from: offset + a, to: offset + b, gross, net });
    }
    lengthError += 2 * EPS * L;
    offset += L;
  }
  const length = offset;
  lengthError += EPS * pieces.length * length;
  // merged runs of a flag, with the hits at their ends; every hit inside the line counts once in the bound
  const atS = (s: number, outerOnly: boolean) => hitsAll.filter((h) => h.s === s && (!outerOnly || h.outer)).reduce((m, h) => Math.max(m, h.bound), 0);
  const runs = (flag: 'gross' | 'net') => {
    const out: { from: number; to: number }[] = [];
    for (const st of stretches) {
      if (!st[flag]) continue;
      const last = out[out.length - 1];
      if (last && last.to === st.from) last.to = st.to; else out.push({ from: st.from, to: st.to });
    }
    return out;
  };
  const sum = (rs: { from: number; to: number }[]) => rs.reduce((t, r) => t + (r.to - r.from), 0);
  const grossRuns = runs('gross'), netRuns = runs('net');
  const roundoff = (v: number) => 4 * EPS * (stretches.length + 1) * Math.max(v, M);
  const gross = sum(grossRuns), net = sum(netRuns);
  const grossError = hitsAll.filter((h) => h.outer).reduce((t, h) => t + h.bound, 0) + roundoff(gross);
  const netError = hitsAll.reduce((t, h) => t + h.bound, 0) + roundoff(net);
  if (!(gross > 0)) {
    if (ifMissed === 'none') return null;
    throw new InputError(where, `the line ${P.map(([x, y]) => `(${fmt(x)}, ${fmt(y)})`).join(' → ')} misses the part (its outline spans x ${fmt(Math.min(...boxes.map((b) => b[0])))} to ${fmt(Math.max(...boxes.map((b) => b[2])))}, y ${fmt(Math.min(...boxes.map((b) => b[1])))} to ${fmt(Math.max(...boxes.map((b) => b[3])))})`);
  }
  const pointAt = (s: number): [number, number] => {
    let o = 0;
    for (const c of pieces) {
      const L = Math.hypot(c.x1 - c.x0, c.y1 - c.y0);
      if (s <= o + L || c === pieces[pieces.length - 1]) { const t = Math.min(1, (s - o) / L); return [c.x0 + (c.x1 - c.x0) * t, c.y0 + (c.y1 - c.y0) * t]; }
      o += L;
    }
    return P[P.length - 1];
  };
  const intervals: NetInterval[] = netRuns.map((r) => ({
    from: r.from, to: r.to, fromError: atS(r.from, false), toError: atS(r.to, false),
    fromPoint: pointAt(r.from), toPoint: pointAt(r.to),
  }));
  return {
    points: P.map(([x, y]) => [x, y]), length, lengthError,
    gross, grossError, net, netError, intervals, crossings,
    // a line that starts or ends on the boundary itself does not start or end inside the material
    startsInMaterial: netRuns.length > 0 && netRuns[0].from === 0 && atS(0, false) === 0,
    endsInMaterial: netRuns.length > 0 && netRuns[netRuns.length - 1].to === length && atS(length, false) === 0,
  };
}

function fmt(v: number): string {
  return String(Number(v.toPrecision(10)));
}
