/**
 * SVG reader: reads a drawing into a `Drawing` (src/read/drawing.ts) and decides nothing about roles or
 * parts; the shared interpretation (src/read/interpret.ts) does. Every contour keeps its layer (an Inkscape
 * layer group, or a top-level <g> with a label or a non-generated id), name (<title>, label, non-generated
 * id), colour (stroke, else fill) and visibility: `display` and `visibility` from attributes, `style` and
 * `<style>` sheets (src/read/css.ts); hidden contours are kept with `hidden` set, never cut. CSS `transform`
 * (and `transform-origin`) in a style wins over the attribute. <use> of elements and <symbol>s is expanded
 * (x/y, viewBox, cycles and depth > 32 refused), nested <svg> viewports mapped, percentages taken of the
 * viewport (SVG 2, 8.9). Elements outside the SVG namespace are ignored and counted; text and images counted.
 * Open subpaths, lines and open polylines are open contours (marking candidates).
 * Units: width/height in mm, cm, in, pt, pc or Q over the viewBox → source 'file'; px or no unit → CSS px,
 * source 'assumed'; the `units` option → 'option', refused when it contradicts a unit the file states unless
 * `unitsOverride` is set.
 *
 * Geometry follows SVG 1.1 (W3C Recommendation, 2nd edition, 2011): the path grammar of chapter 8
 * (M L H V C S Q T A Z, absolute and relative, implicit repeats), elliptical arcs converted from endpoint to
 * centre form per Appendix F.6.5 with out-of-range radii scaled per F.6.6; basic shapes of chapter 9
 * (rect with rx/ry, circle, ellipse, polygon, polyline); `transform` lists of section 7.6. Sizes: width and
 * height with absolute units together with the viewBox fix the scale; without them one user unit is one
 * CSS pixel, 1/96 in (CSS Values and Units Level 3, "absolute lengths"). Output y points up, the origin at
 * the bottom-left corner of the viewBox.
 */
import { InputError } from '../base/errors.js';
import { type Part, loopBox, siteOrigin, unionBox } from '../geometry/part.js';
import { type Box, type Segment, ops, segmentEnd, segmentStart } from '../geometry/segments.js';
import { type Affine, IDENTITY, carriedTo, composeAffine, transformSegment } from '../geometry/transform.js';
import type { LengthUnit } from '../base/units.js';
import { type CascadedProperty, type Computed, type CssNode, StyleSheet, cascade, cssTransform, cssTransformOrigin } from './css.js';
import type { Drawing, DrawingUnits, DrawnContour, HiddenReason } from './drawing.js';
import { type InterpretOptions, interpretDrawing } from './interpret.js';
import { type XmlElement, XML_MAX_CHARS, XML_MAX_DEPTH, parseXml } from './xml.js';

/** CSS absolute units in CSS pixels (CSS Values and Units Level 3: 1in = 96px = 2.54cm, 1pt = 1/72in, 1pc = 12pt, 1Q = 1/40cm). */
export const CSS_PX_PER: Readonly<Record<string, number>> = {
  px: 1,
  in: 96,
  cm: 96 / 2.54,
  mm: 96 / 25.4,
  Q: 96 / 101.6,
  pt: 96 / 72,
  pc: 16,
};

const MM_PER_PX = 25.4 / 96;


// ---------------------------------------------------------------------------------------------
// numbers, lengths, transforms

const NUMBER_RE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/;

/**
 * A length attribute in user units (px); absolute units accepted, font-relative units rejected; a percentage
 * only where `percentOf` (the reference length: viewport width, height or normalised diagonal) is given.
 */
function parseLength(v: string, where: string, what: string, percentOf?: number): number {
  const s = v.trim();
  const m = NUMBER_RE.exec(s);
  if (!m) throw new InputError(where, `${what}: expected a length such as 12, 12px or 3mm, got "${v}"`);
  const num = Number(m[0]);
  if (!Number.isFinite(num)) throw new InputError(where, `${what}: number ${m[0]} is out of range`);
  const unit = s.slice(m[0].length).trim();
  if (unit === '') return num;
  if (unit === '%') {
    if (percentOf === undefined) throw new InputError(where, `${what}: a percentage needs a viewport size (viewBox or width and height on the enclosing <svg>), and there is none`);
    return (num / 100) * percentOf;
  }
  const f = CSS_PX_PER[unit];
  if (f === undefined) {
    throw new InputError(where, `${what}: unit "${unit}" is not accepted; expected none or one of px, mm, cm, in, pt, pc, Q`);
  }
  return num * f;
}

function numberList(v: string, where: string, what: string): number[] {
  const out: number[] = [];
  let i = 0;
  const s = v;
  while (i < s.length) {
    while (i < s.length && /[\s,]/.test(s[i])) i++;
    if (i >= s.length) break;
    const m = NUMBER_RE.exec(s.slice(i));
    if (!m) throw new InputError(where, `${what}: expected a number at character ${i}, got "${s.slice(i, i + 12)}"`);
    const v = Number(m[0]);
    if (!Number.isFinite(v)) throw new InputError(where, `${what}: number ${m[0]} is out of range`);
    out.push(v);
    i += m[0].length;
  }
  return out;
}

/** Parse a transform list (SVG 1.1 section 7.6); the list composes left to right (rightmost applies first). */
export function parseTransform(v: string, where: string): Affine {
  let m: Affine = IDENTITY;
  const re = /\s*,?\s*(matrix|translate|scale|rotate|skewX|skewY)\s*\(([^)]*)\)/y;
  let i = 0;
  const s = v.trim();
  while (i < s.length) {
    re.lastIndex = i;
    const r = re.exec(s);
    if (!r) throw new InputError(`${where} transform`, `expected matrix(), translate(), scale(), rotate(), skewX() or skewY() at character ${i}, got "${s.slice(i, i + 20)}"`);
    const name = r[1];
    const a = numberList(r[2], `${where} transform`, name);
    const bad = (want: string) => new InputError(`${where} transform`, `${name}() expects ${want} numbers, got ${a.length}`);
    let t: Affine;
    const rad = (deg: number) => (deg * Math.PI) / 180;
    switch (name) {
      case 'matrix':
        if (a.length !== 6) throw bad('6');
        t = [a[0], a[1], a[2], a[3], a[4], a[5]];
        break;
      case 'translate':
        if (a.length !== 1 && a.length !== 2) throw bad('1 or 2');
        t = [1, 0, 0, 1, a[0], a[1] ?? 0];
        break;
      case 'scale':
        if (a.length !== 1 && a.length !== 2) throw bad('1 or 2');
        t = [a[0], 0, 0, a[1] ?? a[0], 0, 0];
        break;
      case 'rotate': {
        if (a.length !== 1 && a.length !== 3) throw bad('1 or 3');
        const c = Math.cos(rad(a[0])), sn = Math.sin(rad(a[0]));
        t = [c, sn, -sn, c, 0, 0];
        if (a.length === 3) {
          // rotate(a, cx, cy) = translate(cx, cy) rotate(a) translate(−cx, −cy)
          t = composeAffine(composeAffine([1, 0, 0, 1, a[1], a[2]], t), [1, 0, 0, 1, -a[1], -a[2]]);
        }
        break;
      }
      case 'skewX':
        if (a.length !== 1) throw bad('1');
        t = [1, 0, Math.tan(rad(a[0])), 1, 0, 0];
        break;
      default:
        if (a.length !== 1) throw bad('1');
        t = [1, Math.tan(rad(a[0])), 0, 1, 0, 0];
    }
    m = composeAffine(m, t);
    i = re.lastIndex;
    while (i < s.length && /[\s,]/.test(s[i])) i++;
  }
  return m;
}

