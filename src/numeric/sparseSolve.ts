/**
 * Conjugate gradients preconditioned with an incomplete Cholesky factorisation of zero fill, IC(0), for
 * symmetric positive definite CSR matrices (src/numeric/sparse.ts).
 *
 * IC(0): L has the sparsity of A's lower triangle and L Lᵀ matches A on that pattern. For matrices that
 * are not M-matrices (quadratic-element stiffness) a pivot can go non-positive; the factorisation is then
 * repeated on A + α·diag(A) with α doubled from 1e-3 (Manteuffel's shift, from memory), at most 30 times.
 * The preconditioner only changes the speed of convergence, never the solution CG converges to.
 *
 * Convergence test: ‖b − A x‖₂ ≤ tol·‖b‖₂ on the recursively updated residual, then confirmed on the true
 * residual (recomputed); the result reports the true relative residual and whether it met `tol`.
 */
import type { CsrMatrix } from './sparse.js';
import { csrMultiply } from './sparse.js';
import type { Preconditioner } from './multigrid.js';
import { permuteSymmetric, reverseCuthillMcKee } from './sparseOrder.js';

export interface IncompleteCholesky {
  n: number;
  rowPtr: Int32Array;
  col: Int32Array;
  /** Lower factor, row-wise, diagonal last in each row. */
  val: Float64Array;
  /** Diagonal shift α that made every pivot positive (0 when none was needed). */
  shift: number;
}

/** IC(0) of A (A's lower triangle including the diagonal must be present; columns sorted). */
export function incompleteCholesky(A: CsrMatrix): IncompleteCholesky {
  const n = A.n;
  // lower pattern
  const rowPtr = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) {
    let c = 0;
    for (let k = A.rowPtr[i]; k < A.rowPtr[i + 1]; k++) if (A.col[k] <= i) c++;
    rowPtr[i + 1] = rowPtr[i] + c;
  }
  const col = new Int32Array(rowPtr[n]);
  const orig = new Float64Array(rowPtr[n]);
  for (let i = 0; i < n; i++) {
    let q = rowPtr[i];
    let hasDiag = false;
    for (let k = A.rowPtr[i]; k < A.rowPtr[i + 1]; k++) {
      if (A.col[k] > i) break;
      col[q] = A.col[k]; orig[q] = A.val[k]; q++;
      if (A.col[k] === i) hasDiag = true;
    }
    if (!hasDiag) throw new Error(`incompleteCholesky: row ${i} has no diagonal entry`);
  }
  const val = new Float64Array(rowPtr[n]);
  for (let attempt = 0, shift = 0; attempt <= 30; attempt++, shift = shift === 0 ? 1e-3 : 2 * shift) {
    if (factor(n, rowPtr, col, orig, val, shift)) return { n, rowPtr, col, val, shift };
  }
  throw new Error('incompleteCholesky: no positive pivots even with a diagonal shift (matrix not positive definite?)');
}

function factor(n: number, rowPtr: Int32Array, col: Int32Array, orig: Float64Array, val: Float64Array, shift: number): boolean {
  for (let i = 0; i < n; i++) {
    const a = rowPtr[i], e = rowPtr[i + 1] - 1; // e: diagonal
    for (let k = a; k < e; k++) {
      const j = col[k];
      // s = a_ij − Σ_{m<j} L_im L_jm, merging row i (entries before k) with row j (before its diagonal)
      let s = orig[k];
      let p = a, q = rowPtr[j];
      const qe = rowPtr[j + 1] - 1;
      while (p < k && q < qe) {
        const cp = col[p], cq = col[q];
        if (cp === cq) { s -= val[p] * val[q]; p++; q++; } else if (cp < cq) p++; else q++;
      }
      val[k] = s / val[qe];
    }
    let d = orig[e] * (1 + shift);
    for (let k = a; k < e; k++) d -= val[k] * val[k];
    if (!(d > 0)) return false;
    val[e] = Math.sqrt(d);
  }
  return true;
}

/** z = (L Lᵀ)⁻¹ r. */
export function applyIncompleteCholesky(F: IncompleteCholesky, r: Float64Array, z: Float64Array): void {
  const { n, rowPtr, col, val } = F;
  for (let i = 0; i < n; i++) {
    let s = r[i];
    const e = rowPtr[i + 1] - 1;
    for (let k = rowPtr[i]; k < e; k++) s -= val[k] * z[col[k]];
    z[i] = s / val[e];
  }
  for (let i = n - 1; i >= 0; i--) {
    const e = rowPtr[i + 1] - 1;
    const zi = z[i] / val[e];
    z[i] = zi;
    for (let k = rowPtr[i]; k < e; k++) z[col[k]] -= val[k] * zi;
  }
}

