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
  return {
    ...part,
    regions: part.regions.map((r) => ({
      outer: orientLoop(r.outer, true),
      holes: r.holes.map((h) => orientLoop(h, false)),
    })),
  };
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

export function translatePart(part: Part, dx: number, dy: number): Part {
  return {
    ...part,
    regions: part.regions.map((r) => ({
      outer: translateLoop(r.outer, dx, dy),
      holes: r.holes.map((h) => translateLoop(h, dx, dy)),
    })),
  };
}