// ---------------------------------------------------------------------------------------------
// contour building

const line = (x0: number, y0: number, x1: number, y1: number): Segment => ({ kind: 'line', x0, y0, x1, y1 });

/** A contour under construction, in user units; segments chain exactly (each starts at the previous end). */
interface Contour {
  segments: Segment[];
  where: string;
  closed: boolean;
}

/**
 * Endpoint-to-centre conversion of an SVG arc (SVG 1.1 Appendix F.6.5, radii scaled per F.6.6).
 * Returns the segments (one or two, each at most a half turn) or a line when a radius is zero, or nothing
 * when the ends coincide (F.6.2).
 */
export function svgArcToSegments(
  x1: number, y1: number, rxIn: number, ryIn: number, phiDeg: number, largeArc: boolean, sweep: boolean, x2: number, y2: number,
): Segment[] {
  if (x1 === x2 && y1 === y2) return [];
  let rx = Math.abs(rxIn), ry = Math.abs(ryIn);
  if (rx === 0 || ry === 0) return [line(x1, y1, x2, y2)];
  const phi = ((phiDeg % 360) * Math.PI) / 180;
  const cp = Math.cos(phi), sp = Math.sin(phi);
  // step 1: (x1', y1')
  const dx = (x1 - x2) / 2, dy = (y1 - y2) / 2;
  const x1p = cp * dx + sp * dy;
  const y1p = -sp * dx + cp * dy;
  // F.6.6: scale up radii that cannot reach
  const lambda = (x1p * x1p) / (rx * rx) + (y1p * y1p) / (ry * ry);
  if (lambda > 1) {
    const k = Math.sqrt(lambda);
    rx *= k; ry *= k;
  }
  // step 2: (cx', cy')
  const rx2 = rx * rx, ry2 = ry * ry;
  const num = rx2 * ry2 - rx2 * y1p * y1p - ry2 * x1p * x1p;
  const den = rx2 * y1p * y1p + ry2 * x1p * x1p;
  let coef = Math.sqrt(Math.max(0, num / den));
  if (largeArc === sweep) coef = -coef;
  const cxp = (coef * rx * y1p) / ry;
  const cyp = (-coef * ry * x1p) / rx;
  // step 3: centre, found about the start point as a local origin and then moved there: the offset
  // (x1', y1', cx', cy' and the half chord) is small, so far from the origin only the final sum rounds
  // (one half-ulp of the coordinate) instead of the half-sum of the two ends and the addition both
  const cx = x1 + ((cp * cxp - sp * cyp) - dx);
  const cy = y1 + ((sp * cxp + cp * cyp) - dy);
  // step 4: angles
  const ux = (x1p - cxp) / rx, uy = (y1p - cyp) / ry;
  const vx = (-x1p - cxp) / rx, vy = (-y1p - cyp) / ry;
  const th1 = Math.atan2(uy, ux);
  let dth = Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  if (!sweep && dth > 0) dth -= 2 * Math.PI;
  else if (sweep && dth < 0) dth += 2 * Math.PI;
  const pieces = Math.abs(dth) > Math.PI * (1 + 1e-12) ? 2 : 1;
  const out: Segment[] = [];
  for (let k = 0; k < pieces; k++) {
    const a = th1 + (dth * k) / pieces, b = th1 + (dth * (k + 1)) / pieces;
    if (rx === ry) out.push({ kind: 'arc', cx, cy, r: rx, a0: a + phi, a1: b + phi });
    else out.push({ kind: 'ellipticalArc', cx, cy, rx, ry, phi, t0: a, t1: b });
  }
  return out;
}

/** Chain a segment onto a contour; a line or Bézier start is set to the exact end of the previous segment. */
function push(c: Segment[], s: Segment): void {
  if (c.length === 0) { c.push(s); return; }
  const [px, py] = segmentEnd(c[c.length - 1]);
  c.push(ops(s).moveStart(s, px, py) ?? s);
}

/** Close a contour when its end meets its start (to 1e-10 of the drawing's scale); false when it is open. */
function closeContour(c: Segment[], scale: number): boolean {
  if (c.length === 0) return true;
  const [sx, sy] = segmentStart(c[0]);
  const [ex, ey] = segmentEnd(c[c.length - 1]);
  if (ex === sx && ey === sy) return true;
  if (Math.hypot(ex - sx, ey - sy) > 1e-10 * scale) return false;
  const last = c[c.length - 1];
  c[c.length - 1] = ops(last).moveEnd(last, sx, sy) ?? last;
  return true; // an arc end within 1e-10 relative: left as is (round-off of cos/sin)
}

// ---------------------------------------------------------------------------------------------
// path data

const CMD_ARGS: Record<string, number> = { M: 2, L: 2, H: 1, V: 1, C: 6, S: 4, Q: 4, T: 2, A: 7, Z: 0 };

/**
 * Where positions are read from: user-space coordinates minus this point (see `heldAbout`). Zero except
 * while an element is read a second time about a point near it.
 */
let positionShift: readonly [number, number] = [0, 0];

