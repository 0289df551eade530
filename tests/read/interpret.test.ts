/**
 * The shared interpretation of drawings (issue 12): the habits that used to give silently wrong masses now
 * give the right figures or a one-line refusal naming the place. Every expected figure is a closed form
 * computed here from the drawn dimensions (the source is stated beside each check), never a number taken
 * from the code under test.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { type Part, loopSignedArea } from '../../src/geometry/part.js';
import { readDrawing } from '../../src/read/read.js';

const NS = 'xmlns="http://www.w3.org/2000/svg"';
const INK = 'xmlns:inkscape="http://www.inkscape.org/namespaces/inkscape" xmlns:sodipodi="http://sodipodi.sourceforge.net/DTD/sodipodi-0.dtd"';
const svg = (body: string, size = 'width="200mm" height="100mm" viewBox="0 0 200 100"') => `<?xml version="1.0" encoding="UTF-8"?>\n<svg ${NS} ${INK} ${size}>\n${body}\n</svg>`;
const area = (p: Part) => p.regions.reduce((s, r) => s + loopSignedArea(r.outer) + r.holes.reduce((t, h) => t + loopSignedArea(h), 0), 0);
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
function inputError(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('overlapping outlines: the L-bracket of two rectangles', () => {
  // 100 × 30 flange and 30 × 100 web sharing the corner square 30 × 30
  const l = svg(`<g inkscape:groupmode="layer" inkscape:label="Cut">
    <rect id="flange" x="10" y="60" width="100" height="30"/>
    <rect id="web" x="10" y="-10" width="30" height="100"/></g>`, 'width="200mm" height="110mm" viewBox="0 -10 200 110"');
  it('is refused by default in one line naming both rectangles, their layer and a point where they meet', () => {
    const e = inputError(() => readDrawing(l, 'l.svg'));
    expect(e.where).toBe('svg rect#flange (layer Cut)');
    expect(e.detail).toMatch(/^crosses, touches or coincides with svg rect#web \(layer Cut\) at \(/);
    expect(e.message).not.toContain('\n');
  });
  it('with unite: one part of 5100 mm² (closed form 100·30 + 30·100 − 30·30), outline kept as straight lines', () => {
    const r = readDrawing(l, 'l.svg', { unite: true });
    expect(r.parts).toHaveLength(1);
    expect(rel(area(r.parts[0]), 100 * 30 + 30 * 100 - 30 * 30)).toBeLessThan(1e-12);
    expect(r.summary.united).toHaveLength(1);
    expect(r.summary.warnings).toContain('shapes-united');
  });
});

describe('a circle drawn across the plate edge as a notch', () => {
  // 160 × 80 plate, r = 10 circle centred on the top edge: half of it lies in the plate
  const body = '<rect id="plate" x="20" y="10" width="160" height="80"/><circle id="notch" cx="100" cy="10" r="10"/>';
  it('is refused by default (it crosses the outline)', () => {
    const e = inputError(() => readDrawing(svg(body), 'n.svg'));
    expect(e.where).toBe('svg rect#plate');
    expect(e.detail).toContain('svg circle#notch');
  });
  it('with unite: the plate minus the half disc (closed form 160·80 − π·10²/2), one part, the notch a true arc', () => {
    const r = readDrawing(svg(body), 'n.svg', { unite: true });
    expect(r.parts).toHaveLength(1);
    expect(rel(area(r.parts[0]), 160 * 80 - (Math.PI * 100) / 2)).toBeLessThan(1e-9);
    expect(r.parts[0].regions[0].outer.segments.some((s) => s.kind === 'arc')).toBe(true);
    expect(r.summary.united[0].subtracted).toEqual(['svg circle#notch']);
  });
  it('with unite, a circle mostly outside (a lobe) is added instead: 160·80 + (πr² − segment inside)', () => {
    // centre 6 above the edge (SVG y down: cy = 10 − 6): the part inside is a circular segment of height h = 4,
    // area r² acos((r − h)/r) − (r − h)√(2rh − h²) (circular segment, closed form)
    const r0 = 10, h = 4;
    const seg = r0 * r0 * Math.acos((r0 - h) / r0) - (r0 - h) * Math.sqrt(2 * r0 * h - h * h);
    const res = readDrawing(svg('<rect id="plate" x="20" y="10" width="160" height="80"/><circle id="lobe" cx="100" cy="4" r="10"/>'), 'n.svg', { unite: true });
    expect(rel(area(res.parts[0]), 160 * 80 + Math.PI * r0 * r0 - seg)).toBeLessThan(1e-9);
  });
});

describe('duplicates (a CAD export drawing an outline twice)', () => {
  it('the outline twice with one hole: one part b·h − πr², the duplicate reported with where it was', () => {
    const body = `<path id="outline" d="M 10 10 H 170 V 90 H 10 Z"/>
      <path id="outline-again" d="M 170 90 H 10 V 10 H 170 Z"/>
      <circle id="bore" cx="90" cy="50" r="12"/>`;
    const r = readDrawing(svg(body), 'dup.svg');
    expect(r.parts).toHaveLength(1);
    expect(rel(area(r.parts[0]), 160 * 80 - Math.PI * 144)).toBeLessThan(1e-13);
    expect(r.summary.duplicates).toHaveLength(1);
    expect(r.summary.duplicates[0].where).toBe('svg path#outline-again command 1');
    expect(r.summary.duplicates[0].duplicateOf).toBe('svg path#outline command 1');
    expect(r.summary.warnings).toContain('duplicates-removed');
  });

  // a seeded generator (mulberry32) so that failures reproduce
  function rng(seed: number) {
    return () => {
      seed |= 0; seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
  }
  const scales = (() => { const r = rng(12); return Array.from({ length: 48 }, () => ({ s: 10 ** (-3 + 8 * r()), x: (r() - 0.5) * 2, y: (r() - 0.5) * 2 })); })();

  it('SVG: a rounded rectangle drawn twice (as <rect rx> and as a reversed path from another corner) is caught at 48 random scales 1e-3…1e5 and positions', () => {
    for (const { s, x, y } of scales) {
      const w = 120 * s, h = 70 * s, rr = 9 * s, X = x * 1e3 * s + 5 * s, Y = y * 1e3 * s + 5 * s;
      // the same outline as a path, starting at the bottom-left corner arc's end, drawn the other way round
      const d = `M ${X} ${Y + h - rr} V ${Y + rr} A ${rr} ${rr} 0 0 1 ${X + rr} ${Y} H ${X + w - rr} A ${rr} ${rr} 0 0 1 ${X + w} ${Y + rr} V ${Y + h - rr} A ${rr} ${rr} 0 0 1 ${X + w - rr} ${Y + h} H ${X + rr} A ${rr} ${rr} 0 0 1 ${X} ${Y + h - rr} Z`;
      const text = `<svg ${NS}><rect id="a" x="${X}" y="${Y}" width="${w}" height="${h}" rx="${rr}"/><path id="b" d="${d}"/></svg>`;
      const r = readDrawing(text, 'r.svg', { units: 'mm' });
      expect(r.parts, `scale ${s}`).toHaveLength(1);
      expect(r.summary.duplicates, `scale ${s}`).toHaveLength(1);
      // rounded rectangle: w·h − (4 − π) r² (closed form)
      expect(rel(Math.abs(area(r.parts[0])), w * h - (4 - Math.PI) * rr * rr), `scale ${s}`).toBeLessThan(1e-9);
    }
  });
  it('GeoJSON and WKT: a ring repeated (other start, other direction) is caught at the same 48 scales', () => {
    for (const { s, x, y } of scales) {
      const X = x * 1e3 * s, Y = y * 1e3 * s, w = 120 * s, h = 70 * s;
      const ring = [[X, Y], [X + w, Y], [X + w, Y + h], [X, Y + h], [X, Y]];
      const again = [[X + w, Y + h], [X + w, Y], [X, Y], [X, Y + h], [X + w, Y + h]];
      const gj = JSON.stringify({ type: 'MultiPolygon', coordinates: [[ring], [again]] });
      const g = readDrawing(gj, 'x.geojson', { units: 'mm' });
      expect(g.parts, `geojson scale ${s}`).toHaveLength(1);
      expect(g.summary.duplicates).toHaveLength(1);
      expect(rel(area(g.parts[0]), w * h)).toBeLessThan(1e-12); // rectangle b·h
      const pt = (p: number[]) => `${p[0]} ${p[1]}`;
      const wkt = `MULTIPOLYGON (((${ring.map(pt).join(', ')})), ((${again.map(pt).join(', ')})))`;
      const k = readDrawing(wkt, 'x.wkt', { units: 'mm' });
      expect(k.parts, `wkt scale ${s}`).toHaveLength(1);
      expect(k.summary.duplicates).toHaveLength(1);
    }
  });
  it('overlap and touch are refused at the same 48 scales on every reader (not mistaken for duplicates, not let through)', () => {
    for (const { s, x, y } of scales) {
      const X = x * 1e3 * s, Y = y * 1e3 * s, w = 120 * s, h = 70 * s;
      // overlapping: the second rectangle shifted by a quarter of its width; touching: shifted by its full width
      for (const shift of [w / 4, w]) {
        const a = [[X, Y], [X + w, Y], [X + w, Y + h], [X, Y + h], [X, Y]];
        const b = a.map(([u, v]) => [u + shift, v]);
        expect(() => readDrawing(JSON.stringify({ type: 'MultiPolygon', coordinates: [[a], [b]] }), 'x.geojson', { units: 'mm' }), `geojson ${s} ${shift}`).toThrow(InputError);
        const pt = (p: number[]) => `${p[0]} ${p[1]}`;
        expect(() => readDrawing(`MULTIPOLYGON (((${a.map(pt).join(',')})), ((${b.map(pt).join(',')})))`, 'x.wkt', { units: 'mm' }), `wkt ${s} ${shift}`).toThrow(InputError);
        const t = `<svg ${NS}><rect x="${X}" y="${Y}" width="${w}" height="${h}"/><rect x="${X + shift}" y="${Y}" width="${w}" height="${h}"/></svg>`;
        expect(() => readDrawing(t, 'x.svg', { units: 'mm' }), `svg ${s} ${shift}`).toThrow(InputError);
      }
    }
  });
  it('DXF: a rounded plate (LWPOLYLINE with bulges) drawn twice, once as loose LINE/ARC entities the other way round, is caught at the same 48 scales; overlapping and touching plates are refused', () => {
    // DXF written here by hand (group codes per the DXF reference): $INSUNITS 4 (mm)
    const head = ['0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES'];
    const tail = ['0', 'ENDSEC', '0', 'EOF', ''];
    let h = 0x40;
    const ent = (kind: string, codes: (string | number)[]) => ['0', kind, '5', (h++).toString(16).toUpperCase(), '8', 'CUT', ...codes.map(String)];
    const b = Math.tan(Math.PI / 8); // bulge of a quarter arc, counter-clockwise (DXF reference: bulge = tan(θ/4))
    for (const { s, x, y } of scales) {
      const w = 120 * s, hh = 70 * s, rr = 9 * s, X = x * 1e3 * s + 5 * s, Y = y * 1e3 * s + 5 * s;
      // counter-clockwise LWPOLYLINE: each vertex, then the bulge of the segment that follows it
      const v: [number, number, number][] = [[X + rr, Y, 0], [X + w - rr, Y, b], [X + w, Y + rr, 0], [X + w, Y + hh - rr, b], [X + w - rr, Y + hh, 0], [X + rr, Y + hh, b], [X, Y + hh - rr, 0], [X, Y + rr, b]];
      const poly = ent('LWPOLYLINE', ['90', v.length, '70', 1, ...v.flatMap(([px, py, bu]) => ['10', px, '20', py, '42', bu])]);
      // the same outline as loose entities, listed clockwise: lines and ARCs (ARC angles in degrees, counter-clockwise)
      const arc = (cx: number, cy: number, a0: number, a1: number) => ent('ARC', ['10', cx, '20', cy, '30', 0, '40', rr, '50', a0, '51', a1]);
      const line = (x0: number, y0: number, x1: number, y1: number) => ent('LINE', ['10', x0, '20', y0, '30', 0, '11', x1, '21', y1, '31', 0]);
      const loose = [
        line(X, Y + rr, X, Y + hh - rr), arc(X + rr, Y + hh - rr, 90, 180), line(X + rr, Y + hh, X + w - rr, Y + hh), arc(X + w - rr, Y + hh - rr, 0, 90),
        line(X + w, Y + hh - rr, X + w, Y + rr), arc(X + w - rr, Y + rr, 270, 360), line(X + w - rr, Y, X + rr, Y), arc(X + rr, Y + rr, 180, 270),
      ].flat();
      const text = [...head, ...poly, ...loose, ...tail].join('\n');
      const r = readDrawing(text, 'r.dxf');
      expect(r.parts, `dxf scale ${s}`).toHaveLength(1);
      expect(r.summary.duplicates, `dxf scale ${s}`).toHaveLength(1);
      // rounded rectangle: w·h − (4 − π) r² (closed form)
      expect(rel(Math.abs(area(r.parts[0])), w * hh - (4 - Math.PI) * rr * rr), `dxf scale ${s}`).toBeLessThan(1e-9);
      for (const shift of [w / 4, w]) {
        const rect = (dx: number) => ent('LWPOLYLINE', ['90', 4, '70', 1, '10', X + dx, '20', Y, '10', X + dx + w, '20', Y, '10', X + dx + w, '20', Y + hh, '10', X + dx, '20', Y + hh]);
        const t2 = [...head, ...rect(0), ...rect(shift), ...tail].join('\n');
        expect(() => readDrawing(t2, 'x.dxf'), `dxf ${s} ${shift}`).toThrow(InputError);
      }
    }
  });
});


describe('sheet border around the drawing', () => {
  const body = `<g inkscape:groupmode="layer" inkscape:label="Frame"><rect id="border" x="1" y="1" width="198" height="98"/></g>
    <g inkscape:groupmode="layer" inkscape:label="Cut"><rect id="plate" x="20" y="10" width="160" height="80"/><circle id="bolt" cx="40" cy="30" r="7"/></g>`;
  it('is refused by default, naming the border, the part inside it and the piece inside that', () => {
    const e = inputError(() => readDrawing(svg(body), 'b.svg'));
    expect(e.where).toBe('svg rect#border (layer Frame)');
    expect(e.detail).toContain('svg rect#plate (layer Cut) which holds svg circle#bolt (layer Cut)');
  });
  it('skipping its layer, or skipping enclosing outlines, gives the plate with its bolt hole: 160·80 − π·7²', () => {
    const want = 160 * 80 - Math.PI * 49; // rectangle b·h minus circle πr²
    for (const opts of [{ skipLayers: ['frame'] }, { sheetBorder: 'skip' as const }]) {
      const r = readDrawing(svg(body), 'b.svg', opts);
      expect(r.parts).toHaveLength(1);
      expect(rel(area(r.parts[0]), want)).toBeLessThan(1e-13);
    }
    expect(readDrawing(svg(body), 'b.svg', { sheetBorder: 'skip' }).summary.ignored['sheet-border']).toBe(1);
  });
  it('taking every piece as a part gives the old reading: border frame, and the disc as a part', () => {
    const r = readDrawing(svg(body), 'b.svg', { sheetBorder: 'part' });
    expect(r.parts).toHaveLength(2);
    expect(rel(area(r.parts[0]), 198 * 98 - 160 * 80)).toBeLessThan(1e-13);
    expect(rel(area(r.parts[1]), Math.PI * 49)).toBeLessThan(1e-13);
  });
});

describe('hidden content and CSS (the way drawing programs write it)', () => {
  const body = `<defs><style type="text/css"><![CDATA[
      .construction { display: none }
      #notes > rect { visibility: hidden }
      .big { transform: scale(2) }
    ]]></style></defs>
    <sodipodi:namedview id="base" pagecolor="#ffffff"/>
    <g inkscape:groupmode="layer" inkscape:label="Old revision" style="display:none">
      <rect x="0" y="0" width="200" height="100"/></g>
    <g inkscape:groupmode="layer" inkscape:label="Cut" id="layer1">
      <rect id="plate" x="20" y="10" width="100" height="50"/>
      <circle class="construction" cx="70" cy="35" r="20"/>
      <circle cx="40" cy="30" r="5" visibility="hidden"/>
      <g id="notes"><rect x="30" y="20" width="5" height="5"/></g>
      <rect class="big" x="35" y="12" width="5" height="5"/>
      <text x="30" y="50">PL 10</text>
    </g>`;
  it('hidden layer, display:none class and visibility="hidden" are never cut; counted as hidden', () => {
    const r = readDrawing(svg(body), 'h.svg');
    expect(r.parts).toHaveLength(1);
    // plate 100 × 50 minus one square: the rect of class "big" (35, 12) 5 × 5, scaled by 2 about the origin by the
    // style sheet, is the cut-out (70, 24)…(80, 34): b·h − 10²
    expect(rel(area(r.parts[0]), 100 * 50 - 100)).toBeLessThan(1e-13);
    expect(r.summary.ignored.hidden).toBe(4);
    expect(r.summary.ignored.text).toBe(1);
    expect(r.summary.ignored['foreign-namespace']).toBe(1);
    expect(r.summary.warnings).toEqual(expect.arrayContaining(['hidden-content', 'foreign-content', 'text-ignored']));
  });
  it('style transform:scale(2) is applied: a 5 × 5 square becomes 10 × 10 (area × 4)', () => {
    const text = svg(`<rect id="plate" x="0" y="0" width="100" height="50"/><rect style="transform:scale(2)" x="10" y="5" width="5" height="5"/>`);
    const r = readDrawing(text, 's.svg');
    expect(r.parts).toHaveLength(1);
    expect(rel(area(r.parts[0]), 100 * 50 - 10 * 10)).toBeLessThan(1e-13); // b·h − (2·5)²
  });
  it('the CSS transform property wins over the transform attribute; !important in a sheet wins over style', () => {
    const text = svg(`<style>.h { display: none !important }</style><rect id="plate" width="100" height="50"/>
      <rect transform="scale(3)" style="transform: translate(10px, 10px)" width="5" height="5"/>
      <circle class="h" style="display: inline" cx="50" cy="25" r="3"/>`);
    const r = readDrawing(text, 's.svg');
    expect(rel(area(r.parts[0]), 100 * 50 - 25)).toBeLessThan(1e-13); // the square stays 5 × 5; the circle is hidden
    expect(r.summary.ignored.hidden).toBe(1);
  });
});

describe('units', () => {
  const plate = '<rect x="0" y="0" width="160" height="80"/>';
  it('unitless width/height: read as CSS px and reported as assumed (160 user units → 42.333… mm)', () => {
    const r = readDrawing(`<svg ${NS} width="160" height="80" viewBox="0 0 160 80">${plate}</svg>`, 'u.svg');
    expect(r.units.source).toBe('assumed');
    expect(r.summary.warnings).toContain('units-assumed');
    expect(r.parts[0].unitSource).toBe('assumed');
    expect(rel(area(r.parts[0]), 160 * 80 * (25.4 / 96) ** 2)).toBeLessThan(1e-13); // 1 px = 25.4/96 mm (CSS Values 3)
  });
  it('GeoJSON and WKT without a unit: read as mm, and the warning says mm, not CSS pixels', () => {
    // the unit rule is ours (README: GeoJSON and WKT coordinates are taken as mm unless --units says otherwise)
    for (const [text, label] of [['POLYGON ((0 0, 160 0, 160 80, 0 80, 0 0))', 'u.wkt'], [JSON.stringify({ type: 'Polygon', coordinates: [[[0, 0], [160, 0], [160, 80], [0, 80], [0, 0]]] }), 'u.geojson']]) {
      const r = readDrawing(text, label);
      expect(r.units.source).toBe('assumed');
      expect(r.summary.warnings).toContain('units-assumed-mm');
      expect(r.summary.warnings).not.toContain('units-assumed');
      expect(rel(area(r.parts[0]), 160 * 80)).toBeLessThan(1e-15);
    }
  });
  it('with the units option the same file gives 160 × 80 mm, source option', () => {
    const r = readDrawing(`<svg ${NS} width="160" height="80" viewBox="0 0 160 80">${plate}</svg>`, 'u.svg', { units: 'mm' });
    expect(r.units).toMatchObject({ unit: 'mm', source: 'option' });
    expect(rel(area(r.parts[0]), 160 * 80)).toBeLessThan(1e-15);
  });
  it('width="160mm" over viewBox 160: source file; an agreeing option is fine, a contradicting one refused unless overridden', () => {
    const t = `<svg ${NS} width="160mm" height="80mm" viewBox="0 0 160 80">${plate}</svg>`;
    expect(readDrawing(t, 'u.svg').units.source).toBe('file');
    expect(readDrawing(t, 'u.svg', { units: 'mm' }).units.source).toBe('file');
    const e = inputError(() => readDrawing(t, 'u.svg', { units: 'in' }));
    expect(e.where).toBe('svg <svg> width');
    expect(e.detail).toContain('one user unit is 1 mm');
    const o = readDrawing(t, 'u.svg', { units: 'in', unitsOverride: true });
    expect(o.units).toMatchObject({ unit: 'in', source: 'option' });
  });
  it('GeoJSON declaring a geographic CRS is refused (EPSG:4326, OGC CRS84, NAD83 4269); a projected one needs the units option', () => {
    const poly = { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] };
    for (const name of ['urn:ogc:def:crs:OGC:1.3:CRS84', 'EPSG:4326', 'urn:ogc:def:crs:EPSG::4269', 'http://www.opengis.net/def/crs/EPSG/0/4258']) {
      const e = inputError(() => readDrawing(JSON.stringify({ ...poly, crs: { type: 'name', properties: { name } } }), 'g.geojson'));
      expect(e.where).toBe('crs');
      expect(e.detail).toContain('geographic');
    }
    const utm = JSON.stringify({ ...poly, crs: { type: 'name', properties: { name: 'EPSG:32632' } } });
    expect(inputError(() => readDrawing(utm, 'g.geojson')).detail).toContain('units option');
    expect(readDrawing(utm, 'g.geojson', { units: 'm' }).units).toMatchObject({ unit: 'm', source: 'option' });
    const plain = readDrawing(JSON.stringify(poly), 'g.geojson');
    expect(plain.units.source).toBe('assumed');
  });
  it('WKT with SRID=4326 (and 4258, 4269) is refused naming the character; with units and the override it is read as lengths', () => {
    for (const srid of [4326, 4258, 4269]) {
      const e = inputError(() => readDrawing(`SRID=${srid};POLYGON ((0 0, 1 0, 1 1, 0 0))`, 'w.wkt'));
      expect(e.where).toBe('wkt character 0 (line 1, column 1)');
      expect(e.detail).toContain('geographic');
    }
    const r = readDrawing('SRID=4326;POLYGON ((0 0, 2 0, 2 2, 0 0))', 'w.wkt', { units: 'mm', unitsOverride: true });
    expect(area(r.parts[0])).toBeCloseTo(2, 14); // triangle b·h/2
  });
});

describe('marking (etch layers, open lines)', () => {
  const body = `<g inkscape:groupmode="layer" inkscape:label="Cut"><rect id="plate" x="10" y="10" width="160" height="80"/><circle cx="40" cy="50" r="8"/></g>
    <g inkscape:groupmode="layer" inkscape:label="Etch">
      <rect id="label-box" x="100" y="30" width="40" height="20"/>
      <path id="bend-line" d="M 90 10 V 90"/>
    </g>`;
  it('a closed box and an open line on the etch layer are marking, not a hole and not a failure; marking length summed', () => {
    const r = readDrawing(svg(body), 'e.svg');
    expect(r.parts).toHaveLength(1);
    expect(rel(area(r.parts[0]), 160 * 80 - Math.PI * 64)).toBeLessThan(1e-13); // only the bolt hole is cut
    // box perimeter 2·(40 + 20) plus the bend line 80 (straight lengths)
    expect(rel(r.parts[0].markingLength!, 2 * (40 + 20) + 80)).toBeLessThan(1e-13);
    expect(r.summary.markingBy['marking-layer']).toBe(2);
    expect(r.summary.marking).toBe(2);
  });
  it('the marking layers can be named; a layer with both open and closed contours and no role is refused', () => {
    const named = svg(`<rect id="plate" x="10" y="10" width="160" height="80"/>
      <g inkscape:groupmode="layer" inkscape:label="Scribe lines"><path d="M 20 20 H 60"/><rect x="100" y="30" width="10" height="10"/></g>`);
    const r = readDrawing(named, 'e.svg', { markLayers: ['scribe lines'] });
    expect(rel(area(r.parts[0]), 160 * 80)).toBeLessThan(1e-15);
    expect(rel(r.parts[0].markingLength!, 40 + 40)).toBeLessThan(1e-13);
    const mixed = svg(`<rect id="plate" x="10" y="10" width="160" height="80"/>
      <g inkscape:groupmode="layer" inkscape:label="Layer 2"><path id="tick" d="M 20 20 H 60"/><rect id="box" x="100" y="30" width="10" height="10"/></g>`);
    const e = inputError(() => readDrawing(mixed, 'e.svg'));
    expect(e.where).toBe('layer Layer 2');
    expect(e.detail).toContain('svg path#tick');
  });
  it('an open line without layers is marking (reason open-contour) and a marking colour makes a closed contour marking', () => {
    const t = svg(`<rect id="plate" x="10" y="10" width="160" height="80" stroke="#000"/><polyline points="20,20 50,60" stroke="black"/>
      <rect x="100" y="30" width="10" height="10" stroke="#F00"/>`);
    const r = readDrawing(t, 'c.svg', { markColours: ['red'] });
    expect(rel(area(r.parts[0]), 160 * 80)).toBeLessThan(1e-15);
    expect(rel(r.parts[0].markingLength!, 50 + 40)).toBeLessThan(1e-13); // 30-40-50 triangle; square perimeter 40
    expect(r.summary.markingBy).toEqual({ 'open-contour': 1, 'marking-colour': 1 });
  });
});

describe('parts: one rule for every format', () => {
  const pads = [[[0, 0], [40, 0], [40, 30], [0, 30], [0, 0]], [[60, 0], [100, 0], [100, 30], [60, 30], [60, 0]]];
  it('two separate pads in one MultiPolygon are two parts of 40·30 each, like the same pads as two SVG outlines', () => {
    const g = readDrawing(JSON.stringify({ type: 'Feature', properties: { name: 'pad' }, geometry: { type: 'MultiPolygon', coordinates: [[pads[0]], [pads[1]]] } }), 'p.geojson', { units: 'mm' });
    expect(g.parts.map((p) => p.name)).toEqual(['pad', 'pad-2']);
    for (const p of g.parts) expect(rel(area(p), 1200)).toBeLessThan(1e-15);
    const s = readDrawing(`<svg ${NS}><rect width="40" height="30"/><rect x="60" width="40" height="30"/></svg>`, 'p.svg', { units: 'mm' });
    expect(s.parts).toHaveLength(2);
    for (const p of s.parts) expect(rel(Math.abs(area(p)), 1200)).toBeLessThan(1e-15);
    const one = readDrawing(`<svg ${NS}><rect width="40" height="30"/><rect x="60" width="40" height="30"/></svg>`, 'p.svg', { units: 'mm', onePart: true });
    expect(one.parts).toHaveLength(1);
    expect(rel(area(one.parts[0]), 2400)).toBeLessThan(1e-15);
  });
  it('GeoJSON features are separate parts even where they overlap in space (each feature its own plate)', () => {
    const fc = { type: 'FeatureCollection', features: [0, 1].map((k) => ({ type: 'Feature', properties: { name: `p${k}` }, geometry: { type: 'Polygon', coordinates: [pads[0]] } })) };
    const r = readDrawing(JSON.stringify(fc), 'f.geojson', { units: 'mm' });
    expect(r.parts.map((p) => p.name)).toEqual(['p0', 'p1']);
  });
  it('a GeoJSON hole outside its own outline is refused naming the ring', () => {
    const poly = { type: 'Polygon', coordinates: [pads[0], [[50, 5], [55, 5], [55, 10], [50, 5]]] };
    const e = inputError(() => readDrawing(JSON.stringify(poly), 'h.geojson', { units: 'mm' }));
    expect(e.where).toBe('geojson coordinates[1]');
  });
});

describe('SVG structure: foreign namespaces, <use>/<symbol>, nested <svg>, percentages', () => {
  it('shapes in a foreign namespace are not measured, and are counted', () => {
    const t = `<svg ${NS} xmlns:cad="urn:example:cad" width="100mm" height="100mm" viewBox="0 0 100 100">
      <rect width="100" height="50"/><cad:rect width="10" height="10"/><cad:layer><rect width="5" height="5"/></cad:layer></svg>`;
    const r = readDrawing(t, 'f.svg');
    expect(r.parts).toHaveLength(1);
    expect(rel(area(r.parts[0]), 5000)).toBeLessThan(1e-15);
    expect(r.summary.ignored['foreign-namespace']).toBe(2);
  });
  it('<use> of a <symbol> with x/y offsets and nested transforms: three bolt holes πr² each', () => {
    const t = svg(`<defs><symbol id="bolt"><circle cx="0" cy="0" r="4"/></symbol></defs>
      <rect id="plate" x="10" y="10" width="160" height="80"/>
      <use href="#bolt" x="30" y="30"/>
      <g transform="translate(60 0)"><use xlink:href="#bolt" xmlns:xlink="http://www.w3.org/1999/xlink" x="30" y="30" transform="rotate(10)"/></g>
      <use href="#hole2"/>
      <g id="second"><use id="hole2" href="#bolt" x="140" y="70" transform="scale(1)"/></g>`);
    const r = readDrawing(t, 'u.svg');
    expect(r.parts).toHaveLength(1);
    // four holes: the last <use> refers to a <use>: 4 circles πr² less; the one at (140, 70) is drawn twice
    // (by its own element and through #hole2), so it is a duplicate removed
    expect(r.summary.duplicates).toHaveLength(1);
    expect(rel(area(r.parts[0]), 160 * 80 - 3 * Math.PI * 16)).toBeLessThan(1e-13);
  });
  it('a <use> cycle is refused naming the chain', () => {
    const t = svg('<rect width="10" height="10"/><g id="a"><use href="#b"/></g><g id="b"><use href="#a"/></g>');
    const e = inputError(() => readDrawing(t, 'c.svg'));
    expect(e.detail).toContain('must not loop');
  });
  it('a nested <svg> with its own viewBox scales its content; percentages take the viewport', () => {
    // inner viewport 50 × 25 user units showing a viewBox of 100 × 50: content at half size
    const t = svg(`<rect id="plate" x="0" y="0" width="100%" height="50%"/>
      <svg x="10" y="10" width="50" height="25" viewBox="0 0 100 50"><circle cx="50" cy="25" r="20"/></svg>`);
    const r = readDrawing(t, 'n.svg');
    expect(r.parts).toHaveLength(1);
    // plate 200 × 50 (100 % and 50 % of the 200 × 100 viewBox) minus a circle of radius 10: b·h − πr²
    expect(rel(area(r.parts[0]), 200 * 50 - Math.PI * 100)).toBeLessThan(1e-13);
  });
  it('names come from <title>, labels and ids that are not generated', () => {
    const t = svg(`<g inkscape:groupmode="layer" inkscape:label="Cut"><g id="g12"><rect id="rect234" x="0" y="0" width="10" height="10"/></g>
      <g inkscape:label="Gusset G2"><rect id="path5" x="20" y="0" width="10" height="10"/></g>
      <rect x="40" y="0" width="10" height="10"><title>Stiffener S1</title></rect></g>`);
    expect(readDrawing(t, 'names.svg').parts.map((p) => p.name)).toEqual(['names.svg-1', 'Gusset G2', 'Stiffener S1']);
  });
});
