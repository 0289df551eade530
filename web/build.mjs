/**
 * Builds the page: one self-contained HTML file (dist/page/platewise.html) holding the page script and, as a
 * text inside it, the worker script that runs the library. Both are esbuild bundles of web/ and src/ for the
 * browser; the few Node built-ins the library names are replaced by web/shims (see there). Run by
 * `npm run build` after tsc; fails if the file would reach the 2 MB budget.
 */
import { build } from 'esbuild';
import { mkdirSync, readFileSync, writeFileSync, renameSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const OUT = join(ROOT, 'dist', 'page', 'platewise.html');
const BUDGET = 2 * 1024 * 1024;
const version = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).version;

const shims = join(ROOT, 'web', 'shims');
const alias = {
  'node:module': join(shims, 'module.ts'),
  'node:path': join(shims, 'nofiles.ts'),
  path: join(shims, 'nofiles.ts'),
  'node:url': join(shims, 'nofiles.ts'),
};

const common = {
  bundle: true, write: false, format: 'iife', platform: 'browser', target: ['chrome110', 'firefox115', 'safari16'],
  minify: true, legalComments: 'none', logLevel: 'warning', alias,
  define: { PLATEWISE_VERSION: JSON.stringify(version), 'import.meta.url': '"about:page"' },
};

const worker = await build({ ...common, entryPoints: [join(ROOT, 'web', 'worker.ts')] });
const workerCode = worker.outputFiles[0].text;
const page = await build({ ...common, entryPoints: [join(ROOT, 'web', 'page.ts')], define: { ...common.define, WORKER_SOURCE: JSON.stringify(workerCode) } });
// inside <script>, "</script" (any case) would end the element: write it as "<\/script" (the same in JS strings)
const script = page.outputFiles[0].text.replace(/<\/(script)/gi, '<\\/$1');
const template = readFileSync(join(ROOT, 'web', 'page.html'), 'utf8');
const marker = '<script>/*PAGE*/</script>';
if (!template.includes(marker)) throw new Error(`web/page.html: the marker ${marker} is missing`);
const html = template.replace(marker, () => `<script>${script}</script>`);
const bytes = Buffer.byteLength(html);
if (bytes >= BUDGET) throw new Error(`web/build.mjs: the page is ${bytes} bytes; the budget is ${BUDGET} bytes`);
mkdirSync(dirname(OUT), { recursive: true });
writeFileSync(OUT + '.tmp', html);
renameSync(OUT + '.tmp', OUT);
