import { closeSync, rmSync, statSync, writeSync } from 'node:fs';
import { availableParallelism, freemem } from 'node:os';
import { performance } from 'node:perf_hooks';
import { EXIT, InputError, OutputError, jsonTerminalText, terminalText } from '../../src/base/errors.js';
import { checkOutputTarget, createTemp, publish, readInputText, writeFileAtomic } from '../../src/base/files.js';
import { acquireLock } from '../../src/batch/lock.js';
import { type Job, folderJobs, manifestBase, parseManifest } from '../../src/batch/manifest.js';
import { runPool } from '../../src/batch/pool.js';
import { InJobOrder } from '../../src/batch/order.js';
import { type BatchLine, batchLine } from '../../src/batch/lines.js';
import { type ShopRates, parseRates } from '../../src/batch/rates.js';
import { RFC_4180, SPREADSHEET_LOCALE } from '../../src/base/csv.js';
import { type BatchSummary, SummaryBuilder, batchCsvHeader, batchCsvRow, batchJsonLine, summaryText } from '../../src/output/batchRows.js';
import type { BatchRow } from '../../src/batch/task.js';
import { checkSettings } from '../../src/model/plate.js';
import { type DrawingFlags, plateSettings, readOptions } from './settings.js';

export interface BatchFlags extends DrawingFlags {
  output?: string; force?: boolean; jsonl?: boolean; csv?: boolean; jobs?: number;
  thickness?: string; material?: string; density?: string; degree?: number; levels?: number; quiet?: boolean;
  decimalComma?: boolean; rates?: string;
}

const DIALECT_SWITCH = { toSemicolons: 'add --decimal-comma', toCommas: '--decimal-comma applies to the manifest and the rates file alike; leave it out for comma-separated CSV' };

/** The summary file beside a CSV output: results.csv → results.summary.json. */
export function summaryPath(output: string): string {
  return /\.[^./\\]+$/.test(output) ? output.replace(/\.[^./\\]+$/, '.summary.json') : output + '.summary.json';
}

/** Memory one worker may need for a large part (a mesh of about a million triangles). */
const WORKER_MEMORY_BYTES = 512 * 1024 * 1024;

/** Workers are capped by cores and by memory (one per 512 MiB of free memory, at least one). */
export function workerCap(): number {
  return Math.max(1, Math.min(availableParallelism(), Math.floor(freemem() / WORKER_MEMORY_BYTES)));
}

