/**
 * CSV reading and writing after RFC 4180 (section 2):
 * - fields are separated by commas, records by line breaks (CRLF, LF or a lone CR are all accepted);
 * - the last record may or may not end with a line break;
 * - a field may be enclosed in double quotes; then it may hold commas, line breaks and quotes,
 *   a quote being written twice ("");
 * - spaces are part of a field (they are never trimmed by parseCsv);
 * - a UTF-8 byte-order mark at the very start is skipped.
 * Malformed input (a quote inside an unquoted field, text after a closing quote, an unterminated quote)
 * is an InputError located as `${label}:line L, column C` (1-based; the column counts characters of the
 * physical line, the BOM not counted).
 *
 * Spreadsheet-locale CSV: spreadsheets set to a locale that writes a decimal comma (1,5) save CSV with
 * semicolons between fields. `CsvDialect` says which: the separator for reading and writing, and whether
 * numbers are written with a decimal comma. The quoting rules are the same.
 */
import { InputError } from './errors.js';

/** One parsed record with where it came from. */
export interface CsvRow {
  fields: string[];
  /** Line (1-based) on which the record starts. */
  line: number;
  /** For each field, [line, column] (1-based) of its first character (the opening quote if quoted). */
  starts: [number, number][];
}

/** How a CSV text separates fields and writes decimals. */
export interface CsvDialect {
  separator: ',' | ';';
  decimalComma: boolean;
}

export const RFC_4180: CsvDialect = { separator: ',', decimalComma: false };
/** Semicolons between fields, decimal commas in numbers: CSV as spreadsheets in many locales save it. */
export const SPREADSHEET_LOCALE: CsvDialect = { separator: ';', decimalComma: true };

export function csvWhere(label: string, line: number, column: number): string {
  return `${label}:line ${line}, column ${column}`;
}

/** Parse CSV text into records with their locations. Empty text gives no records. */
export function parseCsvRows(text: string, label: string, separator: ',' | ';' = ','): CsvRow[] {
  const sepName = separator === ',' ? 'a comma' : 'a semicolon';
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const n = text.length;
  const rows: CsvRow[] = [];
  let line = 1;
  let lineStart = i; // index of the first character of the current physical line
  const col = (k: number) => k - lineStart + 1;
  if (i >= n) return rows;

  let fields: string[] = [];
  let starts: [number, number][] = [];
  let rowLine = line;

  // i is at the start of a field on each pass
  for (;;) {
    const fLine = line, fCol = col(i);
    let value = '';
    if (i < n && text[i] === '"') {
      // quoted field
      const openLine = line, openCol = col(i);
      i++;
      let closed = false;
      let chunkStart = i;
      while (i < n) {
        const c = text[i];
        if (c === '"') {
          if (text[i + 1] === '"') {
            value += text.slice(chunkStart, i + 1);
            i += 2;
            chunkStart = i;
            continue;
          }
          value += text.slice(chunkStart, i);
          i++;
          closed = true;
          break;
        }
        if (c === '\r' || c === '\n') {
          if (c === '\r' && text[i + 1] === '\n') i++;
          i++;
          line++;
          lineStart = i;
          continue;
        }
        i++;
      }
      if (!closed) {
        throw new InputError(csvWhere(label, openLine, openCol), 'this quoted field is never closed (expected a closing double quote)');
      }
      if (i < n && text[i] !== separator && text[i] !== '\r' && text[i] !== '\n') {
        throw new InputError(csvWhere(label, line, col(i)),
          `expected ${sepName} or the end of the line after a closing quote, got ${JSON.stringify(text[i])} (write a quote inside a quoted field as "")`);
      }
    } else {
      const s = i;
      while (i < n) {
        const c = text[i];
        if (c === separator || c === '\r' || c === '\n') break;
        if (c === '"') {
          throw new InputError(csvWhere(label, line, col(i)),
            'a double quote inside an unquoted field; expected the whole field in quotes with the quote doubled ("")');
        }
        i++;
      }
      value = text.slice(s, i);
    }
    fields.push(value);
    starts.push([fLine, fCol]);
    if (i >= n) {
      rows.push({ fields, line: rowLine, starts });
      return rows;
    }
    const c = text[i];
    if (c === separator) {
      i++;
      continue; // a separator at the very end makes a last, empty field
    }
    // line break ends the record
    if (c === '\r' && text[i + 1] === '\n') i++;
    i++;
    line++;
    lineStart = i;
    rows.push({ fields, line: rowLine, starts });
    if (i >= n) return rows; // optional final line break
    fields = [];
    starts = [];
    rowLine = line;
  }
}

