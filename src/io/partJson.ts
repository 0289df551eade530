/**
 * Reader for the project's own part description (JSON). See README "Part description format" and
 * schema/part.schema.json. Every problem is an InputError naming the JSON path.
 */
import { InputError, describeValue } from '../errors.js';
import type { Loop, Part, Region } from '../geometry/part.js';
import { type PathStep, type Pt, circleLoop, pathLoop, polygonLoop, rectangleLoop, slotLoop } from '../geometry/shapes.js';
import { LENGTH_UNITS, type LengthUnit, isLengthUnit } from '../units.js';

/** Coordinates beyond this magnitude are refused: no real plate needs them and squares would overflow. */
export const MAX_COORDINATE = 1e12;

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Obj = { [k: string]: Json };

const SHAPE_KINDS = ['rectangle', 'circle', 'slot', 'polygon', 'path'] as const;
const TOP_KEYS = ['$schema', 'part', 'units', 'outline', 'cutouts', 'regions', 'note', 'description'];

/** Parse JSON text, turning a syntax error into an InputError with line and column. */
export function parseJsonText(text: string, label: string): unknown {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  try {
    return JSON.parse(text);
  } catch (e) {
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

function expectArray(v: unknown, where: string): unknown[] {
  if (!Array.isArray(v)) throw new InputError(where, `expected an array, got ${describeValue(v)}`);
  return v;
}

/** Read one SHAPE object into an exact loop. */
export function readShape(v: unknown, where: string): Loop {
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
      const corner = expectPoint(b.corner, `${w}.corner`);
      const size = expectPoint(b.size, `${w}.size`);
      if (!(size[0] > 0)) throw new InputError(`${w}.size[0]`, `expected a positive width, got ${size[0]}`);
      if (!(size[1] > 0)) throw new InputError(`${w}.size[1]`, `expected a positive height, got ${size[1]}`);
      const r = b.cornerRadius === undefined ? 0 : expectNumber(b.cornerRadius, `${w}.cornerRadius`);
      return rectangleLoop(corner, size, r, w);
    }
    case 'circle': {
      const b = expectObject(body, w);
      checkKeys(b, ['center', 'diameter'], w);
      const c = expectPoint(b.center, `${w}.center`);
      const d = expectPositive(b.diameter, `${w}.diameter`);
      return circleLoop(c, d, w);
    }
    case 'slot': {
      const b = expectObject(body, w);
      checkKeys(b, ['from', 'to', 'width'], w);
      return slotLoop(expectPoint(b.from, `${w}.from`), expectPoint(b.to, `${w}.to`), expectPositive(b.width, `${w}.width`), w);
    }
    case 'polygon': {
      const pts = expectArray(body, w).map((p, i) => expectPoint(p, `${w}[${i}]`));
      return polygonLoop(pts, w);
    }
    case 'path': {
      const b = expectObject(body, w);
      checkKeys(b, ['start', 'segments'], w);
      const start = expectPoint(b.start, `${w}.start`);
      const steps: PathStep[] = expectArray(b.segments, `${w}.segments`).map((sv, i) => {
        const sw = `${w}.segments[${i}]`;
        const s = expectObject(sv, sw);
        checkKeys(s, ['to', 'center', 'turn'], sw);
        const to = expectPoint(s.to, `${sw}.to`);
        if (s.center === undefined) {
          if (s.turn !== undefined) throw new InputError(`${sw}.turn`, 'given without "center"; an arc needs both');
          return { to };
        }
        const center = expectPoint(s.center, `${sw}.center`);
        if (s.turn !== 'ccw' && s.turn !== 'cw') throw new InputError(`${sw}.turn`, `expected "ccw" or "cw", got ${describeValue(s.turn)}`);
        return { to, center, turn: s.turn };
      });
      return pathLoop(start, steps, w);
    }
  }
  throw new InputError(where, 'unreachable');
}

function readRegion(o: Obj, where: string): Region {
  if (o.outline === undefined) throw new InputError(where ? `${where}.outline` : 'outline', 'expected the outline shape (missing)');
  const p = where ? `${where}.` : '';
  const outer = readShape(o.outline, `${p}outline`);
  const holes: Loop[] = o.cutouts === undefined ? [] : expectArray(o.cutouts, `${p}cutouts`).map((c, i) => readShape(c, `${p}cutouts[${i}]`));
  return { outer, holes };
}

/**
 * Read a part description. `label` names the file in messages about JSON syntax.
 * The result is not yet validated (see geometry/validate.ts) nor normalised in orientation.
 */
export function readPartJson(text: string, label = 'input'): Part {
  return partFromObject(parseJsonText(text, label), label);
}

/** Read a part from an already-parsed JSON value. */
export function partFromObject(value: unknown, label = 'input'): Part {
  const root = expectObject(value, label);
  checkKeys(root, TOP_KEYS, '');
  const name = root.part === undefined ? 'part' : root.part;
  if (typeof name !== 'string' || name.length === 0) throw new InputError('part', `expected a non-empty name, got ${describeValue(name)}`);
  const units = root.units === undefined ? 'mm' : root.units;
  if (!isLengthUnit(units)) throw new InputError('units', `expected one of ${Object.keys(LENGTH_UNITS).join(', ')}, got ${describeValue(units)}`);
  for (const k of ['note', 'description'] as const) {
    if (root[k] !== undefined && typeof root[k] !== 'string') throw new InputError(k, `expected text, got ${describeValue(root[k])}`);
  }
  let regions: Region[];
  if (root.regions !== undefined) {
    if (root.outline !== undefined || root.cutouts !== undefined) {
      throw new InputError('regions', 'given together with "outline"/"cutouts"; use one or the other');
    }
    const list = expectArray(root.regions, 'regions');
    if (list.length === 0) throw new InputError('regions', 'expected at least one region');
    regions = list.map((r, i) => {
      const w = `regions[${i}]`;
      const o = expectObject(r, w);
      checkKeys(o, ['outline', 'cutouts'], w);
      return readRegion(o, w);
    });
  } else {
    regions = [readRegion(root, '')];
  }
  return { name, units: units as LengthUnit, regions };
}
