/**
 * SVG drawings of measured parts, built with svg.js on svgdom (both loaded on first use only, so commands
 * that do not draw never pay for them).
 *
 * A drawing shows: the material filled and cut-outs clear, every loop stroked with exact curve commands;
 * the centroid; both principal axes through it with the I1 angle; the bounding box with its width and
 * height; a scale bar in the part's units; a title strip with the part name, units and headline numbers.
 * Options overlay the mesh or shade its triangles (error indicator or a function), with a legend.
 *
 * Machine-readable hooks (for tests and tools): data-role on each group; the material path
 * `data-role="material"`; each loop `data-loop="outer|cutout"`; the centroid marker
 * `data-role="centroid"` with data-x/data-y in part units and a translate(X Y) in drawing units; the root
 * carries data-scale/data-ox/data-oy (X = ox + scale·x, Y = oy − scale·y).
 */
import type { Container, Svg } from '@svgdotjs/svg.js';
import type { SectionResult } from '../analysis/measure.js';
import { InputError, OptionError } from '../base/errors.js';
import { type Mesh, triangleCount } from '../mesh/mesh.js';
import { formatError, formatNumber } from './text.js';
import { type DrawingMap, chainPathData, clipLine, loopPathData, mapX, mapY, num, segmentCommands } from './pathData.js';
import type { NotCut } from '../read/interpret.js';
import type { UnitSource } from '../model/plate.js';
import { type Segment, ops } from '../geometry/segments.js';
import { unitSourceText } from './words.js';
import type { SectionMarks } from '../analysis/torsionMember.js';
import { drawMarkKey, drawSectionMarks, drawShearCentre, keyWidth, markKeyRows } from './sectionMarks.js';
import { RAMP_STEPS, type TriangleValues, binValues, errorIndicator, functionValues, rampColour } from './shade.js';

export interface DrawOptions {
  /** Overlay the base mesh's triangles (curved ones drawn curved). */
  mesh?: boolean;
  /** 'error' for the refinement error indicator, else an expression in x and y (e.g. a density). */
  shade?: string;
  /** Rule degree for the error indicator (default: the degree the result was measured with). */
  degree?: number;
  /** Legend title for a shading function (default: the expression itself). */
  shadeTitle?: string;
  /** How the drawing was read: marking and ignored geometry (muted), gaps closed when joining, the unit's source. */
  reading?: { notCut?: NotCut; gapsClosed?: readonly { x: number; y: number }[]; unitSource?: UnitSource };
  /** Section marks on request (shear centre, plastic neutral axes, net lines), keyed under the scale bar. */
  marks?: SectionMarks;
}

/** Our palette: chosen for contrast on white, distinct under colour-vision deficiencies, ordered in grey. */
export const PALETTE = {
  ink: '#1b2530',        // outline, text
  material: '#c7d6e6',   // plate fill (light blue-grey)
  frame: '#5c6670',      // bounding box and dimensions
  axis: '#a33f00',       // principal axes and centroid accents (dark orange: distinct from the blue ramp)
  strip: '#eef1f4',      // title strip background
  marking: '#5d7a93',    // marking (etch) lines: muted steel blue, dashed
  ignored: '#a7aeb5',    // ignored geometry (hidden, skipped layers, borders): light grey, dotted
  meshLine: '#3d5a78',   // mesh overlay on the plain fill
  paper: '#ffffff',
} as const;

/** System fonts only: nothing is fetched. */
const HALO = 'font-size:12px;paint-order:stroke;stroke:#ffffff;stroke-width:3px';

export const FONT_FAMILY = 'system-ui, -apple-system, "Segoe UI", Roboto, Helvetica, Arial, sans-serif';

type SvgJs = typeof import('@svgdotjs/svg.js');
let stack: Promise<SvgJs> | undefined;

/** Load svgdom and svg.js once, and bind svg.js to svgdom's window. */
export function loadSvgStack(): Promise<SvgJs> {
  stack ??= (async () => {
    const { createSVGWindow } = await import('svgdom');
    const svgjs = await import('@svgdotjs/svg.js');
    const window = createSVGWindow();
    svgjs.registerWindow(window, window.document);
    return svgjs;
  })();
  return stack;
}

