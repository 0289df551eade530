import { describe, it, expect } from 'vitest';
import { polygonContains } from 'd3-polygon';
import { nestLoops, pointInLoop } from '../../src/geometry/nesting.js';
import type { Loop } from '../../src/geometry/part.js';
import { type Segment, segmentPoint } from '../../src/geometry/segments.js';
import { circleLoop, rectangleLoop } from '../../src/geometry/shapes.js';

// A loop with every curved kind: a cubic top edge, an elliptical-arc right side, a quadratic bottom, a circular arc left.
function mixedLoop(): Loop {
  const segs: Segment[] = [];
  segs.push({ kind: 'quadratic', x0: 0, y0: 0, x1: 5, y1: -4, x2: 10, y2: 0 });
  segs.push({ kind: 'ellipticalArc', cx: 10, cy: 3, rx: 3, ry: 1.5, phi: Math.PI / 2, t0: -Math.PI, t1: 0 });
  const p = segmentPoint(segs[1], 1);
  segs.push({ kind: 'cubic', x0: p[0], y0: p[1], x1: 7, y1: 12, x2: 3, y2: 2, x3: 0, y3: 6 });
  segs.push({ kind: 'arc', cx: 0, cy: 3, r: 3, a0: Math.PI / 2, a1: 1.5 * Math.PI });
  return { segments: segs, where: 'mixed' };
}

describe('pointInLoop on exact curves', () => {
  it('agrees with d3-polygon polygonContains on a fine polyline, for points away from the boundary', () => {
    // reference: d3-polygon (general-purpose library) on 4000 chords per segment; points within 1e-3
    // of the polyline are skipped, since the chords differ from the curve by less than that.
    const loop = mixedLoop();
    // the test loop is a closed chain
    loop.segments.forEach((s, k) => {
      const a = segmentPoint(s, 1), b = segmentPoint(loop.segments[(k + 1) % loop.segments.length], 0);
      expect(Math.hypot(a[0] - b[0], a[1] - b[1])).toBeLessThan(1e-12);
    });
    const poly: [number, number][] = [];
    for (const s of loop.segments) for (let i = 0; i < 4000; i++) poly.push(segmentPoint(s, i / 4000));
    let seed = 7;
    const rnd = () => { seed = (seed * 16807) % 2147483647; return seed / 2147483647; };
    let checked = 0, inside = 0;
    for (let k = 0; k < 3000; k++) {
      const x = -4 + 16 * rnd(), y = -4 + 14 * rnd();
      let dmin = Infinity;
      for (const q of poly) dmin = Math.min(dmin, Math.hypot(q[0] - x, q[1] - y));
      if (dmin < 1e-3) continue;
      const ref = polygonContains(poly, [x, y]);
      expect(pointInLoop(x, y, loop)).toBe(ref);
      checked++;
      if (ref) inside++;
    }
    expect(checked).toBeGreaterThan(2900);
    expect(inside).toBeGreaterThan(300);
  });
  it('points at the height of a vertex are counted once (half-open rule)', () => {
    const sq = rectangleLoop([0, 0], [10, 10]);
    expect(pointInLoop(5, 0 + 1e-300, sq)).toBe(true);
    expect(pointInLoop(-1, 5, sq)).toBe(false);
    expect(pointInLoop(5, 5, sq)).toBe(true);
    const c = circleLoop([0, 0], 2);
    expect(pointInLoop(0, 0, c)).toBe(true); // on the line y = 0 through both arc joints
    expect(pointInLoop(0.999, 0, c)).toBe(true);
    expect(pointInLoop(1.001, 0, c)).toBe(false);
  });
});

describe('nestLoops', () => {
  it('hole in an outline, island in the hole → two groups; sibling holes stay with their outline', () => {
    const outline = rectangleLoop([0, 0], [100, 100], 0, 'outline');
    const hole = circleLoop([50, 50], 60, 'hole');
    const island = rectangleLoop([40, 40], [20, 20], 0, 'island');
    const islandHole = circleLoop([50, 50], 4, 'islandHole');
    const bolt = circleLoop([8, 8], 6, 'bolt');
    const groups = nestLoops([hole, islandHole, outline, bolt, island]);
    expect(groups).toHaveLength(2);
    const byOuter = new Map(groups.map((g) => [g[0].outer.where, g[0].holes.map((h) => h.where).sort()]));
    expect(byOuter.get('outline')).toEqual(['bolt', 'hole']);
    expect(byOuter.get('island')).toEqual(['islandHole']);
  });
  it('disjoint outlines are separate groups; a loop touching nothing is its own part', () => {
    const groups = nestLoops([rectangleLoop([0, 0], [1, 1]), rectangleLoop([2, 0], [1, 1]), circleLoop([10, 10], 1)]);
    expect(groups).toHaveLength(3);
    expect(groups.every((g) => g.length === 1 && g[0].holes.length === 0)).toBe(true);
  });
  it('an ellipse cut-out inside a Bézier-bounded outline', () => {
    const outer = mixedLoop();
    const e: Loop = { where: 'e', segments: [
      { kind: 'ellipticalArc', cx: 5, cy: 2, rx: 2, ry: 0.8, phi: 0.3, t0: 0, t1: Math.PI },
      { kind: 'ellipticalArc', cx: 5, cy: 2, rx: 2, ry: 0.8, phi: 0.3, t0: Math.PI, t1: 2 * Math.PI },
    ] };
    const g = nestLoops([e, outer]);
    expect(g).toHaveLength(1);
    expect(g[0][0].outer.where).toBe('mixed');
    expect(g[0][0].holes[0].where).toBe('e');
  });
});

describe('pointInLoop with a ray through vertices', () => {
  it('counts a vertex where an arc meets a line once, though the arc end computed from its angle is off in the last bit', () => {
    // the gusset sample's outline (invented demo data): a semicircular lobe from (420, 120) to (300, 120) about
    // (360, 120), bulging up; 120 + 60·sin(π) is not exactly 120, while the next line starts exactly at y = 120. The
    // expected sides are by construction (common practice, no source): every point below is inside the plate.
    const loop: Loop = {
      where: 'gusset',
      segments: [
        { kind: 'line', x0: 0, y0: 0, x1: 420, y1: 0 },
        { kind: 'line', x0: 420, y0: 0, x1: 420, y1: 120 },
        { kind: 'arc', cx: 360, cy: 120, r: 60, a0: 0, a1: Math.PI },
        { kind: 'line', x0: 300, y0: 120, x1: 120, y1: 300 },
        { kind: 'line', x0: 120, y0: 300, x1: 0, y1: 300 },
        { kind: 'line', x0: 0, y0: 300, x1: 0, y1: 0 },
      ],
    };
    expect(segmentPoint(loop.segments[2], 1)[1]).not.toBe(120); // the premise: the arc's end is not exact
    for (const x of [5, 65, 200, 299]) expect(pointInLoop(x, 120, loop)).toBe(true);
    expect(pointInLoop(350, 150, loop)).toBe(true); // inside the lobe
    expect(pointInLoop(360, 190, loop)).toBe(false); // above it
    expect(pointInLoop(430, 120, loop)).toBe(false);
  });
});
