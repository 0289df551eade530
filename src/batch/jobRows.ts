/**
 * One batch job's rows from its texts, as plain data: measure every part in the file, add the fabrication
 * figures, judge the stated values. No file access here (src/batch/task.ts reads the files for the command
 * line; the page in the browser hands over the dropped files' texts), so both give the same rows.
 */
import { analyzePart } from '../analysis/analyze.js';
import { isInputError, isMethodError } from '../base/errors.js';
import type { MaterialTable } from '../model/materials.js';
import type { PlateModel, PlateSettings } from '../model/plate.js';
import type { Quantity } from '../properties/quantities.js';
import { explainMissing, memberNeeds, partSize } from '../qa/compute.js';
import { type Reference, readReference } from '../qa/reference.js';
import { type ComparisonRow, type Verdict, compareAll } from '../qa/verdict.js';
import { readModels } from '../read/models.js';
import type { ReadOptions } from '../read/read.js';
import type { Job } from './manifest.js';

export interface JobSettings {
  /** Command-line plate settings: they fill only what neither the part file nor the row states. */
  defaults: PlateSettings;
  materials?: MaterialTable;
  /** How drawings are read (the command line's drawing options); a row's own format and units win. */
  read?: ReadOptions;
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
  /** Where the length unit came from: 'file', 'option' or 'assumed' (then a warning is in the row too). */
  unitSource: string | null;
  /** Length of marking (etch) lines on the part, in its unit; null for part files (which hold none). */
  markingLength: number | null;
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
  /** Warnings as codes with parameters (src/analysis/analyze.ts); the writers word them. */
  warnings: import('../analysis/analyze.js').AnalysisWarning[];
  error: string | null;
}

function failed(job: Job, error: string): BatchRow {
  return {
    row: job.row, file: job.file, item: 0, items: 0, part: null, status: 'failed', quantity: job.quantity, units: null, unitSource: null, markingLength: null,
    material: null, thickness: null, density: null, densitySource: null, quantities: {}, verdict: null, counts: null,
    comparison: null, warnings: [], error,
  };
}

/** A failure as one line, as the command line prints it after "platewise: ". */
export function failureText(e: unknown): string {
  if (isInputError(e)) return e.message;
  if (isMethodError(e)) return `${e.method} gave up: ${e.tried}; ${e.advice}`;
  return `internal error: ${e instanceof Error ? e.message : String(e)}`;
}

/** How a job's texts are obtained: from files (runJob) or from memory (the page in the browser). */
export interface JobTexts {
  part(): { text: string };
  /** Called only when the job names a reference file. */
  reference(): { text: string };
}

/** The rows of one job whose texts come from `texts`; never throws (a failure becomes the row's error). */
export function jobRows(job: Job, settings: JobSettings, texts: JobTexts): BatchRow[] {
  let reference: Reference | null = null;
  let parts: PlateModel[];
  try {
    const input = texts.part();
    parts = readModels(input.text, job.file, { ...settings.read, format: job.format ?? settings.read?.format, units: job.units ?? settings.read?.units });
    if (job.reference) {
      const rt = texts.reference();
      reference = readReference(rt.text, job.reference.label);
    }
  } catch (e) {
    return [failed(job, failureText(e))];
  }
  const named = reference?.part;
  if (named !== undefined && !parts.some((p) => p.name === named)) {
    return [failed(job, `${job.reference!.label}: names part "${named}", but ${job.file} holds ${parts.map((p) => `"${p.name}"`).join(', ')}; stated values are compared only with the part they name`)];
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
      // the row's cells must not double the file's; command-line settings fill only what both leave unset
      const f = analyzePart(part, {
        section: { degree: settings.degree, levels: settings.levels },
        given: job.plate, defaults: settings.defaults, materials: settings.materials,
        // a constant plate's mass comes from exact boundary integrals: cheap, so the mass column is always filled
        mass: 'optional', fabrication: 'always',
        // plastic and torsion figures only for a part whose stated values need them
        member: stated.length > 0 && (parts.length === 1 || named === undefined || named === part.name) ? memberNeeds(stated.map((v) => v.quantity)) : undefined,
      });
      const p = f.plate;
      row.material = p?.material ?? null;
      row.thickness = p?.thickness ?? null;
      row.density = p?.density ?? null;
      row.densitySource = p ? (p.densityFrom.kind === 'material' ? `${p.densityFrom.id}: ${p.densityFrom.source}` : 'given density') : null;
      row.quantities = f.quantities;
      row.warnings = f.warnings;
      row.unitSource = f.unitSource;
      row.markingLength = f.interpretation?.parts.find((q) => q.name === f.part)?.markingLength ?? null;
      if (stated.length > 0 && (parts.length === 1 || named === undefined || named === part.name)) {
        const c = compareAll({ source: reference?.source ?? 'manifest', values: stated }, f.quantities, { lengthUnit: part.units, partSize: partSize(f) });
        explainMissing(c.rows, f);
        row.verdict = c.verdict;
        row.counts = c.counts;
        row.comparison = c.rows;
      }
      row.status = 'ok';
      row.error = null;
    } catch (e) {
      row.error = failureText(e);
    }
    return row;
  });
}
