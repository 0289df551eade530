import { closeSync, existsSync, openSync, realpathSync, statSync, writeSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { InputError } from '../../src/base/errors.js';
import { readInputText, writeFileAtomic } from '../../src/base/files.js';
import { type Job, folderJobs, manifestBase, parseManifest } from '../../src/batch/manifest.js';
import { runPool } from '../../src/batch/pool.js';
import { type BatchSummary, SummaryBuilder, batchCsvHeader, batchCsvRow, batchJsonLine, summaryText } from '../../src/output/batchRows.js';
import type { BatchRow } from '../../src/batch/task.js';
import { checkSettings } from '../../src/model/plate.js';
import { type DrawingFlags, plateSettings, readOptions } from './settings.js';

export interface BatchFlags extends DrawingFlags {
  output?: string; force?: boolean; jsonl?: boolean; csv?: boolean; jobs?: number;
  thickness?: string; material?: string; density?: string; degree?: number; levels?: number; quiet?: boolean;
}

function real(p: string): string {
  try { return realpathSync(p); } catch { return resolve(p); }
}

/** The summary file beside a CSV output: results.csv → results.summary.json. */
export function summaryPath(output: string): string {
  return /\.[^./\\]+$/.test(output) ? output.replace(/\.[^./\\]+$/, '.summary.json') : output + '.summary.json';
}

function checkTarget(target: string, inputs: Set<string>, force: boolean | undefined, flag: string): void {
  if (inputs.has(real(target))) throw new InputError(flag, `"${target}" is an input of this run; choose another name (inputs are never overwritten)`);
  if (existsSync(target)) {
    if (statSync(target).isDirectory()) throw new InputError(flag, `"${target}" is a folder; expected a file name`);
    if (!force) throw new InputError(flag, `"${target}" already exists; choose a new name or add --force to replace it`);
  }
}

export async function batch(source: string, flags: BatchFlags): Promise<string> {
  if (flags.jsonl && flags.csv) throw new InputError('--csv', 'choose one of --jsonl and --csv');
  if (flags.jobs !== undefined && (flags.jobs < 1 || flags.jobs > 256)) throw new InputError('--jobs', `expected 1 to 256 worker threads, got ${flags.jobs}`);
  if (flags.levels !== undefined && (flags.levels < 1 || flags.levels > 6)) throw new InputError('--levels', `expected 1 to 6, got ${flags.levels}`);
  if (flags.degree !== undefined && (flags.degree < 1 || flags.degree > 20)) throw new InputError('--degree', `expected 1 to 20, got ${flags.degree}`);
  const defaults = plateSettings(flags);
  checkSettings(defaults);

  // the jobs: everything about the manifest is checked before any work starts
  let jobs: Job[];
  let isFolder = false;
  try { isFolder = statSync(source).isDirectory(); } catch { /* readInputText reports it */ }
  if (isFolder) {
    jobs = folderJobs(source);
  } else {
    if (/\.(json|svg|dxf|geojson|wkt)$/i.test(source) && !/\.csv$/i.test(source)) {
      throw new InputError(source, 'is a part file; batch takes a folder of part files or a manifest (CSV with a header naming the column "file"); to measure one part use platewise measure');
    }
    const m = readInputText(source);
    jobs = parseManifest(m.text, m.label, manifestBase(source));
  }

  const jsonl = flags.jsonl || (!flags.csv && flags.output !== undefined && /\.(jsonl|ndjson)$/i.test(flags.output));
  const inputs = new Set<string>([real(source)]);
  for (const j of jobs) {
    inputs.add(real(j.path));
    if (j.reference) inputs.add(real(j.reference.path));
  }
  let fd: number | null = null;
  let sidecar: string | undefined;
  if (flags.output !== undefined) {
    checkTarget(flags.output, inputs, flags.force, '--output');
    if (!jsonl) {
      sidecar = summaryPath(flags.output);
      checkTarget(sidecar, inputs, flags.force, '--output');
    }
    try {
      fd = openSync(flags.output, flags.force ? 'w' : 'wx');
    } catch (e) {
      throw new InputError('--output', `"${flags.output}" cannot be created (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
    }
  }
  const write = (text: string) => {
    if (fd !== null) writeSync(fd, text);
    else process.stdout.write(text);
  };

  const size = Math.min(flags.jobs ?? availableParallelism(), jobs.length);
  const summary = new SummaryBuilder(size);
  const showBar = !flags.quiet && process.stderr.isTTY === true;
  let bar: { increment: (n: number, payload: object) => void; stop: () => void } | null = null;
  if (showBar) {
    const { default: cliProgress } = await import('cli-progress');
    const b = new cliProgress.SingleBar({
      stream: process.stderr, hideCursor: true, clearOnComplete: false,
      format: 'measuring [{bar}] {value}/{total} files | {failed} failed | {duration_formatted} elapsed, about {eta_formatted} left',
    }, cliProgress.Presets.shades_classic);
    b.start(jobs.length, 0, { failed: 0 });
    bar = b;
  }
  let failedParts = 0;
  const t0 = performance.now();
  let result: BatchSummary;
  try {
    write(jsonl ? '' : batchCsvHeader());
    await runPool(jobs, {
      size,
      settings: { defaults, degree: flags.degree, levels: flags.levels, read: readOptions(flags) },
      onRows: (rows: BatchRow[]) => {
        let text = '';
        for (const r of rows) {
          summary.add(r);
          if (r.status !== 'ok') failedParts++;
          text += jsonl ? batchJsonLine(r) : batchCsvRow(r);
        }
        write(text); // one write per file's rows: an interrupted run keeps every row it finished
        bar?.increment(1, { failed: failedParts });
      },
    });
    result = summary.finish((performance.now() - t0) / 1000);
    if (jsonl) write(JSON.stringify({ summary: result }) + '\n');
  } finally {
    bar?.stop();
    if (fd !== null) closeSync(fd);
  }
  if (sidecar) writeFileAtomic(sidecar, JSON.stringify({ summary: result }, null, 2) + '\n', [...inputs]);
  if (!flags.quiet) process.stderr.write(summaryText(result));
  if (result.partsFailed > 0 || result.verdicts.fail > 0 || result.verdicts.inconclusive > 0) process.exitCode = 1;
  return '';
}
