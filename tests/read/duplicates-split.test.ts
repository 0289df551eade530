/**
 * A contour drawn twice with different splits is still a duplicate: a hole as two half-circle arcs and again
 * as four quarter arcs, an outline with one edge in two pieces. Reference areas are closed forms (rectangle
 * b·h, circle πr²). The drawings are invented for the test.
 */
import { describe, expect, it } from 'vitest';
import { readDrawing } from '../../src/read/read.js';
import { loopSignedArea } from '../../src/geometry/part.js';

const area = (text: string) => {
  const r = readDrawing(text, 'split.svg');
  let a = 0;
  for (const p of r.parts) for (const g of p.regions) { a += Math.abs(loopSignedArea(g.outer)); for (const h of g.holes) a -= Math.abs(loopSignedArea(h)); }
  return { a, r };
};

describe('duplicates drawn with different splits', () => {
  it('a Ø20 hole as 2 arcs and again as 4 arcs counts once; an outline edge in two pieces counts once', () => {
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="60mm" viewBox="0 0 100 60">
      <path d="M0 0 H100 V60 H0 Z"/>
      <path d="M0 0 H50 H100 V60 H0 Z"/>
      <path d="M60 30 A10 10 0 0 1 40 30 A10 10 0 0 1 60 30 Z"/>
      <path d="M50 20 A10 10 0 0 1 60 30 A10 10 0 0 1 50 40 A10 10 0 0 1 40 30 A10 10 0 0 1 50 20 Z"/>
    </svg>`;
    const { a, r } = area(svg);
    expect(r.parts).toHaveLength(1);
    expect(r.parts[0].regions[0].holes).toHaveLength(1);
    expect(Math.abs(a - (100 * 60 - Math.PI * 100)) / a).toBeLessThan(1e-13);
    expect(r.summary.duplicates).toHaveLength(2);
  });
  it('arcs of different circles are not merged into a false duplicate', () => {
    // a Ø20 hole and a Ø20.2 hole at the same centre are different contours: they cross nothing but touch no
    // duplicate rule; one inside the other is material inside a cut-out, refused in one line
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="60mm" viewBox="0 0 100 60">
      <path d="M0 0 H100 V60 H0 Z"/>
      <path d="M60 30 A10 10 0 0 1 40 30 A10 10 0 0 1 60 30 Z"/>
      <path d="M50.1 19.9 A10.1 10.1 0 0 1 60.2 30 A10.1 10.1 0 0 1 50.1 40.1 A10.1 10.1 0 0 1 40 30 A10.1 10.1 0 0 1 50.1 19.9 Z"/>
    </svg>`;
    expect(() => readDrawing(svg, 'split.svg')).toThrow(/encloses|crosses, touches or coincides/);
  });
});
