import { describe, expect, it } from 'vitest';
import type { ArcSegment } from '../../src/geometry/segments.js';
import type { Mesh } from '../../src/mesh/mesh.js';
import { refineUniform } from '../../src/mesh/refine.js';
import { integrate } from '../../src/quadrature/integrate.js';

/**
 * One curved triangle: apex P0 and an edge on a unit-circle arc from angle a0 to a1.
 * Closed forms (circular segment; handbook geometry, from memory): a segment of angle θ on a circle of
 * radius R has area R²(θ − sin θ)/2 and its centroid on the bisector at 4R sin³(θ/2) / (3(θ − sin θ))
 * from the centre.
 */
function oneTriangle(apex: [number, number], a0: number, a1: number): Mesh {
  const arc: ArcSegment = { kind: 'arc', cx: 0, cy: 0, r: 1, a0, a1 };
  const p1: [number, number] = [Math.cos(a0), Math.sin(a0)];
  const p2: [number, number] = [Math.cos(a1), Math.sin(a1)];
  // order vertices counter-clockwise: apex, then the arc end that makes a positive area
  const det = (p1[0] - apex[0]) * (p2[1] - apex[1]) - (p2[0] - apex[0]) * (p1[1] - apex[1]);
  const [q1, q2, s0, s1] = det > 0 ? [p1, p2, 0, 1] : [p2, p1, 1, 0];
  return {
    origin: [0, 0],
    coords: Float64Array.from([...apex, ...q1, ...q2]),
    triangles: Uint32Array.from([0, 1, 2]),
    edgeCurve: Int32Array.from([-1, 0, -1]),
    curveSeg: Uint32Array.from([0]),
    curveS0: Float64Array.from([s0]),
    curveS1: Float64Array.from([s1]),
    segments: [arc],
    count: 1,
    level: 0,
  };
}

function closedForm(apex: [number, number], a0: number, a1: number) {
  const p1 = [Math.cos(a0), Math.sin(a0)], p2 = [Math.cos(a1), Math.sin(a1)];
  const triA = Math.abs((p1[0] - apex[0]) * (p2[1] - apex[1]) - (p2[0] - apex[0]) * (p1[1] - apex[1])) / 2;
  const triX = triA * (apex[0] + p1[0] + p2[0]) / 3;
  const th = a1 - a0;
  const segA = (th - Math.sin(th)) / 2;
  const dist = 4 * Math.sin(th / 2) ** 3 / (3 * (th - Math.sin(th)));
  const mid = (a0 + a1) / 2;
  const segX = segA * dist * Math.cos(mid);
  // apex outside the circle, beyond the chord: the arc bulges into the triangle -> subtract the segment
  const apexOut = Math.hypot(apex[0], apex[1]) > 1;
  const sgn = apexOut ? -1 : 1;
  return { area: triA + sgn * segA, mx: triX + sgn * segX };
}

describe('curved triangle map (blending map with smooth Jacobian)', () => {
  it('90° unit arc, apex (2.2, 0.7): area to 1e-13 with degree 10, first moment to 1e-13 with degree 12 (closed form: triangle minus circular segment)', () => {
    const apex: [number, number] = [2.2, 0.7];
    const m = oneTriangle(apex, 0, Math.PI / 2);
    const cf = closedForm(apex, 0, Math.PI / 2);
    // measured: area 1.6e-14 (degree 10); x-moment 7.2e-12 (degree 10), 2.6e-14 (degree 12)
    expect(Math.abs(integrate(m, { degree: 10 }).sums[0] - cf.area) / cf.area).toBeLessThan(1e-13);
    expect(Math.abs(integrate(m, { degree: 12 }).sums[1] - cf.mx) / Math.abs(cf.mx)).toBeLessThan(1e-13);
  });

  it('converges spectrally with the rule degree on the same triangle (degree 8 error > degree 10 error > degree 19 error, all small)', () => {
    const apex: [number, number] = [2.2, 0.7];
    const m = oneTriangle(apex, 0, Math.PI / 2);
    const cf = closedForm(apex, 0, Math.PI / 2);
    const err = (d: number) => Math.abs(integrate(m, { degree: d }).sums[0] - cf.area) / cf.area;
    expect(err(4)).toBeGreaterThan(err(8));
    expect(err(8)).toBeLessThan(1e-9);
    expect(err(19)).toBeLessThan(1e-14);
  });

  it('a 45° arc with the apex inside the circle (segment added) reaches 1e-14 with degree 10', () => {
    const apex: [number, number] = [0.3, 0.1];
    const m = oneTriangle(apex, 0.2, 0.2 + Math.PI / 4);
    const cf = closedForm(apex, 0.2, 0.2 + Math.PI / 4);
    const r = integrate(m, { degree: 10 });
    expect(Math.abs(r.sums[0] - cf.area) / cf.area).toBeLessThan(1e-14);
    expect(Math.abs(r.sums[1] - cf.mx) / Math.abs(cf.mx)).toBeLessThan(1e-13);
  });

  it('uniform refinement splits the curved edge on the arc and keeps the exact region', () => {
    const apex: [number, number] = [2.2, 0.7];
    let m = oneTriangle(apex, 0, Math.PI / 2);
    const cf = closedForm(apex, 0, Math.PI / 2);
    for (let k = 0; k < 3; k++) m = refineUniform(m);
    expect(m.triangles.length / 3).toBe(64);
    // every curved edge's end points lie on the unit circle, and there are 8 curved edges
    let curved = 0;
    for (let t = 0; t < m.triangles.length / 3; t++) for (let k = 0; k < 3; k++) {
      if (m.edgeCurve[3 * t + k] < 0) continue;
      curved++;
      for (const v of [m.triangles[3 * t + k], m.triangles[3 * t + (k + 1) % 3]]) {
        expect(Math.abs(Math.hypot(m.coords[2 * v], m.coords[2 * v + 1]) - 1)).toBeLessThan(1e-15);
      }
    }
    expect(curved).toBe(8);
    const r = integrate(m, { degree: 6 });
    expect(Math.abs(r.sums[0] - cf.area) / cf.area).toBeLessThan(1e-13);
    expect(r.minJacobianRatio).toBeGreaterThan(0);
  });
});

describe('regressions', () => {
  it('a loop of one full-turn elliptical arc meshes (the chord that wraps to the start ends at t = 1)', async () => {
    const { measureSection } = await import('../../src/analysis/measure.js');
    const part = { name: 'e', units: 'mm' as const, regions: [{ outer: { segments: [{ kind: 'ellipticalArc' as const, cx: 3, cy: -2, rx: 50, ry: 20, phi: 0.3, t0: 0, t1: 2 * Math.PI }] }, holes: [] }] };
    const r = measureSection(part);
    // ellipse area πab (closed form)
    expect(Math.abs(r.quantities.area.value - Math.PI * 1000) / (Math.PI * 1000)).toBeLessThan(1e-13);
    expect(r.method.chordSplits).toBe(0);
  });
});
