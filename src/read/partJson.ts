/**
 * Reader for the project's own part description (JSON). See README "Part description format" and
 * schema/part.schema.json. Every problem is an InputError naming the JSON path.
 */
import { InputError, MethodError, OptionError, describeValue } from '../base/errors.js';
import { checkJsonText } from '../base/jsonCheck.js';
import { type Loop, type Part, type Region, partBox, siteOrigin, withLocalFrame } from '../geometry/part.js';
import { type PathStep, type Pt, circleLoop, pathLoop, polygonLoop, rectangleLoop, slotLoop } from '../geometry/shapes.js';
import { combineShapes } from '../geometry/booleans.js';
import { MAX_PATTERN_COPIES, expandPattern, gridPoints, ringPoints } from '../geometry/patterns.js';
import { LENGTH_UNITS, type LengthUnit, isLengthUnit } from '../base/units.js';
import type { GivenSetting } from '../model/settings.js';
import { parseDensity, parseThickness } from '../model/settings.js';
import type { LayerSpec, PlateModel } from '../model/plate.js';

/** Coordinates beyond this magnitude are refused: no real plate needs them and squares would overflow. */
export const MAX_COORDINATE = 1e12;

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Obj = { [k: string]: Json };

/** Top-level keys for thickness, density and layers (read by plateModelFromObject, at the end of this file). */
const PLATE_KEYS = ['thickness', 'density', 'material', 'layers'];

const SHAPE_KINDS = ['rectangle', 'circle', 'slot', 'polygon', 'path'] as const;
/** Items of "cutouts" and "add" lists that stand for several shapes (src/geometry/patterns.ts). */
const PATTERN_KINDS = ['grid', 'ring'] as const;
const TOP_KEYS = ['$schema', 'part', 'units', 'outline', 'cutouts', 'regions', 'note', 'description', 'add', ...PLATE_KEYS];

/** Parse JSON text, turning a syntax error into an InputError with line and column. */
export function parseJsonText(text: string, label: string): unknown {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  try {
    const value: unknown = JSON.parse(text);
    checkJsonText(text, label);
    return value;
  } catch (e) {
    if (e instanceof InputError) throw e;
    const msg = (e as Error).message;
    const m = /position (\d+)/.exec(msg);
    let where = label;
    if (m) {
      const pos = Number(m[1]);
      const before = text.slice(0, pos);
      const line = before.split('\n').length;
      const col = pos - before.lastIndexOf('\n');
      where = `${label}:${line}:${col}`;
    } else if (/end of JSON/i.test(msg)) {
      const lines = text.split('\n');
      where = `${label}:${lines.length}:${lines[lines.length - 1].length + 1}`;
    }
    const detail = msg.replace(/ in JSON at position \d+.*$/, '').replace(/^Unexpected end of JSON input$/, 'the file ends too early (truncated?)');
    throw new InputError(where, `not valid JSON: ${detail}`);
  }
}

function isObj(v: unknown): v is Obj {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

export function expectObject(v: unknown, where: string): Obj {
  if (!isObj(v)) throw new InputError(where, `expected an object, got ${describeValue(v)}`);
  return v;
}

export function checkKeys(o: Obj, allowed: readonly string[], where: string): void {
  for (const k of Object.keys(o)) {
    if (!allowed.includes(k)) {
      throw new InputError(where ? `${where}.${k}` : k, `unknown key; expected one of ${allowed.filter((a) => !a.startsWith('$')).join(', ')}`);
    }
  }
}

export function expectNumber(v: unknown, where: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(where, `expected a number, got ${describeValue(v)}`);
  return v;
}

export function expectPositive(v: unknown, where: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || !(v > 0)) throw new InputError(where, `expected a positive number, got ${describeValue(v)}`);
  return v;
}

export function expectCoordinate(v: unknown, where: string): number {
  const n = expectNumber(v, where);
  if (Math.abs(n) > MAX_COORDINATE) throw new InputError(where, `coordinate ${n} is out of range (magnitude at most ${MAX_COORDINATE})`);
  return n;
}

