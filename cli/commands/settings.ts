/** Flags shared by several commands, turned into library settings (the CLI only names where each came from). */
import { InputError } from '../../src/base/errors.js';
import { type MarkOptions, parseMarkNames } from '../../src/analysis/torsionMember.js';
import { parseNetLine } from '../../src/geometry/netSection.js';
import type { PlateSettings } from '../../src/model/plate.js';
import { type MassUnits } from '../../src/output/massText.js';
import { parseMassMomentUnit, parseMassUnit } from '../../src/model/massUnits.js';
import { checkReadOptions } from '../../src/read/detect.js';
import type { ReadOptions } from '../../src/read/read.js';

export interface PlateFlags { thickness?: string; density?: string; material?: string }

/** --thickness, --density, --material as given settings, each labelled with its flag. */
export function plateSettings(flags: PlateFlags): PlateSettings {
  const s: PlateSettings = {};
  if (flags.thickness !== undefined) s.thickness = { text: flags.thickness, where: '--thickness' };
  if (flags.density !== undefined) s.density = { text: flags.density, where: '--density' };
  if (flags.material !== undefined) s.material = { text: flags.material, where: '--material' };
  return s;
}

export function massUnits(flags: { massUnit?: string; inertiaUnit?: string }): MassUnits {
  return {
    mass: flags.massUnit === undefined ? 'kg' : parseMassUnit(flags.massUnit, '--mass-unit'),
    inertia: flags.inertiaUnit === undefined ? 'kg·m²' : parseMassMomentUnit(flags.inertiaUnit, '--inertia-unit'),
  };
}

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

export interface MarkFlags { show?: string; netLine?: string[] }

/** --show and --net-line as the marks to compute, or undefined when none is asked for. */
export function markWants(flags: MarkFlags): MarkOptions | undefined {
  if (flags.show === undefined && flags.netLine === undefined) return undefined;
  return {
    ...(flags.show === undefined ? {} : parseMarkNames(flags.show, '--show')),
    netLines: flags.netLine?.map((t) => parseNetLine(t, '--net-line')),
  };
}
