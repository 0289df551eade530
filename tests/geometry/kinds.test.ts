/**
 * The SegmentOps contract, checked on every registered kind against the kind's own point(): each new
 * operation must agree with the definition it stands for (the piece over [a, b] has the same points, an
 * affine image maps the points, a mirror reverses a circular arc and keeps it circular, the support is
 * the largest projection, path commands end where the curve does). SAMPLES is typed by kind, so a new
 * kind does not compile here until it has samples.
 */
import { describe, expect, it } from 'vitest';
import { type Affine, type Out2, type Segment, type SegmentKind, OPS, exactCrossings, ops, segmentEnd, segmentPoint, segmentStart } from '../../src/geometry/segments.js';
import { applyAffine } from '../../src/geometry/transform.js';

const SAMPLES = {
  line: [{ kind: 'line', x0: 1, y0: -2, x1: 7.5, y1: 3 }],
  arc: [{ kind: 'arc', cx: 2, cy: 1, r: 3, a0: -0.4, a1: 2.9 }, { kind: 'arc', cx: -1, cy: 0.5, r: 1.5, a0: 4, a1: 0.2 }],
  ellipticalArc: [{ kind: 'ellipticalArc', cx: 1, cy: 2, rx: 4, ry: 1.5, phi: 0.6, t0: -1, t1: 2.5 }],
  quadratic: [{ kind: 'quadratic', x0: 0, y0: 0, x1: 3, y1: 5, x2: 6, y2: -1 }],
  cubic: [{ kind: 'cubic', x0: 0, y0: 0, x1: 1, y1: 4, x2: 5, y2: -3, x3: 6, y3: 2 }],
} satisfies { [K in SegmentKind]: Extract<Segment, { kind: K }>[] };

const ALL: Segment[] = Object.values(SAMPLES).flat() as Segment[];
const U = [0, 0.1, 0.37, 0.5, 0.8, 1];
const dist = (p: readonly number[], q: readonly number[]) => Math.hypot(p[0] - q[0], p[1] - q[1]);
const TOL = 1e-12;

describe('segment kinds: every kind in the registry has samples', () => {
  it('SAMPLES covers OPS', () => {
    expect(Object.keys(SAMPLES).sort()).toEqual(Object.keys(OPS).sort());
  });
});

