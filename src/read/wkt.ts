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

type TokKind = 'word' | 'num' | '(' | ')' | ',' | ';' | 'end';

const NUM = /[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/y;

/** Most tokens read from one WKT text (about 2 million points): memory stays far under 1 GB (issue 16). */
export const MAX_WKT_TOKENS = 6_000_000;

/**
 * The tokens of a WKT text in typed arrays (kind, position, length, value): a million-point polygon is 3–4
 * million tokens, which as one object each took several hundred MB.
 */
class Tokens {
  n = 0;
  kind = new Uint8Array(1024);
  at = new Uint32Array(1024);
  len = new Uint32Array(1024);
  value = new Float64Array(1024);
  /** Upper-cased keywords, by token index. */
  words = new Map<number, string>();
  constructor(readonly text: string) {}
  push(kind: number, at: number, len: number, value: number): void {
    if (this.n === this.kind.length) {
      const grow = <T extends Uint8Array | Uint32Array | Float64Array>(a: T): T => { const b = new (a.constructor as new (n: number) => T)(2 * a.length); b.set(a); return b; };
      this.kind = grow(this.kind); this.at = grow(this.at); this.len = grow(this.len); this.value = grow(this.value);
    }
    this.kind[this.n] = kind; this.at[this.n] = at; this.len[this.n] = len; this.value[this.n] = value;
    this.n++;
  }
  kindOf(k: number): TokKind { return KINDS[this.kind[k]]; }
  textOf(k: number): string {
    const kind = this.kind[k];
    if (kind === K_WORD) return this.words.get(k)!;
    if (kind === K_END) return 'the end of the text';
    return this.text.slice(this.at[k], this.at[k] + this.len[k]);
  }
}
const KINDS: readonly TokKind[] = ['word', 'num', '(', ')', ',', ';', 'end'];
const K_WORD = 0, K_NUM = 1, K_END = 6;
const PUNCT: Record<string, number> = { '(': 2, ')': 3, ',': 4, ';': 5 };

const isLetter = (c: number) => (c >= 65 && c <= 90) || (c >= 97 && c <= 122);

function tokenize(text: string, where: (at: number) => string, srids: { srid: number; at: number }[]): Tokens {
  const out = new Tokens(text);
  let i = 0;
  while (i < text.length) {
    if (out.n > MAX_WKT_TOKENS) throw new InputError(where(i), `holds more than ${MAX_WKT_TOKENS} tokens (about ${Math.round(MAX_WKT_TOKENS / 3)} points), the limit for one drawing; split it or simplify it`);
    const code = text.charCodeAt(i);
    // white space: the ASCII kinds at once, anything else as \s decides
    if (code === 32 || (code >= 9 && code <= 13) || (code >= 128 && /\s/.test(text[i]))) { i++; continue; }
    const c = text[i];
    const p = PUNCT[c];
    if (p !== undefined) { out.push(p, i, 1, 0); i++; continue; }
    if (isLetter(code)) {
      const s = i;
      while (i < text.length && (isLetter(text.charCodeAt(i)) || text[i] === '_')) i++;
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
      out.words.set(out.n, text.slice(s, i).toUpperCase());
      out.push(K_WORD, s, i - s, 0);
      continue;
    }
    NUM.lastIndex = i;
    const m = NUM.exec(text);
    if (m) { out.push(K_NUM, i, m[0].length, Number(m[0])); i += m[0].length; continue; }
    throw new InputError(where(i), `unexpected character "${c}"; expected a keyword, a number, '(', ')' or ','`);
  }
  out.push(K_END, text.length, 0, 0);
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
  const kindNow = () => toks.kindOf(k);
  /** The current token, which must be of `kind`; returns its position in the text. */
  const expect = (kind: TokKind, what: string): number => {
    const got = toks.kindOf(k);
    if (got !== kind) throw new InputError(where(toks.at[k]), `expected ${what}, got ${got === 'end' ? toks.textOf(k) : `"${toks.textOf(k)}"`}`);
    return toks.at[k++];
  };
  const isEmpty = () => kindNow() === 'word' && toks.textOf(k) === 'EMPTY' ? (k++, true) : false;

  const ring = (dims: number, tag: string, ringLabel: string): Loop | null => {
    if (isEmpty()) return null;
    const openAt = expect('(', "'(' to start a ring or EMPTY");
    const pts: { x: number; y: number; at: number }[] = [];
    for (;;) {
      const first = k;
      while (toks.kind[k] === K_NUM) k++;
      const count = k - first;
      if (count !== dims) {
        const hint = count > dims && tag === '' ? ` (write POLYGON Z or POLYGON M for ${count} ordinates)` : '';
        throw new InputError(where(toks.at[first]), `expected a point of ${dims} numbers${tag ? ` (${tag})` : ''}, got ${count}${hint}`);
      }
      for (let j = first; j < k; j++) if (!Number.isFinite(toks.value[j])) throw new InputError(where(toks.at[first]), 'expected finite numbers');
      pts.push({ x: toks.value[first], y: toks.value[first + 1], at: toks.at[first] });
      if (kindNow() === ',') { k++; continue; }
      expect(')', "',' or ')' after a point");
      break;
    }
    if (pts.length < 4) throw new InputError(where(openAt), `expected a closed ring of at least 4 points, got ${pts.length}`);
    const a = pts[0], b = pts[pts.length - 1];
    if (a.x !== b.x || a.y !== b.y) {
      throw new InputError(where(b.at), `expected the ring to end at its first point (${a.x} ${a.y}), got (${b.x} ${b.y}); a linear ring is closed (OGC 06-103r4, 6.1.7)`);
    }
    pts.pop();
    const d: { x: number; y: number }[] = [];
    for (const p of pts) { const q = d[d.length - 1]; if (!q || q.x !== p.x || q.y !== p.y) d.push(p); }
    if (d.length > 1 && d[0].x === d[d.length - 1].x && d[0].y === d[d.length - 1].y) d.pop();
    if (d.length < 3) throw new InputError(where(openAt), `expected at least 3 distinct points, got ${d.length}`);
    const segments: Segment[] = d.map((p, j) => ({ kind: 'line', x0: p.x, y0: p.y, x1: d[(j + 1) % d.length].x, y1: d[(j + 1) % d.length].y }));
    return { segments, where: `${ringLabel} (wkt character ${openAt})` };
  };

  const polygon = (dims: number, tag: string, polyLabel: string): Region | null => {
    if (isEmpty()) return null;
    const openAt = expect('(', "'(' to start a polygon or EMPTY");
    const loops: (Loop | null)[] = [];
    for (;;) {
      loops.push(ring(dims, tag, `${polyLabel} ring ${loops.length}`));
      if (kindNow() === ',') { k++; continue; }
      expect(')', "',' or ')' after a ring");
      break;
    }
    if (loops[0] === null) {
      if (loops.some((l) => l !== null)) throw new InputError(where(openAt), 'expected an outline ring first; it is EMPTY but holes follow');
      return null;
    }
    return { outer: loops[0], holes: loops.slice(1).filter((l): l is Loop => l !== null) };
  };

  const parts: { regions: Region[]; at: number }[] = [];
  while (kindNow() !== 'end') {
    if (kindNow() === ';') { k++; continue; }
    const kwText = toks.kindOf(k) === 'word' ? toks.textOf(k) : '';
    const kwAt = expect('word', 'POLYGON or MULTIPOLYGON');
    if (kwText !== 'POLYGON' && kwText !== 'MULTIPOLYGON') {
      throw new InputError(where(kwAt), `expected POLYGON or MULTIPOLYGON (a plate needs an area), got ${kwText}`);
    }
    let dims = 2, tag = '';
    if (kindNow() === 'word' && ['Z', 'M', 'ZM'].includes(toks.textOf(k))) {
      tag = toks.textOf(k++);
      dims = tag === 'ZM' ? 4 : 3;
    }
    const g = parts.length;
    const base = `wkt geometry ${g}`;
    const regions: Region[] = [];
    if (kwText === 'POLYGON') {
      const r = polygon(dims, tag, base);
      if (r) regions.push(r);
    } else if (!isEmpty()) {
      expect('(', "'(' to start the polygons or EMPTY");
      for (let j = 0; ; j++) {
        const r = polygon(dims, tag, `${base} polygon ${j}`);
        if (r) regions.push(r);
        if (kindNow() === ',') { k++; continue; }
        expect(')', "',' or ')' after a polygon");
        break;
      }
    }
    parts.push({ regions, at: kwAt });
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