export async function batch(source: string, flags: BatchFlags): Promise<string> {
  if (flags.jsonl && flags.csv) throw new InputError('--csv', 'choose one of --jsonl and --csv');
  if (flags.jobs !== undefined && (flags.jobs < 1 || flags.jobs > 256)) throw new InputError('--jobs', `expected 1 to 256 worker threads, got ${flags.jobs}`);
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  if (flags.levels !== undefined && (flags.levels < 1 || flags.levels > 6)) throw new InputError('--levels', `expected 1 to 6, got ${flags.levels}`);
  if (flags.degree !== undefined && (flags.degree < 1 || flags.degree > 20)) throw new InputError('--degree', `expected 1 to 20, got ${flags.degree}`);
  const defaults = plateSettings(flags);
  checkSettings(defaults);
  const dialect = flags.decimalComma ? SPREADSHEET_LOCALE : RFC_4180;

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
    jobs = parseManifest(m.text, m.label, manifestBase(source), { dialect, dialectSwitch: DIALECT_SWITCH });
  }
  let rates: ShopRates | undefined;
  if (flags.rates !== undefined) {
    const rt = readInputText(flags.rates, { regularOnly: true });
    rates = parseRates(rt.text, rt.label, { dialect, dialectSwitch: DIALECT_SWITCH });
  }

  const jsonl = flags.jsonl || (!flags.csv && flags.output !== undefined && /\.(jsonl|ndjson)$/i.test(flags.output));
  if (jsonl && flags.decimalComma) throw new InputError('--decimal-comma', 'applies to CSV; JSON Lines always write numbers with a decimal point');
  const inputs: string[] = [source];
  if (flags.rates !== undefined) inputs.push(flags.rates);
  for (const j of jobs) {
    inputs.push(j.path);
    if (j.reference) inputs.push(j.reference.path);
  }
  const toFile = flags.output !== undefined && flags.output !== '-';
  const opts = { force: flags.force, flag: '--output' };
  let target = '';
  let sidecar: string | undefined;
  let release: (() => void) | null = null;
  let tmp = '';
  let fd: number | null = null;
  let replace = false;
  if (toFile) {
    // every output is checked (inputs by device and inode, devices and FIFOs, --force) before any work
    target = checkOutputTarget(flags.output!, inputs, opts);
    if (!jsonl) {
      sidecar = summaryPath(flags.output!);
      checkOutputTarget(sidecar, inputs, opts);
    }
    // one writer per output: a second run on the same name is refused while this one holds the lock
    release = acquireLock(target, '--output');
    try {
      replace = (() => { try { return statSync(target).isFile(); } catch { return false; } })();
      ({ tmp, fd } = createTemp(target, `--output: "${flags.output}"`));
    } catch (e) {
      release();
      throw e;
    }
  }
  const where = `--output: "${flags.output}"`;
  const write = (text: string) => {
    if (fd !== null) {
      const buf = Buffer.from(text, 'utf8');
      let off = 0;
      try {
        while (off < buf.length) off += writeSync(fd, buf, off, buf.length - off);
      } catch (e) {
        const code = (e as NodeJS.ErrnoException).code ?? (e as Error).message;
        throw new OutputError(where, `cannot be written (${code}${code === 'ENOSPC' ? ': no space left on the device' : ''}); nothing was written`);
      }
    } else {
      // to a terminal or a pipe: JSON lines with every unsafe character as \uXXXX (the same text when read);
      // CSV to a terminal escaped too (a CSV file or pipe keeps the exact text)
      process.stdout.write(jsonl ? jsonTerminalText(text) : process.stdout.isTTY ? terminalText(text) : text);
    }
  };

  const cap = workerCap();
  const asked = flags.jobs ?? availableParallelism();
  const size = Math.max(1, Math.min(asked, cap, jobs.length));
  if (flags.jobs !== undefined && flags.jobs > cap && !flags.quiet) {
    process.stderr.write(`platewise: --jobs ${flags.jobs} capped at ${cap} worker${cap === 1 ? '' : 's'} (${availableParallelism()} cores, ${Math.round(freemem() / 2 ** 20)} MiB free memory, ${WORKER_MEMORY_BYTES / 2 ** 20} MiB per worker)\n`);
  }
  const summary = new SummaryBuilder(size, rates);
  const csvOptions = { dialect, currency: rates?.currency };
  const showBar = !flags.quiet && process.stderr.isTTY === true;
  let bar: { increment: (n: number, payload: object) => void; stop: () => void } | null = null;
  // SIGINT / SIGTERM: stop starting jobs, keep every finished row, mark the summary incomplete, one line
  const stop = new AbortController();
  let signal: NodeJS.Signals | null = null;
  const onSignal = (sig: NodeJS.Signals) => { if (signal === null) { signal = sig; stop.abort(); } };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  let failedParts = 0;
  let rowsDone = 0;
  const t0 = performance.now();
  let result: BatchSummary & { complete: boolean; interrupted?: { signal: string; rowsFinished: number; rowsTotal: number } };
  let ok = false;
  try {
    if (showBar) {
      const { default: cliProgress } = await import('cli-progress');
      const b = new cliProgress.SingleBar({
        stream: process.stderr, hideCursor: true, clearOnComplete: false,
        format: 'measuring [{bar}] {value}/{total} files | {failed} failed | {duration_formatted} elapsed, about {eta_formatted} left',
      }, cliProgress.Presets.shades_classic);
      b.start(jobs.length, 0, { failed: 0 });
      bar = b;
    }
    write(jsonl ? '' : batchCsvHeader(csvOptions));
    // workers finish in any order; rows are written in job order (manifest rows, or the folder's sorted
    // names), each job's rows held until every earlier job's are written, then written whole
    const index = new Map<Job, number>(jobs.map((j, k) => [j, k]));
    const order = new InJobOrder<BatchLine[]>((lines) => {
      let text = '';
      for (const l of lines) text += jsonl ? batchJsonLine(l) : batchCsvRow(l, csvOptions);
      write(text); // one write per file's rows: an interrupted run keeps every row it finished, none torn
      for (const l of lines) summary.add(l); // in job order: the totals do not depend on the number of workers
    });
    rowsDone = await runPool(jobs, {
      size,
      stop: stop.signal,
      settings: { defaults, degree: flags.degree, levels: flags.levels, read: readOptions(flags) },
      onRows: (rows: BatchRow[], job: Job) => {
        for (const r of rows) if (r.status !== 'ok') failedParts++;
        order.put(index.get(job)!, rows.map((r) => batchLine(r, job.note, rates)));
        bar?.increment(1, { failed: failedParts });
      },
    });
    // interrupted: rows that finished behind an unfinished one are kept too, still in ascending order
    order.flush();
    const finished = summary.finish((performance.now() - t0) / 1000);
    for (const k of ['netMassKg', 'netMassErrorKg', 'blankMassKg', 'cutLengthM', 'pierces', 'pieces', 'areaM2', 'markingLengthM'] as const) {
      if (!Number.isFinite(finished[k])) throw new InputError('batch', `the total ${k} is beyond the range of numbers (${finished[k]}); check the quantities and masses of the rows`);
    }
    if (finished.rates && !Number.isFinite(finished.rates.totalCost)) throw new InputError(flags.rates!, `the total cost is beyond the range of numbers (${finished.rates.totalCost}); check the rates and quantities`);
    result = signal === null
      ? { ...finished, complete: true }
      : { ...finished, complete: false, interrupted: { signal, rowsFinished: rowsDone, rowsTotal: jobs.length } };
    if (jsonl) write(JSON.stringify({ summary: result }) + '\n');
    ok = true;
  } finally {
    bar?.stop();
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    if (fd !== null) closeSync(fd);
    try {
      if (ok && toFile) publish(tmp, target, replace || flags.force === true, where);
    } catch (e) {
      ok = false;
      if (!(e instanceof InputError)) throw new OutputError(where, `cannot be written (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
      throw e;
    } finally {
      if (tmp) rmSync(tmp, { force: true });
      if (!ok) release?.();
    }
  }
  try {
    if (sidecar) writeFileAtomic(sidecar, JSON.stringify({ summary: result }, null, 2) + '\n', inputs, opts);
  } finally {
    release?.();
  }
  if (signal !== null) {
    const out = toFile ? `; ${flags.output} holds the ${rowsDone} finished row${rowsDone === 1 ? '' : 's'}${sidecar ? ` and ${sidecar} is marked incomplete` : ', its summary line marked incomplete'}` : '';
    process.stderr.write(`platewise: interrupted by ${signal} after ${rowsDone} of ${jobs.length} rows${out}\n`);
    process.exitCode = signal === 'SIGINT' ? EXIT.interrupted : EXIT.terminated;
    return '';
  }
  if (!flags.quiet) process.stderr.write(summaryText(result));
  if (result.partsFailed > 0 || result.verdicts.fail > 0 || result.verdicts.inconclusive > 0) process.exitCode = 1;
  return '';
}
