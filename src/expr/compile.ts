/**
 * Compiles a checked syntax tree to a fast evaluator (x, y) => number.
 *
 * Safety: the generated source is built ONLY from the tree, never from the user's text. Its only
 * identifiers are x, y, the local names in LOCAL_NAMES (a closed list bound to Math functions) and
 * JavaScript operators; numbers are re-printed from their parsed double values and checked against
 * a strict numeric pattern. Constant subtrees (no x, no y) are folded to a single number by the
 * reference interpreter, so folding cannot change results.
 * If the runtime forbids code generation, the tree-walking interpreter is used instead.
 */
import type { ExprNode, FunctionName } from './ast.js';
import { usesVariables } from './analyze.js';
import { interpret } from './interpret.js';

export type Evaluator = (x: number, y: number) => number;

/** Function name → local identifier in generated code, and the value bound to it. */
const LOCAL_NAMES: Readonly<Record<Exclude<FunctionName, 'if'>, readonly [string, (...a: number[]) => number]>> = {
  sin: ['f_sin', Math.sin],
  cos: ['f_cos', Math.cos],
  tan: ['f_tan', Math.tan],
  asin: ['f_asin', Math.asin],
  acos: ['f_acos', Math.acos],
  atan: ['f_atan', Math.atan],
  atan2: ['f_atan2', Math.atan2],
  exp: ['f_exp', Math.exp],
  log: ['f_log', Math.log],
  sqrt: ['f_sqrt', Math.sqrt],
  abs: ['f_abs', Math.abs],
  floor: ['f_floor', Math.floor],
  ceil: ['f_ceil', Math.ceil],
  pow: ['f_pow', Math.pow],
  hypot: ['f_hypot', Math.hypot],
  min: ['f_min', Math.min],
  max: ['f_max', Math.max],
};

const NUMERIC = /^-?(?:\d+(?:\.\d+)?|\.\d+)(?:e[+-]?\d+)?$/;

/** A number as JavaScript source that evaluates to exactly the same double. */
export function numberLiteral(v: number): string {
  if (Number.isNaN(v)) return '(0/0)';
  if (v === Infinity) return '(1/0)';
  if (v === -Infinity) return '(-1/0)';
  if (Object.is(v, -0)) return '(-0)';
  const s = String(v);
  if (!NUMERIC.test(s) || Number(s) !== v) throw new Error(`numberLiteral: cannot print ${s}`);
  return `(${s})`;
}

const COMPARE_JS = { '<': '<', '<=': '<=', '>': '>', '>=': '>=', '==': '===', '!=': '!==' } as const;

const SUM_OPS: ReadonlySet<string> = new Set(['+', '-']);
const PRODUCT_OPS: ReadonlySet<string> = new Set(['*', '/']);

/**
 * JavaScript source for one node; exported for tests that inspect the generated text.
 * Every node is parenthesized except the left operand of a left-associative chain of the same
 * precedence (a + b - c, a * b / c), which JavaScript groups the same way. This keeps long flat
 * chains flat: V8 overflows its parser stack on about 1800 nested parentheses.
 */
export function generateSource(node: ExprNode, bare = false): string {
  if (node.kind !== 'number' && node.kind !== 'constant' && node.kind !== 'variable' && !usesVariables(node)) {
    return numberLiteral(interpret(node, 0, 0));
  }
  switch (node.kind) {
    case 'number':
    case 'constant':
      return numberLiteral(node.value);
    case 'variable':
      if (node.name !== 'x' && node.name !== 'y') break;
      return node.name;
    case 'negate':
      return `(-${generateSource(node.arg)})`;
    case 'binary': {
      const l = node.left;
      const chained = l.kind === 'binary' && (SUM_OPS.has(node.op) ? SUM_OPS : PRODUCT_OPS).has(l.op) && node.op !== '^';
      const a = generateSource(l, chained);
      const b = generateSource(node.right);
      switch (node.op) {
        case '+':
        case '-':
        case '*':
        case '/':
          return bare ? `${a} ${node.op} ${b}` : `(${a} ${node.op} ${b})`;
        case '^':
          return `${LOCAL_NAMES.pow[0]}(${a}, ${b})`;
      }
      break;
    }
    case 'compare': {
      const op = COMPARE_JS[node.op];
      if (op === undefined) break;
      return `(${generateSource(node.left)} ${op} ${generateSource(node.right)} ? 1 : 0)`;
    }
    case 'call': {
      const args = node.args.map((arg) => generateSource(arg));
      if (node.name === 'if') return `(${args[0]} ? ${args[1]} : ${args[2]})`;
      const local = Object.prototype.hasOwnProperty.call(LOCAL_NAMES, node.name) ? LOCAL_NAMES[node.name][0] : undefined;
      if (local === undefined) break;
      return `${local}(${args.join(', ')})`;
    }
  }
  throw new Error(`generateSource: unexpected node ${JSON.stringify(node)}`);
}

let codegenAllowed: boolean | undefined;

/** Build the evaluator. `useCodegen = false` forces the interpreter (for tests and comparison). */
export function compileTree(node: ExprNode, useCodegen = true): Evaluator {
  if (useCodegen && codegenAllowed !== false) {
    const names = Object.values(LOCAL_NAMES);
    const prelude = names.map(([local], i) => `${local} = F[${i}]`).join(', ');
    const source = `"use strict";\nconst ${prelude};\nreturn function compiledExpression(x, y) { return ${generateSource(node)}; };`;
    try {
      const make = new Function('F', source) as (f: readonly ((...a: number[]) => number)[]) => Evaluator;
      codegenAllowed = true;
      return make(names.map(([, fn]) => fn));
    } catch (e) {
      // EvalError: code generation from strings is disallowed in this runtime (remember that).
      // RangeError: the engine's parser ran out of stack on this one text; interpret it instead.
      if (e instanceof EvalError) codegenAllowed = false;
      else if (!(e instanceof RangeError)) throw e;
    }
  }
  return (x: number, y: number) => interpret(node, x, y);
}
