/** Grading toward vertices (src/mesh/grade.ts): conforming, same region, geometric sizes at the vertex. */
import { describe, expect, it } from 'vitest';
import { preparePart } from '../../src/analysis/measure.js';
import { buildMesh } from '../../src/mesh/build.js';
import { gradeTowardVertices } from '../../src/mesh/grade.js';
import type { Mesh } from '../../src/mesh/mesh.js';
import { partFromObject } from '../../src/read/partJson.js';

function areas(m: Mesh): Float64Array {
  const a = new Float64Array(m.count), c = m.coords, T = m.triangles;
  for (let t = 0; t < m.count; t++) {
    const [p, q, r] = [T[3 * t], T[3 * t + 1], T[3 * t + 2]];
    a[t] = ((c[2 * q] - c[2 * p]) * (c[2 * r + 1] - c[2 * p + 1]) - (c[2 * r] - c[2 * p]) * (c[2 * q + 1] - c[2 * p + 1])) / 2;
  }
  return a;
}

const OUTLINE = [[0, 0], [60, 0], [60, 10], [10, 10], [10, 40], [0, 40]];

function onOutline(x: number, y: number): boolean {
  for (let i = 0; i < OUTLINE.length; i++) {
    const [ax, ay] = OUTLINE[i], [bx, by] = OUTLINE[(i + 1) % OUTLINE.length];
    const t = Math.max(0, Math.min(1, ((x - ax) * (bx - ax) + (y - ay) * (by - ay)) / ((bx - ax) ** 2 + (by - ay) ** 2)));
    if (Math.hypot(x - ax - t * (bx - ax), y - ay - t * (by - ay)) < 1e-9) return true;
  }
  return false;
}

/** Every directed edge is used once, and an edge without its reverse lies on the outline: no hanging nodes. */
function conforming(m: Mesh): boolean {
  const seen = new Set<string>();
  const T = m.triangles, c = m.coords;
  for (let t = 0; t < m.count; t++) for (let e = 0; e < 3; e++) {
    const k = `${T[3 * t + e]},${T[3 * t + (e + 1) % 3]}`;
    if (seen.has(k)) return false;
    seen.add(k);
  }
  for (const k of seen) {
    const [a, b] = k.split(',').map(Number);
    if (seen.has(`${b},${a}`)) continue;
    const x = (c[2 * a] + c[2 * b]) / 2 + m.origin[0], y = (c[2 * a + 1] + c[2 * b + 1]) / 2 + m.origin[1];
    if (!onOutline(x, y)) return false;
  }
  return true;
}

describe('grading toward a re-entrant corner', () => {
  const L = preparePart(partFromObject({ outline: { polygon: OUTLINE } }));
  const { mesh } = buildMesh(L, { maxStraight: 10 });
  const c = mesh.coords;
  let v = -1;
  for (let i = 0; i < c.length / 2; i++) if (Math.hypot(c[2 * i] + mesh.origin[0] - 10, c[2 * i + 1] + mesh.origin[1] - 10) < 1e-9) v = i;

  it('keeps the area (900 mm²), stays conforming, and shrinks the triangles at the corner 4× in area per round', () => {
    expect(v).toBeGreaterThanOrEqual(0);
    const at = (m: Mesh) => { let s = Infinity; const a = areas(m); for (let t = 0; t < m.count; t++) if ([0, 1, 2].some((k) => m.triangles[3 * t + k] === v)) s = Math.min(s, a[t]); return s; };
    let prev = at(mesh);
    for (const r of [1, 2, 3, 4]) {
      const g = gradeTowardVertices(mesh, [v], [r]);
      const a = areas(g);
      expect(Math.abs(a.reduce((s, x) => s + x, 0) - 900)).toBeLessThan(1e-9);
      expect(Math.min(...a)).toBeGreaterThan(0);
      expect(conforming(g)).toBe(true);
      const small = at(g);
      expect(small / prev).toBeCloseTo(0.25, 12);
      prev = small;
    }
  });

  it('no vertex listed, or zero rounds: the mesh is returned unchanged', () => {
    expect(gradeTowardVertices(mesh, [], [])).toBe(mesh);
    expect(gradeTowardVertices(mesh, [v], [0])).toBe(mesh);
  });
});
