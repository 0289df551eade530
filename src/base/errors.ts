/**
 * The one error type for bad input. `where` names the place (a JSON path such as
 * `cutouts[3].circle.diameter`, an SVG element and path-command index, a line and column);
 * `message` says what was expected. The CLI prints `${where}: ${message}` and exits 2.
 */
export class InputError extends Error {
  readonly where: string;
  readonly detail: string;
  constructor(where: string, detail: string) {
    // one line always: line breaks and other control characters quoted from the input are escaped
    where = oneLine(where);
    detail = oneLine(detail);
    super(where ? `${where}: ${detail}` : detail);
    this.name = 'InputError';
    this.where = where;
    this.detail = detail;
  }
}

/** Escape control characters (line breaks included) so that a message stays on one line. */
export function oneLine(s: string): string {
  return s.replace(/[\u0000-\u001f\u007f\u2028\u2029]/g, (c) => (c === '\n' ? '\\n' : c === '\r' ? '\\r' : c === '\t' ? '\\t' : `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`));
}

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}

/** Describe a JSON value briefly for an error message ("got -5", "got a string"). */
export function describeValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return v.length > 40 ? `a string "${v.slice(0, 37)}..."` : `"${v}"`;
  if (typeof v === 'boolean') return String(v);
  if (Array.isArray(v)) return `an array of ${v.length}`;
  return 'an object';
}