export function expectPoint(v: unknown, where: string): Pt {
  if (!Array.isArray(v) || v.length !== 2) throw new InputError(where, `expected a point [x, y], got ${describeValue(v)}`);
  return [expectCoordinate(v[0], `${where}[0]`), expectCoordinate(v[1], `${where}[1]`)];
}

/**
 * A position (not a size or pitch) relative to `at`, the point the part is being held about (see LocalFrame
 * in src/geometry/part.ts): x − at is exact for the coordinates of the part it was chosen for.
 */
function expectPosition(v: unknown, where: string, at: Pt | undefined): Pt {
  const p = expectPoint(v, where);
  return at === undefined ? p : [p[0] - at[0], p[1] - at[1]];
}

function expectArray(v: unknown, where: string): unknown[] {
  if (!Array.isArray(v)) throw new InputError(where, `expected an array, got ${describeValue(v)}`);
  return v;
}

/** Read one SHAPE object into an exact loop; positions relative to `at` when given. */
export function readShape(v: unknown, where: string, at?: Pt): Loop {
  const o = expectObject(v, where);
  const keys = Object.keys(o);
  if (keys.length !== 1 || !(SHAPE_KINDS as readonly string[]).includes(keys[0])) {
    throw new InputError(where, `expected exactly one of ${SHAPE_KINDS.join(', ')}, got ${keys.length ? keys.map((k) => `"${k}"`).join(', ') : 'an empty object'}`);
  }
  const kind = keys[0];
  const w = `${where}.${kind}`;
  const body = o[kind];
  switch (kind) {
    case 'rectangle': {
      const b = expectObject(body, w);
      checkKeys(b, ['corner', 'size', 'cornerRadius'], w);
      const corner = expectPosition(b.corner, `${w}.corner`, at);
      const size = expectPoint(b.size, `${w}.size`);
      if (!(size[0] > 0)) throw new InputError(`${w}.size[0]`, `expected a positive width, got ${size[0]}`);
      if (!(size[1] > 0)) throw new InputError(`${w}.size[1]`, `expected a positive height, got ${size[1]}`);
      const r = b.cornerRadius === undefined ? 0 : expectNumber(b.cornerRadius, `${w}.cornerRadius`);
      return rectangleLoop(corner, size, r, w);
    }
    case 'circle': {
      const b = expectObject(body, w);
      checkKeys(b, ['center', 'diameter'], w);
      const c = expectPosition(b.center, `${w}.center`, at);
      const d = expectPositive(b.diameter, `${w}.diameter`);
      return circleLoop(c, d, w);
    }
    case 'slot': {
      const b = expectObject(body, w);
      checkKeys(b, ['from', 'to', 'width'], w);
      return slotLoop(expectPosition(b.from, `${w}.from`, at), expectPosition(b.to, `${w}.to`, at), expectPositive(b.width, `${w}.width`), w);
    }
    case 'polygon': {
      const pts = expectArray(body, w).map((p, i) => expectPosition(p, `${w}[${i}]`, at));
      return polygonLoop(pts, w);
    }
    case 'path': {
      const b = expectObject(body, w);
      checkKeys(b, ['start', 'segments'], w);
      const start = expectPosition(b.start, `${w}.start`, at);
      const steps: PathStep[] = expectArray(b.segments, `${w}.segments`).map((sv, i) => {
        const sw = `${w}.segments[${i}]`;
        const s = expectObject(sv, sw);
        checkKeys(s, ['to', 'center', 'turn'], sw);
        const to = expectPosition(s.to, `${sw}.to`, at);
        if (s.center === undefined) {
          if (s.turn !== undefined) throw new InputError(`${sw}.turn`, 'given without "center"; an arc needs both');
          return { to };
        }
        const center = expectPosition(s.center, `${sw}.center`, at);
        if (s.turn !== 'ccw' && s.turn !== 'cw') throw new InputError(`${sw}.turn`, `expected "ccw" or "cw", got ${describeValue(s.turn)}`);
        return { to, center, turn: s.turn };
      });
      return pathLoop(start, steps, w);
    }
  }
  throw new InputError(where, 'unreachable');
}

