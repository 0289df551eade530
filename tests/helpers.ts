import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { expect } from 'vitest';
import { type MeasureOptions, type SectionResult, measureSection } from '../src/analysis/measure.js';
import { partFromObject } from '../src/read/partJson.js';

/** Measure a part given as a plain part-description object. */
export function measureObj(obj: unknown, opts: MeasureOptions = {}): SectionResult {
  return measureSection(partFromObject(obj), opts);
}

export const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** Seeded PRNG (mulberry32) so random tests are reproducible. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The project root and the built command line (made by `npm test`'s tsc step). */
export const ROOT = join(import.meta.dirname, '..');
export const CLI = join(ROOT, 'dist', 'cli', 'main.js');

/** Run the built `platewise` with arguments and optional standard input; never throws. */
export function runCli(args: string[], input?: string, options: { cwd?: string; timeout?: number } = {}): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: options.cwd ?? ROOT, input, encoding: 'utf8', timeout: options.timeout });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

export const SECTION_KEYS = ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy'] as const;
export type SectionRef = Record<(typeof SECTION_KEYS)[number], number>;

/**
 * Area, centroid and second moments against a closed-form reference: each within 1e-12 of its natural
 * scale (area; part size for the centroid; √(Ix·Iy) for second moments), and each estimate at least the
 * true error. Prints the measured figures under `label`.
 */
export function expectSectionClose(r: SectionResult, ref: SectionRef, size: number, label: string): void {
  const iScale = Math.sqrt(Math.abs(ref.Ix * ref.Iy));
  const scales: SectionRef = { area: ref.area, centroidX: size, centroidY: size, Ix: iScale, Iy: iScale, Ixy: iScale };
  const rows: string[] = [];
  for (const k of SECTION_KEYS) {
    const q = r.quantities[k];
    const err = Math.abs(q.value - ref[k]);
    rows.push(`${k} rel ${(err / scales[k]).toExponential(2)} est ${(q.error / scales[k]).toExponential(2)}`);
    expect(err / scales[k], `${label} ${k}`).toBeLessThanOrEqual(1e-12);
    expect(q.error, `${label} ${k}: estimate ≥ true error`).toBeGreaterThanOrEqual(err);
  }
  console.log(`${label}: ${rows.join('; ')}`);
}
