/**
 * Section marks on a drawing, on request: the shear centre, the plastic neutral axes and net-section lines
 * (facts from src/analysis/torsionMember.ts `analyzeMarks`). The marks carry no words on the part: every
 * mark has a row in a key under the scale bar (a line sample or the symbol, then the words), so no label
 * ever sits on the drawing's lines. Lines are clipped to the frame around the part.
 *
 * Hooks: `data-role="shear-centre"` (data-x, data-y in part units), `data-role="plastic-axis"` with
 * `data-axis` = the quantity key, `data-role="net-line"` (its runs of material `data-role="net-run"`), and
 * each key row's words `data-role="mark-label"`.
 */
import type { SectionMarks } from '../analysis/torsionMember.js';
import { type Layout, clipLine } from './labels.js';
import { type DrawingMap, mapX, mapY, num } from './pathData.js';
import type { SvgEl } from './svgBuild.js';
import { formatError, formatNumber } from './text.js';

/** Our colours for the marks: distinct from the principal axes' orange and the material's blue-grey, and told apart by dash as well. */
const COLOUR = { shear: '#5b2c83', plastic: '#00695c', net: '#8e1f4f' } as const;
const NET_DASHES = ['7 4', '2 3', '12 3 2 3'];

interface KeyRow { text: string; colour: string; dash?: string; width?: number; symbol?: boolean }

function shearSymbol(g: SvgEl, X: number, Y: number): void {
  // no fill: a centroid at or near the shear centre stays visible under it
  g.circle(12).center(X, Y).attr({ fill: 'none', stroke: COLOUR.shear, 'stroke-width': 1.4 });
  g.path(`M${num(X - 4)} ${num(Y - 4)}L${num(X + 4)} ${num(Y + 4)}M${num(X - 4)} ${num(Y + 4)}L${num(X + 4)} ${num(Y - 4)}`).attr({ stroke: COLOUR.shear, 'stroke-width': 1.4, fill: 'none' });
}

const AXIS_NAME = { plasticAxisY: '∥ x', plasticAxisX: '∥ y', plasticAxis1: '∥ axis 1', plasticAxis2: '∥ axis 2' } as const;

/** The rows of the marks' key (known before drawing, so the drawing can be made wide enough). */
export function markKeyRows(marks: SectionMarks, unit: string): KeyRow[] {
  const rows: KeyRow[] = [];
  if (marks.plasticAxes) {
    const xy = marks.plasticAxes.filter((a) => a.key === 'plasticAxisY' || a.key === 'plasticAxisX');
    rows.push({ colour: COLOUR.plastic, dash: '3 3', text: `plastic neutral axes (equal areas): ${xy.map((a) => `${AXIS_NAME[a.key]} at ${a.key === 'plasticAxisY' ? 'y' : 'x'} = ${formatNumber(a.key === 'plasticAxisY' ? a.py : a.px, 7)} ± ${formatError(a.error)}`).join(', ')} ${unit}` });
    if (marks.plasticAxes.length > 2) rows.push({ colour: COLOUR.plastic, dash: '3 3', text: 'plastic neutral axes ∥ principal axes 1 and 2 (same style)' });
  }
  (marks.netSections ?? []).forEach((n, i) => {
    if (!n) return;
    const area = n.netArea ? `, net area ${formatNumber(n.netArea.value, 7)} ± ${formatError(n.netArea.error)} ${unit}²` : '';
    rows.push({ colour: COLOUR.net, dash: NET_DASHES[i % NET_DASHES.length], text: `net line ${i + 1} (thick where material): net ${formatNumber(n.netLength.value, 7)} ± ${formatError(n.netLength.error)} of gross ${formatNumber(n.grossLength.value, 7)} ${unit}${area}` });
  });
  if (marks.shearCentre) {
    const sc = marks.shearCentre;
    rows.push({ colour: COLOUR.shear, symbol: true, text: `shear centre (${formatNumber(sc.x, 7)}, ${formatNumber(sc.y, 7)}) ± ${formatError(sc.error)} ${unit}${sc.errorIsBound ? '' : ' (at a re-entrant corner the estimate rests on the graded mesh: checked against finer solves, not proven)'}` });
  }
  return rows;
}

