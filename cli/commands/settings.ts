/** Flags shared by several commands, turned into library settings (the CLI only names where each came from). */
import { InputError } from '../../src/base/errors.js';
import { type MarkOptions, parseMarkNames } from '../../src/analysis/torsionMember.js';
import { parseNetLine } from '../../src/geometry/netSection.js';
import type { PlateSettings } from '../../src/model/plate.js';
import { type MassUnits } from '../../src/output/massText.js';
import { parseMassMomentUnit, parseMassUnit } from '../../src/model/massUnits.js';

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

export { type DrawingFlags, readOptions } from '../../src/read/drawingOptions.js';

export interface MarkFlags { show?: string; netLine?: string[] }

/** --show and --net-line as the marks to compute, or undefined when none is asked for. */
export function markWants(flags: MarkFlags): MarkOptions | undefined {
  if (flags.show === undefined && flags.netLine === undefined) return undefined;
  return {
    ...(flags.show === undefined ? {} : parseMarkNames(flags.show, '--show')),
    netLines: flags.netLine?.map((t) => parseNetLine(t, '--net-line')),
  };
}
