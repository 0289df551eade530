/**
 * Where labels may stand in a drawing: every drawn line is kept as straight pieces (curves sampled finely),
 * every placed label as its box, and a label takes the first of its candidate places whose box meets
 * neither. Text boxes are estimated generously from the font size (no font metrics are read here);
 * tests/browser/overlap.test.ts checks the real boxes in Chromium against every drawn line and label.
 */
import { type Segment, ops } from '../geometry/segments.js';
import { type DrawingMap, mapX, mapY } from './pathData.js';

/** [x0, y0, x1, y1] in drawing units, x0 ≤ x1, y0 ≤ y1. */
export type Box = [number, number, number, number];

const NARROW = new Set([...' .,:;!|il()[]{}\'’′Iíj-·']);
const WIDE = new Set([...'mwMW@%—–×⁴²³±°']);

/** Generous width of a text in a sans-serif system font (wider than the wide fonts measured: DejaVu Sans). */
export function textWidth(text: string, px: number, bold = false): number {
  let em = 0;
  for (const c of text) em += NARROW.has(c) ? 0.38 : WIDE.has(c) ? 0.95 : /[A-Z]/.test(c) ? 0.74 : 0.64;
  return em * px * (bold ? 1.1 : 1);
}

/** Box of a text whose baseline starts (anchor start), centres (middle) or ends (end) at x. */
export function textBox(x: number, y: number, text: string, px: number, anchor: 'start' | 'middle' | 'end' = 'start', bold = false): Box {
  const w = textWidth(text, px, bold);
  const x0 = anchor === 'start' ? x : anchor === 'middle' ? x - w / 2 : x - w;
  return [x0, y - 1.0 * px, x0 + w, y + 0.32 * px];
}

/** Clip the segment P + s·D, s in [s0, s1], to a box (Liang–Barsky); null when it misses. */
export function clipLine(px: number, py: number, dx: number, dy: number, s0: number, s1: number, box: Box): [number, number] | null {
  const p = [-dx, dx, -dy, dy], q = [px - box[0], box[2] - px, py - box[1], box[3] - py];
  for (let i = 0; i < 4; i++) {
    if (p[i] === 0) { if (q[i] < 0) return null; continue; }
    const r = q[i] / p[i];
    if (p[i] < 0) s0 = Math.max(s0, r); else s1 = Math.min(s1, r);
  }
  return s0 <= s1 ? [s0, s1] : null;
}

const grow = (b: Box, d: number): Box => [b[0] - d, b[1] - d, b[2] + d, b[3] + d];
const meets = (a: Box, b: Box) => a[0] <= b[2] && b[0] <= a[2] && a[1] <= b[3] && b[1] <= a[3];

/** The drawn lines and placed labels of one drawing. */
export class Layout {
  /** Straight pieces x1 y1 x2 y2, flat. */
  private readonly lines: number[] = [];
  private readonly boxes: Box[] = [];

  line(x1: number, y1: number, x2: number, y2: number): void { this.lines.push(x1, y1, x2, y2); }

  rect(x: number, y: number, w: number, h: number): void {
    this.line(x, y, x + w, y); this.line(x + w, y, x + w, y + h); this.line(x + w, y + h, x, y + h); this.line(x, y + h, x, y);
  }

  /** A boundary segment in part coordinates, mapped and sampled in 24 pieces (any kind the same way), clipped to `clip`. */
  segment(sg: Segment, m: DrawingMap, clip?: Box): void {
    const o = ops(sg), p: [number, number] = [0, 0];
    const n = 24;
    o.point(sg, 0, p);
    let X = mapX(m, p[0]), Y = mapY(m, p[1]);
    for (let i = 1; i <= n; i++) {
      o.point(sg, i / n, p);
      const X2 = mapX(m, p[0]), Y2 = mapY(m, p[1]);
      const c = clip ? clipLine(X, Y, X2 - X, Y2 - Y, 0, 1, clip) : [0, 1];
      if (c) this.line(X + c[0] * (X2 - X), Y + c[0] * (Y2 - Y), X + c[1] * (X2 - X), Y + c[1] * (Y2 - Y));
      X = X2; Y = Y2;
    }
  }

  /** Reserve a box (a label, a marker). */
  reserve(b: Box): void { this.boxes.push(b); }

  /** Whether a box, grown by `pad`, meets no line and no reserved box. */
  clear(b: Box, pad = 2): boolean {
    const g = grow(b, pad);
    for (const r of this.boxes) if (meets(g, r)) return false;
    const L = this.lines;
    for (let i = 0; i < L.length; i += 4) {
      const x1 = L[i], y1 = L[i + 1], x2 = L[i + 2], y2 = L[i + 3];
      if (Math.max(x1, x2) < g[0] || Math.min(x1, x2) > g[2] || Math.max(y1, y2) < g[1] || Math.min(y1, y2) > g[3]) continue;
      if (clipLine(x1, y1, x2 - x1, y2 - y1, 0, 1, g)) return false;
    }
    return true;
  }

  /** The first candidate box that is clear (and reserve it), or the first candidate when none is. */
  place(candidates: readonly Box[], pad = 2): { box: Box; index: number; clear: boolean } {
    for (let i = 0; i < candidates.length; i++) {
      if (this.clear(candidates[i], pad)) { this.reserve(candidates[i]); return { box: candidates[i], index: i, clear: true }; }
    }
    this.reserve(candidates[0]);
    return { box: candidates[0], index: 0, clear: false };
  }
}