/** Parse path data into closed contours (user units). `label` is e.g. `svg path#bracket`. */
export function parsePathData(d: string, label: string): Contour[] {
  const at = positionShift;
  const contours: Contour[] = [];
  let i = 0;
  const n = d.length;
  let cmdIndex = 0;
  let cur: Segment[] = [];
  let curWhere = label;
  // the current point starts at the user-space origin, which is −at about `at`
  let cx = -at[0], cy = -at[1], sx = cx, sy = cy;
  let lastCmd = '';
  let lastCtrlX = 0, lastCtrlY = 0; // second control point of the previous C/S, or the control of Q/T
  let scale = Math.max(1, Math.abs(at[0]), Math.abs(at[1])); // the closing tolerance of the absolute reading
  let started = false;
  const skipWsp = () => { while (i < n && /[\s,]/.test(d[i])) i++; };
  const skipSpaceOnly = () => { while (i < n && /\s/.test(d[i])) i++; };
  const err = (detail: string) => new InputError(`${label} command ${cmdIndex} (character ${i})`, detail);
  const readNumber = (): number => {
    skipWsp();
    const m = NUMBER_RE.exec(d.slice(i, i + 64));
    if (!m) throw err(`expected a number, got ${i < n ? `"${d.slice(i, i + 10)}"` : 'the end of the path data'}`);
    i += m[0].length;
    const v = Number(m[0]);
    if (!Number.isFinite(v)) throw err(`number ${m[0]} is out of range`);
    return v;
  };
  const readFlag = (): boolean => {
    skipWsp();
    const c = d[i];
    if (c !== '0' && c !== '1') throw err(`expected an arc flag 0 or 1, got ${i < n ? `"${c}"` : 'the end of the path data'}`);
    i++;
    return c === '1';
  };
  const finishSubpath = () => {
    if (cur.length === 0) return;
    // an open subpath is kept as an open contour (a marking line); the interpretation decides its role
    const closed = closeContour(cur, scale);
    contours.push({ segments: cur, where: curWhere, closed });
    cur = [];
  };
  const addSeg = (s: Segment) => {
    push(cur, s);
    const [ex, ey] = segmentEnd(cur[cur.length - 1]);
    scale = Math.max(scale, Math.abs(ex), Math.abs(ey));
  };
  skipSpaceOnly();
  while (i < n) {
    const c = d[i];
    const up = c.toUpperCase();
    if (!(up in CMD_ARGS) || !/[A-Za-z]/.test(c)) {
      cmdIndex++;
      throw new InputError(`${label} command ${cmdIndex} (character ${i})`, `unknown path command "${c}"; expected one of M L H V C S Q T A Z (or m l h v c s q t a z)`);
    }
    cmdIndex++;
    const rel = c !== up;
    i++;
    if (!started && up !== 'M') throw err(`path data must begin with a moveto (M or m), got "${c}"`);
    started = true;
    let first = true;
    let cmd = up;
    // one command letter may carry several argument groups (implicit repeats)
    for (;;) {
      if (cmd === 'Z') {
        if (cur.length > 0) {
          const [ex, ey] = segmentEnd(cur[cur.length - 1]);
          if (ex !== sx || ey !== sy) {
            if (Math.hypot(ex - sx, ey - sy) > 1e-10 * scale) addSeg(line(ex, ey, sx, sy));
          }
          finishSubpath();
        }
        cx = sx; cy = sy;
        lastCmd = 'Z';
        break;
      }
      const ox = rel ? cx : -at[0], oy = rel ? cy : -at[1];
      switch (cmd) {
        case 'M': {
          const x = readNumber() + ox, y = readNumber() + oy;
          if (first) {
            finishSubpath();
            sx = x; sy = y;
            curWhere = `${label} command ${cmdIndex}`;
            cx = x; cy = y;
            scale = Math.max(scale, Math.abs(x), Math.abs(y));
          } else {
            if (x !== cx || y !== cy) addSeg(line(cx, cy, x, y));
            cx = x; cy = y;
          }
          break;
        }
        case 'L': {
          const x = readNumber() + ox, y = readNumber() + oy;
          if (x !== cx || y !== cy) addSeg(line(cx, cy, x, y));
          cx = x; cy = y;
          break;
        }
        case 'H': {
          const x = readNumber() + ox;
          if (x !== cx) addSeg(line(cx, cy, x, cy));
          cx = x;
          break;
        }
        case 'V': {
          const y = readNumber() + oy;
          if (y !== cy) addSeg(line(cx, cy, cx, y));
          cy = y;
          break;
        }
        case 'C':
        case 'S': {
          let x1: number, y1: number;
          if (cmd === 'C') { x1 = readNumber() + ox; y1 = readNumber() + oy; } else if (lastCmd === 'C' || lastCmd === 'S') {
            x1 = 2 * cx - lastCtrlX; y1 = 2 * cy - lastCtrlY;
          } else { x1 = cx; y1 = cy; }
          const x2 = readNumber() + ox, y2 = readNumber() + oy;
          const x = readNumber() + ox, y = readNumber() + oy;
          if (!(x === cx && y === cy && x1 === cx && y1 === cy && x2 === cx && y2 === cy)) {
            addSeg({ kind: 'cubic', x0: cx, y0: cy, x1, y1, x2, y2, x3: x, y3: y });
          }
          lastCtrlX = x2; lastCtrlY = y2;
          cx = x; cy = y;
          break;
        }
        case 'Q':
        case 'T': {
          let x1: number, y1: number;
          if (cmd === 'Q') { x1 = readNumber() + ox; y1 = readNumber() + oy; } else if (lastCmd === 'Q' || lastCmd === 'T') {
            x1 = 2 * cx - lastCtrlX; y1 = 2 * cy - lastCtrlY;
          } else { x1 = cx; y1 = cy; }
          const x = readNumber() + ox, y = readNumber() + oy;
          if (!(x === cx && y === cy && x1 === cx && y1 === cy)) {
            addSeg({ kind: 'quadratic', x0: cx, y0: cy, x1, y1, x2: x, y2: y });
          }
          lastCtrlX = x1; lastCtrlY = y1;
          cx = x; cy = y;
          break;
        }
        case 'A': {
          const rx = readNumber(), ry = readNumber(), rot = readNumber();
          const fa = readFlag(), fs = readFlag();
          const x = readNumber() + ox, y = readNumber() + oy;
          for (const s of svgArcToSegments(cx, cy, rx, ry, rot, fa, fs, x, y)) addSeg(s);
          cx = x; cy = y;
          break;
        }
      }
      lastCmd = cmd;
      first = false;
      if (cmd === 'M') cmd = 'L'; // implicit repeats after a moveto are linetos (SVG 1.1, 8.3.2)
      // another argument group follows when the next token is a number
      skipWsp();
      if (i >= n || /[A-Za-z]/.test(d[i])) break;
    }
    skipWsp();
  }
  finishSubpath();
  return contours;
}

// ---------------------------------------------------------------------------------------------
// basic shapes

/** The current viewport in user units (for percentages, SVG 2 section 8.9: x-ish of the width, y-ish of the height, others of the normalised diagonal). */
interface Viewport { w?: number; h?: number }
let currentViewport: Viewport = {};
const X_ATTRS = new Set(['x', 'cx', 'width', 'rx', 'x1', 'x2']);
const Y_ATTRS = new Set(['y', 'cy', 'height', 'ry', 'y1', 'y2']);

function percentRef(name: string, vp: Viewport): number | undefined {
  if (X_ATTRS.has(name)) return vp.w;
  if (Y_ATTRS.has(name)) return vp.h;
  return vp.w !== undefined && vp.h !== undefined ? Math.hypot(vp.w, vp.h) / Math.SQRT2 : undefined;
}

function attrNum(el: XmlElement, name: string, where: string, dflt?: number): number {
  const v = el.attrs[name];
  if (v === undefined || v.trim() === '' || v.trim() === 'auto') {
    if (dflt === undefined) throw new InputError(where, `expected attribute ${name}`);
    return dflt;
  }
  return parseLength(v, where, name, percentRef(name, currentViewport));
}

