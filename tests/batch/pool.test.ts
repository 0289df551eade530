/**
 * The worker pool (src/batch/pool.ts) with a stand-in worker script (plain JS in a temporary folder): every
 * job is answered exactly once, in any order, and a worker that dies fails only the job it was running.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { Job } from '../../src/batch/manifest.js';
import { runPool } from '../../src/batch/pool.js';
import type { BatchRow } from '../../src/batch/task.js';

const dir = mkdtempSync(join(tmpdir(), 'platewise-pool-'));
const script = join(dir, 'worker.mjs');
// answers { id, rows: [{ row, status: 'ok' }] }; exits the whole thread on the job whose row is 7
writeFileSync(script, `
import { parentPort } from 'node:worker_threads';
parentPort.on('message', (m) => {
  if (m.job.row === 7) process.exit(3);
  const t = Date.now() + (m.job.row % 3); while (Date.now() < t) {}
  parentPort.postMessage({ id: m.id, rows: [{ row: m.job.row, file: m.job.file, status: 'ok', error: null }] });
});
`);
const jobs: Job[] = Array.from({ length: 40 }, (_, i) => ({ row: i + 1, file: `f${i + 1}`, path: `/x/f${i + 1}`, quantity: 1, plate: {}, stated: [] }));

describe('runPool', () => {
  for (const size of [1, 2, 3]) {
    it(`${size} worker(s): each job answered once; the crashed one failed, the rest measured`, async () => {
      const seen: BatchRow[] = [];
      await runPool(jobs, { size, settings: { defaults: {} }, onRows: (rows) => seen.push(...rows), workerUrl: pathToFileURL(script) });
      expect(seen.map((r) => r.row).sort((a, b) => a - b)).toEqual(jobs.map((j) => j.row));
      const failed = seen.filter((r) => r.status !== 'ok');
      expect(failed.map((r) => r.row)).toEqual([7]);
      expect(failed[0].error).toMatch(/^internal error: the worker measuring this file stopped \(exit code 3\)/);
    });
  }
});
