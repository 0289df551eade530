/**
 * DXF reader: ASCII DXF (R12 to 2018) → Drawing (read/drawing.ts).
 *
 * Reads LINE, ARC, CIRCLE, LWPOLYLINE and 2-D/3-D POLYLINE (bulges → exact circular arcs), ELLIPSE
 * (→ exact elliptical arcs), SPLINE (→ exact Bézier pieces, dxfSpline.ts) and INSERT (nested block
 * references with base point, scale, mirror, rotation and row/column arrays), all in model space. Object
 * coordinate systems follow the arbitrary-axis algorithm (AutoCAD DXF Reference, "Arbitrary Axis
 * Algorithm"); an extrusion that does not keep the entity parallel to the XY plane is refused. Everything
 * else (text, dimensions, hatches, points, paper space, viewports, 3-D bodies, …) is skipped and counted in
 * `ignored` by a reason key. Loose pieces are joined per layer by geometry/join.ts.
 *
 * Limits: the tokenizer caps group codes; block nesting depth MAX_DEPTH; segments after block expansion
 * MAX_SEGMENTS; entity instances visited MAX_INSTANCES. Block expansion uses an explicit stack.
 */
import { InputError } from '../base/errors.js';
import { type JoinIssue, type JoinPiece, joinPieces } from '../geometry/join.js';
import { loopBox, siteOrigin } from '../geometry/part.js';
import { type Segment, ops } from '../geometry/segments.js';
import { type Affine, IDENTITY, carriedTo, composeAffine, transformSegment } from '../geometry/transform.js';
import type { LengthUnit } from '../base/units.js';
import type { Drawing, JoinFinding, DrawingUnits, DrawnContour, HiddenReason, JoinGap } from './drawing.js';
import { type DxfEntity, type DxfFile, type DxfLayer, findValue, parseDxfStructure } from './dxfStructure.js';
import { splineToSegments } from './dxfSpline.js';
import { type DxfTags, tokenizeDxf } from './dxfTags.js';

export interface ReadDxfOptions {
  units?: LengthUnit;
  fileLabel?: string;
  /** Join tolerance in drawing units (default: geometry/join.ts defaultJoinTolerance). */
  joinTolerance?: number;
}

export const MAX_DEPTH = 16;
export const MAX_SEGMENTS = 1_000_000;
export const MAX_INSTANCES = 4_000_000;

/** $INSUNITS codes read (AutoCAD DXF Reference, HEADER section, $INSUNITS). */
const INSUNITS: Readonly<Record<number, LengthUnit>> = { 1: 'in', 2: 'ft', 4: 'mm', 5: 'cm', 6: 'm' };
const INSUNITS_NAMES: Readonly<Record<number, string>> = {
  3: 'miles', 7: 'kilometres', 8: 'microinches', 9: 'mils', 10: 'yards', 11: 'angstroms', 12: 'nanometres',
  13: 'microns', 14: 'decimetres', 15: 'decametres', 16: 'hectometres', 17: 'gigametres', 18: 'astronomical units',
  19: 'light years', 20: 'parsecs', 21: 'US survey feet', 22: 'US survey inches', 23: 'US survey yards', 24: 'US survey miles',
};

/** Entity types skipped, by reason key. */
const IGNORED: Readonly<Record<string, string>> = {
  TEXT: 'text', MTEXT: 'text', ATTRIB: 'text', ATTDEF: 'text', SHAPE: 'text', RTEXT: 'text',
  DIMENSION: 'dimension', ARC_DIMENSION: 'dimension', LARGE_RADIAL_DIMENSION: 'dimension',
  HATCH: 'hatch', MPOLYGON: 'hatch', SOLID: 'solid-fill', TRACE: 'solid-fill',
  POINT: 'point',
  LEADER: 'leader', MLEADER: 'leader', MULTILEADER: 'leader', TOLERANCE: 'leader',
  VIEWPORT: 'viewport',
  '3DFACE': '3d', '3DSOLID': '3d', BODY: '3d', REGION: '3d', SURFACE: '3d', MESH: '3d',
  EXTRUDEDSURFACE: '3d', LOFTEDSURFACE: '3d', REVOLVEDSURFACE: '3d', SWEPTSURFACE: '3d', PLANESURFACE: '3d', NURBSURFACE: '3d',
  IMAGE: 'image', WIPEOUT: 'image', OLE2FRAME: 'image', OLEFRAME: 'image',
  PDFUNDERLAY: 'image', DWFUNDERLAY: 'image', DGNUNDERLAY: 'image',
  XLINE: 'construction-line', RAY: 'construction-line',
  ACAD_TABLE: 'table', ACAD_PROXY_ENTITY: 'proxy', LIGHT: '3d', SUN: '3d',
};

