/**
 * Property-based checks (fast-check, seeded, bounded runs) on random valid plates with holes
 * (tests/hardening/plates.ts). The facts checked are textbook mechanics of materials (common practice, no
 * source): centroidal quantities do not change under translation; area, I1, I2 and Ip do not change under
 * rotation; area and moments add over a partition of the plate; the parallel-axis theorem; area scales
 * with s² and second moments with s⁴; and the mesh-refinement promise of DESIGN.md (an exact result does
 * not move with refinement; a refined result stays within the coarse estimate).
 * Tolerances: the two results' own error estimates plus a round-off allowance of 1e-9 relative to the
 * quantity's scale (area, Ip, or the plate size for lengths).
 */
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import type { SectionResult } from '../../src/analysis/measure.js';
import { measureObj } from '../helpers.js';
import { type P, type PlateObj, buildPlate, mapPlate, plateSpec } from './plates.js';

const SEED = 20261202;
const RUNS = 100;
/** Counts of runs per property, printed at the end (for the report). */
export const runCounts: Record<string, number> = {};

type Q = SectionResult['quantities'];
const AREA_KEYS = ['area'] as const;

function close(a: { value: number; error: number }, b: { value: number; error: number }, scale: number, slack = 1e-9): boolean {
  return Math.abs(a.value - b.value) <= a.error + b.error + slack * scale;
}

function check(name: string, prop: fc.IProperty<any>, runs = RUNS): void {
  const details = fc.check(prop, { seed: SEED, numRuns: runs, endOnFailure: !!process.env.PW_NOSHRINK });
  runCounts[name] = details.numRuns;
  if (details.failed) {
    throw new Error(`${name}: property failed (seed ${SEED}, path ${details.counterexamplePath}) on ${JSON.stringify(details.counterexample)}\n${details.errorInstance instanceof Error ? details.errorInstance.message : String(details.errorInstance)}`);
  }
  // the precondition may not throw away most cases
  expect(details.numRuns, name).toBe(runs);
  expect(details.numSkips, `${name}: skipped cases`).toBeLessThan(runs);
}

/** Both results' quantities agree within estimates (+ round-off) for `keys`. */
function agree(a: Q, b: Q, keys: readonly (keyof Q)[], note: string): void {
  const size = 500;
  for (const k of keys) {
    const scale = k === 'area' ? a.area.value : ['centroidX', 'centroidY'].includes(k) ? size : a.Ip.value;
    expect(close(a[k], b[k], scale), `${note} ${k}: ${a[k].value} ± ${a[k].error} vs ${b[k].value} ± ${b[k].error}`).toBe(true);
  }
}

const shiftArb = fc.tuple(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }));

