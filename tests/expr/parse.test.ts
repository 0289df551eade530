import { describe, it, expect } from 'vitest';
import { compileExpression, parseExpression, interpret } from '../../src/expr/index.js';

const at = (text: string, x = 0, y = 0): number => compileExpression(text, 'test').evaluate(x, y);

// Expected values below are worked by hand from the usual rules of school algebra
// (common practice, no source): ^ before unary minus before * / before + -, ^ right-associative.
describe('precedence and associativity', () => {
  const cases: [string, number, number, number][] = [
    ['1 + 2 * 3', 0, 0, 7],
    ['(1 + 2) * 3', 0, 0, 9],
    ['10 - 4 - 3', 0, 0, 3], // left-associative: (10-4)-3
    ['48 / 4 / 2', 0, 0, 6], // left-associative: (48/4)/2
    ['2 ^ 3 ^ 2', 0, 0, 512], // right-associative: 2^(3^2)
    ['-x^2', 3, 0, -9], // -(x^2)
    ['(-x)^2', 3, 0, 9],
    ['-2^2', 0, 0, -4],
    ['2^-1', 0, 0, 0.5], // exponent may carry its own sign
    ['2^-x^2', 1, 0, 0.5], // 2^(-(x^2))
    ['- -x', 5, 0, 5],
    ['+x', 5, 0, 5],
    ['--+-x', 5, 0, -5],
    ['2*-x', 4, 0, -8],
    ['x*y - y/x', 2, 8, 12],
    ['20 - 0.025*x + 0.001*x*y', 100, 50, 20 - 2.5 + 5],
    ['1 + 2 < 4', 0, 0, 1], // comparison binds loosest
    ['1 + 2 >= 4', 0, 0, 0],
    ['(x < y) + (x == 2) + (y != 3) + (x <= 2) + (y > 2)', 2, 3, 4],
    ['if(x < 5, 10, 20)', 4, 0, 10],
    ['if(x < 5, 10, 20)', 5, 0, 20],
    ['if(x - 1, 1, 2)', 1, 0, 2], // zero condition is false
    ['if(0/0, 1, 2)', 0, 0, 2], // NaN condition is false (documented)
    ['if(x > 0, if(y > 0, 1, 4), if(y > 0, 2, 3))', -1, -1, 3],
    ['pi', 0, 0, Math.PI],
    ['e', 0, 0, Math.E],
    ['2 * pi * x', 1, 0, 2 * Math.PI],
    ['1e-3 * 1E3 + .5 + 1. + 2.5e+1', 0, 0, 1 + 0.5 + 1 + 25],
    ['  x\t+\n y ', 1, 2, 3],
    ['min(3, x, y, 7)', 5, -2, -2],
    ['max(3, x, y, 7)', 8, -2, 8],
  ];
  for (const [text, x, y, want] of cases) {
    it(`${text} at (${x}, ${y}) = ${want}`, () => {
      expect(at(text, x, y)).toBe(want);
      expect(interpret(parseExpression(text, 't'), x, y)).toBe(want);
    });
  }

  it('builds the tree the grammar says for -x^2 and 2^3^2', () => {
    const t = parseExpression('-x^2', 't');
    expect(t.kind).toBe('negate');
    if (t.kind === 'negate') expect(t.arg.kind === 'binary' && t.arg.op).toBe('^');
    const p = parseExpression('2^3^2', 't');
    expect(p.kind === 'binary' && p.op === '^' && p.right.kind === 'binary' && p.right.op).toBe('^');
  });

  it('domain errors give NaN or Infinity, never an exception', () => {
    expect(at('log(x)', -1)).toBeNaN();
    expect(at('sqrt(x)', -4)).toBeNaN();
    expect(at('1 / x', 0)).toBe(Infinity);
    expect(at('-1 / x', 0)).toBe(-Infinity);
    expect(at('asin(x)', 2)).toBeNaN();
    expect(at('x / y', 0, 0)).toBeNaN();
  });
});
