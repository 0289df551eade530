/**
 * Bench inputs for reading drawings (invented geometry, for timing only): the same plate written as part
 * JSON, SVG and DXF, so that whole-process times can be compared format against format.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** Centres of n square holes (side 4) on a 10 mm grid, and the plate size around them. */
function grid(n: number): { holes: [number, number][]; W: number; H: number } {
  const nx = Math.ceil(Math.sqrt(n * 2)), ny = Math.ceil(n / nx);
  const holes: [number, number][] = [];
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx && holes.length < n; i++) holes.push([10 + i * 10, 10 + j * 10]);
  return { holes, W: nx * 10 + 10, H: ny * 10 + 10 };
}

function svgText(holes: [number, number][], W: number, H: number): string {
  const out = [`<svg xmlns="http://www.w3.org/2000/svg" width="${W}mm" height="${H}mm" viewBox="0 0 ${W} ${H}">`, `<path d="M0 0H${W}V${H}H0Z"/>`];
  for (const [x, y] of holes) out.push(`<path d="M${x - 2} ${y - 2}h4v4h-4z"/>`);
  out.push('</svg>', '');
  return out.join('\n');
}

/** An ASCII DXF of loose LINE entities (as CAM exports write plates), in millimetres ($INSUNITS 4). */
function dxfText(holes: [number, number][], W: number, H: number): string {
  const out: string[] = ['0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES'];
  let handle = 0x100;
  const line = (x0: number, y0: number, x1: number, y1: number) => {
    out.push('0', 'LINE', '5', (handle++).toString(16).toUpperCase(), '8', 'CUT', '10', String(x0), '20', String(y0), '30', '0', '11', String(x1), '21', String(y1), '31', '0');
  };
  const square = (x0: number, y0: number, x1: number, y1: number) => {
    line(x0, y0, x1, y0); line(x1, y0, x1, y1); line(x1, y1, x0, y1); line(x0, y1, x0, y0);
  };
  square(0, 0, W, H);
  for (const [x, y] of holes) square(x - 2, y - 2, x + 2, y + 2);
  out.push('0', 'ENDSEC', '0', 'EOF', '');
  return out.join('\n');
}

/** Write the n-hole plate as part JSON and SVG; returns their paths. */
export function writeHolePlate(dir: string, n: number): { json: string; svg: string } {
  const { holes, W, H } = grid(n);
  const json = join(dir, `holes-${n}.json`), svg = join(dir, `holes-${n}.svg`);
  writeFileSync(json, JSON.stringify({ part: 'holes', units: 'mm', note: 'generated for the benchmark', outline: { rectangle: { corner: [0, 0], size: [W, H] } }, cutouts: holes.map(([x, y]) => ({ rectangle: { corner: [x - 2, y - 2], size: [4, 4] } })) }));
  writeFileSync(svg, svgText(holes, W, H));
  return { json, svg };
}

/** The same plate as a DXF of `entities` loose LINEs (4 per square) and as SVG; returns their paths. */
export function writeLoosePlate(dir: string, entities: number): { dxf: string; svg: string } {
  const { holes, W, H } = grid(Math.max(0, Math.floor(entities / 4) - 1));
  const dxf = join(dir, `loose-${entities}.dxf`), svg = join(dir, `loose-${entities}.svg`);
  writeFileSync(dxf, dxfText(holes, W, H));
  writeFileSync(svg, svgText(holes, W, H));
  return { dxf, svg };
}

/**
 * The same plate (a rectangle with a grid of square holes, 4 vertices each, about n boundary vertices in
 * all) in five formats: part JSON, SVG, GeoJSON, WKT and DXF (LWPOLYLINEs). Returns the paths.
 */
export function writeFormats(dir: string, n: number): Record<'json' | 'svg' | 'geojson' | 'wkt' | 'dxf', string> {
  const { holes, W, H } = grid(Math.max(1, Math.floor(n / 4) - 1));
  const base = join(dir, `formats-${n}`);
  const p = { json: `${base}.json`, svg: `${base}.svg`, geojson: `${base}.geojson`, wkt: `${base}.wkt`, dxf: `${base}.dxf` };
  writeFileSync(p.json, JSON.stringify({ part: 'formats', units: 'mm', note: 'generated for the benchmark', outline: { polygon: [[0, 0], [W, 0], [W, H], [0, H]] }, cutouts: holes.map(([x, y]) => ({ polygon: [[x - 2, y - 2], [x + 2, y - 2], [x + 2, y + 2], [x - 2, y + 2]] })) }));
  writeFileSync(p.svg, svgText(holes, W, H));
  const ring = (pts: [number, number][]) => [...pts, pts[0]];
  const sq = (x: number, y: number): [number, number][] => [[x - 2, y - 2], [x - 2, y + 2], [x + 2, y + 2], [x + 2, y - 2]];
  const outer: [number, number][] = [[0, 0], [W, 0], [W, H], [0, H]];
  writeFileSync(p.geojson, JSON.stringify({ type: 'Feature', properties: { name: 'formats', description: 'generated for the benchmark' }, geometry: { type: 'Polygon', coordinates: [ring(outer), ...holes.map(([x, y]) => ring(sq(x, y)))] } }));
  const wktRing = (pts: [number, number][]) => `(${ring(pts).map(([x, y]) => `${x} ${y}`).join(', ')})`;
  writeFileSync(p.wkt, `POLYGON (${[wktRing(outer), ...holes.map(([x, y]) => wktRing(sq(x, y)))].join(', ')})\n`);
  const out: string[] = ['0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES'];
  let handle = 0x100;
  const poly = (pts: [number, number][]) => {
    out.push('0', 'LWPOLYLINE', '5', (handle++).toString(16).toUpperCase(), '8', 'CUT', '90', String(pts.length), '70', '1');
    for (const [x, y] of pts) out.push('10', String(x), '20', String(y));
  };
  poly(outer);
  for (const [x, y] of holes) poly(sq(x, y));
  out.push('0', 'ENDSEC', '0', 'EOF', '');
  writeFileSync(p.dxf, out.join('\n'));
  return p;
}
