/**
 * Worker-thread entry for `batch`: receives jobs one at a time, answers each with its rows.
 * Messages in: { id, job, settings }; out: { id, rows }. Loaded from dist/cli/worker.js (bundled) or dist/src/batch/worker.js (tsc output), beside the pool.
 */
import { parentPort } from 'node:worker_threads';
import type { Job } from './manifest.js';
import { type JobSettings, runJob } from './task.js';

if (!parentPort) throw new Error('src/batch/worker.ts must run in a worker thread');
const port = parentPort;
port.on('message', (msg: { id: number; job: Job; settings: JobSettings }) => {
  port.postMessage({ id: msg.id, rows: runJob(msg.job, msg.settings) });
});
