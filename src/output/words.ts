/**
 * Words for the facts the library reports: warnings, density origins, unit sources and stop reasons.
 * The library reports codes with parameters; this is the one place that turns them into English.
 */
import type { AnalysisWarning } from '../analysis/analyze.js';
import type { IntegralWarning } from '../analysis/plate.js';
import type { InterpretationSummary, InterpretationWarning } from '../read/interpret.js';
import type { DensityOrigin, UnitSource } from '../model/plate.js';
import { formatNumber } from './numbers.js';

const n = (v: number) => formatNumber(v, 6);

export function warningText(w: AnalysisWarning): string {
  switch (w.code) {
    case 'principal-axes-undefined':
      return 'I1 and I2 are equal within their estimates: every centroidal axis is a principal axis, so principalAngle is not defined (reported as 0 ± 90°).';
    case 'distorted-curved-triangle':
      return `a curved triangle is strongly distorted (smallest Jacobian ratio ${w.minJacobianRatio.toPrecision(2)}); treat the estimate with care.`;
    case 'density-implausible': {
      const [lo, hi] = w.limit as [number, number];
      return `${w.where}: a density of ${n(w.value)} kg/m³ is outside ${n(lo)} to ${n(hi)} kg/m³, unusual for a plate material; check the unit (7.85 g/cm³ is 7850 kg/m³).`;
    }
    case 'thickness-exceeds-part':
      return `${w.where}: the thickness ${n(w.value)} ${w.unit} is larger than the part itself (${n(w.limit as number)} ${w.unit}); check the unit.`;
    case 'thickness-very-thin':
      return `${w.where}: the thickness ${n(w.value)} ${w.unit} is under ${n(w.limit as number)} ${w.unit} (0.01 mm); check the unit.`;
    case 'mass-not-computed':
      return `mass figures not computed: no ${w.missing.join(' and ')} (give ${w.missing.map((m) => (m === 'thickness' ? 'a thickness' : 'a density or material')).join(' and ')}).`;
  }
}

/** Warnings for JSON: the code and parameters as facts, plus the sentence. */
export function warningJson(w: AnalysisWarning): Record<string, unknown> {
  return { ...w, message: warningText(w) };
}

export function densityText(d: DensityOrigin): string {
  if (d.kind === 'material') {
    return `${d.id}, ${d.density} kg/m³ (${d.source}${d.origin === 'built-in' ? '' : `; from ${d.origin}`})`;
  }
  return `${d.text} kg/m³ given ${d.where.startsWith('--') ? 'by' : 'at'} ${d.where}`;
}

export function unitSourceText(s: UnitSource): string {
  switch (s) {
    case 'file': return 'stated by the file';
    case 'option': return 'chosen with --units';
    case 'assumed': return 'ASSUMED (the file states none)';
  }
}

const ROUGH = 'the integrand may be singular (a pole, division by zero) inside the part or too rough for this mesh: check it, and try --tolerance';

export function integralWarningText(w: IntegralWarning): string {
  switch (w.code) {
    case 'integral-indistinguishable-from-zero':
      return `∫ f dA is not distinguishable from zero within its estimate (${w.estimate.toPrecision(2)} against |${w.value.toPrecision(6)}|): either the load balances (a pure couple) or ${ROUGH}. No point of action is given.`;
    case 'integral-estimate-large':
      return `the estimate of ∫ f dA is ${(100 * w.estimate / Math.abs(w.value)).toPrecision(2)}% of its value: ${ROUGH}.`;
  }
}

const INTERPRETATION_WARNINGS: Record<InterpretationWarning, string> = {
  'units-assumed': 'the drawing states no length unit: coordinates were read as CSS pixels (1 px = 25.4/96 mm); give --units if that is wrong',
  'units-assumed-mm': 'the drawing states no length unit: coordinates were read as millimetres; give --units if that is wrong',
  'hidden-content': 'hidden content (hidden layers or elements, layers switched off or frozen) was ignored, never cut',
  'duplicates-removed': 'contours drawn twice were found: each duplicate was removed and measured once',
  'foreign-content': 'elements outside the SVG namespace were ignored',
  'text-ignored': 'text in the drawing was ignored (it is not cut)',
  'marking-outside': 'a marking line lies outside the material',
  'shapes-united': 'overlapping shapes were united (--unite)',
  'open-contour-on-cut-layer': 'an open contour on a cut layer was taken as a marking line, not a cut',
  'css-selector-unsupported': 'a style rule with a selector that could not be matched was ignored',
  'sheet-border-skipped': 'a border around the parts was skipped (--sheet-border skip)',
};

export function interpretationWarningText(w: InterpretationWarning): string {
  return INTERPRETATION_WARNINGS[w];
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** One line saying how the drawing was read: what was cut, marking and ignored, with reasons. */
export function interpretationText(s: InterpretationSummary, part?: string): string[] {
  const reasons = (o: Record<string, number | undefined>) => Object.entries(o).filter(([, n]) => n).map(([k, n]) => `${k} ${n}`).join(', ');
  const ignored = Object.values(s.ignored).reduce((a, b) => a + b, 0);
  const marks = Object.values(s.markingBy).reduce((a: number, b) => a + (b ?? 0), 0);
  const lines = [
    `read as (${s.format}): ${plural(s.outlines, 'outline')}, ${plural(s.cutouts, 'cut-out')}, ${marks} marking${marks ? ` (${reasons(s.markingBy)})` : ''}, ` +
      `${ignored} ignored${ignored ? ` (${reasons(s.ignored)})` : ''}${s.duplicates.length ? `, ${plural(s.duplicates.length, 'duplicate')} removed` : ''}`,
    `length unit ${s.units.unit}: ${unitSourceText(s.units.source)}`,
  ];
  const mine = s.parts.find((p) => p.name === part);
  if (mine && mine.markings > 0) lines.push(`marking length of this part: ${formatNumber(mine.markingLength)} ${s.units.unit} (${plural(mine.markings, 'marking line')})`);
  if (s.gapsClosed.length > 0) {
    const big = Math.max(...s.gapsClosed.map((g) => g.gap));
    lines.push(`joined: ${plural(s.gapsClosed.length, 'gap')} between loose ends closed (largest ${formatNumber(big, 3)} ${s.units.unit}, join tolerance ${formatNumber(s.tolerance, 3)} ${s.units.unit})`);
  }
  const FINDING = { overlap: 'drawn twice over', duplicate: 'entity duplicated (left out of joining)', branch: 'more than two ends meet' } as const;
  s.joinFindings.slice(0, 10).forEach((f) => lines.push(`${FINDING[f.finding]}: ${f.where}${f.layer !== undefined ? ` (layer ${f.layer})` : ''} near (${formatNumber(f.x, 8)}, ${formatNumber(f.y, 8)})${f.length !== undefined ? `, ${formatNumber(f.length, 4)} ${s.units.unit} long` : ''}`));
  if (s.joinFindings.length > 10) lines.push(`… and ${s.joinFindings.length - 10} more places where loose entities retrace each other or branch`);
  for (const d of s.duplicates) lines.push(`duplicate removed: ${d.where}${d.layer ? ` (layer ${d.layer})` : ''} repeats ${d.duplicateOf}`);
  for (const w of s.warnings) lines.push(`warning: ${interpretationWarningText(w)}`);
  return lines;
}
