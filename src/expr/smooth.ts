/**
 * Where is an expression smooth? Two static analyses of a checked tree, for the quadrature's stopping rule:
 *
 *  - `kinkLines(tree, box)`: the straight kink and jump lines of the nodes that are not smooth (abs, min,
 *    max, floor, ceil, comparisons, the condition of `if`) whose arguments are linear in x and y (degree ≤ 1):
 *    abs(u) kinks on u = 0, min/max(a, b, …) on a − b = 0 for every pair, a comparison l ⋛ r jumps on
 *    l − r = 0, floor(u) and ceil(u) jump on u = k for every integer k in the range of u over the box. A part
 *    cut exactly along these lines has the integrand smooth (as far as these nodes go) on every piece.
 *
 *  - `smoothOnBox(tree, box, linearCut)`: true only when interval arithmetic (outward rounded) proves that no
 *    node of the tree can be non-smooth anywhere in the open box: no sqrt, log, fractional power or division
 *    whose argument may reach zero (or below), no asin/acos argument that may reach ±1, no tan pole, no
 *    atan2 branch cut, no hypot cone point, and no kink or jump of the nodes above inside the box — except
 *    that, with `linearCut`, kinks and jumps on linear arguments are taken as cut by the mesh (the caller
 *    guarantees that no triangle straddles them). False means "not established", never "proved rough".
 *
 * Intervals are widened outward by a few ulps after every operation, so rounding can only make the answer
 * more cautious.
 */
import type { ExprNode } from './ast.js';
import { polynomialDegree } from './analyze.js';
import { interpret } from './interpret.js';

/** Box [x0, y0, x1, y1] in the expression's coordinates. */
export type Box4 = readonly [number, number, number, number];

/** A straight line g(x, y) = a·(x − x0) + b·(y − y0) + c = 0. */
export interface KinkLine { a: number; b: number; c: number; x0: number; y0: number }

/** Most lines `kinkLines` returns; more gives null (the caller then refines and says it could not verify). */
export const MAX_KINK_LINES = 16;

type Iv = [number, number];
const ALL: Iv = [-Infinity, Infinity];
const out = (lo: number, hi: number): Iv => {
  if (Number.isNaN(lo) || Number.isNaN(hi)) return ALL;
  return [lo - Math.abs(lo) * 4e-16 - 1e-300, hi + Math.abs(hi) * 4e-16 + 1e-300];
};
const isLinear = (n: ExprNode): boolean => { const d = polynomialDegree(n); return d !== null && d <= 1; };
const straddles = (v: Iv): boolean => v[0] < 0 && v[1] > 0;
const minusIv = (a: Iv, b: Iv): Iv => out(a[0] - b[1], a[1] - b[0]);

function mulIv(a: Iv, b: Iv): Iv {
  const p = [a[0] * b[0], a[0] * b[1], a[1] * b[0], a[1] * b[1]];
  if (p.some(Number.isNaN)) return ALL;
  return out(Math.min(...p), Math.max(...p));
}

function powIv(b: Iv, n: number): Iv {
  // integer n ≥ 0
  if (n === 0) return [1, 1];
  const lo = b[0] ** n, hi = b[1] ** n;
  if (n % 2 === 1) return out(lo, hi);
  if (b[0] >= 0) return out(lo, hi);
  if (b[1] <= 0) return out(hi, lo);
  return out(0, Math.max(lo, hi));
}

/** State of one walk: whether something not smooth was met. */
interface Walk { box: Box4; linearCut: boolean; rough: boolean }