describe('properties of random plates with holes (fast-check)', () => {
  afterAll(() => { console.log(`hardening properties (seed ${SEED}): ${Object.entries(runCounts).map(([k, n]) => `${k} ${n}`).join(', ')} runs`); });
  it('translation leaves centroidal quantities unchanged and moves the centroid with the part', () => {
    check('translation', fc.property(plateSpec, shiftArb, (spec, [dx, dy]) => {
      const obj = buildPlate(spec);
      const a = measureObj(obj).quantities;
      const b = measureObj(mapPlate(obj, ([x, y]) => [x + dx, y + dy])).quantities;
      agree(a, b, ['area', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'Ip', 'perimeter'], 'translated');
      expect(close({ value: a.centroidX.value + dx, error: a.centroidX.error }, b.centroidX, 500 + Math.abs(dx))).toBe(true);
      expect(close({ value: a.centroidY.value + dy, error: a.centroidY.error }, b.centroidY, 500 + Math.abs(dy))).toBe(true);
    }));
  });

  it('rotation leaves area, I1, I2, Ip and perimeter unchanged', () => {
    check('rotation', fc.property(plateSpec, fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (spec, t) => {
      const obj = buildPlate(spec);
      const c = Math.cos(t), s = Math.sin(t);
      const a = measureObj(obj).quantities;
      const b = measureObj(mapPlate(obj, ([x, y]) => [c * x - s * y, s * x + c * y])).quantities;
      agree(a, b, ['area', 'I1', 'I2', 'Ip', 'perimeter'], `rotated ${t}`);
    }));
  });

  it('parallel-axis theorem: origin moments of a moved plate = centroidal moments + A·d²', () => {
    check('parallel axis', fc.property(plateSpec, shiftArb, (spec, [dx, dy]) => {
      const obj = buildPlate(spec);
      const c = measureObj(obj).quantities;
      const m = measureObj(mapPlate(obj, ([x, y]) => [x + dx, y + dy])).quantities;
      const A = c.area.value, xc = c.centroidX.value + dx, yc = c.centroidY.value + dy;
      const scale = m.IxOrigin.value + m.IyOrigin.value;
      // error of A·d² from the area's and centroid's estimates
      const eShift = (d: number, ed: number) => c.area.error * d * d + 2 * A * Math.abs(d) * ed;
      expect(Math.abs(m.IxOrigin.value - (c.Ix.value + A * yc * yc))).toBeLessThanOrEqual(m.IxOrigin.error + c.Ix.error + eShift(yc, c.centroidY.error) + 1e-9 * scale);
      expect(Math.abs(m.IyOrigin.value - (c.Iy.value + A * xc * xc))).toBeLessThanOrEqual(m.IyOrigin.error + c.Iy.error + eShift(xc, c.centroidX.error) + 1e-9 * scale);
      expect(Math.abs(m.IxyOrigin.value - (c.Ixy.value + A * xc * yc))).toBeLessThanOrEqual(m.IxyOrigin.error + c.Ixy.error + c.area.error * Math.abs(xc * yc) + A * (Math.abs(xc) * c.centroidY.error + Math.abs(yc) * c.centroidX.error) + 1e-9 * scale);
    }));
  });

  it('scaling by s: area × s², centroid × s, second moments × s⁴', () => {
    check('scaling', fc.property(plateSpec, fc.double({ min: 0.01, max: 100, noNaN: true }), (spec, k) => {
      const obj = buildPlate(spec);
      const a = measureObj(obj).quantities;
      const b = measureObj(mapPlate(obj, ([x, y]) => [k * x, k * y], k)).quantities;
      const sc = (q: { value: number; error: number }, p: number) => ({ value: q.value * k ** p, error: q.error * k ** p });
      for (const [key, p] of [['area', 2], ['centroidX', 1], ['centroidY', 1], ['Ix', 4], ['Iy', 4], ['Ixy', 4], ['I1', 4], ['I2', 4], ['perimeter', 1]] as const) {
        const scale = p === 2 ? b.area.value : p === 1 ? 500 * k : b.Ip.value;
        expect(close(sc(a[key], p), b[key], scale), `${key} at s = ${k}: ${a[key].value}·s^${p} vs ${b[key].value}`).toBe(true);
      }
    }));
  });

  it('additivity: the two halves of a plate cut by a line through the origin add up to the whole', () => {
    // each half is the whole plate with the other half-plane added as a cut-out (the tool's own booleans)
    const halfPlane = (t: number, side: 1 | -1): P[] => {
      const c = Math.cos(t), s = Math.sin(t), L = 5000;
      // square of side 2L lying on one side of the line through the origin in direction t
      return [[0, 0], [2, 0], [2, 1], [0, 1]].map(([u, v]) => [c * (u - 1) * L - s * side * v * L, s * (u - 1) * L + c * side * v * L] as P);
    };
    check('additivity', fc.property(plateSpec, fc.double({ min: 0, max: Math.PI, noNaN: true }), (spec, t) => {
      const obj = buildPlate(spec);
      // keep the cut line 0.5 mm clear of every vertex, arc centre and tangency: a line through a vertex or
      // grazing an arc is a degenerate touch that the booleans refuse on purpose (slivers, clipper failures)
      const c = Math.cos(t), s = Math.sin(t);
      const dist = (p: P) => -s * p[0] + c * p[1];
      const points: P[] = [], circles: [P, number][] = [];
      for (const sh of [obj.outline, ...obj.cutouts]) {
        if ('circle' in sh) { points.push(sh.circle.center); circles.push([sh.circle.center, sh.circle.diameter / 2]); }
        else if ('polygon' in sh) points.push(...sh.polygon);
        else if ('slot' in sh) { points.push(sh.slot.from, sh.slot.to); circles.push([sh.slot.from, sh.slot.width / 2], [sh.slot.to, sh.slot.width / 2]); }
        else {
          points.push(sh.path.start);
          for (const g of sh.path.segments) {
            points.push(g.to);
            if (g.center) { points.push(g.center); circles.push([g.center, Math.hypot(g.to[0] - g.center[0], g.to[1] - g.center[1])]); }
          }
        }
      }
      fc.pre(points.every((p) => Math.abs(dist(p)) > 0.5) && circles.every(([q, r]) => Math.abs(Math.abs(dist(q)) - r) > 0.5));
      const whole = measureObj(obj).quantities;
      const halves = ([1, -1] as const).map((side) => measureObj({ ...obj, cutouts: [...obj.cutouts, { polygon: halfPlane(t, side) }] } as PlateObj).quantities);
      const raw = (q: Q) => [
        { value: q.area.value, error: q.area.error },
        { value: q.area.value * q.centroidX.value, error: q.area.error * Math.abs(q.centroidX.value) + q.area.value * q.centroidX.error },
        { value: q.area.value * q.centroidY.value, error: q.area.error * Math.abs(q.centroidY.value) + q.area.value * q.centroidY.error },
        q.IyOrigin, q.IxyOrigin, q.IxOrigin,
      ];
      const w = raw(whole), h0 = raw(halves[0]), h1 = raw(halves[1]);
      const scales = [whole.area.value, whole.area.value * 200, whole.area.value * 200, whole.IyOrigin.value + whole.IxOrigin.value, whole.IyOrigin.value + whole.IxOrigin.value, whole.IyOrigin.value + whole.IxOrigin.value];
      ['A', '∫x', '∫y', '∫x²', '∫xy', '∫y²'].forEach((name, i) => {
        const sum = h0[i].value + h1[i].value;
        expect(Math.abs(sum - w[i].value), `${name}: halves ${h0[i].value} + ${h1[i].value} vs whole ${w[i].value}`).toBeLessThanOrEqual(w[i].error + h0[i].error + h1[i].error + 1e-9 * scales[i]);
      });
    }), 50);
  });

  it('straight-edged parts: the mesh result does not move with refinement (levels 1 and 3) and equals the exact boundary formula', () => {
    check('refinement, straight edges', fc.property(plateSpec, (spec) => {
      const obj = buildPlate(spec, true);
      const l1 = measureObj(obj, { method: 'mesh', levels: 1 }).quantities;
      const l3 = measureObj(obj, { method: 'mesh', levels: 3 }).quantities;
      const ex = measureObj(obj, { method: 'auto' }).quantities;
      for (const k of ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy', 'I1', 'I2'] as const) {
        const scale = k === 'area' ? ex.area.value : k.startsWith('centroid') ? 200 : ex.Ip.value;
        // round-off only: 1e-11 of the scale
        expect(Math.abs(l1[k].value - l3[k].value), `${k} levels 1 vs 3`).toBeLessThanOrEqual(1e-11 * scale);
        expect(Math.abs(l3[k].value - ex[k].value), `${k} mesh vs boundary`).toBeLessThanOrEqual(1e-11 * scale);
      }
    }), 60);
  });

  it('curved parts: the refined result (levels 3) stays within the levels-1 estimate', () => {
    check('refinement, curved', fc.property(plateSpec, (spec) => {
      const obj = buildPlate({ ...spec, star: false });
      const l1 = measureObj(obj, { method: 'mesh', levels: 1 }).quantities;
      const l3 = measureObj(obj, { method: 'mesh', levels: 3 }).quantities;
      for (const k of ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'Ip'] as const) {
        const scale = k === 'area' ? l1.area.value : k.startsWith('centroid') ? 500 : l1.Ip.value;
        expect(Math.abs(l1[k].value - l3[k].value), `${k}: ${l1[k].value} ± ${l1[k].error} vs ${l3[k].value}`).toBeLessThanOrEqual(l1[k].error + 1e-12 * scale);
      }
    }), 50);
  });
});
