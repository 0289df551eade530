import { describe, it, expect } from 'vitest';
import { readSvg, svgArcToSegments, parseTransform } from '../../src/read/svg.js';
import { InputError } from '../../src/base/errors.js';
import { loopBox, loopSignedArea, type Part } from '../../src/geometry/part.js';
import { segmentPoint, segmentStart, segmentEnd } from '../../src/geometry/segments.js';

const doc = (body: string, attrs = 'viewBox="0 0 100 100"') => `<svg xmlns="http://www.w3.org/2000/svg" ${attrs}>${body}</svg>`;
const partArea = (p: Part) => p.regions.reduce((s, r) => s + loopSignedArea(r.outer) + r.holes.reduce((t, h) => t + loopSignedArea(h), 0), 0);
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
function inputError(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('W3C SVG 1.1 path examples (chapter 8, "Paths")', () => {
  it('triangle01: M 100 100 L 300 100 L 200 300 z, 4cm × 4cm over a 400 × 400 viewBox', () => {
    // SVG 1.1, 8.3.1 example triangle01 (width="4cm" height="4cm" viewBox="0 0 400 400"; from memory)
    const parts = readSvg(doc('<path d="M 100 100 L 300 100 L 200 300 z"/>', 'width="4cm" height="4cm" viewBox="0 0 400 400"'));
    expect(parts).toHaveLength(1);
    expect(parts[0].units).toBe('mm');
    // 1 user unit = 40 mm / 400 = 0.1 mm; triangle base 200, height 200 user units → 20000 × 0.01 mm²
    expect(rel(partArea(parts[0]), 200)).toBeLessThan(1e-14);
    // y flipped about the viewBox's bottom edge: (100, 100) → (10 mm, 30 mm)
    const xs = parts[0].regions[0].outer.segments.map((s) => segmentStart(s));
    expect(xs.some(([x, y]) => Math.abs(x - 10) < 1e-12 && Math.abs(y - 30) < 1e-12)).toBe(true);
    expect(xs.some(([x, y]) => Math.abs(x - 20) < 1e-12 && Math.abs(y - 10) < 1e-12)).toBe(true);
  });
  it('arcs01: the three-quarter pie "M300,200 h-150 a150,150 0 1,0 150,-150 z" and the quarter "M275,175 v-150 a150,150 0 0,0 -150,150 z"', () => {
    // SVG 1.1, 8.3.8 example arcs01 (width="12cm" height="5.25cm" viewBox="0 0 1200 400" per the spec; we use 12cm × 4cm, from memory)
    const parts = readSvg(doc('<path d="M300,200 h-150 a150,150 0 1,0 150,-150 z"/><path d="M275,175 v-150 a150,150 0 0,0 -150,150 z"/>',
      'width="12cm" height="4cm" viewBox="0 0 1200 400"'));
    expect(parts).toHaveLength(2);
    const areas = parts.map(partArea).sort((a, b) => a - b);
    const k = 0.01; // (0.1 mm)² per user unit²
    expect(rel(areas[0], (Math.PI * 150 * 150 / 4) * k)).toBeLessThan(1e-13);
    expect(rel(areas[1], (3 * Math.PI * 150 * 150 / 4) * k)).toBeLessThan(1e-13);
  });
  it('arcs01\'s open zig-zag path (stroke only) is a marking line, not a cut: alone, the drawing has nothing to cut', () => {
    // changed with the shared interpretation (issue 12): open contours are marking, never an error by themselves
    const e = inputError(() => readSvg(doc('<path id="zz" d="M600,350 l 50,-25 a25,25 -30 0,1 50,-25 l 50,-25 a25,50 -30 0,1 50,-25 l 50,-25"/>')));
    expect(e.where).toBe('svg path#zz command 1');
    expect(e.detail).toContain('open contour');
  });
});

describe('arc endpoint-to-centre conversion (SVG 1.1 Appendix F.6.5, F.6.6)', () => {
  it('hand-computed case: (0,0) → (2,1), rx 2, ry 1, no rotation, flags 0 0 → centre (2,0), θ1 = π, Δθ = −π/2', () => {
    // by hand with F.6.5.1–F.6.5.6: x1' = −1, y1' = −0.5; Λ = 0.5; coefficient −1 (fA = fS);
    // (cx', cy') = (1, −0.5); centre (2, 0); u = (−1, 0) so θ1 = π; v = (0, 1) so Δθ = −π/2 (fS = 0).
    const [s] = svgArcToSegments(0, 0, 2, 1, 0, false, false, 2, 1);
    expect(s.kind).toBe('ellipticalArc');
    if (s.kind !== 'ellipticalArc') return;
    expect(s.cx).toBeCloseTo(2, 14); expect(s.cy).toBeCloseTo(0, 14);
    expect(s.rx).toBe(2); expect(s.ry).toBe(1);
    expect(s.t0).toBeCloseTo(Math.PI, 14);
    expect(s.t1 - s.t0).toBeCloseTo(-Math.PI / 2, 14);
    const e = segmentEnd(s);
    expect(e[0]).toBeCloseTo(2, 14); expect(e[1]).toBeCloseTo(1, 14);
  });
  it('F.6.6: radii too small are scaled up — (0,0) → (10,0) with r = 1 becomes a half circle of radius 5 about (5,0)', () => {
    const segs = svgArcToSegments(0, 0, 1, 1, 0, false, true, 10, 0);
    expect(segs).toHaveLength(1);
    const s = segs[0];
    if (s.kind !== 'arc') throw new Error('expected a circular arc');
    expect(s.r).toBeCloseTo(5, 14); expect(s.cx).toBeCloseTo(5, 14); expect(s.cy).toBeCloseTo(0, 14);
    expect(Math.abs(s.a1 - s.a0)).toBeCloseTo(Math.PI, 14);
  });
  it('F.6.2: equal endpoints omit the arc; a zero radius gives a straight line', () => {
    expect(svgArcToSegments(1, 1, 5, 5, 0, false, false, 1, 1)).toHaveLength(0);
    expect(svgArcToSegments(0, 0, 0, 5, 0, false, false, 3, 4)[0].kind).toBe('line');
  });
  it('rotated arcs: the segment starts and ends at the given points and its large/sweep choice matches the flags', () => {
    for (const [fa, fs] of [[0, 0], [0, 1], [1, 0], [1, 1]]) {
      const segs = svgArcToSegments(1, 2, 4, 2, 30, fa === 1, fs === 1, 5, 3);
      const a = segmentStart(segs[0]), b = segmentEnd(segs[segs.length - 1]);
      expect(Math.hypot(a[0] - 1, a[1] - 2)).toBeLessThan(1e-13);
      expect(Math.hypot(b[0] - 5, b[1] - 3)).toBeLessThan(1e-13);
      const sweep = segs.reduce((t, s) => t + (s.kind === 'ellipticalArc' ? s.t1 - s.t0 : 0), 0);
      expect(Math.abs(sweep) > Math.PI).toBe(fa === 1); // large-arc flag (F.6.5 step 4)
      expect(sweep > 0).toBe(fs === 1); // sweep flag: positive angle direction
    }
  });
  it('a circle built from two arcs with flags written without separators ("a5 5 0 0110 0") has area 25π', () => {
    // SVG 1.1 path grammar (8.3.9): flags are single characters and need no separator
    const p = readSvg(doc('<path d="M0 50a5 5 0 0110 0a5 5 0 0 1-10 0z"/>'), { units: 'mm' });
    expect(rel(partArea(p[0]), 25 * Math.PI)).toBeLessThan(1e-14);
  });
});

describe('path grammar', () => {
  it('implicit lineto after moveto, absolute and relative', () => {
    // SVG 1.1, 8.3.2: "If a moveto is followed by multiple pairs of coordinates, the subsequent pairs are treated as implicit lineto commands"
    const a = readSvg(doc('<path d="M 0 0 10 0 10 10 0 10 z"/>'), { units: 'mm' });
    const b = readSvg(doc('<path d="m 0 0 10 0 0 10 -10 0 z"/>'), { units: 'mm' });
    expect(partArea(a[0])).toBeCloseTo(100, 12);
    expect(partArea(b[0])).toBeCloseTo(100, 12);
  });
  it('H, V, compact numbers ("1.5.5", "10-5") and exponents', () => {
    const p = readSvg(doc('<path d="M0,0H1e1V10h-10.0v-1.5.5z"/>'), { units: 'mm' });
    // "v-1.5.5" = v −1.5 then v 0.5 (implicit repeat); then z
    expect(partArea(p[0])).toBeCloseTo(100, 12);
    const q = readSvg(doc('<path d="M10-5L20-5L20 5z"/>'), { units: 'mm' });
    expect(partArea(q[0])).toBeCloseTo(50, 12);
  });
  it('T reflects the previous control point: M0 0 Q5 10 10 0 T20 0 V20 H0 Z encloses exactly 20 × 20', () => {
    // SVG 1.1, 8.3.7: the control point of T is the reflection of the previous one about the current point,
    // so the two parabolic bumps (Archimedes: 2/3 · base · height each) are equal and opposite.
    const p = readSvg(doc('<path d="M0 0 Q5 10 10 0 T20 0 V20 H0 Z"/>'), { units: 'mm' });
    expect(rel(partArea(p[0]), 400)).toBeLessThan(1e-14);
    // a plain Q followed by a line leaves one bump, bulging into the square: 400 − 2/3·10·5
    const q = readSvg(doc('<path d="M0 0 Q5 10 10 0 L20 0 V20 H0 Z"/>'), { units: 'mm' });
    expect(rel(partArea(q[0]), 400 - (2 / 3) * 10 * 5)).toBeLessThan(1e-14);
  });
  it('S reflects the previous second control point (SVG 1.1, 8.3.6)', () => {
    const p = readSvg(doc('<path d="M0 0 C0 10 10 10 10 0 S20 -10 20 0 V20 H0 Z"/>'), { units: 'mm' });
    expect(rel(partArea(p[0]), 400)).toBeLessThan(1e-14);
  });
  it('unknown command: InputError naming the element, command number and character', () => {
    const e = inputError(() => readSvg(doc('<path id="p1" d="M0 0 L10 0 X 5 5 z"/>')));
    expect(e.where).toBe('svg path#p1 command 3 (character 11)');
    expect(e.detail).toContain('unknown path command "X"');
  });
  it('a missing number names the command', () => {
    const e = inputError(() => readSvg(doc('<path d="M0 0 L10"/>')));
    expect(e.where).toMatch(/^svg path\[1\] command 2/);
  });
  it('subpaths: each closed subpath is its own contour; the inner one becomes a hole', () => {
    const p = readSvg(doc('<path id="plate" d="M0 0H50V50H0Z M10 10H20V20H10Z"/>'), { units: 'mm' });
    expect(p).toHaveLength(1);
    expect(p[0].name).toBe('plate');
    expect(p[0].regions[0].holes).toHaveLength(1);
    expect(p[0].regions[0].holes[0].where).toBe('svg path#plate command 6');
    expect(partArea(p[0])).toBeCloseTo(2500 - 100, 10);
  });
});

describe('basic shapes (SVG 1.1, chapter 9)', () => {
  it('circle, ellipse (πab) and rect with rounded corners (wh − (4 − π) rx ry)', () => {
    const p = readSvg(doc('<circle id="c" cx="50" cy="50" r="10"/>'), { units: 'mm' });
    expect(rel(partArea(p[0]), Math.PI * 100)).toBeLessThan(1e-14);
    const e = readSvg(doc('<ellipse cx="50" cy="50" rx="30" ry="10"/>'), { units: 'mm' });
    expect(rel(partArea(e[0]), Math.PI * 300)).toBeLessThan(1e-14);
    // closed form: rectangle minus four corner squares plus four quarter-ellipses (common practice, no source)
    const r = readSvg(doc('<rect x="10" y="20" width="60" height="40" rx="8" ry="5"/>'), { units: 'mm' });
    expect(rel(partArea(r[0]), 60 * 40 - (4 - Math.PI) * 8 * 5)).toBeLessThan(1e-14);
    expect(r[0].regions[0].outer.segments.some((s) => s.kind === 'ellipticalArc')).toBe(true);
    const rc = readSvg(doc('<rect width="60" height="40" rx="8"/>'), { units: 'mm' });
    expect(rc[0].regions[0].outer.segments.filter((s) => s.kind === 'arc')).toHaveLength(4); // ry defaults to rx
    expect(rel(partArea(rc[0]), 60 * 40 - (4 - Math.PI) * 64)).toBeLessThan(1e-14);
    const big = readSvg(doc('<rect width="60" height="40" rx="100" ry="100"/>'), { units: 'mm' });
    expect(rel(partArea(big[0]), Math.PI * 30 * 20)).toBeLessThan(1e-14); // radii clamped to half the sides: an ellipse
  });
  it('polygon, closed polyline; an open polyline or a line is an open contour', () => {
    const p = readSvg(doc('<polygon points="0,0 10,0 10,10"/>'), { units: 'mm' });
    expect(Math.abs(partArea(p[0]))).toBeCloseTo(50, 12);
    const q = readSvg(doc('<polyline points="0,0 10,0 10,10 0,0"/>'), { units: 'mm' });
    expect(Math.abs(partArea(q[0]))).toBeCloseTo(50, 12);
    // changed with the shared interpretation (issue 12): open polylines and lines are marking lines on the part
    expect(inputError(() => readSvg(doc('<polyline id="pl" points="0,0 10,0 10,10"/>'))).where).toBe('svg polyline#pl');
    const r = readSvg(doc('<rect width="5" height="5"/><line x1="1" y1="0.5" x2="4" y2="4.5"/>'), { units: 'mm' });
    expect(r).toHaveLength(1);
    expect(r[0].markingLength).toBeCloseTo(5, 12); // 3-4-5 triangle: the line is 5 long
  });
});

describe('sizes and units (CSS Values and Units Level 3, absolute lengths: 1in = 2.54cm = 96px = 72pt = 6pc)', () => {
  const square = '<rect width="96" height="96"/>';
  it('without width/height one user unit is 1px = 25.4/96 mm', () => {
    const p = readSvg(doc(square, 'viewBox="0 0 200 200"'));
    expect(rel(partArea(p[0]), 25.4 * 25.4)).toBeLessThan(1e-14);
    const q = readSvg(doc(square, ''));
    expect(rel(partArea(q[0]), 25.4 * 25.4)).toBeLessThan(1e-14);
  });
  it('width/height with units and the viewBox fix the scale', () => {
    for (const [w, h] of [['1in', '1in'], ['25.4mm', '2.54cm'], ['72pt', '6pc'], ['96px', '96'], ['101.6Q', '1in']]) {
      const p = readSvg(doc(square, `width="${w}" height="${h}" viewBox="0 0 96 96"`));
      expect(rel(partArea(p[0]), 25.4 * 25.4)).toBeLessThan(1e-14);
    }
  });
  it('opts.units takes user units as that unit and the part keeps it; against a unit the file states it needs the override', () => {
    // changed (issue 12): the file says one user unit is 1/96 in; "--units in" contradicts it and is refused
    const e = inputError(() => readSvg(doc(square, 'width="1in" height="1in" viewBox="0 0 96 96"'), { units: 'in' }));
    expect(e.where).toBe('svg <svg> width');
    const p = readSvg(doc(square, 'width="1in" height="1in" viewBox="0 0 96 96"'), { units: 'in', unitsOverride: true });
    expect(p[0].units).toBe('in');
    expect(p[0].unitSource).toBe('option');
    expect(partArea(p[0])).toBeCloseTo(96 * 96, 9);
    const q = readSvg(doc(square, 'viewBox="0 0 96 96"'), { units: 'in' });
    expect(q[0].units).toBe('in');
    expect(partArea(q[0])).toBeCloseTo(96 * 96, 9);
  });
  it('origin at the bottom-left of the viewBox, y up', () => {
    const p = readSvg(doc('<rect x="10" y="20" width="30" height="40"/>', 'width="100mm" height="100mm" viewBox="-50 -50 100 100"'));
    const [x0, y0, x1, y1] = loopBox(p[0].regions[0].outer);
    // x: 10 − (−50) = 60 .. 90; y: 50 − 20 = 30 .. 50 − 60 = −10 → [−10, 30]... viewBox bottom is y = 50
    expect([x0, y0, x1, y1].map((v) => Math.round(v * 1e9) / 1e9)).toEqual([60, -10, 90, 30]);
  });
  it('percent and font-relative units are rejected with the attribute named', () => {
    const e = inputError(() => readSvg(doc('<rect width="2em" height="5"/>')));
    expect(e.detail).toContain('width');
  });
});

describe('transforms (SVG 1.1, 7.4–7.6)', () => {
  it('a transform list equals nested groups applied right to left: translate(10,0) rotate(90)', () => {
    // SVG 1.1, 7.5: transform="translate(...) rotate(...)" is equivalent to nested <g>s, outermost first
    const a = readSvg(doc('<g transform="translate(10,0) rotate(90)"><rect width="1" height="2"/></g>'), { units: 'mm' });
    const b = readSvg(doc('<g transform="translate(10,0)"><g transform="rotate(90)"><rect width="1" height="2"/></g></g>'), { units: 'mm' });
    const ba = loopBox(a[0].regions[0].outer), bb = loopBox(b[0].regions[0].outer);
    // rotate(90) takes (x, y) to (−y, x): the rect spans x ∈ [−2, 0], y ∈ [0, 1]; then +10 in x → [8, 10] × [0, 1]
    // output y = 100 − y: [99, 100]
    expect(ba.map((v) => Math.round(v * 1e12) / 1e12)).toEqual([8, 99, 10, 100]);
    expect(bb.map((v) => Math.round(v * 1e12) / 1e12)).toEqual([8, 99, 10, 100]);
  });
  it('rotate(a, cx, cy) is translate(cx, cy) rotate(a) translate(−cx, −cy)', () => {
    const m1 = parseTransform('rotate(30, 5, 7)', 'x');
    const m2 = parseTransform('translate(5 7) rotate(30) translate(-5 -7)', 'x');
    m1.forEach((v, k) => expect(v).toBeCloseTo(m2[k], 14));
  });
  it('matrix, scale, skewX, skewY: areas scale by the determinant, circles become ellipses', () => {
    const p = readSvg(doc('<g transform="skewX(30) scale(2,3)"><circle r="5" cx="50" cy="50"/></g>'), { units: 'mm' });
    expect(rel(partArea(p[0]), 6 * Math.PI * 25)).toBeLessThan(1e-13);
    expect(p[0].regions[0].outer.segments.every((s) => s.kind === 'ellipticalArc')).toBe(true);
    const q = readSvg(doc('<path transform="matrix(0 1 1 0 0 0) skewY(20)" d="M0 0 C 0 10 10 10 10 0 Z"/>'), { units: 'mm' });
    // the determinant is −1 (reflection): area magnitude unchanged, outer still counter-clockwise after normalising
    const ref = readSvg(doc('<path d="M0 0 C 0 10 10 10 10 0 Z"/>'), { units: 'mm' });
    expect(rel(partArea(q[0]), partArea(ref[0]))).toBeLessThan(1e-14);
    expect(partArea(q[0])).toBeGreaterThan(0);
  });
  it('a circle under a similarity stays a circular arc with the right points', () => {
    const p = readSvg(doc('<g transform="rotate(33) scale(2)"><circle r="5" cx="10" cy="0"/></g>'), { units: 'mm' });
    const segs = p[0].regions[0].outer.segments;
    expect(segs.every((s) => s.kind === 'arc')).toBe(true);
    // centre (10, 0) → scale → (20, 0) → rotate 33° → (20 cos 33°, 20 sin 33°) → flip about y = 100
    const c = segs[0].kind === 'arc' ? [segs[0].cx, segs[0].cy] : [0, 0];
    const a = (33 * Math.PI) / 180;
    expect(c[0]).toBeCloseTo(20 * Math.cos(a), 12);
    expect(c[1]).toBeCloseTo(100 - 20 * Math.sin(a), 12);
    const m = segmentPoint(segs[0], 0.3);
    expect(Math.hypot(m[0] - c[0], m[1] - c[1])).toBeCloseTo(10, 12);
  });
});

describe('nesting in drawings', () => {
  it('outline with a cut-out and an island inside the cut-out → refused by default; two parts, named from ids, when every piece is a part', () => {
    // changed (issue 12): material inside a cut-out is refused unless sheetBorder is 'part' (or 'skip')
    const body = '<rect id="plate" width="100" height="100"/><circle id="hole" cx="50" cy="50" r="30"/><rect id="island" x="40" y="40" width="20" height="20"/><circle cx="10" cy="10" r="3"/>';
    expect(inputError(() => readSvg(doc(body), { units: 'mm' })).where).toBe('svg rect#plate');
    const p = readSvg(doc(body), { units: 'mm', fileLabel: 'demo', sheetBorder: 'part' });
    expect(p.map((x) => x.name)).toEqual(['plate', 'island']);
    expect(p[0].regions[0].holes).toHaveLength(2);
    expect(rel(partArea(p[0]), 10000 - Math.PI * 900 - Math.PI * 9)).toBeLessThan(1e-14);
    expect(partArea(p[1])).toBeCloseTo(400, 10);
  });
  it('separate outlines without ids are named from the file label and an index', () => {
    const p = readSvg(doc('<rect width="10" height="10"/><rect x="20" width="10" height="10"/>'), { units: 'mm', fileLabel: 'demo' });
    expect(p.map((x) => x.name)).toEqual(['demo-1', 'demo-2']);
    expect(p[1].regions[0].outer.where).toBe('svg rect[2]');
  });
  it('defs, clipPath, title and text are not drawn; display="none" is skipped', () => {
    const p = readSvg(doc('<title>x</title><defs><rect width="1000" height="1000"/></defs><rect display="none" width="500" height="500"/><rect width="10" height="10"/>'), { units: 'mm' });
    expect(p).toHaveLength(1);
    expect(partArea(p[0])).toBeCloseTo(100, 12);
  });
});

describe('safe XML (XML 1.0 sections 4.1, 4.6; OWASP XXE guidance, from memory)', () => {
  it('entity-expansion bomb ("billion laughs") is rejected quickly', () => {
    const bomb = `<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol"><!ENTITY lol2 "&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;">` +
      `<!ENTITY lol3 "&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;"><!ENTITY lol9 "&lol3;&lol3;&lol3;">]>` +
      `<svg xmlns="http://www.w3.org/2000/svg"><rect id="&lol9;" width="1" height="1"/></svg>`;
    const t = performance.now();
    const e = inputError(() => readSvg(bomb));
    console.log(`took ${(performance.now() - t).toFixed(0)} ms (printed, not asserted: tests never assert on time)`);
    expect(e.detail).toContain('internal subset');
  });
  it('external entity is rejected, and an undeclared entity reference too', () => {
    const xxe = `<!DOCTYPE svg [<!ENTITY xxe SYSTEM "file:///etc/passwd">]><svg><path d="&xxe;"/></svg>`;
    expect(inputError(() => readSvg(xxe)).detail).toContain('internal subset');
    const undeclared = `<svg><path d="&xxe;"/></svg>`;
    expect(inputError(() => readSvg(undeclared)).detail).toContain("'&xxe;' is not accepted");
  });
  it('a DOCTYPE naming the public SVG 1.1 DTD is allowed (never fetched); numeric references decode', () => {
    const ok = `<?xml version="1.0"?><!DOCTYPE svg PUBLIC "-//W3C//DTD SVG 1.1//EN" "http://www.w3.org/Graphics/SVG/1.1/DTD/svg11.dtd">` +
      `<svg xmlns="http://www.w3.org/2000/svg"><!-- c --><path d="M0 0&#32;H10&#x20;V10 H0 Z"/></svg>`;
    expect(partArea(readSvg(ok, { units: 'mm' })[0])).toBeCloseTo(100, 12);
  });
  it('10,000-deep nesting gives a clean InputError, not a stack overflow', () => {
    const deep = '<svg>' + '<g>'.repeat(10000) + '<rect width="1" height="1"/>' + '</g>'.repeat(10000) + '</svg>';
    const e = inputError(() => readSvg(deep));
    expect(e.detail).toContain('nested more than');
  });
  it('a file over the size limit is refused before parsing', () => {
    const big = '<svg>' + ' '.repeat(21 * 1024 * 1024) + '</svg>';
    expect(inputError(() => readSvg(big)).detail).toContain('limit');
  });
  it('malformed XML names line and column', () => {
    const e = inputError(() => readSvg('<svg>\n  <rect width="1" height="1">\n</svg>'));
    expect(e.where).toMatch(/line 3, column 1/);
  });
});

describe('containers and bad transforms', () => {
  it('<a> renders its children like <g> (SVG 1.1, 17.1); a singular transform is refused', () => {
    const p = readSvg(doc('<a href="#x"><rect width="10" height="10"/></a>'), { units: 'mm' });
    expect(partArea(p[0])).toBeCloseTo(100, 12);
    const e = inputError(() => readSvg(doc('<g id="flat" transform="scale(1 0)"><rect width="10" height="10"/></g>')));
    expect(e.where).toBe('svg g#flat transform');
  });
  it('numbers out of range are refused', () => {
    expect(inputError(() => readSvg(doc('<path d="M0 0 L1e999 0 L5 5 Z"/>'))).detail).toContain('out of range');
    expect(inputError(() => readSvg(doc('<polygon points="0 0 1e400 0 5 5"/>'))).detail).toContain('out of range');
  });
});