function iv(n: ExprNode, w: Walk): Iv {
  switch (n.kind) {
    case 'number':
    case 'constant':
      return [n.value, n.value];
    case 'variable':
      return n.name === 'x' ? [w.box[0], w.box[2]] : [w.box[1], w.box[3]];
    case 'negate': {
      const a = iv(n.arg, w);
      return [-a[1], -a[0]];
    }
    case 'binary': {
      const a = iv(n.left, w), b = iv(n.right, w);
      switch (n.op) {
        case '+': return out(a[0] + b[0], a[1] + b[1]);
        case '-': return minusIv(a, b);
        case '*': return mulIv(a, b);
        case '/':
          if (!(b[0] > 0 || b[1] < 0)) { w.rough = true; return ALL; }
          return mulIv(a, out(1 / b[1], 1 / b[0]));
        case '^': return powerIv(a, n.right, b, w);
      }
      return ALL;
    }
    case 'compare': {
      const d = minusIv(iv(n.left, w), iv(n.right, w));
      if (d[0] > 0 || d[1] < 0) {
        // decided on the whole box (outward rounding keeps this safe)
        const v = interpret(n, (w.box[0] + w.box[2]) / 2, (w.box[1] + w.box[3]) / 2);
        return [v, v];
      }
      if (!(w.linearCut && isLinear(n.left) && isLinear(n.right))) w.rough = true;
      return [0, 1];
    }
    case 'call':
      return callIv(n, w);
  }
}

function powerIv(a: Iv, exponent: ExprNode, e: Iv, w: Walk): Iv {
  if (e[0] === e[1] && Number.isInteger(e[0]) && !usesXY(exponent)) {
    const k = e[0];
    if (k >= 0) return powIv(a, k);
    if (!(a[0] > 0 || a[1] < 0)) { w.rough = true; return ALL; }
    const p = powIv(a, -k);
    return out(Math.min(1 / p[0], 1 / p[1]), Math.max(1 / p[0], 1 / p[1]));
  }
  if (!(a[0] > 0)) {
    w.rough = true;
    // defined only where the base is ≥ 0: with a constant positive exponent the values stay in [0^e, hi^e]
    if (e[0] === e[1] && e[0] > 0 && !usesXY(exponent) && a[1] >= 0) return out(Math.pow(Math.max(a[0], 0), e[0]), Math.pow(a[1], e[0]));
    return ALL;
  }
  // b^e = exp(e·ln b), monotone pieces
  const l = out(Math.log(a[0]), Math.log(a[1]));
  const m = mulIv(l, e);
  return out(Math.exp(m[0]), Math.exp(m[1]));
}

const usesXY = (n: ExprNode): boolean => !isConstantTree(n);
function isConstantTree(n: ExprNode): boolean {
  switch (n.kind) {
    case 'variable': return false;
    case 'number': case 'constant': return true;
    case 'negate': return isConstantTree(n.arg);
    case 'binary': case 'compare': return isConstantTree(n.left) && isConstantTree(n.right);
    case 'call': return n.args.every(isConstantTree);
  }
}