/** A round length (1, 2 or 5 × 10^n) near `target`. */
export function roundLength(target: number): number {
  const p = 10 ** Math.floor(Math.log10(target));
  const f = target / p;
  return (f >= 5 ? 5 : f >= 2 ? 2 : 1) * p;
}

/** Closed path of a mesh triangle; curved edges follow their segment's own command. */
function trianglePath(mesh: Mesh, t: number, m: DrawingMap): string {
  const [ox, oy] = mesh.origin;
  const c = mesh.coords, tri = mesh.triangles;
  const v = [tri[3 * t], tri[3 * t + 1], tri[3 * t + 2]];
  let d = `M${num(mapX(m, c[2 * v[0]] + ox))} ${num(mapY(m, c[2 * v[0] + 1] + oy))}`;
  for (let k = 0; k < 3; k++) {
    const rec = mesh.edgeCurve[3 * t + k];
    const b = v[(k + 1) % 3];
    if (rec < 0) d += `L${num(mapX(m, c[2 * b] + ox))} ${num(mapY(m, c[2 * b + 1] + oy))}`;
    else d += segmentCommands(mesh.segments[mesh.curveSeg[rec]], mesh.curveS0[rec], mesh.curveS1[rec], m, ox, oy);
  }
  return d + 'Z';
}

function legendNumber(v: number): string {
  return Math.abs(v) !== 0 && (Math.abs(v) < 1e-3 || Math.abs(v) >= 1e6) ? v.toExponential(1) : formatNumber(v, 4);
}

/** Values shown by the shading option, or undefined. */
export function shadeValues(r: SectionResult, shade: string | undefined, degree?: number, title?: string): TriangleValues | undefined {
  if (shade === undefined) return undefined;
  if (shade.trim() === '') throw new OptionError('shade', 'expected "error" or an expression in x and y, got an empty text');
  const mesh = r.geometry.mesh;
  if (shade.trim() === 'error') return errorIndicator(mesh, degree ?? r.method.degree);
  const tv = functionValues(mesh, shade);
  return title ? { ...tv, title } : tv;
}

/**
 * Draw one part into `root` at vertical offset `top`; returns the drawing's width and height.
 * All ids are avoided (data-role instead) so several drawings can share one sheet.
 */
