/**
 * The drawing options of every reading command (cli/options.ts addDrawingOptions: --format, --units,
 * --cut-layers, --join-tolerance, …) from their texts to the library's read options, each refusal naming its flag.
 * The command line and the page (web/worker.ts) both call this, so both read a drawing alike.
 */
import { InputError } from '../base/errors.js';
import { checkReadOptions } from './detect.js';
import type { ReadOptions } from './read.js';

export interface DrawingFlags {
  format?: string; units?: string; unitsOverride?: boolean; cutLayers?: string; markLayers?: string; skipLayers?: string;
  markColours?: string; unite?: boolean; onePart?: boolean; sheetBorder?: string; joinTolerance?: number;
}

const list = (v: string | undefined) => (v === undefined ? undefined : v.split(',').map((s) => s.trim()).filter((s) => s.length > 0));

/** The drawing options of every reading command (cli/options.ts addDrawingOptions) as library read options. */
export function readOptions(flags: DrawingFlags): ReadOptions {
  const base = checkReadOptions(flags.format, flags.units);
  if (flags.sheetBorder !== undefined && !['refuse', 'skip', 'part'].includes(flags.sheetBorder)) {
    throw new InputError('--sheet-border', `expected refuse, skip or part, got "${flags.sheetBorder}"`);
  }
  if (flags.joinTolerance !== undefined && !(flags.joinTolerance >= 0 && Number.isFinite(flags.joinTolerance))) {
    throw new InputError('--join-tolerance', `expected a length of 0 or more in drawing units, got ${flags.joinTolerance}`);
  }
  if (flags.unitsOverride && flags.units === undefined) throw new InputError('--units-override', 'goes with --units; give the unit to use');
  const colours = list(flags.markColours)?.map((c) => (/^\d+$/.test(c) ? Number(c) : c));
  return {
    ...base,
    unitsOverride: flags.unitsOverride, cutLayers: list(flags.cutLayers), markLayers: list(flags.markLayers),
    skipLayers: list(flags.skipLayers), markColours: colours, unite: flags.unite, onePart: flags.onePart,
    sheetBorder: flags.sheetBorder as ReadOptions['sheetBorder'], joinTolerance: flags.joinTolerance,
  };
}

