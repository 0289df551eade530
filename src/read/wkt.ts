/**
 * Well-known text reader (OGC 06-103r4, Simple Feature Access Part 1, version 1.2.1, section 7):
 * POLYGON and MULTIPOLYGON, case-insensitive, with the Z, M and ZM forms accepted and the extra ordinates
 * ignored; EMPTY accepted (an empty polygon adds nothing). Several geometries may follow one another
 * (separated by white space, new lines or ';'). The result is a Drawing whose rings remember their polygon
 * and index; the shared interpretation makes one part per polygon (per MULTIPOLYGON component too).
 * Coordinates are plane lengths (option `units`; without it mm, an assumption the summary reports). An EWKT
 * "SRID=n;" prefix naming a geographic system (EPSG 4326, 4258, 4269, …: degrees) is refused; any other
 * non-zero SRID needs the units option.
 * Errors name the character offset (0-based) and the line and column.
 */
import { InputError } from '../base/errors.js';
import type { Loop, Part, Region } from '../geometry/part.js';
import type { Segment } from '../geometry/segments.js';
import type { LengthUnit } from '../base/units.js';
import type { Drawing, DrawingUnits, DrawnContour } from './drawing.js';
import { GEOGRAPHIC_EPSG } from './geojson.js';
import { type InterpretOptions, interpretDrawing } from './interpret.js';
import { lineColumn } from './xml.js';

export interface WktOptions extends InterpretOptions {
  units?: LengthUnit;
  /** Read coordinates as lengths in `units` even though an SRID names a geographic or other system. */
  unitsOverride?: boolean;
  fileLabel?: string;
}

type Tok = { kind: 'word' | 'num' | '(' | ')' | ',' | ';' | 'end'; text: string; at: number };

