/**
 * Net section along a line: closed forms and hand calculations. Each check names its source.
 */
import { describe, expect, it } from 'vitest';
import { preparePart } from '../../src/analysis/measure.js';
import { InputError } from '../../src/base/errors.js';
import { type NetSectionGeometry, netSection, parseNetLine } from '../../src/geometry/netSection.js';
import type { Loop, Part } from '../../src/geometry/part.js';
import type { Segment } from '../../src/geometry/segments.js';

const line = (x0: number, y0: number, x1: number, y1: number): Segment => ({ kind: 'line', x0, y0, x1, y1 });
const rect = (x0: number, y0: number, x1: number, y1: number): Loop => ({ segments: [line(x0, y0, x1, y0), line(x1, y0, x1, y1), line(x1, y1, x0, y1), line(x0, y1, x0, y0)] });
const circle = (cx: number, cy: number, r: number): Loop => ({ segments: [{ kind: 'arc', cx, cy, r, a0: 0, a1: Math.PI }, { kind: 'arc', cx, cy, r, a0: Math.PI, a1: 2 * Math.PI }] });
const part = (outer: Loop, holes: Loop[] = []): Part => preparePart({ name: 'test plate (invented)', units: 'mm', regions: [{ outer, holes }] });
const cut = (p: Part, text: string): NetSectionGeometry => netSection(p, parseNetLine(text, '--net-line'));

/** value within its own bound of the exact figure, and the bound below `tol` (absolute). */
function exact(v: number, bound: number, want: number, tol: number, label: string): void {
  const err = Math.abs(v - want);
  console.log(`${label}: ${v} vs ${want}, true error ${err.toExponential(2)}, bound ${bound.toExponential(2)}`);
  expect(bound, `${label}: bound ≥ true error`).toBeGreaterThanOrEqual(err);
  expect(bound, `${label}: bound small`).toBeLessThanOrEqual(tol);
}

