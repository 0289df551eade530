/** `platewise member`: flags in, one call per part into analyzeMember, a writer out. */
import { analyzeMember } from '../../src/analysis/torsionMember.js';
import { InputError } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import { isLengthUnit } from '../../src/base/units.js';
import { memberJson, memberText } from '../../src/output/memberText.js';
import { loadModels } from '../../src/read/load.js';
import { type DrawingFlags, readOptions } from './settings.js';

export interface MemberFlags extends DrawingFlags {
  json?: boolean; printUnit?: string; order?: number; triangles?: number; torsion?: boolean; bolts?: string | boolean;
}

export async function member(file: string, flags: MemberFlags): Promise<string> {
  if (flags.printUnit !== undefined && (!isLengthUnit(flags.printUnit) || flags.printUnit === 'ft')) {
    throw new InputError('--print-unit', `expected mm, cm, m or in, got "${flags.printUnit}"`);
  }
  let bolts: number[] | undefined;
  if (flags.bolts === true) bolts = [];
  else if (typeof flags.bolts === 'string') {
    bolts = flags.bolts.split(',').map((t) => {
      const v = Number(t.trim());
      if (!(v > 0) || !Number.isFinite(v)) throw new InputError('--bolts', `expected comma-separated positive diameters, got "${t}"`);
      return v;
    });
  }
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOptions(flags));
  const results = models.map((m) => {
    if (m.layers.length !== 1) throw new InputError(m.name, `member properties need one shape; this plate has ${m.layers.length} layers`);
    return analyzeMember(m.layers[0].part, {
      torsion: flags.torsion === false ? false : { order: flags.order, minTriangles: flags.triangles },
      bolts,
    });
  });
  const unit = flags.printUnit as Parameters<typeof memberText>[1];
  return flags.json ? memberJson(results, unit) : memberText(results, unit);
}