function callIv(n: Extract<ExprNode, { kind: 'call' }>, w: Walk): Iv {
  const args = n.args.map((a) => iv(a, w));
  const a = args[0];
  const rough = (): Iv => { w.rough = true; return ALL; };
  switch (n.name) {
    case 'sin': case 'cos': return [-1, 1];
    case 'tan': {
      if (!(a[1] - a[0] < Math.PI)) return rough();
      const k = Math.floor(a[0] / Math.PI - 0.5); // poles at (k + 1/2)π
      if ((k + 1.5) * Math.PI <= a[1] + 1e-12 * Math.abs(a[1]) || (k + 0.5) * Math.PI >= a[0] - 1e-12 * Math.abs(a[0])) return rough();
      return out(Math.tan(a[0]), Math.tan(a[1]));
    }
    case 'asin': case 'acos':
      if (!(a[0] > -1 && a[1] < 1)) {
        // defined on [−1, 1] only: the values stay within the function's range there
        w.rough = true;
        return n.name === 'asin' ? [-Math.PI / 2, Math.PI / 2] : [0, Math.PI];
      }
      return n.name === 'asin' ? out(Math.asin(a[0]), Math.asin(a[1])) : out(Math.acos(a[1]), Math.acos(a[0]));
    case 'atan': return out(Math.atan(a[0]), Math.atan(a[1]));
    case 'atan2': {
      // atan2(y, x) jumps across the negative x axis and is singular at the origin
      const [yv, xv] = args;
      // (the values stay within [−π, π] either way)
      if (!(xv[0] > 0 || yv[0] > 0 || yv[1] < 0)) w.rough = true;
      return [-Math.PI, Math.PI];
    }
    case 'exp': return out(Math.exp(a[0]), Math.exp(a[1]));
    case 'log':
      if (!(a[0] > 0)) { w.rough = true; return a[1] > 0 ? [-Infinity, Math.log(a[1]) + 1e-15 * Math.abs(Math.log(a[1]))] : ALL; }
      return out(Math.log(a[0]), Math.log(a[1]));
    case 'sqrt':
      // defined where the argument is ≥ 0: the values stay in [0, √hi]
      if (!(a[0] > 0)) { w.rough = true; return a[1] >= 0 ? out(0, Math.sqrt(a[1])) : ALL; }
      return out(Math.sqrt(a[0]), Math.sqrt(a[1]));
    case 'pow': return powerIv(a, n.args[1]!, args[1], w);
    case 'hypot': {
      if (args.every((v) => v[0] <= 0 && v[1] >= 0)) w.rough = true;
      let hi = 0;
      for (const v of args) hi += Math.max(v[0] * v[0], v[1] * v[1]);
      return out(0, Math.sqrt(hi));
    }
    case 'abs': {
      if (straddles(a)) {
        if (!(w.linearCut && isLinear(n.args[0]!))) w.rough = true;
        return out(0, Math.max(-a[0], a[1]));
      }
      return a[0] >= 0 ? a : [-a[1], -a[0]];
    }
    case 'floor': case 'ceil': {
      const f = n.name === 'floor' ? Math.floor : Math.ceil;
      const lo = f(a[0]), hi = f(a[1]);
      // a jump inside the box: an integer strictly between the ends
      let k = Math.ceil(a[0]);
      if (k === a[0]) k += 1;
      const jump = k < a[1];
      if (jump && !(w.linearCut && isLinear(n.args[0]!))) w.rough = true;
      return [lo, hi];
    }
    case 'min': case 'max': {
      const isMin = n.name === 'min';
      // smooth if one argument dominates all the others on the box
      const dominant = args.some((v, i) => args.every((u, j) => i === j || (isMin ? v[1] <= u[0] : v[0] >= u[1])));
      if (!dominant && !(w.linearCut && n.args.every(isLinear))) w.rough = true;
      const los = args.map((v) => v[0]), his = args.map((v) => v[1]);
      return isMin ? [Math.min(...los), Math.min(...his)] : [Math.max(...los), Math.max(...his)];
    }
    case 'if': {
      const [c, t, e] = args;
      if (c[0] > 0 || c[1] < 0) return t;
      if (c[0] === 0 && c[1] === 0) return e;
      const cond = n.args[0]!;
      // a jump where the condition changes: cut only when the condition is a comparison of linear sides
      // (its own walk has judged it) or a linear expression (jump on cond = 0)
      if (!(w.linearCut && (cond.kind === 'compare' ? isLinear(cond.left) && isLinear(cond.right) : isLinear(cond)))) w.rough = true;
      return [Math.min(t[0], e[0]), Math.max(t[1], e[1])];
    }
  }
}

/** True when the tree is proved smooth (analytic) on the open box; see the file comment. */
export function smoothOnBox(tree: ExprNode, box: Box4, linearCut: boolean): boolean {
  const w: Walk = { box, linearCut, rough: false };
  const v = iv(tree, w);
  return !w.rough && !Number.isNaN(v[0]) && !Number.isNaN(v[1]);
}

/**
 * An interval holding every value of the tree on the closed box (outward rounded), or null when the walk
 * met something it cannot bound (a division by an interval holding zero, …). Used to prove a polynomial
 * thickness or density positive over a part before taking the boundary path.
 */
