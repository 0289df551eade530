/**
 * User material files: JSON that adds materials or overrides built-in ones.
 *
 *   {
 *     "comment": "optional free text",
 *     "materials": {
 *       "s355-plate": { "density": 7850, "unit": "kg/m3", "source": "mill certificate 12345",
 *                       "name": "S355 plate from supplier A", "aliases": ["plate-a"], "note": "..." },
 *       "hdpe": { "density": 0.95, "unit": "g/cm3", "source": "supplier data sheet" }
 *     }
 *   }
 *
 * - "density" (number > 0) and "unit" (kg/m3, g/cm3, lb/in3, lb/ft3; also kg/m³ etc.) are required;
 *   densities are converted to kg/m³ with exact factors (1 lb = 0.45359237 kg, 1 in = 0.0254 m).
 * - "source" is required: say where the figure comes from (a standard, a certificate, "estimate").
 * - An id equal to a built-in id replaces that material under all its names: its id, any aliases
 *   given, and every built-in alias of it (so no old name silently keeps the old density), except
 *   a built-in alias that the file itself uses for another entry. Any other id is a new material;
 *   a new id or alias equal to a built-in alias takes over that one name only.
 * - Densities under 100 kg/m³ are refused unless the entry says "confirmLowDensity": true, because
 *   a figure in g/cm³ written as kg/m³ (7.85 for steel) makes every mass 1000 times too small.
 *   Densities over 23 000 kg/m³ (above osmium, about 22 590 kg/m³, from memory) are refused.
 * Every fault is an InputError whose `where` is `<fileLabel>: <JSON path>`.
 */
import { InputError, describeValue } from '../base/errors.js';
import { checkJsonText } from '../base/jsonCheck.js';
import { MATERIALS, normalizeMaterialName, type Material, type MaterialTable } from './materials.js';
import { DENSITY_UNITS, densityToSI, parseDensityUnit } from './massUnits.js';

export const MIN_PLAIN_DENSITY = 100;
export const MAX_DENSITY = 23000;

const ID_PATTERN = /^[a-z0-9][a-z0-9.+\-]*$/;
const ENTRY_KEYS = new Set(['density', 'unit', 'source', 'name', 'aliases', 'note', 'comment', 'confirmLowDensity']);

