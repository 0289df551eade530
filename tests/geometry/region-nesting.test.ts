/**
 * Regions of one part must not lie on each other's material (validatePart's region check, through the box
 * grid since issue 14 item 3): an island inside a hole of another region is fine, an outline on material
 * is refused, and many separate regions are checked without testing every pair.
 */
import { describe, expect, it } from 'vitest';
import type { Loop, Part, Region } from '../../src/geometry/part.js';
import { validatePart } from '../../src/geometry/validate.js';

const square = (x: number, y: number, s: number, ccw = true, where?: string): Loop => {
  const p = ccw ? [[x, y], [x + s, y], [x + s, y + s], [x, y + s]] : [[x, y], [x, y + s], [x + s, y + s], [x + s, y]];
  return { where, segments: p.map((a, i) => { const b = p[(i + 1) % 4]; return { kind: 'line' as const, x0: a[0], y0: a[1], x1: b[0], y1: b[1] }; }) };
};
const part = (regions: Region[]): Part => ({ name: 'regions (invented)', units: 'mm', regions });

describe('region nesting', () => {
  it('an island inside a hole of another region is valid', () => {
    expect(() => validatePart(part([
      { outer: square(0, 0, 100), holes: [square(20, 20, 60, false)] },
      { outer: square(40, 40, 20), holes: [] },
    ]))).not.toThrow();
  });

  it('an outline on the material of another region is refused, naming it', () => {
    expect(() => validatePart(part([
      { outer: square(0, 0, 100), holes: [square(20, 20, 20, false)] },
      { outer: square(60, 60, 20, true, 'island'), holes: [] },
    ]))).toThrow(/island.*lies on the material/);
  });

  it('an outline on material between holes of a region with many holes is refused', () => {
    const holes: Loop[] = [];
    for (let i = 0; i < 30; i++) for (let j = 0; j < 30; j++) holes.push(square(10 + 10 * i, 10 + 10 * j, 4, false));
    // islands inside every hole: valid
    const islands: Region[] = holes.map((h) => { const s = h.segments[0] as { x0: number; y0: number }; return { outer: square(s.x0 + 1, s.y0 + 1, 2), holes: [] }; });
    expect(() => validatePart(part([{ outer: square(0, 0, 320), holes }, ...islands]))).not.toThrow();
    // one more island on the material between holes: refused
    expect(() => validatePart(part([{ outer: square(0, 0, 320), holes }, ...islands, { outer: square(15, 15, 2, true, 'stray'), holes: [] }]))).toThrow(/stray/);
  });

  it('10^4 separate regions side by side are valid', () => {
    const regions: Region[] = [];
    for (let i = 0; i < 100; i++) for (let j = 0; j < 100; j++) regions.push({ outer: square(10 * i, 10 * j, 5), holes: [] });
    expect(() => validatePart(part(regions))).not.toThrow();
  });
});
