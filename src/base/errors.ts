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

/**
 * Bad input in a library option (units, format, tolerance …). `option` is the library's name for it; the
 * command line shows it as its flag (`units` → `--units`), a library user sees the plain name.
 */
export class OptionError extends InputError {
  readonly option: string;
  constructor(option: string, detail: string) {
    super(option, detail);
    this.name = 'OptionError';
    this.option = option;
  }
}

/**
 * A method that gave up on valid input (the mesher, the clipper, a solver): not the user's fault. `tried` says
 * what was attempted and `advice` what the user can do (another triangulation, a larger cap).
 */
export class MethodError extends Error {
  readonly method: string;
  readonly tried: string;
  readonly advice: string;
  constructor(method: string, tried: string, advice: string) {
    const m = `${oneLine(method)}: ${oneLine(tried)}; ${oneLine(advice)}`;
    super(m);
    this.name = 'MethodError';
    this.method = oneLine(method);
    this.tried = oneLine(tried);
    this.advice = oneLine(advice);
  }
}

export function isMethodError(e: unknown): e is MethodError {
  return e instanceof MethodError;
}

/**
 * Exit statuses of the command line, one per kind of outcome (README "Exit status" and --help):
 * 0 success; 1 a check found a difference (compare or batch verdict fail); 2 bad input (the user's file or
 * options: one line naming where); 3 a method gave up on valid input (one line: what was tried, what to do);
 * 4 an internal fault (one line and a hint to report it; the stack only with PLATEWISE_DEBUG=1).
 */
export const EXIT = { ok: 0, checkFailed: 1, badInput: 2, methodGaveUp: 3, internal: 4 } as const;

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