/** A piece before joining, with what the drawing says about it. */
export interface DxfPiece extends JoinPiece {
  /** A closed piece's segments held about the drawing's origin (Drawing.origin, DrawnContour.local). */
  local?: Segment[];
  colour?: number | string;
  hidden?: HiddenReason;
  /** Block name for content of block references. */
  block?: string;
}

export interface DxfReadResult {
  drawing: Drawing;
  /** Every joining finding (including duplicates, overlaps and branches, which Drawing has no slot for). */
  issues: JoinIssue[];
  pieces: DxfPiece[];
}

export function readDxf(text: string, opts: ReadDxfOptions = {}): Drawing {
  return readDxfFull(text, opts).drawing;
}

export function readDxfFull(text: string, opts: ReadDxfOptions = {}): DxfReadResult {
  const label = opts.fileLabel ?? 'dxf';
  const tags = tokenizeDxf(text, label);
  const file = parseDxfStructure(tags, label);
  const units = resolveUnits(file, label, opts.units);
  const ignored: Record<string, number> = {};
  const held: Held = {};
  const pieces = expand(file, label, ignored, held);
  const keys = pieces.map((p) => `${p.layer ?? ''}\u0000${p.hidden ?? ''}`);
  const joined = joinPieces(pieces.map((p, i) => ({ ...p, layer: keys[i] })), opts.joinTolerance);
  if (joined.dropped.length > 0) ignored['duplicate'] = (ignored['duplicate'] ?? 0) + joined.dropped.length;
  const contours: DrawnContour[] = joined.contours.map((c) => {
    const first = pieces[c.pieces[0]];
    const sources: string[] = [];
    for (const i of c.pieces) for (const s of pieces[i].sources ?? []) sources.push(s);
    const out: DrawnContour = {
      segments: c.segments,
      closed: c.closed,
      where: c.pieces.length === 1 ? first.where : `${first.where} + ${c.pieces.length - 1} more`,
      sources,
    };
    if (first.layer !== undefined) out.layer = first.layer;
    if (first.colour !== undefined) out.colour = first.colour;
    if (first.block !== undefined) out.name = first.block;
    if (first.hidden) out.hidden = first.hidden;
    // a closed piece taken whole keeps its local segments (a contour joined from pieces goes without)
    if (c.pieces.length === 1 && first.local !== undefined && first.local.length === c.segments.length) out.local = first.local;
    return out;
  });
  const gaps: JoinGap[] = [];
  for (const is of joined.issues) {
    if (is.kind === 'gap-bridged' || is.kind === 'gap-open') {
      const a = pieces[is.pieces[0]], b = pieces[is.pieces[1]];
      gaps.push({ x: is.x, y: is.y, gap: is.gap, closed: is.kind === 'gap-bridged', where: a === b ? a.where : `${a.where} / ${b.where}`, layer: a.layer });
    } else if (is.kind === 'dangling') {
      const a = pieces[is.piece];
      gaps.push({ x: is.x, y: is.y, gap: 0, closed: false, where: a.where, layer: a.layer });
    }
  }
  const findings: JoinFinding[] = [];
  for (const is of joined.issues) {
    if (is.kind === 'overlap' || is.kind === 'duplicate' || is.kind === 'branch') {
      const ps = is.pieces.map((k) => pieces[k]);
      const f: JoinFinding = { finding: is.kind, x: is.x, y: is.y, where: ps.map((q) => q.where).join(' / '), sources: ps.flatMap((q) => q.sources ?? []) };
      if (is.kind === 'overlap') f.length = is.length;
      if (ps[0]?.layer !== undefined) f.layer = ps[0].layer;
      findings.push(f);
    }
  }
  const drawing: Drawing = { format: 'dxf', label, units, contours, ignored, join: { tolerance: joined.tolerance, gaps, findings } };
  if (held.origin) drawing.origin = held.origin;
  return { drawing, issues: joined.issues, pieces };
}

