/**
 * Reference files: values stated elsewhere (a drawing, a customer's sheet, a hand calculation) for any
 * catalogued quantity, each with its unit and optionally a tolerance, to be judged against computed values.
 *
 * JSON form:
 *   {
 *     "part": "bracket B-12",                 (optional: which part the values belong to)
 *     "values": [
 *       { "quantity": "area", "value": 4.65, "unit": "in²", "tolerance": "0.5%" },
 *       { "quantity": "centroidX", "value": "50.0 mm", "tolerance": "0.05 mm" },
 *       { "quantity": "Ix", "value": 1.234e6, "unit": "mm^4", "tolerance": { "relative": 0.002 } },
 *       { "quantity": "principalAngle", "value": 0.5236, "unit": "rad", "tolerance": { "absolute": 0.1, "unit": "deg" } },
 *       { "quantity": "pierces", "value": 4, "note": "outer contour and three holes" }
 *     ]
 *   }
 * CSV form (RFC 4180, header required, columns quantity and value required, unit/tolerance/note optional):
 *   quantity,value,unit,tolerance,note
 *   area,4.65,in²,0.5%,
 *   centroidX,50.0,mm,0.05 mm,
 *
 * Rules:
 * - `quantity` must be a catalogued key (src/properties/quantities.ts); a near miss gets a suggestion.
 * - A quantity with a dimension needs a unit, either in `unit` or after the number in `value` ("50.0 mm");
 *   the unit is converted, never assumed. Counts take no unit; ratios take none (a fraction) or "%".
 * - `tolerance` (optional; a default per kind of quantity applies without it):
 *   "0.5%" (relative, in percent), "0.002 rel" (relative, as a fraction), "0.05 mm" (absolute, any unit of
 *   the quantity's dimension), a bare number only for counts and ratios (absolute);
 *   in JSON also { "relative": 0.002 } or { "absolute": 0.05, "unit": "mm" }.
 *   A bare number for a quantity with a dimension is refused: it would be unclear whether it is relative.
 *   Angles take absolute tolerances only.
 * - Each quantity at most once per file.
 */
import { InputError, describeValue } from '../base/errors.js';
import { checkJsonText } from '../base/jsonCheck.js';
import { type Dimension, QUANTITIES, quantityInfo } from '../properties/quantities.js';
import { parseCsvRecords, csvWhere } from '../base/csv.js';
import { DIMENSION_WORDS, type ParsedUnit, parseUnit, plainScale, UNIT_EXAMPLES } from './units.js';
import { editDistance } from '../base/text.js';

export type StatedTolerance =
  | { kind: 'relative'; fraction: number; text: string }
  | { kind: 'absolute'; value: number; unit: ParsedUnit; text: string };

export interface StatedValue {
  quantity: string;
  dimension: Dimension;
  /** The number as written, in `unit`. */
  value: number;
  /**
   * Place value of the last digit written, in `unit` ("0.588" → 0.001, "1.20e3" → 10, "588" → 1). A JSON
   * number gives its shortest text (JSON itself drops trailing zeros: write "0.5880 m" as a text to keep them).
   */
  lastDigit: number;
  /** The unit as written and parsed (for dimensionless values without a unit: scale of a plain number). */
  unit: ParsedUnit;
  tolerance: StatedTolerance | null;
  note?: string;
  /** Where the value was stated (JSON path or CSV line and column), for messages. */
  where: string;
}

export interface Reference {
  /** The label the file was read under (its path). */
  source: string;
  part?: string;
  values: StatedValue[];
}

// eslint-disable-next-line @typescript-eslint/no-empty-object-type
export interface ReferenceOptions {}

// ---------------------------------------------------------------- helpers


/** The closest known key to `name`, if close enough to be a likely typo. */
export function suggestKey(name: string, keys: readonly string[], limit = Math.max(2, Math.floor(name.length / 3))): string | undefined {
  const lower = name.toLowerCase();
  const exactCase = keys.find((k) => k.toLowerCase() === lower);
  if (exactCase) return exactCase;
  let best: string | undefined, bestD = Infinity;
  for (const k of keys) {
    const dd = editDistance(lower, k.toLowerCase());
    if (dd < bestD) { bestD = dd; best = k; }
  }
  return bestD <= limit ? best : undefined;
}

function knownKeys(_options: ReferenceOptions): string[] {
  return QUANTITIES.map((q) => q.key);
}

/**
 * Words people write for a quantity, by meaning (our own list; lower case, spaces and punctuation dropped).
 * Checked before spelling, so that "Sx" leads to the section moduli and "qty" is not taken for "Iy".
 */
