/**
 * Segment kinds own their operations: outside src/geometry/kinds/ (the kinds and their registry) and
 * src/read/ (the readers, which create segments of a chosen kind), no code branches on a segment's kind.
 * A branch is a comparison of some `.kind` with a segment kind's name, a `case` label with such a name,
 * an index by `.kind` (a per-kind table), or a type mapped over the segment kinds. Such code is replaced by
 * an operation in `SegmentOps` (src/geometry/kinds/types.ts), so that a new kind touches only its own file
 * and the registry. The kind names come from the registry itself, so a new kind is covered at once.
 */
import { readFileSync } from 'node:fs';
import { tsFiles } from './files.js';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { OPS } from '../../src/geometry/kinds/index.js';

const ROOT = join(__dirname, '..', '..');
const EXEMPT = ['src/geometry/kinds/', 'src/read/'];


const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** Lines of `text` (comments removed) that branch on a segment kind named in `kinds`, as "line: text". */
export function kindBranches(text: string, kinds: readonly string[]): string[] {
  const names = kinds.map(esc).join('|');
  const patterns = [
    new RegExp(`\\.kind\\s*[!=]==?\\s*['"\`](?:${names})['"\`]`), // s.kind === 'arc'
    new RegExp(`['"\`](?:${names})['"\`]\\s*[!=]==?\\s*[\\w.]*\\.kind\\b`), // 'arc' === s.kind
    new RegExp(`\\bcase\\s+['"\`](?:${names})['"\`]\\s*:`), // case 'arc':
    /\[\s*[\w.]*\.kind\s*\]/, // TABLE[s.kind]
    /\bin\s+(?:Segment\s*\[\s*['"]kind['"]\s*\]|SegmentKind\b)/, // { [K in SegmentKind]: … }
  ];
  const clean = text.replace(/\/\*[\s\S]*?\*\//g, (m) => m.replace(/[^\n]/g, ' ')).replace(/\/\/.*$/gm, '');
  const out: string[] = [];
  clean.split('\n').forEach((line, i) => {
    if (patterns.some((p) => p.test(line))) out.push(`${i + 1}: ${line.trim()}`);
  });
  return out;
}

const KINDS = Object.keys(OPS);
const files = [...tsFiles(join(ROOT, 'src')), ...tsFiles(join(ROOT, 'cli'))].map((f) => relative(ROOT, f).split('\\').join('/'));

describe('architecture: no branch on a segment kind outside the kinds', () => {
  it('reads the registry\'s kinds and a plausible number of files (the scanner itself works)', () => {
    expect(KINDS).toEqual(expect.arrayContaining(['line', 'arc', 'ellipticalArc', 'quadratic', 'cubic']));
    expect(files.length).toBeGreaterThan(60);
    expect(files.filter((f) => f.startsWith('src/geometry/kinds/')).length).toBeGreaterThanOrEqual(7);
  });

  it('finds none in src/ and cli/ outside src/geometry/kinds/ and src/read/', () => {
    const found: string[] = [];
    for (const f of files) {
      if (EXEMPT.some((e) => f.startsWith(e))) continue;
      for (const hit of kindBranches(readFileSync(join(ROOT, f), 'utf8'), KINDS)) found.push(`${f}:${hit}`);
    }
    expect(found).toEqual([]);
  });

  it('catches each form of branch and leaves other kinds of `kind` alone (negative control on made-up code)', () => {
    const snippet = [
      "if (s.kind === 'arc') return 1;", // 1 flagged
      "switch (seg.kind) {", // 2 (the cases below carry it)
      "  case 'cubic': return 2;", // 3 flagged
      "if ('line' !== s.kind) return 3;", // 4 flagged
      'const T: { [K in SegmentKind]?: F } = {};', // 5 flagged
      'const f = EXACT[s.kind];', // 6 flagged
      "if (node.kind === 'binary') return 4;", // 7: an expression node, not a segment
      "// if (s.kind === 'line') in a comment", // 8
      "const seg = { kind: 'line', x0: 0, y0: 0, x1: 1, y1: 0 };", // 9: creating a segment is fine
      "return tol.kind === 'absolute' ? a : b;", // 10
      "/* case 'quadratic': */", // 11
      "const E: { [K in Segment['kind']]?: F } = {};", // 12 flagged
      "if (s.kind === 'ellipticalArc' || s.kind === 'quadratic') x();", // 13 flagged
    ].join('\n');
    expect(kindBranches(snippet, KINDS).map((h) => Number(h.split(':')[0]))).toEqual([1, 3, 4, 5, 6, 12, 13]);
  });
});