// ---------------------------------------------------------------------------------------------
// units

function resolveUnits(file: DxfFile, label: string, option: LengthUnit | undefined): DrawingUnits {
  const h = file.header.get('$INSUNITS')?.find((g) => g.code === 70);
  const code = h ? Number(h.value) : 0;
  if (!Number.isInteger(code)) throw new InputError(`${label} line ${h!.line}`, `$INSUNITS is not an integer: "${h!.value}"`);
  const unit = INSUNITS[code];
  if (unit) {
    const detail: Record<string, string | number> = { insunits: code };
    if (option !== undefined && option !== unit) detail.option = option;
    return { unit, source: 'file', detail };
  }
  if (code !== 0) {
    if (option) return { unit: option, source: 'option', detail: { insunits: code } };
    throw new InputError(`${label} header $INSUNITS`, `unit code ${code} (${INSUNITS_NAMES[code] ?? 'unknown'}) is not read (in, ft, mm, cm, m are); give --units`);
  }
  if (!option) throw new InputError(label, 'the DXF states no unit ($INSUNITS); give --units');
  return { unit: option, source: 'option', detail: { insunits: 0 } };
}

// ---------------------------------------------------------------------------------------------
// block expansion

interface Frame {
  entities: DxfEntity[];
  m: Affine;
  depth: number;
  /** Upper-case names of the blocks being expanded, outermost first. */
  chain: string[];
  /** Layer and colour that layer-0 / BYBLOCK content inherits; undefined at top level. */
  layer?: string;
  colour?: number | string;
  frozen: boolean;
  handlePath: string;
  wherePrefix: string;
  block?: string;
}

/** The point closed pieces are also held about (undefined until the first closed piece decides; null: none). */
interface Held { origin?: [number, number] | null }

/**
 * A closed piece's segments about the drawing's origin: rebuilt by `rebuild` from positions taken about a
 * point near the piece (a polyline's bulge centres are made there) and mapped by m carried to that point;
 * without a rebuild (circles, arcs, ellipses: their centres are given, not made) the segments moved by
 * the origin. Undefined when the rebuilt segments differ in kind.
 */
function heldPiece(abs: Segment[], segs: Segment[], m: Affine, origin: [number, number], rebuild?: (at: readonly [number, number]) => Segment[]): Segment[] | undefined {
  if (rebuild === undefined) return abs.map((sg) => ops(sg).translate(sg, -origin[0], -origin[1]));
  const at = siteOrigin(loopBox({ segments: segs })) ?? [0, 0];
  const again = rebuild(at);
  if (again.length !== abs.length || again.some((sg, i) => sg.kind !== segs[i].kind)) return undefined;
  const mt = carriedTo(m, at, origin);
  return again.map((sg) => transformSegment(sg, mt));
}

