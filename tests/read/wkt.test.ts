import { describe, it, expect } from 'vitest';
import { readWkt } from '../../src/read/wkt.js';
import { detectFormat } from '../../src/read/detect.js';
import { InputError } from '../../src/base/errors.js';
import { loopSignedArea, type Part } from '../../src/geometry/part.js';

const partArea = (p: Part) => p.regions.reduce((s, r) => s + loopSignedArea(r.outer) + r.holes.reduce((t, h) => t + loopSignedArea(h), 0), 0);
function inputError(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('OGC 06-103r4 (Simple Features 1.2.1) WKT examples', () => {
  it('Polygon ((10 10, 10 20, 20 20, 20 15, 10 10)) — table 7 example (from memory); shoelace by hand: 75', () => {
    const p = readWkt('Polygon ((10 10, 10 20, 20 20, 20 15, 10 10))');
    expect(p).toHaveLength(1);
    expect(partArea(p[0])).toBeCloseTo(75, 12);
  });
  it('MultiPolygon (((10 10, 10 20, 20 20, 20 15, 10 10)), ((60 60, 70 70, 80 60, 60 60))) — table 7 (from memory): 75 and 100, two parts (changed in issue 12)', () => {
    const p = readWkt('MultiPolygon (((10 10, 10 20, 20 20, 20 15, 10 10)), ((60 60, 70 70, 80 60, 60 60 )))');
    expect(p).toHaveLength(2);
    expect(partArea(p[0])).toBeCloseTo(75, 12);
    expect(partArea(p[1])).toBeCloseTo(100, 12);
  });
  it('polygon with a hole: POLYGON ((35 10, 45 45, 15 40, 10 20, 35 10), (20 30, 35 35, 30 20, 20 30)) — shoelace by hand 775 − 100', () => {
    // the common textbook example of WKT (from memory)
    const p = readWkt('POLYGON ((35 10, 45 45, 15 40, 10 20, 35 10),\n(20 30, 35 35, 30 20, 20 30))', { units: 'cm', fileLabel: 'plate' });
    expect(p[0].name).toBe('plate');
    expect(p[0].units).toBe('cm');
    expect(p[0].regions[0].holes).toHaveLength(1);
    expect(partArea(p[0])).toBeCloseTo(675, 12);
  });
  it('Z and M ordinates are ignored; a third number without the tag is refused with its offset', () => {
    expect(partArea(readWkt('POLYGON Z ((0 0 1, 2 0 1, 2 2 1, 0 0 1))')[0])).toBeCloseTo(2, 12);
    expect(partArea(readWkt('polygon zm ((0 0 1 9, 2 0 1 9, 2 2 1 9, 0 0 1 9))')[0])).toBeCloseTo(2, 12);
    const e = inputError(() => readWkt('POLYGON ((0 0 1, 2 0 1, 2 2 1, 0 0 1))'));
    expect(e.where).toBe('wkt character 10 (line 1, column 11)');
    expect(e.detail).toContain('POLYGON Z');
  });
  it('EMPTY: skipped inside a MULTIPOLYGON; a file with nothing else is an error', () => {
    const p = readWkt('MULTIPOLYGON (EMPTY, ((0 0, 1 0, 1 1, 0 0)))');
    expect(p[0].regions).toHaveLength(1);
    expect(inputError(() => readWkt('POLYGON EMPTY')).detail).toContain('EMPTY');
  });
  it('several geometries → several parts; SRID=0 prefix skipped (changed in issue 12: SRID=4326 is refused, see wkt-units tests)', () => {
    const p = readWkt('SRID=0;POLYGON ((0 0, 1 0, 1 1, 0 0))\nPOLYGON ((0 0, 2 0, 2 2, 0 0));', { fileLabel: 'b' });
    expect(p.map((x) => x.name)).toEqual(['b-1', 'b-2']);
  });
  it('errors carry the character offset: unclosed ring, unknown type, missing parenthesis', () => {
    const e = inputError(() => readWkt('POLYGON ((0 0, 1 0, 1 1, 0 1))'));
    expect(e.where).toBe('wkt character 25 (line 1, column 26)');
    expect(inputError(() => readWkt('  LINESTRING (0 0, 1 1)')).where).toBe('wkt character 2 (line 1, column 3)');
    expect(inputError(() => readWkt('POLYGON ((0 0, 1 0, 1 1, 0 0)')).detail).toContain("')'");
  });
});

describe('detectFormat', () => {
  it('by extension, with .json split on a GeoJSON "type" (RFC 7946 1.4 type names)', () => {
    expect(detectFormat('a.svg', '')).toBe('svg');
    expect(detectFormat('a.GeoJSON', '')).toBe('geojson');
    expect(detectFormat('a.wkt', '')).toBe('wkt');
    expect(detectFormat('a.platewise.json', '{"name": "p"}')).toBe('part-json');
    expect(detectFormat('a.json', '{"type": "FeatureCollection", "features": []}')).toBe('geojson');
  });
  it('by content when there is no name', () => {
    expect(detectFormat(undefined, '<?xml version="1.0"?><svg/>')).toBe('svg');
    expect(detectFormat(undefined, ' {"type": "Polygon", "coordinates": []}')).toBe('geojson');
    expect(detectFormat(undefined, '{"name": "x", "outline": {}}')).toBe('part-json');
    expect(detectFormat(undefined, 'multipolygon (((0 0, 1 0, 1 1, 0 0)))')).toBe('wkt');
    expect(() => detectFormat(undefined, 'hello')).toThrow(InputError);
  });
});
