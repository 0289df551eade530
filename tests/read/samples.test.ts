import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { readSvg } from '../../src/read/svg.js';
import { readGeoJson } from '../../src/read/geojson.js';
import { readWkt } from '../../src/read/wkt.js';
import { detectFormat } from '../../src/read/detect.js';
import { loopSignedArea, type Part } from '../../src/geometry/part.js';
import { segmentEnd, segmentStart } from '../../src/geometry/segments.js';

// The sample files are invented demo data; these checks only confirm they read as intended.
const read = (name: string) => readFileSync(fileURLToPath(new URL(`../../samples/${name}`, import.meta.url)), 'utf8');
const partArea = (p: Part) => p.regions.reduce((s, r) => s + loopSignedArea(r.outer) + r.holes.reduce((t, h) => t + loopSignedArea(h), 0), 0);

describe('samples', () => {
  it('bracket.svg: one part with five cut-outs, every curved kind present', () => {
    const text = read('bracket.svg');
    expect(detectFormat('bracket.svg', text)).toBe('svg');
    const p = readSvg(text, { fileLabel: 'bracket' });
    expect(p).toHaveLength(1);
    expect(p[0].name).toBe('bracket');
    expect(p[0].regions[0].holes).toHaveLength(5);
    const kinds = new Set([p[0].regions[0].outer, ...p[0].regions[0].holes].flatMap((l) => l.segments.map((s) => s.kind)));
    expect([...kinds].sort()).toEqual(['arc', 'cubic', 'ellipticalArc', 'line']);
    // the rotated ellipse keeps its area π·18·10 (1 user unit = 1 mm here)
    const ell = p[0].regions[0].holes.find((h) => h.where === 'svg ellipse#lightening')!;
    expect(Math.abs(Math.abs(loopSignedArea(ell)) - Math.PI * 180)).toBeLessThan(1e-11);
    expect(partArea(p[0])).toBeGreaterThan(0);
    // every loop is a closed chain: each segment starts where the previous one ends
    for (const loop of [p[0].regions[0].outer, ...p[0].regions[0].holes]) {
      loop.segments.forEach((s, k) => {
        const a = segmentEnd(s), b = segmentStart(loop.segments[(k + 1) % loop.segments.length]);
        expect(Math.hypot(a[0] - b[0], a[1] - b[1])).toBeLessThan(1e-12);
      });
    }
  });
  it('gusset.geojson and baseplate.wkt', () => {
    const g = readGeoJson(read('gusset.geojson'));
    // outline by the shoelace formula, by hand: (3000 + 39775 + 3000) / 2 = 22887.5; two 22 × 22 holes
    expect(g[0].name).toBe('gusset');
    expect(g[0].regions[0].holes).toHaveLength(2);
    const outline = 22887.5;
    expect(partArea(g[0])).toBeCloseTo(outline - 2 * 22 * 22, 9);
    const w = readWkt(read('baseplate.wkt'), { fileLabel: 'baseplate' });
    expect(partArea(w[0])).toBeCloseTo(300 * 300 - 4 * 30 * 30 - 60 * 60, 9);
  });
});