/** A position attribute (x, y, cx, cy, x1 …) as read about positionShift; `axis` 0 for x-ish, 1 for y-ish. */
function attrPos(el: XmlElement, name: string, where: string, axis: 0 | 1): number {
  return attrNum(el, name, where, 0) - positionShift[axis];
}

function pointsList(el: XmlElement, where: string): [number, number][] {
  const nums = numberList(el.attrs.points ?? '', where, 'points');
  if (nums.length % 2 !== 0) throw new InputError(`${where} points`, `expected pairs of numbers, got an odd count ${nums.length}`);
  const pts: [number, number][] = [];
  const [ax, ay] = positionShift;
  for (let k = 0; k < nums.length; k += 2) {
    const p: [number, number] = [nums[k] - ax, nums[k + 1] - ay];
    const q = pts[pts.length - 1];
    if (!q || q[0] !== p[0] || q[1] !== p[1]) pts.push(p);
  }
  return pts;
}

function polyContour(pts: [number, number][], where: string): Contour {
  if (pts.length > 1 && pts[0][0] === pts[pts.length - 1][0] && pts[0][1] === pts[pts.length - 1][1]) pts.pop();
  if (pts.length < 3) throw new InputError(`${where} points`, `expected at least 3 distinct points, got ${pts.length}`);
  const segs: Segment[] = [];
  for (let k = 0; k < pts.length; k++) {
    const a = pts[k], b = pts[(k + 1) % pts.length];
    segs.push(line(a[0], a[1], b[0], b[1]));
  }
  return { segments: segs, where, closed: true };
}

function shapeContours(el: XmlElement, tag: string, where: string): Contour[] {
  switch (tag) {
    case 'path': {
      const d = el.attrs.d;
      if (d === undefined || d.trim() === '' || d.trim() === 'none') return [];
      return parsePathData(d, where);
    }
    case 'rect': {
      const x = attrPos(el, 'x', where, 0), y = attrPos(el, 'y', where, 1);
      const w = attrNum(el, 'width', where), h = attrNum(el, 'height', where);
      if (w < 0 || h < 0) throw new InputError(where, `expected a non-negative width and height, got ${w} and ${h}`);
      if (w === 0 || h === 0) return []; // "a value of zero disables rendering" (SVG 1.1, 9.2)
      const hasRx = el.attrs.rx !== undefined && el.attrs.rx.trim() !== 'auto';
      const hasRy = el.attrs.ry !== undefined && el.attrs.ry.trim() !== 'auto';
      let rx = hasRx ? attrNum(el, 'rx', where) : 0, ry = hasRy ? attrNum(el, 'ry', where) : 0;
      if (rx < 0 || ry < 0) throw new InputError(where, `expected non-negative rx and ry, got ${rx} and ${ry}`);
      if (hasRx && !hasRy) ry = rx;
      if (hasRy && !hasRx) rx = ry;
      rx = Math.min(rx, w / 2); ry = Math.min(ry, h / 2);
      if (rx === 0 || ry === 0) return [polyContour([[x, y], [x + w, y], [x + w, y + h], [x, y + h]], where)];
      const segs: Segment[] = [];
      const corner = (ccx: number, ccy: number, a: number) => {
        const s: Segment = rx === ry
          ? { kind: 'arc', cx: ccx, cy: ccy, r: rx, a0: a, a1: a + Math.PI / 2 }
          : { kind: 'ellipticalArc', cx: ccx, cy: ccy, rx, ry, phi: 0, t0: a, t1: a + Math.PI / 2 };
        if (segs.length > 0) {
          const [px, py] = segmentEnd(segs[segs.length - 1]);
          const [qx, qy] = segmentStart(s);
          if (Math.hypot(qx - px, qy - py) > 1e-12 * Math.max(w, h)) segs.push(line(px, py, qx, qy));
        }
        segs.push(s);
      };
      // in user coordinates (y down): top-right, bottom-right, bottom-left, top-left corners
      corner(x + w - rx, y + ry, -Math.PI / 2);
      corner(x + w - rx, y + h - ry, 0);
      corner(x + rx, y + h - ry, Math.PI / 2);
      corner(x + rx, y + ry, Math.PI);
      const [px, py] = segmentEnd(segs[segs.length - 1]);
      const [qx, qy] = segmentStart(segs[0]);
      if (Math.hypot(qx - px, qy - py) > 1e-12 * Math.max(w, h)) segs.push(line(px, py, qx, qy));
      return [{ segments: segs, where, closed: true }];
    }
    case 'circle': {
      const ccx = attrPos(el, 'cx', where, 0), ccy = attrPos(el, 'cy', where, 1), r = attrNum(el, 'r', where, 0);
      if (r < 0) throw new InputError(where, `expected a non-negative r, got ${r}`);
      if (r === 0) return [];
      return [{ where, closed: true, segments: [
        { kind: 'arc', cx: ccx, cy: ccy, r, a0: 0, a1: Math.PI },
        { kind: 'arc', cx: ccx, cy: ccy, r, a0: Math.PI, a1: 2 * Math.PI },
      ] }];
    }
    case 'ellipse': {
      const ccx = attrPos(el, 'cx', where, 0), ccy = attrPos(el, 'cy', where, 1);
      let rx = attrNum(el, 'rx', where, NaN), ry = attrNum(el, 'ry', where, NaN);
      if (Number.isNaN(rx)) rx = ry; // SVG 2: auto takes the other radius
      if (Number.isNaN(ry)) ry = rx;
      if (Number.isNaN(rx)) return [];
      if (rx < 0 || ry < 0) throw new InputError(where, `expected non-negative rx and ry, got ${rx} and ${ry}`);
      if (rx === 0 || ry === 0) return [];
      if (rx === ry) {
        return [{ where, closed: true, segments: [
          { kind: 'arc', cx: ccx, cy: ccy, r: rx, a0: 0, a1: Math.PI },
          { kind: 'arc', cx: ccx, cy: ccy, r: rx, a0: Math.PI, a1: 2 * Math.PI },
        ] }];
      }
      return [{ where, closed: true, segments: [
        { kind: 'ellipticalArc', cx: ccx, cy: ccy, rx, ry, phi: 0, t0: 0, t1: Math.PI },
        { kind: 'ellipticalArc', cx: ccx, cy: ccy, rx, ry, phi: 0, t0: Math.PI, t1: 2 * Math.PI },
      ] }];
    }
    case 'polygon':
      return [polyContour(pointsList(el, where), where)];
    case 'polyline': {
      const pts = pointsList(el, where);
      const a = pts[0], b = pts[pts.length - 1];
      if (pts.length >= 4 && a[0] === b[0] && a[1] === b[1]) return [polyContour(pts, where)];
      if (pts.length < 2) return [];
      const segs: Segment[] = [];
      for (let k = 0; k + 1 < pts.length; k++) segs.push(line(pts[k][0], pts[k][1], pts[k + 1][0], pts[k + 1][1]));
      return [{ segments: segs, where, closed: false }];
    }
    case 'line': {
      const x1 = attrPos(el, 'x1', where, 0), y1 = attrPos(el, 'y1', where, 1), x2 = attrPos(el, 'x2', where, 0), y2 = attrPos(el, 'y2', where, 1);
      if (x1 === x2 && y1 === y2) return [];
      return [{ segments: [line(x1, y1, x2, y2)], where, closed: false }];
    }
    default:
      return [];
  }
}

