import { describe, it, expect } from 'vitest';
import { expectSectionClose, measureObj } from '../helpers.js';
import { partFromObject } from '../../src/read/partJson.js';
import { InputError, MethodError } from '../../src/base/errors.js';

type M = { A: number; Sx: number; Sy: number; Ixx: number; Iyy: number; Ixy: number }; // raw moments about the origin
const sub = (a: M, b: M): M => ({ A: a.A - b.A, Sx: a.Sx - b.Sx, Sy: a.Sy - b.Sy, Ixx: a.Ixx - b.Ixx, Iyy: a.Iyy - b.Iyy, Ixy: a.Ixy - b.Ixy });
const add = (a: M, b: M): M => ({ A: a.A + b.A, Sx: a.Sx + b.Sx, Sy: a.Sy + b.Sy, Ixx: a.Ixx + b.Ixx, Iyy: a.Iyy + b.Iyy, Ixy: a.Ixy + b.Ixy });
/** Rectangle [x0, x0+w] × [y0, y0+h]: ∫y² = w((y0+h)³ − y0³)/3 etc. (calculus, common practice, no source). */
function rectM(x0: number, y0: number, w: number, h: number): M {
  const x1 = x0 + w, y1 = y0 + h;
  return { A: w * h, Sx: (w * (y1 ** 2 - y0 ** 2)) / 2, Sy: (h * (x1 ** 2 - x0 ** 2)) / 2, Ixx: (w * (y1 ** 3 - y0 ** 3)) / 3, Iyy: (h * (x1 ** 3 - x0 ** 3)) / 3, Ixy: ((x1 ** 2 - x0 ** 2) * (y1 ** 2 - y0 ** 2)) / 4 };
}
/**
 * Circular segment of a circle (centre (cx, cy), radius r) cut off by the line y = cy + h (the part above
 * it, |h| < r), as sector minus triangle with half-angle α = acos(h/r) about the vertical axis through the
 * centre (handbook closed forms, from memory): sector ∫v² dA = r⁴(α + sinα cosα)/4, ∫u² dA = r⁴(α − sinα cosα)/4,
 * ∫v dA = 2r³ sinα/3; triangle (centre, (±c, h)), c = r sinα: ∫v² = c h³/2, ∫u² = c³ h/6, ∫v = 2 c h²/3.
 * Then moved to the origin with the parallel-axis rules (∫(cy+v)² = ∫v² + 2cy∫v + cy² A).
 */
function segmentAbove(cx: number, cy: number, r: number, h: number, below = false): M {
  const al = Math.acos(h / r), s = Math.sin(al), c = Math.cos(al);
  const half = r * s;
  const A = r * r * al - half * h;
  const Sv = (2 * r ** 3 * s) / 3 - (2 * half * h * h) / 3;
  const Ivv = (r ** 4 * (al + s * c)) / 4 - (half * h ** 3) / 2;
  const Iuu = (r ** 4 * (al - s * c)) / 4 - (half ** 3 * h) / 6;
  const sv = below ? -Sv : Sv; // the mirror image below y = cy − h
  return { A, Sx: cy * A + sv, Sy: cx * A, Ixx: Ivv + 2 * cy * sv + cy * cy * A, Iyy: Iuu + cx * cx * A, Ixy: cx * (sv + cy * A) };
}
function central(m: M) {
  const xc = m.Sy / m.A, yc = m.Sx / m.A;
  return { area: m.A, centroidX: xc, centroidY: yc, Ix: m.Ixx - m.A * yc * yc, Iy: m.Iyy - m.A * xc * xc, Ixy: m.Ixy - m.A * xc * yc };
}

describe('notch cut by a circle at the plate edge keeps the exact arc', () => {
  // plate 200 × 100 from the origin, circle of radius r centred below the top edge (y = 100) at depth d
  for (const [cx, r, d] of [[80, 15, 6], [80, 15, -4], [150.5, 22.25, 0.5], [45, 40, 13]]) {
    it(`circle r=${r} centred ${d} below the top edge at x=${cx}`, () => {
      const part = { units: 'mm', outline: { rectangle: { corner: [0, 0], size: [200, 100] } }, cutouts: [{ circle: { center: [cx, 100 - d], diameter: 2 * r } }] };
      const r0 = measureObj(part);
      // material removed = the circle minus its part above the top edge y = 100 (a line at h = d from the centre)
      const whole = segmentAbove(cx, 100 - d, r, -r); // h = −r: the whole circle
      const above = segmentAbove(cx, 100 - d, r, d); // part of the circle above y = 100
      const ref = central(sub(rectM(0, 0, 200, 100), sub(whole, above)));
      expectSectionClose(r0, ref, 200, `notch r=${r} d=${d}`);
      const outer = r0.geometry.part.regions[0].outer;
      expect(outer.segments.filter((s) => s.kind === 'arc').length).toBeGreaterThanOrEqual(1);
      expect(r0.geometry.part.regions[0].holes.length).toBe(0);
    });
  }
});

const plate = (extra: object) => ({ units: 'mm', outline: { rectangle: { corner: [0, 0], size: [200, 100] } }, ...extra });
const circ = (x: number, y: number, r: number) => ({ circle: { center: [x, y], diameter: 2 * r } });

