import { type MeasureOptions, type SectionResult, measureSection } from '../src/accuracy/measure.js';
import { partFromObject } from '../src/io/partJson.js';

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
