/**
 * joinPieces: joining loose pieces into contours. Areas checked against the shoelace formula and πr² (closed
 * forms); locations and gaps against the coordinates the test itself constructs.
 */
import { describe, expect, it } from 'vitest';
import { type JoinPiece, defaultJoinTolerance, joinPieces } from '../../src/geometry/join.js';
import type { Segment } from '../../src/geometry/segments.js';
import { signedArea } from '../read/dxfHelpers.js';
import { rng } from '../helpers.js';

const L = (x0: number, y0: number, x1: number, y1: number): Segment => ({ kind: 'line', x0, y0, x1, y1 });
const piece = (s: Segment, where: string, layer = 'CUT'): JoinPiece => ({ segments: [s], where, layer, sources: [where] });
const near = (a: number, b: number, tol: number) => expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThanOrEqual(tol);


describe('joinPieces', () => {
  it('joins shuffled, reversed edges of a polygon into one closed contour (shoelace area)', () => {
    // polygon (0,0) (4,0) (4,3) (1,5) : shoelace area = ½|Σ (x_i y_{i+1} − x_{i+1} y_i)| = ½(0 + 12 + 17 + 0) = 14.5
    const ps = [piece(L(4, 3, 1, 5), 'c'), piece(L(4, 0, 0, 0), 'a-reversed'), piece(L(1, 5, 0, 0), 'd'), piece(L(4, 3, 4, 0), 'b-reversed')];
    const r = joinPieces(ps);
    expect(r.contours.length).toBe(1);
    expect(r.contours[0].closed).toBe(true);
    expect(r.contours[0].pieces.length).toBe(4);
    near(Math.abs(signedArea(r.contours[0].segments)), 14.5, 1e-14);
    expect(r.issues).toEqual([]);
  });

  it('keeps curves in place: two half circles with a gap within the tolerance get a connecting line, recorded', () => {
    const g = 1e-10;
    const up: Segment = { kind: 'arc', cx: 0, cy: 0, r: 1, a0: 0, a1: Math.PI };
    const down: Segment = { kind: 'arc', cx: 0, cy: -g, r: 1, a0: Math.PI, a1: 2 * Math.PI };
    const r = joinPieces([{ segments: [up], where: 'u', layer: 'A' }, { segments: [down], where: 'd', layer: 'A' }], 1e-9);
    expect(r.contours.length).toBe(1);
    const c = r.contours[0];
    expect(c.closed).toBe(true);
    // the arcs are unchanged objects; one connecting line per joint with a gap
    expect(c.segments.filter((s) => s.kind === 'arc')).toEqual([up, down]);
    const bridged = r.issues.filter((i) => i.kind === 'gap-bridged');
    expect(bridged.length).toBe(2);
    for (const b of bridged) if (b.kind === 'gap-bridged') near(b.gap, g, 1e-15);
    // area: two half discs of r = 1 plus the 2r × g strip the connecting lines close (closed form)
    near(Math.abs(signedArea(c.segments)), Math.PI + 2 * g, 1e-14);
  });

  it('reports a near miss as an open gap with its location, and never bridges it', () => {
    const tol = 1e-9, g = 5e-8; // g < 100·tol
    const ps = [piece(L(0, 0, 1, 0), 'a'), piece(L(1 + g, 0, 1, 1), 'b'), piece(L(1, 1, 0, 0), 'c')];
    const r = joinPieces(ps, tol);
    expect(r.contours.every((c) => !c.closed)).toBe(true);
    const open = r.issues.filter((i) => i.kind === 'gap-open');
    expect(open.length).toBe(1);
    if (open[0].kind === 'gap-open') { near(open[0].gap, g, 1e-15); near(open[0].x, 1 + g / 2, 1e-15); near(open[0].y, 0, 0); }
    expect(r.issues.filter((i) => i.kind === 'dangling').length).toBe(2);
    // at 100× the tolerance the ends are no longer near misses
    const far = joinPieces(ps, g / 200);
    expect(far.issues.filter((i) => i.kind === 'gap-open').length).toBe(0);
  });

  it('joins only within a layer', () => {
    const ps = [piece(L(0, 0, 1, 0), 'a', 'A'), piece(L(1, 0, 0, 1), 'b', 'B'), piece(L(0, 1, 0, 0), 'c', 'A')];
    const r = joinPieces(ps);
    expect(r.contours.some((c) => c.closed)).toBe(false);
    expect(r.contours.length).toBe(2); // a+c joined on A, b alone on B
  });

  it('reports duplicates (dropped), overlaps with their length and branches', () => {
    const ps = [piece(L(0, 0, 2, 0), 'a'), piece(L(2, 0, 0, 0), 'a-again'), piece(L(1, 0, 3, 0), 'overlapping'),
      piece(L(3, 0, 3, 1), 'x'), piece(L(3, 0, 4, 0), 'y')];
    const r = joinPieces(ps);
    expect(r.dropped).toEqual([1]);
    const dup = r.issues.find((i) => i.kind === 'duplicate');
    expect(dup && dup.kind === 'duplicate' && dup.pieces).toEqual([0, 1]);
    const ov = r.issues.find((i) => i.kind === 'overlap');
    expect(ov && ov.kind === 'overlap' && ov.pieces).toEqual([0, 2]);
    if (ov && ov.kind === 'overlap') { near(ov.length, 1, 1e-15); near(ov.x, 1.5, 1e-15); }
    const br = r.issues.find((i) => i.kind === 'branch');
    expect(br).toBeDefined();
    if (br && br.kind === 'branch') { near(br.x, 3, 0); expect(br.pieces.sort()).toEqual([2, 3, 4]); }
  });

  it('concentric equal arcs overlapping over 90° are an overlap of length r·π/2', () => {
    const a: Segment = { kind: 'arc', cx: 5, cy: 5, r: 2, a0: 0, a1: Math.PI };
    const b: Segment = { kind: 'arc', cx: 5, cy: 5, r: 2, a0: 2 * Math.PI + Math.PI / 2, a1: 2 * Math.PI + 1.5 * Math.PI };
    const r = joinPieces([{ segments: [a], where: 'a' }, { segments: [b], where: 'b' }]);
    const ov = r.issues.find((i) => i.kind === 'overlap');
    expect(ov).toBeDefined();
    if (ov && ov.kind === 'overlap') near(ov.length, Math.PI, 1e-12);
  });

  it('passes closed pieces through as closed', () => {
    const circle: Segment = { kind: 'arc', cx: 0, cy: 0, r: 3, a0: 0, a1: 2 * Math.PI };
    const r = joinPieces([{ segments: [circle], where: 'c', closed: true }]);
    expect(r.contours).toEqual([{ segments: [circle], closed: true, pieces: [0] }]);
    near(signedArea(r.contours[0].segments), 9 * Math.PI, 1e-13); // πr², closed form
  });

  it('default tolerance is max(1e-9·size, 64ε·max|coordinate|)', () => {
    const small = [piece(L(0, 0, 100, 0), 'a'), piece(L(100, 0, 0, 50), 'b')];
    expect(defaultJoinTolerance(small)).toBe(1e-9 * 100);
    const far = [piece(L(1e6, 1e6, 1e6 + 1, 1e6), 'a')];
    expect(defaultJoinTolerance(far)).toBe(64 * Number.EPSILON * (1e6 + 1));
  });

  it('joins 20,000 shuffled squares (80,000 loose edges) into 20,000 closed unit squares', () => {
    const rand = rng(7);
    const ps: JoinPiece[] = [];
    const n = 20000, side = 200;
    for (let k = 0; k < n; k++) {
      const x = (k % side) * 2, y = Math.floor(k / side) * 2;
      const pts: [number, number][] = [[x, y], [x + 1, y], [x + 1, y + 1], [x, y + 1]];
      for (let e = 0; e < 4; e++) {
        const [a, b] = [pts[e], pts[(e + 1) % 4]];
        ps.push(piece(rand() < 0.5 ? L(a[0], a[1], b[0], b[1]) : L(b[0], b[1], a[0], a[1]), `s${k}e${e}`));
      }
    }
    for (let i = ps.length - 1; i > 0; i--) { const j = Math.floor(rand() * (i + 1)); [ps[i], ps[j]] = [ps[j], ps[i]]; }
    const r = joinPieces(ps);
    expect(r.contours.length).toBe(n);
    expect(r.contours.every((c) => c.closed && c.segments.length === 4)).toBe(true);
    // every contour is a unit square: |area| = 1 (shoelace)
    expect(r.contours.every((c) => Math.abs(Math.abs(signedArea(c.segments)) - 1) < 1e-12)).toBe(true);
    expect(r.issues.length).toBe(0);
  });
});
