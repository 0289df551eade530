/**
 * ASCII DXF group-code tokenizer. A DXF file is a sequence of pairs of lines: an integer group code, then
 * its value (AutoCAD DXF Reference, "DXF Format": group codes and values). This module only splits the text
 * into pairs; it knows nothing about sections or entities.
 *
 * Output is three parallel arrays (codes, values, line numbers of the group code), allocated once from an
 * upper bound on the pair count. Iterative, no recursion. Binary DXF and text that is not DXF are refused
 * with one line naming the line number.
 */
import { InputError } from '../base/errors.js';

export interface DxfTags {
  /** Group codes. */
  codes: Int32Array;
  /** Values, trimmed of surrounding white space. */
  values: string[];
  /** 1-based line number of each group code line. */
  lines: Int32Array;
  count: number;
}

/** Sentinel that opens a binary DXF file (AutoCAD DXF Reference, "Binary DXF Files"). */
const BINARY_SENTINEL = 'AutoCAD Binary DXF';

/** Most pairs read from one file: 32 MiB of text holds at most 8 Mi pairs of non-empty lines. */
export const MAX_TAGS = 16 * 1024 * 1024;

export function tokenizeDxf(text: string, label = 'dxf'): DxfTags {
  if (text.startsWith(BINARY_SENTINEL) || text.startsWith('\uFEFF' + BINARY_SENTINEL)) {
    throw new InputError(label, 'binary DXF is not read; save as ASCII DXF');
  }
  let start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  // upper bound on line count
  let nl = 1;
  for (let i = text.indexOf('\n', start); i >= 0; i = text.indexOf('\n', i + 1)) nl++;
  const cap = Math.min(MAX_TAGS, (nl >> 1) + 1);
  const codes = new Int32Array(cap);
  const lines = new Int32Array(cap);
  const values: string[] = new Array(cap);
  let count = 0;
  let line = 0;
  const n = text.length;
  while (start < n) {
    // group code line
    let e = text.indexOf('\n', start);
    if (e < 0) e = n;
    line++;
    const codeText = text.slice(start, e).trim();
    start = e + 1;
    if (codeText === '') {
      // tolerate trailing empty lines at the end of the file only
      if (text.slice(start).trim() === '') break;
      throw new InputError(`${label} line ${line}`, 'expected a group code (an integer), got an empty line');
    }
    if (!/^-?\d{1,4}$/.test(codeText)) {
      if (line === 1 && /[\u0000-\u0008\u000e-\u001f]/.test(text.slice(0, 256))) {
        throw new InputError(label, 'not an ASCII DXF file (binary content); save as ASCII DXF');
      }
      const shown = codeText.length > 30 ? codeText.slice(0, 27) + '...' : codeText;
      throw new InputError(`${label} line ${line}`, `expected a group code (an integer), got "${shown}"`);
    }
    const code = Number(codeText);
    if (start > n || (start === n && e === n)) {
      throw new InputError(`${label} line ${line}`, `file ends after group code ${code} without its value (truncated file?)`);
    }
    let ve = text.indexOf('\n', start);
    if (ve < 0) ve = n;
    line++;
    const value = text.slice(start, ve).trim();
    start = ve + 1;
    if (count >= cap) throw new InputError(`${label} line ${line}`, `more than ${MAX_TAGS} group codes`);
    if (code === 999) continue; // comment
    codes[count] = code;
    values[count] = value;
    lines[count] = line - 1;
    count++;
  }
  return { codes, values, lines, count };
}