describe.each(ALL.map((s) => [s.kind, s] as const))('%s: SegmentOps contract', (_kind, s) => {
  const o = ops(s);
  it('evaluate = point + derivative; start and end are the points at 0 and 1', () => {
    const p: Out2 = [0, 0], d: Out2 = [0, 0], q: Out2 = [0, 0], e: Out2 = [0, 0];
    for (const t of U) {
      o.evaluate(s, t, p, d); o.point(s, t, q); o.derivative(s, t, e);
      expect([p[0], p[1], d[0], d[1]]).toEqual([q[0], q[1], e[0], e[1]]);
    }
    expect(dist(segmentStart(s), segmentPoint(s, 0))).toBeLessThan(TOL);
    expect(dist(segmentEnd(s), segmentPoint(s, 1))).toBeLessThan(TOL);
  });
  it('sub(a, b) runs through the same points, reparametrised over [0, 1]', () => {
    for (const [a, b] of [[0, 0.3], [0.25, 0.9], [0.6, 1]]) {
      const piece = o.sub(s, a, b);
      for (const u of U) expect(dist(segmentPoint(piece, u), segmentPoint(s, a + (b - a) * u))).toBeLessThan(TOL * 10);
    }
  });
  it('affine images map the points; a mirror keeps a circular arc circular and reverses its sense', () => {
    const maps: Affine[] = [[0.8, 0.6, -0.6, 0.8, 3, -1], [-1, 0, 0, 1, 2, 0], [1.5, 0.2, 0.7, 0.9, -4, 1]];
    for (const m of maps) {
      const img = o.affine(s, m);
      for (const u of U) {
        const p = segmentPoint(s, u);
        expect(dist(segmentPoint(img, u), applyAffine(m, p[0], p[1]))).toBeLessThan(1e-11);
      }
      const det = m[0] * m[3] - m[1] * m[2];
      // the enclosed signed area scales by det (a mirror flips the sense of travel)
      const chordArea = (g: Segment) => { const a = segmentStart(g), b = segmentEnd(g); return ops(g).areaTerm(g) - (a[0] * b[1] - b[0] * a[1]) / 2; };
      expect(chordArea(img)).toBeCloseTo(det * chordArea(s), 10);
    }
    if (s.kind === 'arc') {
      const mirrored = o.affine(s, [-1, 0, 0, 1, 0, 0]);
      expect(mirrored.kind).toBe('arc');
      if (mirrored.kind === 'arc') expect(Math.sign(mirrored.a1 - mirrored.a0)).toBe(-Math.sign(s.a1 - s.a0));
    }
  });
  it('rotate(c, s, angle, dx, dy) equals the rotation then the shift', () => {
    const ang = 0.7, c = Math.cos(ang), sn = Math.sin(ang);
    const r = o.rotate(s, c, sn, ang, 5, -3);
    for (const u of U) {
      const p = segmentPoint(s, u);
      expect(dist(segmentPoint(r, u), [5 + c * p[0] - sn * p[1], -3 + sn * p[0] + c * p[1]])).toBeLessThan(1e-11);
    }
  });
  it('moveStart / moveEnd move exactly that end, or decline (null)', () => {
    const ms = o.moveStart(s, 10, 20), me = o.moveEnd(s, -10, -20);
    if (ms) { expect(segmentStart(ms)).toEqual([10, 20]); expect(segmentEnd(ms)).toEqual(segmentEnd(s)); }
    if (me) { expect(segmentEnd(me)).toEqual([-10, -20]); expect(segmentStart(me)).toEqual(segmentStart(s)); }
    expect(ms === null).toBe(me === null);
  });
  it('crossingX lands on the curve at the requested height on each y-monotone piece', () => {
    const cuts = [0, ...o.yTurns(s), 1];
    for (let k = 0; k + 1 < cuts.length; k++) {
      const ya = segmentPoint(s, cuts[k])[1], yb = segmentPoint(s, cuts[k + 1])[1];
      if (Math.abs(yb - ya) < 1e-9) continue;
      for (const f of [0.2, 0.5, 0.9]) {
        const y = ya + (yb - ya) * f;
        const x = o.crossingX(s, cuts[k], cuts[k + 1], y);
        // the point of the piece at that height, by bisection on its monotone y
        let lo = cuts[k], hi = cuts[k + 1];
        for (let i = 0; i < 200; i++) { const mid = (lo + hi) / 2; if ((segmentPoint(s, mid)[1] < y) === (yb > ya)) lo = mid; else hi = mid; }
        expect(Math.abs(x - segmentPoint(s, (lo + hi) / 2)[0])).toBeLessThan(1e-9);
      }
    }
  });
  it('every kind crosses a line exactly: a line through the point at u in several directions finds ta = u there, on both', () => {
    for (const u of [0.1, 0.37, 0.8]) {
      const [px, py] = segmentPoint(s, u);
      for (const th of [0.3, 1.1, 2.4]) {
        const line: Segment = { kind: 'line', x0: px - 20 * Math.cos(th), y0: py - 20 * Math.sin(th), x1: px + 20 * Math.cos(th), y1: py + 20 * Math.sin(th) };
        const hits = exactCrossings(s, line, 1e-9);
        expect(hits, `${s.kind} has a closed-form crossing with a line`).not.toBeNull();
        const near = hits!.filter((h) => Math.abs(h.ta - u) < 1e-7);
        if (near.length === 0) {
          // only a tangent line may miss the point as a separate crossing
          const d: Out2 = [0, 0]; o.derivative(s, u, d);
          expect(Math.abs(d[0] * Math.sin(th) - d[1] * Math.cos(th)) / Math.hypot(d[0], d[1]), `${s.kind} u=${u} th=${th}`).toBeLessThan(1e-6);
          continue;
        }
        for (const h of hits!) {
          // every reported crossing lies on both the segment (at ta) and the line (at tb)
          expect(dist(segmentPoint(s, h.ta), [h.x, h.y])).toBeLessThan(1e-9);
          expect(dist(segmentPoint(line, h.tb), [h.x, h.y])).toBeLessThan(1e-9);
        }
      }
    }
  });
  it('an exact support, where the kind has one, is the largest projection over dense samples', () => {
    if (!o.support) return;
    for (let k = 0; k < 16; k++) {
      const th = (k * Math.PI) / 8 + 0.1, ux = Math.cos(th), uy = Math.sin(th);
      let best = -Infinity;
      for (let i = 0; i <= 20000; i++) { const p = segmentPoint(s, i / 20000); best = Math.max(best, p[0] * ux + p[1] * uy); }
      const h = o.support(s, ux, uy);
      expect(h).toBeGreaterThanOrEqual(best - 1e-12);
      expect(h - best).toBeLessThan(1e-6);
    }
  });
  it('path commands end at the point for t1, forwards and backwards', () => {
    for (const [t0, t1] of [[0, 1], [0.2, 0.7], [1, 0]]) {
      const cmds = o.pathCommands(s, t0, t1);
      const last = cmds[cmds.length - 1].args;
      expect(dist([last[last.length - 2], last[last.length - 1]], segmentPoint(s, t1))).toBeLessThan(1e-12);
    }
  });
});