function expand(file: DxfFile, label: string, ignored: Record<string, number>, held: Held): DxfPiece[] {
  const t = file.tags;
  const pieces: DxfPiece[] = [];
  const count = (key: string, k = 1) => { ignored[key] = (ignored[key] ?? 0) + k; };
  for (const b of file.blocks.values()) {
    if (b.name.toUpperCase().startsWith('*PAPER_SPACE') && b.entities.length > 0) count('paper-space', b.entities.length);
  }
  let segCount = 0, instances = 0;
  const stack: Frame[] = [{ entities: file.entities, m: IDENTITY, depth: 0, chain: [], frozen: false, handlePath: '', wherePrefix: '' }];
  while (stack.length > 0) {
    const fr = stack.pop()!;
    for (const ent of fr.entities) {
      if (++instances > MAX_INSTANCES) throw new InputError(label, `more than ${MAX_INSTANCES} entities after expanding block references (limit)`);
      const paper = findValue(t, ent.start, ent.end, 67);
      if (paper !== undefined && Number(paper) === 1) { count('paper-space'); continue; }
      const layerName = ent.layer === '0' && fr.layer !== undefined ? fr.layer : ent.layer;
      const layer = file.layers.get(layerName.toUpperCase());
      const colour = entityColour(t, ent, layer, fr.colour);
      const hidden: HiddenReason | undefined = fr.frozen || (layer && (layer.flags & 1)) ? 'layer-frozen' : layer && layer.colour < 0 ? 'layer-off' : undefined;
      const where = `dxf ${ent.type} #${ent.handle || '?'}${fr.wherePrefix} layer ${layerName}`;
      const at = `${where} (line ${ent.line})`;
      const source = fr.handlePath + (ent.handle || '?');
      const ocs = () => ocsMap(t, ent, at);
      const emit = (segs: Segment[], closed: boolean, local: Affine, rebuild?: (at: readonly [number, number]) => Segment[]) => {
        if (segs.length === 0) { count('zero-length'); return; }
        segCount += segs.length;
        if (segCount > MAX_SEGMENTS) throw new InputError(label, `more than ${MAX_SEGMENTS} segments after expanding block references (limit)`);
        const m = composeAffine(fr.m, local);
        const p: DxfPiece = { segments: segs.map((s) => transformSegment(s, m)), where, sources: [source], closed, layer: layerName, colour };
        if (closed) {
          // far from the origin the first closed piece fixes a point the drawing is also held about
          if (held.origin === undefined) held.origin = siteOrigin(loopBox(p));
          if (held.origin) p.local = heldPiece(p.segments, segs, m, held.origin, rebuild);
        }
        if (hidden) p.hidden = hidden;
        if (fr.block !== undefined) p.block = fr.block;
        pieces.push(p);
      };
      switch (ent.type) {
        case 'LINE': {
          const x0 = num(t, ent, 10, 0, at), y0 = num(t, ent, 20, 0, at), x1 = num(t, ent, 11, 0, at), y1 = num(t, ent, 21, 0, at);
          if (x0 === x1 && y0 === y1) { count('zero-length'); break; }
          emit([{ kind: 'line', x0, y0, x1, y1 }], false, IDENTITY);
          break;
        }
        case 'CIRCLE': {
          const cx = num(t, ent, 10, 0, at), cy = num(t, ent, 20, 0, at), r = num(t, ent, 40, 0, at);
          if (r < 0) throw new InputError(at, `CIRCLE radius must be positive, got ${r}`);
          if (r === 0) { count('zero-length'); break; }
          emit([{ kind: 'arc', cx, cy, r, a0: 0, a1: 2 * Math.PI }], true, ocs());
          break;
        }
        case 'ARC': {
          const cx = num(t, ent, 10, 0, at), cy = num(t, ent, 20, 0, at), r = num(t, ent, 40, 0, at);
          const s = num(t, ent, 50, 0, at), e = num(t, ent, 51, 360, at);
          if (r < 0) throw new InputError(at, `ARC radius must be positive, got ${r}`);
          if (r === 0) { count('zero-length'); break; }
          // counter-clockwise about the extrusion from s to e; equal angles make a full circle
          let sweep = e - s;
          sweep -= 360 * Math.floor(sweep / 360);
          if (sweep === 0) sweep = 360;
          const a0 = (s * Math.PI) / 180, a1 = ((s + sweep) * Math.PI) / 180;
          emit([{ kind: 'arc', cx, cy, r, a0, a1 }], sweep === 360, ocs());
          break;
        }
        case 'LWPOLYLINE': {
          const xs: number[] = [], ys: number[] = [], bs: number[] = [];
          for (let k = ent.start; k < ent.end; k++) {
            const c = t.codes[k];
            if (c === 1001) break;
            if (c === 10) { xs.push(val(t, k, at)); ys.push(0); bs.push(0); } else if (c === 20 && ys.length > 0) ys[ys.length - 1] = val(t, k, at);
            else if (c === 42 && bs.length > 0) bs[bs.length - 1] = val(t, k, at);
          }
          const closed = (num(t, ent, 70, 0, at) & 1) === 1;
          emit(polylineSegments(xs, ys, bs, closed, at), closed, ocs(), (o) => polylineSegments(xs.map((x) => x - o[0]), ys.map((y) => y - o[1]), bs, closed, at));
          break;
        }
        case 'POLYLINE': {
          const flags = num(t, ent, 70, 0, at);
          if (flags & (16 | 64)) { count('3d'); break; }
          const xs: number[] = [], ys: number[] = [], bs: number[] = [];
          for (const v of ent.children ?? []) {
            const vat = `dxf VERTEX #${v.handle || '?'} of ${where} (line ${v.line})`;
            const vf = num(t, v, 70, 0, vat);
            if (vf & 16) continue; // spline frame control point: not on the curve
            xs.push(num(t, v, 10, 0, vat)); ys.push(num(t, v, 20, 0, vat)); bs.push(flags & 8 ? 0 : num(t, v, 42, 0, vat));
          }
          const closed = (flags & 1) === 1;
          emit(polylineSegments(xs, ys, bs, closed, at), closed, flags & 8 ? IDENTITY : ocs(), (o) => polylineSegments(xs.map((x) => x - o[0]), ys.map((y) => y - o[1]), bs, closed, at));
          break;
        }
        case 'ELLIPSE': {
          const [seg, full] = ellipseSegment(t, ent, at);
          emit([seg], full, IDENTITY);
          break;
        }
        case 'SPLINE': {
          emit(splineSegments(t, ent, at), false, IDENTITY);
          break;
        }
        case 'INSERT': {
          const name = findValue(t, ent.start, ent.end, 2) ?? '';
          const key = name.toUpperCase();
          const block = file.blocks.get(key);
          if (!block) throw new InputError(at, `INSERT refers to block "${name}", which the BLOCKS section does not define`);
          if (block.flags & 4) { count('xref'); break; }
          if (fr.chain.includes(key)) throw new InputError(at, `block "${name}" refers to itself (through ${fr.chain.map((c) => file.blocks.get(c)?.name ?? c).join(' > ')})`);
          if (fr.depth + 1 > MAX_DEPTH) throw new InputError(at, `block references nested deeper than ${MAX_DEPTH} (limit)`);
          const px = num(t, ent, 10, 0, at), py = num(t, ent, 20, 0, at);
          const sx = num(t, ent, 41, 1, at), sy = num(t, ent, 42, 1, at), rot = num(t, ent, 50, 0, at);
          const cols = Math.max(1, Math.trunc(num(t, ent, 70, 1, at))), rows = Math.max(1, Math.trunc(num(t, ent, 71, 1, at)));
          const cs = num(t, ent, 44, 0, at), rs = num(t, ent, 45, 0, at);
          if (sx === 0 || sy === 0) throw new InputError(at, `INSERT scale factor is 0 (x ${sx}, y ${sy})`);
          if (cols * rows > MAX_SEGMENTS) throw new InputError(at, `INSERT array of ${cols} × ${rows} references (limit ${MAX_SEGMENTS})`);
          const c = cosDeg(rot), s = sinDeg(rot);
          const E = ocs();
          const insertLayer = layerName;
          const frozen = hidden === 'layer-frozen';
          const insertColour = colour;
          const frames: Frame[] = [];
          for (let r = 0; r < rows; r++) {
            for (let q = 0; q < cols; q++) {
              const ox = q * cs, oy = r * rs;
              // E · T(P) · R(rot) · T(ox, oy) · S(sx, sy) · T(−B)
              const local: Affine = [c * sx, s * sx, -s * sy, c * sy,
                px + c * (ox - sx * block.baseX) - s * (oy - sy * block.baseY),
                py + s * (ox - sx * block.baseX) + c * (oy - sy * block.baseY)];
              const arr = cols * rows > 1 ? ` [${q},${r}]` : '';
              frames.push({
                entities: block.entities,
                m: composeAffine(fr.m, composeAffine(E, local)),
                depth: fr.depth + 1,
                chain: [...fr.chain, key],
                layer: insertLayer,
                colour: insertColour,
                frozen,
                handlePath: `${source}${arr ? `[${q},${r}]` : ''}/`,
                wherePrefix: ` in block ${block.name} (INSERT #${ent.handle || '?'}${arr})${fr.wherePrefix}`,
                block: block.name,
              });
            }
          }
          for (let k = frames.length - 1; k >= 0; k--) stack.push(frames[k]);
          break;
        }
        default:
          count(IGNORED[ent.type] ?? `unsupported:${ent.type}`);
      }
    }
  }
  return pieces;
}

