/**
 * Generated test parts (invented): rectangles with a row of round holes, seeded, with their closed-form
 * area, cut length and pierce count (rectangle minus circles: A = w·h − k·π·d²/4,
 * cut length = 2(w + h) + k·π·d, pierces = k + 1 — common practice, no source).
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { rng } from '../helpers.js';

export interface GeneratedPart { file: string; w: number; h: number; k: number; d: number; area: number; cut: number; pierces: number }

export function generateParts(dir: string, n: number, seed = 1): GeneratedPart[] {
  const rand = rng(seed);
  const out: GeneratedPart[] = [];
  for (let i = 0; i < n; i++) {
    const w = 100 + Math.round(rand() * 400);
    const h = 60 + Math.round(rand() * 200);
    const d = 8 + Math.round(rand() * 12);
    const k = Math.floor(rand() * 4);
    const pitch = w / (k + 1);
    const cutouts = Array.from({ length: k }, (_, j) => ({ circle: { center: [pitch * (j + 1), h / 2], diameter: d } }));
    const file = `p${String(i + 1).padStart(4, '0')}.json`;
    writeFileSync(join(dir, file), JSON.stringify({
      part: `generated part ${i + 1}`, units: 'mm', note: 'invented test data',
      outline: { rectangle: { corner: [0, 0], size: [w, h] } }, cutouts,
    }));
    out.push({ file, w, h, k, d, area: w * h - (k * Math.PI * d * d) / 4, cut: 2 * (w + h) + k * Math.PI * d, pierces: k + 1 });
  }
  return out;
}
