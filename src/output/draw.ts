/**
 * SVG drawings of measured parts, built with our small SVG builder (src/output/svgBuild.ts).
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
import { type SvgEl, svgRoot } from './svgBuild.js';
import type { SectionResult } from '../analysis/measure.js';
import { OptionError } from '../base/errors.js';
import { type Mesh, triangleCount } from '../mesh/mesh.js';
import { formatError, formatNumber, formatValue } from './text.js';
import { LENGTH_UNITS, type LengthUnit } from '../base/units.js';
import { type Box, Layout, clipLine, textBox, textWidth } from './labels.js';
import { type DrawingMap, chainPathData, loopPathData, mapX, mapY, num, segmentCommands } from './pathData.js';
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

/** A common scale for several drawings (a sheet): drawing units per millimetre, and the scale bar's length. */
export interface CommonScale { kPerMm: number; barLength: number; barUnit: LengthUnit }

const mmPer = (u: LengthUnit) => LENGTH_UNITS[u] * 1000;

/** The scale that fits the largest of the parts into the drawing box, and one bar length for all. */
export function commonScale(results: readonly SectionResult[]): CommonScale {
  let k = Infinity, widest = 0;
  for (const r of results) {
    const q = r.quantities, f = mmPer(r.units);
    const w = (q.xMax.value - q.xMin.value) * f, h = (q.yMax.value - q.yMin.value) * f;
    k = Math.min(k, BOX / w, BOX / h);
    widest = Math.max(widest, w, h);
  }
  // the bar in the parts' own unit when they share one, else in millimetres
  const unit = results.every((r) => r.units === results[0].units) ? results[0].units : 'mm';
  return { kPerMm: k, barLength: roundLength(widest / mmPer(unit) / 2.5), barUnit: unit };
}

/** Size of the square the part is fitted into, in drawing units. */
const BOX = 520;

/** Pack title pieces into lines of at most `width` drawing units, joined by " · ". */
function packLines(pieces: readonly string[], px: number, width: number): string[] {
  const lines: string[] = [];
  for (const p of pieces) {
    const last = lines.length - 1;
    if (last >= 0 && textWidth(`${lines[last]} · ${p}`, px) <= width) lines[last] = `${lines[last]} · ${p}`;
    else lines.push(p);
  }
  return lines;
}

/**
 * Draw one part into `root` at vertical offset `top`; returns the drawing's width and height.
 * All ids are avoided (data-role instead) so several drawings can share one sheet. Every label is placed
 * clear of every drawn line and of every other label (src/output/labels.ts), mesh and shading aside.
 */
