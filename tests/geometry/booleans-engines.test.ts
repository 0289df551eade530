/**
 * polygon-clipping (the clipper in use) against polyclip-ts (its maintained TypeScript successor, same API)
 * on seeded near-degenerate cases with known exact areas: nearly coincident edges, tangent and nearly
 * tangent circles, shared vertices. Each outcome is one of
 *   ok       — a valid region whose exact area matches the closed form to 1e-9 relative
 *   refused  — an InputError (sliver, pieces, grazing junction, touching loops, clipper failure turned into an InputError)
 *   clipper  — of the refusals, those where the clipper itself threw
 *   wrong    — a region accepted by validation whose area is off the closed form
 *   crash    — anything that is not an InputError (must never happen)
 * The figures are printed; the checks are that the engine in use never crashes or returns a wrong area.
 */
import { describe, it, expect } from 'vitest';
import * as polyclip from 'polyclip-ts';
import { type ClipEngine, POLYGON_CLIPPING, combineShapes } from '../../src/geometry/booleans.js';
import { circleLoop, polygonLoop, rectangleLoop } from '../../src/geometry/shapes.js';
import { type Loop, type Region, loopSignedArea } from '../../src/geometry/part.js';
import { validatePart } from '../../src/geometry/validate.js';
import { InputError } from '../../src/base/errors.js';
import { rng } from '../helpers.js';

const POLYCLIP_TS: ClipEngine = {
  name: 'polyclip-ts',
  union: (g, ...m) => polyclip.union(g, ...m) as never,
  difference: (g, ...m) => polyclip.difference(g, ...m) as never,
};

interface Case { label: string; outline: Loop; cutouts: Loop[]; add?: Loop[]; area: number; slack?: number; refuse?: boolean }

/** Area of the union of two discs of radius r with centres d apart (lens by inclusion–exclusion; from memory). */
function twoDiscs(r: number, d: number): number {
  if (d >= 2 * r) return 2 * Math.PI * r * r;
  const lens = 2 * r * r * Math.acos(d / (2 * r)) - (d / 2) * Math.sqrt(4 * r * r - d * d);
  return 2 * Math.PI * r * r - lens;
}
/** Circular segment beyond a line at distance h from the centre: r² acos(h/r) − h √(r² − h²) (from memory). */
const segment = (r: number, h: number) => (h >= r ? 0 : r * r * Math.acos(h / r) - h * Math.sqrt(r * r - h * h));