const NUM = /[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/y;

/** Most tokens read from one WKT text (about a million points): memory stays far under 1 GB (issue 16). */
export const MAX_WKT_TOKENS = 3_000_000;

function tokenize(text: string, where: (at: number) => string, srids: { srid: number; at: number }[]): Tok[] {
  const out: Tok[] = [];
  let i = 0;
  while (i < text.length) {
    if (out.length > MAX_WKT_TOKENS) throw new InputError(where(i), `holds more than ${MAX_WKT_TOKENS} tokens (about ${MAX_WKT_TOKENS / 3} points), the limit for one drawing; split it or simplify it`);
    const c = text[i];
    if (/\s/.test(c)) { i++; continue; }
    if (c === '(' || c === ')' || c === ',' || c === ';') { out.push({ kind: c, text: c, at: i }); i++; continue; }
    if (/[A-Za-z]/.test(c)) {
      const s = i;
      while (i < text.length && /[A-Za-z_]/.test(text[i])) i++;
      // EWKT "SRID=4326;" prefix
      if (text.slice(s, i).toUpperCase() === 'SRID' && text[i] === '=') {
        const m = /=\s*(\d+)\s*;/y;
        m.lastIndex = i;
        const r = m.exec(text);
        if (!r) throw new InputError(where(i), 'expected SRID=<integer>; before the geometry');
        srids.push({ srid: Number(r[1]), at: s });
        i = m.lastIndex;
        continue;
      }
      out.push({ kind: 'word', text: text.slice(s, i).toUpperCase(), at: s });
      continue;
    }
    NUM.lastIndex = i;
    const m = NUM.exec(text);
    if (m) { out.push({ kind: 'num', text: m[0], at: i }); i += m[0].length; continue; }
    throw new InputError(where(i), `unexpected character "${c}"; expected a keyword, a number, '(', ')' or ','`);
  }
  out.push({ kind: 'end', text: 'the end of the text', at: text.length });
  return out;
}

/** Read WKT text into a Drawing (rings with their polygon and index). */
export function readWktDrawing(text: string, opts: WktOptions = {}): Drawing {
  const label = opts.fileLabel ?? 'wkt';
  const where = (at: number) => `wkt character ${at} (${lineColumn(text, at)})`;
  const srids: { srid: number; at: number }[] = [];
  const toks = tokenize(text, where, srids);
  let units: DrawingUnits = opts.units !== undefined ? { unit: opts.units, source: 'option' } : { unit: 'mm', source: 'assumed', detail: { assumed: 'mm' } };
  for (const { srid, at } of srids) {
    if (srid === 0) continue;
    if (GEOGRAPHIC_EPSG.has(srid) && !(opts.units !== undefined && opts.unitsOverride)) {
      throw new InputError(where(at), `SRID=${srid} is a geographic system: coordinates are degrees of longitude and latitude, not lengths; export plane coordinates, or give the units with the override to read the numbers as lengths`);
    }
    if (opts.units === undefined) throw new InputError(where(at), `SRID=${srid}: the length unit of this system is not read from the file; give the units option`);
    units = { unit: opts.units, source: 'option', detail: { srid } };
  }
  let k = 0;
  const peek = () => toks[k];
  const expect = (kind: Tok['kind'], what: string): Tok => {
    const t = toks[k];
    if (t.kind !== kind) throw new InputError(where(t.at), `expected ${what}, got ${t.kind === 'end' ? t.text : `"${t.text}"`}`);
    k++;
    return t;
  };
  const isEmpty = () => peek().kind === 'word' && peek().text === 'EMPTY' ? (k++, true) : false;

  const ring = (dims: number, tag: string, ringLabel: string): Loop | null => {
    if (isEmpty()) return null;
    const open = expect('(', "'(' to start a ring or EMPTY");
    const pts: { x: number; y: number; at: number }[] = [];
    for (;;) {
      const first = peek();
      const nums: number[] = [];
      while (peek().kind === 'num') nums.push(Number(toks[k++].text));
      if (nums.length !== dims) {
        const hint = nums.length > dims && tag === '' ? ` (write POLYGON Z or POLYGON M for ${nums.length} ordinates)` : '';
        throw new InputError(where(first.at), `expected a point of ${dims} numbers${tag ? ` (${tag})` : ''}, got ${nums.length}${hint}`);
      }
      if (!nums.every(Number.isFinite)) throw new InputError(where(first.at), 'expected finite numbers');
      pts.push({ x: nums[0], y: nums[1], at: first.at });
      if (peek().kind === ',') { k++; continue; }
      expect(')', "',' or ')' after a point");
      break;
    }
    if (pts.length < 4) throw new InputError(where(open.at), `expected a closed ring of at least 4 points, got ${pts.length}`);
    const a = pts[0], b = pts[pts.length - 1];
    if (a.x !== b.x || a.y !== b.y) {
      throw new InputError(where(b.at), `expected the ring to end at its first point (${a.x} ${a.y}), got (${b.x} ${b.y}); a linear ring is closed (OGC 06-103r4, 6.1.7)`);
    }
    pts.pop();
    const d: { x: number; y: number }[] = [];
    for (const p of pts) { const q = d[d.length - 1]; if (!q || q.x !== p.x || q.y !== p.y) d.push(p); }
    if (d.length > 1 && d[0].x === d[d.length - 1].x && d[0].y === d[d.length - 1].y) d.pop();
    if (d.length < 3) throw new InputError(where(open.at), `expected at least 3 distinct points, got ${d.length}`);
    const segments: Segment[] = d.map((p, j) => ({ kind: 'line', x0: p.x, y0: p.y, x1: d[(j + 1) % d.length].x, y1: d[(j + 1) % d.length].y }));
    return { segments, where: `${ringLabel} (wkt character ${open.at})` };
  };

  const polygon = (dims: number, tag: string, polyLabel: string): Region | null => {
    if (isEmpty()) return null;
    const open = expect('(', "'(' to start a polygon or EMPTY");
    const loops: (Loop | null)[] = [];
    for (;;) {
      loops.push(ring(dims, tag, `${polyLabel} ring ${loops.length}`));
      if (peek().kind === ',') { k++; continue; }
      expect(')', "',' or ')' after a ring");
      break;
    }
    if (loops[0] === null) {
      if (loops.some((l) => l !== null)) throw new InputError(where(open.at), 'expected an outline ring first; it is EMPTY but holes follow');
      return null;
    }
    return { outer: loops[0], holes: loops.slice(1).filter((l): l is Loop => l !== null) };
  };

  const parts: { regions: Region[]; at: number }[] = [];
  while (peek().kind !== 'end') {
    if (peek().kind === ';') { k++; continue; }
    const kw = expect('word', 'POLYGON or MULTIPOLYGON');
    if (kw.text !== 'POLYGON' && kw.text !== 'MULTIPOLYGON') {
      throw new InputError(where(kw.at), `expected POLYGON or MULTIPOLYGON (a plate needs an area), got ${kw.text}`);
    }
    let dims = 2, tag = '';
    if (peek().kind === 'word' && ['Z', 'M', 'ZM'].includes(peek().text)) {
      tag = toks[k++].text;
      dims = tag === 'ZM' ? 4 : 3;
    }
    const g = parts.length;
    const base = `wkt geometry ${g}`;
    const regions: Region[] = [];
    if (kw.text === 'POLYGON') {
      const r = polygon(dims, tag, base);
      if (r) regions.push(r);
    } else if (!isEmpty()) {
      expect('(', "'(' to start the polygons or EMPTY");
      for (let j = 0; ; j++) {
        const r = polygon(dims, tag, `${base} polygon ${j}`);
        if (r) regions.push(r);
        if (peek().kind === ',') { k++; continue; }
        expect(')', "',' or ')' after a polygon");
        break;
      }
    }
    parts.push({ regions, at: kw.at });
  }
  const nonEmpty = parts.filter((p) => p.regions.length > 0);
  if (nonEmpty.length === 0) {
    throw new InputError(parts.length > 0 ? where(parts[0].at) : 'wkt', parts.length > 0 ? 'the geometry is EMPTY; expected at least one polygon' : 'expected POLYGON or MULTIPOLYGON, found nothing');
  }
  const contours: DrawnContour[] = [];
  parts.forEach((p, g) => p.regions.forEach((r, j) => {
    const key = `${g}.${j}`;
    [r.outer, ...r.holes].forEach((l, index) => {
      contours.push({ segments: l.segments, closed: true, where: l.where ?? `wkt geometry ${g}`, ring: { polygon: key, index }, group: `${g}` });
    });
  }));
  return { format: 'wkt', label, units, contours, ignored: {} };
}

/** Read WKT text into parts: one per polygon (through the shared interpretation). */
export function readWkt(text: string, opts: WktOptions = {}): Part[] {
  return interpretDrawing(readWktDrawing(text, opts), opts).parts;
}