const MEANINGS: Readonly<Record<string, readonly string[]>> = {
  a: ['area'], netarea: ['area'], grossarea: ['area'],
  sx: ['SxTop', 'SxBottom'], sy: ['SyRight', 'SyLeft'], wx: ['SxTop', 'SxBottom'], wy: ['SyRight', 'SyLeft'],
  zx: ['Zx'], zy: ['Zy'], zpl: ['Zx', 'Zy'], wpl: ['Zx', 'Zy'], wply: ['Zx'], wplz: ['Zy'],
  xbar: ['centroidX'], ybar: ['centroidY'], xc: ['centroidX'], yc: ['centroidY'], cx: ['centroidX'], cy: ['centroidY'],
  cgx: ['massCentreX'], cgy: ['massCentreY'], cogx: ['massCentreX'], cogy: ['massCentreY'],
  ixx: ['Ix'], iyy: ['Iy'], izz: ['Ip'], ix0: ['IxOrigin'], iy0: ['IyOrigin'], imax: ['I1'], imin: ['I2'], j0: ['Ip'], polar: ['Ip'],
  it: ['J'], torsionconstant: ['J'], k: ['J'], cw: ['Iw'], warping: ['Iw'],
  kg: ['netMass', 'mass'], weight: ['weight'], netweight: ['netMass'], grossmass: ['blankMass'],
  holes: ['pierces'], piercings: ['pierces'], starts: ['pierces'],
  cut: ['cutLength'], cutting: ['cutLength'], cutlen: ['cutLength'], perim: ['perimeter'],
  angle: ['principalAngle'], alpha: ['principalAngle'], theta: ['principalAngle'],
  scrap: ['scrapFraction'], waste: ['scrapFraction'],
};

/** Names that are columns or settings, not stated quantities: what to write instead. */
const NOT_QUANTITIES: Readonly<Record<string, string>> = {
  qty: 'the number of pieces is not a stated value; in a batch manifest it is the "quantity" column',
  pcs: 'the number of pieces is not a stated value; in a batch manifest it is the "quantity" column',
  pieces: 'the number of pieces is not a stated value; in a batch manifest it is the "quantity" column',
  thickness: 'thickness is a setting, not a stated value: give it in the part file, the manifest or --thickness',
  density: 'density is a setting, not a stated value: give it with --density, --material or the part file',
  material: 'material is a setting, not a stated value: give it with --material or the part file',
};

/** Suggestions for an unknown quantity name: by meaning first, then keys it begins, then spelling. */
export function suggestQuantities(name: string, keys: readonly string[]): { keys: string[] } | { instead: string } {
  const plain = name.toLowerCase().replace(/[^a-z0-9]/g, '');
  if (NOT_QUANTITIES[plain]) return { instead: NOT_QUANTITIES[plain] };
  const meant = MEANINGS[plain]?.filter((k) => keys.includes(k));
  if (meant && meant.length > 0) return { keys: [...meant] };
  if (plain.length >= 2) {
    const begun = keys.filter((k) => k.toLowerCase().startsWith(plain));
    if (begun.length > 0 && begun.length <= 4) return { keys: begun };
  }
  // spelling: short names only by one edit (a two-letter change turns "qty" into "Iy")
  const best = name.length <= 3 ? suggestKey(name, keys, 1) : suggestKey(name, keys);
  return { keys: best === undefined ? [] : [best] };
}

export function checkQuantity(name: string, where: string, options: ReferenceOptions): Dimension {
  const info = quantityInfo(name);
  if (info) return info.dimension;
  const s = suggestQuantities(name, knownKeys(options));
  if ('instead' in s) throw new InputError(where, `unknown quantity "${name}": ${s.instead}`);
  const guess = s.keys.length === 0 ? '; expected a key such as area, centroidX, Ix, SxTop, principalAngle, cutLength, netMass'
    : `; did you mean ${s.keys.map((k) => `"${k}"`).join(' or ')}?`;
  throw new InputError(where, `unknown quantity "${name}"${guess}`);
}

export function unitFor(dim: Dimension, text: string, where: string): ParsedUnit {
  const t = text.trim();
  if (t === '') {
    if (dim === 'count' || dim === 'ratio') return { dimension: dim, scale: plainScale(dim), text: '' };
    throw new InputError(where, `expected a unit of ${DIMENSION_WORDS[dim]} (${UNIT_EXAMPLES[dim]}); units are never assumed`);
  }
  const u = parseUnit(t);
  if (!u) throw new InputError(where, `unknown unit "${t}"; expected a unit of ${DIMENSION_WORDS[dim]} (${UNIT_EXAMPLES[dim]})`);
  if (u.dimension !== dim) {
    throw new InputError(where, `"${t}" is a unit of ${DIMENSION_WORDS[u.dimension]}; expected a unit of ${DIMENSION_WORDS[dim]} (${UNIT_EXAMPLES[dim]})`);
  }
  return u;
}

