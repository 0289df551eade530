import { describe, it, expect } from 'vitest';
import { readGeoJson } from '../../src/read/geojson.js';
import { InputError } from '../../src/base/errors.js';
import { loopSignedArea, type Part } from '../../src/geometry/part.js';

const partArea = (p: Part) => p.regions.reduce((s, r) => s + loopSignedArea(r.outer) + r.holes.reduce((t, h) => t + loopSignedArea(h), 0), 0);
function inputError(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('RFC 7946 appendix A examples', () => {
  it('A.3 Polygon without holes: unit square, area 1', () => {
    const p = readGeoJson('{"type": "Polygon", "coordinates": [[[100.0, 0.0], [101.0, 0.0], [101.0, 1.0], [100.0, 1.0], [100.0, 0.0]]]}');
    expect(p).toHaveLength(1);
    expect(p[0].units).toBe('mm');
    expect(partArea(p[0])).toBeCloseTo(1, 12);
  });
  it('A.3 Polygon with a hole: 1 − 0.6² = 0.64', () => {
    const p = readGeoJson(`{"type": "Polygon", "coordinates": [
      [[100.0, 0.0], [101.0, 0.0], [101.0, 1.0], [100.0, 1.0], [100.0, 0.0]],
      [[100.8, 0.8], [100.8, 0.2], [100.2, 0.2], [100.2, 0.8], [100.8, 0.8]]]}`);
    expect(p[0].regions[0].holes).toHaveLength(1);
    expect(partArea(p[0])).toBeCloseTo(0.64, 12);
    // after normalising, the outline runs counter-clockwise and the hole clockwise
    expect(loopSignedArea(p[0].regions[0].outer)).toBeGreaterThan(0);
    expect(loopSignedArea(p[0].regions[0].holes[0])).toBeLessThan(0);
  });
  it('A.6 MultiPolygon: two parts (changed in issue 12: disjoint pieces are separate parts), 1 and 0.64', () => {
    const p = readGeoJson(`{"type": "MultiPolygon", "coordinates": [
      [[[102.0, 2.0], [103.0, 2.0], [103.0, 3.0], [102.0, 3.0], [102.0, 2.0]]],
      [[[100.0, 0.0], [101.0, 0.0], [101.0, 1.0], [100.0, 1.0], [100.0, 0.0]],
       [[100.2, 0.2], [100.2, 0.8], [100.8, 0.8], [100.8, 0.2], [100.2, 0.2]]]]}`, { units: 'in' });
    expect(p).toHaveLength(2);
    expect(p[0].units).toBe('in');
    expect(p[0].unitSource).toBe('option');
    expect(partArea(p[0])).toBeCloseTo(1, 12);
    expect(partArea(p[1])).toBeCloseTo(0.64, 12);
  });
  it('1.5 example FeatureCollection (Point, LineString, Polygon): the Point is rejected, naming its path', () => {
    // RFC 7946, section 1.5 (abridged)
    const fc = `{"type": "FeatureCollection", "features": [
      {"type": "Feature", "geometry": {"type": "Point", "coordinates": [102.0, 0.5]}, "properties": {"prop0": "value0"}},
      {"type": "Feature", "geometry": {"type": "Polygon", "coordinates": [[[100.0, 0.0], [101.0, 0.0], [101.0, 1.0], [100.0, 1.0], [100.0, 0.0]]]}, "properties": {}}]}`;
    const e = inputError(() => readGeoJson(fc));
    expect(e.where).toBe('features[0].geometry.type');
  });
});

describe('features, names and errors', () => {
  it('one part per feature; properties.name names it, else the file label and an index', () => {
    const fc = {
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', properties: { name: 'gusset A' }, geometry: { type: 'Polygon', coordinates: [[[0, 0], [4, 0], [0, 3], [0, 0]]] } },
        { type: 'Feature', properties: null, geometry: { type: 'Polygon', coordinates: [[[0, 0], [2, 0], [2, 2], [0, 2], [0, 0]]] } },
      ],
    };
    const p = readGeoJson(JSON.stringify(fc), { fileLabel: 'plates' });
    expect(p.map((x) => x.name)).toEqual(['gusset A', 'plates-2']);
    expect(partArea(p[0])).toBeCloseTo(6, 12);
    expect(p[0].regions[0].outer.where).toBe('geojson features[0].geometry.coordinates[0]');
  });
  it('an unclosed ring names the offending position (RFC 7946 3.1.6: first and last positions identical)', () => {
    const fc = { type: 'FeatureCollection', features: [
      { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] } },
      { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] } },
      { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[0, 0], [5, 0], [5, 5], [0, 5], [0, 0]], [[1, 1], [2, 1], [2, 2], [1, 2]]] } },
    ] };
    const e = inputError(() => readGeoJson(JSON.stringify(fc)));
    expect(e.where).toBe('features[2].geometry.coordinates[1][3]');
    expect(e.detail).toContain('repeat the first');
  });
  it('bad JSON, bad positions and too-short rings are InputErrors', () => {
    expect(inputError(() => readGeoJson('{"type": "Polygon", ')).where).toBe('geojson');
    expect(inputError(() => readGeoJson('{"type":"Polygon","coordinates":[[[0,0],[1,"a"],[1,1],[0,0]]]}')).where).toBe('coordinates[0][1][1]');
    expect(inputError(() => readGeoJson('{"type":"Polygon","coordinates":[[[0,0],[1,1],[0,0]]]}')).where).toBe('coordinates[0]');
    expect(inputError(() => readGeoJson('{"type":"Topology"}')).where).toBe('type');
  });
  it('altitude is ignored', () => {
    const p = readGeoJson('{"type":"Polygon","coordinates":[[[0,0,5],[2,0,5],[2,2,7],[0,2,1],[0,0,5]]]}');
    expect(partArea(p[0])).toBeCloseTo(4, 12);
  });
});
