/**
 * From input text to plate models, whatever the format: a part file keeps its thickness, density,
 * material and layers; a drawing gives one single-layer model per part. This is the one place that knows
 * which formats carry plate data: nothing else sniffs the input text.
 */
import { OptionError } from '../base/errors.js';
import { type PlateModel, singleLayerModel } from '../model/plate.js';
import { detectFormat } from './detect.js';
import { readPlateModel } from './partJson.js';
import { type ReadOptions, readParts } from './read.js';

export function readModels(text: string, label: string, options: ReadOptions = {}): PlateModel[] {
  const format = options.format ?? detectFormat(label === 'stdin' ? undefined : label, text);
  if (format === 'part-json') {
    if (options.units !== undefined) throw new OptionError('units', 'applies to drawings (SVG, DXF, GeoJSON, WKT); a part file states its own "units"');
    return [readPlateModel(text, label)];
  }
  return readParts(text, label, { ...options, format }).map((p) => singleLayerModel(p, options.units !== undefined ? 'option' : 'file'));
}
