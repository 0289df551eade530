/**
 * Built-in materials with nominal densities in kg/m³, each with where the figure comes from.
 * "from memory" marks a value recalled rather than read from the named document at the time of
 * writing; check it against the document or a mill certificate before relying on it.
 * Nominal densities are for mass estimates; real parts vary with grade, temper and temperature.
 */
import { InputError } from '../base/errors.js';
import { editDistance } from '../base/text.js';

export interface Material {
  /** Lower-case identifier used on the command line and in files, e.g. "stainless-1.4301". */
  readonly id: string;
  /** Human-readable name. */
  readonly name: string;
  /** Nominal density in kg/m³. */
  readonly density: number;
  /** Where the density comes from (standard and clause, "from memory", or "common practice, no source"). */
  readonly source: string;
  /** Other names that find this material (lower-case). */
  readonly aliases: readonly string[];
  /** Optional remark (range of real values, grade notes). */
  readonly note?: string;
  /** "built-in" or the label of the user file that defined it. */
  readonly origin: string;
}

/** A lookup table: key = normalized id or alias → material. */
export type MaterialTable = ReadonlyMap<string, Material>;

const BUILT_IN: readonly Omit<Material, 'origin'>[] = [
  {
    id: 'steel',
    name: 'structural steel (carbon steel)',
    density: 7850,
    source: 'EN 1993-1-1:2005, 3.2.6 (design value of density for steel)',
    aliases: ['structural-steel', 'carbon-steel', 'mild-steel', 's235', 's275', 's355', 's420', 's460', 's500', 's550', 's690'],
  },
  {
    id: 'aluminium',
    name: 'aluminium alloys',
    density: 2700,
    source: 'EN 1999-1-1:2007, 3.2.5 (design value of density for aluminium alloys)',
    aliases: ['aluminum', 'al', 'aluminium-alloy', 'aluminum-alloy'],
    note: 'single design value for all alloys in EN 1999-1-1; individual alloys differ by a few per cent',
  },
  {
    id: 'stainless-1.4301',
    name: 'austenitic stainless steel 1.4301 (X5CrNi18-10)',
    density: 7900,
    source: 'EN 10088-1 (per-grade density table), from memory',
    aliases: ['1.4301', 'x5crni18-10', '304', 'aisi-304'],
    note: '"stainless" finds this grade; name the grade when it matters',
  },
  {
    id: 'stainless-1.4404',
    name: 'austenitic stainless steel 1.4404 (X2CrNiMo17-12-2)',
    density: 8000,
    source: 'EN 10088-1 (per-grade density table), from memory',
    aliases: ['1.4404', 'x2crnimo17-12-2', '316l', 'aisi-316l'],
  },
  {
    id: 'copper',
    name: 'copper (unalloyed)',
    density: 8960,
    source: 'from memory (pure copper at 20 °C, commonly tabulated as 8.96 g/cm³)',
    aliases: ['cu'],
    note: 'commercial coppers such as Cu-ETP are about 8.89-8.94 g/cm³ (from memory)',
  },
  {
    id: 'brass',
    name: 'brass (copper-zinc alloys, nominal)',
    density: 8500,
    source: 'common practice, no source',
    aliases: ['cuzn'],
    note: 'real brasses span roughly 8.4-8.7 g/cm³ depending on zinc and lead content (from memory)',
  },
  {
    id: 'titanium-6al4v',
    name: 'titanium alloy Ti-6Al-4V (grade 5)',
    density: 4430,
    source: 'from memory (typical published value for Ti-6Al-4V, 4.43 g/cm³)',
    aliases: ['ti-6al-4v', 'ti6al4v', 'titanium-grade-5', 'ti-grade-5'],
  },
];

/** The built-in materials, frozen. */
export const MATERIALS: readonly Material[] = Object.freeze(
  BUILT_IN.map((m) => Object.freeze({ ...m, aliases: Object.freeze([...m.aliases]), origin: 'built-in' })),
);

/** Normalize a material name: trim, lower-case, runs of spaces/underscores → "-". */
export function normalizeMaterialName(name: string): string {
  return name.trim().toLowerCase().replace(/[\s_]+/g, '-');
}

