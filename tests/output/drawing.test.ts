/**
 * The SVG drawing itself: well-formed XML, an outline that reads back to the part's exact area, the
 * centroid marker where the centroid is, y pointing up, curves drawn as curve commands.
 */
import { describe, expect, it } from 'vitest';
import { measureSection } from '../../src/analysis/measure.js';
import { type Loop, type Part, loopSignedArea } from '../../src/geometry/part.js';
import { circleLoop, rectangleLoop } from '../../src/geometry/shapes.js';
import type { Segment } from '../../src/geometry/segments.js';
import { readSvg } from '../../src/read/svg.js';
import { type XmlElement, parseXml } from '../../src/read/xml.js';
import { drawPart, drawSheet, roundLength } from '../../src/output/draw.js';
import { unmap } from '../../src/output/pathData.js';
import { measureObj } from '../helpers.js';

function all(el: XmlElement, pred: (e: XmlElement) => boolean, out: XmlElement[] = []): XmlElement[] {
  if (pred(el)) out.push(el);
  for (const c of el.children) all(c, pred, out);
  return out;
}
const byRole = (root: XmlElement, role: string) => all(root, (e) => e.attrs['data-role'] === role);

/** Net area of a path's `d` read back through the project's SVG reader (user units as mm, no scaling). */
function pathArea(d: string): number {
  const parts = readSvg(`<svg xmlns="http://www.w3.org/2000/svg"><path d="${d}"/></svg>`, { units: 'mm' });
  let a = 0;
  for (const p of parts) for (const r of p.regions) { a += loopSignedArea(r.outer); for (const h of r.holes) a += loopSignedArea(h); }
  return a;
}

async function drawn(part: Part) {
  const r = measureSection(part);
  const svg = await drawPart(r);
  const root = parseXml(svg, {}, 'drawing');
  const k = Number(root.attrs['data-scale']), ox = Number(root.attrs['data-ox']), oy = Number(root.attrs['data-oy']);
  return { r, svg, root, map: { k, ox, oy } };
}

const line = (x0: number, y0: number, x1: number, y1: number): Segment => ({ kind: 'line', x0, y0, x1, y1 });
const part = (outer: Loop, holes: Loop[] = []): Part => ({ name: 'test part', units: 'mm', regions: [{ outer, holes }] });

describe('drawing of a plate with circular cut-outs (closed forms)', () => {
  // 300 × 200 plate, corner radius 12, three holes of radius 15, 10 and 25 at asymmetric places.
  // Area: w·h − (4 − π)r² − Σπrᵢ² (rounded rectangle and circle areas, common practice, no source).
  const holes: [number, number, number][] = [[60, 150, 15], [240, 40, 10], [200, 120, 25]];
  const obj = {
    part: 'closed-form plate', units: 'mm',
    outline: { rectangle: { corner: [0, 0], size: [300, 200], cornerRadius: 12 } },
    cutouts: holes.map(([x, y, r]) => ({ circle: { center: [x, y], diameter: 2 * r } })),
  };
  const exactArea = 300 * 200 - (4 - Math.PI) * 144 - holes.reduce((s, [, , r]) => s + Math.PI * r * r, 0);

  it('is well-formed XML with an <svg> root, one material path and one outline per loop', async () => {
    const r = measureObj(obj);
    const svg = await drawPart(r);
    const root = parseXml(svg, {}, 'drawing');
    expect(root.name).toBe('svg');
    expect(byRole(root, 'material')).toHaveLength(1);
    expect(all(root, (e) => e.attrs['data-loop'] === 'cutout')).toHaveLength(3);
    expect(all(root, (e) => e.attrs['data-loop'] === 'outer')).toHaveLength(1);
  });

  it('the material path reads back to the exact area (1e-9), arcs as A commands, no polyline', async () => {
    const r = measureObj(obj);
    const root = parseXml(await drawPart(r), {}, 'drawing');
    const k = Number(root.attrs['data-scale']);
    const d = byRole(root, 'material')[0].attrs.d;
    expect(Math.abs(pathArea(d) / (k * k) - exactArea) / exactArea).toBeLessThan(1e-9);
    // 4 straight sides: exactly 4 L commands; every curve is an A
    expect((d.match(/L/g) ?? []).length).toBe(4);
    expect((d.match(/A/g) ?? []).length).toBeGreaterThanOrEqual(4 + 3 * 2);
  });

  it('the centroid marker sits at the closed-form centroid', async () => {
    // centroid of the composite: Σ Aᵢ xᵢ / Σ Aᵢ with holes negative; the rounded corners are symmetric about
    // the rectangle's centre, so the plate without holes has its centroid at (150, 100) (common practice, no source)
    const plate = 300 * 200 - (4 - Math.PI) * 144;
    let ax = plate * 150, ay = plate * 100, a = plate;
    for (const [x, y, r] of holes) { const h = Math.PI * r * r; ax -= h * x; ay -= h * y; a -= h; }
    const r = measureObj(obj);
    const root = parseXml(await drawPart(r), {}, 'drawing');
    const mk = byRole(root, 'centroid')[0];
    const m = /^translate\(([^ ]+) ([^)]+)\)$/.exec(mk.attrs.transform)!;
    const [x, y] = unmap({ k: Number(root.attrs['data-scale']), ox: Number(root.attrs['data-ox']), oy: Number(root.attrs['data-oy']) }, Number(m[1]), Number(m[2]));
    expect(Math.abs(x - ax / a)).toBeLessThan(1e-9 * 300);
    expect(Math.abs(y - ay / a)).toBeLessThan(1e-9 * 300);
    expect(Number(mk.attrs['data-x'])).toBe(r.quantities.centroidX.value);
    expect(Number(mk.attrs['data-y'])).toBe(r.quantities.centroidY.value);
  });

  it('y points up: the hole high in the part is drawn nearer the top of the drawing', async () => {
    const r = measureObj(obj);
    const root = parseXml(await drawPart(r), {}, 'drawing');
    const cut = all(root, (e) => e.attrs['data-loop'] === 'cutout');
    // each hole's drawn points: its centre is the mean of the extreme Y values of its path
    const centreY = (d: string) => {
      const ys = [...d.matchAll(/(-?[\d.]+(?:e-?\d+)?) (-?[\d.]+(?:e-?\d+)?)(?=[AZLMQC]|$)/g)].map((mm) => Number(mm[2]));
      return (Math.min(...ys) + Math.max(...ys)) / 2;
    };
    const ys = cut.map((c) => centreY(c.attrs.d));
    // holes in part y order: 40 (index 1), 120 (index 2), 150 (index 0) → drawing Y decreasing
    expect(ys[1]).toBeGreaterThan(ys[2]);
    expect(ys[2]).toBeGreaterThan(ys[0]);
    // and the title strip is above everything: the part's top edge is below the strip
    const X = Number(root.attrs['data-oy']) - Number(root.attrs['data-scale']) * 200;
    expect(X).toBeGreaterThan(74);
  });

  it('the scale bar is a round length and the bounding box labels give width and height', async () => {
    const r = measureObj(obj);
    const root = parseXml(await drawPart(r), {}, 'drawing');
    const len = Number(byRole(root, 'scale-bar')[0].attrs['data-length']);
    expect([1, 2, 5]).toContain(len / 10 ** Math.floor(Math.log10(len)));
    expect(roundLength(120)).toBe(100);
    expect(roundLength(0.031)).toBe(0.02);
    expect(byRole(root, 'width-label')).toHaveLength(1);
    expect(byRole(root, 'height-label')).toHaveLength(1);
  });
});

