/** Run a command body and map failures to exit status: 2 for bad input, 1 for anything unexpected. */
export async function run(body: () => Promise<string | void>): Promise<void> {
  try {
    const out = await body();
    if (out) process.stdout.write(out);
  } catch (e) {
    const { isInputError } = await import('../src/base/errors.js');
    if (isInputError(e)) {
      process.stderr.write(`platewise: ${e.message}\n`);
      process.exitCode = 2;
    } else {
      process.stderr.write(`platewise: internal error: ${(e as Error)?.stack ?? String(e)}\n`);
      process.exitCode = 1;
    }
  }
}
