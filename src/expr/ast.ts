/**
 * Syntax tree of the expression language, and the closed table of names it knows.
 * Every identifier that can ever reach generated code comes from the tables in this file.
 */

/** Variables: coordinates in the part's length unit. */
export type VariableName = 'x' | 'y';

/** Named constants. `e` is Euler's number, `pi` is π (values from Math.E and Math.PI). */
export const CONSTANTS: Readonly<Record<string, number>> = Object.freeze({
  pi: Math.PI,
  e: Math.E,
});

export type BinaryOp = '+' | '-' | '*' | '/' | '^';
export type CompareOp = '<' | '<=' | '>' | '>=' | '==' | '!=';

/**
 * Built-in functions with their argument counts (max = Infinity for variadic ones).
 * `if(c, a, b)` gives a when c is non-zero and not NaN, otherwise b.
 */
export interface FunctionInfo {
  readonly min: number;
  readonly max: number;
}

export const FUNCTIONS = Object.freeze({
  sin: { min: 1, max: 1 },
  cos: { min: 1, max: 1 },
  tan: { min: 1, max: 1 },
  asin: { min: 1, max: 1 },
  acos: { min: 1, max: 1 },
  atan: { min: 1, max: 1 },
  atan2: { min: 2, max: 2 },
  exp: { min: 1, max: 1 },
  log: { min: 1, max: 1 },
  sqrt: { min: 1, max: 1 },
  abs: { min: 1, max: 1 },
  floor: { min: 1, max: 1 },
  ceil: { min: 1, max: 1 },
  pow: { min: 2, max: 2 },
  hypot: { min: 2, max: Infinity },
  min: { min: 2, max: Infinity },
  max: { min: 2, max: Infinity },
  if: { min: 3, max: 3 },
} satisfies Record<string, FunctionInfo>);

export type FunctionName = keyof typeof FUNCTIONS;

export function isFunctionName(s: string): s is FunctionName {
  return Object.prototype.hasOwnProperty.call(FUNCTIONS, s);
}

export function isConstantName(s: string): boolean {
  return Object.prototype.hasOwnProperty.call(CONSTANTS, s);
}

/** `pos` is the 1-based column of the node's first character (or of its operator). */
export type ExprNode =
  | { readonly kind: 'number'; readonly value: number; readonly pos: number }
  | { readonly kind: 'constant'; readonly name: string; readonly value: number; readonly pos: number }
  | { readonly kind: 'variable'; readonly name: VariableName; readonly pos: number }
  | { readonly kind: 'negate'; readonly arg: ExprNode; readonly pos: number }
  | { readonly kind: 'binary'; readonly op: BinaryOp; readonly left: ExprNode; readonly right: ExprNode; readonly pos: number }
  | { readonly kind: 'compare'; readonly op: CompareOp; readonly left: ExprNode; readonly right: ExprNode; readonly pos: number }
  | { readonly kind: 'call'; readonly name: FunctionName; readonly args: readonly ExprNode[]; readonly pos: number };
