/**
 * GeoJSON reader (RFC 7946): Polygon, MultiPolygon, GeometryCollection, Feature and FeatureCollection.
 * Each Feature (or a bare geometry) is one part; each Polygon is one region, its first ring the outline and
 * the others holes. Rings must be closed (RFC 7946, 3.1.6: first and last positions identical).
 *
 * Deviation from RFC 7946, on purpose: coordinates are plane lengths in the part's unit (default mm, option
 * `units`), not WGS 84 longitude/latitude. A third (altitude) coordinate is ignored; `bbox`, `crs` and foreign
 * members are ignored. Ring orientation is not required (the right-hand rule of 3.1.6 is a SHOULD).
 */
import { InputError, describeValue } from '../base/errors.js';
import { type Loop, type Part, type Region, normalizePart } from '../geometry/part.js';
import type { Segment } from '../geometry/segments.js';
import type { LengthUnit } from '../base/units.js';

export interface GeoJsonOptions {
  /** Unit of the coordinates (default mm). */
  units?: LengthUnit;
  /** Used in part names when a feature has no properties.name. */
  fileLabel?: string;
}

const GEOMETRY_TYPES = new Set(['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon', 'GeometryCollection']);
export const GEOJSON_TYPES: ReadonlySet<string> = new Set([...GEOMETRY_TYPES, 'Feature', 'FeatureCollection']);

const join = (path: string, key: string | number) =>
  typeof key === 'number' ? `${path}[${key}]` : path === '' ? key : `${path}.${key}`;

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function ringLoop(ring: unknown, path: string): Loop {
  if (!Array.isArray(ring)) throw new InputError(path, `expected a ring (an array of positions), got ${describeValue(ring)}`);
  if (ring.length < 4) throw new InputError(path, `expected a closed ring of at least 4 positions (RFC 7946, 3.1.6), got ${ring.length}`);
  const pts: [number, number][] = ring.map((p, k) => {
    const w = join(path, k);
    if (!Array.isArray(p) || p.length < 2) throw new InputError(w, `expected a position [x, y], got ${describeValue(p)}`);
    for (let j = 0; j < p.length; j++) {
      if (typeof p[j] !== 'number' || !Number.isFinite(p[j])) throw new InputError(join(w, j), `expected a finite number, got ${describeValue(p[j])}`);
    }
    return [p[0] as number, p[1] as number];
  });
  const a = pts[0], b = pts[pts.length - 1];
  if (a[0] !== b[0] || a[1] !== b[1]) {
    throw new InputError(join(path, pts.length - 1), `expected the last position to repeat the first [${a[0]}, ${a[1]}] (a closed ring, RFC 7946, 3.1.6), got [${b[0]}, ${b[1]}]`);
  }
  pts.pop();
  const distinct: [number, number][] = [];
  for (const p of pts) {
    const q = distinct[distinct.length - 1];
    if (!q || q[0] !== p[0] || q[1] !== p[1]) distinct.push(p);
  }
  if (distinct.length > 1 && distinct[0][0] === distinct[distinct.length - 1][0] && distinct[0][1] === distinct[distinct.length - 1][1]) distinct.pop();
  if (distinct.length < 3) throw new InputError(path, `expected at least 3 distinct positions, got ${distinct.length}`);
  const segments: Segment[] = distinct.map((p, k) => {
    const q = distinct[(k + 1) % distinct.length];
    return { kind: 'line', x0: p[0], y0: p[1], x1: q[0], y1: q[1] };
  });
  return { segments, where: `geojson ${path}` };
}

function polygonRegion(coords: unknown, path: string): Region {
  if (!Array.isArray(coords) || coords.length === 0) {
    throw new InputError(path, `expected an array of rings (outline first, then holes), got ${describeValue(coords)}`);
  }
  const loops = coords.map((r, k) => ringLoop(r, join(path, k)));
  return { outer: loops[0], holes: loops.slice(1) };
}

