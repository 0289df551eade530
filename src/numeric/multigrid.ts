/**
 * Multigrid V-cycle used as the preconditioner of conjugate gradients (src/numeric/sparseSolve.ts) for a
 * hierarchy of nested discretisations: level 0 coarsest, level L finest, prolongation P_l from level l − 1
 * to level l (CSR, rows = unknowns of level l), restriction its transpose. Knows nothing of meshes.
 *
 * One cycle on level l > 0 (from memory; the textbook V(ν, ν) cycle, e.g. Briggs, Henson & McCormick,
 * "A Multigrid Tutorial"): ν forward Gauss–Seidel sweeps from z = 0, the residual restricted by P_lᵀ, the
 * cycle on level l − 1, its correction prolongated and added, ν backward Gauss–Seidel sweeps. Level 0 is
 * solved exactly by an envelope Cholesky factorisation (src/numeric/envelope.ts). Forward sweeps before and
 * backward sweeps after make the cycle a symmetric operator, and positive definite on the range of a
 * symmetric positive (semi-)definite matrix, as conjugate gradients needs; the coarse operators are the
 * levels' own discretisations, which only changes how fast CG converges, never what it converges to.
 */
import { type EnvelopeCholesky, envelopeCholesky, envelopeSolve } from './envelope.js';
import type { CsrMatrix } from './sparse.js';
import { csrMultiply } from './sparse.js';

export interface Preconditioner {
  /** z = M⁻¹ r (z may not alias r). */
  apply(r: Float64Array, z: Float64Array): void;
}

interface Level { A: CsrMatrix; diag: Int32Array; P: CsrMatrix | null; r: Float64Array; z: Float64Array; t: Float64Array }

function diagonalIndex(A: CsrMatrix): Int32Array {
  const d = new Int32Array(A.n).fill(-1);
  for (let i = 0; i < A.n; i++) {
    for (let k = A.rowPtr[i]; k < A.rowPtr[i + 1]; k++) if (A.col[k] === i) { d[i] = k; break; }
    if (d[i] < 0 || !(A.val[d[i]] > 0)) throw new Error(`multigrid: row ${i} has no positive diagonal entry`);
  }
  return d;
}

/** y = Pᵀ x (P has rows = length of x). */
export function csrMultiplyTranspose(P: CsrMatrix, x: ArrayLike<number>, y: Float64Array): void {
  y.fill(0);
  for (let i = 0; i < P.n; i++) {
    const xi = x[i];
    if (xi === 0) continue;
    for (let k = P.rowPtr[i]; k < P.rowPtr[i + 1]; k++) y[P.col[k]] += P.val[k] * xi;
  }
}

/** y += P x. */
function addProlongated(P: CsrMatrix, x: Float64Array, y: Float64Array): void {
  for (let i = 0; i < P.n; i++) {
    let s = 0;
    for (let k = P.rowPtr[i]; k < P.rowPtr[i + 1]; k++) s += P.val[k] * x[P.col[k]];
    y[i] += s;
  }
}

export class MultigridCycle implements Preconditioner {
  private readonly levels: Level[];
  private readonly coarse: EnvelopeCholesky;

  /**
   * matrices[0] coarsest … matrices[L] finest; prolongations[l − 1] maps level l − 1 to level l.
   * `sweeps` Gauss–Seidel sweeps before and after each coarse correction.
   */
  constructor(matrices: readonly CsrMatrix[], prolongations: readonly CsrMatrix[], readonly sweeps = 2) {
    if (prolongations.length !== matrices.length - 1) throw new Error('multigrid: one prolongation per level above the coarsest');
    this.levels = matrices.map((A, l) => {
      const P = l === 0 ? null : prolongations[l - 1];
      if (P && (P.n !== A.n)) throw new Error(`multigrid: prolongation ${l} has ${P.n} rows for ${A.n} unknowns`);
      return { A, diag: diagonalIndex(A), P, r: new Float64Array(A.n), z: new Float64Array(A.n), t: new Float64Array(A.n) };
    });
    this.coarse = envelopeCholesky(matrices[0]);
  }

  apply(r: Float64Array, z: Float64Array): void {
    this.cycle(this.levels.length - 1, r, z);
  }

  /** Preconditioner of level l as an object (for conjugate gradients on that level). */
  at(l: number): Preconditioner {
    return { apply: (r, z) => this.cycle(l, r, z) };
  }

  /** y = P_l x: a level-(l − 1) vector taken to level l. */
  prolongate(l: number, x: Float64Array, y: Float64Array): void {
    y.fill(0);
    addProlongated(this.levels[l].P!, x, y);
  }

  private cycle(l: number, r: Float64Array, z: Float64Array): void {
    if (l === 0) { envelopeSolve(this.coarse, r, z); return; }
    const L = this.levels[l], below = this.levels[l - 1];
    z.fill(0);
    for (let s = 0; s < this.sweeps; s++) sweep(L, r, z, true);
    csrMultiply(L.A, z, L.t);
    for (let i = 0; i < L.t.length; i++) L.t[i] = r[i] - L.t[i];
    csrMultiplyTranspose(L.P!, L.t, below.r);
    this.cycle(l - 1, below.r, below.z);
    addProlongated(L.P!, below.z, z);
    for (let s = 0; s < this.sweeps; s++) sweep(L, r, z, false);
  }
}

/** One Gauss–Seidel sweep on A z = r, in place, forward or backward. */
function sweep(L: Level, r: Float64Array, z: Float64Array, forward: boolean): void {
  const { rowPtr, col, val } = L.A, d = L.diag, n = L.A.n;
  for (let m = 0; m < n; m++) {
    const i = forward ? m : n - 1 - m;
    let s = r[i];
    const e = rowPtr[i + 1];
    for (let k = rowPtr[i]; k < e; k++) s -= val[k] * z[col[k]];
    const di = d[i];
    z[i] += s / val[di];
  }
}