export function rangeOnBox(tree: ExprNode, box: Box4): [number, number] | null {
  const w: Walk = { box, linearCut: false, rough: false };
  const v = iv(tree, w);
  return w.rough || Number.isNaN(v[0]) || Number.isNaN(v[1]) ? null : [v[0], v[1]];
}

/**
 * For a polynomial tree (+, −, ·, division by a constant, whole constant powers; functions of constants):
 * the largest |value| on the closed box and a bound on the error of its floating-point evaluation anywhere
 * in the box when x and y each come with an absolute error up to `inputError` — or null for anything else.
 * Running error analysis over intervals: every operation's result is rounded within ε·|result| (IEEE 754
 * arithmetic; Math.pow with a whole exponent n counted as 2n + 2 roundings), and errors in the operands
 * propagate exactly as |a|·e_b + |b|·e_a + e_a·e_b for a product, e_a + e_b for a sum, (|a| + e_a)^n − |a|^n
 * for a power (bounded by k·e_a·(|a| + e_a)^(k−1)), with |a| the largest on the box (interval arithmetic); a number or constant carries its own
 * rounding ε·|v| (the decimal or exact value it stands for). The usual first-order analysis
 * (N. J. Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM 2002, ch. 3, from memory)
 * kept to all orders, so the bound holds however large the errors.
 */
export function roundingOnBox(tree: ExprNode, box: Box4, inputError: number): { max: number; error: number } | null {
  const w: Walk = { box, linearCut: false, rough: false };
  const eps = Number.EPSILON;
  const big = (v: Iv) => Math.max(Math.abs(v[0]), Math.abs(v[1]));
  const rec = (n: ExprNode): { v: Iv; e: number } | null => {
    if (isConstantTree(n)) {
      const v = interpret(n, 0, 0);
      if (!Number.isFinite(v)) return null;
      const ops = n.kind === 'number' || n.kind === 'constant' ? 1 : 4;
      return { v: [v, v], e: ops * eps * Math.abs(v) };
    }
    switch (n.kind) {
      case 'variable': return { v: n.name === 'x' ? [box[0], box[2]] : [box[1], box[3]], e: inputError };
      case 'negate': { const a = rec(n.arg); return a && { v: [-a.v[1], -a.v[0]], e: a.e }; }
      case 'binary': {
        const a = rec(n.left);
        if (!a) return null;
        if (n.op === '^') return power(a, n.right);
        const b = rec(n.right);
        if (!b) return null;
        let v: Iv, e: number;
        switch (n.op) {
          case '+': v = out(a.v[0] + b.v[0], a.v[1] + b.v[1]); e = a.e + b.e; break;
          case '-': v = minusIv(a.v, b.v); e = a.e + b.e; break;
          case '*': v = mulIv(a.v, b.v); e = big(a.v) * b.e + big(b.v) * a.e + a.e * b.e; break;
          default: {
            // division by a constant c (exact bound: |a/c − (a + e_a)/(c + e_c)| ≤ (|a|e_c + |c|e_a)/(|c|(|c| − e_c)))
            const c = Math.abs(b.v[0]);
            if (b.v[0] !== b.v[1] || !(c > b.e)) return null;
            v = mulIv(a.v, out(1 / b.v[0], 1 / b.v[0]));
            e = (big(a.v) * b.e + c * a.e) / (c * (c - b.e));
          }
        }
        return { v, e: (e + eps * big(v)) * (1 + 1e-12) };
      }
      case 'call': {
        if (n.name !== 'pow') return null;
        const a = rec(n.args[0]!);
        return a && power(a, n.args[1]!);
      }
      default: return null;
    }
  };
  const power = (a: { v: Iv; e: number }, exponent: ExprNode): { v: Iv; e: number } | null => {
    if (!isConstantTree(exponent)) return null;
    const k = interpret(exponent, 0, 0);
    if (!Number.isInteger(k) || k < 0) return null;
    const v = powIv(a.v, k), m = big(a.v);
    // (m + e)^k − m^k ≤ k·e·(m + e)^(k − 1), written without the cancellation
    return { v, e: ((k === 0 ? 0 : k * a.e * (m + a.e) ** (k - 1)) + (2 * k + 2) * eps * big(v)) * (1 + 1e-12) };
  };
  const r = rec(tree);
  if (!r || w.rough || !Number.isFinite(r.e) || !Number.isFinite(big(r.v))) return null;
  return { max: big(r.v), error: r.e };
}