describe('overlapping cut-outs, added material, open slots', () => {
  it('two overlapping circles inside the plate: rectangle − (two discs − lens)', () => {
    const r = 12, x = 70, y1 = 40, d = 9;
    const res = measureObj(plate({ cutouts: [circ(x, y1, r), circ(x, y1 + d, r)] }));
    const whole1 = segmentAbove(x, y1, r, -r), whole2 = segmentAbove(x, y1 + d, r, -r);
    // lens = part of circle 1 above the mid line + part of circle 2 below it (each at h = d/2 from its centre)
    const lens = add(segmentAbove(x, y1, r, d / 2), segmentAbove(x, y1 + d, r, d / 2, true));
    const ref = central(sub(rectM(0, 0, 200, 100), sub(add(whole1, whole2), lens)));
    expectSectionClose(res, ref, 200, 'overlapping discs');
    const hole = res.geometry.part.regions[0].holes;
    expect(hole.length).toBe(1);
    expect(hole[0].segments.every((s) => s.kind === 'arc' && (s.r === r))).toBe(true);
  });
  it('added boss on the top edge (union): rectangle + circle part above the edge', () => {
    for (const [cx, r, d] of [[50, 10, 0], [120, 18, 7.5]]) {
      const res = measureObj(plate({ add: [circ(cx, 100 - d, r)] }));
      const ref = central(add(rectM(0, 0, 200, 100), segmentAbove(cx, 100 - d, r, d)));
      expectSectionClose(res, ref, 200, `boss r=${r} d=${d}`);
    }
  });
  it('open slot from inside through the bottom edge: removes a rectangle and a half disc', () => {
    const res = measureObj(plate({ cutouts: [{ slot: { from: [50, 20], to: [50, -30], width: 10 } }] }));
    // inside the plate: the straight part x 45..55, y 0..20 and the round end above (50, 20)
    const removed = add(rectM(45, 0, 10, 20), segmentAbove(50, 20, 5, 0));
    expectSectionClose(res, central(sub(rectM(0, 0, 200, 100), removed)), 200, 'open slot');
  });
  it('a cut-out inside a bigger cut-out is absorbed', () => {
    const res = measureObj(plate({ cutouts: [circ(100, 50, 20), circ(104, 50, 5)] }));
    const ref = central(sub(rectM(0, 0, 200, 100), segmentAbove(100, 50, 20, -20)));
    expectSectionClose(res, ref, 200, 'nested cut-outs');
  });
});

describe('boolean results that cannot be measured are reported', () => {
  const bad = (o: object) => () => partFromObject(o);
  it('empty result', () => {
    expect(bad(plate({ cutouts: [{ rectangle: { corner: [-1, -1], size: [202, 102] } }] }))).toThrow(/^outline\.rectangle: the cut-outs cutouts\[0\]\.rectangle remove all the material/);
  });
  it('several pieces', () => {
    expect(bad(plate({ cutouts: [{ rectangle: { corner: [90, -5], size: [10, 110] } }] }))).toThrow(/^outline\.rectangle: cutouts\[0\]\.rectangle splits the plate into 2 separate pieces/);
  });
  it('a sliver thinner than the tolerance', () => {
    // leaves a strip 1e-5 wide along the top edge (tolerance 1e-6 × 200)
    expect(bad(plate({ cutouts: [{ rectangle: { corner: [-1, 50], size: [300, 50 - 1e-5] } }, circ(10, 10, 3)] })))
      .toThrow(/^cutouts\[0\]\.rectangle − outline\.rectangle: leaves a sliver about 0\.00001 wide near \(100, 100\)/);
  });
  it('a cut-out outside the plate removes nothing', () => {
    expect(bad(plate({ cutouts: [circ(300, 50, 5)] }))).toThrow(/^cutouts\[0\]\.circle: lies outside outline\.rectangle: it removes no material/);
  });
  it('a self-crossing operand is refused before clipping', () => {
    expect(bad(plate({ cutouts: [{ polygon: [[190, 90], [210, 110], [210, 90], [190, 110]] }] }))).toThrow(/^cutouts\[0\]\.polygon: crosses or touches itself/);
  });
  it('a failure inside the clipper is the method giving up (MethodError, exit 3), naming the operation and shapes', async () => {
    const { combineShapes } = await import('../../src/geometry/booleans.js');
    const { rectangleLoop, circleLoop } = await import('../../src/geometry/shapes.js');
    const engine = { name: 'failing', union: () => { throw new Error('Unable to complete output ring starting at [1, 2]'); }, difference: () => { throw new Error('Unable to complete output ring starting at [1, 2]'); } };
    const run = () => combineShapes({ outline: rectangleLoop([0, 0], [10, 10], 0, 'outline'), cutouts: [circleLoop([10, 5], 4, 'cutouts[0]')] }, { engine });
    expect(run).toThrow(MethodError);
    expect(run).toThrow(/^polygon clipper: the difference of outline with cutouts\[0\] failed \(Unable to complete output ring.*\); shapes that touch or nearly coincide/);
  });
});
