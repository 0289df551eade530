#!/usr/bin/env node
/**
 * platewise command line. Thin: parse arguments, call src/, print. Each command's module is imported
 * only when that command runs, so start-up stays cheap.
 * Exit status: 0 success, 2 bad input (one line, no stack trace), 1 unexpected failure.
 */
import { Command, CommanderError, InvalidArgumentError } from 'commander';
import { run } from './run.js';

const VERSION = '0.1.0';

function intArg(name: string) {
  return (v: string) => {
    const n = Number(v);
    if (!Number.isInteger(n)) throw new InvalidArgumentError(`${name} must be a whole number`);
    return n;
  };
}

const program = new Command();
program
  .name('platewise')
  .description('Area and mass properties of flat plates with cut-outs, each value with an error estimate.')
  .version(VERSION)
  .showHelpAfterError('(run with --help for usage)')
  .exitOverride();

program
  .command('measure')
  .description('area properties of a part: area, centroid, second moments, principal axes, section moduli')
  .argument('<file>', 'part file (platewise JSON), or - for standard input')
  .option('--json', 'print JSON instead of a table')
  .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
  .option('--levels <n>', 'uniform refinements after the base mesh (the last two give the estimate)', intArg('--levels'))
  .option('--triangulation <mode>', 'delaunay or sweep')
  .action((file: string, opts) => run(async () => (await import('./commands/measure.js')).measure(file, opts)));

program
  .command('rules')
  .description("list Dunavant's triangle rules: degree, points, and marks for negative weights or points outside the triangle")
  .option('--json', 'print JSON instead of a table')
  .action((opts) => run(async () => (await import('./commands/rules.js')).rules(opts)));

try {
  await program.parseAsync(process.argv);
} catch (e) {
  if (e instanceof CommanderError) {
    process.exitCode = e.exitCode === 0 ? 0 : 2;
  } else {
    throw e;
  }
}