/** Regions of a geometry object (Polygon, MultiPolygon or a GeometryCollection of them). */
function geometryRegions(g: unknown, path: string): Region[] {
  if (!isObject(g)) throw new InputError(path, `expected a geometry object, got ${describeValue(g)}`);
  const type = g.type;
  switch (type) {
    case 'Polygon':
      return [polygonRegion(g.coordinates, join(path, 'coordinates'))];
    case 'MultiPolygon': {
      const c = g.coordinates;
      const w = join(path, 'coordinates');
      if (!Array.isArray(c)) throw new InputError(w, `expected an array of polygons, got ${describeValue(c)}`);
      return c.map((p, k) => polygonRegion(p, join(w, k)));
    }
    case 'GeometryCollection': {
      const gs = g.geometries;
      const w = join(path, 'geometries');
      if (!Array.isArray(gs)) throw new InputError(w, `expected an array of geometries, got ${describeValue(gs)}`);
      return gs.flatMap((x, k) => geometryRegions(x, join(w, k)));
    }
    default:
      throw new InputError(join(path, 'type'), `expected "Polygon", "MultiPolygon" or "GeometryCollection" (a plate needs an area), got ${describeValue(type)}`);
  }
}

/** Parts from an already parsed GeoJSON value. */
export function geoJsonToParts(value: unknown, opts: GeoJsonOptions = {}): Part[] {
  const label = opts.fileLabel ?? 'geojson';
  const units = opts.units ?? 'mm';
  if (!isObject(value)) throw new InputError('', `expected a GeoJSON object, got ${describeValue(value)}`);
  const make = (regions: Region[], name: string, path: string): Part => {
    if (regions.length === 0) throw new InputError(path, 'expected at least one polygon, found none');
    return normalizePart({ name, units, regions });
  };
  const featureName = (f: Record<string, unknown>, path: string, fallback: string): string => {
    const props = f.properties;
    if (props === undefined || props === null) return fallback;
    if (!isObject(props)) throw new InputError(join(path, 'properties'), `expected an object or null, got ${describeValue(props)}`);
    const n = props.name;
    if (n === undefined || n === null) return fallback;
    if (typeof n !== 'string' || n.trim() === '') throw new InputError(join(join(path, 'properties'), 'name'), `expected a non-empty string, got ${describeValue(n)}`);
    return n;
  };
  switch (value.type) {
    case 'FeatureCollection': {
      const fs = value.features;
      if (!Array.isArray(fs)) throw new InputError('features', `expected an array of features, got ${describeValue(fs)}`);
      if (fs.length === 0) throw new InputError('features', 'expected at least one feature, found none');
      return fs.map((f, k) => {
        const w = join('features', k);
        if (!isObject(f) || f.type !== 'Feature') throw new InputError(join(w, 'type'), `expected "Feature", got ${describeValue(isObject(f) ? f.type : f)}`);
        const name = featureName(f, w, fs.length === 1 ? label : `${label}-${k + 1}`);
        return make(geometryRegions(f.geometry, join(w, 'geometry')), name, join(w, 'geometry'));
      });
    }
    case 'Feature':
      return [make(geometryRegions(value.geometry, 'geometry'), featureName(value, '', label), 'geometry')];
    default:
      if (typeof value.type === 'string' && GEOMETRY_TYPES.has(value.type)) return [make(geometryRegions(value, ''), label, '')];
      throw new InputError('type', `expected a GeoJSON type (FeatureCollection, Feature, Polygon, MultiPolygon, GeometryCollection), got ${describeValue(value.type)}`);
  }
}

/** Read GeoJSON text into parts (one per feature, or one for a bare geometry). */
export function readGeoJson(text: string, opts: GeoJsonOptions = {}): Part[] {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    throw new InputError('geojson', `expected valid JSON: ${(e as Error).message}`);
  }
  return geoJsonToParts(value, opts);
}
