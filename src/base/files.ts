/**
 * File access for the CLI and library: strict UTF-8 reading with a size limit enforced while reading (any file,
 * device, pipe or standard input stops at the limit + 1 byte), and atomic writing (a short temporary name in
 * the target's folder, then rename or link) that never writes over an input (same device and inode, whatever
 * the name: hard links, symlinks, ./ prefixes), never over a device, FIFO or socket, and never over an
 * existing file without `force`.
 */
import { closeSync, constants, fstatSync, linkSync, lstatSync, openSync, readSync, realpathSync, renameSync, rmSync, statSync, writeSync, type Stats } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { InputError, OutputError } from './errors.js';

let tempCounter = 0;
/**
 * A temporary name in `folder`, short whatever the target's name (".pw" + pid + counter + random + ".tmp", under
 * 40 bytes), so that a target whose name is at the 255-byte limit can still be written.
 */
function tempName(folder: string): string {
  tempCounter++;
  return join(folder, `.pw${process.pid.toString(36)}-${tempCounter.toString(36)}${Math.floor(Math.random() * 0x100000000).toString(36)}.tmp`);
}

export interface InputText { text: string; label: string; path?: string; bytes: Uint8Array }

export { MAX_INPUT_BYTES, decodeUtf8, firstBadUtf8 } from './utf8.js';
import { MAX_INPUT_BYTES, decodeUtf8 } from './utf8.js';

/** How a file is read: `regularOnly` refuses anything but a regular file (devices, FIFOs, /dev/stdin) by name. */
export interface ReadInputOptions { regularOnly?: boolean; limit?: number }