function expectCount(v: unknown, where: string): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < 1) throw new InputError(where, `expected a whole number of at least 1, got ${describeValue(v)}`);
  return v;
}

/**
 * Read a grid or ring pattern ({"grid": {...}} or {"ring": {...}}) into its copies. The pattern's start or
 * centre is a position (relative to `at` when given); the repeated shape is drawn about each place.
 */
function readPattern(kind: string, body: unknown, w: string, at?: Pt): Loop[] {
  const b = expectObject(body, w);
  if (kind === 'grid') {
    checkKeys(b, ['start', 'pitch', 'count', 'shape'], w);
    const start = expectPosition(b.start, `${w}.start`, at);
    const pitch = expectPoint(b.pitch, `${w}.pitch`);
    const count = expectArray(b.count, `${w}.count`);
    if (count.length !== 2) throw new InputError(`${w}.count`, `expected [columns, rows], got ${describeValue(count)}`);
    const nx = expectCount(count[0], `${w}.count[0]`), ny = expectCount(count[1], `${w}.count[1]`);
    if (nx * ny > MAX_PATTERN_COPIES) throw new InputError(`${w}.count`, `expected at most ${MAX_PATTERN_COPIES} copies, got ${nx} × ${ny}`);
    spendCopies(nx * ny, `${w}.count`);
    if (nx > 1 && pitch[0] === 0) throw new InputError(`${w}.pitch[0]`, 'expected a non-zero pitch with more than one column');
    if (ny > 1 && pitch[1] === 0) throw new InputError(`${w}.pitch[1]`, 'expected a non-zero pitch with more than one row');
    if (b.shape === undefined) throw new InputError(`${w}.shape`, 'expected the shape to repeat (missing)');
    const shape = readShape(b.shape, `${w}.shape`);
    return expandPattern(shape, gridPoints({ start: [start[0], start[1]], pitch: [pitch[0], pitch[1]], count: [nx, ny] }), false, w);
  }
  checkKeys(b, ['center', 'diameter', 'count', 'startAngle', 'step', 'rotate', 'shape'], w);
  const center = expectPosition(b.center, `${w}.center`, at);
  const diameter = expectPositive(b.diameter, `${w}.diameter`);
  const n = expectCount(b.count, `${w}.count`);
  if (n > MAX_PATTERN_COPIES) throw new InputError(`${w}.count`, `expected at most ${MAX_PATTERN_COPIES} copies, got ${n}`);
  spendCopies(n, `${w}.count`);
  const startAngle = b.startAngle === undefined ? 0 : expectNumber(b.startAngle, `${w}.startAngle`);
  const step = b.step === undefined ? undefined : expectNumber(b.step, `${w}.step`);
  if (step !== undefined && n > 1 && (step === 0 || Math.abs(step) * (n - 1) >= 360)) {
    throw new InputError(`${w}.step`, `expected a non-zero angle with ${n} − 1 steps short of a full turn (|step| < ${360 / (n - 1)}°), got ${step}`);
  }
  if (b.rotate !== undefined && typeof b.rotate !== 'boolean') throw new InputError(`${w}.rotate`, `expected true or false, got ${describeValue(b.rotate)}`);
  if (b.shape === undefined) throw new InputError(`${w}.shape`, 'expected the shape to repeat (missing)');
  const shape = readShape(b.shape, `${w}.shape`);
  const points = ringPoints({ center: [center[0], center[1]], diameter, count: n, startAngle, step });
  return expandPattern(shape, points, b.rotate === true, w);
}

