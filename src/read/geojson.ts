/**
 * GeoJSON reader (RFC 7946): Polygon, MultiPolygon, GeometryCollection, Feature and FeatureCollection, read
 * into a Drawing: every ring a closed contour that remembers its polygon and index (0 the outline, then the
 * holes) and its feature. The shared interpretation (src/read/interpret.ts) makes the parts: each polygon
 * (each MultiPolygon component too) is one part, named from its feature's properties.name.
 * Rings must be closed (RFC 7946, 3.1.6: first and last positions identical).
 *
 * Deviation from RFC 7946, on purpose: coordinates are plane lengths (option `units`; without it mm, an
 * assumption the summary reports), not WGS 84 longitude/latitude. A file that declares a coordinate
 * reference system (the `crs` member of the 2008 GeoJSON specification, still written by GIS programs) is
 * refused when that system is geographic (degrees: EPSG 4326, 4258, 4269, … or OGC CRS84), and needs the
 * units option for any other system. A third (altitude) coordinate is ignored; `bbox` and foreign members
 * are ignored. Ring orientation is not required (the right-hand rule of 3.1.6 is a SHOULD).
 */
import { InputError, describeValue } from '../base/errors.js';
import { checkJsonText } from '../base/jsonCheck.js';
import type { Loop, Part } from '../geometry/part.js';
import type { Segment } from '../geometry/segments.js';
import type { LengthUnit } from '../base/units.js';
import type { Drawing, DrawingUnits, DrawnContour } from './drawing.js';
import { GEOMETRY_TYPES } from './detect.js';
import { type InterpretOptions, interpretDrawing } from './interpret.js';

export interface GeoJsonOptions extends InterpretOptions {
  /** Unit of the coordinates (without it: mm, assumed). */
  units?: LengthUnit;
  /** Read coordinates as lengths in `units` even though the file declares a geographic or other CRS. */
  unitsOverride?: boolean;
  /** Used in part names when a feature has no properties.name. */
  fileLabel?: string;
}

/**
 * EPSG codes of well-known geographic (longitude/latitude, degrees) systems: WGS 84 (4326, 3-D 4979), ETRS89
 * (4258), NAD83 (4269), NAD27 (4267), GDA94 (4283), ED50 (4230), RGF93 (4171), JGD2000 (4612), SIRGAS 2000
 * (4674), NAD83(CSRS) (4617), GRS 1980 and others (4019), WGS 84 sphere (4030, 4047), Pulkovo 1942 (4284),
 * Beijing 1954 (4214), CGCS2000 (4490), Tokyo (4301), OSGB36 (4277), DHDN (4314).
 */
export const GEOGRAPHIC_EPSG: ReadonlySet<number> = new Set([4326, 4979, 4258, 4269, 4267, 4283, 4230, 4171, 4612, 4674, 4617, 4019, 4030, 4047, 4284, 4214, 4490, 4301, 4277, 4314]);

/** The EPSG code or OGC name a CRS name states, and whether it is geographic. */
export function crsKind(name: string): { code: string; geographic: boolean } {
  const t = name.trim();
  const ogc = /(?:^|[:/])(CRS84|CRS83|CRS27)$/i.exec(t);
  if (ogc) return { code: ogc[1].toUpperCase(), geographic: true };
  const epsg = /EPSG(?::+|\/(?:\d+\/)?|::?[\d.]*:)(\d+)$/i.exec(t) ?? /^(\d+)$/.exec(t);
  if (epsg) { const n = Number(epsg[1]); return { code: `EPSG:${n}`, geographic: GEOGRAPHIC_EPSG.has(n) }; }
  return { code: t, geographic: false };
}


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

/** The rings of one polygon: the outline first, then the holes. */
function polygonRings(coords: unknown, path: string): Loop[] {
  if (!Array.isArray(coords) || coords.length === 0) {
    throw new InputError(path, `expected an array of rings (outline first, then holes), got ${describeValue(coords)}`);
  }
  return coords.map((r, k) => ringLoop(r, join(path, k)));
}

/** Polygons (each a list of rings, with its path) of a geometry object (Polygon, MultiPolygon or a GeometryCollection of them). */
function geometryPolygons(g: unknown, path: string): { rings: Loop[]; path: string }[] {
  if (!isObject(g)) throw new InputError(path, `expected a geometry object, got ${describeValue(g)}`);
  const type = g.type;
  switch (type) {
    case 'Polygon': {
      const w = join(path, 'coordinates');
      return [{ rings: polygonRings(g.coordinates, w), path: w }];
    }
    case 'MultiPolygon': {
      const c = g.coordinates;
      const w = join(path, 'coordinates');
      if (!Array.isArray(c)) throw new InputError(w, `expected an array of polygons, got ${describeValue(c)}`);
      return c.map((p, k) => ({ rings: polygonRings(p, join(w, k)), path: join(w, k) }));
    }
    case 'GeometryCollection': {
      const gs = g.geometries;
      const w = join(path, 'geometries');
      if (!Array.isArray(gs)) throw new InputError(w, `expected an array of geometries, got ${describeValue(gs)}`);
      return gs.flatMap((x, k) => geometryPolygons(x, join(w, k)));
    }
    default:
      throw new InputError(join(path, 'type'), `expected "Polygon", "MultiPolygon" or "GeometryCollection" (a plate needs an area), got ${describeValue(type)}`);
  }
}

