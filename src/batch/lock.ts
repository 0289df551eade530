/**
 * One writer per output file: `acquireLock(target)` creates a lock file beside the target exclusively (O_EXCL)
 * holding the process id, so that a second `batch -o same.csv --force` started while the first runs is refused
 * in one line instead of interleaving its rows with the first's. A lock left by a process that no longer
 * exists (killed with SIGKILL, a crash) is taken over. The lock's name is short and fixed-length (a hash of
 * the target's real path), so it fits the file-name limit whatever the target's name.
 */
import { createHash } from 'node:crypto';
import { closeSync, openSync, readFileSync, realpathSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { InputError } from '../base/errors.js';

function alive(pid: number): boolean {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try { process.kill(pid, 0); return true; } catch (e) { return (e as NodeJS.ErrnoException).code === 'EPERM'; }
}

/** The lock file's path for `target`: `.pw-<16 hex digits>.lock` in the target's folder. */
export function lockPath(target: string): string {
  const folder = dirname(resolve(target));
  let real: string;
  try { real = join(realpathSync(folder), basename(target)); } catch { real = resolve(target); }
  return join(folder, `.pw-${createHash('sha256').update(real).digest('hex').slice(0, 16)}.lock`);
}

/** Take the lock for `target` or refuse; returns the function that releases it. */
export function acquireLock(target: string, where: string): () => void {
  const path = lockPath(target);
  for (let attempt = 0; attempt < 3; attempt++) {
    let fd: number;
    try {
      fd = openSync(path, 'wx', 0o644);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code !== 'EEXIST') throw new InputError(where, `"${target}" cannot be locked for writing (${code ?? (e as Error).message})`);
      let text: string | null = null;
      try { text = readFileSync(path, 'utf8').trim(); } catch { continue; /* vanished: try again */ }
      const pid = Number(text);
      // an empty lock is one whose writer has not yet written its id: held
      if (text === '' || alive(pid)) throw new InputError(where, `"${target}" is being written by another platewise run (process ${text || 'starting'}); wait for it to finish or choose another name`);
      rmSync(path, { force: true }); // stale: its writer is gone
      continue;
    }
    try { writeSync(fd, `${process.pid}\n`); } finally { closeSync(fd); }
    let released = false;
    return () => {
      if (released) return;
      released = true;
      rmSync(path, { force: true });
    };
  }
  throw new InputError(where, `"${target}" cannot be locked for writing (another run keeps taking the lock)`);
}
