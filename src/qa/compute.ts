/**
 * What `compare` and `batch` need beyond the analysis entry point's report: the part's size (for default
 * length tolerances), which stated keys need a thickness and density, and why a stated mass was not computed.
 */
import type { PartReport } from '../analysis/analyze.js';
import { quantityInfo } from '../properties/quantities.js';

/** The member group of a quantity key (plastic or torsion: from `member`'s analysis), or undefined. */
function memberGroup(key: string): 'plastic' | 'torsion' | undefined {
  const g = quantityInfo(key)?.group;
  return g === 'plastic' || g === 'torsion' ? g : undefined;
}

/** Which member figures stated values need. */
export function memberNeeds(keys: Iterable<string>): { plastic: boolean; torsion: boolean } {
  const groups = new Set([...keys].map(memberGroup));
  return { plastic: groups.has('plastic'), torsion: groups.has('torsion') };
}

/** Bounding-box diagonal in the part's unit (for default length tolerances). */
export function partSize(r: PartReport): number {
  const q = r.section.quantities;
  return Math.hypot(q.width.value, q.height.value);
}

const MASS_KEYS_NEEDING_PLATE = new Set([
  'netMass', 'blankMass', 'mass', 'weight', 'massCentreX', 'massCentreY', 'massCentreZ',
  'massMomentX', 'massMomentY', 'massMomentZ', 'massProductXY', 'massProductXZ', 'massProductYZ',
]);

/** Is this a key that needs a thickness and a density? */
export function needsPlate(key: string): boolean {
  return MASS_KEYS_NEEDING_PLATE.has(key);
}

/** Why a stated value was not computed, as a fact: what is missing, or that no single constant plate exists. */
export type MissingReason = { code: 'needs'; missing: ('thickness' | 'density')[] } | { code: 'not-constant' };

export function missingReason(r: PartReport): MissingReason {
  const missing: ('thickness' | 'density')[] = r.missing.length > 0 ? r.missing : r.mass || r.plate ? [] : ['thickness', 'density'];
  return missing.length > 0 ? { code: 'needs', missing } : { code: 'not-constant' };
}

/** Say why a stated mass was not computed (no thickness or density), instead of the generic note. */
export function explainMissing(rows: { quantity: string; note?: string; computed: number | null }[], r: PartReport): void {
  const why = missingReason(r);
  for (const row of rows) {
    if (row.computed === null && r.memberNotComputed && memberGroup(row.quantity)) {
      row.note = `not computed: member figures need a plate of one shape; this one has ${r.memberNotComputed.layers} layers`;
      continue;
    }
    if (row.computed === null && needsPlate(row.quantity)) {
      row.note = why.code === 'needs'
        ? `not computed: needs ${why.missing.map((m) => (m === 'thickness' ? 'a thickness' : 'a density (material or density)')).join(' and ')}`
        : 'not computed: netMass and blankMass need one constant thickness and density (see mass for layered or varying plates)';
    }
  }
}
