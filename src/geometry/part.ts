/**
 * Loops, regions and parts.
 * A loop is a closed chain of segments (each segment starts where the previous one ends).
 * A region is one outer loop and any number of hole loops; a part is one or more regions.
 * After `normalizePart`, outer loops run counter-clockwise and holes clockwise.
 */
import type { LengthUnit } from '../base/units.js';
import { CompensatedSum } from '../numeric/sum.js';
import { type Box, type Segment, ops } from './segments.js';

export interface Loop {
  segments: Segment[];
  /** Where the loop came from, for error messages (JSON path, SVG element, ...). */
  where?: string;
}

export interface Region {
  outer: Loop;
  holes: Loop[];
}

export interface Part {
  name: string;
  units: LengthUnit;
  regions: Region[];
  /** Drawings: where the length unit came from (the file, the user's option, or assumed: CSS px). */
  unitSource?: 'file' | 'option' | 'assumed';
  /** Drawings: total length of marking lines (etching, scribing) on this part, in `units`. */
  markingLength?: number;
  /**
   * The same loops held about a point near the part (see LocalFrame), where the reader built them; valid only
   * while `local.of` is this part's `regions` (a part made from another with new regions drops it unseen).
   */
  local?: LocalFrame;
}

/**
 * A part held about `origin`, an exactly representable point near it: `regions` are the part's loops with
 * origin subtracted, built in these coordinates by the reader (tangent points, arc centres, pattern places
 * computed where they are small), so a constructed point keeps the precision of its distance from the
 * origin instead of the ulp of site coordinates (3.1e6 mm: 4.7e-10 mm). The part's own (absolute) regions
 * are these moved by the origin, one rounding per coordinate; moments are taken from the local loops.
 * Loop for loop and segment for segment the two describe the same geometry (withLocalFrame checks the shape).
 */
export interface LocalFrame {
  origin: readonly [number, number];
  regions: Region[];
  /** The absolute regions this frame belongs to (identity). */
  of: Region[];
}

/** The part's local frame, when it has one that belongs to its current regions. */
export function localFrame(part: Part): LocalFrame | undefined {
  const f = part.local;
  return f !== undefined && f.of === part.regions ? f : undefined;
}

/**
 * A point to hold a part about: the centre of `box` rounded to a multiple of a power of two g no smaller
 * than the ulp of the box's largest coordinate, so that every coordinate x of the part is a multiple of
 * ulp(x), which divides g, and x − origin is exact whenever it is representable (always, for a part
 * that does not reach many times its own size from the origin). Null when the part is near the
 * coordinate origin already (its largest coordinate under 4 times its size): nothing to gain.
 */
export function siteOrigin(box: Box): [number, number] | null {
  const m = Math.max(Math.abs(box[0]), Math.abs(box[1]), Math.abs(box[2]), Math.abs(box[3]));
  const size = Math.max(box[2] - box[0], box[3] - box[1]);
  if (!(m > 4 * size) || !Number.isFinite(m)) return null;
  // g = ulp(m)·2^22: 2^⌊log2 m⌋ is m's leading bit, ulp(m) = that·2^-52
  const g = 2 ** (Math.floor(Math.log2(m)) - 30);
  return [Math.round((box[0] + box[2]) / 2 / g) * g, Math.round((box[1] + box[3]) / 2 / g) * g];
}

/**
 * The part with its local frame attached: `local` holds the same loops as `part.regions`, built about
 * `origin`. When the two do not match loop for loop and kind for kind (a boolean decided differently at a
 * different rounding), the part is returned without a frame: correct, only less precise far from the origin.
 */
export function withLocalFrame(part: Part, origin: readonly [number, number], local: Region[]): Part {
  const a = part.regions;
  if (local.length !== a.length) return part;
  const same = (p: Loop, q: Loop) => p.segments.length === q.segments.length && p.segments.every((s, i) => s.kind === q.segments[i].kind);
  for (let i = 0; i < a.length; i++) {
    if (!same(a[i].outer, local[i].outer) || a[i].holes.length !== local[i].holes.length) return part;
    for (let j = 0; j < a[i].holes.length; j++) if (!same(a[i].holes[j], local[i].holes[j])) return part;
  }
  return { ...part, local: { origin: [origin[0], origin[1]], regions: local, of: a } };
}

