/**
 * Envelope Cholesky and the multigrid cycle (src/numeric/envelope.ts, src/numeric/multigrid.ts), on
 * matrices whose solutions are known by construction (x chosen, b = A x).
 */
import { describe, expect, it } from 'vitest';
import { envelopeCholesky, envelopeSize, envelopeSolve } from '../../src/numeric/envelope.js';
import { MultigridCycle } from '../../src/numeric/multigrid.js';
import { type CsrMatrix, TripletBuilder, csrMultiply } from '../../src/numeric/sparse.js';
import { conjugateGradients, solveSpd } from '../../src/numeric/sparseSolve.js';
import { rng } from '../helpers.js';
import { laplacian as laplacianTriplets } from './laplacian.js';

const laplacian = (m: number, neumann = false): CsrMatrix => laplacianTriplets(m, neumann).toCsr();

/** Bilinear interpolation from an (m + 1)-point grid to a (2m + 1)-point grid of the same square (interior
 * nodes of a Dirichlet problem: mc = m − 1 coarse, 2m − 1 fine unknowns per side). */
function interpolation(mc: number): CsrMatrix {
  const mf = 2 * mc + 1, B = new TripletBuilder(mf * mf);
  const w1 = (i: number): [number, number][] => (i % 2 === 1 ? [[(i - 1) / 2, 1]] : [[i / 2 - 1, 0.5], [i / 2, 0.5]]);
  for (let i = 0; i < mf; i++) for (let j = 0; j < mf; j++) {
    for (const [a, wa] of w1(i)) for (const [b, wb] of w1(j)) {
      if (a < 0 || b < 0 || a >= mc || b >= mc) continue;
      B.add(i * mf + j, a * mc + b, wa * wb);
    }
  }
  return B.toCsr();
}

const maxErr = (a: Float64Array, b: Float64Array) => a.reduce((m, v, i) => Math.max(m, Math.abs(v - b[i])), 0);

describe('envelope Cholesky', () => {
  it('solves a definite Laplacian exactly (to rounding) and reports its envelope size', () => {
    const A = laplacian(30), n = A.n;
    const g = rng(5), x = Float64Array.from({ length: n }, () => g() - 0.5);
    const b = new Float64Array(n); csrMultiply(A, x, b);
    const F = envelopeCholesky(A), y = new Float64Array(n);
    envelopeSolve(F, b, y);
    expect(maxErr(x, y)).toBeLessThan(1e-11);
    expect(F.nulls).toBe(0);
    // RCM on a 30 × 30 grid: bandwidth about 30, so roughly n·30 entries, far below the dense n²/2
    expect(envelopeSize(A)).toBeLessThan(n * 40);
    expect(F.val.length).toBe(envelopeSize(A));
  });

  it('grounds the one null direction of a Neumann Laplacian and solves a consistent system', () => {
    const A = laplacian(12, true), n = A.n;
    const g = rng(9), x = Float64Array.from({ length: n }, () => g() - 0.5);
    const b = new Float64Array(n); csrMultiply(A, x, b);
    const F = envelopeCholesky(A), y = new Float64Array(n);
    envelopeSolve(F, b, y);
    expect(F.nulls).toBe(1);
    // the solution is x up to a constant
    const shift = y[0] - x[0];
    for (let i = 0; i < n; i++) expect(Math.abs(y[i] - x[i] - shift)).toBeLessThan(1e-10);
  });

  it('refuses an indefinite matrix with a clear message', () => {
    const B = new TripletBuilder(2); B.add(0, 0, 1); B.add(1, 1, 1); B.add(0, 1, 2); B.add(1, 0, 2);
    expect(() => envelopeCholesky(B.toCsr())).toThrow(/not positive semi-definite/);
  });
});

describe('multigrid-preconditioned conjugate gradients', () => {
  it('solves a Laplacian hierarchy (7² … 127² unknowns) to 1e-12 in a number of iterations that does not grow with the grid, unlike IC(0)', () => {
    const mats: CsrMatrix[] = [], P: CsrMatrix[] = [];
    let mc = 7;
    mats.push(laplacian(mc));
    for (let l = 0; l < 4; l++) { P.push(interpolation(mc)); mc = 2 * mc + 1; mats.push(laplacian(mc)); }
    const mg = new MultigridCycle(mats, P);
    const its: number[] = [];
    for (let l = 1; l < mats.length; l++) {
      const A = mats[l], n = A.n;
      const g = rng(l), x = Float64Array.from({ length: n }, () => g() - 0.5);
      const b = new Float64Array(n); csrMultiply(A, x, b);
      const s = conjugateGradients(A, b, mg.at(l), { tol: 1e-12 });
      expect(s.converged).toBe(true);
      expect(s.residual).toBeLessThanOrEqual(1e-12);
      // a residual of 1e-12 on a matrix of condition ≈ (2m/π)² bounds the error by about 1e-12·cond
      expect(maxErr(x, s.x)).toBeLessThan(1e-12 * mc * mc);
      its.push(s.iterations);
    }
    const ic = solveSpd(mats[mats.length - 1], (() => { const b = new Float64Array(mats[4].n); csrMultiply(mats[4], new Float64Array(mats[4].n).fill(1), b); return b; })(), { tol: 1e-12 });
    // random right-hand sides: iterations stay flat with multigrid (within 3) while IC(0) needs many more
    expect(Math.max(...its) - Math.min(...its)).toBeLessThanOrEqual(3);
    expect(its[its.length - 1] * 3).toBeLessThan(ic.iterations);
  });

  it('rejects a prolongation whose size does not match its level', () => {
    expect(() => new MultigridCycle([laplacian(3), laplacian(5)], [interpolation(3)])).toThrow(/prolongation/);
  });
});