function geoJsonUnits(value: Record<string, unknown>, opts: GeoJsonOptions): DrawingUnits {
  const crs = value.crs;
  if (crs !== undefined && crs !== null) {
    const props = isObject(crs) && isObject(crs.properties) ? crs.properties : undefined;
    const name = props && typeof props.name === 'string' ? props.name
      : props && typeof props.href === 'string' ? props.href : undefined;
    if (name === undefined) throw new InputError('crs', `expected {"type": "name", "properties": {"name": "..."}}, got ${describeValue(crs)}`);
    const kind = crsKind(name);
    if (kind.geographic && !(opts.units !== undefined && opts.unitsOverride)) {
      throw new InputError('crs', `names ${kind.code} ("${name}"), a geographic system: coordinates are degrees of longitude and latitude, not lengths; export plane coordinates, or give the units with the override to read the numbers as lengths`);
    }
    if (opts.units === undefined) {
      throw new InputError('crs', `names ${kind.code} ("${name}"); its length unit is not read from the file: give the units option`);
    }
    return { unit: opts.units, source: 'option', detail: { crs: kind.code } };
  }
  return opts.units !== undefined ? { unit: opts.units, source: 'option' } : { unit: 'mm', source: 'assumed', detail: { assumed: 'mm' } };
}

/** A Drawing from an already parsed GeoJSON value. */
export function geoJsonDrawing(value: unknown, opts: GeoJsonOptions = {}): Drawing {
  const label = opts.fileLabel ?? 'geojson';
  if (!isObject(value)) throw new InputError('', `expected a GeoJSON object, got ${describeValue(value)}`);
  const units = geoJsonUnits(value, opts);
  const contours: DrawnContour[] = [];
  const featureName = (f: Record<string, unknown>, path: string): string | undefined => {
    const props = f.properties;
    if (props === undefined || props === null) return undefined;
    if (!isObject(props)) throw new InputError(join(path, 'properties'), `expected an object or null, got ${describeValue(props)}`);
    const n = props.name;
    if (n === undefined || n === null) return undefined;
    if (typeof n !== 'string' || n.trim() === '') throw new InputError(join(join(path, 'properties'), 'name'), `expected a non-empty string, got ${describeValue(n)}`);
    return n;
  };
  const addGeometry = (g: unknown, path: string, group: string, name: string | undefined) => {
    const polys = geometryPolygons(g, path);
    if (polys.length === 0) throw new InputError(path, 'expected at least one polygon, found none');
    for (const p of polys) {
      p.rings.forEach((l, index) => {
        const c: DrawnContour = { segments: l.segments, closed: true, where: l.where ?? p.path, ring: { polygon: p.path, index }, group };
        if (name !== undefined) c.name = name;
        contours.push(c);
      });
    }
  };
  switch (value.type) {
    case 'FeatureCollection': {
      const fs = value.features;
      if (!Array.isArray(fs)) throw new InputError('features', `expected an array of features, got ${describeValue(fs)}`);
      if (fs.length === 0) throw new InputError('features', 'expected at least one feature, found none');
      fs.forEach((f, k) => {
        const w = join('features', k);
        if (!isObject(f) || f.type !== 'Feature') throw new InputError(join(w, 'type'), `expected "Feature", got ${describeValue(isObject(f) ? f.type : f)}`);
        addGeometry(f.geometry, join(w, 'geometry'), w, featureName(f, w));
      });
      break;
    }
    case 'Feature':
      addGeometry(value.geometry, 'geometry', 'feature', featureName(value, ''));
      break;
    default:
      if (typeof value.type === 'string' && GEOMETRY_TYPES.has(value.type)) addGeometry(value, '', 'geometry', undefined);
      else throw new InputError('type', `expected a GeoJSON type (FeatureCollection, Feature, Polygon, MultiPolygon, GeometryCollection), got ${describeValue(value.type)}`);
  }
  return { format: 'geojson', label, units, contours, ignored: {} };
}

function parseJson(text: string): unknown {
  try {
    const value: unknown = JSON.parse(text);
    checkJsonText(text, 'geojson');
    return value;
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError('geojson', `expected valid JSON: ${(e as Error).message}`);
  }
}

/** Read GeoJSON text into a Drawing. */
export function readGeoJsonDrawing(text: string, opts: GeoJsonOptions = {}): Drawing {
  return geoJsonDrawing(parseJson(text), opts);
}

/** Parts from an already parsed GeoJSON value (through the shared interpretation). */
export function geoJsonToParts(value: unknown, opts: GeoJsonOptions = {}): Part[] {
  return interpretDrawing(geoJsonDrawing(value, opts), opts).parts;
}

/** Read GeoJSON text into parts: one per polygon (per MultiPolygon component too). */
export function readGeoJson(text: string, opts: GeoJsonOptions = {}): Part[] {
  return geoJsonToParts(parseJson(text), opts);
}
