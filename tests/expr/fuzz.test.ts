/**
 * Seeded, reproducible fuzz tests for the expression language.
 * PRNG: mulberry32 (a small public-domain 32-bit generator, tests/helpers.ts); change SEED to explore.
 * Checks: (1) any string is either accepted or rejected with InputError, quickly; (2) for random
 * well-formed trees, text → parse → compiled evaluator equals this file's own evaluation of the
 * generated tree AND the library's tree-walking interpreter, bit for bit (Object.is);
 * (3) the generated JavaScript contains only whitelisted identifiers.
 */
import { describe, it, expect } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { compileExpression, interpret, parseExpression } from '../../src/expr/index.js';
import { generateSource } from '../../src/expr/compile.js';
import { rng as mulberry32 } from '../helpers.js';

const SEED = 0x5eed2026;


type Rand = () => number;
const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;

// ---- random well-formed trees (the test's own tree type and evaluator) -------------------------

type G =
  | { k: 'num'; text: string }
  | { k: 'var'; name: 'x' | 'y' }
  | { k: 'const'; name: 'pi' | 'e' }
  | { k: 'neg'; a: G }
  | { k: 'bin'; op: '+' | '-' | '*' | '/' | '^'; a: G; b: G }
  | { k: 'cmp'; op: '<' | '<=' | '>' | '>=' | '==' | '!='; a: G; b: G }
  | { k: 'call'; name: string; args: G[] };

const ARITY: Record<string, [number, number]> = {
  sin: [1, 1], cos: [1, 1], tan: [1, 1], asin: [1, 1], acos: [1, 1], atan: [1, 1], atan2: [2, 2],
  exp: [1, 1], log: [1, 1], sqrt: [1, 1], abs: [1, 1], floor: [1, 1], ceil: [1, 1], pow: [2, 2],
  hypot: [2, 4], min: [2, 4], max: [2, 4], if: [3, 3],
};

function randomNumberText(r: Rand): string {
  const int = String(Math.floor(r() * 1000));
  switch (Math.floor(r() * 6)) {
    case 0: return int;
    case 1: return `${int}.${Math.floor(r() * 1000)}`;
    case 2: return `.${Math.floor(r() * 100)}`;
    case 3: return `${int}e${pick(r, ['', '+', '-'])}${Math.floor(r() * 20)}`;
    case 4: return `${Math.floor(r() * 10)}.${Math.floor(r() * 10)}E-${Math.floor(r() * 4)}`;
    default: return pick(r, ['0', '1', '2', '0.5', '3']);
  }
}

function randomTree(r: Rand, depth: number): G {
  if (depth <= 0 || r() < 0.25) {
    const u = r();
    if (u < 0.4) return { k: 'num', text: randomNumberText(r) };
    if (u < 0.85) return { k: 'var', name: r() < 0.5 ? 'x' : 'y' };
    return { k: 'const', name: r() < 0.5 ? 'pi' : 'e' };
  }
  const u = r();
  if (u < 0.12) return { k: 'neg', a: randomTree(r, depth - 1) };
  if (u < 0.6) return { k: 'bin', op: pick(r, ['+', '-', '*', '/', '^'] as const), a: randomTree(r, depth - 1), b: randomTree(r, depth - 1) };
  if (u < 0.7) return { k: 'cmp', op: pick(r, ['<', '<=', '>', '>=', '==', '!='] as const), a: randomTree(r, depth - 1), b: randomTree(r, depth - 1) };
  const name = pick(r, Object.keys(ARITY));
  const [lo, hi] = ARITY[name]!;
  const n = lo + Math.floor(r() * (hi - lo + 1));
  return { k: 'call', name, args: Array.from({ length: n }, () => randomTree(r, depth - 1)) };
}