// ---------------------------------------------------------------------------------------------
// the document

export const SVG_NS = 'http://www.w3.org/2000/svg';
const INKSCAPE_NS = 'http://www.inkscape.org/namespaces/inkscape';
const XLINK_NS = 'http://www.w3.org/1999/xlink';

/** Containers never drawn directly (their content is drawn only through <use>, or never). */
const NOT_RENDERED = new Set([
  'defs', 'clipPath', 'mask', 'symbol', 'pattern', 'marker', 'linearGradient', 'radialGradient', 'filter',
  'metadata', 'title', 'desc', 'style', 'script', 'view', 'cursor', 'animate', 'animateTransform', 'animateMotion', 'set',
]);
/** Drawn content that is not a contour, counted under its own reason in `Drawing.ignored`. */
const IGNORED_CONTENT: Readonly<Record<string, string>> = { text: 'text', image: 'image', foreignObject: 'foreign-object' };

/** Largest depth of <use> inside <use> (through symbols); deeper chains are refused. */
export const USE_MAX_DEPTH = 32;

/** Ids that drawing programs generate (`rect234`, `path12`, `g5`, `layer1`, `use3-7`): not names. */
const GENERATED_ID = /^(?:path|rect|circle|ellipse|line|polyline|polygon|g|svg|use|symbol|text|tspan|layer|defs|image|a|clipPath|mask|group|shape|object|linearGradient|radialGradient)[-_]?\d+(?:[-_]\d+)*$/i;
export function isGeneratedId(id: string): boolean { return GENERATED_ID.test(id); }

export interface SvgDrawingOptions {
  /** One user unit is one of this unit (instead of the size the file states, or 1 CSS px when it states none). */
  units?: LengthUnit;
  /** Let `units` replace a unit the file states (width/height in mm, cm, in, pt, pc or Q); without it a contradiction is refused. */
  unitsOverride?: boolean;
  fileLabel?: string;
}

type NsScope = ReadonlyMap<string, string>;

function nsScope(el: XmlElement, parent: NsScope): NsScope {
  let out: Map<string, string> | undefined;
  for (const k in el.attrs) {
    if (k.charCodeAt(0) === 120 /* x */ && (k === 'xmlns' || k.startsWith('xmlns:'))) {
      out ??= new Map(parent);
      out.set(k === 'xmlns' ? '' : k.slice(6), el.attrs[k]);
    }
  }
  return out ?? parent;
}

/** Namespace and local name of an element. */
function resolveName(name: string, scope: NsScope): { ns: string | undefined; local: string } {
  const c = name.indexOf(':');
  if (c < 0) return { ns: scope.get(''), local: name };
  return { ns: scope.get(name.slice(0, c)), local: name.slice(c + 1) };
}

/** An attribute in a namespace (by its bound prefix), e.g. inkscape:label. */
function nsAttr(el: XmlElement, scope: NsScope, ns: string, local: string): string | undefined {
  for (const k in el.attrs) {
    const c = k.indexOf(':');
    if (c < 0 || k.length - c - 1 !== local.length || !k.endsWith(local)) continue;
    const prefix = k.slice(0, c);
    if (prefix !== 'xmlns' && scope.get(prefix) === ns) return el.attrs[k];
  }
  return undefined;
}

function titleOf(el: XmlElement, scope: NsScope): string | undefined {
  for (const c of el.children) {
    const { ns, local } = resolveName(c.name, nsScope(c, scope));
    if (ns === SVG_NS && local === 'title') {
      const t = (c.text ?? '').trim().replace(/\s+/g, ' ');
      return t === '' ? undefined : t;
    }
  }
  return undefined;
}

interface ViewBox { x: number; y: number; w: number; h: number }

function viewBoxOf(el: XmlElement, where: string): ViewBox | undefined {
  if (el.attrs.viewBox === undefined) return undefined;
  const vb = numberList(el.attrs.viewBox, where, 'viewBox');
  if (vb.length !== 4) throw new InputError(`${where} viewBox`, `expected 4 numbers (min-x min-y width height), got ${vb.length}`);
  if (!(vb[2] > 0) || !(vb[3] > 0)) throw new InputError(`${where} viewBox`, `expected a positive width and height, got ${vb[2]} and ${vb[3]}`);
  return { x: vb[0], y: vb[1], w: vb[2], h: vb[3] };
}

/** The viewBox-to-viewport transform (SVG 2, section 8.2), for a viewport at (0, 0) of size w × h. */
function viewBoxTransform(vb: ViewBox, w: number, h: number, par: string, where: string): Affine {
  const parts = par.trim().split(/\s+/).filter((x) => x !== '' && x !== 'defer');
  const align = parts[0] ?? 'xMidYMid';
  const slice = parts[1] === 'slice';
  let sx = w / vb.w, sy = h / vb.h;
  if (align !== 'none') {
    const m = /^x(Min|Mid|Max)Y(Min|Mid|Max)$/.exec(align);
    if (!m) throw new InputError(`${where} preserveAspectRatio`, `expected none or xMinYMin … xMaxYMax, got "${par}"`);
    const k = slice ? Math.max(sx, sy) : Math.min(sx, sy);
    sx = sy = k;
    const fx = m[1] === 'Min' ? 0 : m[1] === 'Mid' ? 0.5 : 1, fy = m[2] === 'Min' ? 0 : m[2] === 'Mid' ? 0.5 : 1;
    return [sx, 0, 0, sy, -vb.x * sx + fx * (w - vb.w * sx), -vb.y * sy + fy * (h - vb.h * sy)];
  }
  return [sx, 0, 0, sy, -vb.x * sx, -vb.y * sy];
}

const ABSOLUTE_UNITS = new Set(['mm', 'cm', 'in', 'pt', 'pc', 'Q']);

/** A size attribute of the root split into number and unit ('' for none); undefined when absent, auto or a percentage. */
function rootSize(root: XmlElement, name: string): { px: number; unit: string; text: string } | undefined {
  const v = root.attrs[name];
  if (v === undefined || v.trim() === '' || v.trim().endsWith('%') || v.trim() === 'auto') return undefined;
  const where = 'svg <svg>';
  const px = parseLength(v, where, name);
  if (!(px > 0)) throw new InputError(`${where} ${name}`, `expected a positive length, got "${v}"`);
  const m = NUMBER_RE.exec(v.trim());
  return { px, unit: v.trim().slice(m ? m[0].length : 0).trim(), text: v.trim() };
}

const MM_PER: Readonly<Record<LengthUnit, number>> = { mm: 1, cm: 10, m: 1000, in: 25.4, ft: 304.8 };

