/**
 * Run a command body and map failures to exit statuses (src/base/errors.ts EXIT, README "Exit status"):
 * 2 bad input (one line naming where), 3 a method gave up on valid input (what was tried, what to do),
 * 4 an internal fault (one line and a hint to report it; the stack only with PLATEWISE_DEBUG=1).
 * A check that found a difference (exit 1) is decided by the command itself, not here.
 */

/**
 * Standard output and error failures end the run in one line with a documented status (README "Exit
 * status"): a reader that closed the pipe (`platewise batch … | head`) stops the run quietly with 141, as a
 * Unix tool killed by SIGPIPE; a full disk or an I/O error on standard output prints one line and exits 5.
 * Errors on standard error itself are ignored (there is nowhere left to say anything).
 */
export function guardStandardStreams(): void {
  process.stderr.on('error', () => { /* nowhere to report */ });
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(141);
    try {
      process.stderr.write(`platewise: standard output: cannot be written (${e.code ?? e.message}${e.code === 'ENOSPC' ? ': no space left on the device' : ''})\n`);
    } catch { /* ignore */ }
    process.exit(5);
  });
}

export async function run(body: () => Promise<string | void>): Promise<void> {
  try {
    const out = await body();
    if (out) process.stdout.write(out);
  } catch (e) {
    const { isInputError, isMethodError, OptionError, OutputError, oneLine, optionFlag, EXIT } = await import('../src/base/errors.js');
    if (e instanceof OutputError) {
      process.stderr.write(`platewise: ${e.message}\n`);
      process.exitCode = EXIT.outputFailed;
    } else if (e instanceof OptionError) {
      process.stderr.write(`platewise: ${optionFlag(e.option)}: ${e.detail}\n`);
      process.exitCode = EXIT.badInput;
    } else if (isInputError(e)) {
      process.stderr.write(`platewise: ${e.message}\n`);
      process.exitCode = EXIT.badInput;
    } else if (isMethodError(e)) {
      process.stderr.write(`platewise: ${e.method} gave up: ${e.tried}; ${e.advice}\n`);
      process.exitCode = EXIT.methodGaveUp;
    } else {
      const msg = oneLine(e instanceof Error ? e.message : String(e));
      process.stderr.write(`platewise: internal error: ${msg} (this is a fault in platewise, not in your input: please report it with the command and the file; PLATEWISE_DEBUG=1 shows the stack)\n`);
      if (process.env.PLATEWISE_DEBUG) process.stderr.write(`${(e as Error)?.stack ?? String(e)}\n`);
      process.exitCode = EXIT.internal;
    }
  }
}
