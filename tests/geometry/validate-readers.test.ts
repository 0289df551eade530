/**
 * Shared validation reached through each drawing reader (readParts + preparePart): invalid polygons give
 * one InputError naming the element, feature or character offset where the bad ring is.
 */
import { describe, it, expect } from 'vitest';
import { readParts } from '../../src/read/read.js';
import { preparePart } from '../../src/analysis/measure.js';
import { InputError } from '../../src/base/errors.js';

function firstError(text: string, label: string): InputError {
  try {
    for (const p of readParts(text, label)) preparePart(p);
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError, got none');
}

describe('SVG: a self-intersecting path is refused, naming the element and path command', () => {
  // A closed subpath is one cut contour; a figure-eight cannot bound material (W3C SVG 1.1 §8.3 path data,
  // and the Simple Features rule that a ring is simple, OGC 06-103r4 §6.1.7.1).
  it('by id', () => {
    const e = firstError('<svg xmlns="http://www.w3.org/2000/svg"><rect width="100" height="100"/><path id="bow" d="M 10 10 L 40 40 L 40 10 L 10 40 Z"/></svg>', 'a.svg');
    expect(e.message).toMatch(/^svg path#bow command \d+: crosses or touches itself near \(/);
  });
  it('by position when the element has no id', () => {
    const e = firstError('<svg xmlns="http://www.w3.org/2000/svg"><path d="M 0 0 L 50 0 L 50 50 L 0 50 Z"/><path d="M 10 10 L 30 30 L 30 10 L 10 30 Z"/></svg>', 'b.svg');
    expect(e.message).toMatch(/^svg path\[2\] command \d+: crosses or touches itself/);
  });
});

describe('GeoJSON: rings that cross are refused, naming the feature and ring', () => {
  // RFC 7946 §3.1.6: the first ring is the exterior, the others are holes; Simple Features (OGC 06-103r4
  // §6.1.11.1) requires holes inside the exterior and rings that do not cross.
  const poly = (rings: number[][][]) => JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: rings } }] });
  const shell = [[0, 0], [10, 0], [10, 10], [0, 10], [0, 0]];
  it('a hole crossing the exterior ring', () => {
    const e = firstError(poly([shell, [[2, 2], [12, 3], [4, 4], [2, 2]]]), 'c.geojson');
    // changed in issue 12: the shared interpretation refuses crossings first, naming the earlier ring first
    expect(e.message).toMatch(/^geojson features\[0\]\.geometry\.coordinates\[0\]: crosses, touches or coincides with geojson features\[0\]\.geometry\.coordinates\[1\] at \(10, (?:2\.8|3\.25)\)/); // the hole's two edges meet x = 10 at y = 2.8 and y = 3.25 (by hand)
  });
  it('a hole crossing another hole', () => {
    const e = firstError(poly([shell, [[2, 2], [5, 2], [5, 5], [2, 2]], [[3, 1], [4, 1], [4, 8], [3, 1]]]), 'd.geojson');
    expect(e.message).toMatch(/^geojson features\[0\]\.geometry\.coordinates\[1\]: crosses, touches or coincides with geojson features\[0\]\.geometry\.coordinates\[2\]/);
  });
});

describe('WKT: a hole outside its shell is refused, naming the ring and its character offset', () => {
  // OGC 06-103r4 §6.1.11.1: interior rings lie inside the exterior ring.
  it('hole outside', () => {
    const text = 'POLYGON ((0 0, 10 0, 10 10, 0 10, 0 0), (20 20, 22 20, 22 22, 20 20))';
    const e = firstError(text, 'e.wkt');
    // changed in issue 12: the shared interpretation checks a declared hole against its own outline
    expect(e.message).toMatch(/^wkt geometry 0 ring 1 \(wkt character (\d+)\): is a hole of wkt geometry 0 ring 0 \(wkt character (\d+)\) but does not lie inside that outline alone/);
    const m = /ring 1 \(wkt character (\d+)\)/.exec(e.message)!;
    // the named offset (counted from 0) points at the ring's opening parenthesis
    expect(text[Number(m[1])]).toBe('(');
    expect(text.slice(Number(m[1]))).toMatch(/^\(20 20/);
  });
});