/**
 * The map from the root's user units to output units (y up, origin at the bottom-left of the viewBox), the
 * output unit and where it came from. The file states a unit when width or height carries an absolute unit
 * (mm, cm, in, pt, pc, Q); px or no unit is CSS px, an assumption the result reports.
 */
function rootUnits(root: XmlElement, opts: SvgDrawingOptions): { map: Affine; units: DrawingUnits; viewport: Viewport } {
  const where = 'svg <svg>';
  const vb = viewBoxOf(root, where);
  const W = rootSize(root, 'width'), H = rootSize(root, 'height');
  const stated = [W, H].find((x) => x !== undefined && ABSOLUTE_UNITS.has(x.unit));
  // millimetres per user unit along x and y, by the file (CSS px when it states no unit)
  let kx = MM_PER_PX, ky = MM_PER_PX;
  if (vb) {
    const sx = W ? (W.px * MM_PER_PX) / vb.w : undefined;
    const sy = H ? (H.px * MM_PER_PX) / vb.h : undefined;
    const par = (root.attrs.preserveAspectRatio ?? '').trim();
    if (sx !== undefined && sy !== undefined) {
      if (par.startsWith('none')) { kx = sx; ky = sy; } else if (par.endsWith('slice')) { kx = ky = Math.max(sx, sy); } else { kx = ky = Math.min(sx, sy); }
    } else if (sx !== undefined) kx = ky = sx;
    else if (sy !== undefined) kx = ky = sy;
  }
  const detail: Record<string, string | number> = {};
  if (W) detail.width = W.text;
  if (H) detail.height = H.text;
  if (vb) detail.viewBox = `${vb.x} ${vb.y} ${vb.w} ${vb.h}`;
  let units: DrawingUnits;
  let fx: number, fy: number;
  if (opts.units !== undefined) {
    if (stated) {
      const want = MM_PER[opts.units];
      const agree = Math.abs(kx - want) <= 1e-9 * want && Math.abs(ky - want) <= 1e-9 * want;
      if (!agree && !opts.unitsOverride) {
        const fmt = (v: number) => Number(v.toPrecision(9)).toString();
        throw new InputError(`${where} ${stated === W ? 'width' : 'height'}`, `the file states ${stated === W ? 'width' : 'height'}="${stated.text}"${vb ? ` over a viewBox of ${stated === W ? vb.w : vb.h}` : ''}, so one user unit is ${fmt(kx)} mm, but the units option says 1 ${opts.units}; drop the option or confirm it with the units override`);
      }
      units = { unit: opts.units, source: agree ? 'file' : 'option', detail };
    } else {
      units = { unit: opts.units, source: 'option', detail };
    }
    fx = fy = 1;
  } else if (stated) {
    units = { unit: 'mm', source: 'file', detail };
    fx = kx; fy = ky;
  } else {
    units = { unit: 'mm', source: 'assumed', detail: { ...detail, assumed: 'css-px' } };
    fx = kx; fy = ky;
  }
  let map: Affine;
  if (vb) map = [fx, 0, 0, -fy, -vb.x * fx, (vb.y + vb.h) * fy];
  else if (H !== undefined) map = [fx, 0, 0, -fy, 0, H.px * fy];
  else map = [fx, 0, 0, -fy, 0, 0];
  const viewport: Viewport = vb ? { w: vb.w, h: vb.h } : { w: W?.px, h: H?.px };
  return { map, units, viewport };
}

interface Frame {
  el: XmlElement;
  m: Affine;
  scope: NsScope;
  css: Computed;
  hidden?: HiddenReason;
  layer?: string;
  /** Name of the nearest named group (not a layer). */
  groupName?: string;
  viewport: Viewport;
  /** Ids of the <use> chain that led here (cycle and depth checks). */
  useChain: string[];
  /** True for the root's direct children (top-level groups may be layers). */
  topLevel: boolean;
  /** Where prefix for elements reached through <use>. */
  via?: string;
}

const PRESENTATION: readonly CascadedProperty[] = ['display', 'visibility', 'stroke', 'fill'];

function checkInvertible(m: Affine, where: string): void {
  const det = m[0] * m[3] - m[1] * m[2];
  if (!(Math.abs(det) > 1e-300) || !m.every(Number.isFinite)) {
    throw new InputError(`${where} transform`, 'the transform flattens the drawing (zero determinant); expected an invertible transform');
  }
}

/** Read an SVG document into a Drawing: every contour with its layer, name, colour and visibility; no roles decided. */
/** Box of drawn contours (drawing units). */
function contoursBox(contours: Segment[][]): Box {
  return contours.reduce<Box>((b, c) => unionBox(b, loopBox({ segments: c })), [Infinity, Infinity, -Infinity, -Infinity]);
}

/**
 * An element's contours held about `origin` (drawing units): read again with user-space positions taken
 * about a point near them (exact there: see siteOrigin), then mapped by the element's matrix with its
 * translation carried to that point, so only small numbers are ever rounded. The matrix's own translation
 * is rounded once, as in the absolute reading; it moves the whole element alike. Undefined for a contour
 * whose second reading differs in shape (it then goes without), or for all when that reading fails.
 */
function heldAbout(el: XmlElement, tag: string, where: string, shapes: Contour[], m: Affine, origin: [number, number]): (Segment[] | undefined)[] | undefined {
  const at = siteOrigin(contoursBox(shapes.map((c) => c.segments))) ?? [0, 0];
  let again: Contour[];
  positionShift = at;
  try {
    again = shapeContours(el, tag, where);
  } catch (e) {
    if (e instanceof InputError) return undefined;
    throw e;
  } finally {
    positionShift = [0, 0];
  }
  if (again.length !== shapes.length) return undefined;
  const mt = carriedTo(m, at, origin);
  return again.map((c, k) => {
    const a = shapes[k];
    if (c.closed !== a.closed || c.segments.length !== a.segments.length || c.segments.some((sg, i) => sg.kind !== a.segments[i].kind)) return undefined;
    return c.segments.map((sg) => transformSegment(sg, mt));
  });
}

