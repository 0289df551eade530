import { describe, it, expect } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { compileExpression, MAX_EXPRESSION_LENGTH, MAX_NESTING } from '../../src/expr/index.js';

function fault(text: string, where = 'thickness'): InputError {
  try {
    compileExpression(text, where);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error(`expected "${text}" to be rejected`);
}

describe('error messages name the column and what was expected', () => {
  it('unknown name, with the caller label as where', () => {
    const e = fault('20 + xx');
    expect(e.where).toBe('thickness');
    expect(e.detail).toMatch(/^unknown name "xx" at column 6; expected x, y, pi, e/);
    expect(e.message).toMatch(/^thickness: unknown name "xx" at column 6/);
  });
  const cases: [string, RegExp][] = [
    ['', /^empty expression; expected/],
    ['   \t', /^empty expression; expected/],
    ['1 + 2 3', /^unexpected number "3" at column 7; expected an operator or end of input/],
    ['(1 + 2', /^missing "\)" at column 7 to close "\(" at column 1/],
    ['1 + 2)', /^unmatched "\)" at column 6/],
    ['((x)', /^missing "\)" at column 5 to close "\(" at column 1/],
    ['()', /^unexpected "\)" at column 2; expected an expression inside the parentheses/],
    ['x +', /^unexpected end of input at column 4; expected a number, a name or "\("/],
    ['x * / 2', /^unexpected "\/" at column 5; expected a number, a name or "\("/],
    ['sin(x, y)', /^sin\(\.\.\.\) at column 1 takes 1 argument, got 2 arguments/],
    ['atan2(x)', /^atan2\(\.\.\.\) at column 1 takes 2 arguments, got 1 argument/],
    ['max(x)', /^max\(\.\.\.\) at column 1 takes at least 2 arguments, got 1 argument/],
    ['min()', /^min\(\.\.\.\) at column 1 takes at least 2 arguments, got 0 arguments/],
    ['if(x, 1)', /^if\(\.\.\.\) at column 1 takes 3 arguments, got 2 arguments/],
    ['1 + sin', /^function "sin" at column 5 needs its arguments; expected "\(" after it/],
    ['sqrt(x', /^missing "\)" at column 7 to close "sqrt\(" at column 1/],
    ['pow(x 2)', /^unexpected number "2" at column 7; expected "," or "\)" in the arguments of pow/],
    ['2x', /^unexpected name "x" right after number "2" at column 2; expected an operator/],
    ['1.2.3', /^unexpected second "\." right after number "1\.2" at column 4/],
    ['1e+', /^incomplete exponent in number "1e\+" at column 1; expected digits after "e\+"$/],
    ['2e', /^incomplete exponent in number "2e" at column 1; expected digits after "e" \(write 2\*e to multiply by e\)$/],
    ['1e400', /^number "1e400" at column 1 is too large/],
    ['x = 1', /^unexpected character "=" at column 3; .*use == to compare/],
    ['x < y < 1', /^second comparison "<" at column 7; comparisons do not chain/],
    ['cosh(x)', /^unknown function "cosh" at column 1; expected one of sin, cos/],
    ['Sin(x)', /did you mean "sin"\?$/],
    ['x, y', /^unexpected "," at column 2/],
    ['x ** 2', /^unexpected "\*" at column 4/],
    ['é + x', /^unexpected character "é" at column 1/],
    ['😀 + xx', /^unexpected character "😀" at column 1/],
    ['"😀" + xx', /^unexpected character '"' at column 1/],
    ['sin(😀) + xx', /^unexpected character "😀" at column 5/],
    ['(😀) + xx', /^unexpected character "😀" at column 2/],
    ['x + \u0000', /^unexpected character U\+0000 at column 5/],
    ['x +\u00a0y', /^unexpected character U\+00A0 at column 4/],
    ['20 \u2212 x', /^unexpected character "\u2212" at column 4; .*use the ASCII minus sign/],
    ['2 \u00d7 x', /^unexpected character "\u00d7" at column 3; .*use \* to multiply/],
  ];
  for (const [text, re] of cases) {
    it(JSON.stringify(text), () => {
      const e = fault(text);
      expect(e.where).toBe('thickness');
      expect(e.detail).toMatch(re);
      expect(e.message.includes('\n')).toBe(false);
    });
  }
  it('a character outside the BMP is shown whole, at its column', () => {
    // the emoji is two UTF-16 code units; it is shown as one character
    expect(fault('😀+y').detail).toMatch(/at column 1/);
    expect(fault('y+x+😀').detail).toMatch(/at column 5/);
    expect(fault('"😀"+x').detail).toMatch(/at column 1/);
  });
  it('the earliest fault is reported, even when a later character is not lexable', () => {
    expect(fault('q + ?').detail).toMatch(/^unknown name "q" at column 1/);
  });
  it('limits length and nesting with a clear message', () => {
    expect(fault('1+'.repeat(MAX_EXPRESSION_LENGTH)).detail).toMatch(/characters long; expected at most/);
    const deep = '('.repeat(MAX_NESTING + 1) + 'x' + ')'.repeat(MAX_NESTING + 1);
    expect(fault(deep).detail).toMatch(/nested too deeply at column \d+; expected at most/);
    expect(fault('-'.repeat(MAX_NESTING + 1) + 'x').detail).toMatch(/nested too deeply/);
    const ok = '('.repeat(MAX_NESTING) + 'x' + ')'.repeat(MAX_NESTING);
    expect(compileExpression(ok, 't').evaluate(3, 0)).toBe(3);
  });
  it('a long flat sum is fine (no recursion limit on + chains)', () => {
    const text = Array.from({ length: 1500 }, () => 'x').join('+');
    expect(compileExpression(text, 't').evaluate(2, 0)).toBe(3000);
  });
});

describe('injection attempts are syntax errors', () => {
  const attempts = [
    'constructor.constructor("return process")().exit()',
    'process.exit()',
    'process',
    'require("fs")',
    '__proto__',
    'x.__proto__',
    'this',
    'globalThis',
    'Function("return 1")()',
    'eval("1")',
    '"a"',
    "'a'",
    '`a`',
    'x[0]',
    '[1]',
    '{}',
    'x; process.exit()',
    'x => x',
    'new Date()',
    'Math.sin(x)',
    'sin.call(x)',
    'toString()',
    'valueOf(x)',
    'hasOwnProperty(x, x)',
    'x /* */',
    'x // y',
    '1 ? 2 : 3',
    'x || 1',
    'x && 1',
    '!x',
    '~x',
    'x++',
    'x = 1',
    'x\u2028+1',
  ];
  for (const text of attempts) {
    it(JSON.stringify(text), () => {
      expect(() => compileExpression(text, 'density')).toThrow(InputError);
    });
  }
  it('names inherited from Object.prototype are not functions or constants', () => {
    for (const name of ['constructor', 'toString', '__proto__', 'valueOf', 'isPrototypeOf']) {
      expect(fault(`${name}(1)`).detail).toMatch(/^unknown function/);
      expect(fault(name).detail).toMatch(/^unknown name/);
    }
  });
});
