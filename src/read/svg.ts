/**
 * SVG reader: every closed contour in the drawing is a cut line; nesting decides what is material.
 * A contour inside another is a cut-out, a contour inside a cut-out is a new part.
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
import { nestLoops } from '../geometry/nesting.js';
import { type Loop, type Part, normalizePart } from '../geometry/part.js';
import { type Segment, ops, segmentEnd, segmentStart } from '../geometry/segments.js';
import { type Affine, IDENTITY, composeAffine, transformSegment } from '../geometry/transform.js';
import type { LengthUnit } from '../base/units.js';
import { type XmlElement, XML_MAX_CHARS, XML_MAX_DEPTH, parseXml } from './xml.js';

export interface SvgOptions {
  /** Take the drawing's numbers (user units) as lengths in this unit, ignoring width/height; the part uses it. */
  units?: LengthUnit;
  /** Used in part names and messages (e.g. the file name). */
  fileLabel?: string;
}

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

/** Elements whose content is never drawn directly. */
const SKIPPED = new Set([
  'defs', 'clipPath', 'mask', 'symbol', 'pattern', 'marker', 'linearGradient', 'radialGradient', 'filter',
  'metadata', 'title', 'desc', 'text', 'style', 'script', 'foreignObject', 'image',
]);

// ---------------------------------------------------------------------------------------------
// numbers, lengths, transforms

const NUMBER_RE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/;