/** Read a list of SHAPEs and patterns ("cutouts", "add") into loops; positions relative to `at` when given. */
export function readShapeList(v: unknown, where: string, at?: Pt): Loop[] {
  const out: Loop[] = [];
  expectArray(v, where).forEach((item, i) => {
    const w = `${where}[${i}]`;
    const o = expectObject(item, w);
    const keys = Object.keys(o);
    if (keys.length === 1 && (PATTERN_KINDS as readonly string[]).includes(keys[0])) {
      out.push(...readPattern(keys[0], o[keys[0]], `${w}.${keys[0]}`, at));
    } else if (keys.length !== 1 || !(SHAPE_KINDS as readonly string[]).includes(keys[0])) {
      throw new InputError(w, `expected exactly one of ${[...SHAPE_KINDS, ...PATTERN_KINDS].join(', ')}, got ${keys.length ? keys.map((k) => `"${k}"`).join(', ') : 'an empty object'}`);
    } else {
      out.push(readShape(o, w, at));
    }
  });
  return out;
}

function readRegion(o: Obj, where: string, at?: Pt): Region {
  if (o.outline === undefined) throw new InputError(where ? `${where}.outline` : 'outline', 'expected the outline shape (missing)');
  const p = where ? `${where}.` : '';
  const outer = readShape(o.outline, `${p}outline`, at);
  const add: Loop[] = o.add === undefined ? [] : readShapeList(o.add, `${p}add`, at);
  const holes: Loop[] = o.cutouts === undefined ? [] : readShapeList(o.cutouts, `${p}cutouts`, at);
  return combineShapes({ outline: outer, add, cutouts: holes });
}

/**
 * Read a part description. `label` names the file in messages about JSON syntax.
 * The result is not yet validated (see geometry/validate.ts) nor normalised in orientation.
 */
export function readPartJson(text: string, label = 'input'): Part {
  return partFromObject(parseJsonText(text, label), label);
}

/**
 * Shapes that the patterns of one part file may generate in all (every layer, every pattern): each copy
 * becomes exact segments, a mesh and booleans, so the budget is checked before any copy is made.
 */
export const MAX_TOTAL_PATTERN_COPIES = 250_000;
let patternCopies = 0;
let readDepth = 0;

/** Run a top-level read with a fresh pattern budget (nested reads of layers share it). */
function withBudget<T>(body: () => T): T {
  if (readDepth === 0) patternCopies = 0;
  readDepth++;
  try { return body(); } finally { readDepth--; }
}

function spendCopies(n: number, where: string): void {
  if (patternCopies + n > MAX_TOTAL_PATTERN_COPIES) {
    throw new InputError(where, `the patterns of this part would make ${patternCopies + n} shapes, more than ${MAX_TOTAL_PATTERN_COPIES} in all; split the part into several files or use fewer copies`);
  }
  patternCopies += n;
}

/** Read a part from an already-parsed JSON value. */
export function partFromObject(value: unknown, label = 'input'): Part {
  return withBudget(() => partFromObjectIn(value, label));
}

function partFromObjectIn(value: unknown, label: string): Part {
  const root = expectObject(value, label);
  checkKeys(root, TOP_KEYS, '');
  // A layered part: readers that take one Part see the first layer (the base plate); see readPlateModel.
  if (root.layers !== undefined) return plateModelFromObject(root, label).layers[0].part;
  const name = root.part === undefined ? 'part' : root.part;
  if (typeof name !== 'string' || name.length === 0) throw new InputError('part', `expected a non-empty name, got ${describeValue(name)}`);
  const units = root.units === undefined ? 'mm' : root.units;
  if (!isLengthUnit(units)) throw new InputError('units', `expected one of ${Object.keys(LENGTH_UNITS).join(', ')}, got ${describeValue(units)}`);
  for (const k of ['note', 'description'] as const) {
    if (root[k] !== undefined && typeof root[k] !== 'string') throw new InputError(k, `expected text, got ${describeValue(root[k])}`);
  }
  const regions = readRegions(root);
  const part: Part = { name, units: units as LengthUnit, regions };
  // Far from the coordinate origin the shapes are read a second time about a point near the part, where
  // constructed points (slot tangent points, rounded corners, pattern places) keep their digits; every
  // check ran on the first reading, so a second reading that fails only leaves the part without its frame.
  const at = siteOrigin(partBox(part));
  if (at === null) return part;
  const spent = patternCopies;
  try {
    return withLocalFrame(part, at, readRegions(root, at));
  } catch (e) {
    if (!(e instanceof InputError || e instanceof MethodError)) throw e;
    return part;
  } finally {
    patternCopies = spent;
  }
}

