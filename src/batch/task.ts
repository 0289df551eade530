/**
 * One batch job, start to finish, as plain data: read the part file, measure every part in it, add the
 * fabrication figures, judge the stated values. Runs inside a worker thread (src/batch/worker.ts) and may
 * be called directly (tests, a single-threaded run). Never throws: a failure becomes the row's `error`.
 */
import { isInputError } from '../base/errors.js';
import { readInputText } from '../base/files.js';
import { readParts } from '../read/read.js';
import type { Quantity } from '../properties/quantities.js';
import { explainMissing, gapsOnly, measurePart, needsPlate, plainModel } from '../qa/compute.js';
import { type PlateSpec, mergePlate, resolvePlate } from '../model/plate.js';
import { detectFormat } from '../read/detect.js';
import { type InputFormat } from '../read/read.js';
import { type PlateModel, readPlateModel } from '../read/partJson.js';
import type { Part } from '../geometry/part.js';
import { type Reference, readReference } from '../qa/reference.js';
import { type ComparisonRow, type Verdict, compareAll } from '../qa/verdict.js';
import type { Job } from './manifest.js';

export interface JobSettings {
  /** Command-line plate settings; the row's own win. */
  plate: PlateSpec;
  degree?: number;
  levels?: number;
}

export interface BatchRow {
  row: number;
  file: string;
  /** Part number within the file (from 1) and how many parts the file holds; 0 / 0 when the file failed. */
  item: number;
  items: number;
  part: string | null;
  status: 'ok' | 'failed';
  quantity: number;
  units: string | null;
  material: string | null;
  /** Thickness in the part's unit, density in kg/m³. */
  thickness: number | null;
  density: number | null;
  densitySource: string | null;
  quantities: Record<string, Quantity>;
  /** null when nothing was stated for the part. */
  verdict: Verdict | null;
  counts: Record<Verdict, number> | null;
  comparison: ComparisonRow[] | null;
  warnings: string[];
  error: string | null;
}

function failed(job: Job, error: string): BatchRow {
  return {
    row: job.row, file: job.file, item: 0, items: 0, part: null, status: 'failed', quantity: job.quantity, units: null,
    material: null, thickness: null, density: null, densitySource: null, quantities: {}, verdict: null, counts: null,
    comparison: null, warnings: [], error,
  };
}

function message(e: unknown): string {
  if (isInputError(e)) return e.message;
  return `internal error: ${e instanceof Error ? e.message : String(e)}`;
}

/**
 * The plate model of a part: a part JSON file's own (thickness, density, material, layers), else the part
 * alone. `count` is how many parts the file gave (part JSON gives one).
 */
export function modelFor(text: string, label: string, format: InputFormat | undefined, part: Part, count: number): PlateModel {
  const f = format ?? detectFormat(label === 'stdin' ? undefined : label, text);
  if (f === 'part-json' && count === 1) return readPlateModel(text, label);
  return plainModel(part);
}

export function runJob(job: Job, settings: JobSettings): BatchRow[] {
  let reference: Reference | null = null;
  let parts: Part[];
  let text: string;
  try {
    const input = readInputText(job.path);
    text = input.text;
    parts = readParts(input.text, job.file, { format: job.format, units: job.units });
    if (job.reference) {
      const rt = readInputText(job.reference.path);
      reference = readReference(rt.text, job.reference.label);
    }
  } catch (e) {
    return [failed(job, message(e))];
  }
  const stated = [...(reference?.values ?? [])];
  for (const sv of job.stated) {
    const dup = stated.find((s) => s.quantity === sv.quantity);
    if (dup) return [failed(job, `${sv.where}: "${sv.quantity}" is also stated in ${job.reference?.label} (${dup.where}); expected it in one place`)];
    stated.push(sv);
  }
  return parts.map((part, k) => {
    const row = failed(job, '');
    row.item = k + 1;
    row.items = parts.length;
    row.part = part.name;
    row.units = part.units;
    try {
      const model = modelFor(text, job.file, job.format, part, parts.length);
      // command-line settings fill what the file leaves unset; the row's own cells must not double the file's
      const plate = resolvePlate(mergePlate(gapsOnly(model, settings.plate), job.plate), part.units);
      const needMass = stated.some((s) => needsPlate(s.quantity) && s.quantity !== 'netMass' && s.quantity !== 'blankMass');
      const f = measurePart(part, plate, { degree: settings.degree, levels: settings.levels, model, massProperties: needMass });
      row.material = f.plate.material ?? null;
      row.thickness = f.plate.thickness ?? null;
      row.density = f.plate.density ?? null;
      row.densitySource = f.plate.densitySource ?? null;
      row.quantities = f.quantities;
      row.warnings = f.section.warnings;
      const named = reference?.part;
      if (stated.length > 0 && (parts.length === 1 || named === undefined || named === part.name)) {
        const c = compareAll({ source: reference?.source ?? 'manifest', values: stated }, f.quantities, { lengthUnit: part.units, partSize: f.size });
        explainMissing(c.rows, f.known);
        row.verdict = c.verdict;
        row.counts = c.counts;
        row.comparison = c.rows;
      }
      row.status = 'ok';
      row.error = null;
    } catch (e) {
      row.error = message(e);
    }
    return row;
  });
}
