import { TripletBuilder } from '../../src/numeric/sparse.js';

/** 5-point Laplacian on an m × m grid with Dirichlet rows folded in: SPD, an M-matrix. */
export function laplacian(m: number, neumann = false): TripletBuilder {
  const n = m * m, B = new TripletBuilder(n, 5 * n);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) {
    const r = i * m + j;
    let d = neumann ? 0 : 4;
    for (const [di, dj] of [[1, 0], [-1, 0], [0, 1], [0, -1]]) {
      const a = i + di, b = j + dj;
      if (a < 0 || b < 0 || a >= m || b >= m) continue;
      B.add(r, a * m + b, -1);
      if (neumann) d++;
    }
    B.add(r, r, d);
  }
  return B;
}
