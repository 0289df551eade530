/**
 * File access for the CLI and library: strict UTF-8 reading with a size limit, and atomic writing
 * (temporary name, then rename) that never overwrites an input file.
 */
import { readFileSync, renameSync, rmSync, writeFileSync, realpathSync, existsSync, fstatSync, openSync, closeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { InputError } from './errors.js';

let tempCounter = 0;
/** A suffix unique within this process (pid in the name makes it unique across processes). */
function tempSuffix(): string {
  tempCounter++;
  return `${tempCounter.toString(36)}${Math.floor(Math.random() * 0x100000000).toString(16)}`;
}

/** Largest input accepted, in bytes. */
export const MAX_INPUT_BYTES = 32 * 1024 * 1024;

export interface InputText { text: string; label: string; path?: string; bytes: Uint8Array }

export function decodeUtf8(bytes: Uint8Array, label: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    const head = new TextDecoder('latin1').decode(bytes.subarray(0, 22));
    if (head.startsWith('AutoCAD Binary DXF')) throw new InputError(label, 'is a binary DXF, which is not read; save the drawing as ASCII DXF');
    // DXF before AutoCAD 2007 is written in the drawing's code page ($DWGCODEPAGE, mostly Windows-1252); its
    // geometry is ASCII and its text is not read, so decoding it as Windows-1252 changes no figure
    if (/\.dxf$/i.test(label)) return new TextDecoder('windows-1252').decode(bytes);
    throw new InputError(label, `is not UTF-8 text (invalid byte sequence at byte offset ${firstBadUtf8(bytes)})`);
  }
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 well-formedness). */
export function firstBadUtf8(b: Uint8Array): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i];
    let n = 0, min = 0;
    if (c < 0x80) { i++; continue; }
    if (c >= 0xc2 && c <= 0xdf) { n = 1; min = 0x80; } else if (c >= 0xe0 && c <= 0xef) { n = 2; min = 0x800; } else if (c >= 0xf0 && c <= 0xf4) { n = 3; min = 0x10000; } else return i;
    let cp = c & (0x3f >> n);
    for (let k = 1; k <= n; k++) {
      const d = b[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (d & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += n + 1;
  }
  return b.length;
}

/** Read a file (or standard input for "-") as UTF-8 text. */
export function readInputText(path: string): InputText {
  const label = path === '-' ? 'stdin' : path;
  let bytes: Uint8Array;
  try {
    if (path === '-') {
      bytes = readFileSync(0);
    } else {
      const fd = openSync(path, 'r');
      try {
        const st = fstatSync(fd);
        if (st.isDirectory()) throw new InputError(label, 'is a folder; expected a file');
        if (st.size > MAX_INPUT_BYTES) throw new InputError(label, `is ${st.size} bytes; the limit is ${MAX_INPUT_BYTES} bytes`);
        bytes = readFileSync(fd);
      } finally {
        closeSync(fd);
      }
    }
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw new InputError(label, 'no such file');
    if (code === 'EISDIR') throw new InputError(label, 'is a folder; expected a file');
    if (code === 'EACCES') throw new InputError(label, 'cannot be read (permission denied)');
    throw new InputError(label, `cannot be read (${code ?? (e as Error).message})`);
  }
  if (bytes.length > MAX_INPUT_BYTES) throw new InputError(label, `is ${bytes.length} bytes; the limit is ${MAX_INPUT_BYTES} bytes`);
  return { text: decodeUtf8(bytes, label), label, path: path === '-' ? undefined : resolve(path), bytes };
}

function sameFile(a: string, b: string): boolean {
  try { return realpathSync(a) === realpathSync(b); } catch { return resolve(a) === resolve(b); }
}

/**
 * Write `data` to `target` atomically. Refuses to write over any of `inputs`. The file appears complete
 * or not at all: it is written under a temporary name in the same folder, then renamed.
 */
export function writeFileAtomic(target: string, data: string | Uint8Array, inputs: readonly string[] = []): void {
  for (const i of inputs) {
    if (i !== '-' && existsSync(target) && sameFile(target, i)) {
      throw new InputError(target, 'is an input file of this run; choose another output name (inputs are never overwritten)');
    }
  }
  const tmp = join(dirname(resolve(target)), `.${basename(target)}.${process.pid}.${tempSuffix()}.tmp`);
  try {
    writeFileSync(tmp, data);
    renameSync(tmp, target);
  } catch (e) {
    rmSync(tmp, { force: true });
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(target, `cannot be written (${code ?? (e as Error).message})`);
  }
}

/**
 * Write several files as one step: every target is checked against the inputs (and against each other)
 * before anything is written, each file goes through a temporary name, and if any write fails the files
 * already written by this call are removed again, so a failed run leaves nothing behind (a file that one of
 * those writes had replaced is gone too: the check before writing is what protects existing files).
 */
export function writeFilesAtomic(files: readonly { target: string; data: string | Uint8Array }[], inputs: readonly string[] = []): void {
  const seen = new Set<string>();
  for (const { target } of files) {
    for (const i of inputs) {
      if (i !== '-' && existsSync(target) && sameFile(target, i)) {
        throw new InputError(target, 'is an input file of this run; choose another output name (inputs are never overwritten)');
      }
    }
    const key = resolve(target);
    if (seen.has(key)) throw new InputError(target, 'is named twice as an output of this run');
    seen.add(key);
  }
  const done: string[] = [];
  try {
    for (const { target, data } of files) {
      writeFileAtomic(target, data, inputs);
      done.push(target);
    }
  } catch (e) {
    for (const t of done) rmSync(t, { force: true });
    throw e;
  }
}