/** Parse CSV text into records of fields (see the module comment for the rules). */
export function parseCsv(text: string, label: string, separator: ',' | ';' = ','): string[][] {
  return parseCsvRows(text, label, separator).map((r) => r.fields);
}

export interface CsvRecords {
  /** Header names, trimmed of surrounding spaces. */
  header: string[];
  /** One object per data record, keyed by header name (null prototype). */
  records: Record<string, string>[];
  /** For each record, its starting line and the [line, column] of each field by header name. */
  locations: { line: number; fields: Record<string, [number, number]> }[];
}

export interface CsvRecordOptions {
  /** Header names that must be present. */
  required?: readonly string[];
  /** If given, the only header names accepted (required ones are always accepted). */
  allowed?: readonly string[];
  /** Field separator (default a comma). */
  separator?: ',' | ';';
}

/**
 * Parse CSV whose first record is a header. Header names are trimmed; an empty or repeated header name,
 * a missing required column, a column not allowed, or a record with a different number of fields than the
 * header is an InputError with its location. Blank lines (a record of one empty field) are skipped.
 */
export function parseCsvRecords(text: string, label: string, options: CsvRecordOptions = {}): CsvRecords {
  const rows = parseCsvRows(text, label, options.separator).filter((r) => !(r.fields.length === 1 && r.fields[0] === ''));
  if (rows.length === 0) throw new InputError(label, 'expected a header line, got no data');
  const head = rows[0];
  const header = head.fields.map((h) => h.trim());
  const seen = new Map<string, number>();
  header.forEach((h, k) => {
    const [l, c] = head.starts[k];
    if (h === '') throw new InputError(csvWhere(label, l, c), `expected a column name, got an empty header field (column ${k + 1})`);
    if (seen.has(h)) {
      throw new InputError(csvWhere(label, l, c), `repeats the column name "${h}" (first in field ${seen.get(h)! + 1}); expected each name once`);
    }
    seen.set(h, k);
  });
  for (const r of options.required ?? []) {
    if (!seen.has(r)) {
      throw new InputError(csvWhere(label, head.line, 1), `expected a column named "${r}"; the header has ${header.map((h) => `"${h}"`).join(', ')}`);
    }
  }
  if (options.allowed) {
    const ok = new Set([...options.allowed, ...(options.required ?? [])]);
    header.forEach((h, k) => {
      if (!ok.has(h)) {
        const [l, c] = head.starts[k];
        throw new InputError(csvWhere(label, l, c), `unknown column "${h}"; expected one of ${[...ok].map((x) => `"${x}"`).join(', ')}`);
      }
    });
  }
  const records: Record<string, string>[] = [];
  const locations: CsvRecords['locations'] = [];
  for (const r of rows.slice(1)) {
    if (r.fields.length !== header.length) {
      const k = Math.min(r.fields.length, header.length) - 1;
      const [l, c] = r.starts[Math.max(0, r.fields.length > header.length ? header.length : k)];
      throw new InputError(csvWhere(label, l, c),
        `expected ${header.length} fields as in the header, got ${r.fields.length}`);
    }
    const rec: Record<string, string> = Object.create(null);
    const loc: Record<string, [number, number]> = Object.create(null);
    header.forEach((h, k) => {
      rec[h] = r.fields[k];
      loc[h] = r.starts[k];
    });
    records.push(rec);
    locations.push({ line: r.line, fields: loc });
  }
  return { header, records, locations };
}

/**
 * Text for a number that reads back to the same double: JS's shortest round-trip form, and -0 kept; with
 * `decimalComma` the decimal point is written as a comma (1,5 and 1,5e-9), as decimal-comma locales read it.
 */
