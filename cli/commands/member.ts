/** `platewise member`: flags in, one call per part into analyzeMember, a writer out. */
import { analyzeMemberModels } from '../../src/analysis/torsionMember.js';
import { InputError } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import { memberJson, memberText, printUnit } from '../../src/output/memberText.js';
import { parseNetLine } from '../../src/geometry/netSection.js';
import { loadModels } from '../../src/read/load.js';
import { type DrawingFlags, readOptions } from './settings.js';

export interface MemberFlags extends DrawingFlags {
  json?: boolean; printUnit?: string; order?: number; triangles?: number; torsion?: boolean; bolts?: string | boolean;
  netLine?: string[]; thickness?: string;
}

export async function member(file: string, flags: MemberFlags): Promise<string> {
  const unit = printUnit(flags.printUnit);
  let bolts: number[] | undefined;
  if (flags.bolts === true) bolts = [];
  else if (typeof flags.bolts === 'string') {
    bolts = flags.bolts.split(',').map((t) => {
      const v = Number(t.trim());
      if (!(v > 0) || !Number.isFinite(v)) throw new InputError('--bolts', `expected comma-separated positive diameters, got "${t}"`);
      return v;
    });
  }
  const netLines = flags.netLine?.map((t) => parseNetLine(t, '--net-line'));
  if (flags.thickness !== undefined && !netLines) throw new InputError('--thickness', 'is used for the net area; give a --net-line');
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOptions(flags));
  const results = analyzeMemberModels(models, {
    torsion: flags.torsion === false ? false : { order: flags.order, minTriangles: flags.triangles },
    bolts, netLines,
  }, flags.thickness);
  return flags.json ? memberJson(results, unit) : memberText(results, unit);
}
