import { describe, it, expect } from 'vitest';
import { compileExpression, constantValue, parseExpression, polynomialDegree, variablesUsed } from '../../src/expr/index.js';

// Degree of a polynomial = highest total degree of its terms (common practice, no source).
describe('polynomial degree', () => {
  const cases: [string, number | null][] = [
    ['7850', 0],
    ['2 * pi', 0],
    ['sin(1) + sqrt(2)', 0],
    ['x', 1],
    ['-y', 1],
    ['20 - 0.025*x + 0.001*x*y', 2],
    ['x^2 + y^3', 3],
    ['(x + y)^3', 3],
    ['x^2*y^2', 4],
    ['pow(x*y, 2)', 4],
    ['x^(1+1)', 2],
    ['x^0', 0],
    ['x / 4', 1],
    ['(x*y) / (2*pi)', 2],
    ['x / y', null],
    ['x / 0', null],
    ['1 / x', null],
    ['x^-1', null],
    ['x^0.5', null],
    ['x^y', null],
    ['2^x', null],
    ['sqrt(x)', null],
    ['abs(x)', null],
    ['min(x, 1)', null],
    ['if(x < 1, 1, 2)', null],
    ['x < 1', null],
    ['if(1 < 2, x, 2)', null], // conservative: any if() over x or y is not treated as a polynomial
    ['x^1001', null], // above MAX_POLYNOMIAL_DEGREE
    ['x*x - x*x', 2], // upper bound: cancellation is not detected (documented)
  ];
  for (const [text, want] of cases) {
    it(`${text} → ${want}`, () => {
      expect(polynomialDegree(parseExpression(text, 't'))).toBe(want);
      expect(compileExpression(text, 't').polynomialDegree).toBe(want);
    });
  }
});

describe('variables and constants', () => {
  it('lists the variables used', () => {
    expect([...variablesUsed(parseExpression('3', 't'))]).toEqual([]);
    expect([...variablesUsed(parseExpression('x + 1', 't'))]).toEqual(['x']);
    expect([...variablesUsed(parseExpression('if(y>0, x, 1)', 't'))].sort()).toEqual(['x', 'y']);
    expect([...variablesUsed(parseExpression('0*x', 't'))]).toEqual(['x']); // structural
  });
  it('gives the constant value when x and y are absent', () => {
    const c = compileExpression('7.85 * 1000', 'density');
    expect(c.isConstant).toBe(true);
    expect(c.constant).toBe(7850);
    expect(c.evaluate(123, 456)).toBe(7850);
    const v = compileExpression('x + 1', 'density');
    expect(v.isConstant).toBe(false);
    expect(v.constant).toBeUndefined();
    expect(constantValue(parseExpression('x', 't'))).toBeUndefined();
    expect(compileExpression('log(-1)', 't').constant).toBeNaN();
  });
  it('evaluate is a plain function that can be detached', () => {
    const { evaluate } = compileExpression('x*y', 't');
    expect(evaluate(3, 4)).toBe(12);
  });
});
