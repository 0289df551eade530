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
  /**
   * Stops the pool (SIGINT, SIGTERM): no further job starts, the workers are terminated, results that arrive
   * afterwards are dropped, and the promise resolves with the number of jobs whose rows were delivered. Rows
   * are delivered whole or not at all, so nothing handed to `onRows` is ever torn.
   */
  stop?: AbortSignal;
}

function crashedRow(job: Job, why: string): BatchRow {
  return {
    row: job.row, file: job.file, item: 0, items: 0, part: null, status: 'failed', quantity: job.quantity, units: null, unitSource: null, markingLength: null,
    material: null, thickness: null, density: null, densitySource: null, quantities: {}, verdict: null, counts: null,
    comparison: null, warnings: [], error: `internal error: the worker measuring this file stopped (${why})`,
  };
}

/** Jobs kept in flight per worker, so that a worker never waits for the main thread between jobs. */
const IN_FLIGHT = 2;

export function runPool(jobs: readonly Job[], options: PoolOptions): Promise<number> {
  // beside this module: dist/src/batch/worker.js in the tsc build; in the bundled command line dist/cli/worker.js,
  // bundled with it (a few shared chunks instead of about 110 modules: each worker's start-up cost 380 ms CPU
  // when loaded from the tsc output, 260 ms bundled, measured on a 10-part batch under load 14)
  const url = options.workerUrl ?? new URL('./worker.js', import.meta.url);
  const size = Math.max(1, Math.min(options.size, jobs.length));
  const queue: number[] = jobs.map((_, i) => i);
  let done = 0;
  return new Promise<number>((resolveAll, rejectAll) => {
    if (jobs.length === 0) { resolveAll(0); return; }
    let stopped = false;
    const live = new Set<Worker>();
    const halt = () => {
      if (stopped) return;
      stopped = true;
      for (const w of live) void w.terminate();
      resolveAll(done);
    };
    if (options.stop?.aborted) { halt(); return; }
    options.stop?.addEventListener('abort', halt, { once: true });
    const complete = (rows: BatchRow[], index: number): boolean => {
      if (stopped) return false;
      try {
        options.onRows(rows, jobs[index]);
      } catch (e) {
        stopped = true;
        for (const w of live) void w.terminate();
        rejectAll(e);
        return false;
      }
      done++;
      if (done === jobs.length) {
        stopped = true;
        options.stop?.removeEventListener('abort', halt);
        for (const w of live) void w.terminate();
        resolveAll(done);
      }
      return true;
    };
    const start = () => {
      const w = new Worker(url);
      live.add(w);
      const inFlight: number[] = []; // job indices sent, in the order the worker runs them
      let gone = false;
      const fill = () => {
        while (!stopped && inFlight.length < IN_FLIGHT && queue.length > 0) {
          const k = queue.shift()!;
          inFlight.push(k);
          w.postMessage({ id: k, job: jobs[k], settings: options.settings });
        }
        if (inFlight.length === 0 && !gone) {
          gone = true;
          live.delete(w);
          void w.terminate();
        }
      };
      w.on('message', (msg: { id: number; rows: BatchRow[] }) => {
        const at = inFlight.indexOf(msg.id);
        if (at >= 0) inFlight.splice(at, 1);
        if (complete(msg.rows, msg.id)) fill();
      });
      const lost = (why: string) => {
        if (gone) return;
        gone = true;
        live.delete(w);
        if (stopped) return;
        // the job it was running fails; the ones waiting behind it go back to the queue
        const [running, ...waiting] = inFlight;
        queue.unshift(...waiting);
        if (running !== undefined && !complete([crashedRow(jobs[running], why)], running)) return;
        if (queue.length > 0) start();
      };
      w.on('error', (e) => lost(e instanceof Error ? e.message : String(e)));
      w.on('exit', (code) => lost(`exit code ${code}`));
      fill();
    };
    for (let k = 0; k < size && !stopped; k++) start();
  });
}
