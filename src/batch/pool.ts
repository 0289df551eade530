/**
 * A small pool of worker threads for `batch`: `size` workers, each given one job at a time; results are
 * handed to `onRows` as they arrive (finish order). A worker that dies (out of memory, a crash in native
 * code) fails only its current job and is replaced.
 */
import { Worker } from 'node:worker_threads';
import type { Job } from './manifest.js';
import type { BatchRow, JobSettings } from './task.js';

export interface PoolOptions {
  size: number;
  settings: JobSettings;
  onRows: (rows: BatchRow[], job: Job) => void;
  /** Worker script (default: the compiled worker.js beside this module). */
  workerUrl?: URL;
}

function crashedRow(job: Job, why: string): BatchRow {
  return {
    row: job.row, file: job.file, item: 0, items: 0, part: null, status: 'failed', quantity: job.quantity, units: null,
    material: null, thickness: null, density: null, densitySource: null, quantities: {}, verdict: null, counts: null,
    comparison: null, warnings: [], error: `internal error: the worker measuring this file stopped (${why})`,
  };
}

export function runPool(jobs: readonly Job[], options: PoolOptions): Promise<void> {
  const url = options.workerUrl ?? new URL('./worker.js', import.meta.url);
  const size = Math.max(1, Math.min(options.size, jobs.length));
  let next = 0;
  let done = 0;
  return new Promise<void>((resolveAll, rejectAll) => {
    if (jobs.length === 0) { resolveAll(); return; }
    const start = () => {
      const w = new Worker(url);
      let current = -1;
      let finished = false;
      const give = () => {
        if (next >= jobs.length) {
          finished = true;
          void w.terminate();
          return;
        }
        current = next++;
        w.postMessage({ id: current, job: jobs[current], settings: options.settings });
      };
      const complete = (rows: BatchRow[], index: number) => {
        try {
          options.onRows(rows, jobs[index]);
        } catch (e) {
          finished = true;
          void w.terminate();
          rejectAll(e);
          return;
        }
        done++;
        if (done === jobs.length) resolveAll();
      };
      w.on('message', (msg: { id: number; rows: BatchRow[] }) => {
        current = -1;
        complete(msg.rows, msg.id);
        give();
      });
      const lost = (why: string) => {
        if (finished) return;
        finished = true;
        if (current >= 0) {
          const k = current;
          current = -1;
          complete([crashedRow(jobs[k], why)], k);
        }
        if (next < jobs.length) start();
      };
      w.on('error', (e) => lost(e instanceof Error ? e.message : String(e)));
      w.on('exit', (code) => lost(`exit code ${code}`));
      give();
    };
    for (let k = 0; k < size; k++) start();
  });
}
