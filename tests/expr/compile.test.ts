import { describe, it, expect } from 'vitest';
import { parseExpression } from '../../src/expr/index.js';
import { compileTree, generateSource, numberLiteral } from '../../src/expr/compile.js';

describe('code generation from the checked tree', () => {
  it('re-prints numbers so they evaluate to the same double (ECMAScript Number::toString round-trips)', () => {
    for (const v of [0, 1, 0.1, 1e-3, 2.5e300, 5e-324, 123456789.125, Math.PI, 1 / 3]) {
      const lit = numberLiteral(v);
      expect(lit).toMatch(/^\([0-9.e+-]+\)$/);
      expect(Number(lit.slice(1, -1))).toBe(v);
    }
    expect(numberLiteral(-0)).toBe('(-0)');
    expect(numberLiteral(NaN)).toBe('(0/0)');
    expect(numberLiteral(Infinity)).toBe('(1/0)');
    expect(numberLiteral(-Infinity)).toBe('(-1/0)');
  });
  it('folds constant subtrees and keeps chains flat', () => {
    expect(generateSource(parseExpression('2*pi*x', 't'))).toBe(`((${2 * Math.PI}) * x)`);
    expect(generateSource(parseExpression('x + y - 1', 't'))).toBe('(x + y - (1))');
    expect(generateSource(parseExpression('x - (y - 1)', 't'))).toBe('(x - (y - (1)))');
    expect(generateSource(parseExpression('x / y * 2', 't'))).toBe('(x / y * (2))');
    expect(generateSource(parseExpression('-x^2', 't'))).toBe('(-f_pow(x, (2)))');
    expect(generateSource(parseExpression('if(x <= 1, sqrt(y), 0)', 't'))).toBe('((x <= (1) ? 1 : 0) ? f_sqrt(y) : (0))');
  });
  it('keeps signed zero and non-finite folded constants', () => {
    const negZero = compileTree(parseExpression('x*0 + -0*1', 't'));
    expect(Object.is(negZero(-1, 0), -0)).toBe(true); // (-1*0) + (-0) = -0 under IEEE 754
    expect(compileTree(parseExpression('x + log(0)', 't'))(1, 0)).toBe(-Infinity);
  });
  it('forced interpreter and generated code agree', () => {
    const tree = parseExpression('hypot(x, y, 1) + if(x > y, atan2(y, x), min(x, y, 3)) ^ 2', 't');
    const a = compileTree(tree, true);
    const b = compileTree(tree, false);
    for (const [x, y] of [[1, 2], [3, -1], [0, 0], [-2.5, 7]] as const) expect(Object.is(a(x, y), b(x, y))).toBe(true);
  });
});
