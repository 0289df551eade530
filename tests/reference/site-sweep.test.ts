/**
 * Every input format at site coordinates (about 1.2e6 and 9.9e6 mm), curved edges included: at default
 * settings the area quantities (area, Ix, Iy, and Ixy against √(Ix·Iy)) within 1e-12 relative, and at every
 * rule degree 1–20 and refinement levels 1–2 (level 3 at degrees 1–6) no estimate below its true error.
 * Inputs and references in tests/reference/data/site-sweep.json, made by tests/reference/siteSweep.py
 * (mpmath Green's-theorem integration at 50 digits of each format's own definitions: SVG 1.1 F.6.5 arcs,
 * AutoCAD DXF Reference bulges and ELLIPSE, the README's part format; DXF written by ezdxf).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { type MeasureOptions, measureSection } from '../../src/analysis/measure.js';
import type { Part } from '../../src/geometry/part.js';
import { readModels } from '../../src/read/models.js';

interface Case { format: 'part-json' | 'svg' | 'dxf' | 'geojson' | 'wkt'; label: string; text: string; ref: Record<string, string> }
const cases = JSON.parse(readFileSync(join(import.meta.dirname, 'data', 'site-sweep.json'), 'utf8')) as Record<string, Case>;
const KEYS = ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy'] as const;

function partOf(c: Case): Part {
  const models = readModels(c.text, c.label, { format: c.format, units: c.format === 'part-json' ? undefined : 'mm' });
  expect(models.length).toBe(1);
  return models[0].layers[0].part;
}

/** [true error, estimate] of each quantity. */
function errors(part: Part, ref: Record<string, string>, opts: MeasureOptions): Record<(typeof KEYS)[number], [number, number]> {
  const q = measureSection(part, opts).quantities;
  return Object.fromEntries(KEYS.map((k) => [k, [Math.abs(q[k].value - Number(ref[k])), q[k].error]])) as Record<(typeof KEYS)[number], [number, number]>;
}

describe('site coordinates in every input format (issue 13)', () => {
  it('covers every format at both offsets', () => {
    expect(new Set(Object.values(cases).map((c) => c.format))).toEqual(new Set(['part-json', 'svg', 'dxf', 'geojson', 'wkt']));
    expect(Object.keys(cases).length).toBe(10);
  });
  for (const [name, c] of Object.entries(cases)) {
    it(`${name}: area quantities within 1e-12 at default settings, every estimate at least its true error`, () => {
      const part = partOf(c);
      const e = errors(part, c.ref, {});
      const r = (k: (typeof KEYS)[number]) => Number(c.ref[k]);
      const relative = { area: e.area[0] / r('area'), Ix: e.Ix[0] / r('Ix'), Iy: e.Iy[0] / r('Iy'), Ixy: e.Ixy[0] / Math.sqrt(r('Ix') * r('Iy')) };
      console.log(`${name}: ${Object.entries(relative).map(([k, v]) => `${k} ${v.toExponential(1)}`).join(', ')}; estimate/true area ${(e.area[1] / e.area[0]).toExponential(1)}`);
      for (const [k, v] of Object.entries(relative)) expect(v, `${name} ${k} relative error`).toBeLessThanOrEqual(1e-12);
      for (const k of KEYS) expect(e[k][1], `${name} ${k}: estimate vs true error ${e[k][0]}`).toBeGreaterThanOrEqual(e[k][0]);
    });
  }
  it('at every degree 1–20 and levels 1–2 (3 at degrees 1–6) on the mesh: no estimate below its true error', () => {
    let checked = 0;
    for (const [name, c] of Object.entries(cases)) {
      const part = partOf(c);
      for (let degree = 1; degree <= 20; degree++) {
        for (const levels of degree <= 6 ? [1, 2, 3] : [1, 2]) {
          const e = errors(part, c.ref, { degree, levels, method: 'mesh' });
          for (const k of KEYS) {
            expect(e[k][1], `${name} d${degree} L${levels} ${k}: estimate vs true error ${e[k][0]}`).toBeGreaterThanOrEqual(e[k][0]);
            checked++;
          }
        }
      }
    }
    console.log(`site sweep: ${checked} estimates checked`);
    expect(checked).toBe(10 * (6 * 3 + 14 * 2) * KEYS.length);
  });
});