/** Signed area enclosed by a loop (positive when counter-clockwise), exact for lines and arcs. */
export function loopSignedArea(loop: Loop): number {
  const a = new CompensatedSum();
  for (const s of loop.segments) a.add(ops(s).areaTerm(s));
  return a.value;
}

export function reverseLoop(loop: Loop): Loop {
  const segs = loop.segments.map((s) => ops(s).reverse(s)).reverse();
  return { ...loop, segments: segs };
}

/** Orient a loop counter-clockwise (ccw = true) or clockwise. */
export function orientLoop(loop: Loop, ccw: boolean): Loop {
  const a = loopSignedArea(loop);
  return (a > 0) === ccw ? loop : reverseLoop(loop);
}

export function normalizePart(part: Part): Part {
  const regions = part.regions.map((r) => ({
    outer: orientLoop(r.outer, true),
    holes: r.holes.map((h) => orientLoop(h, false)),
  }));
  const frame = localFrame(part);
  if (frame === undefined) return { ...part, regions, local: undefined };
  // the local loops turn with their absolute twins (one decision, so the two stay loop for loop alike)
  const turn = (given: Loop, oriented: Loop, local: Loop) => (oriented === given ? local : reverseLoop(local));
  const local = part.regions.map((r, i) => ({
    outer: turn(r.outer, regions[i].outer, frame.regions[i].outer),
    holes: r.holes.map((h, j) => turn(h, regions[i].holes[j], frame.regions[i].holes[j])),
  }));
  return { ...part, regions, local: { origin: frame.origin, regions: local, of: regions } };
}

export function loopLength(loop: Loop): number {
  let sum = 0;
  for (const s of loop.segments) sum += ops(s).length(s);
  return sum;
}

export function loopBox(loop: Loop): Box {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const s of loop.segments) {
    const b = ops(s).bbox(s);
    x0 = Math.min(x0, b[0]); y0 = Math.min(y0, b[1]); x1 = Math.max(x1, b[2]); y1 = Math.max(y1, b[3]);
  }
  return [x0, y0, x1, y1];
}

export function unionBox(a: Box, b: Box): Box {
  return [Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.max(a[2], b[2]), Math.max(a[3], b[3])];
}

/** Bounding box of the part's material (the outer loops bound everything). */
export function partBox(part: Part): Box {
  let b: Box = [Infinity, Infinity, -Infinity, -Infinity];
  for (const r of part.regions) b = unionBox(b, loopBox(r.outer));
  return b;
}

export function allLoops(part: Part): Loop[] {
  const out: Loop[] = [];
  for (const r of part.regions) {
    out.push(r.outer);
    for (const h of r.holes) out.push(h);
  }
  return out;
}

export function translateLoop(loop: Loop, dx: number, dy: number): Loop {
  return { ...loop, segments: loop.segments.map((s) => ops(s).translate(s, dx, dy)) };
}

/**
 * The part's loops in coordinates about `origin` (x − ox, y − oy): its local frame's loops when it is held
 * about that very point, else the loops translated (one rounding per coordinate).
 */
export function partAbout(part: Part, origin: readonly [number, number]): Part {
  const f = localFrame(part);
  if (f !== undefined && f.origin[0] === origin[0] && f.origin[1] === origin[1]) return { ...part, regions: f.regions, local: undefined };
  return translatePart(part, -origin[0], -origin[1]);
}

export function translatePart(part: Part, dx: number, dy: number): Part {
  return {
    ...part,
    local: undefined,
    regions: part.regions.map((r) => ({
      outer: translateLoop(r.outer, dx, dy),
      holes: r.holes.map((h) => translateLoop(h, dx, dy)),
    })),
  };
}