function makeCases(n: number, seed: number): Case[] {
  const R = rng(seed);
  const eps = () => [0, 1e-13, -1e-13, 1e-10, -1e-10, 1e-7, -1e-7, 1e-4, -1e-4][Math.floor(R() * 9)];
  const out: Case[] = [];
  for (let i = 0; i < n; i++) {
    const kind = i % 5;
    const W = 100, H = 60;
    const outline = rectangleLoop([0, 0], [W, H], 0, 'outline');
    if (kind === 0) {
      // notch rectangle whose side nearly coincides with the plate's right edge
      const e = eps() * W, y0 = 10 + 30 * R(), h = 5 + 10 * R(), w = 10 + 20 * R();
      const x1 = W + e;
      const cut = polygonLoop([[x1 - w, y0], [x1, y0], [x1, y0 + h], [x1 - w, y0 + h]], 'cutouts[0]');
      out.push({ label: `coincident edge e=${e}`, outline, cutouts: [cut], area: W * H - Math.min(w, w - e) * h });
    } else if (kind === 1) {
      // two nearly tangent circles
      const r = 5 + 10 * R(), e = eps() * r, cx = 30 + 20 * R(), cy = 30;
      const d = 2 * r + e;
      out.push({ label: `tangent circles e=${e}`, outline, cutouts: [circleLoop([cx, cy], 2 * r, 'cutouts[0]'), circleLoop([cx + d, cy], 2 * r, 'cutouts[1]')], area: W * H - twoDiscs(r, d) });
    } else if (kind === 2) {
      // triangle filling the plate's corner (two coincident edges), a second triangle sharing its vertex
      const a = 10 + 20 * R(), b = 10 + 20 * R(), e = eps() * W;
      const t1 = polygonLoop([[W, H], [W - a, H], [W, H - b]], 'cutouts[0]');
      const t2 = polygonLoop([[W - a + e, H], [W - a - 10, H - 15], [W - a + 5, H - 20]], 'cutouts[1]');
      // e ≤ 0: t2's top vertex touches the plate's edge or t1's corner: a point contact, to be refused;
      // e > 0: the vertex is inside t1's top edge, the two overlap properly (area not checked)
      out.push({ label: `shared vertices e=${e}`, outline, cutouts: [t1, t2], area: NaN, refuse: e <= 0 });
    } else if (kind === 3) {
      // a convex quadrilateral across the right edge and a copy with every vertex moved by about e
      const e = eps() * W, cx = W - 5 + 10 * R(), cy = 30, r = 8 + 10 * R();
      const angles = [0, 1, 2, 3].map((k) => (k + 0.2 + 0.6 * R()) * (Math.PI / 2)).sort((x, y) => x - y);
      const P: [number, number][] = angles.map((t) => [cx + r * Math.cos(t), cy + r * Math.sin(t)]);
      const Q: [number, number][] = P.map(([x, y]) => [x + e * (R() - 0.5), y + e * (R() - 0.5)]);
      // reference: P clipped to x ≤ W (Sutherland–Hodgman for one half-plane; common practice, no source), shoelace area
      const clipped: [number, number][] = [];
      for (let k = 0; k < 4; k++) {
        const [x0, y0] = P[k], [x1, y1] = P[(k + 1) % 4];
        if (x0 <= W) clipped.push([x0, y0]);
        if ((x0 <= W) !== (x1 <= W)) clipped.push([W, y0 + ((y1 - y0) * (W - x0)) / (x1 - x0)]);
      }
      let A = 0;
      for (let k = 0; k < clipped.length; k++) { const [x0, y0] = clipped[k], [x1, y1] = clipped[(k + 1) % clipped.length]; A += x0 * y1 - x1 * y0; }
      // the copy changes the area by at most about e × perimeter: judged at that tolerance
      out.push({ label: `jittered copies e=${e}`, outline, cutouts: [polygonLoop(P, 'cutouts[0]'), polygonLoop(Q, 'cutouts[1]')], area: W * H - Math.abs(A) / 2, slack: Math.abs(e) * 8 * r });
    } else {
      // circle nearly tangent to the bottom edge (inside or crossing)
      const r = 5 + 10 * R(), e = eps() * r, cx = 20 + 60 * R();
      out.push({ label: `circle on edge e=${e}`, outline, cutouts: [circleLoop([cx, r + e], 2 * r, 'cutouts[0]')], area: W * H - (Math.PI * r * r - segment(r, r + e)) });
    }
  }
  return out;
}

type Outcome = 'ok' | 'refused' | 'clipper' | 'wrong' | 'crash';
/** Offsets of at least 1e-7 relative count as clear configurations: refusing those would be a fault. */
const isClear = (c: Case) => { const m = /e=(\S+)/.exec(c.label); return m !== null && Math.abs(Number(m[1])) >= 1e-7 * 100; };
function regionArea(r: Region): number {
  return Math.abs(loopSignedArea(r.outer)) - r.holes.reduce((s, h) => s + Math.abs(loopSignedArea(h)), 0);
}
function run(c: Case, engine: ClipEngine): { outcome: Outcome; detail: string } {
  try {
    const region = combineShapes({ outline: c.outline, cutouts: c.cutouts, add: c.add }, { engine });
    validatePart({ name: 'result', units: 'mm', regions: [region] });
    const A = regionArea(region);
    if (c.refuse) return { outcome: 'wrong', detail: 'a point contact was accepted' };
    if (Number.isNaN(c.area)) return { outcome: 'ok', detail: '' };
    return Math.abs(A - c.area) <= 1e-9 * c.area + (c.slack ?? 0) ? { outcome: 'ok', detail: '' } : { outcome: 'wrong', detail: `${A} vs ${c.area}` };
  } catch (e) {
    if (e instanceof InputError) return { outcome: /polygon clipper/.test(e.message) ? 'clipper' : 'refused', detail: e.message };
    return { outcome: 'crash', detail: String(e) };
  }
}

