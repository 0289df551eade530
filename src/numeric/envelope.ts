/**
 * Cholesky factorisation of a symmetric positive semi-definite CSR matrix in envelope (profile) storage
 * after a reverse Cuthill–McKee renumbering: row i keeps every entry from its first non-zero column to the
 * diagonal, so the factor has no fill outside that envelope. Cost Σ (row length)²; meant for the small
 * coarsest level of a multigrid hierarchy (src/numeric/multigrid.ts), where it is exact.
 *
 * Semi-definite matrices (a Neumann problem's stiffness: constants in the null space, one per connected
 * part): a pivot that falls below PIVOT_FLOOR times its row's original diagonal is taken as a null
 * direction. That unknown is grounded (set to zero), which is the same as deleting its row and column;
 * for a right-hand side orthogonal to the null space this gives one exact solution, otherwise the solution
 * of the grounded system. The operator b ↦ x stays symmetric positive semi-definite either way.
 */
import type { CsrMatrix } from './sparse.js';
import { permuteSymmetric, reverseCuthillMcKee } from './sparseOrder.js';

/** A pivot below this fraction of its diagonal marks a null direction (a stiffness matrix whose
 * conditioning reached 1e10 on the coarsest level would need it: far beyond the meshes it serves). */
export const PIVOT_FLOOR = 1e-10;

export interface EnvelopeCholesky {
  readonly n: number;
  /** perm[new] = old */
  readonly perm: Int32Array;
  /** first column of each (renumbered) row's envelope */
  readonly first: Int32Array;
  /** start of row i's entries in `val` (row i holds columns first[i] … i) */
  readonly start: Int32Array;
  readonly val: Float64Array;
  /** 1 where the pivot marked a null direction */
  readonly grounded: Uint8Array;
  /** number of grounded unknowns */
  readonly nulls: number;
  /** scratch of length n for solves */
  readonly work: Float64Array;
}

/** Envelope size (stored entries) after RCM, without factorising: lets a caller decide before spending. */
export function envelopeSize(A: CsrMatrix, perm = reverseCuthillMcKee(A)): number {
  const inv = new Int32Array(A.n);
  for (let i = 0; i < A.n; i++) inv[perm[i]] = i;
  let s = 0;
  for (let i = 0; i < A.n; i++) {
    const o = perm[i];
    let f = i;
    for (let k = A.rowPtr[o]; k < A.rowPtr[o + 1]; k++) if (inv[A.col[k]] < f) f = inv[A.col[k]];
    s += i - f + 1;
  }
  return s;
}

export function envelopeCholesky(A: CsrMatrix): EnvelopeCholesky {
  const n = A.n;
  const perm = reverseCuthillMcKee(A);
  const B = permuteSymmetric(A, perm);
  const first = new Int32Array(n), start = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) {
    const c = B.col[B.rowPtr[i]];
    first[i] = c < i ? c : i;
    start[i + 1] = start[i] + (i - first[i] + 1);
  }
  const val = new Float64Array(start[n]);
  const diag = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let k = B.rowPtr[i]; k < B.rowPtr[i + 1]; k++) {
      const j = B.col[k];
      if (j > i) break;
      val[start[i] + (j - first[i])] = B.val[k];
      if (j === i) diag[i] = B.val[k];
    }
  }
  const grounded = new Uint8Array(n);
  let nulls = 0;
  for (let i = 0; i < n; i++) {
    const fi = first[i], si = start[i];
    for (let j = fi; j < i; j++) {
      const pj = start[j] - first[j]; // val[pj + c] is L[j][c]
      if (grounded[j]) { val[si + j - fi] = 0; continue; }
      let s = val[si + j - fi];
      const from = fi > first[j] ? fi : first[j];
      for (let c = from; c < j; c++) s -= val[si + c - fi] * val[pj + c];
      val[si + j - fi] = s / val[pj + j];
    }
    let d = val[si + i - fi];
    for (let c = fi; c < i; c++) d -= val[si + c - fi] * val[si + c - fi];
    if (!(d > PIVOT_FLOOR * Math.abs(diag[i]))) {
      if (d < -PIVOT_FLOOR * Math.abs(diag[i]) || !(diag[i] > 0)) throw new Error(`envelopeCholesky: matrix not positive semi-definite (pivot ${d} at row ${i})`);
      grounded[i] = 1; nulls++;
      val[si + i - fi] = 1;
      // the row's own entries no longer matter: its unknown is zero
      for (let c = fi; c < i; c++) val[si + c - fi] = 0;
    } else val[si + i - fi] = Math.sqrt(d);
  }
  return { n, perm, first, start, val, grounded, nulls, work: new Float64Array(n) };
}

/** x = A⁺ b in the sense of the file comment (grounded unknowns zero). x may not alias b. */
export function envelopeSolve(F: EnvelopeCholesky, b: ArrayLike<number>, x: Float64Array): void {
  const { n, perm, first, start, val, grounded, work: y } = F;
  for (let i = 0; i < n; i++) {
    if (grounded[i]) { y[i] = 0; continue; }
    const fi = first[i], si = start[i];
    let s = b[perm[i]];
    for (let c = fi; c < i; c++) s -= val[si + c - fi] * y[c];
    y[i] = s / val[si + i - fi];
  }
  for (let i = n - 1; i >= 0; i--) {
    if (grounded[i]) { y[i] = 0; continue; }
    const fi = first[i], si = start[i];
    const yi = y[i] / val[si + i - fi];
    y[i] = yi;
    for (let c = fi; c < i; c++) y[c] -= val[si + c - fi] * yi;
  }
  for (let i = 0; i < n; i++) x[perm[i]] = y[i];
}
