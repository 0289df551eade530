/**
 * All pairs of overlapping axis-aligned boxes, through a uniform grid: near O(n + pairs) for the
 * box sizes of real parts (many small holes plus a few long outline edges), where a one-dimensional sweep
 * degrades to O(n^1.5) on hole grids.
 */

/**
 * Calls fn(i, j), i < j, once for each pair of boxes that overlap (touching counts).
 * `boxes` holds xMin, yMin, xMax, yMax per box.
 */
export function overlappingPairs(boxes: Float64Array, fn: (i: number, j: number) => void): void {
  const n = boxes.length / 4;
  if (n < 2) return;
  let xMin = Infinity, yMin = Infinity, xMax = -Infinity, yMax = -Infinity, sumW = 0, sumH = 0;
  for (let i = 0; i < n; i++) {
    xMin = Math.min(xMin, boxes[4 * i]); yMin = Math.min(yMin, boxes[4 * i + 1]);
    xMax = Math.max(xMax, boxes[4 * i + 2]); yMax = Math.max(yMax, boxes[4 * i + 3]);
    sumW += boxes[4 * i + 2] - boxes[4 * i]; sumH += boxes[4 * i + 3] - boxes[4 * i + 1];
  }
  const W = Math.max(xMax - xMin, 1e-300), H = Math.max(yMax - yMin, 1e-300);
  // cell about twice the median-ish (mean, clipped) box, at most ~4n cells
  let cell = Math.max(2 * Math.max(sumW, sumH) / n, Math.sqrt((W * H) / (4 * n)), Math.max(W, H) / 4096);
  const nx = Math.min(4096, Math.floor(W / cell) + 1), ny = Math.min(4096, Math.floor(H / cell) + 1);
  cell = Math.max(W / nx, H / ny) * (1 + 1e-12);
  const cx = (x: number) => Math.min(nx - 1, Math.max(0, Math.floor((x - xMin) / cell)));
  const cy = (y: number) => Math.min(ny - 1, Math.max(0, Math.floor((y - yMin) / cell)));
  // counting sort of (cell, box) entries
  const count = new Int32Array(nx * ny + 1);
  for (let i = 0; i < n; i++) {
    const i0 = cx(boxes[4 * i]), i1 = cx(boxes[4 * i + 2]), j0 = cy(boxes[4 * i + 1]), j1 = cy(boxes[4 * i + 3]);
    for (let a = i0; a <= i1; a++) for (let b = j0; b <= j1; b++) count[a * ny + b + 1]++;
  }
  for (let k = 1; k < count.length; k++) count[k] += count[k - 1];
  const items = new Int32Array(count[count.length - 1]);
  const fill = count.slice();
  for (let i = 0; i < n; i++) {
    const i0 = cx(boxes[4 * i]), i1 = cx(boxes[4 * i + 2]), j0 = cy(boxes[4 * i + 1]), j1 = cy(boxes[4 * i + 3]);
    for (let a = i0; a <= i1; a++) for (let b = j0; b <= j1; b++) items[fill[a * ny + b]++] = i;
  }
  for (let c = 0; c < nx * ny; c++) {
    const s = count[c], e = count[c + 1];
    const ca = Math.floor(c / ny), cb = c - ca * ny;
    for (let p = s; p < e; p++) {
      const i = items[p];
      for (let q = p + 1; q < e; q++) {
        const j = items[q];
        // overlap test
        const ox0 = Math.max(boxes[4 * i], boxes[4 * j]), oy0 = Math.max(boxes[4 * i + 1], boxes[4 * j + 1]);
        if (ox0 > Math.min(boxes[4 * i + 2], boxes[4 * j + 2]) || oy0 > Math.min(boxes[4 * i + 3], boxes[4 * j + 3])) continue;
        // report each pair once: in the cell holding the overlap's lower-left corner
        if (cx(ox0) !== ca || cy(oy0) !== cb) continue;
        if (i < j) fn(i, j); else fn(j, i);
      }
    }
  }
}