function drawInto(root: Container, r: SectionResult, opts: DrawOptions, top: number): { width: number; height: number; map: DrawingMap } {
  const q = r.quantities;
  const part = r.geometry.part;
  const u = r.units;
  const [xMin, yMin, xMax, yMax] = [q.xMin.value, q.yMin.value, q.xMax.value, q.yMax.value];
  const w = xMax - xMin, h = yMax - yMin;
  const BOX = 520;
  const k = Math.min(BOX / w, BOX / h);
  const shadeVals = shadeValues(r, opts.shade, opts.degree, opts.shadeTitle);
  const left = 80, stripH = 74, topPad = 44;
  const T = top + stripH + topPad;
  const pw = k * w, ph = k * h;
  const legendW = shadeVals ? 250 : 0;
  const markRows = opts.marks ? markKeyRows(opts.marks, u) : [];
  const width = Math.max(640, left + pw + 110 + legendW, left + keyWidth(markRows) + 20);
  // geometry that is not cut and lies over this part's box: drawn muted, with a key under the scale bar
  const nc = opts.reading?.notCut;
  const near = (segs: readonly Segment[]) => {
    let b = [Infinity, Infinity, -Infinity, -Infinity];
    for (const sg of segs) { const bb = ops(sg).bbox(sg); b = [Math.min(b[0], bb[0]), Math.min(b[1], bb[1]), Math.max(b[2], bb[2]), Math.max(b[3], bb[3])]; }
    return b[0] <= xMax && b[2] >= xMin && b[1] <= yMax && b[3] >= yMin;
  };
  const ig = nc ? nc.ignored.filter(near) : [], mk = nc ? nc.marking.filter(near) : [];
  const gaps = (opts.reading?.gapsClosed ?? []).filter((p) => p.x >= xMin && p.x <= xMax && p.y >= yMin && p.y <= yMax);
  const keyRows = (mk.length > 0 ? 1 : 0) + (ig.length > 0 ? 1 : 0) + (gaps.length > 0 ? 1 : 0);
  const height = stripH + topPad + ph + 118 + 18 * keyRows;
  const m: DrawingMap = { k, ox: left - k * xMin, oy: T + k * yMax };

  const g = root.group().attr({ 'data-role': 'part-drawing', 'data-part': r.part, 'data-scale': num(k), 'data-ox': num(m.ox), 'data-oy': num(m.oy) });

  // title strip
  const strip = g.group().attr({ 'data-role': 'title' });
  strip.rect(width, stripH).move(0, top).attr({ fill: PALETTE.strip });
  const fmt = (key: keyof typeof q, digits = 10) => `${formatNumber(q[key].value, digits)} ± ${formatError(q[key].error)}`;
  strip.plain(r.part).attr({ x: 14, y: top + 24, style: `font-size:17px;font-weight:600`, fill: PALETTE.ink });
  const unitNote = opts.reading?.unitSource ? ` (${unitSourceText(opts.reading.unitSource)})` : '';
  strip.plain(`lengths in ${u}${unitNote} · area ${fmt('area')} ${u}² · centroid (${formatNumber(q.centroidX.value)}, ${formatNumber(q.centroidY.value)}) ± ${formatError(Math.max(q.centroidX.error, q.centroidY.error))} ${u}`)
    .attr({ x: 14, y: top + 46, style: `font-size:12.5px`, fill: PALETTE.ink });
  strip.plain(`I1 ${fmt('I1')} ${u}⁴ · I2 ${fmt('I2')} ${u}⁴ (principal second moments)`)
    .attr({ x: 14, y: top + 64, style: `font-size:12.5px`, fill: PALETTE.ink });

  // material: all loops in one path; outers run counter-clockwise and cut-outs clockwise
  let d = '';
  for (const reg of part.regions) {
    d += loopPathData(reg.outer, m);
    for (const hole of reg.holes) d += loopPathData(hole, m);
  }
  g.path(d).attr({ 'data-role': 'material', fill: shadeVals ? PALETTE.paper : PALETTE.material, 'fill-rule': 'evenodd', stroke: 'none' });

  // mesh overlay or shading
  const mesh = r.geometry.mesh;
  if (opts.mesh || shadeVals) {
    const mg = g.group().attr({ 'data-role': shadeVals ? 'shading' : 'mesh', 'data-triangles': String(triangleCount(mesh)) });
    const bins = shadeVals ? binValues(shadeVals) : undefined;
    for (let t = 0; t < triangleCount(mesh); t++) {
      const p = mg.path(trianglePath(mesh, t, m));
      if (bins) {
        p.attr({ fill: rampColour(bins.bins[t]), stroke: opts.mesh ? PALETTE.paper : rampColour(bins.bins[t]), 'stroke-width': opts.mesh ? 0.6 : 0.3, 'data-value': num(shadeVals!.values[t]) });
      } else {
        p.attr({ fill: 'none', stroke: PALETTE.meshLine, 'stroke-width': 0.6, 'stroke-opacity': 0.8 });
      }
    }
  }

  // outlines
  const og = g.group().attr({ 'data-role': 'outlines', fill: 'none', stroke: PALETTE.ink, 'stroke-width': 1.6, 'stroke-linejoin': 'round' });
  let nCut = 0;
  for (const reg of part.regions) {
    og.path(loopPathData(reg.outer, m)).attr({ 'data-loop': 'outer' });
    for (const hole of reg.holes) { og.path(loopPathData(hole, m)).attr({ 'data-loop': 'cutout' }); nCut++; }
  }
  g.attr({ 'data-cutouts': String(nCut) });

  // geometry that is not cut, in muted styles: ignored contours dotted grey, marking lines dashed
  {
    if (ig.length > 0) {
      const gi = g.group().attr({ 'data-role': 'ignored', 'data-count': String(ig.length), fill: 'none', stroke: PALETTE.ignored, 'stroke-width': 0.9, 'stroke-dasharray': '1.5 3' });
      for (const segs of ig) gi.path(chainPathData(segs, m));
    }
    if (mk.length > 0) {
      const gm = g.group().attr({ 'data-role': 'marking', 'data-count': String(mk.length), fill: 'none', stroke: PALETTE.marking, 'stroke-width': 1.1, 'stroke-dasharray': '6 3' });
      for (const segs of mk) gm.path(chainPathData(segs, m));
    }
  }
  if (gaps.length > 0) {
    const gg = g.group().attr({ 'data-role': 'joined-gaps', 'data-count': String(gaps.length), fill: 'none', stroke: PALETTE.axis, 'stroke-width': 1 });
    for (const p of gaps) gg.circle(9).center(mapX(m, p.x), mapY(m, p.y));
  }

  // bounding box and its dimensions
  const X0 = mapX(m, xMin), X1 = mapX(m, xMax), Y0 = mapY(m, yMax), Y1 = mapY(m, yMin);
  const bg = g.group().attr({ 'data-role': 'bounding-box', stroke: PALETTE.frame, fill: 'none', 'stroke-width': 0.8 });
  bg.rect(X1 - X0, Y1 - Y0).move(X0, Y0).attr({ 'stroke-dasharray': '5 4' });
  const dimY = Y1 + 26, dimX = X1 + 26;
  bg.line(X0, dimY, X1, dimY);
  bg.line(X0, dimY - 6, X0, dimY + 6); bg.line(X1, dimY - 6, X1, dimY + 6);
  bg.line(X0, Y1 + 4, X0, dimY + 8); bg.line(X1, Y1 + 4, X1, dimY + 8);
  bg.line(dimX, Y0, dimX, Y1);
  bg.line(dimX - 6, Y0, dimX + 6, Y0); bg.line(dimX - 6, Y1, dimX + 6, Y1);
  bg.line(X1 + 4, Y0, dimX + 8, Y0); bg.line(X1 + 4, Y1, dimX + 8, Y1);
  g.plain(`${formatNumber(w, 7)} ${u}`).attr({ x: (X0 + X1) / 2, y: dimY - 6, 'text-anchor': 'middle', style: HALO, fill: PALETTE.ink, 'data-role': 'width-label' });
  g.plain(`${formatNumber(h, 7)} ${u}`).attr({ x: 0, y: 0, transform: `translate(${num(dimX - 6)} ${num((Y0 + Y1) / 2)}) rotate(-90)`, 'text-anchor': 'middle', style: HALO, fill: PALETTE.ink, 'data-role': 'height-label' });

  // principal axes through the centroid (a white halo keeps them legible on dark shading)
  const cx = q.centroidX.value, cy = q.centroidY.value;
  const CX = mapX(m, cx), CY = mapY(m, cy);
  const ax = g.group().attr({ 'data-role': 'principal-axes' });
  const clipBox: [number, number, number, number] = [X0 - 12, Y0 - 12, X1 + 12, Y1 + 12];
  const angleDefined = !(q.principalAngle.error >= 90);
  if (angleDefined) {
    const th = (q.principalAngle.value * Math.PI) / 180;
    const half = Math.hypot(X1 - X0, Y1 - Y0);
    const axes: [string, number][] = [['I1', th], ['I2', th + Math.PI / 2]];
    for (const [name, a] of axes) {
      const dx = Math.cos(a), dy = -Math.sin(a); // drawing y points down
      const s = clipLine(CX, CY, dx, dy, -half, half, clipBox);
      if (!s) continue;
      const pts = [CX + dx * s[0], CY + dy * s[0], CX + dx * s[1], CY + dy * s[1]] as const;
      ax.line(...pts).attr({ stroke: PALETTE.paper, 'stroke-width': 4, 'stroke-opacity': 0.85 });
      ax.line(...pts).attr({ stroke: PALETTE.axis, 'stroke-width': 1.4, 'stroke-dasharray': name === 'I1' ? 'none' : '10 3 2 3', 'data-axis': name });
      // the key sits in the margin above the part, never on the drawing's lines: a line sample and the words
      const label = name === 'I1' ? `I1 axis, ${q.principalAngle.value.toFixed(2)}° from +x` : 'I2 axis';
      const kx = name === 'I1' ? X0 : X0 + 250, ky = Y0 - 22;
      ax.line(kx, ky - 4, kx + 26, ky - 4).attr({ stroke: PALETTE.axis, 'stroke-width': 1.4, 'stroke-dasharray': name === 'I1' ? 'none' : '10 3 2 3' });
      ax.plain(label).attr({ x: kx + 32, y: ky, 'text-anchor': 'start', style: `font-size:12px;font-weight:600`, fill: PALETTE.axis, 'data-role': `${name}-label` });
    }
  } else {
    ax.plain('I1 = I2 within the estimate: every centroidal axis is principal').attr({ x: left, y: T - 14, style: `font-size:12px`, fill: PALETTE.axis });
  }

  if (opts.marks) drawSectionMarks(g, opts.marks, m, clipBox);

  // centroid marker: ring with two opposite filled quarters
  const cg = g.group().attr({ 'data-role': 'centroid', 'data-x': num(cx), 'data-y': num(cy), transform: `translate(${num(CX)} ${num(CY)})` });
  cg.circle(16).center(0, 0).attr({ fill: PALETTE.paper, stroke: PALETTE.ink, 'stroke-width': 1.4 });
  cg.path('M0 0L8 0A8 8 0 0 0 0 -8ZM0 0L-8 0A8 8 0 0 0 0 8Z').attr({ fill: PALETTE.ink });
  cg.plain('centroid').attr({ x: 11, y: 16, style: `font-size:11px;paint-order:stroke;stroke:#ffffff;stroke-width:3px`, fill: PALETTE.ink });
  if (opts.marks) drawShearCentre(g, opts.marks, m);

  // scale bar in the part's units: four alternating blocks
  const len = roundLength(w / 2.5);
  const sb = g.group().attr({ 'data-role': 'scale-bar', 'data-length': num(len) });
  const sbY = T + ph + 62, bl = (k * len) / 4;
  for (let i = 0; i < 4; i++) sb.rect(bl, 7).move(left + i * bl, sbY).attr({ fill: i % 2 === 0 ? PALETTE.ink : PALETTE.paper, stroke: PALETTE.ink, 'stroke-width': 0.8 });
  sb.plain('0').attr({ x: left, y: sbY + 22, 'text-anchor': 'middle', style: `font-size:11px`, fill: PALETTE.ink });
  if (2 * bl >= 40) sb.plain(formatNumber(len / 2, 6)).attr({ x: left + 2 * bl, y: sbY + 22, 'text-anchor': 'middle', style: `font-size:11px`, fill: PALETTE.ink });
  sb.plain(`${formatNumber(len, 6)} ${u}`).attr({ x: left + 4 * bl, y: sbY + 22, 'text-anchor': 'middle', style: `font-size:11px`, fill: PALETTE.ink });

  // key to the muted styles, beside the scale bar, when the drawing shows geometry that is not cut
  const shown = [
    ...(mk.length > 0 ? [{ dash: '6 3', colour: PALETTE.marking, text: `marking, not cut: ${mk.length} line${mk.length === 1 ? '' : 's'}` }] : []),
    ...(ig.length > 0 ? [{ dash: '1.5 3', colour: PALETTE.ignored, text: `ignored: ${ig.length} contour${ig.length === 1 ? '' : 's'} (hidden, skipped layer or border)` }] : []),
    ...(gaps.length > 0 ? [{ dash: '', colour: PALETTE.axis, text: `gap closed when joining loose ends: ${gaps.length}` }] : []),
  ];
  if (shown.length > 0) {
    const kg = g.group().attr({ 'data-role': 'reading-key' });
    shown.forEach((it, i) => {
      const ky = sbY + 44 + 18 * i;
      if (it.dash) kg.line(left, ky - 4, left + 26, ky - 4).attr({ stroke: it.colour, 'stroke-width': 1.2, 'stroke-dasharray': it.dash });
      else kg.circle(9).center(left + 13, ky - 4).attr({ fill: 'none', stroke: it.colour, 'stroke-width': 1 });
      kg.plain(it.text).attr({ x: left + 34, y: ky, style: 'font-size:11px', fill: PALETTE.ink });
    });
  }

  if (markRows.length > 0) drawMarkKey(g, markRows, left, sbY + 44 + 18 * shown.length);

  // legend of the shading
  if (shadeVals) {
    const bins = binValues(shadeVals);
    const lx = X1 + 78, ly = T;
    const lg = g.group().attr({ 'data-role': 'legend', 'data-scale-kind': bins.scale });
    lg.plain(shadeVals.title.length > 34 ? shadeVals.title.slice(0, 33) + '…' : shadeVals.title).attr({ x: lx, y: ly, style: `font-size:12px;font-weight:600`, fill: PALETTE.ink });
    lg.plain(bins.scale === 'log' ? 'per triangle; steps equal in log₁₀' : 'at triangle centres; equal steps').attr({ x: lx, y: ly + 16, style: `font-size:11px`, fill: PALETTE.ink });
    const sh = 22;
    for (let i = RAMP_STEPS - 1, row = 0; i >= 0; i--, row++) {
      const y0 = ly + 28 + row * sh;
      lg.rect(26, sh).move(lx, y0).attr({ fill: rampColour(i), stroke: PALETTE.ink, 'stroke-width': 0.6 });
      const loText = i === 0 && bins.floored ? `≤ ${legendNumber(bins.edges[1])}` : `${legendNumber(bins.edges[i])} – ${legendNumber(bins.edges[i + 1])}`;
      lg.plain(loText).attr({ x: lx + 34, y: y0 + 15, style: `font-size:11px`, fill: PALETTE.ink });
    }
    if (bins.scale === 'log' && bins.edges[bins.edges.length - 1] < 1e-12) {
      lg.plain('all at round-off level (below 1e-12)').attr({ x: lx, y: ly + 28 + RAMP_STEPS * sh + 16, style: `font-size:11px`, fill: PALETTE.ink });
    }
  }
  return { width, height: height + 18 * markRows.length, map: m };
}