describe('clipper engines on 500 seeded near-degenerate cases', () => {
  const cases = makeCases(500, 20260412);
  const tally: Record<string, Record<Outcome, number>> = {};
  const samples: Record<string, string[]> = {};
  for (const engine of [POLYGON_CLIPPING, POLYCLIP_TS]) {
    it(engine.name, () => {
      const t: Record<Outcome, number> = { ok: 0, refused: 0, clipper: 0, wrong: 0, crash: 0 };
      let clear = 0, clearRefused = 0;
      const s: string[] = [];
      const t0 = performance.now();
      for (const c of cases) {
        const r = run(c, engine);
        t[r.outcome]++;
        if (c.refuse) { if (r.outcome === 'refused') t.ok++, t.refused--; }
        else if (isClear(c)) { clear++; if (r.outcome !== 'ok') clearRefused++; }
        if (r.outcome !== 'ok' && (r.outcome === 'wrong' || (!c.refuse && isClear(c))) && s.length < 8) s.push(`${r.outcome} ${c.label}: ${r.detail.slice(0, 160)}`);
      }
      const ms = performance.now() - t0;
      tally[engine.name] = t;
      samples[engine.name] = s;
      console.log(`${engine.name}: ${JSON.stringify(t)}; clear cases ${clear}, of them not ok ${clearRefused}; ${ms.toFixed(0)} ms\n  ${s.join('\n  ')}`);
      if (engine === POLYGON_CLIPPING) {
        expect(t.crash).toBe(0);
        expect(t.wrong).toBe(0);
      }
    }, 120000);
  }
});

describe('clipper engines on raw near-coincident polygons (no exact-curve layer)', () => {
  // 500 seeded cases: a random convex polygon and 2–4 copies with every vertex moved by 1e-15…1e-9 of its
  // size (and sometimes a shared vertex), then the union and the difference. Counts throws and results.
  const R = rng(7);
  const cases: [number, number][][][] = [];
  for (let i = 0; i < 500; i++) {
    const n = 3 + Math.floor(R() * 6), r = 1 + 100 * R(), cx = 1000 * R(), cy = 1000 * R();
    const ang = Array.from({ length: n }, () => R() * 2 * Math.PI).sort((a, b) => a - b);
    const P: [number, number][] = ang.map((t) => [cx + r * Math.cos(t), cy + r * Math.sin(t)]);
    const jitter = r * 10 ** (-15 + 6 * R());
    const polys = [P];
    for (let k = 0, m = 2 + Math.floor(R() * 3); k < m; k++) {
      polys.push(P.map(([x, y], j) => (j === 0 && R() < 0.3 ? [x, y] : [x + jitter * (R() - 0.5), y + jitter * (R() - 0.5)])));
    }
    cases.push(polys);
  }
  for (const engine of [POLYGON_CLIPPING, POLYCLIP_TS]) {
    it(engine.name, () => {
      let threw = 0, empty = 0, fine = 0;
      const messages = new Map<string, number>();
      const t0 = performance.now();
      for (const polys of cases) {
        for (const op of ['union', 'difference'] as const) {
          try {
            const [first, ...rest] = polys.map((p) => [[...p, p[0]]]);
            const res = engine[op](first as never, ...(rest as never[]));
            if (res.length === 0) empty++; else fine++;
          } catch (e) {
            threw++;
            const m = String((e as Error).message ?? e).replace(/\[.*$/, '').replace(/#\d+/, '#n').slice(0, 60);
            messages.set(m, (messages.get(m) ?? 0) + 1);
          }
        }
      }
      console.log(`${engine.name} raw: ${fine} results, ${empty} empty, ${threw} threw ${JSON.stringify([...messages])} in ${(performance.now() - t0).toFixed(0)} ms`);
      expect(fine + empty + threw).toBe(1000);
    }, 120000);
  }
});
