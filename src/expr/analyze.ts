/**
 * Static facts about a checked tree: variables used, constant value, polynomial degree.
 */
import type { ExprNode, VariableName } from './ast.js';
import { interpret } from './interpret.js';

/** Degrees above this are reported as "not a usable polynomial" (null). */
export const MAX_POLYNOMIAL_DEGREE = 1000;

/** The variables that appear in the tree (structurally: `0*x` uses x). */
export function variablesUsed(node: ExprNode): ReadonlySet<VariableName> {
  const out = new Set<VariableName>();
  const walk = (n: ExprNode): void => {
    switch (n.kind) {
      case 'variable':
        out.add(n.name);
        return;
      case 'negate':
        walk(n.arg);
        return;
      case 'binary':
      case 'compare':
        walk(n.left);
        walk(n.right);
        return;
      case 'call':
        n.args.forEach(walk);
        return;
      default:
        return;
    }
  };
  walk(node);
  return out;
}

const hasVarsMemo = new WeakMap<ExprNode, boolean>();

/** True when x or y appears anywhere in the tree; memoized per node, so repeated calls are cheap. */
export function usesVariables(node: ExprNode): boolean {
  const known = hasVarsMemo.get(node);
  if (known !== undefined) return known;
  let v: boolean;
  switch (node.kind) {
    case 'variable':
      v = true;
      break;
    case 'number':
    case 'constant':
      v = false;
      break;
    case 'negate':
      v = usesVariables(node.arg);
      break;
    case 'binary':
    case 'compare': {
      const a = usesVariables(node.left);
      const b = usesVariables(node.right);
      v = a || b;
      break;
    }
    case 'call':
      v = false;
      for (const arg of node.args) if (usesVariables(arg)) v = true;
      break;
  }
  hasVarsMemo.set(node, v);
  return v;
}

/** The value of a tree that uses neither x nor y (may be NaN or ±Infinity); undefined otherwise. */
export function constantValue(node: ExprNode): number | undefined {
  return usesVariables(node) ? undefined : interpret(node, 0, 0);
}

/**
 * If the tree is a polynomial in x and y, an upper bound on its total degree (exact unless terms
 * cancel, e.g. x*x - x*x reports 2); otherwise null. Rules followed:
 * constants 0; x, y 1; a±b max; a*b sum; a/c with c constant, finite and non-zero: deg a;
 * a^n and pow(a, n) with n a constant non-negative integer: n·deg a; a function or comparison
 * of constants only: 0; anything else that involves x or y: null.
 * Degrees above MAX_POLYNOMIAL_DEGREE give null.
 */
export function polynomialDegree(node: ExprNode): number | null {
  const d = degree(node);
  return d !== null && d <= MAX_POLYNOMIAL_DEGREE ? d : null;
}

function degree(n: ExprNode): number | null {
  switch (n.kind) {
    case 'number':
    case 'constant':
      return 0;
    case 'variable':
      return 1;
    case 'negate':
      return degree(n.arg);
    case 'binary': {
      if (n.op === '+' || n.op === '-' || n.op === '*') {
        const a = degree(n.left);
        const b = degree(n.right);
        if (a === null || b === null) return null;
        const d = n.op === '*' ? a + b : Math.max(a, b);
        return d <= MAX_POLYNOMIAL_DEGREE ? d : null;
      }
      if (n.op === '/') {
        const c = constantValue(n.right);
        if (c === undefined || !Number.isFinite(c) || c === 0) return !usesVariables(n) ? 0 : null;
        return degree(n.left);
      }
      return powerDegree(n.left, n.right, n);
    }
    case 'call':
      if (n.name === 'pow') return powerDegree(n.args[0]!, n.args[1]!, n);
      return !usesVariables(n) ? 0 : null;
    case 'compare':
      return !usesVariables(n) ? 0 : null;
  }
}

function powerDegree(base: ExprNode, exponent: ExprNode, whole: ExprNode): number | null {
  if (!usesVariables(whole)) return 0;
  const k = constantValue(exponent);
  if (k === undefined || !Number.isInteger(k) || k < 0) return null;
  const b = degree(base);
  if (b === null) return null;
  const d = b * k;
  return d <= MAX_POLYNOMIAL_DEGREE ? d : null;
}