/** The regions of a part object ("regions", or "outline" with "cutouts" and "add"); positions relative to `at`. */
function readRegions(root: Obj, at?: Pt): Region[] {
  let regions: Region[];
  if (root.regions !== undefined) {
    if (root.outline !== undefined || root.cutouts !== undefined) {
      throw new InputError('regions', 'given together with "outline"/"cutouts"; use one or the other');
    }
    if (root.add !== undefined) {
      throw new InputError('add', 'given together with "regions"; give "add" inside each region instead');
    }
    const list = expectArray(root.regions, 'regions');
    if (list.length === 0) throw new InputError('regions', 'expected at least one region');
    regions = list.map((r, i) => {
      const w = `regions[${i}]`;
      const o = expectObject(r, w);
      checkKeys(o, ['outline', 'cutouts', 'add'], w);
      return readRegion(o, w, at);
    });
  } else {
    regions = [readRegion(root, '', at)];
  }
  return regions;
}


// ---------------------------------------------------------------------------------------------------------
// Thickness, density, material and layers (the plate model for mass properties).
//
// A part file may add, at the top level:
//   "thickness": 20 | "20 - 0.025*x"     (part length unit; a number or an expression in x and y)
//   "density":   7850 | "7850 + 0.1*y"   (kg/m³; number or expression) — or —
//   "material":  "steel"                  (a material id or alias; see `platewise materials`)
// or, instead of outline/cutouts/regions, a stack of layers:
//   "layers": [ { "name": "base", "outline": ..., "cutouts": [...], "thickness": 20, "material": "steel", "z": 0 },
//               { "name": "doubler", "outline": ..., "thickness": 12, "density": 7850 } ]
// Each layer has its own shape (outline + cutouts, or regions), thickness, density or material, and z: the
// height of its underside in the part's length unit (default: the first layer at 0, each next one on top
// of the previous, which then needs a constant thickness). Top-level thickness/density/material are the
// default for every layer that states none. Expressions are compiled (and their values checked) later,
// where they are integrated (src/accuracy/plate.ts); here only their type is checked.
// ---------------------------------------------------------------------------------------------------------

export type { LayerSpec, PlateModel } from '../model/plate.js';
export { singleLayerModel } from '../model/plate.js';

const LAYER_KEYS = ['name', 'outline', 'cutouts', 'regions', 'thickness', 'density', 'material', 'z', 'note'];

/** A thickness or density as written (a number, a number with a unit, or an expression), checked by the one grammar. */
function readField(v: unknown, where: string, what: 'thickness' | 'density'): GivenSetting | undefined {
  if (v === undefined) return undefined;
  if (typeof v === 'number' || (typeof v === 'string' && v.trim().length > 0)) {
    const g: GivenSetting = { text: v, where };
    if (what === 'thickness') parseThickness(g); else parseDensity(g);
    return g;
  }
  throw new InputError(where, `expected a positive ${what}: a number, a number with a unit, or an expression in x and y as text, got ${describeValue(v)}`);
}

function readMaterialName(v: unknown, where: string): GivenSetting | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== 'string' || v.trim().length === 0) throw new InputError(where, `expected a material name (see "platewise materials"), got ${describeValue(v)}`);
  return { text: v, where };
}

/** Prefix the JSON path of an InputError raised while reading a layer's shape. */
function withPrefix<T>(prefix: string, body: () => T): T {
  try {
    return body();
  } catch (e) {
    if (e instanceof InputError) throw new InputError(e.where ? `${prefix}.${e.where}` : prefix, e.detail);
    throw e;
  }
}

/** A part file as plate models; a drawing's unit option is refused (a part file states its own "units"). */
export function partFileModels(text: string, label: string, units: unknown): PlateModel[] {
  if (units !== undefined) throw new OptionError('units', 'applies to drawings (SVG, DXF, GeoJSON, WKT); a part file states its own "units"');
  return [readPlateModel(text, label)];
}

