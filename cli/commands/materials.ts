import { jsonTerminalText, terminalText } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import { type MaterialTable, listMaterials, loadMaterialFile } from '../../src/model/index.js';
import { MASS_CAUTION } from '../../src/output/cautions.js';

/** Read --materials-file when given. */
export function userMaterials(path: string | undefined): MaterialTable | undefined {
  if (path === undefined) return undefined;
  const input = readInputText(path);
  return loadMaterialFile(input.text, input.label);
}

export function materials(flags: { json?: boolean; materialsFile?: string }): string {
  const list = listMaterials(userMaterials(flags.materialsFile));
  if (flags.json) {
    return jsonTerminalText(JSON.stringify({
      units: { density: 'kg/m3' },
      materials: list.map((m) => ({ id: m.id, name: m.name, density: m.density, source: m.source, aliases: m.aliases, note: m.note ?? null, origin: m.origin })),
      caution: MASS_CAUTION,
    }, null, 2) + '\n');
  }
  // names escaped first, so that the columns line up with what the terminal shows
  const safe = list.map((m) => ({ ...m, id: terminalText(m.id), name: terminalText(m.name), source: terminalText(m.source) }));
  const w = Math.max(2, ...safe.map((m) => m.id.length));
  const wn = Math.max(4, ...safe.map((m) => m.name.length));
  const lines = [`${'id'.padEnd(w)}  ${'name'.padEnd(wn)}  ${'kg/m³'.padStart(8)}  source`];
  for (const m of safe) {
    lines.push(`${m.id.padEnd(w)}  ${m.name.padEnd(wn)}  ${String(m.density).padStart(8)}  ${m.source}${m.origin === 'built-in' ? '' : ` [${m.origin}]`}`);
    if (m.aliases.length > 0) lines.push(`${''.padEnd(w)}  also: ${m.aliases.join(', ')}`);
  }
  lines.push('', 'Designations with quality or delivery suffixes are understood (S355J2+N is s355, EN AW-6082-T6 is aluminium); "stainless" alone is refused: name the grade.');
  lines.push('', 'Densities are nominal. ' + MASS_CAUTION);
  return lines.join('\n') + '\n';
}
