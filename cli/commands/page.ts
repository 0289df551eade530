/** `platewise page`: a copy of the built page (dist/page/platewise.html, made by web/build.mjs) written anywhere. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { InputError } from '../../src/base/errors.js';
import { checkOutputTarget, writeFileAtomic } from '../../src/base/files.js';

export interface PageFlags { output?: string; force?: boolean }

/** Where the build puts the page, beside the command line's own folder (dist/cli → dist/page). */
export const BUILT_PAGE = fileURLToPath(new URL('../page/platewise.html', import.meta.url));

export function page(flags: PageFlags): string {
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  if (flags.output === '-') flags = { ...flags, output: undefined };
  const write = { force: flags.force, flag: '--output' };
  if (flags.output !== undefined) {
    checkOutputTarget(flags.output, [BUILT_PAGE], write);
    if (!/\.html?$/i.test(flags.output)) throw new InputError('--output', `the page is an HTML file; name it .html (got "${flags.output}")`);
  }
  let html: string;
  try {
    html = readFileSync(BUILT_PAGE, 'utf8');
  } catch {
    throw new InputError(BUILT_PAGE, 'is missing; build it with npm run build (npm install builds it too)');
  }
  if (flags.output === undefined) return html;
  writeFileAtomic(flags.output, html, [BUILT_PAGE], write);
  return '';
}
