/**
 * DXF reader on fixtures written by ezdxf (tests/fixtures/dxf/generate.py, invented drawings). Every figure is
 * checked against an outside source named beside it: a closed form, or the reference JSON that the generator
 * computed with ezdxf (its own entity/path/block expansion) and shapely (polygon area and centroid).
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { readDxf, readDxfFull } from '../../src/read/dxf.js';
import type { Drawing, DrawnContour } from '../../src/read/drawing.js';
import { centroid, extents, findContour, fixture, moments, reference, signedArea } from './dxfHelpers.js';

const PI = Math.PI;
const near = (a: number, b: number, tol: number) => expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThanOrEqual(tol);
const closedVisible = (d: Drawing) => d.contours.filter((c) => c.closed && !c.hidden);

function refuse(text: string, opts: Parameters<typeof readDxf>[1], pattern: RegExp): InputError {
  let err: unknown;
  try { readDxf(text, opts); } catch (e) { err = e; }
  expect(err).toBeInstanceOf(InputError);
  const e = err as InputError;
  expect(e.message).not.toMatch(/\n/);
  expect(e.message).toMatch(pattern);
  return e;
}

/** Every region of the generator's reference JSON matches one visible closed contour (ezdxf + shapely). */
function matchesReference(d: Drawing, name: string, relA = 1e-6, absC = 1e-4): void {
  const ref = reference(name);
  for (const r of ref.regions) {
    const c = findContour(d.contours, r.area, r.cx, r.cy, relA, absC);
    expect(c, `${name}: ${r.label} (area ${r.area}, centroid ${r.cx}, ${r.cy})`).toBeDefined();
    const e = extents(c!.segments);
    for (let k = 0; k < 4; k++) near(e[k], r.bbox[k], 1e-4);
  }
  expect(closedVisible(d).length).toBe(ref.regions.length);
}

