/**
 * Input format detection: by file extension first, then by content.
 * `.dxf` is DXF (ASCII; binary DXF is recognised and refused by the reader);
 * `.json` (including `.platewise.json`) is the project's part format unless its top-level "type" is a
 * GeoJSON type (RFC 7946, section 1.4); `.geojson` is GeoJSON; `.svg` is SVG; `.wkt` is well-known text.
 */
import { InputError, OptionError } from '../base/errors.js';
import { type LengthUnit, isLengthUnit, LENGTH_UNITS } from '../base/units.js';

export type InputFormat = 'part-json' | 'svg' | 'dxf' | 'geojson' | 'wkt';
export const INPUT_FORMATS: readonly InputFormat[] = ['part-json', 'svg', 'dxf', 'geojson', 'wkt'];

/** Check option values given as text (from the command line). */
export function checkReadOptions(format: unknown, units: unknown): { format?: InputFormat; units?: LengthUnit } {
  if (format !== undefined && !INPUT_FORMATS.includes(format as InputFormat)) {
    throw new OptionError('format', `expected one of ${INPUT_FORMATS.join(', ')}, got "${String(format)}"`);
  }
  if (units !== undefined && !isLengthUnit(units)) {
    throw new OptionError('units', `expected one of ${Object.keys(LENGTH_UNITS).join(', ')}, got "${String(units)}"`);
  }
  return { format: format as InputFormat | undefined, units: units as LengthUnit | undefined };
}

export const GEOMETRY_TYPES: ReadonlySet<string> = new Set(['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon', 'GeometryCollection']);
export const GEOJSON_TYPES: ReadonlySet<string> = new Set([...GEOMETRY_TYPES, 'Feature', 'FeatureCollection']);

function jsonKind(text: string): 'part-json' | 'geojson' {
  // a GeoJSON text names a "type" (or hides the key behind a \u escape): without either it is a part file,
  // and the text is not parsed twice (a 10^6-vertex part file is 40 MB of text, 65 MB parsed)
  if (!text.includes('"type"') && !text.includes('\\u')) return 'part-json';
  // look only at the top-level "type"; a parse failure is left to the reader, which reports it properly
  try {
    const v: unknown = JSON.parse(text);
    if (typeof v === 'object' && v !== null && !Array.isArray(v)) {
      const t = (v as Record<string, unknown>).type;
      if (typeof t === 'string' && GEOJSON_TYPES.has(t)) return 'geojson';
    }
  } catch {
    /* not valid JSON: the part reader will say where */
  }
  return 'part-json';
}

export function detectFormat(fileName: string | undefined, text: string): InputFormat {
  const name = (fileName ?? '').toLowerCase();
  if (name.endsWith('.geojson')) return 'geojson';
  if (name.endsWith('.svg')) return 'svg';
  if (name.endsWith('.wkt')) return 'wkt';
  if (name.endsWith('.dxf')) return 'dxf';
  if (name.endsWith('.json')) return jsonKind(text);
  const head = text.replace(/^\uFEFF/, '').trimStart();
  if (head.startsWith('<')) return 'svg';
  if (head.startsWith('{')) return jsonKind(text);
  // ASCII DXF opens with group code 0 and SECTION (or a 999 comment); binary DXF with its sentinel line
  if (/^(0\s*\r?\n\s*SECTION|999\s*\r?\n)/.test(head) || head.startsWith('AutoCAD Binary DXF')) return 'dxf';
  if (/^(SRID\s*=\s*\d+\s*;\s*)?(MULTI)?POLYGON\b/i.test(head)) return 'wkt';
  throw new InputError(fileName ?? 'input', 'cannot tell the format; expected part JSON or GeoJSON ({...}), SVG (<svg ...>), DXF (0 SECTION …) or WKT (POLYGON / MULTIPOLYGON), or a file name ending in .json, .geojson, .svg, .dxf or .wkt');
}