/**
 * The kink and jump lines of linear-argument nodes that cross the box (see the file comment), at most
 * MAX_KINK_LINES (null when there are more), without repeats.
 */
export function kinkLines(tree: ExprNode, box: Box4): KinkLine[] | null {
  const x0 = (box[0] + box[2]) / 2, y0 = (box[1] + box[3]) / 2;
  const s = Math.max(box[2] - box[0], box[3] - box[1], 1e-300);
  const lines: KinkLine[] = [];
  let tooMany = false;
  const add = (g: (x: number, y: number) => number, c0 = 0) => {
    const c = g(x0, y0) - c0;
    const a = (g(x0 + s, y0) - g(x0 - s, y0)) / (2 * s), b = (g(x0, y0 + s) - g(x0, y0 - s)) / (2 * s);
    if (!(a !== 0 || b !== 0) || !Number.isFinite(a + b + c)) return;
    // crosses the box? (corners on both sides)
    const h = Math.abs(a) * (box[2] - box[0]) / 2 + Math.abs(b) * (box[3] - box[1]) / 2;
    if (!(Math.abs(c) < h)) return;
    const n = Math.hypot(a, b), sg = a !== 0 ? Math.sign(a) : Math.sign(b);
    const key = { a: (sg * a) / n, b: (sg * b) / n, c: (sg * c) / n };
    if (lines.some((l) => {
      const m = Math.hypot(l.a, l.b), t = l.a !== 0 ? Math.sign(l.a) : Math.sign(l.b);
      return Math.abs(t * l.a / m - key.a) < 1e-12 && Math.abs(t * l.b / m - key.b) < 1e-12 && Math.abs(t * l.c / m - key.c) <= 1e-12 * s;
    })) return;
    if (lines.length >= MAX_KINK_LINES) { tooMany = true; return; }
    lines.push({ a, b, c, x0, y0 });
  };
  const fn = (n: ExprNode) => (x: number, y: number) => interpret(n, x, y);
  const diff = (p: ExprNode, q: ExprNode) => (x: number, y: number) => interpret(p, x, y) - interpret(q, x, y);
  const walk = (n: ExprNode): void => {
    switch (n.kind) {
      case 'negate': walk(n.arg); return;
      case 'binary': walk(n.left); walk(n.right); return;
      case 'compare':
        walk(n.left); walk(n.right);
        if (isLinear(n.left) && isLinear(n.right)) add(diff(n.left, n.right));
        return;
      case 'call': {
        n.args.forEach(walk);
        const a0 = n.args[0]!;
        if (n.name === 'abs' && isLinear(a0)) add(fn(a0));
        else if ((n.name === 'min' || n.name === 'max') && n.args.every(isLinear)) {
          for (let i = 0; i < n.args.length; i++) for (let j = i + 1; j < n.args.length; j++) add(diff(n.args[i]!, n.args[j]!));
        } else if ((n.name === 'floor' || n.name === 'ceil') && isLinear(a0)) {
          const w: Walk = { box, linearCut: true, rough: false };
          const r = iv(a0, w);
          const k0 = Math.ceil(r[0]), k1 = Math.floor(r[1]);
          if (!(k1 - k0 < MAX_KINK_LINES)) { tooMany = true; return; }
          for (let k = k0; k <= k1; k++) add(fn(a0), k);
        } else if (n.name === 'if' && a0.kind !== 'compare' && isLinear(a0)) add(fn(a0));
        return;
      }
      default: return;
    }
  };
  walk(tree);
  return tooMany ? null : lines;
}