function drawInto(root: SvgEl, r: SectionResult, opts: DrawOptions, top: number, scale?: CommonScale): { width: number; height: number; map: DrawingMap } {
  const q = r.quantities;
  const part = r.geometry.part;
  const u = r.units;
  const [xMin, yMin, xMax, yMax] = [q.xMin.value, q.yMin.value, q.xMax.value, q.yMax.value];
  const w = xMax - xMin, h = yMax - yMin;
  const markRows = opts.marks ? markKeyRows(opts.marks, u) : [];
  // geometry that is not cut and lies over this part's box: drawn muted, with a key under the scale bar
  const nc = opts.reading?.notCut;
  const near = (segs: readonly Segment[]) => {
    let b = [Infinity, Infinity, -Infinity, -Infinity];
    for (const sg of segs) { const bb = ops(sg).bbox(sg); b = [Math.min(b[0], bb[0]), Math.min(b[1], bb[1]), Math.max(b[2], bb[2]), Math.max(b[3], bb[3])]; }
    return b[0] <= xMax && b[2] >= xMin && b[1] <= yMax && b[3] >= yMin;
  };
  const ig = nc ? nc.ignored.filter(near) : [], mk = nc ? nc.marking.filter(near) : [];
  // the drawn extent: the part's box and the muted geometry over it, at most a quarter of the part's size
  // beyond the box (muted geometry is clipped there), so that labels outside the extent stay clear of it
  const reach = 0.25 * Math.max(w, h);
  const ext = [xMin, yMin, xMax, yMax];
  for (const segs of [...ig, ...mk]) for (const sg of segs) {
    const bb = ops(sg).bbox(sg);
    ext[0] = Math.min(ext[0], Math.max(bb[0], xMin - reach)); ext[1] = Math.min(ext[1], Math.max(bb[1], yMin - reach));
    ext[2] = Math.max(ext[2], Math.min(bb[2], xMax + reach)); ext[3] = Math.max(ext[3], Math.min(bb[3], yMax + reach));
  }
  const ew = ext[2] - ext[0], eh = ext[3] - ext[1];
  const k = scale ? scale.kPerMm * mmPer(u) : Math.min(BOX / ew, BOX / eh);
  const shadeVals = shadeValues(r, opts.shade, opts.degree, opts.shadeTitle);
  const left = 80, topPad = 44;
  const pw = k * ew, ph = k * eh;
  const legendW = shadeVals ? 250 : 0;
  const fmt = (key: keyof typeof q) => `${formatValue(q[key].value, q[key].error)} ± ${formatError(q[key].error)}`;
  const widthText = `${formatNumber(w, 7)} ${u}`, heightText = `${formatNumber(h, 7)} ${u}`;
  const widthInside = textWidth(widthText, 12) + 8 <= k * w, heightInside = textWidth(heightText, 12) + 8 <= k * h;
  // width: the part, its dimensions and legend, and every title piece on a line of its own at least
  const unitNote = opts.reading?.unitSource ? ` (${unitSourceText(opts.reading.unitSource)})` : '';
  const cErr = Math.max(q.centroidX.error, q.centroidY.error);
  const pieces = [
    `lengths in ${u}${unitNote}`,
    `area ${fmt('area')} ${u}²`,
    `centroid (${formatValue(q.centroidX.value, cErr)}, ${formatValue(q.centroidY.value, cErr)}) ± ${formatError(cErr)} ${u}`,
    `I1 ${fmt('I1')} ${u}⁴ · I2 ${fmt('I2')} ${u}⁴ (principal second moments)`,
  ];
  const width = Math.max(640, left + pw + 110 + legendW, left + keyWidth(markRows) + 20, 28 + textWidth(r.part, 17, true), 28 + Math.max(...pieces.map((p) => textWidth(p, 12.5))),
    heightInside ? 0 : left + pw + 36 + textWidth(heightText, 12) + 12, widthInside ? 0 : left + pw + 12 + textWidth(widthText, 12) + 12);
  const titleLines = packLines(pieces, 12.5, width - 28);
  const stripH = 56 + 18 * (titleLines.length - 1);
  const T = top + stripH + topPad;
  const gaps = (opts.reading?.gapsClosed ?? []).filter((p) => p.x >= xMin && p.x <= xMax && p.y >= yMin && p.y <= yMax);
  const m: DrawingMap = { k, ox: left - k * ext[0], oy: T + k * ext[3] };
  const X0 = mapX(m, xMin), X1 = mapX(m, xMax), Y0 = mapY(m, yMax), Y1 = mapY(m, yMin);
  const EX1 = left + pw, EY0 = T, EY1 = T + ph; // the drawn extent's right, top and bottom
  // the origin (0, 0) is marked where it lies on or inside the bounding box; elsewhere a key row says where it is
  const OX = mapX(m, 0), OY = mapY(m, 0);
  const originShown = OX >= X0 - 1 && OX <= X1 + 1 && OY >= Y0 - 1 && OY <= Y1 + 1;
  const keyRows = (mk.length > 0 ? 1 : 0) + (ig.length > 0 ? 1 : 0) + (gaps.length > 0 ? 1 : 0) + (originShown ? 0 : 1);
  const height = stripH + topPad + ph + 118 + 18 * keyRows;
  const lay = new Layout();

  const g = root.group().attr({ 'data-role': 'part-drawing', 'data-part': r.part, 'data-scale': num(k), 'data-ox': num(m.ox), 'data-oy': num(m.oy) });

  // title strip
  const strip = g.group().attr({ 'data-role': 'title' });
  strip.rect(width, stripH).move(0, top).attr({ fill: PALETTE.strip });
  strip.plain(r.part).attr({ x: 14, y: top + 24, style: `font-size:17px;font-weight:600`, fill: PALETTE.ink });
  titleLines.forEach((t, i) => strip.plain(t).attr({ x: 14, y: top + 46 + 18 * i, style: `font-size:12.5px`, fill: PALETTE.ink }));
  lay.rect(0, top, width, stripH); // nothing else may stand on the strip

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
    for (const loop of [reg.outer, ...reg.holes]) for (const sg of loop.segments) lay.segment(sg, m);
  }
  g.attr({ 'data-cutouts': String(nCut) });

  // geometry that is not cut, in muted styles: ignored contours dotted grey, marking lines dashed; clipped to
  // the drawn extent by a nested viewport (no ids needed)
  const extBox: Box = [left - 4, EY0 - 4, EX1 + 4, EY1 + 4];
  const muted = ig.length + mk.length > 0
    ? g.element('svg').attr({ x: num(extBox[0]), y: num(extBox[1]), width: num(extBox[2] - extBox[0]), height: num(extBox[3] - extBox[1]), viewBox: `${num(extBox[0])} ${num(extBox[1])} ${num(extBox[2] - extBox[0])} ${num(extBox[3] - extBox[1])}`, overflow: 'hidden', 'data-role': 'muted-extent' })
    : g;
  if (ig.length > 0) {
    const gi = muted.group().attr({ 'data-role': 'ignored', 'data-count': String(ig.length), fill: 'none', stroke: PALETTE.ignored, 'stroke-width': 0.9, 'stroke-dasharray': '1.5 3' });
    for (const segs of ig) { gi.path(chainPathData(segs, m)); for (const sg of segs) lay.segment(sg, m, extBox); }
  }
  if (mk.length > 0) {
    const gm = muted.group().attr({ 'data-role': 'marking', 'data-count': String(mk.length), fill: 'none', stroke: PALETTE.marking, 'stroke-width': 1.1, 'stroke-dasharray': '6 3' });
    for (const segs of mk) { gm.path(chainPathData(segs, m)); for (const sg of segs) lay.segment(sg, m, extBox); }
  }
  if (gaps.length > 0) {
    const gg = g.group().attr({ 'data-role': 'joined-gaps', 'data-count': String(gaps.length), fill: 'none', stroke: PALETTE.axis, 'stroke-width': 1 });
    for (const p of gaps) { gg.circle(9).center(mapX(m, p.x), mapY(m, p.y)); lay.reserve([mapX(m, p.x) - 5, mapY(m, p.y) - 5, mapX(m, p.x) + 5, mapY(m, p.y) + 5]); }
  }

  // bounding box and its dimensions; a label too long for its dimension line stands beyond the line's end
  const bg = g.group().attr({ 'data-role': 'bounding-box', stroke: PALETTE.frame, fill: 'none', 'stroke-width': 0.8 });
  const bline = (x1: number, y1: number, x2: number, y2: number) => { bg.line(x1, y1, x2, y2); lay.line(x1, y1, x2, y2); };
  bg.rect(X1 - X0, Y1 - Y0).move(X0, Y0).attr({ 'stroke-dasharray': '5 4' });
  lay.rect(X0, Y0, X1 - X0, Y1 - Y0);
  const dimY = EY1 + 26, dimX = EX1 + 26;
  bline(X0, dimY, X1, dimY);
  bline(X0, dimY - 6, X0, dimY + 6); bline(X1, dimY - 6, X1, dimY + 6);
  bline(X0, Y1 + 4, X0, dimY + 8); bline(X1, Y1 + 4, X1, dimY + 8);
  bline(dimX, Y0, dimX, Y1);
  bline(dimX - 6, Y0, dimX + 6, Y0); bline(dimX - 6, Y1, dimX + 6, Y1);
  bline(X1 + 4, Y0, dimX + 8, Y0); bline(X1 + 4, Y1, dimX + 8, Y1);
  if (widthInside) {
    g.plain(widthText).attr({ x: (X0 + X1) / 2, y: dimY - 6, 'text-anchor': 'middle', style: HALO, fill: PALETTE.ink, 'data-role': 'width-label' });
    lay.reserve(textBox((X0 + X1) / 2, dimY - 6, widthText, 12, 'middle'));
  } else {
    g.plain(widthText).attr({ x: Math.max(X1, EX1) + 12, y: dimY + 4, style: HALO, fill: PALETTE.ink, 'data-role': 'width-label' });
    lay.reserve(textBox(Math.max(X1, EX1) + 12, dimY + 4, widthText, 12));
  }
  if (heightInside) {
    g.plain(heightText).attr({ x: 0, y: 0, transform: `translate(${num(dimX - 6)} ${num((Y0 + Y1) / 2)}) rotate(-90)`, 'text-anchor': 'middle', style: HALO, fill: PALETTE.ink, 'data-role': 'height-label' });
    const hw = textWidth(heightText, 12) / 2;
    lay.reserve([dimX - 6 - 12, (Y0 + Y1) / 2 - hw, dimX - 6 + 4, (Y0 + Y1) / 2 + hw]);
  } else {
    g.plain(heightText).attr({ x: dimX + 10, y: (Y0 + Y1) / 2 + 4, style: HALO, fill: PALETTE.ink, 'data-role': 'height-label' });
    lay.reserve(textBox(dimX + 10, (Y0 + Y1) / 2 + 4, heightText, 12));
  }

  // principal axes through the centroid (a white halo keeps them legible on dark shading), clipped just
  // outside the bounding box so that they stop short of the dimension labels
  const cx = q.centroidX.value, cy = q.centroidY.value;
  const CX = mapX(m, cx), CY = mapY(m, cy);
  const ax = g.group().attr({ 'data-role': 'principal-axes' });
  const clipBox: Box = [X0 - 6, Y0 - 6, X1 + 6, Y1 + 6];
  const angleDefined = !(q.principalAngle.error >= 90);
  if (angleDefined) {
    const th = (q.principalAngle.value * Math.PI) / 180;
    const half = Math.hypot(X1 - X0, Y1 - Y0) + 12;
    const axes: [string, number][] = [['I1', th], ['I2', th + Math.PI / 2]];
    for (const [name, a] of axes) {
      const dx = Math.cos(a), dy = -Math.sin(a); // drawing y points down
      const s = clipLine(CX, CY, dx, dy, -half, half, clipBox);
      // the key sits in the margin above the part, never on the drawing's lines: a line sample and the words
      const label = name === 'I1' ? `I1 axis, ${q.principalAngle.value.toFixed(2).replace(/^-(0\.00)$/, '$1')}° from +x` : 'I2 axis';
      const kx = name === 'I1' ? left : left + 250, ky = EY0 - 22;
      ax.line(kx, ky - 4, kx + 26, ky - 4).attr({ stroke: PALETTE.axis, 'stroke-width': 1.4, 'stroke-dasharray': name === 'I1' ? 'none' : '10 3 2 3' });
      ax.plain(label).attr({ x: kx + 32, y: ky, 'text-anchor': 'start', style: `font-size:12px;font-weight:600`, fill: PALETTE.axis, 'data-role': `${name}-label` });
      lay.line(kx, ky - 4, kx + 26, ky - 4);
      lay.reserve(textBox(kx + 32, ky, label, 12, 'start', true));
      if (!s) continue;
      const pts = [CX + dx * s[0], CY + dy * s[0], CX + dx * s[1], CY + dy * s[1]] as const;
      ax.line(...pts).attr({ stroke: PALETTE.paper, 'stroke-width': 4, 'stroke-opacity': 0.85 });
      ax.line(...pts).attr({ stroke: PALETTE.axis, 'stroke-width': 1.4, 'stroke-dasharray': name === 'I1' ? 'none' : '10 3 2 3', 'data-axis': name });
      lay.line(...pts);
    }
  } else {
    const t = 'I1 = I2 within the estimate: every centroidal axis is principal';
    ax.plain(t).attr({ x: left, y: EY0 - 18, style: `font-size:12px`, fill: PALETTE.axis });
    lay.reserve(textBox(left, EY0 - 18, t, 12));
  }

  if (opts.marks) drawSectionMarks(g, opts.marks, m, clipBox, lay);

  // scale bar in the part's units: four alternating blocks (one length for every part of a sheet)
  const len = scale ? (scale.barLength * mmPer(scale.barUnit)) / mmPer(u) : roundLength(Math.max(w, h) / 2.5);
  const sb = g.group().attr({ 'data-role': 'scale-bar', 'data-length': num(len) });
  const sbY = T + ph + 62, bl = (k * len) / 4;
  for (let i = 0; i < 4; i++) sb.rect(bl, 7).move(left + i * bl, sbY).attr({ fill: i % 2 === 0 ? PALETTE.ink : PALETTE.paper, stroke: PALETTE.ink, 'stroke-width': 0.8 });
  lay.rect(left, sbY, 4 * bl, 7);
  const barText = (x: number, t: string) => {
    sb.plain(t).attr({ x, y: sbY + 22, 'text-anchor': 'middle', style: `font-size:11px`, fill: PALETTE.ink });
    lay.reserve(textBox(x, sbY + 22, t, 11, 'middle'));
  };
  barText(left, '0');
  if (2 * bl >= 40) barText(left + 2 * bl, formatNumber(len / 2, 6));
  barText(left + 4 * bl, `${formatNumber(len, 6)} ${u}`);

  // key to the muted styles and to the origin, under the scale bar
  const shown = [
    ...(mk.length > 0 ? [{ dash: '6 3', colour: PALETTE.marking, text: `marking, not cut: ${mk.length} line${mk.length === 1 ? '' : 's'}` }] : []),
    ...(ig.length > 0 ? [{ dash: '1.5 3', colour: PALETTE.ignored, text: `ignored: ${ig.length} contour${ig.length === 1 ? '' : 's'} (hidden, skipped layer or border)` }] : []),
    ...(gaps.length > 0 ? [{ dash: '', colour: PALETTE.axis, text: `gap closed when joining loose ends: ${gaps.length}` }] : []),
    ...(originShown ? [] : [{ dash: 'origin', colour: PALETTE.axis, text: `origin (0, 0) lies outside this drawing: the box's lower-left corner is at (${formatNumber(xMin)}, ${formatNumber(yMin)}) ${u}` }]),
  ];
  if (shown.length > 0) {
    const kg = g.group().attr({ 'data-role': 'reading-key' });
    shown.forEach((it, i) => {
      const ky = sbY + 44 + 18 * i;
      if (it.dash === 'origin') originMark(kg, left + 4, ky + 2, 'origin-direction', 12);
      else if (it.dash) kg.line(left, ky - 4, left + 26, ky - 4).attr({ stroke: it.colour, 'stroke-width': 1.2, 'stroke-dasharray': it.dash });
      else kg.circle(9).center(left + 13, ky - 4).attr({ fill: 'none', stroke: it.colour, 'stroke-width': 1 });
      lay.reserve([left - 2, ky - 14, left + 30, ky + 4]);
      kg.plain(it.text).attr({ x: left + 34, y: ky, style: 'font-size:11px', fill: PALETTE.ink, ...(it.dash === 'origin' ? { 'data-role': 'origin-note' } : {}) });
      lay.reserve(textBox(left + 34, ky, it.text, 11));
    });
  }

  if (markRows.length > 0) drawMarkKey(g, markRows, left, sbY + 44 + 18 * shown.length);

  // legend of the shading
  if (shadeVals) {
    const bins = binValues(shadeVals);
    const lx = EX1 + 78, ly = T;
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
    lay.reserve([lx - 4, ly - 14, lx + legendW, ly + 28 + RAMP_STEPS * sh + 22]);
  }

  // the origin: a ring with x and y arrows, labels placed clear of everything drawn so far
  if (originShown) {
    const og2 = g.group().attr({ 'data-role': 'origin', 'data-x': '0', 'data-y': '0', transform: `translate(${num(OX)} ${num(OY)})` });
    originMark(og2, 0, 0, 'origin-arrows', 30);
    lay.line(OX, OY, OX + 30, OY); lay.line(OX, OY, OX, OY - 30);
    lay.reserve([OX - 5, OY - 5, OX + 5, OY + 5]);
    placeText(og2, lay, OX, OY, '(0, 0)', 11, 'origin-label', [[-9, 16, 'end'], [9, 16, 'start'], [-9, -8, 'end'], [9, -8, 'start'], [-9, 30, 'end'], [9, 30, 'start'], [-9, -22, 'end'], [-24, 16, 'end'], [-24, -8, 'end']]);
    placeText(og2, lay, OX, OY, 'x', 11, 'origin-x', [[36, 4, 'start'], [30, 16, 'middle'], [30, -7, 'middle'], [44, 4, 'start']]);
    placeText(og2, lay, OX, OY, 'y', 11, 'origin-y', [[0, -36, 'middle'], [-8, -28, 'end'], [8, -28, 'start'], [0, -46, 'middle']]);
  }

  if (opts.marks) drawShearCentre(g, opts.marks, m, lay);

  // centroid marker: ring with two opposite filled quarters; its label where nothing is drawn
  const cg = g.group().attr({ 'data-role': 'centroid', 'data-x': num(cx), 'data-y': num(cy), transform: `translate(${num(CX)} ${num(CY)})` });
  cg.circle(16).center(0, 0).attr({ fill: PALETTE.paper, stroke: PALETTE.ink, 'stroke-width': 1.4 });
  cg.path('M0 0L8 0A8 8 0 0 0 0 -8ZM0 0L-8 0A8 8 0 0 0 0 8Z').attr({ fill: PALETTE.ink });
  lay.reserve([CX - 9, CY - 9, CX + 9, CY + 9]);
  const around: [number, number, 'start' | 'end' | 'middle'][] = [];
  for (const f of [1, 1.8, 2.8, 4]) around.push([11 * f, 16 * f, 'start'], [11 * f, -6 * f, 'start'], [-11 * f, 16 * f, 'end'], [-11 * f, -6 * f, 'end'], [0, 22 * f, 'middle'], [0, -12 * f, 'middle']);
  placeText(cg, lay, CX, CY, 'centroid', 11, 'centroid-label', around);
  return { width, height: height + 18 * markRows.length, map: m };
}

