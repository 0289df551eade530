/**
 * `measure` must not load the drawing code (src/output/draw.ts and the SVG builder, bundled into a chunk of
 * dist/cli that `draw` and `report` import on demand). Method: run the built CLI under a Node
 * module-resolution hook (node:module register(), stable in Node 20.6+) that appends every resolved URL
 * to a log file. ESM has no require.cache and NODE_DEBUG=module only traces CommonJS, whereas a resolve
 * hook sees every import, static or dynamic, ESM or CommonJS-from-ESM. The same run of `draw` is the
 * positive control: it must show the drawing chunk in the log, so the check cannot pass by seeing nothing.
 * The drawing chunk is the file of dist/cli that holds the drawing's 'part-drawing' role (src/output/draw.ts;
 * the bundle is minified, so function names are gone; older builds may leave more such files).
 * Needs the dist build (tsc), like the other CLI tests.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const dir = mkdtempSync(join(tmpdir(), 'platewise-lazy-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

writeFileSync(join(dir, 'hooks.mjs'), `import { appendFileSync } from 'node:fs';
export async function resolve(specifier, context, next) {
  const r = await next(specifier, context);
  if (process.env.PLATEWISE_RESOLVE_LOG) appendFileSync(process.env.PLATEWISE_RESOLVE_LOG, r.url + '\\n');
  return r;
}
`);
writeFileSync(join(dir, 'register.mjs'), `import { register } from 'node:module';
register(${JSON.stringify(pathToFileURL(join(dir, 'hooks.mjs')).href)});
`);

function resolvedBy(args: string[], log: string): { status: number | null; urls: string[]; stderr: string } {
  const r = spawnSync(process.execPath, ['--import', pathToFileURL(join(dir, 'register.mjs')).href, CLI, ...args], {
    cwd: ROOT, encoding: 'utf8', env: { ...process.env, PLATEWISE_RESOLVE_LOG: log },
  });
  let urls: string[] = [];
  try { urls = readFileSync(log, 'utf8').split('\n').filter(Boolean); } catch { /* nothing resolved */ }
  return { status: r.status, urls, stderr: r.stderr };
}

const chunks = readdirSync(join(ROOT, 'dist', 'cli')).filter((f) => f.endsWith('.js') && readFileSync(join(ROOT, 'dist', 'cli', f), 'utf8').includes('part-drawing'));
const drawingChunk = (u: string) => chunks.some((c) => u.endsWith(`/dist/cli/${c}`));

describe('lazy loading of the drawing code', () => {
  it('measure resolves its own modules but never the drawing chunk', () => {
    expect(chunks.length).toBeGreaterThan(0); // stale chunks of earlier builds may be there too: none may load
    const r = resolvedBy(['measure', 'samples/base-plate-bp1.json', '--json'], join(dir, 'measure.log'));
    expect(r.status, r.stderr).toBe(0);
    // the hook sees the command line's own modules (the bundle in dist/cli and its chunks)
    expect(r.urls.some((u) => /\/dist\/cli\/[^/]+\.js$/.test(u))).toBe(true);
    expect(r.urls.filter(drawingChunk)).toEqual([]);
    expect(r.urls.some((u) => /\/dist\/src\/output\/(draw|svgBuild|html|convergence|shade|pathData)\.js$/.test(u))).toBe(false);
  });

  it('positive control: draw does resolve the drawing chunk through the same hook', () => {
    const r = resolvedBy(['draw', 'samples/base-plate-bp1.json', '-o', join(dir, 'bp1.svg')], join(dir, 'draw.log'));
    expect(r.status, r.stderr).toBe(0);
    expect(r.urls.some(drawingChunk)).toBe(true);
  });
});
