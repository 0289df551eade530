/**
 * Triangle quadrature rules expanded from Dunavant's orbits into flat arrays.
 * A rule's points are barycentric (l0, l1, l2) with l0 = 1 − l1 − l2; weights sum to 1 (fractions of area).
 */
import { InputError } from '../base/errors.js';
import { DUNAVANT_RULES, NEGATIVE_WEIGHT, POINTS_OUTSIDE } from './dunavant1985.js';

export interface TriangleRule {
  degree: number;
  n: number;
  l1: Float64Array;
  l2: Float64Array;
  w: Float64Array;
  negativeWeight: boolean;
  pointsOutside: boolean;
}

/** Degrees whose rules have only positive weights and points inside the triangle. */
export const SAFE_DEGREES: readonly number[] = [1, 2, 4, 5, 6, 8, 9, 10, 12, 13, 14, 17, 19];
export const MAX_DEGREE = 20;
export const DEFAULT_DEGREE = 10;

const cache = new Map<number, TriangleRule>();

export function getRule(degree: number): TriangleRule {
  if (!Number.isInteger(degree) || degree < 1 || degree > MAX_DEGREE) {
    throw new InputError('degree', `expected a whole number from 1 to ${MAX_DEGREE}, got ${degree}`);
  }
  const hit = cache.get(degree);
  if (hit) return hit;
  const pub = DUNAVANT_RULES[degree];
  const bary: [number, number, number][] = [];
  const ws: number[] = [];
  for (const o of pub.orbits) {
    if (o.orbit === 'centroid') {
      bary.push([1 / 3, 1 / 3, 1 / 3]); ws.push(o.weight);
    } else if (o.orbit === 'three') {
      const a = o.a!, c = 1 - 2 * a;
      for (const p of [[a, a, c], [a, c, a], [c, a, a]] as [number, number, number][]) { bary.push(p); ws.push(o.weight); }
    } else {
      const a = o.a!, b = o.b!, c = 1 - a - b;
      for (const p of [[a, b, c], [a, c, b], [b, a, c], [b, c, a], [c, a, b], [c, b, a]] as [number, number, number][]) { bary.push(p); ws.push(o.weight); }
    }
  }
  const n = bary.length;
  const rule: TriangleRule = {
    degree,
    n,
    l1: Float64Array.from(bary, (p) => p[1]),
    l2: Float64Array.from(bary, (p) => p[2]),
    w: Float64Array.from(ws),
    negativeWeight: NEGATIVE_WEIGHT.includes(degree),
    pointsOutside: POINTS_OUTSIDE.includes(degree),
  };
  cache.set(degree, rule);
  return rule;
}

/** The published point count of each degree (Dunavant 1985, table of rules). */
export function publishedPoints(degree: number): number {
  return DUNAVANT_RULES[degree].points;
}

/** The lowest safe degree ≥ d (for callers that need exactness to degree d). */
export function safeDegreeAtLeast(d: number): number {
  for (const s of SAFE_DEGREES) if (s >= d) return s;
  return SAFE_DEGREES[SAFE_DEGREES.length - 1];
}

export interface RuleInfo { degree: number; points: number; negativeWeight: boolean; pointsOutside: boolean; safe: boolean }

export function listRules(): RuleInfo[] {
  const out: RuleInfo[] = [];
  for (let d = 1; d <= MAX_DEGREE; d++) {
    const r = getRule(d);
    out.push({ degree: d, points: r.n, negativeWeight: r.negativeWeight, pointsOutside: r.pointsOutside, safe: SAFE_DEGREES.includes(d) });
  }
  return out;
}