/** A ring with x and y arrows at (x, y) (drawing units), arrows `len` long. */
function originMark(into: SvgEl, x: number, y: number, role: string, len: number): void {
  const o = into.group().attr({ 'data-role': role, fill: 'none', stroke: PALETTE.axis, 'stroke-width': 1.3 });
  o.circle(7).center(x, y);
  o.path(`M${num(x + 3.5)} ${num(y)}L${num(x + len)} ${num(y)}M${num(x + len - 5)} ${num(y - 3)}L${num(x + len)} ${num(y)}L${num(x + len - 5)} ${num(y + 3)}` +
    `M${num(x)} ${num(y - 3.5)}L${num(x)} ${num(y - len)}M${num(x - 3)} ${num(y - len + 5)}L${num(x)} ${num(y - len)}L${num(x + 3)} ${num(y - len + 5)}`);
}

/** A small label at one of the offsets (dx, dy, anchor) from (X, Y), the first clear of the layout. */
function placeText(into: SvgEl, lay: Layout, X: number, Y: number, text: string, px: number, role: string, offsets: readonly [number, number, 'start' | 'middle' | 'end'][]): void {
  const boxes = offsets.map(([dx, dy, a]) => textBox(X + dx, Y + dy, text, px, a));
  const { index } = lay.place(boxes);
  const [dx, dy, a] = offsets[index];
  into.plain(text).attr({ x: num(dx), y: num(dy), ...(a === 'start' ? {} : { 'text-anchor': a }), style: `font-size:${px}px;paint-order:stroke;stroke:#ffffff;stroke-width:3px`, fill: PALETTE.ink, 'data-role': role });
}

