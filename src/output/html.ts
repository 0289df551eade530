/**
 * One self-contained HTML report per input file: no network access (inline CSS and SVG only, system
 * fonts, no scripts). Per part: the drawing, the table of quantities (value, estimate, unit), the method,
 * a convergence plot, mass properties where thickness and density are given, and the cautions; the
 * header and footer trace the report to its input (file name, SHA-256 of the bytes), tool version and date.
 *
 * Machine-readable hooks: each quantity row is `<tr data-key="area">` and its value and estimate cells
 * carry `data-value` / `data-error` with the shortest round-trip text of the very numbers `measure --json`
 * prints (JSON.stringify and String give the same digits for finite numbers). The value cell shows the value
 * rounded to what its estimate supports (ROUNDING_RULE, stated in the report's header).
 */
import type { LevelResult, SectionResult } from '../analysis/measure.js';
import type { MassResult } from '../analysis/plate.js';
import { densityText, warningText } from './words.js';
import { GEOMETRY_CAUTION, MASS_CAUTION, NET_SECTION_NOTE } from './cautions.js';
import { PRISMATIC_NOTE } from './memberText.js';
import { formatError, formatNumber, formatValue } from './text.js';
import { ROUNDING_RULE } from './numbers.js';
import type { FabricationFigures } from '../properties/fabrication.js';
import { orderedFabrication } from './fabricationText.js';
import { type Quantity, SECTION_QUANTITIES, quantityInfo, unitText } from '../properties/quantities.js';
import { convergencePlot, convergencePoints } from './convergence.js';
import { type DrawOptions, drawPart } from './draw.js';
import { num } from './pathData.js';
import { stopText } from './stopText.js';
import { boundaryMethodText } from './massText.js';

export interface ReportPart {
  /** Result measured exactly as `measure` measures it (the table shows these numbers). */
  result: SectionResult;
  /** Levels of a run with more refinements, for the convergence plot (default: result.levels). */
  convergence?: readonly LevelResult[];
  /** Mass properties, when thickness and density (or material) are known. */
  mass?: MassResult;
  /** Why mass is not shown (printed instead of the mass table). */
  massNote?: string;
  /** Fabrication figures (cut length, pierces, blank, scrap; masses with a constant plate). */
  fabrication?: FabricationFigures;
  /** Length of the marking (etch) lines over this part, when the drawing has any. */
  markingLength?: number;
  /** How the drawing was read: the interpretation's lines in words, and what the picture shows of it. */
  reading?: { lines: string[]; draw: DrawOptions['reading'] };
  /** Section marks asked for (shear centre, plastic neutral axes, net lines), drawn and keyed on the drawing. */
  marks?: DrawOptions['marks'];
}

export interface ReportInput {
  /** Input file as named on the command line, and the SHA-256 (hex) of its bytes. */
  file: { name: string; sha256: string };
  /** Tool version (cli/version.ts). */
  version: string;
  /** ISO 8601 date and time of the run. */
  date: string;
  /** The options that shaped the numbers (printed for traceability). */
  settings?: Record<string, string | number | boolean | undefined>;
  parts: ReportPart[];
}

export function escapeHtml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

const CSS = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0 auto; max-width: 980px; padding: 24px 28px 40px; color: #1b2530; background: #fff;
  font: 14px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, Helvetica, Arial, sans-serif; }
