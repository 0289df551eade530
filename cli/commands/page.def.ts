import type { Command } from 'commander';
import { run } from '../run.js';

export function definePage(program: Command): void {
  program
    .command('page')
    .description('write the offline page (one HTML file: drop drawings in, see how they were read, get the figures; no server, no network)')
    .option('-o, --output <file.html>', 'write here (default or -: standard output)')
    .option('--force', 'allow --output to replace an existing file (never a device or FIFO)')
    .action((opts) => run(async () => (await import('./page.js')).page(opts)));
}
