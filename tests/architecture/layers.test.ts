/**
 * The layers of src/ import only downward (from folders earlier in LAYERS, or their own), nothing in
 * src/ imports cli/, and no two files import each other through any chain (no cycles). Static imports,
 * `export … from` and dynamic `import('…')` all count, type-only imports included: a type import is
 * still a dependency of the design. The order is the one drawn in DEVELOPERS.md ("Layers").
 */
import { readFileSync } from 'node:fs';
import { tsFiles } from './files.js';
import { dirname, join, normalize, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

/** Top to bottom: a folder may import only from folders above it and from itself. */
export const LAYERS = [
  'base', 'numeric', 'expr', 'geometry', 'model', 'read', 'mesh', 'quadrature',
  'properties', 'analysis', 'qa', 'batch', 'output',
] as const;

const ROOT = join(__dirname, '..', '..');


const SPEC = /(?:^|[^\w.])(?:import|export)\s[^'";]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|^\s*import\s*['"]([^'"]+)['"]/gm;

function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8').replace(/\/\*[\s\S]*?\*\//g, '').replace(/^\s*\/\/.*$/gm, '');
  const out: string[] = [];
  for (const m of text.matchAll(SPEC)) {
    const spec = m[1] ?? m[2] ?? m[3];
    if (!spec.startsWith('.')) continue;
    out.push(relative(ROOT, normalize(join(dirname(file), spec.replace(/\.js$/, '.ts')))));
  }
  return out;
}

/** 'src/<layer>/…' → its rank; src/index.ts and src/library.ts (the API) → below every layer; cli → last. */
function rank(rel: string): number {
  const parts = rel.split('/');
  if (parts[0] === 'cli') return LAYERS.length + 1;
  if (parts[0] !== 'src') return -1;
  if (parts.length === 2) return LAYERS.length; // the public API files at src/ root
  const k = (LAYERS as readonly string[]).indexOf(parts[1]);
  return k;
}

function upward(g: Map<string, string[]>): string[] {
  const bad: string[] = [];
  for (const [f, deps] of g) for (const d of deps) if (rank(d) > rank(f)) bad.push(`${f} → ${d}`);
  return bad;
}

/** Iterative three-colour depth-first search; each back edge found is one cycle, given by its path. */
function findCycles(g: Map<string, string[]>): string[] {
  const colour = new Map<string, 0 | 1 | 2>();
  const cycles: string[] = [];
  for (const start of g.keys()) {
    if (colour.get(start)) continue;
    const stack: { f: string; i: number }[] = [{ f: start, i: 0 }];
    colour.set(start, 1);
    while (stack.length > 0) {
      const top = stack[stack.length - 1];
      const deps = g.get(top.f) ?? [];
      if (top.i >= deps.length) { colour.set(top.f, 2); stack.pop(); continue; }
      const d = deps[top.i++];
      const c = colour.get(d) ?? 0;
      if (c === 1) {
        const k = stack.findIndex((e) => e.f === d);
        cycles.push([...stack.slice(k).map((e) => e.f), d].join(' → '));
      } else if (c === 0 && g.has(d)) {
        colour.set(d, 1);
        stack.push({ f: d, i: 0 });
      }
    }
  }
  return cycles;
}

const files = [...tsFiles(join(ROOT, 'src')), ...tsFiles(join(ROOT, 'cli'))].map((f) => relative(ROOT, f));
const graph = new Map(files.map((f) => [f, importsOf(join(ROOT, f))]));

describe('architecture: layers and cycles', () => {
  it('reads a plausible number of files and imports (the scanner itself works)', () => {
    expect(files.length).toBeGreaterThan(60);
    const edges = [...graph.values()].reduce((n, v) => n + v.length, 0);
    expect(edges).toBeGreaterThan(200);
  });

  it('every file under src/ sits in a known layer', () => {
    const unknown = files.filter((f) => rank(f) < 0);
    expect(unknown).toEqual([]);
  });

  it('every import goes to an existing file', () => {
    const missing: string[] = [];
    for (const [f, deps] of graph) for (const d of deps) if (!graph.has(d)) missing.push(`${f} → ${d}`);
    expect(missing).toEqual([]);
  });

  it('no import runs upward (against the layer order) and src/ never imports cli/', () => {
    expect(upward(graph)).toEqual([]);
  });

  it('no import cycle between files', () => {
    expect(findCycles(graph)).toEqual([]);
  });

  it('the checker catches an upward import and a cycle (negative control on a made-up graph)', () => {
    const fake = new Map<string, string[]>([
      ['src/geometry/a.ts', ['src/read/b.ts']], // upward: geometry must not import read
      ['src/read/b.ts', ['src/geometry/c.ts']],
      ['src/geometry/c.ts', ['src/geometry/a.ts']], // closes a → b → c → a
      ['src/index.ts', ['cli/main.ts']], // src must never import cli
      ['cli/main.ts', ['src/index.ts']],
    ]);
    expect(upward(fake)).toEqual(['src/geometry/a.ts → src/read/b.ts', 'src/index.ts → cli/main.ts']);
    expect(findCycles(fake).length).toBe(2);
  });
});