function entityColour(t: DxfTags, ent: DxfEntity, layer: DxfLayer | undefined, byBlock: number | string | undefined): number | string {
  const tc = findValue(t, ent.start, ent.end, 420);
  if (tc !== undefined && Number.isFinite(Number(tc))) return '#' + (Number(tc) & 0xffffff).toString(16).padStart(6, '0');
  const v = findValue(t, ent.start, ent.end, 62);
  const c = v === undefined ? 256 : Number(v);
  if (c === 0) return byBlock ?? 7; // BYBLOCK
  if (c === 256 || !Number.isFinite(c)) {
    if (layer?.trueColour !== undefined) return '#' + (layer.trueColour & 0xffffff).toString(16).padStart(6, '0');
    return Math.abs(layer?.colour ?? 7); // BYLAYER
  }
  return Math.abs(c);
}

// ---------------------------------------------------------------------------------------------
// values

function val(t: DxfTags, k: number, at: string): number {
  const v = Number(t.values[k]);
  if (!Number.isFinite(v) || t.values[k] === '') throw new InputError(`${at.replace(/ \(line \d+\)$/, '')} (line ${t.lines[k]})`, `group ${t.codes[k]} should be a number, got "${t.values[k].slice(0, 30)}"`);
  return v;
}

function num(t: DxfTags, ent: DxfEntity, code: number, def: number, at: string): number {
  for (let k = ent.start; k < ent.end; k++) {
    const c = t.codes[k];
    if (c === 1001) break;
    if (c === 102) { // application group "{NAME … }": skip
      if (t.values[k].startsWith('{')) { while (k + 1 < ent.end && !(t.codes[k + 1] === 102 && t.values[k + 1] === '}')) k++; k++; }
      continue;
    }
    if (c === code) return val(t, k, at);
  }
  return def;
}