describe('curves other than circles are drawn with their own commands', () => {
  it('a rotated elliptical cut-out: A with rotation; area and product moment read back (1e-9)', async () => {
    // Ellipse a = 40, b = 15 rotated 30°, cut from a 200 × 120 rectangle centred on it. Area: 200·120 − πab.
    // The rectangle's centroidal product moment is 0, so the plate's is −Ixy(ellipse), with, for a shape
    // rotated by φ, Ixy = sin(2φ)/2 · (Iv − Iu), Iv = πa³b/4, Iu = πab³/4 (rotation of axes, common practice, no source).
    const a = 40, b = 15, phi = Math.PI / 6;
    // four quarter arcs (a single full-turn elliptical segment currently trips the default triangulator)
    const ell: Loop = { segments: [0, 1, 2, 3].map((i): Segment => ({ kind: 'ellipticalArc', cx: 70, cy: 50, rx: a, ry: b, phi, t0: (i * Math.PI) / 2, t1: ((i + 1) * Math.PI) / 2 })) };
    const { root, map } = await drawn(part(rectangleLoop([-30, -10], [200, 120]), [ell]));
    const d = byRole(root, 'material')[0].attrs.d;
    const rots = [...d.matchAll(/A[\d.]+ [\d.]+ (-?[\d.e-]+) 0 [01] /g)].map((m) => Number(m[1]));
    expect(rots).toHaveLength(4);
    for (const r of rots) expect(Math.abs(r + 30)).toBeLessThan(1e-12); // drawn y-down: +30° becomes −30°
    const exact = 200 * 120 - Math.PI * a * b;
    expect(Math.abs(pathArea(d) / map.k ** 2 - exact) / exact).toBeLessThan(1e-9);
    const back = readSvg(`<svg xmlns="http://www.w3.org/2000/svg"><path d="${d}"/></svg>`, { units: 'mm' })[0];
    const rb = measureSection(back);
    const ixy = -(Math.sin(2 * phi) / 2) * (Math.PI * a ** 3 * b / 4 - Math.PI * a * b ** 3 / 4);
    // readSvg flips y back, so the read-back part is the drawn part scaled by k (moments scale by k⁴)
    expect(Math.abs(rb.quantities.Ixy.value / map.k ** 4 - ixy) / Math.abs(ixy)).toBeLessThan(1e-9);
  });

  it('a quadratic Bézier edge: Q command; area = rectangle + 2/3 of the control triangle (Archimedes, from memory)', async () => {
    // plate 0..100 × 0..50 whose top edge is a parabola through (100, 50) → (0, 50) with control (50, 90):
    // the parabolic segment between chord and curve has 2/3 of the control triangle's area (40·100/2·2/3).
    const outer: Loop = { segments: [line(0, 0, 100, 0), line(100, 0, 100, 50), { kind: 'quadratic', x0: 100, y0: 50, x1: 50, y1: 90, x2: 0, y2: 50 }, line(0, 50, 0, 0)] };
    const hole = circleLoop([30, 25], 16);
    const { root, map, r } = await drawn(part(outer, [hole]));
    const d = byRole(root, 'material')[0].attrs.d;
    expect(d).toMatch(/Q/);
    const exact = 100 * 50 + (2 / 3) * (100 * 40) / 2 - Math.PI * 64;
    expect(Math.abs(pathArea(d) / map.k ** 2 - exact) / exact).toBeLessThan(1e-9);
    expect(Math.abs(r.quantities.area.value - exact) / exact).toBeLessThan(1e-9);
  });

  it('a cubic Bézier edge: C command; area from the exact cubic area formula read back', async () => {
    // Cubic from (100, 0) over the top to (0, 0), closed by the chord on y = 0. Enclosed area = −∫ y dx along
    // the cubic (the chord adds nothing). y(t) is cubic and x'(t) quadratic, so y·x' has degree 5 and the
    // 3-point Gauss–Legendre rule is exact for it (Abramowitz & Stegun 25.4.29): an independent exact value.
    const P = [[100, 0], [70, 60], [30, 60], [0, 0]];
    const outer: Loop = { segments: [{ kind: 'cubic', x0: 100, y0: 0, x1: 70, y1: 60, x2: 30, y2: 60, x3: 0, y3: 0 }, line(0, 0, 100, 0)] };
    const { root, map } = await drawn(part(outer));
    const d = byRole(root, 'material')[0].attrs.d;
    expect(d).toMatch(/C/);
    const B = (t: number, i: 0 | 1) => (1 - t) ** 3 * P[0][i] + 3 * (1 - t) ** 2 * t * P[1][i] + 3 * (1 - t) * t * t * P[2][i] + t ** 3 * P[3][i];
    const dB = (t: number, i: 0 | 1) => 3 * (1 - t) ** 2 * (P[1][i] - P[0][i]) + 6 * (1 - t) * t * (P[2][i] - P[1][i]) + 3 * t * t * (P[3][i] - P[2][i]);
    const g = Math.sqrt(3 / 5), nodes = [-g, 0, g], w = [5 / 9, 8 / 9, 5 / 9];
    let area = 0;
    for (let i = 0; i < 3; i++) { const t = (nodes[i] + 1) / 2; area += -0.5 * w[i] * B(t, 1) * dB(t, 0); }
    expect(Math.abs(pathArea(d) / map.k ** 2 - area) / area).toBeLessThan(1e-9);
  });
});