export function formatCsvNumber(x: number, decimalComma = false): string {
  const s = Object.is(x, -0) ? '-0' : String(x);
  return decimalComma ? s.replace('.', ',') : s;
}

/**
 * Whether the header line is split by the other dialect's separator (a semicolon file read as RFC 4180, or
 * the other way round), so that the reader can say so instead of reporting one puzzling column.
 */
export function otherSeparator(text: string, separator: ',' | ';'): boolean {
  const first = text.replace(/^\ufeff/, '').split(/\r?\n/, 1)[0] ?? '';
  return !first.includes(separator) && first.includes(separator === ',' ? ';' : ',');
}

/** The one line for a file in the other dialect; `switchHint` says how the caller switches (a flag). */
export function otherSeparatorError(label: string, separator: ',' | ';', what: string, switchHint?: { toSemicolons: string; toCommas: string }): InputError {
  return new InputError(`${label}:line 1`, separator === ','
    ? `the columns are separated by semicolons; ${what} is CSV with commas (RFC 4180): save it with comma separators (in a spreadsheet: CSV with "," as the field separator)${switchHint ? `, or ${switchHint.toSemicolons} to read semicolons and decimal commas` : ''}`
    : `the columns are separated by commas, but semicolons with decimal commas were asked for${switchHint ? `; ${switchHint.toCommas}` : ''}`);
}

/**
 * A number cell written with a decimal comma, as plain text for the number readers ("1,5 mm" → "1.5 mm").
 * A point between digits is refused: in a decimal-comma locale it separates thousands ("1.500" is 1500
 * there), so reading it either way could be wrong by a factor of 1000.
 */
export function decimalCommaCell(text: string, where: string): string {
  if (/\d\.\d/.test(text)) {
    throw new InputError(where, `"${text.length > 40 ? text.slice(0, 40) + '…' : text}" has a decimal point; in semicolon CSV numbers take a decimal comma (1,5), and a point there could be a thousands separator; expected the number with a decimal comma`);
  }
  return text.replace(/(\d),(\d)/g, '$1.$2');
}

/**
 * A text cell that a spreadsheet would run as a formula (it begins with =, +, -, @, a tab or a carriage
 * return: the common guidance on CSV formula injection) gets a leading single quote, which spreadsheets
 * show as text. Only text cells: numbers are written as numbers (a negative number stays a number, also when
 * it arrives as text such as a stated value "-5").
 */
export function neutraliseFormula(s: string): string {
  return /^[=+\-@\t\r]/.test(s) && !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s) ? `'${s}` : s;
}

/**
 * One CSV field: quoted when it holds a comma, a double quote, CR or LF. null/undefined give an empty field.
 * With `neutralise`, text that could start a spreadsheet formula gets its leading quote (neutraliseFormula);
 * the codec itself (round trips) writes text exactly.
 */
export function formatCsvField(f: string | number | null | undefined, neutralise = false, dialect: CsvDialect = RFC_4180): string {
  if (f === null || f === undefined) return '';
  const s = typeof f === 'number' ? formatCsvNumber(f, dialect.decimalComma) : neutralise ? neutraliseFormula(f) : f;
  // a text holding either separator is quoted, so that it reads back whole in both dialects
  if (/[",;\r\n]/.test(s)) return `"${s.replace(/"/g, '""')}"`;
  return s;
}

/**
 * One CSV record without a line break. A record of a single empty field is written as `""` so that it
 * cannot be mistaken for a blank line or for no record at all.
 */
export function formatCsvRow(fields: readonly (string | number | null | undefined)[], options: { neutralise?: boolean; dialect?: CsvDialect } = {}): string {
  const d = options.dialect ?? RFC_4180;
  const s = fields.map((f) => formatCsvField(f, options.neutralise === true, d)).join(d.separator);
  return s === '' && fields.length === 1 ? '""' : s;
}

/** Whole CSV text: records joined and ended with CRLF, as RFC 4180 writes them. */
export function formatCsv(rows: readonly (readonly (string | number | null | undefined)[])[], options: { neutralise?: boolean; dialect?: CsvDialect } = {}): string {
  return rows.map((r) => formatCsvRow(r, options) + '\r\n').join('');
}
