import { describe, expect, it } from 'vitest';
import { TripletBuilder, csrFind, csrMultiply, fixUnknown } from '../../src/numeric/sparse.js';
import { applyIncompleteCholesky, incompleteCholesky, solveSpd } from '../../src/numeric/sparseSolve.js';
import { rng } from '../helpers.js';
import { laplacian } from './laplacian.js';

const norm = (a: Float64Array) => Math.sqrt(a.reduce((s, v) => s + v * v, 0));

describe('CSR assembly', () => {
  it('sums duplicates and sorts columns', () => {
    const B = new TripletBuilder(3, 1);
    B.add(2, 0, 1); B.add(0, 2, 1); B.add(1, 1, 2); B.add(0, 0, 1); B.add(0, 0, 3); B.add(2, 2, 5); B.add(0, 2, 1); B.add(2, 0, 1);
    const A = B.toCsr();
    expect(Array.from(A.rowPtr)).toEqual([0, 2, 3, 5]);
    expect(Array.from(A.col)).toEqual([0, 2, 1, 0, 2]);
    expect(Array.from(A.val)).toEqual([4, 2, 2, 2, 5]);
    expect(csrFind(A, 2, 2)).toBe(4);
    expect(csrFind(A, 1, 0)).toBe(-1);
  });
});

describe('IC(0)', () => {
  it('is exact (L Lᵀ = A) for a tridiagonal matrix, where IC(0) has no dropped fill', () => {
    const n = 50, B = new TripletBuilder(n);
    for (let i = 0; i < n; i++) { B.add(i, i, 2 + i / n); if (i > 0) { B.add(i, i - 1, -1); B.add(i - 1, i, -1); } }
    const A = B.toCsr();
    const F = incompleteCholesky(A);
    const g = rng(3), x = Float64Array.from({ length: n }, () => g() - 0.5);
    const b = new Float64Array(n); csrMultiply(A, x, b);
    const z = new Float64Array(n); applyIncompleteCholesky(F, b, z);
    for (let i = 0; i < n; i++) expect(Math.abs(z[i] - x[i])).toBeLessThan(1e-12);
    expect(F.shift).toBe(0);
  });
});

describe('preconditioned conjugate gradients', () => {
  it('solves SPD systems with known solutions (Laplacian grids of 10² … 100² unknowns)', () => {
    for (const m of [10, 40, 100]) {
      const A = laplacian(m).toCsr();
      const g = rng(m), x = Float64Array.from({ length: m * m }, () => g() * 2 - 1);
      const b = new Float64Array(m * m); csrMultiply(A, x, b);
      const s = solveSpd(A, b, { tol: 1e-12 });
      expect(s.converged).toBe(true);
      let err = 0;
      for (let i = 0; i < m * m; i++) err = Math.max(err, Math.abs(s.x[i] - x[i]));
      // κ(A) ≈ (2m/π)²: the solution error is at most κ × the relative residual (times ‖x‖∞ ≤ 1)
      expect(err).toBeLessThan(1e-12 * (2 * m / Math.PI) ** 2 * 10);
      expect(s.iterations).toBeLessThan(m * m);
      console.log(`Laplacian ${m}×${m}: ${s.iterations} iterations, residual ${s.residual.toExponential(2)}, max error ${err.toExponential(2)}`);
    }
  });

  it('solves a random SPD matrix that is not an M-matrix (positive off-diagonals), shifting IC(0) if needed', () => {
    const n = 200, g = rng(11), B = new TripletBuilder(n);
    // A = Σ over random pairs of vvᵀ with v = e_i ± e_j scaled, plus a small diagonal: SPD
    for (let e = 0; e < 800; e++) {
      const i = Math.floor(g() * n), j = Math.floor(g() * n);
      if (i === j) continue;
      const s = g() < 0.5 ? 1 : -1, w = 0.1 + g();
      B.add(i, i, w); B.add(j, j, w); B.add(i, j, s * w); B.add(j, i, s * w);
    }
    for (let i = 0; i < n; i++) B.add(i, i, 1e-2);
    const A = B.toCsr();
    const x = Float64Array.from({ length: n }, () => g() - 0.5);
    const b = new Float64Array(n); csrMultiply(A, x, b);
    const s = solveSpd(A, b, { tol: 1e-13 });
    expect(s.converged).toBe(true);
    const r = new Float64Array(n); csrMultiply(A, s.x, r);
    for (let i = 0; i < n; i++) r[i] -= b[i];
    expect(norm(r) / norm(b)).toBeLessThanOrEqual(1e-13);
  });

  it('solves a Neumann (singular) system made definite by fixing one unknown', () => {
    const m = 30, n = m * m;
    const A = laplacian(m, true).toCsr();
    // a solution with x[0] = 0 and a right-hand side consistent with it
    const g = rng(5), x = Float64Array.from({ length: n }, (_, i) => (i === 0 ? 0 : g() - 0.5));
    const b = new Float64Array(n); csrMultiply(A, x, b);
    let sum = 0; for (const v of b) sum += v;
    expect(Math.abs(sum)).toBeLessThan(1e-12); // compatibility: the constant is in the null space
    fixUnknown(A, b, 0, 0);
    const s = solveSpd(A, b, { tol: 1e-13 });
    expect(s.converged).toBe(true);
    let err = 0;
    for (let i = 0; i < n; i++) err = Math.max(err, Math.abs(s.x[i] - x[i]));
    expect(err).toBeLessThan(1e-8);
  });

  it('reports non-convergence as a status when the iteration cap is hit', () => {
    const A = laplacian(30).toCsr();
    const b = new Float64Array(900).fill(1);
    const s = solveSpd(A, b, { tol: 1e-14, maxIterations: 2 });
    expect(s.converged).toBe(false);
    expect(s.iterations).toBe(2);
  });
});
