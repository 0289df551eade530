/**
 * Batch jobs: from a manifest (CSV, RFC 4180) or from a folder of part files.
 *
 * Manifest columns (header required; names are case-sensitive; a unit may follow a name in brackets):
 *   file        required  part file, relative to the manifest's folder (platewise JSON, SVG, GeoJSON, WKT)
 *   quantity    optional  how many of this part are made: a whole number ≥ 1 (default 1)
 *   material    optional  material name from the table (its nominal density is used)
 *   thickness   optional  "10 mm", or a bare number with the unit in the header, `thickness [mm]`;
 *                         a bare number under a plain `thickness` header is in the part's own unit
 *   density     optional  "7850 kg/m3", "7.85 g/cm3", or a bare number (kg/m³, or the header's unit)
 *   reference   optional  reference file (JSON or CSV, see src/qa/reference.ts), relative to the manifest
 *   format      optional  part-json, svg, geojson or wkt (default: by extension, then content)
 *   units       optional  length unit of drawing coordinates (SVG, GeoJSON, WKT)
 *   note        optional  free text, carried into the row's `note` column (quotes, order numbers, remarks)
 *   <quantity key> [unit]  optional, any number of them: a stated value for that quantity, such as
 *                         `area [mm²]`, `netMass [kg]`, `pierces`, `centroidX [in]`. A cell is a bare number
 *                         in the header's unit, or a number with its own unit ("4.65 in²") under a header
 *                         without one. Default tolerances apply (src/qa/verdict.ts); for stated tolerances
 *                         use a reference file.
 * An empty cell means "not given": the command-line setting applies (material, thickness, density), or no
 * stated value. A row's `material` replaces a command-line `--density`; a row's `density` replaces both.
 *
 * Spreadsheet-locale manifests (`dialect: SPREADSHEET_LOCALE`): semicolons between fields and decimal commas
 * in thickness, density and stated-value cells ("1,5 mm"); a decimal point there is refused (it could be a
 * thousands separator). Without the dialect a semicolon manifest is refused with a hint, and the other way round.
 *
 * Row numbers: data records are numbered from 1 (the header is not counted; blank lines are skipped and
 * not counted). Every problem in the manifest itself is an InputError naming line and column; problems
 * with a part file (missing, malformed) are the row's own failure, found when the row runs.
 *
 * Folder: every file directly in it whose name ends in .json, .svg, .geojson or .wkt (sorted by name,
 * numbered from 1), except hidden files and reference files named `<stem>.ref.json` / `<stem>.ref.csv`;
 * such a reference file, when present, is used for the part `<stem>.<ext>`.
 */
import { readdirSync, statSync } from 'node:fs';
import { dirname, isAbsolute, join, resolve } from 'node:path';
import { InputError } from '../base/errors.js';
import { type CsvDialect, RFC_4180, csvWhere, decimalCommaCell, otherSeparator, otherSeparatorError, parseCsvRecords, parseCsvRows } from '../base/csv.js';
import { type InputFormat, INPUT_FORMATS } from '../read/read.js';
import type { MaterialTable } from '../model/index.js';
import { type PlateSettings, checkSettings } from '../model/plate.js';
import { type StatedValue, checkQuantity, splitValueText, suggestQuantities, unitFor } from '../qa/reference.js';

/** Words for the number of pieces, which is the "quantity" column. */
const PIECE_WORDS = ['qty', 'pcs', 'pieces', 'count', 'number', 'no'];
import { QUANTITIES } from '../properties/quantities.js';
import { type LengthUnit, isLengthUnit } from '../base/units.js';

export interface Job {
  /** Manifest row number (data records from 1) or position in the folder listing (from 1). */
  row: number;
  /** Line of the manifest the row starts on (absent for folders). */
  line?: number;
  /** The file as written in the manifest (or its name in the folder). */
  file: string;
  /** Absolute path. */
  path: string;
  quantity: number;
  format?: InputFormat;
  units?: LengthUnit;
  /** Settings from the row (merged with the command line's later). */
  /** The row's plate settings (texts, each with its cell); checked by the one settings grammar while parsing. */
  plate: PlateSettings;
  /** Absolute path of the reference file, and the label it is shown under. */
  reference?: { path: string; label: string };
  /** Stated values from the row's own columns. */
  stated: StatedValue[];
  /** The manifest's note cell, as written (absent when empty). */
  note?: string;
}

export const PART_EXTENSIONS = ['.json', '.svg', '.dxf', '.geojson', '.wkt'];
/** Most pieces one row may order: totals stay exact in whole pieces and far from overflow. */
export const MAX_QUANTITY = 1_000_000_000;