/** Direct evaluation of a generated tree, written independently of src/expr. */
function evalG(g: G, x: number, y: number): number {
  switch (g.k) {
    case 'num': return Number(g.text);
    case 'var': return g.name === 'x' ? x : y;
    case 'const': return g.name === 'pi' ? Math.PI : Math.E;
    case 'neg': return -evalG(g.a, x, y);
    case 'bin': {
      const a = evalG(g.a, x, y), b = evalG(g.b, x, y);
      return g.op === '+' ? a + b : g.op === '-' ? a - b : g.op === '*' ? a * b : g.op === '/' ? a / b : Math.pow(a, b);
    }
    case 'cmp': {
      const a = evalG(g.a, x, y), b = evalG(g.b, x, y);
      const t = g.op === '<' ? a < b : g.op === '<=' ? a <= b : g.op === '>' ? a > b : g.op === '>=' ? a >= b : g.op === '==' ? a === b : a !== b;
      return t ? 1 : 0;
    }
    case 'call': {
      if (g.name === 'if') {
        const c = evalG(g.args[0]!, x, y);
        return c !== 0 && c === c ? evalG(g.args[1]!, x, y) : evalG(g.args[2]!, x, y);
      }
      const v = g.args.map((a) => evalG(a, x, y));
      const fn = (Math as unknown as Record<string, (...a: number[]) => number>)[g.name]!;
      return fn(...v);
    }
  }
}

// Printing: fully parenthesized, or with the fewest parentheses the grammar needs.
// Levels: 1 comparison, 2 sum, 3 product, 4 unary, 5 power, 6 primary.
function level(g: G): number {
  switch (g.k) {
    case 'cmp': return 1;
    case 'bin': return g.op === '+' || g.op === '-' ? 2 : g.op === '^' ? 5 : 3;
    case 'neg': return 4;
    default: return 6;
  }
}

function print(g: G, minimal: boolean, r: Rand): string {
  const sp = (): string => (r() < 0.3 ? ' ' : '');
  const wrap = (c: G, need: number): string => {
    const s = print(c, minimal, r);
    return !minimal || level(c) < need ? `(${sp()}${s}${sp()})` : s;
  };
  switch (g.k) {
    case 'num': return g.text;
    case 'var':
    case 'const': return g.name;
    case 'neg': return `-${sp()}${wrap(g.a, 4)}`;
    case 'bin': {
      const [la, lb] = g.op === '+' || g.op === '-' ? [2, 3] : g.op === '^' ? [6, 4] : [3, 4];
      return `${wrap(g.a, la)}${sp()}${g.op}${sp()}${wrap(g.b, lb)}`;
    }
    case 'cmp': return `${wrap(g.a, 2)}${sp()}${g.op}${sp()}${wrap(g.b, 2)}`;
    case 'call': return `${g.name}(${g.args.map((a) => print(a, minimal, r)).join(`,${sp()}`)})`;
  }
}

const POINTS: [number, number][] = [[0, 0], [1, 2], [-3.5, 0.25], [120, -45], [1e-7, 1e7], [0.5, 0.5], [-0, 3]];

const ALLOWED_IDENTIFIERS = new Set(['x', 'y', 'f_sin', 'f_cos', 'f_tan', 'f_asin', 'f_acos', 'f_atan', 'f_atan2', 'f_exp', 'f_log', 'f_sqrt', 'f_abs', 'f_floor', 'f_ceil', 'f_pow', 'f_hypot', 'f_min', 'f_max']);

describe('fuzz: random well-formed expressions', () => {
  it('compiled = generator evaluation = library interpreter, bit for bit (3000 trees)', () => {
    const r = mulberry32(SEED);
    let compared = 0;
    let finite = 0;
    for (let i = 0; i < 3000; i++) {
      const g = randomTree(r, 1 + Math.floor(r() * 6));
      const text = print(g, r() < 0.5, r);
      const c = compileExpression(text, `case ${i}`);
      const tree = parseExpression(text, `case ${i}`);
      for (const [x, y] of POINTS) {
        const want = evalG(g, x, y);
        const got = c.evaluate(x, y);
        const ref = interpret(tree, x, y);
        if (!Object.is(got, want) || !Object.is(ref, want)) {
          throw new Error(`case ${i} "${text}" at (${x}, ${y}): compiled ${got}, interpreter ${ref}, expected ${want}`);
        }
        compared++;
        if (Number.isFinite(want)) finite++;
      }
      const ids = generateSource(tree).match(/[A-Za-z_$][A-Za-z0-9_$]*/g) ?? [];
      for (const id of ids) {
        // exponent markers inside re-printed numbers (1e-7) are matched as "e..." words only after a digit
        if (/^e\d*$/.test(id)) continue;
        expect(ALLOWED_IDENTIFIERS.has(id), `identifier ${id} in generated code for "${text}"`).toBe(true);
      }
    }
    expect(compared).toBe(3000 * POINTS.length);
    // guard against a generator that only makes NaN: most values must be finite numbers
    expect(finite / compared).toBeGreaterThan(0.3);
  });
});