/** Draw the marks into `g`, clipped to `clip` (drawing units); their words go in the key (markKeyRows). */
export function drawSectionMarks(g: SvgEl, marks: SectionMarks, m: DrawingMap, clip: [number, number, number, number], lay?: Layout): void {
  const far = 4 * Math.hypot(clip[2] - clip[0], clip[3] - clip[1]);
  if (marks.plasticAxes) {
    const pg = g.group().attr({ 'data-role': 'plastic-axes' });
    for (const a of marks.plasticAxes) {
      const X = mapX(m, a.px), Y = mapY(m, a.py), dx = a.dx, dy = -a.dy;
      const s = clipLine(X, Y, dx, dy, -far, far, clip);
      if (!s) continue;
      const pts = [X + dx * s[0], Y + dy * s[0], X + dx * s[1], Y + dy * s[1]] as const;
      pg.line(...pts).attr({ stroke: '#ffffff', 'stroke-width': 3.5, 'stroke-opacity': 0.8 });
      lay?.line(...pts);
      pg.line(...pts).attr({ stroke: COLOUR.plastic, 'stroke-width': 1.3, 'stroke-dasharray': '3 3', 'data-role': 'plastic-axis', 'data-axis': a.key });
    }
  }
  (marks.netSections ?? []).forEach((n, i) => {
    if (!n) return;
    const dash = NET_DASHES[i % NET_DASHES.length];
    const ng = g.group().attr({ 'data-role': 'net-line', 'data-index': String(i + 1) });
    const seg = (x0: number, y0: number, x1: number, y1: number, attrs: Record<string, string | number>) => {
      const X0 = mapX(m, x0), Y0 = mapY(m, y0), X1 = mapX(m, x1), Y1 = mapY(m, y1);
      const s = clipLine(X0, Y0, X1 - X0, Y1 - Y0, 0, 1, clip);
      if (!s) return;
      const pts = [X0 + (X1 - X0) * s[0], Y0 + (Y1 - Y0) * s[0], X0 + (X1 - X0) * s[1], Y0 + (Y1 - Y0) * s[1]] as const;
      lay?.line(...pts);
      ng.line(...pts).attr(attrs);
    };
    for (let k = 0; k + 1 < n.points.length; k++) {
      const [a, b] = [n.points[k], n.points[k + 1]];
      seg(a[0], a[1], b[0], b[1], { stroke: COLOUR.net, 'stroke-width': 1.1, 'stroke-dasharray': dash });
    }
    // runs of material: thick, along the line's own pieces (a run may turn at a corner of the line)
    for (const r of n.intervals) {
      let from = 0;
      for (let k = 0; k + 1 < n.points.length; k++) {
        const [a, b] = [n.points[k], n.points[k + 1]];
        const L = Math.hypot(b[0] - a[0], b[1] - a[1]), to = from + L;
        const lo = Math.max(r.from, from), hi = Math.min(r.to, to);
        if (hi > lo) {
          const p = (d: number): [number, number] => [a[0] + ((b[0] - a[0]) * (d - from)) / L, a[1] + ((b[1] - a[1]) * (d - from)) / L];
          const [p0, p1] = [p(lo), p(hi)];
          seg(p0[0], p0[1], p1[0], p1[1], { stroke: COLOUR.net, 'stroke-width': 3.2, 'stroke-linecap': 'butt', 'data-role': 'net-run' });
        }
        from = to;
      }
    }
  });
}

/** The shear-centre symbol, drawn after the centroid marker so both show where they meet. */
export function drawShearCentre(g: SvgEl, marks: SectionMarks, m: DrawingMap, lay?: Layout): void {
  if (marks.shearCentre) {
    const sc = marks.shearCentre;
    const sg = g.group().attr({ 'data-role': 'shear-centre', 'data-x': num(sc.x), 'data-y': num(sc.y) });
    const X = mapX(m, sc.x), Y = mapY(m, sc.y);
    shearSymbol(sg, X, Y);
    lay?.reserve([X - 7, Y - 7, X + 7, Y + 7]);
  }
}

/** Widest key row in px at 11 px (a generous 6.4 px per character). */
export const keyWidth = (rows: readonly KeyRow[]) => Math.max(0, ...rows.map((r) => 34 + 6.4 * r.text.length));

/** The key rows under the scale bar, from `y0` down 18 px apart, starting at `left`. */
export function drawMarkKey(g: SvgEl, rows: readonly KeyRow[], left: number, y0: number): void {
  const kg = g.group().attr({ 'data-role': 'mark-key' });
  rows.forEach((row, i) => {
    const ky = y0 + 18 * i;
    if (row.symbol) shearSymbol(kg, left + 13, ky - 4);
    else kg.line(left, ky - 4, left + 26, ky - 4).attr({ stroke: row.colour, 'stroke-width': 1.3, 'stroke-dasharray': row.dash ?? 'none' });
    kg.plain(row.text).attr({ x: left + 34, y: ky, style: 'font-size:11px', fill: '#1b2530', 'data-role': 'mark-label' });
  });
}
