/**
 * Sparse symmetric matrices in compressed sparse row form (CSR, both triangles stored, columns sorted in
 * every row) and their assembly from coordinate triplets. Knows nothing of meshes or plates.
 *
 * Solver: preconditioned conjugate gradients with an incomplete Cholesky IC(0) preconditioner
 * (src/numeric/sparseSolve.ts); decision and figures in docs/sparse-solver-decision.md.
 */

export interface CsrMatrix {
  readonly n: number;
  /** rowPtr[i] … rowPtr[i + 1] − 1 index the entries of row i. */
  readonly rowPtr: Int32Array;
  /** Column of each entry; ascending within a row. */
  readonly col: Int32Array;
  readonly val: Float64Array;
}

/**
 * Triplet collector: entries added with `add(i, j, v)`; duplicates are summed by `toCsr`. Grows by
 * doubling; `reserve` avoids growth when the count is known (a finite-element assembly knows it).
 */
export class TripletBuilder {
  private rows: Int32Array;
  private cols: Int32Array;
  private vals: Float64Array;
  count = 0;

  constructor(readonly n: number, capacity = 16) {
    const c = Math.max(1, capacity);
    this.rows = new Int32Array(c); this.cols = new Int32Array(c); this.vals = new Float64Array(c);
  }

  add(i: number, j: number, v: number): void {
    if (this.count === this.rows.length) {
      const c = 2 * this.rows.length;
      const r = new Int32Array(c); r.set(this.rows); this.rows = r;
      const k = new Int32Array(c); k.set(this.cols); this.cols = k;
      const w = new Float64Array(c); w.set(this.vals); this.vals = w;
    }
    this.rows[this.count] = i; this.cols[this.count] = j; this.vals[this.count] = v;
    this.count++;
  }

  /** CSR with duplicates summed and columns sorted (counting sort by row, then by column within rows). */
  toCsr(): CsrMatrix {
    const n = this.n, m = this.count;
    // bucket by column first, then stable bucket by row: rows end up with ascending columns
    const byCol = new Int32Array(n + 1);
    for (let e = 0; e < m; e++) byCol[this.cols[e] + 1]++;
    for (let i = 0; i < n; i++) byCol[i + 1] += byCol[i];
    const order1 = new Int32Array(m);
    const fill = byCol.slice(0, n);
    for (let e = 0; e < m; e++) order1[fill[this.cols[e]]++] = e;
    const byRow = new Int32Array(n + 1);
    for (let e = 0; e < m; e++) byRow[this.rows[e] + 1]++;
    for (let i = 0; i < n; i++) byRow[i + 1] += byRow[i];
    const order = new Int32Array(m);
    const fr = byRow.slice(0, n);
    for (let q = 0; q < m; q++) { const e = order1[q]; order[fr[this.rows[e]]++] = e; }
    // merge duplicates
    const rowPtr = new Int32Array(n + 1);
    const col = new Int32Array(m);
    const val = new Float64Array(m);
    let k = 0;
    for (let i = 0; i < n; i++) {
      rowPtr[i] = k;
      let last = -1;
      for (let q = byRow[i]; q < byRow[i + 1]; q++) {
        const e = order[q];
        const j = this.cols[e];
        if (j === last) { val[k - 1] += this.vals[e]; continue; }
        col[k] = j; val[k] = this.vals[e]; last = j; k++;
      }
    }
    rowPtr[n] = k;
    return { n, rowPtr, col: col.slice(0, k), val: val.slice(0, k) };
  }
}

/** y = A x. */
export function csrMultiply(A: CsrMatrix, x: ArrayLike<number>, y: Float64Array): void {
  const { n, rowPtr, col, val } = A;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = rowPtr[i]; k < rowPtr[i + 1]; k++) s += val[k] * x[col[k]];
    y[i] = s;
  }
}

/** Index of entry (i, j), or −1 (binary search in the sorted row). */
export function csrFind(A: CsrMatrix, i: number, j: number): number {
  let lo = A.rowPtr[i], hi = A.rowPtr[i + 1] - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1, c = A.col[mid];
    if (c === j) return mid;
    if (c < j) lo = mid + 1; else hi = mid - 1;
  }
  return -1;
}

/**
 * Make a symmetric system definite by fixing unknown `i` to `value`: row and column i become the identity
 * row and column, and the right-hand side takes the fixed column's contribution. Works in place.
 */
export function fixUnknown(A: CsrMatrix, b: Float64Array, i: number, value: number): void {
  for (let k = A.rowPtr[i]; k < A.rowPtr[i + 1]; k++) {
    const j = A.col[k];
    if (j === i) continue;
    const kj = csrFind(A, j, i);
    b[j] -= A.val[kj] * value;
    A.val[kj] = 0;
    A.val[k] = 0;
  }
  A.val[csrFind(A, i, i)] = 1;
  b[i] = value;
}