export function readSvgDrawing(text: string, opts: SvgDrawingOptions = {}): Drawing {
  /** The point contours are also held about (undefined until the first drawn element decides; null: none). */
  let origin: [number, number] | null | undefined;
  const label = opts.fileLabel ?? 'svg';
  const keepText = new Set(['style', 'title', 'svg:style', 'svg:title']);
  const root = parseXml(text, { maxChars: XML_MAX_CHARS, maxDepth: XML_MAX_DEPTH, keepText }, 'svg');
  let rootScope = nsScope(root, new Map());
  const rootName = resolveName(root.name, rootScope);
  if (rootName.local !== 'svg') throw new InputError('svg', `expected the root element <svg>, got <${root.name}>`);
  if (rootName.ns === undefined && !root.name.includes(':')) {
    // a file without xmlns: browsers would not draw it as SVG, but drawing programs read it; take it as SVG
    rootScope = new Map([...rootScope, ['', SVG_NS]]);
  } else if (rootName.ns !== SVG_NS) {
    throw new InputError('svg <svg>', `the root element is in namespace "${rootName.ns ?? 'none'}", not SVG (${SVG_NS})`);
  }
  const { map, units, viewport } = rootUnits(root, opts);
  checkInvertible(map, 'svg <svg>');
  const ignored: Record<string, number> = {};
  const count = (k: string) => { ignored[k] = (ignored[k] ?? 0) + 1; };

  // ids, style sheets and (only when there is a sheet) the node tree css-select walks
  const byId = new Map<string, { el: XmlElement; scope: NsScope }>();
  const sheet = new StyleSheet();
  const scopes = new Map<XmlElement, NsScope>();
  {
    const st: { el: XmlElement; scope: NsScope }[] = [{ el: root, scope: rootScope }];
    while (st.length > 0) {
      const { el, scope } = st.pop()!;
      const sc = el === root ? scope : nsScope(el, scope);
      scopes.set(el, sc);
      const id = el.attrs.id;
      if (id !== undefined && !byId.has(id)) byId.set(id, { el, scope: sc });
      const { ns, local } = resolveName(el.name, sc);
      if (ns === SVG_NS && local === 'style') {
        const type = (el.attrs.type ?? 'text/css').trim().toLowerCase();
        if (type === 'text/css' || type === '') sheet.add(el.text ?? '', `svg style${id ? `#${id}` : ''}`);
        continue;
      }
      for (let k = el.children.length - 1; k >= 0; k--) st.push({ el: el.children[k], scope: sc });
    }
  }
  const nodes = new Map<XmlElement, CssNode>();
  if (!sheet.empty) {
    const make = (el: XmlElement, parent: CssNode | null): CssNode => {
      const n: CssNode = { el, name: resolveName(el.name, scopes.get(el) ?? rootScope).local, parent, children: [] };
      nodes.set(el, n);
      return n;
    };
    const st: CssNode[] = [make(root, null)];
    while (st.length > 0) {
      const n = st.pop()!;
      for (const c of n.el.children) { const cn = make(c, n); n.children.push(cn); st.push(cn); }
    }
  }
  const hasInkscapeLayers = (() => {
    const st = [root];
    while (st.length > 0) {
      const el = st.pop()!;
      if ((el.name === 'g' || el.name.endsWith(':g')) && nsAttr(el, scopes.get(el) ?? rootScope, INKSCAPE_NS, 'groupmode') === 'layer') return true;
      for (const c of el.children) st.push(c);
    }
    return false;
  })();

  const computeCss = (el: XmlElement, parent: Computed, where: string): { css: Computed; cssTransform?: string } => {
    const pres: Computed = {};
    let any = false;
    for (const p of PRESENTATION) if (el.attrs[p] !== undefined) { pres[p] = el.attrs[p]; any = true; }
    if (!any && sheet.empty && el.attrs.style === undefined) {
      // nothing declared here: the inherited properties pass through, the others take their initial value
      return { css: parent.visibility === undefined && parent.stroke === undefined && parent.fill === undefined ? {} : { visibility: parent.visibility, stroke: parent.stroke, fill: parent.fill } };
    }
    const css = cascade(nodes.get(el), sheet, pres, el.attrs.style, parent, where);
    return { css, cssTransform: css.transform };
  };

  const contours: DrawnContour[] = [];
  const counters = new Map<string, number>();
  const rootCss = computeCss(root, {}, 'svg <svg>').css;
  const rootHidden: HiddenReason | undefined = rootCss.display?.toLowerCase() === 'none' ? 'display-none' : undefined;
  const stack: Frame[] = [];
  for (let k = root.children.length - 1; k >= 0; k--) {
    stack.push({ el: root.children[k], m: map, scope: rootScope, css: rootCss, hidden: rootHidden, viewport, useChain: [], topLevel: true });
  }
  while (stack.length > 0) {
    const f = stack.pop()!;
    const el = f.el;
    const scope = nsScope(el, f.scope);
    const { ns, local: tag } = resolveName(el.name, scope);
    if (ns !== SVG_NS) { count('foreign-namespace'); continue; }
    if (NOT_RENDERED.has(tag)) continue;
    const n = (counters.get(tag) ?? 0) + 1;
    counters.set(tag, n);
    const id = el.attrs.id;
    const where = `${f.via ?? 'svg'} ${tag}${id ? `#${id}` : `[${n}]`}`;
    if (IGNORED_CONTENT[tag] !== undefined) { count(IGNORED_CONTENT[tag]); continue; }
    const { css, cssTransform: cssT } = computeCss(el, f.css, where);
    let hidden = f.hidden;
    if (css.display?.toLowerCase() === 'none') hidden ??= 'display-none';
    // the element's own transform: the CSS property (style sheet or style attribute) wins over the attribute
    let m = f.m;
    if (cssT !== undefined) {
      let t = cssTransformMatrix(cssT, where);
      if (css['transform-origin'] !== undefined) {
        const [ox, oy] = cssTransformOrigin(css['transform-origin'], where, CSS_PX_PER);
        t = composeAffine(composeAffine([1, 0, 0, 1, ox, oy], t), [1, 0, 0, 1, -ox, -oy]);
      }
      m = composeAffine(m, t);
    } else if (el.attrs.transform !== undefined) {
      m = composeAffine(m, parseTransform(el.attrs.transform, where));
    }
    checkInvertible(m, where);
    const childFrame = (c: XmlElement, extra: Partial<Frame> = {}): Frame => ({
      el: c, m, scope, css, hidden, layer: f.layer, groupName: f.groupName, viewport: f.viewport, useChain: f.useChain, topLevel: false, via: f.via, ...extra,
    });
    const ownName = titleOf(el, scope) ?? nsAttr(el, scope, INKSCAPE_NS, 'label') ?? (id !== undefined && !isGeneratedId(id) ? id : undefined);

    if (tag === 'g' || tag === 'a') {
      let layer = f.layer, groupName = f.groupName;
      const isLayer = tag === 'g' && (nsAttr(el, scope, INKSCAPE_NS, 'groupmode') === 'layer'
        || (!hasInkscapeLayers && f.topLevel && f.layer === undefined && ownName !== undefined));
      if (isLayer) layer = nsAttr(el, scope, INKSCAPE_NS, 'label') ?? ownName ?? id ?? `${where}`;
      else if (ownName !== undefined) groupName = ownName;
      for (let k = el.children.length - 1; k >= 0; k--) stack.push(childFrame(el.children[k], { layer, groupName }));
      continue;
    }
    if (tag === 'switch') throw new InputError(where, '<switch> is not supported; keep only the alternative to be cut');
    if (tag === 'svg') {
      // a nested viewport (SVG 2, 8.2): x, y, width, height (percentages of the enclosing viewport), viewBox
      const vp = f.viewport;
      currentViewport = vp;
      const x = attrNum(el, 'x', where, 0), y = attrNum(el, 'y', where, 0);
      const w = el.attrs.width !== undefined ? attrNum(el, 'width', where) : vp.w;
      const h = el.attrs.height !== undefined ? attrNum(el, 'height', where) : vp.h;
      const vb = viewBoxOf(el, where);
      let mm = composeAffine(m, [1, 0, 0, 1, x, y]);
      if (vb) {
        if (w === undefined || h === undefined) throw new InputError(where, 'a nested <svg> with a viewBox needs a width and height (or an enclosing viewport)');
        mm = composeAffine(mm, viewBoxTransform(vb, w, h, el.attrs.preserveAspectRatio ?? '', where));
      }
      checkInvertible(mm, where);
      const inner: Viewport = vb ? { w: vb.w, h: vb.h } : { w, h };
      for (let k = el.children.length - 1; k >= 0; k--) stack.push({ ...childFrame(el.children[k]), m: mm, viewport: inner });
      continue;
    }
    if (tag === 'use') {
      const href = el.attrs.href ?? nsAttr(el, scope, XLINK_NS, 'href') ?? el.attrs['xlink:href'];
      if (href === undefined || href.trim() === '') { count('use-without-reference'); continue; }
      const ref = href.trim();
      if (!ref.startsWith('#')) throw new InputError(`${where} href`, `only references into the same file (#id) are read, got "${ref}"`);
      const target = byId.get(ref.slice(1));
      if (!target) throw new InputError(`${where} href`, `no element has id "${ref.slice(1)}"`);
      if (f.useChain.includes(ref)) throw new InputError(`${where} href`, `refers back to ${ref} through ${[...f.useChain, ref].join(' → ')}; a <use> chain must not loop`);
      if (f.useChain.length >= USE_MAX_DEPTH) throw new InputError(`${where} href`, `<use> elements nest more than ${USE_MAX_DEPTH} deep`);
      currentViewport = f.viewport;
      const x = attrNum(el, 'x', where, 0), y = attrNum(el, 'y', where, 0);
      let mu = composeAffine(m, [1, 0, 0, 1, x, y]);
      const chain = [...f.useChain, ref];
      const via = `${where} → ${ref}:`;
      const tScope = target.scope;
      const tn = resolveName(target.el.name, tScope);
      if (tn.ns !== SVG_NS) { count('foreign-namespace'); continue; }
      const named = { groupName: ownName ?? f.groupName };
      if (tn.local === 'symbol' || tn.local === 'svg') {
        // the referenced viewport: use's width/height, else the symbol's, else 100 % (SVG 2, 5.6.2)
        const tw = el.attrs.width ?? target.el.attrs.width, th = el.attrs.height ?? target.el.attrs.height;
        const w = tw !== undefined ? parseLength(tw, where, 'width', f.viewport.w) : f.viewport.w;
        const h = th !== undefined ? parseLength(th, where, 'height', f.viewport.h) : f.viewport.h;
        const vb = viewBoxOf(target.el, `svg ${tn.local}${ref}`);
        if (tn.local === 'svg') {
          currentViewport = f.viewport;
          mu = composeAffine(mu, [1, 0, 0, 1, attrNum(target.el, 'x', where, 0), attrNum(target.el, 'y', where, 0)]);
        }
        if (vb) {
          if (w === undefined || h === undefined) throw new InputError(where, `${ref} has a viewBox but no size is given (width and height on <use>)`);
          mu = composeAffine(mu, viewBoxTransform(vb, w, h, target.el.attrs.preserveAspectRatio ?? '', where));
        }
        if (target.el.attrs.transform !== undefined) mu = composeAffine(mu, parseTransform(target.el.attrs.transform, `svg ${tn.local}${ref}`));
        checkInvertible(mu, where);
        const symCss = computeCss(target.el, css, `svg ${tn.local}${ref}`).css;
        const symHidden = hidden ?? (symCss.display?.toLowerCase() === 'none' && tn.local === 'svg' ? 'display-none' : undefined);
        const inner: Viewport = vb ? { w: vb.w, h: vb.h } : { w, h };
        const sc = nsScope(target.el, tScope);
        for (let k = target.el.children.length - 1; k >= 0; k--) {
          stack.push({ ...childFrame(target.el.children[k]), m: mu, css: symCss, hidden: symHidden, scope: sc, viewport: inner, useChain: chain, via, ...named });
        }
      } else {
        checkInvertible(mu, where);
        const parentScope = target.scope; // the target's own xmlns attributes are applied again when it is popped
        stack.push({ ...childFrame(target.el), m: mu, scope: parentScope, useChain: chain, via, ...named });
      }
      continue;
    }
    currentViewport = f.viewport;
    const shapes = shapeContours(el, tag, where);
    if (shapes.length === 0) continue;
    const vis = css.visibility?.toLowerCase();
    const shapeHidden: HiddenReason | undefined = hidden ?? (vis === 'hidden' || vis === 'collapse' ? 'visibility-hidden' : undefined);
    const stroke = css.stroke?.trim();
    const colour = stroke !== undefined && stroke.toLowerCase() !== 'none' ? stroke : css.fill?.trim();
    const name = ownName ?? f.groupName;
    const drawn = shapes.map((c) => c.segments.map((sq) => transformSegment(sq, m)));
    // far from the origin, the element is read again about a point near it (the first element far out
    // fixes the drawing's origin): arc centres and transformed points are then made where they are small
    if (origin === undefined) origin = siteOrigin(contoursBox(drawn));
    const local = origin === null ? undefined : heldAbout(el, tag, where, shapes, m, origin);
    shapes.forEach((c, k) => {
      const segs = drawn[k];
      const dc: DrawnContour = { segments: segs, closed: c.closed, where: c.where };
      if (local?.[k] !== undefined) dc.local = local[k];
      if (f.layer !== undefined) dc.layer = f.layer;
      if (colour !== undefined) dc.colour = colour;
      if (name !== undefined) dc.name = name;
      if (shapeHidden !== undefined) dc.hidden = shapeHidden;
      if (id !== undefined) dc.sources = [id];
      contours.push(dc);
    });
  }
  currentViewport = {};
  if (sheet.unsupportedSelectors > 0) ignored['css-selector-unsupported'] = sheet.unsupportedSelectors;
  const drawing: Drawing = { format: 'svg', label, units, contours, ignored };
  if (origin) drawing.origin = origin;
  const docName = titleOf(root, rootScope);
  if (docName !== undefined) drawing.name = docName;
  return drawing;
}

function cssTransformMatrix(v: string, where: string): Affine {
  return cssTransform(v, where, CSS_PX_PER);
}

export interface SvgOptions extends SvgDrawingOptions, InterpretOptions {}

/** Read an SVG drawing into parts (the drawing read, then interpreted by the shared rules). */
export function readSvg(text: string, opts: SvgOptions = {}): Part[] {
  return interpretDrawing(readSvgDrawing(text, opts), opts).parts;
}