const FIXED = ['file', 'quantity', 'material', 'thickness', 'density', 'reference', 'format', 'units', 'note'];
const UNIT_HEADER = /^(.*?)\s*\[([^\]]*)\]$/;

function splitHeader(h: string): { name: string; unit: string | null } {
  const m = UNIT_HEADER.exec(h);
  return m ? { name: m[1], unit: m[2].trim() } : { name: h, unit: null };
}

export interface ManifestOptions {
  materials?: MaterialTable;
  /** Separator and decimal mark of the manifest (default RFC 4180: commas, decimal points). */
  dialect?: CsvDialect;
  /** How the caller lets a user switch dialect (the command line names its flag), added to the separator hints. */
  dialectSwitch?: { toSemicolons: string; toCommas: string };
}

/** Read a manifest's text; `label` is its path as given, `baseDir` the folder that relative paths start from. */
export function parseManifest(text: string, label: string, baseDir: string, options: ManifestOptions = {}): Job[] {
  const dialect = options.dialect ?? RFC_4180;
  const sep = dialect.separator;
  // spreadsheets in many locales save CSV with semicolons: say so instead of a puzzling column error
  if (otherSeparator(text, sep)) throw otherSeparatorError(label, sep, 'a manifest', options.dialectSwitch);
  const t = parseCsvRecords(text, label, { required: ['file'], separator: sep });
  const head = parseCsvRows(text, label, sep).find((r) => !(r.fields.length === 1 && r.fields[0] === ''))!;
  const columns = t.header.map((h) => ({ header: h, ...splitHeader(h) }));
  const colIndex = new Map<string, number>();
  const statedCols: { header: string; key: string; dimension: ReturnType<typeof checkQuantity>; unit: string | null }[] = [];
  columns.forEach((c, k) => {
    const at = csvWhere(label, head.starts[k][0], head.starts[k][1]);
    if (colIndex.has(c.name)) throw new InputError(at, `column "${c.name}" appears twice; expected each column once`);
    colIndex.set(c.name, k);
    if (FIXED.includes(c.name)) {
      if (c.unit !== null && c.name !== 'thickness' && c.name !== 'density') {
        throw new InputError(at, `column "${c.header}": only thickness, density and stated values take a unit in brackets`);
      }
      return;
    }
    let dim;
    try {
      dim = checkQuantity(c.name, at, {});
    } catch {
      const keys = [...FIXED, ...QUANTITIES.map((q) => q.key)];
      const plain = c.name.toLowerCase().replace(/[^a-z]/g, '');
      const r = PIECE_WORDS.includes(plain) ? { keys: ['quantity'] } : suggestQuantities(c.name, keys);
      const s = 'keys' in r && r.keys.length > 0 ? r.keys.map((k) => `"${k}"`).join(' or ') : undefined;
      throw new InputError(at, `unknown column "${c.header}"${s ? `; did you mean ${s}?` : ''}; expected file, quantity, material, thickness, density, reference, format, units, note, or a quantity key with its unit such as "area [mm²]"`);
    }
    if (c.unit !== null) unitFor(dim, c.unit, `${at} (column "${c.header}")`);
    statedCols.push({ header: c.header, key: c.name, dimension: dim, unit: c.unit });
  });
  if (t.records.length === 0) throw new InputError(label, 'expected at least one row below the header');
  const thicknessUnit = columns[colIndex.get('thickness') ?? -1]?.unit ?? null;
  const densityUnit = columns[colIndex.get('density') ?? -1]?.unit ?? null;
  if (thicknessUnit !== null && thicknessUnit !== '' && !isLengthUnit(thicknessUnit)) {
    throw new InputError(csvWhere(label, head.starts[colIndex.get('thickness')!][0], head.starts[colIndex.get('thickness')!][1]), `column "thickness [${thicknessUnit}]": expected a length unit (mm, cm, m, in, ft)`);
  }

  return t.records.map((rec, i) => {
    const loc = t.locations[i];
    const at = (h: string) => csvWhere(label, loc.fields[h][0], loc.fields[h][1]);
    const cell = (name: string): string | undefined => {
      const k = colIndex.get(name);
      if (k === undefined) return undefined;
      const v = rec[columns[k].header].trim();
      return v === '' ? undefined : v;
    };
    const hdr = (name: string) => columns[colIndex.get(name)!].header;
    // a number cell: decimal comma turned into a point for the one settings grammar, in that dialect only
    const num = (v: string, name: string) => (dialect.decimalComma ? decimalCommaCell(v, at(name)) : v);
    const file = cell('file');
    if (file === undefined) throw new InputError(at(hdr('file')), 'expected a part file name, got an empty cell');
    const job: Job = {
      row: i + 1, line: loc.line, file, path: isAbsolute(file) ? file : resolve(baseDir, file), quantity: 1, plate: {}, stated: [],
    };
    const q = cell('quantity');
    if (q !== undefined) {
      if (!/^\d+$/.test(q) || Number(q) < 1 || !Number.isSafeInteger(Number(q))) {
        throw new InputError(at(hdr('quantity')), `expected how many of this part (a whole number of 1 or more), got "${q}"`);
      }
      if (Number(q) > MAX_QUANTITY) throw new InputError(at(hdr('quantity')), `${q} pieces is more than the limit of ${MAX_QUANTITY}; totals would lose whole pieces (split the row)`);
      job.quantity = Number(q);
    }
    const m = cell('material');
    if (m !== undefined) job.plate.material = { text: m, where: at(hdr('material')) };
    const thCell = cell('thickness');
    const th = thCell === undefined ? undefined : num(thCell, hdr('thickness'));
    if (th !== undefined) {
      const text = thicknessUnit && /^[\d.+\-eE]+$/.test(th) ? `${th} ${thicknessUnit}` : th;
      job.plate.thickness = { text, where: at(hdr('thickness')) };
    }
    const deCell = cell('density');
    const de = deCell === undefined ? undefined : num(deCell, hdr('density'));
    if (de !== undefined) {
      const text = densityUnit && /^[\d.+\-eE]+$/.test(de) ? `${de} ${densityUnit}` : de;
      job.plate.density = { text, where: at(hdr('density')) };
    }
    checkSettings(job.plate, options.materials);
    const ref = cell('reference');
    if (ref !== undefined) job.reference = { path: isAbsolute(ref) ? ref : resolve(baseDir, ref), label: ref };
    const f = cell('format');
    if (f !== undefined) {
      if (!INPUT_FORMATS.includes(f as InputFormat)) throw new InputError(at(hdr('format')), `expected one of ${INPUT_FORMATS.join(', ')}, got "${f}"`);
      job.format = f as InputFormat;
    }
    const note = cell('note');
    if (note !== undefined) job.note = note;
    const u = cell('units');
    if (u !== undefined) {
      if (!isLengthUnit(u)) throw new InputError(at(hdr('units')), `expected mm, cm, m, in or ft, got "${u}"`);
      job.units = u;
    }
    for (const c of statedCols) {
      const vCell = cell(c.key);
      if (vCell === undefined) continue;
      const w = at(c.header);
      const v = num(vCell, c.header);
      const sv = splitValueText(v, w);
      if (sv.unit !== '' && c.unit) throw new InputError(w, `the column "${c.header}" already gives the unit; expected a bare number, got "${v}"`);
      const unit = unitFor(c.dimension, sv.unit !== '' ? sv.unit : c.unit ?? '', w);
      job.stated.push({ quantity: c.key, dimension: c.dimension, value: sv.value, lastDigit: sv.lastDigit, unit, tolerance: null, where: w });
    }
    return job;
  });
}

