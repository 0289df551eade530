import { DEFAULT_DEGREE, listRules } from '../../src/quadrature/rules.js';
import { DUNAVANT_SOURCE } from '../../src/quadrature/dunavant1985.js';

export function rules(flags: { json?: boolean }): string {
  const list = listRules();
  if (flags.json) return JSON.stringify({ source: DUNAVANT_SOURCE, defaultDegree: DEFAULT_DEGREE, rules: list }, null, 2) + '\n';
  const lines = ['degree  points  marks'];
  for (const r of list) {
    const marks = [r.negativeWeight ? 'negative weight' : '', r.pointsOutside ? 'points outside the triangle' : ''].filter(Boolean).join(', ');
    lines.push(`${String(r.degree).padStart(6)}  ${String(r.points).padStart(6)}  ${marks || '-'}${r.degree === DEFAULT_DEGREE ? '  (default)' : ''}`);
  }
  lines.push('', `Marked rules are used only when asked for with --degree. Source: ${DUNAVANT_SOURCE}`);
  return lines.join('\n') + '\n';
}
