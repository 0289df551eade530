import type { Command } from 'commander';
import { intArg, addDrawingOptions } from '../options.js';
import { run } from '../run.js';

export function defineBatch(program: Command): void {
  addDrawingOptions(program
    .command('batch')
    .description('measure many parts at once: a folder of part files or a manifest (CSV); one result row per part, totals at the end')
    .argument('<source>', 'a folder (every .json, .svg, .geojson, .wkt file in it) or a manifest .csv')
    .option('-o, --output <file>', 'write result rows to this new file as they finish (default: standard output)')
    .option('--force', 'allow --output (and its summary file) to replace an existing file (never an input)')
    .option('--jsonl', 'JSON Lines rows, the last line a summary (default: CSV, or by the --output extension .jsonl)')
    .option('--csv', 'CSV rows (RFC 4180)')
    .option('--jobs <n>', 'worker threads (default: one per core)', intArg('--jobs'))
    .option('--thickness <t>', 'plate thickness for every row that gives none, e.g. "10 mm"')
    .option('--material <name>', 'material for every row that gives none (its nominal density)')
    .option('--density <d>', 'density for every row that gives none, e.g. "7850 kg/m3"')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--levels <n>', 'uniform refinements after the base mesh', intArg('--levels'))
    .option('--quiet', 'no progress bar and no summary on standard error')
    .addHelpText('after', '\nExit status: 0 every part measured and every stated value passes; 1 a part failed or a stated value failed\n' +
      'or was inconclusive; 2 bad manifest or arguments (nothing is measured).'))
    .action((source: string, opts) => run(async () => (await import('./batch.js')).batch(source, opts)));
}
