#!/usr/bin/env node
/**
 * platewise command line. Thin: parse arguments, call src/, print. Each command is declared in
 * cli/commands/<name>.def.ts (options only, cheap to load); its body in cli/commands/<name>.ts is imported
 * only when that command runs, so start-up stays cheap.
 * Exit status (src/base/errors.ts EXIT): 0 success; 1 a check found a difference (compare, batch); 2 bad input;
 * 3 a method gave up on valid input; 4 an internal fault.
 */
import { setFlagsFromString } from 'node:v8';
import { Command, CommanderError } from 'commander';
import { COMMANDS } from './commands/index.js';
import { guardStandardStreams } from './run.js';
import { VERSION } from './version.js';

// A one-shot run spent more CPU in V8's optimising compiler (TurboFan, on background threads) than in running
// the code it optimised: on the 1,250-hole panel 457 of the 1,105 million instructions above bare Node
// (callgrind). A larger interrupt budget lets functions run longer in the interpreter and baseline code
// before they are optimised: `measure --json` on the panel took 507 -> 379 ms CPU, the mesh path 1535 ->
// 1304, a 10^5-vertex part unchanged within noise (1257 -> 1224 ms; 1,000,000 cost it 6 %, hence this
// value). It must be set before the command's modules load; it applies to this process and its workers only.
setFlagsFromString('--interrupt-budget=300000');
// The bundle is minified (start-up: `measure` of a small part 1.81 -> 1.73 × `node -e 0`, medians of 15
// alternated runs); PLATEWISE_DEBUG=1 turns on its source maps, so a stack names our own files and lines (for
// the commands' modules, which load after this line).
if (process.env.PLATEWISE_DEBUG) process.setSourceMapsEnabled(true);
guardStandardStreams();

const program = new Command();
program
  .name('platewise')
  .description('Area and mass properties of flat plates with cut-outs, each value with an error estimate.')
  .version(VERSION)
  // one line on standard error, like every other bad-input message: "platewise: <what> (run with --help for usage)"
  // commander's suggestion ("(Did you mean --thickness?)") stays on the same line
  .configureOutput({ outputError: (str, write) => write(`platewise: ${str.replace(/^error: /, '').trim().split('\n').map((l) => l.trim()).filter(Boolean).join(' ').replace(/\s*\(Did you mean (.*)\?\)/, '; did you mean $1?')} (run with --help for usage)\n`) })
  .addHelpText('after', `
Exit status:
  0  success
  1  a check found a difference (compare or batch: a stated value fails or is inconclusive)
  2  bad input: the file or an option (one line on standard error naming where; nothing written)
  3  a method gave up on valid input (mesher, clipper): the line says what was tried and what to do
  4  an internal fault: one line and a request to report it (PLATEWISE_DEBUG=1 shows the stack)
  5  an output could not be written (full disk, quota, I/O error): one line; nothing half-written is left
  130, 143  batch interrupted by SIGINT, SIGTERM: one line; finished rows kept, summary marked incomplete
  141  standard output was closed by its reader (| head): the run stops quietly, like a Unix tool on SIGPIPE`)
  .exitOverride();

// a run that names its command first defines only that command: defining every command's options cost about
// 8 ms of a small part's start-up (CPU profile); help, a version request or a mistyped command get them all
const named = Object.hasOwn(COMMANDS, process.argv[2] ?? '') ? COMMANDS[process.argv[2]] : undefined;
if (named) named(program);
else for (const define of Object.values(COMMANDS)) define(program);

try {
  await program.parseAsync(process.argv);
} catch (e) {
  if (e instanceof CommanderError) {
    process.exitCode = e.exitCode === 0 ? 0 : 2;
  } else {
    throw e;
  }
}