/** Place value of the last digit of a number as written: "0.588" → 0.001, "1.20e3" → 10, "588" → 1. */
export function lastDigitOf(numberText: string): number {
  const m = /^[+-]?(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(numberText.trim());
  if (!m) return NaN;
  const decimals = (m[2] ?? '').length, exponent = m[3] !== undefined ? Number(m[3]) : 0;
  // 10^(exponent − decimals) computed as a quotient or product of exact powers of ten
  const p = exponent - decimals;
  return p >= 0 ? 10 ** p : 1 / 10 ** -p;
}

/** "12.5 in²" → number, the place value of its last digit, and unit text; a plain number gives unit ''. */
export function splitValueText(s: string, where: string): { value: number; lastDigit: number; unit: string } {
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$/.exec(s);
  if (!m) throw new InputError(where, `expected a number, optionally followed by a unit (such as "12.5 mm²"), got ${describeValue(s)}`);
  return { value: Number(m[1]), lastDigit: lastDigitOf(m[1]), unit: m[2] };
}

/** Largest relative tolerance accepted: 100% (beyond it every computed value of the right sign passes). */
export const MAX_RELATIVE_TOLERANCE = 1;

/** Tolerance text: "0.5%", "0.002 rel", "0.05 mm", or (counts, ratios) a bare number. */
function parseToleranceText(s: string, dim: Dimension, where: string): StatedTolerance | null {
  const t = s.trim();
  if (t === '') return null;
  const { value, unit } = splitValueText(t, where);
  if (!(value >= 0) || !Number.isFinite(value)) throw new InputError(where, `expected a tolerance of zero or more, got ${describeValue(s)}`);
  const u = unit.toLowerCase();
  if (u === '%' || u === 'rel') {
    if (dim === 'angle') throw new InputError(where, `expected an absolute tolerance for an angle (such as "0.1 deg"), got "${t}"`);
    const fraction = u === '%' ? value / 100 : value;
    if (fraction > MAX_RELATIVE_TOLERANCE) throw new InputError(where, `a tolerance of ${t} is more than the value itself (at most 100% or 1 rel); expected a tolerance that can tell a right value from a wrong one`);
    return { kind: 'relative', fraction, text: t };
  }
  if (u === '' && dim !== 'count' && dim !== 'ratio') {
    throw new InputError(where, `a bare number is unclear; expected "${value}%" (relative), "${value} rel" (fraction of the value) or "${value} <unit>" (${UNIT_EXAMPLES[dim]})`);
  }
  return { kind: 'absolute', value, unit: unitFor(dim, unit, where), text: t };
}

// ---------------------------------------------------------------- JSON

function jsonLocation(text: string, e: unknown): string {
  const msg = e instanceof Error ? e.message : String(e);
  const m = /position (\d+)/.exec(msg);
  if (!m) return '';
  const pos = Number(m[1]);
  const before = text.slice(0, pos);
  const line = before.split(/\r\n|\r|\n/).length;
  const col = pos - Math.max(before.lastIndexOf('\n'), before.lastIndexOf('\r')) ;
  return `line ${line}, column ${col}`;
}

const ENTRY_KEYS = ['quantity', 'value', 'unit', 'tolerance', 'note'];

export function parseReferenceJson(text: string, label: string, options: ReferenceOptions = {}): Reference {
  let doc: unknown;
  try {
    doc = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
    checkJsonText(text, label, `${label}:`);
  } catch (e) {
    if (e instanceof InputError) throw e;
    const loc = jsonLocation(text, e);
    throw new InputError(loc ? `${label}:${loc}` : label, `expected JSON (${e instanceof Error ? e.message.split('\n')[0] : 'unreadable'})`);
  }
  const at = (path: string) => `${label}:${path}`;
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) {
    throw new InputError(label, `expected an object with "values", got ${describeValue(doc)}`);
  }
  const obj = doc as Record<string, unknown>;
  for (const k of Object.keys(obj)) {
    if (k !== 'part' && k !== 'values') throw new InputError(at(k), 'unknown key; expected "part" or "values"');
  }
  if (obj.part !== undefined && typeof obj.part !== 'string') throw new InputError(at('part'), `expected a string, got ${describeValue(obj.part)}`);
  if (!Array.isArray(obj.values)) throw new InputError(at('values'), `expected an array of stated values, got ${describeValue(obj.values)}`);
  if (obj.values.length === 0) throw new InputError(at('values'), 'expected at least one stated value');
  const out: StatedValue[] = [];
  const seen = new Map<string, string>();
  obj.values.forEach((entry, i) => {
    const w = `values[${i}]`;
    if (typeof entry !== 'object' || entry === null || Array.isArray(entry)) {
      throw new InputError(at(w), `expected an object such as {"quantity": "area", "value": 12.5, "unit": "mm²"}, got ${describeValue(entry)}`);
    }
    const e = entry as Record<string, unknown>;
    for (const k of Object.keys(e)) {
      if (!ENTRY_KEYS.includes(k)) {
        const s = suggestKey(k, ENTRY_KEYS);
        throw new InputError(at(`${w}.${k}`), `unknown key${s ? `; did you mean "${s}"?` : `; expected ${ENTRY_KEYS.join(', ')}`}`);
      }
    }
    if (typeof e.quantity !== 'string') throw new InputError(at(`${w}.quantity`), `expected a quantity name (a string), got ${describeValue(e.quantity)}`);
    const dim = checkQuantity(e.quantity, at(`${w}.quantity`), options);
    if (seen.has(e.quantity)) throw new InputError(at(`${w}.quantity`), `"${e.quantity}" is already stated at ${seen.get(e.quantity)}; expected each quantity once`);
    seen.set(e.quantity, w);
    let value: number, lastDigit: number, unitText: string, unitWhere: string;
    if (typeof e.value === 'number') {
      if (!Number.isFinite(e.value)) throw new InputError(at(`${w}.value`), `expected a finite number, got ${e.value}`);
      value = e.value;
      lastDigit = lastDigitOf(String(e.value));
      if (e.unit !== undefined && typeof e.unit !== 'string') throw new InputError(at(`${w}.unit`), `expected a unit text, got ${describeValue(e.unit)}`);
      unitText = (e.unit as string | undefined) ?? '';
      unitWhere = e.unit === undefined ? at(w) : at(`${w}.unit`);
    } else if (typeof e.value === 'string') {
      const sv = splitValueText(e.value, at(`${w}.value`));
      value = sv.value;
      lastDigit = sv.lastDigit;
      unitText = sv.unit;
      if (e.unit !== undefined) {
        if (typeof e.unit !== 'string') throw new InputError(at(`${w}.unit`), `expected a unit text, got ${describeValue(e.unit)}`);
        if (sv.unit !== '') throw new InputError(at(`${w}.unit`), `the value "${e.value}" already has a unit; expected the unit in one place`);
        unitText = e.unit;
      }
      unitWhere = sv.unit !== '' ? at(`${w}.value`) : e.unit !== undefined ? at(`${w}.unit`) : at(w);
    } else {
      throw new InputError(at(`${w}.value`), `expected a number or a text such as "12.5 mm²", got ${describeValue(e.value)}`);
    }
    const unit = unitFor(dim, unitText, unitWhere);
    let tolerance: StatedTolerance | null = null;
    const tw = at(`${w}.tolerance`);
    if (e.tolerance !== undefined) {
      const t = e.tolerance;
      if (typeof t === 'string') tolerance = parseToleranceText(t, dim, tw);
      else if (typeof t === 'number') tolerance = parseToleranceText(String(t), dim, tw);
      else if (typeof t === 'object' && t !== null && !Array.isArray(t)) {
        const to = t as Record<string, unknown>;
        const keys = Object.keys(to).sort().join(',');
        if (keys === 'relative') {
          if (typeof to.relative !== 'number' || !(to.relative >= 0) || !Number.isFinite(to.relative)) {
            throw new InputError(`${tw}.relative`, `expected a fraction of zero or more (0.002 for 0.2%), got ${describeValue(to.relative)}`);
          }
          if (dim === 'angle') throw new InputError(tw, 'expected an absolute tolerance for an angle, such as {"absolute": 0.1, "unit": "deg"}');
          if (to.relative > MAX_RELATIVE_TOLERANCE) throw new InputError(`${tw}.relative`, `a tolerance of ${to.relative} is more than the value itself (at most 1, i.e. 100%); expected a tolerance that can tell a right value from a wrong one`);
          tolerance = { kind: 'relative', fraction: to.relative, text: `${to.relative} rel` };
        } else if (keys === 'absolute,unit' || keys === 'absolute') {
          if (typeof to.absolute !== 'number' || !(to.absolute >= 0) || !Number.isFinite(to.absolute)) {
            throw new InputError(`${tw}.absolute`, `expected a number of zero or more, got ${describeValue(to.absolute)}`);
          }
          if (to.unit !== undefined && typeof to.unit !== 'string') throw new InputError(`${tw}.unit`, `expected a unit text, got ${describeValue(to.unit)}`);
          const u = unitFor(dim, (to.unit as string | undefined) ?? '', to.unit === undefined ? tw : `${tw}.unit`);
          tolerance = { kind: 'absolute', value: to.absolute, unit: u, text: `${to.absolute}${u.text ? ' ' + u.text : ''}` };
        } else {
          throw new InputError(tw, 'expected {"relative": fraction} or {"absolute": number, "unit": text}');
        }
      } else {
        throw new InputError(tw, `expected a text such as "0.5%" or "0.05 mm", or an object, got ${describeValue(t)}`);
      }
    }
    if (e.note !== undefined && typeof e.note !== 'string') throw new InputError(at(`${w}.note`), `expected a text, got ${describeValue(e.note)}`);
    out.push({ quantity: e.quantity, dimension: dim, value, lastDigit, unit, tolerance, note: e.note as string | undefined, where: at(w) });
  });
  return { source: label, part: obj.part as string | undefined, values: out };
}