function finish(svg: Svg, width: number, height: number, title: string): string {
  svg.attr({ width: num(width), height: num(height), viewBox: `0 0 ${num(width)} ${num(height)}`, 'font-family': FONT_FAMILY });
  svg.element('title').words(title);
  return svg.svg();
}

/** One part, one drawing (SVG text). */
export async function drawPart(r: SectionResult, opts: DrawOptions = {}): Promise<string> {
  const { SVG } = await loadSvgStack();
  const svg = SVG();
  svg.rect('100%', '100%').attr({ fill: PALETTE.paper, 'data-role': 'paper' });
  const { width, height, map } = drawInto(svg, r, opts, 0);
  svg.attr({ 'data-scale': num(map.k), 'data-ox': num(map.ox), 'data-oy': num(map.oy) });
  return finish(svg, width, height, `${r.part} (platewise drawing)`);
}

/** Several parts stacked on one sheet (SVG text). */
export async function drawSheet(results: SectionResult[], opts: DrawOptions = {}, marks?: readonly (SectionMarks | undefined)[]): Promise<string> {
  const { SVG } = await loadSvgStack();
  const svg = SVG();
  svg.rect('100%', '100%').attr({ fill: PALETTE.paper, 'data-role': 'paper' });
  let top = 0, width = 0;
  for (const [i, r] of results.entries()) {
    const d = drawInto(svg, r, marks ? { ...opts, marks: marks[i] } : opts, top);
    top += d.height + 16;
    width = Math.max(width, d.width);
  }
  return finish(svg, width, top, `${results.length} parts (platewise sheet)`);
}
