import { type IntegrationOptions, integrateExpression } from '../../src/analysis/plate.js';
import { InputError } from '../../src/base/errors.js';
import type { Part } from '../../src/geometry/part.js';
import { detectFormat } from '../../src/read/detect.js';
import { readInputText } from '../../src/base/files.js';
import { integralJson, integralText } from '../../src/output/massText.js';
import { readPlateModel } from '../../src/read/partJson.js';
import { checkReadOptions, readParts } from '../../src/read/read.js';
import { SAFE_DEGREES } from '../../src/quadrature/rules.js';

export interface IntegrateFlags {
  expr: string; exprUnit?: string; layer?: string; tolerance?: number; maxTriangles?: number; timeLimit?: number;
  degree?: number; json?: boolean; format?: string; units?: string;
}

/** Check --tolerance, --max-triangles, --time-limit and --degree; shared with measure's mass flags. */
export function integrationOptions(flags: { tolerance?: number; maxTriangles?: number; timeLimit?: number; degree?: number }): IntegrationOptions {
  if (flags.tolerance !== undefined && !(flags.tolerance > 0 && flags.tolerance < 1)) throw new InputError('--tolerance', `expected a relative tolerance between 0 and 1 (e.g. 1e-6), got ${flags.tolerance}`);
  if (flags.maxTriangles !== undefined && !(flags.maxTriangles >= 100 && flags.maxTriangles <= 20_000_000)) throw new InputError('--max-triangles', `expected 100 to 20000000, got ${flags.maxTriangles}`);
  if (flags.timeLimit !== undefined && !(flags.timeLimit > 0 && flags.timeLimit <= 3600)) throw new InputError('--time-limit', `expected seconds between 0 and 3600, got ${flags.timeLimit}`);
  if (flags.degree !== undefined && !SAFE_DEGREES.includes(flags.degree)) throw new InputError('--degree', `expected one of the safe degrees ${SAFE_DEGREES.join(', ')}, got ${flags.degree}`);
  return { tolerance: flags.tolerance, maxTriangles: flags.maxTriangles, maxMillis: flags.timeLimit === undefined ? undefined : flags.timeLimit * 1000, degree: flags.degree };
}

export function integrate(file: string, flags: IntegrateFlags): string {
  const opts = integrationOptions(flags);
  if (flags.exprUnit !== undefined && !/^[^\s\u0000-\u001f]{1,20}$/u.test(flags.exprUnit)) throw new InputError('--expr-unit', `expected a short unit name without spaces, got "${flags.exprUnit}"`);
  const readOpts = checkReadOptions(flags.format, flags.units);
  const input = readInputText(file);
  const format = readOpts.format ?? detectFormat(input.label === 'stdin' ? undefined : input.label, input.text);
  let parts: Part[];
  if (format === 'part-json') {
    if (readOpts.units !== undefined) throw new InputError('--units', 'applies to SVG, GeoJSON and WKT drawings; a part file states its own "units"');
    const model = readPlateModel(input.text, input.label);
    let layer = model.layers[0];
    if (flags.layer !== undefined) {
      const hit = model.layers.find((l) => l.name === flags.layer);
      if (!hit) throw new InputError('--layer', `no layer "${flags.layer}"; the part has ${model.layers.map((l) => `"${l.name}"`).join(', ')}`);
      layer = hit;
    }
    parts = [model.layered ? layer.part : { ...layer.part, name: model.name }];
  } else {
    if (flags.layer !== undefined) throw new InputError('--layer', 'applies to layered part files only');
    parts = readParts(input.text, input.label, readOpts);
  }
  const results = parts.map((p) => integrateExpression(p, flags.expr, { ...opts, where: '--expr' }));
  if (flags.json) {
    const docs = results.map((r) => integralJson(r, flags.exprUnit));
    return JSON.stringify(docs.length === 1 ? docs[0] : { parts: docs }, null, 2) + '\n';
  }
  return results.map((r) => integralText(r, flags.exprUnit)).join('\n');
}