/** A length attribute in user units (px); absolute units accepted, % and font-relative units rejected. */
function parseLength(v: string, where: string, what: string): number {
  const s = v.trim();
  const m = NUMBER_RE.exec(s);
  if (!m) throw new InputError(where, `${what}: expected a length such as 12, 12px or 3mm, got "${v}"`);
  const num = Number(m[0]);
  if (!Number.isFinite(num)) throw new InputError(where, `${what}: number ${m[0]} is out of range`);
  const unit = s.slice(m[0].length).trim();
  if (unit === '') return num;
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
  // step 3: centre
  const cx = cp * cxp - sp * cyp + (x1 + x2) / 2;
  const cy = sp * cxp + cp * cyp + (y1 + y2) / 2;
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

/** Parse path data into closed contours (user units). `label` is e.g. `svg path#bracket`. */
export function parsePathData(d: string, label: string): Contour[] {
  const contours: Contour[] = [];
  let i = 0;
  const n = d.length;
  let cmdIndex = 0;
  let cur: Segment[] = [];
  let curWhere = label;
  let subStartCmd = 0, subStartChar = 0;
  let cx = 0, cy = 0, sx = 0, sy = 0;
  let lastCmd = '';
  let lastCtrlX = 0, lastCtrlY = 0; // second control point of the previous C/S, or the control of Q/T
  let scale = 1;
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
    if (!closeContour(cur, scale)) {
      const [ex, ey] = segmentEnd(cur[cur.length - 1]);
      throw new InputError(
        `${label} command ${subStartCmd} (character ${subStartChar})`,
        `open contour: the subpath ends at (${ex}, ${ey}) (command ${cmdIndex}), not at its start (${sx}, ${sy}); expected a closed contour (end it with Z)`,
      );
    }
    contours.push({ segments: cur, where: curWhere });
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
      const ox = rel ? cx : 0, oy = rel ? cy : 0;
      switch (cmd) {
        case 'M': {
          const x = readNumber() + ox, y = readNumber() + oy;
          if (first) {
            finishSubpath();
            sx = x; sy = y; subStartCmd = cmdIndex; subStartChar = i;
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

function attrNum(el: XmlElement, name: string, where: string, dflt?: number): number {
  const v = el.attrs[name];
  if (v === undefined || v.trim() === '' || v.trim() === 'auto') {
    if (dflt === undefined) throw new InputError(where, `expected attribute ${name}`);
    return dflt;
  }
  return parseLength(v, where, name);
}

function pointsList(el: XmlElement, where: string): [number, number][] {
  const nums = numberList(el.attrs.points ?? '', where, 'points');
  if (nums.length % 2 !== 0) throw new InputError(`${where} points`, `expected pairs of numbers, got an odd count ${nums.length}`);
  const pts: [number, number][] = [];
  for (let k = 0; k < nums.length; k += 2) {
    const p: [number, number] = [nums[k], nums[k + 1]];
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
  return { segments: segs, where };
}

function shapeContours(el: XmlElement, tag: string, where: string): Contour[] {
  switch (tag) {
    case 'path': {
      const d = el.attrs.d;
      if (d === undefined || d.trim() === '' || d.trim() === 'none') return [];
      return parsePathData(d, where);
    }
    case 'rect': {
      const x = attrNum(el, 'x', where, 0), y = attrNum(el, 'y', where, 0);
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
      return [{ segments: segs, where }];
    }
    case 'circle': {
      const ccx = attrNum(el, 'cx', where, 0), ccy = attrNum(el, 'cy', where, 0), r = attrNum(el, 'r', where, 0);
      if (r < 0) throw new InputError(where, `expected a non-negative r, got ${r}`);
      if (r === 0) return [];
      return [{ where, segments: [
        { kind: 'arc', cx: ccx, cy: ccy, r, a0: 0, a1: Math.PI },
        { kind: 'arc', cx: ccx, cy: ccy, r, a0: Math.PI, a1: 2 * Math.PI },
      ] }];
    }
    case 'ellipse': {
      const ccx = attrNum(el, 'cx', where, 0), ccy = attrNum(el, 'cy', where, 0);
      let rx = attrNum(el, 'rx', where, NaN), ry = attrNum(el, 'ry', where, NaN);
      if (Number.isNaN(rx)) rx = ry; // SVG 2: auto takes the other radius
      if (Number.isNaN(ry)) ry = rx;
      if (Number.isNaN(rx)) return [];
      if (rx < 0 || ry < 0) throw new InputError(where, `expected non-negative rx and ry, got ${rx} and ${ry}`);
      if (rx === 0 || ry === 0) return [];
      if (rx === ry) {
        return [{ where, segments: [
          { kind: 'arc', cx: ccx, cy: ccy, r: rx, a0: 0, a1: Math.PI },
          { kind: 'arc', cx: ccx, cy: ccy, r: rx, a0: Math.PI, a1: 2 * Math.PI },
        ] }];
      }
      return [{ where, segments: [
        { kind: 'ellipticalArc', cx: ccx, cy: ccy, rx, ry, phi: 0, t0: 0, t1: Math.PI },
        { kind: 'ellipticalArc', cx: ccx, cy: ccy, rx, ry, phi: 0, t0: Math.PI, t1: 2 * Math.PI },
      ] }];
    }
    case 'polygon':
      return [polyContour(pointsList(el, where), where)];
    case 'polyline': {
      const pts = pointsList(el, where);
      const a = pts[0], b = pts[pts.length - 1];
      if (pts.length < 2 || a[0] !== b[0] || a[1] !== b[1]) {
        throw new InputError(where, `open contour: a polyline must end at its first point (${a ? `${a[0]}, ${a[1]}` : 'none'}) to be a cut line; use a polygon or repeat the first point`);
      }
      return [polyContour(pts, where)];
    }
    case 'line':
      throw new InputError(where, 'open contour: a <line> cannot bound material; expected closed shapes (path with Z, polygon, rect, circle, ellipse)');
    default:
      return [];
  }
}

// ---------------------------------------------------------------------------------------------
// the document

function localName(name: string): string | undefined {
  if (name.startsWith('svg:')) return name.slice(4);
  return name.includes(':') ? undefined : name;
}

/** Map from the root's user units to output units (y up, origin at the viewBox's bottom-left) and the output unit. */
function viewportMap(root: XmlElement, opts: SvgOptions): { map: Affine; units: LengthUnit } {
  const where = 'svg <svg>';
  let vb: number[] | undefined;
  if (root.attrs.viewBox !== undefined) {
    vb = numberList(root.attrs.viewBox, where, 'viewBox');
    if (vb.length !== 4) throw new InputError(`${where} viewBox`, `expected 4 numbers (min-x min-y width height), got ${vb.length}`);
    if (!(vb[2] > 0) || !(vb[3] > 0)) throw new InputError(`${where} viewBox`, `expected a positive width and height, got ${vb[2]} and ${vb[3]}`);
  }
  const absLength = (name: string): number | undefined => {
    const v = root.attrs[name];
    if (v === undefined || v.trim() === '' || v.trim().endsWith('%') || v.trim() === 'auto') return undefined;
    const px = parseLength(v, where, name);
    if (!(px > 0)) throw new InputError(`${where} ${name}`, `expected a positive length, got "${v}"`);
    return px;
  };
  const wPx = absLength('width'), hPx = absLength('height');
  let kx: number, ky: number, units: LengthUnit;
  if (opts.units) {
    kx = ky = 1; units = opts.units;
  } else {
    units = 'mm';
    kx = ky = MM_PER_PX;
    if (vb) {
      const sx = wPx !== undefined ? (wPx * MM_PER_PX) / vb[2] : undefined;
      const sy = hPx !== undefined ? (hPx * MM_PER_PX) / vb[3] : undefined;
      const par = (root.attrs.preserveAspectRatio ?? '').trim();
      if (sx !== undefined && sy !== undefined) {
        if (par.startsWith('none')) { kx = sx; ky = sy; } else if (par.endsWith('slice')) { kx = ky = Math.max(sx, sy); } else { kx = ky = Math.min(sx, sy); }
      } else if (sx !== undefined) kx = ky = sx;
      else if (sy !== undefined) kx = ky = sy;
    }
  }
  let map: Affine;
  if (vb) map = [kx, 0, 0, -ky, -vb[0] * kx, (vb[1] + vb[3]) * ky];
  else if (hPx !== undefined) map = [kx, 0, 0, -ky, 0, hPx * ky];
  else map = [kx, 0, 0, -ky, 0, 0];
  if (root.attrs.transform !== undefined) map = composeAffine(map, parseTransform(root.attrs.transform, where));
  return { map, units };
}

/** Read an SVG drawing into parts (one per piece of material). */
export function readSvg(text: string, opts: SvgOptions = {}): Part[] {
  const label = opts.fileLabel ?? 'svg';
  const root = parseXml(text, { maxChars: XML_MAX_CHARS, maxDepth: XML_MAX_DEPTH }, 'svg');
  if (localName(root.name) !== 'svg') throw new InputError('svg', `expected the root element <svg>, got <${root.name}>`);
  const { map, units } = viewportMap(root, opts);

  const counters = new Map<string, number>();
  const loops: Loop[] = [];
  const idOf = new Map<Loop, string>();
  // iterative walk (the XML depth limit also bounds this stack)
  const stack: { el: XmlElement; m: Affine }[] = root.children.map((el) => ({ el, m: map })).reverse();
  while (stack.length > 0) {
    const { el, m: parentM } = stack.pop()!;
    const tag = localName(el.name);
    if (tag === undefined || SKIPPED.has(tag)) continue;
    const count = (counters.get(tag) ?? 0) + 1;
    counters.set(tag, count);
    const id = el.attrs.id;
    const where = `svg ${tag}${id ? `#${id}` : `[${count}]`}`;
    if ((el.attrs.display ?? '').trim() === 'none') continue;
    const m = el.attrs.transform !== undefined ? composeAffine(parentM, parseTransform(el.attrs.transform, where)) : parentM;
    const det = m[0] * m[3] - m[1] * m[2];
    if (!(Math.abs(det) > 1e-300) || !m.every(Number.isFinite)) {
      throw new InputError(`${where} transform`, 'the transform flattens the drawing (zero determinant); expected an invertible transform');
    }
    if (tag === 'g' || tag === 'a') {
      for (let k = el.children.length - 1; k >= 0; k--) stack.push({ el: el.children[k], m });
      continue;
    }
    if (tag === 'switch') throw new InputError(where, '<switch> is not supported; keep only the alternative to be cut');
    if (tag === 'use') throw new InputError(where, '<use> references are not supported; expand (unlink) them in the drawing first');
    if (tag === 'svg') throw new InputError(where, 'nested <svg> elements are not supported; expected shapes inside <g> groups');
    for (const c of shapeContours(el, tag, where)) {
      const loop: Loop = { where: c.where, segments: c.segments.map((s) => transformSegment(s, m)) };
      loops.push(loop);
      if (id) idOf.set(loop, id);
    }
  }
  if (loops.length === 0) throw new InputError('svg', 'expected at least one closed contour (path, rect, circle, ellipse, polygon), found none');

  const groups = nestLoops(loops);
  const used = new Map<string, number>();
  return groups.map((regions, k) => {
    const base = idOf.get(regions[0].outer) ?? (groups.length === 1 ? label : `${label}-${k + 1}`);
    const seen = used.get(base) ?? 0;
    used.set(base, seen + 1);
    const name = seen === 0 ? base : `${base}-${seen + 1}`;
    return normalizePart({ name, units, regions });
  });
}