describe('fuzz: random strings', () => {
  const ALPHABET = [
    ...'0123456789.eE+-*/^(),<>=! \txyzpisncoqrtabmhf_[]{}"\'`;:?&|~$@#\\',
    'sin(', 'cos(', 'atan2(', 'max(', 'if(', 'pi', 'x', 'y', '1e', '<=', '==', '!=', '1.5', '\u00e9', '\u{1F600}',
    'constructor', '__proto__', 'process', 'this',
  ];
  it('every string is accepted or rejected with InputError, each in under 50 ms (4000 strings)', () => {
    const r = mulberry32(SEED ^ 0x1234);
    let accepted = 0;
    let rejected = 0;
    let slowest = 0;
    for (let i = 0; i < 4000; i++) {
      let text: string;
      if (i % 2 === 0) {
        const len = Math.floor(r() * 40);
        text = Array.from({ length: len }, () => pick(r, ALPHABET)).join('');
      } else {
        // mutate a valid expression: delete, duplicate or insert a few characters
        text = print(randomTree(r, 1 + Math.floor(r() * 5)), r() < 0.5, r);
        const edits = 1 + Math.floor(r() * 3);
        for (let k = 0; k < edits; k++) {
          const at = Math.floor(r() * (text.length + 1));
          const u = r();
          if (u < 0.4) text = text.slice(0, at) + text.slice(at + 1);
          else if (u < 0.7) text = text.slice(0, at) + pick(r, ALPHABET) + text.slice(at);
          else text = text.slice(0, at) + text.slice(at, at + 3) + text.slice(at);
        }
      }
      const t0 = performance.now();
      try {
        const c = compileExpression(text, 'fuzz');
        const v = c.evaluate(1.5, -2.5);
        expect(typeof v).toBe('number');
        accepted++;
      } catch (e) {
        if (!(e instanceof InputError)) throw new Error(`"${text}" threw ${String(e)}`);
        expect(e.where).toBe('fuzz');
        expect(e.detail).toMatch(/column \d+|empty expression|characters long/);
        rejected++;
      }
      const dt = performance.now() - t0;
      slowest = Math.max(slowest, dt);
    }
    // both outcomes must actually occur, or the fuzzer is not exercising anything
    expect(accepted).toBeGreaterThan(200);
    expect(rejected).toBeGreaterThan(200);
  });

  it('pathological shapes near the limits stay fast and clean', () => {
    const shapes = [
      '('.repeat(3999),
      ')'.repeat(3999),
      '-'.repeat(3999),
      '-'.repeat(3998) + 'x',
      '2^'.repeat(1999) + '2',
      'x+'.repeat(1999) + 'x',
      'x*'.repeat(1999) + 'y',
      'sin('.repeat(999) + 'x' + ')'.repeat(999),
      'max(' + 'x,'.repeat(1990) + 'y)',
      '1'.repeat(3999),
      '9'.repeat(400),
      'x'.repeat(3999),
      '.'.repeat(3999),
    ];
    let slowestShape = 0;
    for (const text of shapes) {
      const t0 = performance.now();
      try {
        compileExpression(text, 'edge').evaluate(1, 2);
      } catch (e) {
        if (!(e instanceof InputError)) throw new Error(`"${text.slice(0, 20)}..." threw ${String(e)}`);
      }
      slowestShape = Math.max(slowestShape, performance.now() - t0);
    }
  });
});