// ---------------------------------------------------------------- CSV

export function parseReferenceCsv(text: string, label: string, options: ReferenceOptions = {}): Reference {
  const t = parseCsvRecords(text, label, { required: ['quantity', 'value'], allowed: ENTRY_KEYS });
  if (t.records.length === 0) throw new InputError(label, 'expected at least one stated value below the header');
  const out: StatedValue[] = [];
  const seen = new Map<string, number>();
  t.records.forEach((rec, i) => {
    const loc = t.locations[i];
    const at = (col: string) => csvWhere(label, loc.fields[col][0], loc.fields[col][1]);
    const name = rec.quantity.trim();
    const dim = checkQuantity(name, at('quantity'), options);
    if (seen.has(name)) throw new InputError(at('quantity'), `"${name}" is already stated on line ${seen.get(name)}; expected each quantity once`);
    seen.set(name, loc.line);
    const sv = splitValueText(rec.value, at('value'));
    let unitText = sv.unit, unitWhere = at('value');
    const unitCol = rec.unit !== undefined ? rec.unit.trim() : '';
    if (unitCol !== '') {
      if (sv.unit !== '') throw new InputError(at('unit'), `the value "${rec.value.trim()}" already has a unit; expected the unit in one place`);
      unitText = unitCol;
      unitWhere = at('unit');
    } else if (sv.unit === '' && rec.unit !== undefined) {
      unitWhere = at('unit');
    }
    const unit = unitFor(dim, unitText, unitWhere);
    const tolerance = rec.tolerance !== undefined ? parseToleranceText(rec.tolerance, dim, at('tolerance')) : null;
    const note = rec.note !== undefined && rec.note.trim() !== '' ? rec.note : undefined;
    out.push({ quantity: name, dimension: dim, value: sv.value, lastDigit: sv.lastDigit, unit, tolerance, note, where: csvWhere(label, loc.line, 1) });
  });
  return { source: label, values: out };
}