describe('LINE and ARC loose entities, joined per layer', () => {
  const d = readDxf(fixture('loose-plate'), { fileLabel: 'loose-plate.dxf' });
  it('joins the CUT plate into one closed contour with the rounded-rectangle area', () => {
    const cut = d.contours.filter((c) => c.layer === 'CUT');
    expect(cut.length).toBe(1);
    expect(cut[0].closed).toBe(true);
    expect(cut[0].sources!.length).toBe(8);
    // rounded rectangle W·H − (4 − π) r², closed form
    near(Math.abs(signedArea(cut[0].segments)), 200 * 100 - (4 - PI) * 100, 1e-9 * 20000);
    expect(cut[0].segments.filter((s) => s.kind === 'arc').length).toBe(4);
    // extents: the bounding rectangle, closed form
    const e = extents(cut[0].segments);
    [0, 0, 200, 100].forEach((v, k) => near(e[k], v, 1e-12));
    expect(cut[0].where).toMatch(/^dxf (LINE|ARC) #[0-9A-F]+ layer CUT/);
  });
  it('matches ezdxf + shapely on both plates once the gap is within a chosen tolerance', () => {
    matchesReference(readDxf(fixture('loose-plate'), { joinTolerance: 1e-4 }), 'loose-plate');
  });
  it('does not bridge the 1e-5 gap on layer GAPPY at the default tolerance, and reports it with its location', () => {
    const g = d.contours.filter((c) => c.layer === 'GAPPY');
    expect(g.length).toBe(1);
    expect(g[0].closed).toBe(false);
    const open = d.join!.gaps.filter((x) => !x.closed && x.gap > 0);
    expect(open.length).toBe(1);
    near(open[0].gap, 1e-5, 1e-12);
    // the gap lies between (310, 100) and (310 + 1e-5, 100), as drawn by the generator
    near(open[0].x, 310 + 0.5e-5, 1e-9); near(open[0].y, 100, 1e-9);
    expect(open[0].layer).toBe('GAPPY');
    expect(d.join!.gaps.filter((x) => x.gap === 0).length).toBe(2); // two dangling ends
  });
  it('bridges it at a tolerance of 1e-4 and records the bridged gap', () => {
    const d2 = readDxf(fixture('loose-plate'), { joinTolerance: 1e-4 });
    const g = d2.contours.filter((c) => c.layer === 'GAPPY');
    expect(g.length).toBe(1);
    expect(g[0].closed).toBe(true);
    const bridged = d2.join!.gaps.filter((x) => x.closed);
    expect(bridged.length).toBe(1);
    near(bridged[0].gap, 1e-5, 1e-12);
    // the line end moves onto the arc: the area is still W·H − (4 − π) r², closed form
    near(Math.abs(signedArea(g[0].segments)), 20000 - (4 - PI) * 100, 1e-8);
  });
});

describe('LWPOLYLINE with bulges and CIRCLE holes (R2018)', () => {
  const d = readDxf(fixture('lwpolyline-plate'));
  it('gives exact arcs: areas by closed form', () => {
    expect(d.units).toEqual({ unit: 'mm', source: 'file', detail: { insunits: 4 } });
    const areas = closedVisible(d).map((c) => Math.abs(signedArea(c.segments))).sort((a, b) => a - b);
    // πr² (r = 5, 6.5); slot 20×10 + π·5²; rounded rectangle 120·80 − (4 − π)·8²; all closed forms
    const want = [PI * 25, PI * 6.5 * 6.5, 200 + 25 * PI, 9600 - (4 - PI) * 64].sort((a, b) => a - b);
    expect(areas.length).toBe(4);
    areas.forEach((a, k) => near(a, want[k], 1e-12 * want[k] + 1e-12));
    const outer = closedVisible(d).find((c) => Math.abs(signedArea(c.segments)) > 5000)!;
    const e = extents(outer.segments);
    [10, 20, 130, 100].forEach((v, k) => near(e[k], v, 1e-12));
    // centroid of the symmetric rounded rectangle is its centre (closed form, symmetry)
    const [x, y] = centroid(outer.segments);
    near(x, 70, 1e-9); near(y, 60, 1e-9);
    expect(outer.segments.filter((s) => s.kind === 'arc').length).toBe(4);
  });
  it('second moment of a circle hole about its centre is πr⁴/4 (closed form)', () => {
    const hole = closedVisible(d).find((c) => Math.abs(Math.abs(signedArea(c.segments)) - 25 * PI) < 1e-9)!;
    const m = moments(hole.segments);
    const [cx, cy] = [m.Sx / m.A, m.Sy / m.A];
    near(cx, 30, 1e-12); near(cy, 40, 1e-12);
    // tolerance: round-off of the origin moment A·cy² ≈ 1.3e5 at 1e-14 relative
    near(m.Ixx - m.A * cy * cy, (PI * 625) / 4, 1e-14 * m.A * cy * cy);
  });
  it('resolves colour BYLAYER and explicit colour; matches ezdxf + shapely', () => {
    const hole2 = closedVisible(d).find((c) => Math.abs(Math.abs(signedArea(c.segments)) - PI * 42.25) < 1e-9)!;
    expect(hole2.colour).toBe(1);
    const outer = closedVisible(d).find((c) => Math.abs(signedArea(c.segments)) > 5000)!;
    expect(outer.colour).toBe(3); // layer CUT has colour 3
    matchesReference(d, 'lwpolyline-plate');
  });
});

describe('R12: POLYLINE with bulges, CIRCLE, LINE + ARC; no $INSUNITS', () => {
  it('refuses without a unit, in one line', () => {
    refuse(fixture('r12-plate'), {}, /the DXF states no unit \(\$INSUNITS\); give --units/);
  });
  it('reads with --units, source option; areas by closed form and ezdxf + shapely', () => {
    const d = readDxf(fixture('r12-plate'), { units: 'mm' });
    expect(d.units.source).toBe('option');
    expect(d.units.unit).toBe('mm');
    const areas = closedVisible(d).map((c) => Math.abs(signedArea(c.segments))).sort((a, b) => a - b);
    // πr² (r = 5), half disc πr²/2 (r = 10), rounded rectangle: closed forms
    [25 * PI, 50 * PI, 9600 - (4 - PI) * 64].forEach((v, k) => near(areas[k], v, 1e-11 * v));
    matchesReference(d, 'r12-plate');
  });
});

describe('ELLIPSE full and partial, extrusion (0, 0, −1)', () => {
  const d = readDxf(fixture('ellipse'));
  it('full ellipse: area πab, extents √(a²cos²φ + b²sin²φ) (closed forms)', () => {
    const c = findContour(d.contours, PI * 30 * 15, 100, 50)!;
    expect(c).toBeDefined();
    expect(c.segments.length).toBe(1);
    expect(c.segments[0].kind).toBe('ellipticalArc');
    const phi = PI / 6, a = 30, b = 15;
    const hx = Math.sqrt(a * a * Math.cos(phi) ** 2 + b * b * Math.sin(phi) ** 2);
    const hy = Math.sqrt(a * a * Math.sin(phi) ** 2 + b * b * Math.cos(phi) ** 2);
    const e = extents(c.segments);
    [100 - hx, 50 - hy, 100 + hx, 50 + hy].forEach((v, k) => near(e[k], v, 1e-12 * 100));
  });
  it('half ellipse: area πab/2, centroid 4b/(3π) from the axis (closed form, from memory)', () => {
    const a = 20, b = 10;
    const up = findContour(d.contours, PI * a * b / 2, 0, 4 * b / (3 * PI), 1e-12, 1e-9);
    expect(up).toBeDefined();
    // extrusion −Z: the parameter runs clockwise, so the same 0..π is the lower half
    const down = findContour(d.contours, PI * a * b / 2, 0, 100 - 4 * b / (3 * PI), 1e-12, 1e-9);
    expect(down).toBeDefined();
  });
  it('elliptic quadrant: area πab/4, centroid (−4a/(3π), 4b/(3π)) from the centre (closed form, from memory)', () => {
    const a = 40, b = 10;
    expect(findContour(d.contours, PI * a * b / 4, 200 - 4 * a / (3 * PI), 4 * b / (3 * PI), 1e-12, 1e-9)).toBeDefined();
  });
  it('matches ezdxf + shapely', () => matchesReference(d, 'ellipse'));
});

describe('SPLINE → exact Bézier pieces and rational arcs', () => {
  const d = readDxf(fixture('spline'));
  const ref = reference('spline');
  it('degree 1: the polygon 40 × 30 (closed form)', () => {
    expect(findContour(d.contours, 1200, 120, 115, 1e-14, 1e-10)).toBeDefined();
  });
  it('rational circular arc → exact arcs r = 25: half disc area πr²/2, centroid 4r/(3π) (closed form)', () => {
    const c = findContour(d.contours, PI * 625 / 2, 50, 100 + 100 / (3 * PI), 1e-13, 1e-11)!;
    expect(c).toBeDefined();
    const arcs = c.segments.filter((s) => s.kind === 'arc');
    expect(arcs.length).toBe(2);
    for (const s of arcs) if (s.kind === 'arc') { near(s.r, 25, 1e-12); near(s.cx, 50, 1e-12); near(s.cy, 100, 1e-12); }
  });
  it('cubic, quadratic and unclamped cubic: areas and centroids of ezdxf\'s evaluation (20,000 steps) + shapely', () => {
    // sampling error of the reference: about (1/20000)² relative
    for (const label of ['cubic', 'quadratic', 'unclamped cubic']) {
      const r = ref.regions.find((x) => x.label === label)!;
      const c = findContour(d.contours, r.area, r.cx, r.cy, 1e-7, 1e-6);
      expect(c, label).toBeDefined();
      const kinds = new Set(c!.segments.map((s) => s.kind));
      expect(kinds.has(label === 'quadratic' ? 'quadratic' : 'cubic')).toBe(true);
    }
    matchesReference(d, 'spline', 1e-7, 1e-6);
  });
  it('unclamped cubic starts and ends at ezdxf\'s B-spline points at u_p and u_n', () => {
    const ends = ref.unclamped_ends as [number, number][];
    const c = d.contours.find((k) => k.segments.some((s) => s.kind === 'cubic' && Math.abs(s.x0 - ends[0][0]) < 1e-9 || s.kind === 'cubic' && Math.abs(s.x3 - ends[0][0]) < 1e-9));
    expect(c).toBeDefined();
    const pts = c!.segments.flatMap((s) => (s.kind === 'cubic' ? [[s.x0, s.y0], [s.x3, s.y3]] : []));
    for (const e of ends) expect(pts.some((p) => Math.hypot(p[0] - e[0], p[1] - e[1]) < 1e-12)).toBe(true);
  });
  it('refuses a general rational spline, naming its handle and layer', () => {
    const r = reference('spline-rational-refused') as unknown as { handle: string; layer: string };
    const e = refuse(fixture('spline-rational-refused'), {}, /SPLINE not read: rational/);
    expect(e.message).toContain(`#${r.handle}`);
    expect(e.message).toContain(`layer ${r.layer}`);
  });
});

describe('INSERT: base point, rotation, scale, mirror, nesting, arrays', () => {
  const d = readDxf(fixture('blocks'));
  it('every expanded contour matches ezdxf\'s own block expansion + shapely', () => matchesReference(d, 'blocks'));
  it('triangle area 100·|sx·sy| and the hole centre by the insert transform (closed forms)', () => {
    // TAB: triangle (0,0) (20,0) (0,10), area 100; hole r = 1.5 at (4, 3); base point (5, 5)
    const hole = (px: number, py: number, sx: number, sy: number, rotDeg: number, ox = 0, oy = 0): [number, number] => {
      const c = Math.cos(rotDeg * PI / 180), s = Math.sin(rotDeg * PI / 180);
      const lx = ox + sx * (4 - 5), ly = oy + sy * (3 - 5);
      return [px + c * lx - s * ly, py + s * lx + c * ly];
    };
    const circle = (x: number, y: number, area: number) => expect(findContour(d.contours, area, x, y, 1e-12, 1e-9), `hole at ${x}, ${y}`).toBeDefined();
    circle(...hole(100, 100, 1, 1, 0), 2.25 * PI);
    circle(...hole(200, 100, 1, 1, 30), 2.25 * PI);
    circle(...hole(300, 100, 2, 2, 0), 9 * PI);
    circle(...hole(400, 100, -1, 1, 0), 2.25 * PI); // mirrored: (401, 98)
    circle(...hole(500, 100, 3, 1, 45), 3 * 2.25 * PI); // non-uniform scale: an ellipse of area 3πr²
    for (let r = 0; r < 2; r++) for (let q = 0; q < 3; q++) circle(...hole(100, 500, 1, 1, 10, q * 50, r * 40), 2.25 * PI);
    const tri = closedVisible(d).filter((c) => c.segments.every((s) => s.kind === 'line'));
    const areas = tri.map((c) => Math.abs(signedArea(c.segments))).sort((a, b) => a - b);
    // 10 references of area 100 (incl. mirror, rotation, arrays, nested 1.5²·100 twice), 400, 300
    expect(areas.filter((a) => Math.abs(a - 100) < 1e-9).length).toBe(9);
    expect(areas.filter((a) => Math.abs(a - 225) < 1e-9).length).toBe(2);
    expect(areas.filter((a) => Math.abs(a - 300) < 1e-9).length).toBe(1);
    expect(areas.filter((a) => Math.abs(a - 400) < 1e-9).length).toBe(1);
  });
  it('a mirrored reference keeps exact arcs (mirrored angles, reversed direction)', () => {
    const c = findContour(d.contours, 2.25 * PI, 401, 98, 1e-12, 1e-9)!;
    expect(c.segments[0].kind).toBe('arc');
    if (c.segments[0].kind === 'arc') expect(Math.sign(c.segments[0].a1 - c.segments[0].a0)).toBe(-1);
    expect(c.name).toBe('TAB');
    expect(c.where).toMatch(/in block TAB \(INSERT #[0-9A-F]+\) layer CUT/); // layer 0 content takes the INSERT's layer
  });
  it('refuses a block that refers to itself', () => {
    refuse(fixture('block-cycle'), {}, /block "A" refers to itself/);
  });
});

describe('extrusion (0, 0, −1): x → −x in the object coordinate system', () => {
  const d = readDxf(fixture('extrusion'));
  it('circle centre (10, 5) in OCS is (−10, 5) in WCS; area 9π (closed form)', () => {
    expect(findContour(d.contours, 9 * PI, -10, 5, 1e-12, 1e-12)).toBeDefined();
  });
  it('ARC 0..180 about (40, 0) in OCS: the upper half disc about (−40, 0), centroid 4r/(3π) (closed form)', () => {
    expect(findContour(d.contours, 50 * PI, -40, 40 / (3 * PI), 1e-12, 1e-9)).toBeDefined();
  });
  it('LWPOLYLINE with bulge 0.5: square plus circular segment r²(θ − sin θ)/2 (closed form), mirrored extents', () => {
    const b = 0.5, chord = 20, theta = 4 * Math.atan(b), r = chord * (1 + b * b) / (4 * b);
    const area = 400 + r * r * (theta - Math.sin(theta)) / 2;
    const c = closedVisible(d).find((k) => Math.abs(Math.abs(signedArea(k.segments)) - area) < 1e-9);
    expect(c).toBeDefined();
    const e = extents(c!.segments);
    // sagitta b·chord/2 = 5 beyond x = 20 in OCS, so x reaches −25 in WCS
    [-25, 50, 0, 70].forEach((v, k) => near(e[k], v, 1e-12));
    matchesReference(d, 'extrusion');
  });
});

describe('layers, visibility and skipped entities', () => {
  const d = readDxf(fixture('layers-annotation'));
  it('hides contours on layers off and frozen, and counts annotation and paper space', () => {
    const hidden = d.contours.filter((c) => c.hidden).map((c) => `${c.layer}:${c.hidden}`).sort();
    expect(hidden).toEqual(['HIDDEN-FROZEN:layer-frozen', 'HIDDEN-OFF:layer-off']);
    expect(d.ignored.text).toBe(2); // TEXT, MTEXT
    expect(d.ignored.dimension).toBe(1);
    expect(d.ignored.hatch).toBe(1);
    expect(d.ignored.point).toBe(1);
    expect(d.ignored['paper-space']).toBe(1);
    matchesReference(d, 'layers-annotation');
    // square 50 × 50 (closed form)
    near(Math.abs(signedArea(closedVisible(d)[0].segments)), 2500, 1e-12);
  });
});

describe('units', () => {
  it('inch file: unit in from $INSUNITS 1; a differing --units is recorded for the caller', () => {
    const d = readDxf(fixture('inch'));
    expect(d.units).toEqual({ unit: 'in', source: 'file', detail: { insunits: 1 } });
    near(Math.abs(signedArea(d.contours[0].segments)), PI * 0.25, 1e-15); // πr², r = 0.5 in
    const d2 = readDxf(fixture('inch'), { units: 'mm' });
    expect(d2.units).toEqual({ unit: 'in', source: 'file', detail: { insunits: 1, option: 'mm' } });
  });
  it('unitless file: refused without --units, read with it', () => {
    refuse(fixture('unitless'), {}, /states no unit/);
    expect(readDxf(fixture('unitless'), { units: 'cm' }).units).toEqual({ unit: 'cm', source: 'option', detail: { insunits: 0 } });
  });
});

// ---- malformed input and limits (hand-written DXF text)

const dxf = (entities: string, blocks = '', header = '  9\n$INSUNITS\n 70\n4\n') =>
  `  0\nSECTION\n  2\nHEADER\n${header}  0\nENDSEC\n` +
  (blocks ? `  0\nSECTION\n  2\nBLOCKS\n${blocks}  0\nENDSEC\n` : '') +
  `  0\nSECTION\n  2\nENTITIES\n${entities}  0\nENDSEC\n  0\nEOF\n`;
const circle = (x: number, y: number, r: number, h = '1') => `  0\nCIRCLE\n  5\n${h}\n  8\n0\n 10\n${x}\n 20\n${y}\n 40\n${r}\n`;
const block = (name: string, body: string) => `  0\nBLOCK\n  2\n${name}\n 70\n0\n 10\n0\n 20\n0\n${body}  0\nENDBLK\n`;
const insert = (name: string, extra = '') => `  0\nINSERT\n  5\nAA\n  8\n0\n  2\n${name}\n 10\n0\n 20\n0\n${extra}`;

describe('malformed files and limits', () => {
  it('truncated file: one line naming where', () => {
    const text = fixture('lwpolyline-plate');
    refuse(text.slice(0, Math.floor(text.length * 0.8)), {}, /truncated|without its value/);
  });
  it('garbage and binary DXF', () => {
    refuse('hello world\nthis is not dxf\n', {}, /line 1: expected a group code/);
    refuse('AutoCAD Binary DXF\r\n\u001a\u0000rest', {}, /binary DXF is not read; save as ASCII DXF/);
  });
  it('a number that is not a number names its line', () => {
    refuse(dxf(circle(0, 0, 1).replace(' 40\n1\n', ' 40\nabc\n')), {}, /line \d+\): group 40 should be a number/);
  });
  it('an extrusion out of the XY plane is refused in one line', () => {
    refuse(dxf(circle(0, 0, 1) + '210\n1\n220\n0\n230\n0\n'), {}, /outside the XY plane/);
  });
  it('a missing block is refused', () => {
    refuse(dxf(insert('NOPE')), {}, /block "NOPE", which the BLOCKS section does not define/);
  });
  it('nesting deeper than the limit is refused, iteratively (no stack overflow)', () => {
    let blocks = block('B0', circle(0, 0, 1));
    for (let k = 1; k <= 40; k++) blocks += block(`B${k}`, insert(`B${k - 1}`));
    refuse(dxf(insert('B40'), blocks), {}, /nested deeper than 16/);
  });
  it('expansion beyond a million segments is refused with the limit', () => {
    let body = '';
    for (let k = 0; k < 1000; k++) body += circle(k * 3, 0, 1, `C${k}`);
    refuse(dxf(insert('MANY', ' 70\n40\n 71\n30\n 44\n10\n 45\n10\n'), block('MANY', body)), {}, /more than 1000000 segments/);
  });
  it('a negative circle radius names the entity', () => {
    refuse(dxf(circle(0, 0, -2, '2F')), {}, /dxf CIRCLE #2F layer 0 \(line \d+\): CIRCLE radius must be positive/);
  });
});

describe('join findings are returned as data', () => {
  it('duplicate and overlapping LINEs are reported with handles', () => {
    const line = (h: string, x0: number, x1: number) => `  0\nLINE\n  5\n${h}\n  8\nCUT\n 10\n${x0}\n 20\n0\n 11\n${x1}\n 21\n0\n`;
    const r = readDxfFull(dxf(line('A1', 0, 10) + line('A2', 10, 0) + line('A3', 5, 20)));
    const dup = r.issues.find((i) => i.kind === 'duplicate');
    expect(dup).toBeDefined();
    const ov = r.issues.find((i) => i.kind === 'overlap');
    expect(ov).toBeDefined();
    if (ov && ov.kind === 'overlap') { near(ov.length, 5, 1e-12); near(ov.x, 7.5, 1e-12); }
    expect(r.drawing.ignored.duplicate).toBe(1);
    const c: DrawnContour[] = r.drawing.contours;
    expect(c.flatMap((k) => k.sources)).toEqual(expect.arrayContaining(['A1', 'A3']));
  });
});
