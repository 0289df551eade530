/**
 * From input text to parts, whatever the format: by the `format` option, else by file extension,
 * else by content (src/read/detect.ts). Drawings (SVG, DXF, GeoJSON, WKT) are read into
 * a `Drawing` and then interpreted by the one shared step (src/read/interpret.ts); part JSON states its parts.
 */
import { InputError, OptionError } from '../base/errors.js';
import { readDxf } from './dxf.js';
import type { Part } from '../geometry/part.js';
import type { LengthUnit } from '../base/units.js';
import { type InputFormat, detectFormat } from './detect.js';
import type { Drawing, DrawingUnits } from './drawing.js';
import { readGeoJsonDrawing } from './geojson.js';
import { type InterpretOptions, type InterpretationSummary, type NotCut, interpretDrawing } from './interpret.js';
import { readPartJson } from './partJson.js';
import { readSvgDrawing } from './svg.js';
import { readWktDrawing } from './wkt.js';

export type { InputFormat };
export { INPUT_FORMATS, checkReadOptions } from './detect.js';
export interface ReadOptions extends InterpretOptions {
  format?: InputFormat;
  /** Length unit of drawing coordinates (SVG user units, GeoJSON/WKT coordinates). */
  units?: LengthUnit;
  /**
   * Let `units` stand even where the file states something else (SVG width/height in mm, cm, in, pt, pc or Q
   * over a viewBox; a GeoJSON crs or WKT SRID naming a geographic system). Without it such a contradiction is
   * refused.
   */
  unitsOverride?: boolean;
  /** DXF: largest gap between loose entity ends that is closed when joining them into contours (drawing units). */
  joinTolerance?: number;
}

/** What reading gives: the parts, the length unit with where it came from, and the interpretation's facts. */
export interface ReadResult {
  parts: Part[];
  units: DrawingUnits;
  summary: InterpretationSummary;
  /** Marking and ignored geometry, for drawings (empty for part files). */
  notCut: NotCut;
}

function formatOf(text: string, label: string, options: ReadOptions): InputFormat {
  return options.format ?? detectFormat(label === 'stdin' ? undefined : label, text);
}

/** The drawing as its reader gives it (no roles, no parts), for SVG, GeoJSON and WKT. */
export function drawingOf(text: string, label: string, options: ReadOptions = {}): Drawing {
  const format = formatOf(text, label, options);
  const o = { units: options.units, unitsOverride: options.unitsOverride, fileLabel: label };
  switch (format) {
    case 'svg': return readSvgDrawing(text, o);
    case 'geojson': return readGeoJsonDrawing(text, o);
    case 'wkt': return readWktDrawing(text, o);
    case 'dxf': return readDxf(text, { units: options.units, fileLabel: label, joinTolerance: options.joinTolerance });
    case 'part-json': throw new InputError(label, 'a part file states its parts; it is not a drawing');
  }
}

/** Read any input into parts with the unit's source and the interpretation summary. */
export function readDrawing(text: string, label: string, options: ReadOptions = {}): ReadResult {
  const format = formatOf(text, label, options);
  if (format === 'part-json') {
    if (options.units !== undefined) throw new OptionError('units', 'applies to drawings (SVG, DXF, GeoJSON, WKT); a part file states its own "units"');
    const part = { ...readPartJson(text, label), unitSource: 'file' as const };
    const units: DrawingUnits = { unit: part.units, source: 'file' };
    const cutouts = part.regions.reduce((s, r) => s + r.holes.length, 0);
    return {
      parts: [part],
      units,
      summary: {
        format: 'part-json', units, contours: part.regions.length + cutouts, outlines: part.regions.length, cutouts, marking: 0,
        ignored: {}, markingBy: {}, duplicates: [], united: [], markingOutside: [], tolerance: 0, gapsClosed: [], joinFindings: [],
        parts: [{ name: part.name, outlines: part.regions.length, cutouts, markings: 0, markingLength: 0 }], warnings: [],
      },
      notCut: { marking: [], ignored: [] },
    };
  }
  const drawing = drawingOf(text, label, { ...options, format });
  const { parts, summary, notCut } = interpretDrawing(drawing, options);
  return { parts, units: drawing.units, summary, notCut };
}

/** `label` is the file name (or "stdin"); it also drives detection by extension. Parts only (existing callers). */
export function readParts(text: string, label: string, options: ReadOptions = {}): Part[] {
  return readDrawing(text, label, options).parts;
}
