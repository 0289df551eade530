/**
 * Builds the page: one self-contained HTML file (dist/page/platewise.html) holding the page script, and as
 * packed texts the worker script that runs the library and the CSS packages the worker loads on demand, with
 * the small script that starts the worker (web/start.js). All are esbuild bundles of web/ and src/ for the
 * browser; the few Node built-ins the library names are replaced by web/shims (see there). Run by
 * `npm run build` after tsc; fails if the file would reach the 2 MB budget.
 */
import { build } from 'esbuild';
import { mkdirSync, readFileSync, writeFileSync, renameSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
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
  bundle: true, write: false, format: 'iife', platform: 'browser', target: ['chrome110', 'firefox115', 'safari16.4'],
  minify: true, legalComments: 'none', logLevel: 'warning', alias,
  define: { PLATEWISE_VERSION: JSON.stringify(version), 'import.meta.url': '"about:page"' },
};

const worker = await build({ ...common, entryPoints: [join(ROOT, 'web', 'worker.ts')] });
const workerCode = worker.outputFiles[0].text;
const page = await build({ ...common, entryPoints: [join(ROOT, 'web', 'page.ts')] });
// inside <script>, "</script" (any case) would end the element: write it as "<\/script" (the same in JS strings
// and regular expressions, the only places a bundle can hold it); "<!--" followed by "<script" would make the
// HTML parser look for a second end tag, so a page script holding both is refused
const pageCode = page.outputFiles[0].text;
if (/<!--/.test(pageCode) && /<script/i.test(pageCode)) throw new Error('web/build.mjs: the page bundle holds "<!--" and "<script"; it cannot be inlined safely');
const script = pageCode.replace(/<\/(script)/gi, '<\\/$1');
// the worker's code travels gzip-compressed in base64 inside a text element (the bundle as plain text took the
// HTML parser 60–200 ms more), read by a small script at the top of <body> (web/start.js) that starts the
// worker at once, while the browser is still parsing the rest of the page; the CSS packages (web/csslib.ts)
// travel the same way in a second element and are loaded by the worker only when an SVG needs them
const css = await build({ ...common, entryPoints: [join(ROOT, 'web', 'csslib.ts')] });
// (base64 holds no '<', so the HTML parser cannot end the element early)
const pack = (code) => gzipSync(Buffer.from(code, 'utf8'), { level: 9 }).toString('base64');
const workerStart = `<script type="text/x-platewise-worker" id="worker-source">${pack(workerCode)}</script>\n`
  + `<script type="text/x-platewise-worker" id="css-source">${pack(css.outputFiles[0].text)}</script>\n`
  + `<script>${readFileSync(join(ROOT, 'web', 'start.js'), 'utf8').trim()}</script>`;
const template = readFileSync(join(ROOT, 'web', 'page.html'), 'utf8');
const marker = '<script>/*PAGE*/</script>';
if (!template.includes(marker)) throw new Error(`web/page.html: the marker ${marker} is missing`);
const workerMarker = '<script>/*WORKER*/</script>';
if (!template.includes(workerMarker)) throw new Error(`web/build.mjs: the marker ${workerMarker} is missing`);
const html = template.replace(workerMarker, () => workerStart).replace(marker, () => `<script>${script}</script>`);
const bytes = Buffer.byteLength(html);
if (bytes >= BUDGET) throw new Error(`web/build.mjs: the page is ${bytes} bytes; the budget is ${BUDGET} bytes`);
mkdirSync(dirname(OUT), { recursive: true });
writeFileSync(OUT + '.tmp', html);
renameSync(OUT + '.tmp', OUT);
