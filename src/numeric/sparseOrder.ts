/**
 * Reverse Cuthill–McKee ordering of a symmetric sparsity pattern (E. Cuthill and J. McKee, 1969; reversed
 * as A. George proposed, 1971 — from memory): breadth-first search from a pseudo-peripheral vertex, each
 * vertex's unvisited neighbours taken in increasing degree, the whole order reversed. Incomplete Cholesky
 * with zero fill is much stronger on a banded ordering than on the scattered order in which a refined
 * mesh numbers its unknowns (measured: docs/sparse-solver-decision.md).
 */
import type { CsrMatrix } from './sparse.js';

/** perm[newIndex] = oldIndex. Handles disconnected patterns (one search per component). */
export function reverseCuthillMcKee(A: CsrMatrix): Int32Array {
  const n = A.n, { rowPtr, col } = A;
  const deg = new Int32Array(n);
  for (let i = 0; i < n; i++) deg[i] = rowPtr[i + 1] - rowPtr[i];
  const order = new Int32Array(n);
  const seen = new Uint8Array(n);
  const level = new Int32Array(n);
  let filled = 0;
  const bfs = (start: number, mark: Uint8Array, out: Int32Array, at: number): { end: number; last: number; depth: number } => {
    let head = at, tail = at;
    out[tail++] = start; mark[start] = 1; level[start] = 0;
    let depth = 0;
    const nb: number[] = [];
    while (head < tail) {
      const v = out[head++];
      nb.length = 0;
      for (let k = rowPtr[v]; k < rowPtr[v + 1]; k++) { const w = col[k]; if (!mark[w]) { mark[w] = 1; nb.push(w); } }
      nb.sort((p, q) => deg[p] - deg[q] || p - q);
      for (const w of nb) { level[w] = level[v] + 1; if (level[w] > depth) depth = level[w]; out[tail++] = w; }
    }
    return { end: tail, last: out[tail - 1], depth };
  };
  const scratch = new Int32Array(n);
  for (let s = 0; s < n; s++) {
    if (seen[s]) continue;
    // pseudo-peripheral start: repeat the search from the last vertex found while the depth grows
    let start = s, depth = -1;
    for (let pass = 0; pass < 5; pass++) {
      const tmp = new Uint8Array(n);
      for (let i = 0; i < n; i++) tmp[i] = seen[i];
      const r = bfs(start, tmp, scratch, 0);
      if (r.depth <= depth) break;
      depth = r.depth;
      // the last vertex of the deepest level with the smallest degree
      let best = r.last;
      for (let i = r.end - 1; i >= 0 && level[scratch[i]] === r.depth; i--) if (deg[scratch[i]] < deg[best]) best = scratch[i];
      if (best === start) break;
      start = best;
    }
    filled = bfs(start, seen, order, filled).end;
  }
  order.reverse();
  return order;
}

/** P A Pᵀ for perm[new] = old: entry (i, j) of the result is A[perm[i], perm[j]]; rows stay sorted. */
export function permuteSymmetric(A: CsrMatrix, perm: Int32Array): CsrMatrix {
  const n = A.n;
  const inv = new Int32Array(n);
  for (let i = 0; i < n; i++) inv[perm[i]] = i;
  const rowPtr = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) rowPtr[i + 1] = rowPtr[i] + (A.rowPtr[perm[i] + 1] - A.rowPtr[perm[i]]);
  const col = new Int32Array(rowPtr[n]), val = new Float64Array(rowPtr[n]);
  const idx: number[] = [];
  for (let i = 0; i < n; i++) {
    const o = perm[i], a = A.rowPtr[o], len = A.rowPtr[o + 1] - a;
    idx.length = 0;
    for (let k = 0; k < len; k++) idx.push(k);
    idx.sort((p, q) => inv[A.col[a + p]] - inv[A.col[a + q]]);
    for (let k = 0; k < len; k++) { col[rowPtr[i] + k] = inv[A.col[a + idx[k]]]; val[rowPtr[i] + k] = A.val[a + idx[k]]; }
  }
  return { n, rowPtr, col, val };
}
