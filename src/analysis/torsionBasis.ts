/**
 * Lagrange basis of order k (1 ≤ k ≤ 4) on the reference triangle, in barycentric coordinates.
 *
 * Nodes sit at the multi-indices α = (α0, α1, α2), α0 + α1 + α2 = k, point λ = α/k. The basis function of
 * node α is the classical product (from memory; e.g. any finite-element text's "Lagrange triangle"):
 *   φ_α(λ) = Π_m Π_{s=0}^{α_m − 1} (k·λ_m − s)/(s + 1),
 * which is 1 at its node and 0 at every other node. Local node order: the three vertices; then, for each
 * local edge e = 0, 1, 2 (vertex e → vertex e+1), its k − 1 inner nodes from vertex e towards vertex e+1;
 * then the (k − 1)(k − 2)/2 inner nodes.
 */

export interface LagrangeTable {
  order: number;
  /** nodes per triangle, (k + 1)(k + 2)/2 */
  nodes: number;
  /** multi-indices, 3 per node */
  alpha: Int32Array;
  /** values and derivatives with respect to (l1, l2) at rule points: [q·nodes + i] */
  phi: Float64Array;
  du: Float64Array;
  dv: Float64Array;
}

/** The multi-indices in local node order. */
export function lagrangeNodes(k: number): Int32Array {
  const out: number[] = [];
  const v = [[k, 0, 0], [0, k, 0], [0, 0, k]];
  for (const a of v) out.push(...a);
  for (let e = 0; e < 3; e++) {
    for (let j = 1; j < k; j++) {
      const a = [0, 0, 0];
      a[e] = k - j; a[(e + 1) % 3] = j;
      out.push(...a);
    }
  }
  for (let a1 = 1; a1 < k; a1++) for (let a2 = 1; a1 + a2 < k; a2++) out.push(k - a1 - a2, a1, a2);
  return Int32Array.from(out);
}

/** Value and gradient (w.r.t. l0, l1, l2 independently) of one factor product. */
function evalNode(k: number, a: ArrayLike<number>, l: readonly number[], g: number[]): number {
  const f = [1, 1, 1], df = [0, 0, 0];
  for (let m = 0; m < 3; m++) {
    // product over s of (k l − s)/(s + 1) and its derivative
    let p = 1, dp = 0;
    for (let s = 0; s < a[m]; s++) {
      const c = (k * l[m] - s) / (s + 1), dc = k / (s + 1);
      dp = dp * c + p * dc;
      p *= c;
    }
    f[m] = p; df[m] = dp;
  }
  g[0] = df[0] * f[1] * f[2]; g[1] = f[0] * df[1] * f[2]; g[2] = f[0] * f[1] * df[2];
  return f[0] * f[1] * f[2];
}

/** Tabulate the order-k basis at the points of a rule (barycentric l1, l2 arrays). */
export function lagrangeTable(k: number, l1: Float64Array, l2: Float64Array): LagrangeTable {
  if (!(Number.isInteger(k) && k >= 1 && k <= 4)) throw new Error(`lagrangeTable: order ${k} outside 1–4`);
  const alpha = lagrangeNodes(k);
  const nodes = alpha.length / 3, n = l1.length;
  const phi = new Float64Array(n * nodes), du = new Float64Array(n * nodes), dv = new Float64Array(n * nodes);
  const g = [0, 0, 0];
  for (let q = 0; q < n; q++) {
    const l = [1 - l1[q] - l2[q], l1[q], l2[q]];
    for (let i = 0; i < nodes; i++) {
      phi[q * nodes + i] = evalNode(k, alpha.subarray(3 * i, 3 * i + 3), l, g);
      // l0 = 1 − u − v: d/du = ∂1 − ∂0, d/dv = ∂2 − ∂0
      du[q * nodes + i] = g[1] - g[0];
      dv[q * nodes + i] = g[2] - g[0];
    }
  }
  return { order: k, nodes, alpha, phi, du, dv };
}
