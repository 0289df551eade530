import { describe, it, expect } from 'vitest';
import { compileExpression } from '../../src/expr/index.js';

// Reference: the ECMAScript Math object on IEEE 754 binary64 doubles (ECMA-262, section
// "The Math Object"); the expression language promises to call exactly these functions, so the
// compiled result must be identical (Object.is), including NaN and signed zero.
const POINTS = [0, -0, 0.5, -0.5, 1, -1, 2.75, -3.25, 1e-9, 123.456, -1e6, 1e300, Infinity, -Infinity, NaN];

const unary: [string, (a: number) => number][] = [
  ['sin', Math.sin],
  ['cos', Math.cos],
  ['tan', Math.tan],
  ['asin', Math.asin],
  ['acos', Math.acos],
  ['atan', Math.atan],
  ['exp', Math.exp],
  ['log', Math.log],
  ['sqrt', Math.sqrt],
  ['abs', Math.abs],
  ['floor', Math.floor],
  ['ceil', Math.ceil],
];
const binary: [string, (a: number, b: number) => number][] = [
  ['atan2', Math.atan2],
  ['pow', Math.pow],
  ['hypot', Math.hypot],
  ['min', Math.min],
  ['max', Math.max],
];

describe('built-in functions match Math (IEEE 754 doubles)', () => {
  for (const [name, fn] of unary) {
    it(`${name}(x)`, () => {
      const f = compileExpression(`${name}(x)`, 'test').evaluate;
      for (const p of POINTS) expect(Object.is(f(p, 0), fn(p)), `${name}(${p})`).toBe(true);
    });
  }
  for (const [name, fn] of binary) {
    it(`${name}(x, y)`, () => {
      const f = compileExpression(`${name}(x, y)`, 'test').evaluate;
      for (const a of POINTS) for (const b of POINTS) expect(Object.is(f(a, b), fn(a, b)), `${name}(${a}, ${b})`).toBe(true);
    });
  }
  it('x^y is Math.pow', () => {
    const f = compileExpression('x^y', 'test').evaluate;
    for (const a of POINTS) for (const b of POINTS) expect(Object.is(f(a, b), Math.pow(a, b))).toBe(true);
  });
  it('variadic forms match Math.min/max/hypot with three and four arguments', () => {
    const mn = compileExpression('min(x, y, 2, -7.5)', 't').evaluate;
    const mx = compileExpression('max(x, y, 2, -7.5)', 't').evaluate;
    const hy = compileExpression('hypot(x, y, 12)', 't').evaluate;
    for (const a of POINTS) {
      for (const b of POINTS) {
        expect(Object.is(mn(a, b), Math.min(a, b, 2, -7.5))).toBe(true);
        expect(Object.is(mx(a, b), Math.max(a, b, 2, -7.5))).toBe(true);
        expect(Object.is(hy(a, b), Math.hypot(a, b, 12))).toBe(true);
      }
    }
  });
  it('a few textbook values (common practice, no source)', () => {
    expect(compileExpression('sin(pi/6)', 't').constant).toBeCloseTo(0.5, 15);
    expect(compileExpression('cos(pi)', 't').constant).toBe(-1);
    expect(compileExpression('atan2(1, 1) * 4', 't').constant).toBeCloseTo(Math.PI, 15);
    expect(compileExpression('log(e)', 't').constant).toBe(1);
    expect(compileExpression('hypot(3, 4)', 't').constant).toBe(5);
    expect(compileExpression('floor(-2.5) + ceil(-2.5)', 't').constant).toBe(-5);
  });
});
