/**
 * Net section along a line against shapely (LineString ∩ Polygon length) on invented random plates with
 * rounded corners and circular holes: tests/reference/netSection/generate.py (python3-shapely) wrote
 * refs.json with each reference length and the allowance for shapely's polygonised circles (N = 4096
 * vertices per turn). Ours must agree within our own bound plus that allowance.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { preparePart } from '../../src/analysis/measure.js';
import { netSection } from '../../src/geometry/netSection.js';
import type { Segment } from '../../src/geometry/segments.js';

interface Case { plate: number; outer: Segment[]; holes: Segment[][]; points: [number, number][]; gross: number; net: number; allowance: number }
const refs = JSON.parse(readFileSync(join(import.meta.dirname, 'netSection', 'refs.json'), 'utf8')) as { source: string; cases: Case[] };

describe(`net section against ${refs.source}`, () => {
  it(`agrees on ${refs.cases.length} lines and chains within our bound plus the polygonisation allowance`, () => {
    let worst = 0, worstAllow = 0, worstBound = 0;
    for (const c of refs.cases) {
      const part = preparePart({ name: `plate ${c.plate}`, units: 'mm', regions: [{ outer: { segments: c.outer }, holes: c.holes.map((segments) => ({ segments })) }] });
      const r = netSection(part, { points: c.points, where: `case of plate ${c.plate}` });
      const dg = Math.abs(r.gross - c.gross), dn = Math.abs(r.net - c.net);
      expect(dg, `plate ${c.plate} gross`).toBeLessThanOrEqual(r.grossError + c.allowance);
      expect(dn, `plate ${c.plate} net`).toBeLessThanOrEqual(r.netError + c.allowance);
      worst = Math.max(worst, dg, dn);
      worstAllow = Math.max(worstAllow, c.allowance);
      worstBound = Math.max(worstBound, r.netError, r.grossError);
    }
    console.log(`largest difference ${worst.toExponential(2)}, largest allowance ${worstAllow.toExponential(2)}, largest bound of ours ${worstBound.toExponential(2)}`);
    // the allowance is small enough for the comparison to mean something
    expect(worstAllow).toBeLessThan(1e-2);
  });
});
