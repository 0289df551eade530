/**
 * From input text to plate models, whatever the format: a part file keeps its thickness, density,
 * material and layers; a drawing (SVG, DXF, GeoJSON, WKT) gives one single-layer model per part, read through
 * the one interpretation step, with the unit's source and the interpretation's facts attached. This is the
 * one place that knows which formats carry plate data: nothing else sniffs the input text.
 */
import { type PlateModel, singleLayerModel } from '../model/plate.js';
import { detectFormat } from './detect.js';
import type { InterpretationSummary, NotCut } from './interpret.js';
import { partFileModels } from './partJson.js';
import { type ReadOptions, readDrawing } from './read.js';

/** A plate model with what reading its file established (for drawings: the interpretation summary). */
export type ReadModel = PlateModel & { interpretation?: InterpretationSummary; notCut?: NotCut };

export function readModels(text: string, label: string, options: ReadOptions = {}): ReadModel[] {
  const format = options.format ?? detectFormat(label === 'stdin' ? undefined : label, text);
  if (format === 'part-json') return partFileModels(text, label, options.units);
  const r = readDrawing(text, label, { ...options, format });
  return r.parts.map((p) => ({ ...singleLayerModel(p, r.units.source), interpretation: r.summary, notCut: r.notCut }));
}
