/**
 * From input text to parts, whatever the format: by the `format` option, else by file extension,
 * else by content (src/read/detect.ts).
 */
import { OptionError } from '../base/errors.js';
import type { Part } from '../geometry/part.js';
import { type LengthUnit, isLengthUnit, LENGTH_UNITS } from '../base/units.js';
import { type InputFormat, detectFormat } from './detect.js';
import { readGeoJson } from './geojson.js';
import { readPartJson } from './partJson.js';
import { readSvg } from './svg.js';
import { readWkt } from './wkt.js';

export type { InputFormat };
export const INPUT_FORMATS: readonly InputFormat[] = ['part-json', 'svg', 'geojson', 'wkt'];

export interface ReadOptions {
  format?: InputFormat;
  /** Length unit of drawing coordinates (SVG user units, GeoJSON/WKT coordinates). */
  units?: LengthUnit;
}

/** Check option values given as text (from the command line). */
export function checkReadOptions(format: unknown, units: unknown): ReadOptions {
  if (format !== undefined && !INPUT_FORMATS.includes(format as InputFormat)) {
    throw new OptionError('format', `expected one of ${INPUT_FORMATS.join(', ')}, got "${String(format)}"`);
  }
  if (units !== undefined && !isLengthUnit(units)) {
    throw new OptionError('units', `expected one of ${Object.keys(LENGTH_UNITS).join(', ')}, got "${String(units)}"`);
  }
  return { format: format as InputFormat | undefined, units: units as LengthUnit | undefined };
}

/** `label` is the file name (or "stdin"); it also drives detection by extension. */
export function readParts(text: string, label: string, options: ReadOptions = {}): Part[] {
  const format = options.format ?? detectFormat(label === 'stdin' ? undefined : label, text);
  switch (format) {
    case 'part-json':
      if (options.units !== undefined) throw new OptionError('units', 'applies to drawings (SVG, DXF, GeoJSON, WKT); a part file states its own "units"');
      return [readPartJson(text, label)];
    case 'svg': return readSvg(text, { units: options.units, fileLabel: label });
    case 'geojson': return readGeoJson(text, { units: options.units, fileLabel: label });
    case 'wkt': return readWkt(text, { units: options.units, fileLabel: label });
  }
}
