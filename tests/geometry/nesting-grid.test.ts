/**
 * Box-grid nesting (nestContours, locatePoints) against a brute-force reference that tests every pair by
 * distance between circle centres (closed form: circle A lies inside circle B when |AB| + rA < rB), and the
 * band index of long loops against the polygon's own definition.
 */
import { describe, expect, it } from 'vitest';
import { locatePoints, nestContours, pointInLoop } from '../../src/geometry/nesting.js';
import { circleLoop, polygonLoop } from '../../src/geometry/shapes.js';

function rng(seed: number) {
  return () => {
    seed |= 0; seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('nestContours (box grid) equals the brute-force nesting of circles', () => {
  it('1,000 random circles, nested but never crossing (rejection sampling), 3 seeds', () => {
    for (const seed of [1, 2, 3]) {
      const r = rng(seed);
      const cs: { x: number; y: number; r: number }[] = [];
      while (cs.length < 1000) {
        const c = { x: r() * 1000, y: r() * 1000, r: 0.5 + r() ** 3 * 200 };
        // keep it only if, against every circle so far, it is clearly inside, around or apart (no crossing)
        const ok = cs.every((d) => {
          const dist = Math.hypot(c.x - d.x, c.y - d.y);
          return dist + c.r < d.r - 1e-6 || dist + d.r < c.r - 1e-6 || dist > c.r + d.r + 1e-6;
        });
        if (ok) cs.push(c);
      }
      const loops = cs.map((c) => circleLoop([c.x, c.y], 2 * c.r));
      const { parent, depth } = nestContours(loops);
      for (let i = 0; i < cs.length; i++) {
        let d = 0, p = -1;
        for (let j = 0; j < cs.length; j++) {
          if (i === j) continue;
          if (Math.hypot(cs[i].x - cs[j].x, cs[i].y - cs[j].y) + cs[i].r < cs[j].r) { d++; if (p < 0 || cs[j].r < cs[p].r) p = j; }
        }
        expect(depth[i]).toBe(d);
        expect(parent[i]).toBe(p);
      }
      // locatePoints: the circle centres lie in their own circle, the innermost one around them
      const where = locatePoints(cs.map((c) => [c.x, c.y] as const), loops, { parent, depth });
      for (let i = 0; i < cs.length; i++) {
        let best = -1;
        for (let j = 0; j < cs.length; j++) if (Math.hypot(cs[i].x - cs[j].x, cs[i].y - cs[j].y) < cs[j].r && (best < 0 || cs[j].r < cs[best].r)) best = j;
        expect(where[i]).toBe(best);
      }
    }
  });
});

describe('band index of long loops', () => {
  it('a 5,000-gon star: point-in-loop through the band index agrees with the winding of the polygon itself', () => {
    const n = 5000;
    const pts = Array.from({ length: n }, (_, k) => {
      const a = (2 * Math.PI * k) / n, rr = k % 2 === 0 ? 100 : 60;
      return [rr * Math.cos(a), rr * Math.sin(a)] as [number, number];
    });
    const loop = polygonLoop(pts);
    const r = rng(9);
    // reference: even–odd ray casting directly over the vertex list
    const inside = (x: number, y: number) => {
      let c = false;
      for (let i = 0, j = n - 1; i < n; j = i++) {
        const [xi, yi] = pts[i], [xj, yj] = pts[j];
        if ((yi > y) !== (yj > y) && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
      }
      return c;
    };
    for (let k = 0; k < 2000; k++) {
      const x = (r() - 0.5) * 220, y = (r() - 0.5) * 220;
      expect(pointInLoop(x, y, loop)).toBe(inside(x, y));
    }
  });
});