export interface SolveOptions {
  /** Relative residual target ‖b − Ax‖/‖b‖ (default 1e-13). */
  tol?: number;
  /** Iteration cap (default 10 n + 100). */
  maxIterations?: number;
  /** Starting guess (default zero). */
  x0?: Float64Array;
  /** Renumber by reverse Cuthill–McKee before factorising (default true). */
  reorder?: boolean;
}

export interface SolveResult {
  x: Float64Array;
  iterations: number;
  /** True relative residual ‖b − A x‖₂ / ‖b‖₂ of the returned x. */
  residual: number;
  converged: boolean;
  /** IC(0) diagonal shift used. */
  shift: number;
}

/** Solve A x = b, A symmetric positive definite, by IC(0)-preconditioned conjugate gradients. */
export function solveSpd(A: CsrMatrix, b: Float64Array, options: SolveOptions = {}): SolveResult {
  if (options.reorder === false) return solvePcg(A, b, options);
  const perm = reverseCuthillMcKee(A);
  const Ap = permuteSymmetric(A, perm);
  const bp = new Float64Array(A.n);
  for (let i = 0; i < A.n; i++) bp[i] = b[perm[i]];
  let x0: Float64Array | undefined;
  if (options.x0) { x0 = new Float64Array(A.n); for (let i = 0; i < A.n; i++) x0[i] = options.x0[perm[i]]; }
  const r = solvePcg(Ap, bp, { ...options, x0 });
  const x = new Float64Array(A.n);
  for (let i = 0; i < A.n; i++) x[perm[i]] = r.x[i];
  return { ...r, x };
}

function solvePcg(A: CsrMatrix, b: Float64Array, options: SolveOptions): SolveResult {
  const F = incompleteCholesky(A);
  const r = conjugateGradients(A, b, { apply: (res, z) => applyIncompleteCholesky(F, res, z) }, options);
  return { ...r, shift: F.shift };
}

/**
 * Conjugate gradients on A x = b with any symmetric positive definite preconditioner (IC(0) above, or a
 * multigrid cycle: src/numeric/multigrid.ts). A may be singular (a Neumann problem) if b is orthogonal to
 * its null space. `shift` of the result is 0 (the preconditioner's business).
 */
export function conjugateGradients(A: CsrMatrix, b: Float64Array, M: Preconditioner, options: SolveOptions = {}): SolveResult {
  const n = A.n;
  const tol = options.tol ?? 1e-13;
  const maxIt = options.maxIterations ?? 10 * n + 100;
  const x = options.x0 ? Float64Array.from(options.x0) : new Float64Array(n);
  const r = new Float64Array(n), z = new Float64Array(n), p = new Float64Array(n), q = new Float64Array(n);
  const bn = Math.sqrt(dot(b, b));
  if (bn === 0) return { x: new Float64Array(n), iterations: 0, residual: 0, converged: true, shift: 0 };
  const trueResidual = (): number => {
    csrMultiply(A, x, q);
    for (let i = 0; i < n; i++) r[i] = b[i] - q[i];
    return Math.sqrt(dot(r, r)) / bn;
  };
  let res = trueResidual();
  let it = 0;
  // restarts from the true residual: stop when one no longer halves it (round-off floor reached)
  for (let restart = 0, before = Infinity; restart < 3 && res > tol && it < maxIt && res < before / 2; restart++) {
    before = res;
    M.apply(r, z);
    p.set(z);
    let rz = dot(r, z);
    while (it < maxIt) {
      csrMultiply(A, p, q);
      const pq = dot(p, q);
      if (!(pq > 0)) break;
      const alpha = rz / pq;
      for (let i = 0; i < n; i++) { x[i] += alpha * p[i]; r[i] -= alpha * q[i]; }
      it++;
      if (Math.sqrt(dot(r, r)) <= tol * bn) break;
      M.apply(r, z);
      const rz1 = dot(r, z);
      const beta = rz1 / rz;
      rz = rz1;
      for (let i = 0; i < n; i++) p[i] = z[i] + beta * p[i];
    }
    res = trueResidual();
  }
  return { x, iterations: it, residual: res, converged: res <= tol, shift: 0 };
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}