/**
 * Read a reference file. The format is taken from `format`, else from the label's extension (.json, .csv),
 * else from the first character ("{" means JSON).
 */
export function readReference(text: string, label: string, format?: 'json' | 'csv', options: ReferenceOptions = {}): Reference {
  let f = format;
  if (!f) {
    if (/\.json$/i.test(label)) f = 'json';
    else if (/\.csv$/i.test(label)) f = 'csv';
    else f = text.replace(/^\ufeff/, '').trimStart().startsWith('{') ? 'json' : 'csv';
  }
  // a stated-values file holds the values of one part: far fewer than this; refuse before building records
  let lines = 0;
  for (let i = text.indexOf('\n'); i >= 0 && lines <= MAX_STATED_LINES; i = text.indexOf('\n', i + 1)) lines++;
  if (lines > MAX_STATED_LINES) {
    throw new InputError(label, `has more than ${MAX_STATED_LINES} lines; a stated-values file holds the values of one part (at most ${MAX_STATED_VALUES} values)`);
  }
  const ref = f === 'json' ? parseReferenceJson(text, label, options) : parseReferenceCsv(text, label, options);
  if (ref.values.length > MAX_STATED_VALUES) throw new InputError(label, `states ${ref.values.length} values; expected at most ${MAX_STATED_VALUES} for one part`);
  return ref;
}

/** A stated-values file names the values of one part; these bounds keep a malformed file from costing gigabytes. */
export const MAX_STATED_VALUES = 10_000;
const MAX_STATED_LINES = 100_000;