function kindOf(st: Stats): string {
  if (st.isDirectory()) return 'a folder';
  if (st.isFIFO()) return 'a FIFO (named pipe)';
  if (st.isCharacterDevice()) return 'a character device';
  if (st.isBlockDevice()) return 'a block device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

/** Sleep briefly without an event loop (a non-blocking standard input that has no data yet). */
function pause(ms: number): void {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

/**
 * Read everything from `fd`, but never more than `limit` + 1 bytes: the size is checked while reading, so
 * a device (/dev/zero), a pipe or standard input cannot make the process read without end.
 */
export function readBounded(fd: number, label: string, limit: number = MAX_INPUT_BYTES): Uint8Array {
  const chunks: Uint8Array[] = [];
  let total = 0;
  let chunk = Buffer.allocUnsafe(1 << 16);
  for (;;) {
    let n: number;
    try {
      n = readSync(fd, chunk, 0, Math.min(chunk.length, limit + 1 - total), null);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code === 'EAGAIN') { pause(5); continue; }
      if (code === 'EOF') break;
      throw e;
    }
    if (n === 0) break;
    chunks.push(chunk.subarray(0, n));
    total += n;
    if (total > limit) throw new InputError(label, `is larger than the limit of ${limit} bytes (reading stopped at ${limit + 1} bytes)`);
    if (n === chunk.length) chunk = Buffer.allocUnsafe(Math.min(chunk.length * 2, 1 << 22));
    else chunk = chunk.subarray(n);
    if (chunk.length === 0) chunk = Buffer.allocUnsafe(1 << 16);
  }
  return chunks.length === 1 ? chunks[0] : Buffer.concat(chunks, total);
}

/** Read a file (or standard input for "-") as UTF-8 text. */
export function readInputText(path: string, options: ReadInputOptions = {}): InputText {
  const label = path === '-' ? 'stdin' : path;
  const limit = options.limit ?? MAX_INPUT_BYTES;
  let bytes: Uint8Array;
  try {
    if (path === '-') {
      if (options.regularOnly) throw new InputError(label, 'standard input cannot be read here; name a file');
      bytes = readBounded(0, label, limit);
    } else {
      if (options.regularOnly) {
        // /dev/stdin, /dev/fd/N, /proc/self/fd/N: whatever they point to, they are not files of the job
        let real = '';
        try { real = realpathSync(path); } catch { /* the open below reports it */ }
        if (/^\/(dev|proc)\//.test(real) || /^\/(dev|proc)\//.test(resolve(path))) throw new InputError(label, 'is a device or process file, not a regular file; name a regular file');
      }
      // O_NONBLOCK: opening a FIFO must not wait for a writer before it can be refused
      const fd = openSync(path, options.regularOnly ? constants.O_RDONLY | constants.O_NONBLOCK : 'r');
      try {
        const st = fstatSync(fd);
        if (st.isDirectory()) throw new InputError(label, 'is a folder; expected a file');
        if (options.regularOnly && !st.isFile()) throw new InputError(label, `is ${kindOf(st)}, not a regular file; name a regular file`);
        if (st.isFile() && st.size > limit) throw new InputError(label, `is ${st.size} bytes; the limit is ${limit} bytes`);
        bytes = readBounded(fd, label, limit);
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
  return { text: decodeUtf8(bytes, label), label, path: path === '-' ? undefined : resolve(path), bytes };
}

/** Options of a write: `force` lets an existing regular file (never an input) be replaced; `flag` labels messages. */
export interface WriteOptions { force?: boolean; flag?: string }

function statOrNull(p: string): Stats | null {
  try { return statSync(p); } catch { return null; }
}

/** Error codes that mean the output medium failed (not the name the user gave): exit status 5. */
const MEDIUM_FAILURES = new Set(['ENOSPC', 'EDQUOT', 'EIO', 'EFBIG']);

function writeFailure(where: string, e: unknown): Error {
  const code = (e as NodeJS.ErrnoException).code;
  if (code && MEDIUM_FAILURES.has(code)) return new OutputError(where, `cannot be written (${code}${code === 'ENOSPC' ? ': no space left on the device' : code === 'EDQUOT' ? ': disk quota exceeded' : ''}); nothing was written`);
  return new InputError(where, `cannot be written (${code ?? (e as Error).message})`);
}

/**
 * Check an output name before anything is computed or written: refused when it is one of `inputs` (same
 * device and inode, so hard links and symlinks are caught), a folder, a device, FIFO or socket (directly or
 * through a symlink), or an existing file without `force`. Returns the path to write (a symlink to a
 * regular file is written through, so the link stays a link).
 */
export function checkOutputTarget(target: string, inputs: readonly string[], options: WriteOptions = {}): string {
  const where = options.flag ?? target;
  const said = options.flag ? `"${target}" ` : '';
  if (target.trim() === '') throw new InputError(where, 'expected a file name, got an empty text');
  const st = statOrNull(target);
  let lst: Stats | null = null;
  try { lst = lstatSync(target); } catch { /* absent */ }
  if (!st) {
    if (lst?.isSymbolicLink()) throw new InputError(where, `${said}is a symbolic link to nothing; remove it or choose another name`.trim());
    return target;
  }
  for (const i of inputs) {
    if (i === '-') continue;
    const si = statOrNull(i);
    if (si && si.dev === st.dev && si.ino === st.ino) throw new InputError(where, `${said}is an input file of this run; choose another output name (inputs are never overwritten)`.trim());
  }
  if (st.isDirectory()) throw new InputError(where, `${said}is a folder; expected a file name`.trim());
  if (!st.isFile()) throw new InputError(where, `${said}is ${kindOf(st)}; outputs are written to regular files only (use - for standard output)`.trim());
  if (!options.force) throw new InputError(where, `${said}already exists; choose a new name or add --force to replace it`.trim());
  return lst?.isSymbolicLink() ? realpathSync(target) : target;
}

/** Write all of `data` to `fd`. */
function writeAll(fd: number, data: string | Uint8Array): void {
  const buf = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
  let off = 0;
  while (off < buf.length) off += writeSync(fd, buf, off, buf.length - off);
}

/**
 * Put the finished temporary file `tmp` in place as `path`: with `replace`, rename over it; otherwise link
 * (fails if a file of that name appeared meanwhile, so nothing is replaced) and remove the temporary name.
 */
export function publish(tmp: string, path: string, replace: boolean, where: string): void {
  if (replace) { renameSync(tmp, path); return; }
  try {
    linkSync(tmp, path);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') throw new InputError(where, 'appeared while this run was writing it (another program?); nothing was replaced');
    if (code === 'EPERM' || code === 'ENOTSUP' || code === 'EOPNOTSUPP') { renameSync(tmp, path); return; }
    throw e;
  }
  rmSync(tmp, { force: true });
}

/** A temporary file beside `path`, created exclusively; the caller writes to `fd` then publishes or removes it. */
export function createTemp(path: string, where: string): { tmp: string; fd: number } {
  const folder = dirname(resolve(path));
  for (let k = 0; ; k++) {
    const tmp = tempName(folder);
    try {
      return { tmp, fd: openSync(tmp, 'wx', 0o666) };
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'EEXIST' && k < 5) continue;
      throw writeFailure(where, e);
    }
  }
}

/**
 * Write `data` to `target` atomically. Refuses to write over any of `inputs` and over anything but a regular
 * file (checkOutputTarget); an existing file is replaced only with `force`. The file appears complete or not
 * at all: it is written under a short temporary name in the same folder, then renamed (or linked).
 */
export function writeFileAtomic(target: string, data: string | Uint8Array, inputs: readonly string[] = [], options: WriteOptions = { force: true }): void {
  const path = checkOutputTarget(target, inputs, options);
  const where = options.flag ? `${options.flag}: "${target}"` : target;
  const replace = statOrNull(path) !== null;
  const { tmp, fd } = createTemp(path, where);
  try {
    try { writeAll(fd, data); } finally { closeSync(fd); }
    publish(tmp, path, replace, where);
  } catch (e) {
    rmSync(tmp, { force: true });
    if (e instanceof InputError || e instanceof OutputError) throw e;
    throw writeFailure(where, e);
  }
}

/**
 * Write several files as one step: every target is checked against the inputs (and against each other)
 * before anything is written, each file goes through a temporary name, and if any write fails the files
 * already written by this call are removed again, so a failed run leaves nothing behind (a file that one of
 * those writes had replaced is gone too: the check before writing is what protects existing files).
 */
export function writeFilesAtomic(files: readonly { target: string; data: string | Uint8Array }[], inputs: readonly string[] = [], options: WriteOptions = { force: true }): void {
  const seen = new Set<string>();
  for (const { target } of files) {
    checkOutputTarget(target, inputs, options);
    const key = resolve(target);
    if (seen.has(key)) throw new InputError(target, 'is named twice as an output of this run');
    seen.add(key);
  }
  const done: string[] = [];
  try {
    for (const { target, data } of files) {
      writeFileAtomic(target, data, inputs, options);
      done.push(target);
    }
  } catch (e) {
    for (const t of done) rmSync(t, { force: true });
    throw e;
  }
}
