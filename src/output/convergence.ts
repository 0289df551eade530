/**
 * Convergence plot: how much a quantity changes from one uniform refinement to the next, against the
 * number of triangles, on log–log axes (inline SVG, src/output/svgBuild.ts).
 */
import type { LevelResult } from '../analysis/measure.js';
import type { SectionKey } from '../properties/quantities.js';
import { FONT_FAMILY, PALETTE } from './draw.js';
import { svgRoot } from './svgBuild.js';
import { num } from './pathData.js';

export interface ConvergencePoint { triangles: number; change: number }

/** |value(level k) − value(level k−1)| for k ≥ 1, with the triangles of level k. */
export function convergencePoints(levels: readonly LevelResult[], key: SectionKey): ConvergencePoint[] {
  const out: ConvergencePoint[] = [];
  for (let i = 1; i < levels.length; i++) out.push({ triangles: levels[i].triangles, change: Math.abs(levels[i].values[key] - levels[i - 1].values[key]) });
  return out;
}


function decadeLabel(e: number): string {
  return e === 0 ? '1' : e === 1 ? '10' : `10${String(e).split('').map((c) => '⁰¹²³⁴⁵⁶⁷⁸⁹'[Number(c)] ?? '⁻').join('')}`;
}

/**
 * One log–log panel. Changes that are exactly zero cannot be placed on a log axis: they are drawn as open
 * markers on the bottom edge and said so in the caption.
 */
export async function convergencePlot(points: readonly ConvergencePoint[], title: string, unit: string, key: string): Promise<string> {
  const W = 330, H = 240, L = 58, R = 14, T = 30, B = 44;
  const svg = svgRoot().attr({ width: W, height: H, viewBox: `0 0 ${W} ${H}`, 'data-role': 'convergence', 'data-key': key, role: 'img', 'font-family': FONT_FAMILY });
  svg.element('title').words(`${title}: change between refinement levels against triangles (log–log)`);
  svg.rect(W, H).attr({ fill: PALETTE.paper });
  const pos = points.filter((p) => p.change > 0);
  const xs = points.map((p) => Math.log10(p.triangles));
  const ys = pos.map((p) => Math.log10(p.change));
  const x0 = Math.floor(Math.min(...xs)), x1 = Math.max(x0 + 1, Math.ceil(Math.max(...xs)));
  let y0 = ys.length ? Math.floor(Math.min(...ys)) : -16, y1 = ys.length ? Math.ceil(Math.max(...ys)) : -15;
  if (y1 - y0 < 2) { y0 -= 1; y1 += 1; }
  const px = (lx: number) => L + ((lx - x0) / (x1 - x0)) * (W - L - R);
  const py = (ly: number) => H - B - ((ly - y0) / (y1 - y0)) * (H - T - B);
  const grid = svg.group().attr({ stroke: '#d5dbe1', 'stroke-width': 0.7 });
  const labels = svg.group().attr({ style: `font-size:10.5px`, fill: PALETTE.ink });
  const ystep = Math.max(1, Math.ceil((y1 - y0) / 6));
  for (let e = x0; e <= x1; e++) {
    grid.line(px(e), T, px(e), H - B);
    labels.plain(decadeLabel(e)).attr({ x: px(e), y: H - B + 19, 'text-anchor': 'middle' }); // below the corner's y label
  }
  for (let e = y0; e <= y1; e += ystep) {
    grid.line(L, py(e), W - R, py(e));
    labels.plain(decadeLabel(e)).attr({ x: L - 5, y: py(e) + 4, 'text-anchor': 'end' });
  }
  svg.rect(W - L - R, H - T - B).move(L, T).attr({ fill: 'none', stroke: PALETTE.ink, 'stroke-width': 0.9 });
  labels.plain('triangles').attr({ x: (L + W - R) / 2, y: H - 6, 'text-anchor': 'middle' });
  svg.plain(`${title}: |change| per refinement, ${unit}`).attr({ x: L, y: 18, style: `font-size:12px;font-weight:600`, fill: PALETTE.ink });
  const line = pos.map((p, i) => `${i === 0 ? 'M' : 'L'}${num(px(Math.log10(p.triangles)))} ${num(py(Math.log10(p.change)))}`).join('');
  if (pos.length > 1) svg.path(line).attr({ fill: 'none', stroke: PALETTE.meshLine, 'stroke-width': 1.6 });
  for (const p of points) {
    const X = px(Math.log10(p.triangles));
    if (p.change > 0) svg.circle(8).center(X, py(Math.log10(p.change))).attr({ fill: PALETTE.meshLine, 'data-triangles': String(p.triangles), 'data-change': num(p.change) });
    else svg.circle(8).center(X, H - B).attr({ fill: PALETTE.paper, stroke: PALETTE.meshLine, 'stroke-width': 1.5, 'data-triangles': String(p.triangles), 'data-change': '0' });
  }
  return svg.svg();
}