const DEG = Math.PI / 180;
/** cos and sin of an angle in degrees, exact at multiples of 90°. */
function cosDeg(a: number): number {
  const r = a - 360 * Math.floor(a / 360);
  return r === 0 ? 1 : r === 90 ? 0 : r === 180 ? -1 : r === 270 ? 0 : Math.cos(a * DEG);
}
function sinDeg(a: number): number {
  const r = a - 360 * Math.floor(a / 360);
  return r === 0 ? 0 : r === 90 ? 1 : r === 180 ? 0 : r === 270 ? -1 : Math.sin(a * DEG);
}

/**
 * Map from an entity's object coordinate system to world XY by the arbitrary-axis algorithm: with N the
 * unit extrusion, Ax = Wy × N if |Nx| < 1/64 and |Ny| < 1/64, else Wz × N; Ay = N × Ax. Only extrusions
 * along ±Z keep the entity in a plane parallel to XY: (0, 0, 1) is the identity, (0, 0, −1) gives Ax = −X,
 * Ay = Y (x → −x). Others are refused.
 */
function ocsMap(t: DxfTags, ent: DxfEntity, at: string): Affine {
  const nx = num(t, ent, 210, 0, at), ny = num(t, ent, 220, 0, at), nz = num(t, ent, 230, 1, at);
  return extrusionMap(nx, ny, nz, at);
}

export function extrusionMap(nx: number, ny: number, nz: number, at: string): Affine {
  const len = Math.hypot(nx, ny, nz);
  if (!(len > 0)) throw new InputError(at, 'extrusion direction (210/220/230) is zero');
  const Nx = nx / len, Ny = ny / len, Nz = nz / len;
  if (Math.abs(Nx) > 1e-12 || Math.abs(Ny) > 1e-12) {
    throw new InputError(at, `extrusion direction (${nx}, ${ny}, ${nz}) puts the entity outside the XY plane; only drawings in the XY plane are read`);
  }
  const sz = Nz > 0 ? 1 : -1;
  // |Nx|, |Ny| < 1/64: Ax = Wy × N = (Nz, 0, −Nx) → (sz, 0, 0); Ay = N × Ax = (0, sz·sz, 0) = (0, 1, 0)
  return [sz, 0, 0, 1, 0, 0];
}

// ---------------------------------------------------------------------------------------------
// entity geometry

/**
 * Polyline vertices with bulges → lines and exact arcs. Bulge b = tan(θ/4), θ the arc's sweep, positive
 * counter-clockwise (AutoCAD DXF Reference, LWPOLYLINE group 42). For a chord of length d the centre lies
 * d/2 · (1 − b²)/(2b) to the left of the chord's midpoint (cot(θ/2) = (1 − b²)/(2b)); radius
 * d (1 + b²)/(4|b|). Zero-length steps are dropped.
 */
