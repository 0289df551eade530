import { assertFiniteIntegral } from '../../src/analysis/finite.js';
import { checkIntegrationOptions } from '../../src/analysis/options.js';
import { integrateExpression } from '../../src/analysis/plate.js';
import { InputError, jsonTerminalText, terminalText } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import type { Part } from '../../src/geometry/part.js';
import { integralJson, integralText } from '../../src/output/massText.js';
import { loadModels } from '../../src/read/load.js';
import { type DrawingFlags, readOptions } from './settings.js';

export interface IntegrateFlags extends DrawingFlags {
  expr: string; exprUnit?: string; layer?: string; tolerance?: number; maxTriangles?: number; timeLimit?: number;
  degree?: number; method?: string; json?: boolean; format?: string; units?: string;
}

export async function integrate(file: string, flags: IntegrateFlags): Promise<string> {
  const opts = checkIntegrationOptions(flags);
  if (flags.exprUnit !== undefined && !/^[^\s\u0000-\u001f]{1,20}$/u.test(flags.exprUnit)) throw new InputError('--expr-unit', `expected a short unit name without spaces, got "${flags.exprUnit}"`);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOptions(flags));
  let parts: Part[];
  if (models.length === 1 && models[0].layered) {
    const model = models[0];
    let layer = model.layers[0];
    if (flags.layer !== undefined) {
      const hit = model.layers.find((l) => l.name === flags.layer);
      if (!hit) throw new InputError('--layer', `no layer "${flags.layer}"; the part has ${model.layers.map((l) => `"${l.name}"`).join(', ')}`);
      layer = hit;
    }
    parts = [layer.part];
  } else {
    if (flags.layer !== undefined) throw new InputError('--layer', 'applies to layered part files only');
    parts = models.map((m) => ({ ...m.layers[0].part, name: m.name }));
  }
  const results = parts.map((p) => integrateExpression(p, flags.expr, { ...opts, where: '--expr' }));
  for (const r of results) assertFiniteIntegral('--expr', { integral: r.integral, momentX: r.momentX, momentY: r.momentY, pointX: r.pointX ?? undefined, pointY: r.pointY ?? undefined });
  if (flags.json) {
    const docs = results.map((r) => integralJson(r, flags.exprUnit));
    return jsonTerminalText(JSON.stringify(docs.length === 1 ? docs[0] : { parts: docs }, null, 2) + '\n');
  }
  return terminalText(results.map((r) => integralText(r, flags.exprUnit)).join('\n'));
}
