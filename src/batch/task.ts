/**
 * One batch job, start to finish: read the part file (and its reference file) and hand the texts to
 * `jobRows` (src/batch/jobRows.ts). Runs inside a worker thread (src/batch/worker.ts) and may be called
 * directly (tests, a single-threaded run). Never throws: a failure becomes the row's `error`.
 */
import { readInputText } from '../base/files.js';
import { type BatchRow, type JobSettings, jobRows } from './jobRows.js';
import type { Job } from './manifest.js';

export type { BatchRow, JobSettings } from './jobRows.js';

export function runJob(job: Job, settings: JobSettings): BatchRow[] {
  return jobRows(job, settings, {
    part: () => readInputText(job.path, { regularOnly: true }),
    reference: () => readInputText(job.reference!.path, { regularOnly: true }),
  });
}