describe('mesh overlay and sheets', () => {
  it('--mesh draws one path per triangle, curved edges as A commands', async () => {
    const p = part(rectangleLoop([0, 0], [120, 80]), [circleLoop([60, 40], 40)]);
    // the mesh path's facts name the triangles; the boundary path builds the same mesh when a drawing asks
    const r = measureSection(p, { method: 'mesh' });
    const lazy = measureSection(p);
    expect(lazy.method.path).toBe('boundary');
    expect(lazy.geometry.mesh.count).toBe(r.method.baseTriangles);
    const root = parseXml(await drawPart(lazy, { mesh: true }), {}, 'drawing');
    const mesh = byRole(root, 'mesh')[0];
    expect(mesh.children).toHaveLength(r.method.baseTriangles);
    const curved = mesh.children.filter((c) => /A/.test(c.attrs.d)).length;
    expect(curved).toBe(r.method.curvedTriangles);
    // the triangles tile the part exactly: their read-back areas sum to the part's area
    const k = Number(root.attrs['data-scale']);
    const sum = mesh.children.reduce((s, c) => s + Math.abs(pathArea(c.attrs.d)), 0) / (k * k);
    const exact = 120 * 80 - Math.PI * 400;
    expect(Math.abs(sum - exact) / exact).toBeLessThan(1e-9);
  });

  it('a sheet holds one drawing per part, each with its own centroid', async () => {
    const a = measureSection(part(rectangleLoop([0, 0], [50, 20])));
    const b = measureSection({ ...part(circleLoop([0, 0], 20)), name: 'disc' });
    const root = parseXml(await drawSheet([a, b]), {}, 'sheet');
    expect(byRole(root, 'part-drawing').map((g) => g.attrs['data-part'])).toEqual(['test part', 'disc']);
    expect(byRole(root, 'centroid')).toHaveLength(2);
  });
});
