/**
 * Benchmark cases (invented parts for timing only). Each case gives a platewise part and the same boundary
 * as the chords platewise triangulates, so the peers triangulate exactly what we do.
 */
import { partFromObject } from '../../src/read/partJson.js';
import type { Part } from '../../src/geometry/part.js';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** A W × H panel with an nx × ny grid of round holes of diameter d. */
export function panel(W: number, H: number, nx: number, ny: number, d: number): Part {
  const holes = [];
  for (let i = 0; i < nx; i++) for (let j = 0; j < ny; j++) holes.push({ circle: { center: [(i + 0.5) * W / nx, (j + 0.5) * H / ny], diameter: d } });
  return partFromObject({ part: `panel ${nx * ny} holes`, outline: { rectangle: { corner: [0, 0], size: [W, H] } }, cutouts: holes });
}

/**
 * A straight-edged plate with about n vertices: a 1000 × 1000 square with a grid of k × k small square
 * holes (4 vertices each), k chosen so that 4 + 4k² ≈ n, each hole's edges split into `per` pieces.
 */
export function squareHoles(n: number): Part {
  const k = Math.max(1, Math.round(Math.sqrt((n - 4) / 4)));
  const pitch = 1000 / k, s = pitch * 0.4;
  const holes = [];
  for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) {
    const x = (i + 0.5) * pitch - s / 2, y = (j + 0.5) * pitch - s / 2;
    holes.push({ polygon: [[x, y], [x + s, y], [x + s, y + s], [x, y + s]] });
  }
  return partFromObject({ part: `square holes n=${4 + 4 * k * k}`, outline: { rectangle: { corner: [0, 0], size: [1000, 1000] } }, cutouts: holes });
}

/** The 2000 × 1000 mm panel with 1,250 round holes Ø20 as a part file in `dir` (invented for the benchmark). */
export function writePanel1250(dir: string): string {
  const file = join(dir, 'panel-1250.json');
  const cutouts = [];
  for (let i = 0; i < 50; i++) for (let j = 0; j < 25; j++) cutouts.push({ circle: { center: [(i + 0.5) * 40, (j + 0.5) * 40], diameter: 20 } });
  writeFileSync(file, JSON.stringify({ part: 'panel 1250 holes', units: 'mm', note: 'generated for the benchmark', outline: { rectangle: { corner: [0, 0], size: [2000, 1000] } }, cutouts }));
  return file;
}