/** Every part file directly in a folder (see the module comment). */
export function folderJobs(folder: string): Job[] {
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch (e) {
    throw new InputError(folder, `cannot be listed (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  const set = new Set(names);
  // a batch's own summary (results.summary.json) is an output, never a part
  const isPart = (n: string) => !n.startsWith('.') && !/\.ref\.(json|csv)$/i.test(n) && !/\.summary\.json$/i.test(n) &&
    PART_EXTENSIONS.some((x) => n.toLowerCase().endsWith(x));
  const parts = names.filter(isPart).filter((n) => {
    try { return statSync(join(folder, n)).isFile(); } catch { return false; }
  }).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  if (parts.length === 0) throw new InputError(folder, `holds no part files (expected names ending in ${PART_EXTENSIONS.join(', ')})`);
  return parts.map((n, i) => {
    const stem = n.replace(/\.[^.]+$/, '');
    const refName = [`${stem}.ref.json`, `${stem}.ref.csv`].find((r) => set.has(r));
    const job: Job = { row: i + 1, file: n, path: resolve(folder, n), quantity: 1, plate: {}, stated: [] };
    if (refName) job.reference = { path: resolve(folder, refName), label: refName };
    return job;
  });
}

/** The folder relative paths of a manifest start from. */
export function manifestBase(manifestPath: string): string {
  return dirname(resolve(manifestPath));
}