describe('net section along a line', () => {
  it('row of n holes across a straight cut: net = width − n·d (common practice, no source)', () => {
    const d = 22, n = 4, width = 200;
    const p = part(rect(0, 0, 300, width), Array.from({ length: n }, (_, i) => circle(150, 25 + 50 * i, d / 2)));
    const r = cut(p, '150,-10 150,210');
    exact(r.gross, r.grossError, width, 1e-9, 'row gross');
    exact(r.net, r.netError, width - n * d, 1e-9, 'row net');
    expect(r.intervals).toHaveLength(n + 1);
    // runs start at the plate's edge and at each hole's far side, in order along the line
    exact(r.intervals[0].from, r.intervals[0].fromError, 10, 1e-9, 'first run start');
    exact(r.intervals[1].from, r.intervals[1].fromError, 10 + 25 + d / 2, 1e-9, 'second run start');
    expect(r.intervals.map((i) => i.from)).toEqual([...r.intervals.map((i) => i.from)].sort((a, b) => a - b));
    expect(r.startsInMaterial || r.endsInMaterial).toBe(false);
  });

  it('staggered two-piece chain through holes, by hand: gross 100√5, net 100√5 − 3·20 (one hole at the kink)', () => {
    // by hand: piece (100,−20)→(160,100) has direction (60,120), length 60√5; the plate (y 0…200) keeps 5/6
    // of it, 50√5; the second piece (160,100)→(100,220) likewise. Holes Ø20 centred on each piece take 20
    // each; the hole centred on the kink takes 10 from each piece.
    const p = part(rect(0, 0, 300, 200), [circle(130, 40, 10), circle(130, 160, 10), circle(160, 100, 10)]);
    const r = cut(p, '100,-20 160,100 100,220');
    exact(r.gross, r.grossError, 100 * Math.sqrt(5), 1e-9, 'chain gross');
    exact(r.net, r.netError, 100 * Math.sqrt(5) - 60, 1e-9, 'chain net');
    expect(r.intervals).toHaveLength(4);
    exact(r.length, r.lengthError, 120 * Math.sqrt(5), 1e-12, 'chain length');
  });

  it('a cut tangent to a hole takes nothing; just inside it takes the chord 2√(r² − h²) (closed form, from memory)', () => {
    const p = part(rect(0, 0, 300, 200), [circle(150, 100, 15)]);
    const t = cut(p, '-10,115 310,115');
    exact(t.net, t.netError, 300, 1e-4, 'tangent net');
    expect(t.intervals).toHaveLength(1);
    const h = 15 - 1e-6;
    const n = cut(p, `-10,${100 + h} 310,${100 + h}`);
    const chord = 2 * Math.sqrt(15 * 15 - (100 + h - 100) ** 2);
    exact(n.net, n.netError, 300 - chord, 1e-4, 'near-tangent net');
  });

  it('a cut through a curved outline: circle chord 2√(r² − d²), ellipse chord 2a√(1 − k²/b²) (closed forms, from memory)', () => {
    const disc = part(circle(20, -30, 50));
    const r = cut(disc, '-100,0 100,0'); // distance 30 from the centre
    exact(r.gross, r.grossError, 80, 1e-10, 'circle chord');
    const a = 60, b = 25, k = 10;
    const ell = part({ segments: [{ kind: 'ellipticalArc', cx: 5, cy: 7, rx: a, ry: b, phi: 0, t0: 0, t1: Math.PI }, { kind: 'ellipticalArc', cx: 5, cy: 7, rx: a, ry: b, phi: 0, t0: Math.PI, t1: 2 * Math.PI }] });
    const e = cut(ell, `-100,${7 + k} 100,${7 + k}`);
    exact(e.gross, e.grossError, 2 * a * Math.sqrt(1 - (k * k) / (b * b)), 1e-10, 'ellipse chord');
    // the same ellipse turned by 30°: a line through the centre along the major axis has length 2a
    const c = Math.cos(Math.PI / 6), s = Math.sin(Math.PI / 6);
    const tilted = part({ segments: [{ kind: 'ellipticalArc', cx: 0, cy: 0, rx: a, ry: b, phi: Math.PI / 6, t0: 0, t1: Math.PI }, { kind: 'ellipticalArc', cx: 0, cy: 0, rx: a, ry: b, phi: Math.PI / 6, t0: Math.PI, t1: 2 * Math.PI }] });
    const tt = cut(tilted, `${-100 * c},${-100 * s} ${100 * c},${100 * s}`);
    exact(tt.gross, tt.grossError, 2 * a, 1e-10, 'tilted ellipse major axis');
  });

  it('Bézier edges: the height under a quadratic and a cubic edge at x = 25 (polynomials evaluated by hand)', () => {
    // quadratic (0,100) (50,200) (100,100): x = 100t, y = 100 + 200t(1 − t); at t = 1/4, y = 137.5
    const q = part({ segments: [line(0, 0, 100, 0), line(100, 0, 100, 100), { kind: 'quadratic', x0: 100, y0: 100, x1: 50, y1: 200, x2: 0, y2: 100 }, line(0, 100, 0, 0)] });
    const rq = cut(q, '25,-5 25,300');
    exact(rq.gross, rq.grossError, 137.5, 1e-10, 'quadratic edge');
    // cubic (0,100) (100/3,160) (200/3,40) (100,100): x = 100t, y = 100 + 180t(1 − t)(1 − 2t); at t = 1/4, 116.875
    const c = part({ segments: [line(0, 0, 100, 0), line(100, 0, 100, 100), { kind: 'cubic', x0: 100, y0: 100, x1: 200 / 3, y1: 40, x2: 100 / 3, y2: 160, x3: 0, y3: 100 }, line(0, 100, 0, 0)] });
    const rc = cut(c, '25,-5 25,300');
    exact(rc.gross, rc.grossError, 116.875, 1e-10, 'cubic edge');
  });

  it('a line through a vertex of the outline and one at a shallow angle keep honest bounds', () => {
    const p = part(rect(0, 0, 100, 50));
    const diag = cut(p, '-10,-5 110,55'); // through both corners
    exact(diag.gross, diag.grossError, Math.hypot(100, 50), 1e-9, 'corner to corner');
    // (−1, −0.0001) → (101, 0.0001) crosses the bottom edge at x = 50 at a grazing angle (slope 0.0002/102)
    const shallow = cut(p, '-1,-0.0001 101,0.0001');
    exact(shallow.gross, shallow.grossError, Math.hypot(50, (50 * 0.0002) / 102), 1e-4, 'grazing line');
    expect(shallow.grossError, 'a grazing crossing is far less certain than a square one').toBeGreaterThan(1e3 * diag.grossError);
  });

  it('a line from edge to edge is not flagged as starting in the material; one starting inside is (common practice, no source)', () => {
    const p = part(rect(0, 0, 300, 200));
    const edge = cut(p, '0,100 300,100');
    exact(edge.gross, edge.grossError, 300, 1e-9, 'edge to edge');
    expect([edge.startsInMaterial, edge.endsInMaterial]).toEqual([false, false]);
    const inside = cut(p, '50,100 310,100');
    exact(inside.net, inside.netError, 250, 1e-9, 'from inside');
    expect([inside.startsInMaterial, inside.endsInMaterial]).toEqual([true, false]);
  });

  it('refuses a line that misses the part or is malformed, in one located line', () => {
    const p = part(rect(0, 0, 100, 50));
    const msg = (f: () => unknown) => { try { f(); } catch (e) { expect(e).toBeInstanceOf(InputError); return String((e as Error).message); } throw new Error('no error'); };
    expect(msg(() => cut(p, '200,0 300,10'))).toMatch(/--net-line.*misses the part/);
    expect(msg(() => parseNetLine('10,10', '--net-line'))).toMatch(/at least two points/);
    expect(msg(() => parseNetLine('10,10 20;x', '--net-line'))).toMatch(/point 2 "20" is not x,y/);
    expect(msg(() => cut(p, '10,-5 10,-5 10,60'))).toMatch(/points 1 and 2 are the same/);
    expect(msg(() => cut(p, '10,-5 10,60 10,20'))).toMatch(/folds back/);
    expect(msg(() => cut(p, '-5,10 50,60 50,-5 -5,40'))).toMatch(/crosses itself/);
    expect(msg(() => cut(p, '-10,0 110,0'))).toMatch(/runs along the part's boundary/);
  });
});