export function polylineSegments(xs: number[], ys: number[], bs: number[], closed: boolean, at: string): Segment[] {
  const n = xs.length;
  const segs: Segment[] = [];
  const steps = closed ? n : n - 1;
  for (let i = 0; i < steps; i++) {
    const j = (i + 1) % n;
    const x0 = xs[i], y0 = ys[i], x1 = xs[j], y1 = ys[j], b = bs[i];
    const dx = x1 - x0, dy = y1 - y0, d = Math.hypot(dx, dy);
    if (d === 0) continue;
    if (!Number.isFinite(b)) throw new InputError(at, `vertex ${i + 1} has a bulge that is not a number`);
    if (b === 0) { segs.push({ kind: 'line', x0, y0, x1, y1 }); continue; }
    const k = (1 - b * b) / (4 * b);
    const cx = (x0 + x1) / 2 - dy * k, cy = (y0 + y1) / 2 + dx * k;
    const r = (d * (1 + b * b)) / (4 * Math.abs(b));
    const a0 = Math.atan2(y0 - cy, x0 - cx);
    segs.push({ kind: 'arc', cx, cy, r, a0, a1: a0 + 4 * Math.atan(b) });
  }
  return segs;
}

/**
 * ELLIPSE: centre and major-axis end point in WCS, ratio minor/major, parameters 41/42 (radians).
 * The curve is c + cos t · M + sin t · ratio · (N × M) with N the extrusion (AutoCAD DXF Reference, ELLIPSE),
 * so for N = −Z the parameter runs clockwise in XY: t → −t.
 */
function ellipseSegment(t: DxfTags, ent: DxfEntity, at: string): [Segment, boolean] {
  const cx = num(t, ent, 10, 0, at), cy = num(t, ent, 20, 0, at);
  const mx = num(t, ent, 11, 0, at), my = num(t, ent, 21, 0, at);
  const ratio = num(t, ent, 40, 1, at);
  const s = num(t, ent, 41, 0, at);
  let e = num(t, ent, 42, 2 * Math.PI, at);
  const E = ocsMap(t, ent, at);
  const rx = Math.hypot(mx, my);
  if (!(rx > 0)) throw new InputError(at, 'ELLIPSE major axis has zero length');
  if (!(ratio > 0)) throw new InputError(at, `ELLIPSE axis ratio must be positive, got ${ratio}`);
  const TWO_PI = 2 * Math.PI;
  while (e <= s) e += TWO_PI;
  let full = false;
  if (e - s >= TWO_PI - 1e-12 * TWO_PI) { e = s + TWO_PI; full = true; }
  const phi = Math.atan2(my, mx);
  const flip = E[0] < 0;
  const seg: Segment = { kind: 'ellipticalArc', cx, cy, rx, ry: ratio * rx, phi, t0: flip ? -s : s, t1: flip ? -e : e };
  return [seg, full];
}

function splineSegments(t: DxfTags, ent: DxfEntity, at: string): Segment[] {
  const flags = num(t, ent, 70, 0, at);
  const degree = num(t, ent, 71, 3, at);
  const knots: number[] = [], pts: number[] = [], weights: number[] = [];
  let nFit = 0;
  for (let k = ent.start; k < ent.end; k++) {
    const c = t.codes[k];
    if (c === 1001) break;
    if (c === 40) knots.push(val(t, k, at));
    else if (c === 41) weights.push(val(t, k, at));
    else if (c === 10) pts.push(val(t, k, at), 0);
    else if (c === 20 && pts.length > 0) pts[pts.length - 1] = val(t, k, at);
    else if (c === 11) nFit++;
  }
  if (flags & 8) ocsMap(t, ent, at); // planar spline: its plane must be parallel to XY
  if (pts.length === 0) {
    throw new InputError(at, nFit > 0 ? 'SPLINE is defined by fit points only (no control points); save it with control points' : 'SPLINE has no control points');
  }
  const res = splineToSegments({ degree, knots, points: pts, weights: weights.length > 0 ? weights : undefined });
  if (!res.ok) throw new InputError(at, `SPLINE not read: ${res.reason}`);
  return res.segments;
}