/** Read a part file with its thickness, density, material and layers. */
export function readPlateModel(text: string, label = 'input'): PlateModel {
  return plateModelFromObject(parseJsonText(text, label), label);
}

/** Read the plate model from an already-parsed JSON value. */
export function plateModelFromObject(value: unknown, label = 'input'): PlateModel {
  return withBudget(() => plateModelFromObjectIn(value, label));
}

function plateModelFromObjectIn(value: unknown, label: string): PlateModel {
  const root = expectObject(value, label);
  checkKeys(root, TOP_KEYS, '');
  const defThickness = readField(root.thickness, 'thickness', 'thickness');
  const defDensity = readField(root.density, 'density', 'density');
  const defMaterial = readMaterialName(root.material, 'material');
  if (defDensity && defMaterial) throw new InputError('material', 'given together with "density"; give one or the other');
  if (root.layers === undefined) {
    const { layers: _l, thickness: _t, density: _d, material: _m, ...shape } = root;
    const part = partFromObject(shape, label);
    return {
      name: part.name, units: part.units, unitSource: 'file', layered: false,
      layers: [{ name: part.name, where: '', part, thickness: defThickness, density: defDensity, material: defMaterial }],
    };
  }
  for (const k of ['outline', 'cutouts', 'regions'] as const) {
    if (root[k] !== undefined) throw new InputError(k, 'given together with "layers"; each layer has its own shape');
  }
  const name = root.part === undefined ? 'part' : root.part;
  if (typeof name !== 'string' || name.length === 0) throw new InputError('part', `expected a non-empty name, got ${describeValue(name)}`);
  const units = root.units === undefined ? 'mm' : root.units;
  if (!isLengthUnit(units)) throw new InputError('units', `expected one of ${Object.keys(LENGTH_UNITS).join(', ')}, got ${describeValue(units)}`);
  const list = expectArray(root.layers, 'layers');
  if (list.length === 0) throw new InputError('layers', 'expected at least one layer');
  const seen = new Set<string>();
  const layers = list.map((lv, i): LayerSpec => {
    const w = `layers[${i}]`;
    const o = expectObject(lv, w);
    checkKeys(o, LAYER_KEYS, w);
    const lname = o.name === undefined ? `layer ${i + 1}` : o.name;
    if (typeof lname !== 'string' || lname.trim().length === 0) throw new InputError(`${w}.name`, `expected a non-empty layer name, got ${describeValue(lname)}`);
    if (seen.has(lname)) throw new InputError(`${w}.name`, `layer name "${lname}" is used twice; expected unique names`);
    seen.add(lname);
    if (o.note !== undefined && typeof o.note !== 'string') throw new InputError(`${w}.note`, `expected text, got ${describeValue(o.note)}`);
    const part = withPrefix(w, () => partFromObject({ part: `${name} / ${lname}`, units, outline: o.outline, cutouts: o.cutouts, regions: o.regions }, label));
    const thickness = readField(o.thickness, `${w}.thickness`, 'thickness') ?? defThickness;
    const density = readField(o.density, `${w}.density`, 'density');
    const material = readMaterialName(o.material, `${w}.material`);
    if (density && material) throw new InputError(`${w}.material`, 'given together with "density"; give one or the other');
    const z = o.z === undefined ? undefined : expectNumber(o.z, `${w}.z`);
    // z is a coordinate too: its square enters the mass moments, so the coordinate limit holds for it
    if (z !== undefined && Math.abs(z) > MAX_COORDINATE) throw new InputError(`${w}.z`, `coordinate ${z} is out of range (magnitude at most ${MAX_COORDINATE})`);
    return {
      name: lname, where: w, part, thickness,
      density: density ?? (material ? undefined : defDensity),
      material: material ?? (density ? undefined : defMaterial),
      z, zWhere: o.z === undefined ? undefined : `${w}.z`,
    };
  });
  return { name, units: units as LengthUnit, unitSource: 'file', layered: true, layers };
}