function finish(svg: SvgEl, width: number, height: number, title: string): string {
  svg.attr({ width: num(width), height: num(height), viewBox: `0 0 ${num(width)} ${num(height)}`, 'font-family': FONT_FAMILY });
  svg.element('title').words(title);
  return svg.svg();
}

/** One part, one drawing (SVG text). */
export async function drawPart(r: SectionResult, opts: DrawOptions = {}): Promise<string> {
  const svg = svgRoot();
  svg.rect('100%', '100%').attr({ fill: PALETTE.paper, 'data-role': 'paper' });
  const { width, height, map } = drawInto(svg, r, opts, 0);
  svg.attr({ 'data-scale': num(map.k), 'data-ox': num(map.ox), 'data-oy': num(map.oy) });
  return finish(svg, width, height, `${r.part} (platewise drawing)`);
}

/** Several parts stacked on one sheet (SVG text). */
export async function drawSheet(results: SectionResult[], opts: DrawOptions = {}, marks?: readonly (SectionMarks | undefined)[]): Promise<string> {
  const svg = svgRoot();
  svg.rect('100%', '100%').attr({ fill: PALETTE.paper, 'data-role': 'paper' });
  // one scale for every part: the one that fits the largest; every scale bar has the same length
  const scale = commonScale(results);
  const head = results.length === 1
    ? `1 part; its scale bar is ${formatNumber(scale.barLength, 6)} ${scale.barUnit} long`
    : `${results.length} parts drawn at one scale: every scale bar is ${formatNumber(scale.barLength, 6)} ${scale.barUnit} long`;
  svg.plain(head).attr({ x: 14, y: 20, style: 'font-size:13px;font-weight:600', fill: PALETTE.ink, 'data-role': 'sheet-scale', 'data-scale-per-mm': num(scale.kPerMm) });
  let top = 30, width = 28 + textWidth(head, 13, true);
  for (const [i, r] of results.entries()) {
    const d = drawInto(svg, r, marks ? { ...opts, marks: marks[i] } : opts, top, scale);
    top += d.height + 16;
    width = Math.max(width, d.width);
  }
  return finish(svg, width, top, `${results.length} parts (platewise sheet)`);
}
