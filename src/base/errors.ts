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
    where = capEcho(oneLine(where), 240);
    detail = capEcho(oneLine(detail), 600);
    super(where ? `${where}: ${detail}` : detail);
    this.name = 'InputError';
    this.where = where;
    this.detail = detail;
  }
}

/**
 * Characters that must never reach a terminal raw: C0 controls (line breaks, ESC), DEL, C1 controls (U+0080–
 * U+009F, among them the one-character CSI U+009B), the line and paragraph separators, and the bidirectional
 * embeddings, overrides and isolates (U+202A–U+202E, U+2066–U+2069) that can make text read backwards.
 */
export const UNSAFE_TEXT = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g;

function escapeChar(c: string): string {
  return c === '\n' ? '\\n' : c === '\r' ? '\\r' : c === '\t' ? '\\t' : `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`;
}

/**
 * Escape control characters (line breaks, C1, DEL, bidirectional controls) so that a message stays on one
 * line and cannot steer the terminal: each becomes a visible \n, \t or \uXXXX.
 */
export function oneLine(s: string): string {
  return s.replace(UNSAFE_TEXT, escapeChar);
}

/**
 * Text for a terminal (tables, lists): every unsafe character but the line break becomes a visible escape, so
 * a part, feature or material name cannot clear the screen, set the window title, hide text or reverse it.
 */
export function terminalText(s: string): string {
  return s.replace(UNSAFE_TEXT, (c) => (c === '\n' ? c : escapeChar(c)));
}

/**
 * JSON text for a terminal: JSON.stringify already escapes C0 controls; DEL, C1, the line separators and the
 * bidirectional controls are written as \uXXXX escapes too, which JSON reads back as the exact same text.
 */
export function jsonTerminalText(s: string): string {
  return s.replace(/[\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** Longest piece of quoted user text echoed in a message; longer pieces are cut with an ellipsis. */
export const ECHO_LIMIT = 80;

/** Cap what a message echoes: quoted pieces to ECHO_LIMIT characters, the whole to a few lines' worth. */
function capEcho(s: string, whole: number): string {
  // quotes pair up left to right (each match consumes both), so text between two quoted pieces is never cut
  const t = s.replace(/"([^"]*)"/g, (m, inner: string) => (inner.length > ECHO_LIMIT + 1 ? `"${inner.slice(0, ECHO_LIMIT)}…" (${inner.length} characters)` : m));
  return t.length > whole ? `${t.slice(0, whole)}… (message cut at ${whole} characters)` : t;
}

/**
 * Bad input in a library option (units, format, tolerance …). `option` is the library's name for it; the
 * command line shows it as its flag (`units` → `--units`), a library user sees the plain name.
 */
/** A library option's name as the command line's flag (`units` → `--units`, `unitsOverride` → `--units-override`). */
export function optionFlag(option: string): string {
  return '--' + option.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());
}

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
 * An output could not be written although its name was fine: the disk is full, a quota or an I/O error.
 * The CLI prints `${where}: ${detail}` and exits 5; whatever was half-written is removed first.
 */
export class OutputError extends Error {
  readonly where: string;
  readonly detail: string;
  constructor(where: string, detail: string) {
    where = capEcho(oneLine(where), 240);
    detail = capEcho(oneLine(detail), 600);
    super(`${where}: ${detail}`);
    this.name = 'OutputError';
    this.where = where;
    this.detail = detail;
  }
}

/**
 * Exit statuses of the command line, one per kind of outcome (README "Exit status" and --help):
 * 0 success; 1 a check found a difference (compare or batch verdict fail); 2 bad input (the user's file or
 * options: one line naming where); 3 a method gave up on valid input (one line: what was tried, what to do);
 * 4 an internal fault (one line and a hint to report it; the stack only with PLATEWISE_DEBUG=1); 5 an output
 * could not be written (full disk, quota, I/O error: one line, nothing half-written left); 130 / 143 a batch
 * interrupted by SIGINT / SIGTERM (one line, finished rows kept, summary marked incomplete); 141 standard
 * output was closed by its reader (`| head`): the run stops quietly, as Unix tools do on SIGPIPE.
 */
export const EXIT = { ok: 0, checkFailed: 1, badInput: 2, methodGaveUp: 3, internal: 4, outputFailed: 5, interrupted: 130, terminated: 143, closedPipe: 141 } as const;

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}

/** Describe a JSON value briefly for an error message ("got -5", "got a string"). */
export function describeValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return v.length > 40 ? `a string "${oneLine(v.slice(0, 37))}..."` : `"${oneLine(v)}"`;
  if (typeof v === 'boolean') return String(v);
  if (Array.isArray(v)) return `an array of ${v.length}`;
  return 'an object';
}
