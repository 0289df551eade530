/**
 * Straightforward tree-walking evaluator. It is the reference the compiled evaluator is tested
 * against, and the fallback where generated code is not allowed. Semantics are JavaScript's
 * IEEE 754 double arithmetic and Math functions; comparisons give 1 or 0; `if(c, a, b)` takes a
 * when c is neither 0 nor NaN. Domain errors give NaN or ±Infinity, never an exception.
 */
import type { ExprNode } from './ast.js';

export function interpret(node: ExprNode, x: number, y: number): number {
  switch (node.kind) {
    case 'number':
    case 'constant':
      return node.value;
    case 'variable':
      return node.name === 'x' ? x : y;
    case 'negate':
      return -interpret(node.arg, x, y);
    case 'binary': {
      const a = interpret(node.left, x, y);
      const b = interpret(node.right, x, y);
      switch (node.op) {
        case '+':
          return a + b;
        case '-':
          return a - b;
        case '*':
          return a * b;
        case '/':
          return a / b;
        case '^':
          return Math.pow(a, b);
      }
      break;
    }
    case 'compare': {
      const a = interpret(node.left, x, y);
      const b = interpret(node.right, x, y);
      switch (node.op) {
        case '<':
          return a < b ? 1 : 0;
        case '<=':
          return a <= b ? 1 : 0;
        case '>':
          return a > b ? 1 : 0;
        case '>=':
          return a >= b ? 1 : 0;
        case '==':
          return a === b ? 1 : 0;
        case '!=':
          return a !== b ? 1 : 0;
      }
      break;
    }
    case 'call': {
      const args = node.args;
      if (node.name === 'if') {
        const c = interpret(args[0]!, x, y);
        return c !== 0 && !Number.isNaN(c) ? interpret(args[1]!, x, y) : interpret(args[2]!, x, y);
      }
      const v = args.map((a) => interpret(a, x, y));
      switch (node.name) {
        case 'sin':
          return Math.sin(v[0]!);
        case 'cos':
          return Math.cos(v[0]!);
        case 'tan':
          return Math.tan(v[0]!);
        case 'asin':
          return Math.asin(v[0]!);
        case 'acos':
          return Math.acos(v[0]!);
        case 'atan':
          return Math.atan(v[0]!);
        case 'atan2':
          return Math.atan2(v[0]!, v[1]!);
        case 'exp':
          return Math.exp(v[0]!);
        case 'log':
          return Math.log(v[0]!);
        case 'sqrt':
          return Math.sqrt(v[0]!);
        case 'abs':
          return Math.abs(v[0]!);
        case 'floor':
          return Math.floor(v[0]!);
        case 'ceil':
          return Math.ceil(v[0]!);
        case 'pow':
          return Math.pow(v[0]!, v[1]!);
        case 'hypot':
          return Math.hypot(...v);
        case 'min':
          return Math.min(...v);
        case 'max':
          return Math.max(...v);
      }
      break;
    }
  }
  throw new Error(`interpret: unhandled node ${JSON.stringify(node)}`);
}
