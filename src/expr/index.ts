/**
 * The expression language for density, thickness and user integrands over a part, in x and y
 * (the part's length unit). See parse.ts for the grammar. Public API:
 *   compileExpression(text, where) → CompiledExpression
 *   parseExpression, interpret, polynomialDegree, variablesUsed, constantValue for finer use.
 */
import type { ExprNode, VariableName } from './ast.js';
import { constantValue, polynomialDegree, variablesUsed } from './analyze.js';
import { compileTree, type Evaluator } from './compile.js';
import { parseExpression } from './parse.js';

export type { ExprNode, VariableName, FunctionName, BinaryOp, CompareOp } from './ast.js';
export { FUNCTIONS, CONSTANTS } from './ast.js';
export { parseExpression, MAX_EXPRESSION_LENGTH, MAX_NESTING } from './parse.js';
export { interpret } from './interpret.js';
export { polynomialDegree, variablesUsed, constantValue, MAX_POLYNOMIAL_DEGREE } from './analyze.js';
export type { Evaluator } from './compile.js';

export interface CompiledExpression {
  /** The text as given. */
  readonly text: string;
  /** The checked syntax tree. */
  readonly tree: ExprNode;
  /**
   * Value at (x, y). Never throws; domain errors give NaN or ±Infinity, which callers must check
   * (Number.isFinite). A plain function: safe to detach from the object.
   */
  readonly evaluate: Evaluator;
  /** Upper bound on the total degree if a polynomial in x and y (constants: 0), else null. */
  readonly polynomialDegree: number | null;
  /** Variables that appear in the text. */
  readonly variables: ReadonlySet<VariableName>;
  /** True when the text uses neither x nor y. */
  readonly isConstant: boolean;
  /** The value when isConstant (may be non-finite, e.g. log(-1)); otherwise undefined. */
  readonly constant?: number;
}

/**
 * Parse, check and compile `text`. Throws InputError(where, '<what> at column N; expected ...').
 * `where` is the caller's label for the place the text came from (e.g. "thickness" or
 * "regions[2].density").
 */
export function compileExpression(text: string, where: string): CompiledExpression {
  const tree = parseExpression(text, where);
  const variables = variablesUsed(tree);
  const constant = constantValue(tree);
  const isConstant = constant !== undefined;
  const evaluate: Evaluator = isConstant ? () => constant : compileTree(tree);
  const base = { text, tree, evaluate, polynomialDegree: polynomialDegree(tree), variables, isConstant };
  return isConstant ? { ...base, constant } : base;
}