h1 { font-size: 22px; margin: 0 0 4px; }
h2 { font-size: 19px; margin: 28px 0 8px; padding-top: 10px; border-top: 2px solid #1b2530; }
h3 { font-size: 15px; margin: 20px 0 6px; }
.trace { display: grid; grid-template-columns: max-content 1fr; gap: 2px 14px; margin: 8px 0 0; font-size: 13px; }
.trace dt { font-weight: 600; } .trace dd { margin: 0; overflow-wrap: anywhere; }
code, .num { font-family: ui-monospace, "SF Mono", Menlo, Consolas, "DejaVu Sans Mono", monospace; }
figure { margin: 8px 0; } figure svg { max-width: 100%; height: auto; display: block; }
figcaption { font-size: 12.5px; color: #3d4a57; margin-top: 4px; }
table { border-collapse: collapse; width: 100%; font-size: 13px; }
th, td { text-align: left; padding: 3px 8px; border-bottom: 1px solid #d5dbe1; vertical-align: top; }
th { background: #eef1f4; border-bottom: 1.5px solid #1b2530; }
tbody th { background: none; border-bottom: 1px solid #d5dbe1; font-weight: 400; }
td.num { text-align: right; white-space: nowrap; }
.plots { display: flex; flex-wrap: wrap; gap: 12px; }
.caution { border-left: 4px solid #a33f00; padding: 6px 10px; background: #fbf4ee; margin: 6px 0; }
.warning { border-left: 4px solid #1b2530; padding: 6px 10px; background: #eef1f4; margin: 6px 0; }
.hook { border: 1px dashed #5f6b77; padding: 6px 10px; }
footer { margin-top: 32px; font-size: 12px; border-top: 1px solid #d5dbe1; padding-top: 8px; }
@page { size: auto; margin: 14mm 12mm; }
@media print {
  body { max-width: none; padding: 0; color: #000; background: #fff; font-size: 11pt; }
  h2 { break-after: avoid; }
  section.part + section.part { break-before: page; }
  table, figure, .plots, .caution, dl { break-inside: avoid; }
  tr { break-inside: avoid; }
  th { background: #fff; }
  .caution, .warning { background: #fff; }
}
`;

function quantityTable(q: Record<string, Quantity>, keys: readonly string[], lengthUnit: string, role: string): string {
  const rows = keys.map((key) => {
    const v = q[key];
    const info = quantityInfo(key);
    const unit = info ? unitText(info.dimension, lengthUnit) : '';
    return `<tr data-key="${escapeHtml(key)}"><th scope="row"><code>${escapeHtml(key)}</code></th>` +
      `<td class="num" data-value="${num(v.value)}">${escapeHtml(formatValue(v.value, v.error))}</td>` +
      `<td class="num" data-error="${num(v.error)}">± ${escapeHtml(formatError(v.error))}</td>` +
      `<td>${escapeHtml(unit)}</td><td>${escapeHtml(info?.description ?? '')}</td></tr>`;
  });
  return `<table data-role="${role}"><thead><tr><th>quantity</th><th>value</th><th>estimate</th><th>unit</th><th>meaning</th></tr></thead>` +
    `<tbody>\n${rows.join('\n')}\n</tbody></table>`;
}

function methodList(r: SectionResult): string {
  const m = r.method;
  if (m.path === 'boundary') {
    const items: [string, string][] = [
      ['path', 'exact boundary integrals: the moments are sums over the boundary segments (Green\'s theorem: closed forms on lines and arcs, exact Gauss–Legendre on Béziers); no mesh, no refinement'],
      ['estimate', `${m.estimator}: round-off allowance only`],
      ['stop', stopText(m)],
      ['edges', String(m.vertices)],
      ['local origin', `(${formatNumber(m.localOrigin[0])}, ${formatNumber(m.localOrigin[1])}) ${r.units}`],
    ];
    return `<dl class="trace" data-role="method">${items.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd>`).join('')}</dl>`;
  }
  const items: [string, string][] = [
    ['rule', `Dunavant degree ${m.degree} (${m.rulePoints} points) on curved triangles; straight triangles use the lowest rule exact for the moments`],
    ['triangles', `${m.baseTriangles} in the base mesh (${m.curvedTriangles} curved, ${m.vertices} vertices), refined uniformly ${m.refinementLevels}× to ${m.triangles}`],
    ['estimate', `${m.estimator}: |refined − coarse| of each quantity plus a round-off allowance`],
    ['stop', stopText(m)],
    ['triangulation', String(m.triangulation)],
    ['curved maps', `smallest Jacobian ratio ${formatNumber(m.minJacobianRatio, 3)}`],
    ['local origin', `(${formatNumber(m.localOrigin[0])}, ${formatNumber(m.localOrigin[1])}) ${r.units}`],
  ];
  const known = new Set(['path', 'degree', 'rulePoints', 'estimator', 'stopped', 'baseTriangles', 'triangles', 'curvedTriangles', 'vertices', 'refinementLevels', 'chordSplits', 'triangulation', 'minJacobianRatio', 'localOrigin']);
  if (m.chordSplits) items.push(['chord splits', String(m.chordSplits)]);
  // fields added to MethodInfo later (a tolerance, a stop reason) appear without changes here
  for (const [k, v] of Object.entries(m)) if (!known.has(k)) items.push([k, typeof v === 'object' ? JSON.stringify(v) : String(v)]);
  return `<dl class="trace" data-role="method">${items.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd>`).join('')}</dl>`;
}

function massBlock(p: ReportPart): string {
  if (!p.mass) {
    return `<p class="hook" data-role="mass-missing">${escapeHtml(p.massNote ?? 'Mass not shown: no thickness and density (or material) were given.')}</p>`;
  }
  const m = p.mass;
  const keys = Object.keys(m.quantities);
  const layers = m.layers.map((l) => `<li>${escapeHtml(l.name)}: thickness ${escapeHtml(l.thickness)} ${escapeHtml(m.units)}, density ${escapeHtml(densityText(l.densityFrom))}, underside at z = ${formatNumber(l.z0)} ${escapeHtml(m.units)}</li>`).join('');
  return `<ul data-role="materials">${layers}</ul>\n${quantityTable(m.quantities as Record<string, Quantity>, keys, m.units, 'mass')}` +
    (m.method.estimator === 'exact boundary integrals'
      ? `<p>Mass ${escapeHtml(boundaryMethodText('thickness and density constant or polynomials in x and y'))}.</p>`
      : `<p>Mass method: Dunavant degree ${m.method.degree}, ${m.method.triangles} triangles, ${escapeHtml(m.method.estimator)}; ` +
        `${m.method.tolerance === null ? 'no tolerance requested' : `tolerance ${m.method.tolerance}`}, stop: ${escapeHtml(stopText(m.method))}.</p>`);
}

/** Fabrication block: cut length, pierces, blank, scrap (and masses with a constant plate), box, marking. */
function fabricationBlock(p: ReportPart): string {
  const f = p.fabrication;
  if (!f) return '';
  const u = p.result.units, x = f.box;
  const items: [string, string][] = [
    ['bounding box', `${formatNumber(x.width)} × ${formatNumber(x.height)} ${u}, x ${formatNumber(x.xMin)} to ${formatNumber(x.xMax)}, y ${formatNumber(x.yMin)} to ${formatNumber(x.yMax)} ${u}`],
    ['blank', `smallest enclosing rectangle ${formatNumber(f.blank.width, 8)} × ${formatNumber(f.blank.height, 8)} ${u}, long side at ${formatNumber(f.blank.angle, 6)}° from +x`],
    ['pierces', 'one per closed contour (outer contours and cut-outs); cut length: every contour once'],
    ['marking', p.markingLength !== undefined && p.markingLength > 0 ? `${formatNumber(p.markingLength)} ${u} of marking (etch) lines, not cut` : 'no marking lines'],
  ];
  if (!f.quantities.netMass) items.push(['masses', 'not computed (give a thickness and a material or density)']);
  return `<h3>Fabrication</h3>
${quantityTable(orderedFabrication(f), Object.keys(orderedFabrication(f)), u, 'fabrication')}
<dl class="trace" data-role="fabrication-notes">${items.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd>`).join('')}</dl>`;
}

/** Convergence plots where the values came from refinement and changed; otherwise a sentence saying why not. */
async function convergenceBlock(p: ReportPart): Promise<string> {
  const r = p.result;
  if (r.method.path === 'boundary') {
    return '<p data-role="convergence-note">No convergence to show: the values come from exact boundary integrals (no mesh, no refinement); each ± is the round-off allowance.</p>';
  }
  const levels = p.convergence ?? r.levels;
  const keys = [['area', 'area'], ['Ix', 'length4']] as const;
  const moved = keys.filter(([k]) => convergencePoints(levels, k).some((c) => c.change > 0));
  if (moved.length === 0) {
    return `<p data-role="convergence-note">No convergence to show: area and Ix did not change at all in floating point over ${levels.length - 1} refinements (${levels.map((l) => l.triangles).join(' → ')} triangles); the result is exact for this mesh, and each ± is the round-off allowance.</p>`;
  }
  const plots = await Promise.all(moved.map(([k, dim]) => convergencePlot(convergencePoints(levels, k), k, unitText(dim, r.units), k)));
  const anyZero = moved.some(([k]) => convergencePoints(levels, k).some((c) => c.change === 0));
  return `<div class="plots">${plots.join('')}</div>
<p><small>Change of each value from one refinement of the curved triangles to the next (${levels.length - 1} refinements; straight triangles are exact and are not refined; ${levels.map((l) => l.triangles).join(' → ')} triangles).${anyZero ? ' Open markers on the bottom edge: no change at all in floating point.' : ''} The table's values come from the run described under Method.</small></p>`;
}

async function partSection(p: ReportPart, index: number): Promise<string> {
  const r = p.result;
  const drawing = await drawPart(r, { reading: p.reading?.draw, marks: p.marks });
  const q = r.quantities as Record<string, Quantity>;
  const keys = SECTION_QUANTITIES.map((i) => i.key);
  const holes = r.geometry.part.regions.reduce((n, g) => n + g.holes.length, 0);
  const warn = r.warnings.map((w) => `<p class="warning">Warning: ${escapeHtml(warningText(w))}</p>`).join('\n');
  return `<section class="part" data-part="${escapeHtml(r.part)}" data-index="${index}">
<h2>${escapeHtml(r.part)}</h2>
${p.reading ? `<ul data-role="reading">${p.reading.lines.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul>` : ''}
<p>Lengths in ${escapeHtml(r.units)}; ${r.geometry.part.regions.length} region${r.geometry.part.regions.length === 1 ? '' : 's'}, ${holes} cut-out${holes === 1 ? '' : 's'}.</p>
<figure data-role="drawing">${drawing}<figcaption>Material shaded, cut-outs clear; centroid marked; solid line: I1 axis, dash-dot line: I2 axis; dashed frame: bounding box; ring with x and y arrows: the origin (0, 0) of the coordinates (or, when it lies off the drawing, a note under the scale bar). Curves drawn exactly (SVG arcs and Béziers).</figcaption></figure>
<h3>Quantities</h3>
${quantityTable(q, keys, r.units, 'quantities')}
<h3>Method</h3>
${methodList(r)}
<h3>Convergence</h3>
${await convergenceBlock(p)}
<h3>Mass and materials</h3>
${massBlock(p)}
${fabricationBlock(p)}
<h3>Cautions</h3>
${warn}
<p class="caution">${escapeHtml(GEOMETRY_CAUTION)}</p>
${p.mass ? `<p class="caution">${escapeHtml(MASS_CAUTION)}</p>` : ''}
${p.marks?.shearCentre ? `<p class="caution">${escapeHtml(PRISMATIC_NOTE)}</p>` : ''}
${p.marks?.netSections?.length ? `<p class="caution">${escapeHtml(NET_SECTION_NOTE)}</p>` : ''}
</section>`;
}

const BARE_NUMBER = /^\s*[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?\s*$/i;

/**
 * One setting with its unit: a bare thickness is in the part's length unit and a bare density in kg/m³
 * (the settings grammar, src/model/settings.ts); an expression says its unit in brackets; counts have none.
 */
export function settingText(key: string, value: string, lengthUnit: string): string {
  const unit = key === 'thickness' ? lengthUnit : key === 'density' ? 'kg/m³' : undefined;
  if (unit === undefined) return key === 'degree' ? `rule degree ${value}` : key === 'levels' ? `${value} refinement levels` : `${key} ${value}`;
  if (BARE_NUMBER.test(value)) return `${key} ${value.trim()} ${unit}`;
  return /\b[xy]\b/.test(value) ? `${key} ${value} (${unit})` : `${key} ${value}`; // an expression in x and y
}

/** The report as one HTML document. */
export async function buildReport(input: ReportInput): Promise<string> {
  const sections: string[] = [];
  for (let i = 0; i < input.parts.length; i++) sections.push(await partSection(input.parts[i], i + 1));
  const names = input.parts.map((p) => p.result.part);
  const title = `${names.length === 1 ? names[0] : `${names.length} parts`} — platewise report`;
  const lengthUnit = input.parts[0]?.result.units ?? 'mm';
  const settings = Object.entries(input.settings ?? {}).filter(([, v]) => v !== undefined).map(([k, v]) => settingText(k, String(v), lengthUnit)).join(', ') || 'defaults';
  const trace = `<dl class="trace" data-role="trace">
<dt>input file</dt><dd><code data-role="file">${escapeHtml(input.file.name)}</code></dd>
<dt>SHA-256</dt><dd><code data-role="sha256">${escapeHtml(input.file.sha256)}</code></dd>
<dt>tool</dt><dd>platewise <span data-role="version">${escapeHtml(input.version)}</span></dd>
<dt>date</dt><dd><time data-role="date" datetime="${escapeHtml(input.date)}">${escapeHtml(input.date)}</time></dd>
<dt>settings</dt><dd>${escapeHtml(settings)}</dd>
</dl>
<p data-role="rounding-rule"><small>${escapeHtml(ROUNDING_RULE)}</small></p>`;
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="platewise ${escapeHtml(input.version)}">
<title>${escapeHtml(title)}</title>
<style>${CSS}</style>
</head>
<body>
<header>
<h1>${escapeHtml(title)}</h1>
<p>Area properties of flat plates by mesh-based quadrature; every value carries an estimate of its error.</p>
${trace}
</header>
${sections.join('\n')}
<footer>Report of <code>${escapeHtml(input.file.name)}</code> (SHA-256 ${escapeHtml(input.file.sha256.slice(0, 16))}…), platewise ${escapeHtml(input.version)}, ${escapeHtml(input.date)}.</footer>
</body>
</html>
`;
}