function key(k: string): string {
  return /^[A-Za-z0-9_-]+$/.test(k) ? `.${k}` : `[${JSON.stringify(k)}]`;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function jsonErrorPlace(text: string, message: string): { line: number; column: number } | undefined {
  const m = /position (\d+)/.exec(message);
  if (!m) return undefined;
  const pos = Math.min(Number(m[1]), text.length);
  let line = 1;
  let column = 1;
  for (let i = 0; i < pos; i++) {
    if (text[i] === '\n') {
      line++;
      column = 1;
    } else {
      column++;
    }
  }
  return { line, column };
}

/**
 * Read a user material file. Returns a lookup table to pass to findMaterial / listMaterials.
 * Throws InputError naming `fileLabel` and the JSON path of the first fault.
 */
export function loadMaterialFile(text: string, fileLabel: string): MaterialTable {
  let data: unknown;
  try {
    data = JSON.parse(text);
    checkJsonText(text, fileLabel, `${fileLabel}: `);
  } catch (e) {
    if (e instanceof InputError) throw e;
    const msg = e instanceof Error ? e.message : String(e);
    const at = jsonErrorPlace(text, msg);
    const short = msg.replace(/\s*in JSON at position \d+.*$/s, '').replace(/\s*\(line \d+ column \d+\)$/, '');
    throw new InputError(at ? `${fileLabel}:${at.line}:${at.column}` : fileLabel, `not valid JSON (${short}); expected {"materials": {...}}`);
  }
  const w = (path: string): string => `${fileLabel}: ${path}`;
  if (!isPlainObject(data)) {
    throw new InputError(w('(top level)'), `expected an object {"materials": {...}}, got ${describeValue(data)}`);
  }
  for (const k of Object.keys(data)) {
    if (k !== 'materials' && k !== 'comment') {
      throw new InputError(w(k), `unknown key; expected "materials" (and optionally "comment")`);
    }
  }
  const mats = data['materials'];
  if (!isPlainObject(mats)) {
    throw new InputError(w('materials'), `expected an object of materials keyed by id, got ${describeValue(mats)}`);
  }

  const builtInById = new Map(MATERIALS.map((m) => [normalizeMaterialName(m.id), m]));
  const table = new Map<string, Material>();
  const owner = new Map<string, string>(); // normalized name → path that claimed it in this file
  const inherited: [Material, Material][] = []; // [built-in replaced, replacement]

  const claim = (name: string, m: Material, path: string): void => {
    const prev = owner.get(name);
    if (prev !== undefined) {
      throw new InputError(w(path), `name "${name}" is already used by ${prev} in this file; expected each id and alias once`);
    }
    owner.set(name, path);
    table.set(name, m);
  };

  for (const [rawId, entry] of Object.entries(mats)) {
    const p = `materials${key(rawId)}`;
    const id = normalizeMaterialName(rawId);
    if (!ID_PATTERN.test(id)) {
      throw new InputError(w(p), `bad material id "${rawId}"; expected letters, digits, ".", "+" and "-", starting with a letter or digit`);
    }
    if (!isPlainObject(entry)) {
      throw new InputError(w(p), `expected an object with "density", "unit" and "source", got ${describeValue(entry)}`);
    }
    for (const k of Object.keys(entry)) {
      if (!ENTRY_KEYS.has(k)) {
        throw new InputError(w(p + key(k)), `unknown key; expected one of ${[...ENTRY_KEYS].join(', ')}`);
      }
    }
    const density = entry['density'];
    if (typeof density !== 'number' || !Number.isFinite(density) || !(density > 0)) {
      throw new InputError(w(`${p}.density`), `expected a positive number, got ${describeValue(density)}`);
    }
    if (entry['unit'] === undefined) {
      throw new InputError(w(`${p}.unit`), `missing; expected one of ${Object.keys(DENSITY_UNITS).join(', ')}`);
    }
    const unit = parseDensityUnit(entry['unit'], w(`${p}.unit`));
    const source = entry['source'];
    if (typeof source !== 'string' || source.trim() === '') {
      throw new InputError(w(`${p}.source`), `expected a non-empty string saying where the density comes from, got ${describeValue(source)}`);
    }
    for (const k of ['name', 'note', 'comment'] as const) {
      if (entry[k] !== undefined && typeof entry[k] !== 'string') {
        throw new InputError(w(`${p}.${k}`), `expected a string, got ${describeValue(entry[k])}`);
      }
    }
    const confirm = entry['confirmLowDensity'];
    if (confirm !== undefined && typeof confirm !== 'boolean') {
      throw new InputError(w(`${p}.confirmLowDensity`), `expected true or false, got ${describeValue(confirm)}`);
    }
    const si = densityToSI(density, unit);
    if (si > MAX_DENSITY) {
      throw new InputError(w(`${p}.density`), `${density} ${unit} is ${si} kg/m³, denser than any element; expected at most ${MAX_DENSITY} kg/m³ (check the unit)`);
    }
    if (si < MIN_PLAIN_DENSITY && confirm !== true) {
      throw new InputError(
        w(`${p}.density`),
        `${density} ${unit} is ${si} kg/m³, below ${MIN_PLAIN_DENSITY} kg/m³; check the unit (steel is 7850 kg/m3 = 7.85 g/cm3), or add "confirmLowDensity": true if it is right`,
      );
    }
    const builtIn = builtInById.get(id);
    let aliases: string[];
    const rawAliases = entry['aliases'];
    if (rawAliases === undefined) {
      aliases = builtIn ? [...builtIn.aliases] : [];
    } else {
      if (!Array.isArray(rawAliases)) {
        throw new InputError(w(`${p}.aliases`), `expected an array of strings, got ${describeValue(rawAliases)}`);
      }
      aliases = rawAliases.map((a, i) => {
        const an = typeof a === 'string' ? normalizeMaterialName(a) : '';
        if (!ID_PATTERN.test(an)) {
          throw new InputError(w(`${p}.aliases[${i}]`), `expected a name of letters, digits, ".", "+" and "-", got ${describeValue(a)}`);
        }
        return an;
      });
    }
    const name = typeof entry['name'] === 'string' ? entry['name'] : builtIn ? builtIn.name : rawId;
    const material: Material = Object.freeze({
      id,
      name,
      density: si,
      source: source.trim(),
      aliases: Object.freeze(aliases),
      ...(typeof entry['note'] === 'string' ? { note: entry['note'] } : {}),
      origin: fileLabel,
    });
    claim(id, material, p);
    aliases.forEach((a, i) => {
      if (a !== id) claim(a, material, `${p}.aliases[${i}]`);
    });
    if (builtIn) inherited.push([builtIn, material]);
  }
  // Replacing a built-in also takes over its aliases, unless the file named them explicitly.
  for (const [builtIn, material] of inherited) {
    for (const a of builtIn.aliases) {
      const an = normalizeMaterialName(a);
      if (!owner.has(an)) table.set(an, material);
    }
  }
  return table;
}