/** Build a lookup table from materials (ids and aliases). Later entries win on a clash. */
export function materialTable(materials: readonly Material[]): MaterialTable {
  const map = new Map<string, Material>();
  for (const m of materials) {
    map.set(normalizeMaterialName(m.id), m);
    for (const a of m.aliases) map.set(normalizeMaterialName(a), m);
  }
  return map;
}

const BUILT_IN_TABLE = materialTable(MATERIALS);

/**
 * Find a material by id or alias (case-insensitive; spaces and underscores count as "-").
 * A user table (from loadMaterialFile) is searched first, so it can override built-in names.
 * Throws InputError('material', 'unknown material "xyz"; known: ...; did you mean "..."?').
 */
export function findMaterial(name: string, userTable?: MaterialTable): Material {
  const key = normalizeMaterialName(String(name));
  const found = userTable?.get(key) ?? BUILT_IN_TABLE.get(key);
  if (found !== undefined) return found;
  // a designation with a quality or delivery suffix the density does not depend on
  const base = designationBase(key);
  if (base !== undefined) {
    const m = userTable?.get(base) ?? BUILT_IN_TABLE.get(base);
    if (m !== undefined) return m;
  }
  // a general name that fits several grades of different density: refuse with the choices
  const choices = Object.prototype.hasOwnProperty.call(AMBIGUOUS, key) ? AMBIGUOUS[key] : undefined;
  if (choices !== undefined && userTable?.get(key) === undefined) {
    const opts = choices.map((id) => MATERIALS.find((m) => m.id === id)!).map((m) => `${m.id} (${m.name}, ${m.density} kg/m³)`);
    throw new InputError('material', `"${name}" could be ${opts.join(' or ')}; name the grade`);
  }
  const ids = new Set<string>();
  for (const m of userTable?.values() ?? []) ids.add(m.id);
  for (const m of MATERIALS) ids.add(m.id);
  const candidates = [...(userTable?.keys() ?? []), ...BUILT_IN_TABLE.keys()];
  let best: string | undefined;
  let bestD = Infinity;
  for (const c of candidates) {
    const d = editDistance(key, c);
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  const limit = Math.max(2, Math.floor(key.length / 3));
  const guess = best !== undefined && bestD <= limit ? `; did you mean "${best}"?` : '';
  throw new InputError('material', `unknown material "${name}"; known: ${[...ids].join(', ')}${guess}`);
}

/** General names that fit several built-in grades of different density (refused with the choices). */
const AMBIGUOUS: Readonly<Record<string, readonly string[]>> = {
  stainless: ['stainless-1.4301', 'stainless-1.4404'],
  'stainless-steel': ['stainless-1.4301', 'stainless-1.4404'],
  inox: ['stainless-1.4301', 'stainless-1.4404'],
};

/**
 * The grade behind a designation with suffixes that do not change the density (common practice, no source:
 * the EN 10025 designation system writes strength grade, then quality and delivery condition):
 * S355J2+N, S355JR, S275J0, S460ML, S355MC → s355 …; EN AW-6082-T6, 5754-H22 → aluminium (EN 1999-1-1 gives
 * one design density for aluminium alloys).
 */
function designationBase(key: string): string | undefined {
  let m = /^(s(?:235|275|355|420|460|500|550|690))(?:j[r0-2]|k2|n|nl|m|ml|mc|q|ql|g\d+)?(?:[+-](?:n|ar|m|qt|z\d*))*$/.exec(key);
  if (m) return m[1];
  m = /^(?:en-?aw-?)?[1-8]\d{3}[a-z]?(?:-(?:[ofhtw]\d*))?$/.exec(key);
  if (m && !/^1\.\d{4}/.test(key)) return 'aluminium';
  return undefined;
}

/** All materials visible with an optional user table: user ones first, then built-ins not overridden. */
export function listMaterials(userTable?: MaterialTable): Material[] {
  const out: Material[] = [];
  const seen = new Set<string>();
  for (const m of userTable?.values() ?? []) {
    if (!seen.has(m.id)) {
      seen.add(m.id);
      out.push(m);
    }
  }
  for (const m of MATERIALS) {
    const key = normalizeMaterialName(m.id);
    if (!seen.has(m.id) && userTable?.get(key) === undefined) {
      seen.add(m.id);
      out.push(m);
    }
  }
  return out;
}

