/**
 * The page's worker: every computation of the page runs here, on the library's own code (bundled by
 * web/build.mjs), so the page stays responsive while a large part is measured. It is a front end like cli/:
 * texts in, one call into src/, a writer out. Messages are plain data (structured clone); the page never
 * receives the library's objects, only texts, numbers and the writers' output.
 */
import { analyzePart, type PartReport } from '../src/analysis/analyze.js';
import { InputError, OptionError, optionFlag } from '../src/base/errors.js';
import { decodeUtf8, MAX_INPUT_BYTES } from '../src/base/utf8.js';
import { type BatchRow, failureText, jobRows } from '../src/batch/jobRows.js';
import type { Job } from '../src/batch/manifest.js';
import { batchLine } from '../src/batch/lines.js';
import { type MaterialTable, listMaterials } from '../src/model/materials.js';
import { loadMaterialFile } from '../src/model/materialFile.js';
import type { PlateModel, PlateSettings } from '../src/model/plate.js';
import { SummaryBuilder, batchCsvHeader, batchCsvRow, summaryText } from '../src/output/batchRows.js';
import { GEOMETRY_CAUTION, MASS_CAUTION } from '../src/output/cautions.js';
import { comparePart, pickPart } from '../src/output/comparePart.js';
import { comparisonCsv, comparisonJson, comparisonText, rowAdvice } from '../src/output/compareText.js';
import { PALETTE, drawPart } from '../src/output/draw.js';
import { formatError, formatNumber, formatValue } from '../src/output/numbers.js';
import { NOT_A_BOUND, NUMERIC_FIBRES, type NetSectionDoc, boltGroupFigures, boltGroupText, memberFigureText, memberJson, netSectionWords, printUnit, torsionMethodText } from '../src/output/memberText.js';
import { parseNetLine } from '../src/geometry/netSection.js';
import { analyzeMemberModels } from '../src/analysis/torsionMember.js';
import { partReportJson, reportsJson } from '../src/output/partReport.js';
import { reportHtml } from '../src/output/reportPart.js';
import { interpretationText, unitSourceText, warningText } from '../src/output/words.js';
import { quantityInfo, unitText } from '../src/properties/quantities.js';
import { readReference } from '../src/qa/reference.js';
import { type ReadModel, readModels } from '../src/read/models.js';
import { readOptions } from '../src/read/drawingOptions.js';
import type { ReadOptions } from '../src/read/read.js';
import type { LengthUnit } from '../src/base/units.js';
import type { MassUnits } from '../src/output/massText.js';
import { READING_SETTINGS } from './protocol.js';
import type { FileSettings, FileView, MaterialView, MemberPartView, MemberView, PartView, QuantityGroupView, ToWorker } from './protocol.js';

declare const PLATEWISE_VERSION: string;

/** The page's mass-unit choices as the command line's --mass-unit and --inertia-unit ('' is its default). */
export const MASS_CHOICES: Record<string, MassUnits> = {
  '': { mass: 'kg', inertia: 'kg·m²' },
  lb: { mass: 'lb', inertia: 'lb·in²' },
  'lb-ft': { mass: 'lb', inertia: 'lb·ft²' },
  g: { mass: 'g', inertia: 'g·cm²' },
};
const massUnitsOf = (s: FileSettings): MassUnits => MASS_CHOICES[s.massUnits] ?? MASS_CHOICES[''];

interface Held { name: string; bytes: Uint8Array; settings: FileSettings; reports?: PartReport[] }
const files = new Map<number, Held>();
/** The user's materials file (the command line's --materials-file), for every file of the page. */
let userMaterials: MaterialTable | undefined;
/** Every material the page knows, and how many of them come from the user's file. */
function materialList(): { materials: MaterialView[]; count: number } {
  const materials = listMaterials(userMaterials).map((x) => ({ id: x.id, name: x.name, density: x.density, aliases: [...x.aliases], fromFile: x.origin !== 'built-in' }));
  return { materials, count: materials.filter((x) => x.fromFile).length };
}

/** The file as the command line would read it: the same size limit and the same decoding with its messages. */
function textOf({ name, bytes }: { name: string; bytes: Uint8Array }): string {
  if (bytes.length > MAX_INPUT_BYTES) throw new InputError(name, `is ${bytes.length} bytes; the limit is ${MAX_INPUT_BYTES} bytes`);
  return decodeUtf8(bytes, name);
}

/** The page's inputs as settings given on the command line (--thickness, --material, --density). */
function given(s: FileSettings): PlateSettings {
  const g: PlateSettings = {};
  if (s.thickness.trim() !== '') g.thickness = { text: s.thickness.trim(), where: 'thickness' };
  if (s.material.trim() !== '') g.material = { text: s.material.trim(), where: 'material' };
  if (s.density.trim() !== '') g.density = { text: s.density.trim(), where: 'density' };
  return g;
}

function groupView(title: string, group: string, q: Record<string, { value: number; error: number; errorIsBound?: false }> | undefined, unitOf: (key: string) => string): QuantityGroupView | undefined {
  if (!q) return undefined;
  return {
    title, group,
    rows: Object.entries(q).map(([key, v]) => ({
      key, value: v.value, error: v.error, text: formatValue(v.value, v.error), errorText: formatError(v.error), unit: unitOf(key),
      description: quantityInfo(key)?.description ?? '', bound: v.errorIsBound !== false,
    })),
  };
}

function partView(r: PartReport, mu: MassUnits): PartView {
  // exactly the document `measure --json` prints for this part, and the units it states for each group
  const doc = partReportJson(r, mu) as {
    quantities: Record<string, { value: number; error: number }>;
    massProperties?: { quantities: Record<string, { value: number; error: number }>; units: { mass: string; massMoment: string } };
    fabrication?: { quantities: Record<string, { value: number; error: number }>; units: { mass: string } };
  };
  const length = r.units;
  const unit = (key: string, mass: string, inertia: string) => {
    const info = quantityInfo(key);
    if (!info) return '';
    return info.dimension === 'massMoment' ? inertia : unitText(info.dimension, length, mass);
  };
  const groups = [
    groupView('Section', 'section', doc.quantities, (k) => unit(k, 'kg', '')),
    groupView('Mass', 'mass', doc.massProperties?.quantities, (k) => unit(k, doc.massProperties!.units.mass, doc.massProperties!.units.massMoment)),
    groupView('Cutting', 'fabrication', doc.fabrication?.quantities, (k) => unit(k, doc.fabrication!.units.mass, '')),
  ].filter((g): g is QuantityGroupView => g !== undefined);
  const reading = r.interpretation ? interpretationText(r.interpretation, r.part) : [`length unit ${r.units}: ${unitSourceText(r.unitSource)}`];
  const p = r.plate;
  return {
    name: r.part, units: r.units, groups, warnings: r.warnings.map(warningText), reading,
    cautions: [GEOMETRY_CAUTION, ...(r.cautions.includes('mass') ? [MASS_CAUTION] : [])],
    plate: p ? `thickness ${formatNumber(p.thickness)} ${r.units}, density ${formatNumber(p.density)} kg/m³${p.material ? ` (${p.material})` : ''}` : undefined,
    missing: r.missing,
  };
}

/** The card's drawing settings as the command line's drawing options (the same checks and messages). */
function readOptionsOf(s: FileSettings): ReadOptions {
  const t = (v: string) => (v.trim() === '' ? undefined : v.trim());
  return readOptions({
    units: t(s.units), cutLayers: t(s.cutLayers), markLayers: t(s.markLayers), skipLayers: t(s.skipLayers),
    joinTolerance: t(s.joinTolerance) === undefined ? undefined : Number(s.joinTolerance.trim()), unite: s.unite === 'yes' ? true : undefined,
  });
}
/** Whether the card sets any drawing option (a refusal then falls back to the file as it says). */
const setsReading = (s: FileSettings) => READING_SETTINGS.some((k) => s[k].trim() !== '');

function modelsOf(h: Held): ReadModel[] {
  return readModels(textOf(h), h.name, readOptionsOf(h.settings));
}

/**
 * The drawings of the parts last measured (the library's SVG drawing, as `platewise draw` makes it, with what
 * is marking and what was ignored), sent after the figures: on a panel with a thousand holes the drawing takes
 * several times as long as the figures.
 */
async function drawings(key: number): Promise<string[]> {
  const reports = files.get(key)?.reports ?? [];
  const out: string[] = [];
  for (const r of reports) out.push(await drawPart(r.section, { reading: { notCut: r.notCut, gapsClosed: r.interpretation?.gapsClosed, unitSource: r.unitSource } }));
  return out;
}

/** `measure` with the page's settings: the same call and the same writer as `platewise measure --json`. */
function measure(key: number): FileView {
  const h = files.get(key)!;
  const t0 = performance.now();
  try {
    let models: ReadModel[];
    let unitsRefused: string | undefined;
    try {
      models = modelsOf(h);
    } catch (e) {
      // a unit the file contradicts, a unit given to a part file, a drawing option refused: the figures as the
      // file says, and the refusal
      if (!setsReading(h.settings)) throw e;
      models = readModels(textOf(h), h.name);
      unitsRefused = `platewise: ${e instanceof OptionError ? `${optionFlag(e.option)}: ${e.detail}` : failureText(e)}`;
    }
    const run = (g: PlateSettings) => models.map((m) => analyzePart(m, { given: g, materials: userMaterials, mass: 'required', fabrication: 'auto' }));
    const g = given(h.settings);
    let reports: PartReport[];
    let refused: string | undefined;
    try {
      reports = run(g);
    } catch (e) {
      // settings refused (half typed, unknown material, a figure the file states): the figures without them,
      // and the refusal in the command line's words
      if (Object.keys(g).length === 0) throw e;
      reports = run({});
      refused = `platewise: ${failureText(e)}`;
    }
    const mu = massUnitsOf(h.settings);
    const json = reportsJson(reports, mu);
    h.reports = reports;
    if (unitsRefused) refused = refused ? `${unitsRefused}\n${refused}` : unitsRefused;
    return { ok: true, parts: reports.map((r) => partView(r, mu)), json, millis: performance.now() - t0, refused };
  } catch (e) {
    h.reports = undefined;
    return { ok: false, message: `platewise: ${failureText(e)}`, millis: performance.now() - t0 };
  }
}

/** The job `batch` would run for this file, its settings as a manifest row's cells. */
function jobOf(key: number, row: number): Job {
  const h = files.get(key)!;
  return { row, file: h.name, path: h.name, quantity: h.settings.quantity, plate: given(h.settings), stated: [], ...(h.settings.units ? { units: h.settings.units as LengthUnit } : {}) };
}

function batch(keys: number[]): { csv: string; rows: BatchRow[]; summary: ReturnType<SummaryBuilder['finish']>; summaryLines: string[] } {
  const summary = new SummaryBuilder(1);
  let csv = batchCsvHeader();
  const all: BatchRow[] = [];
  keys.forEach((key, i) => {
    const h = files.get(key)!;
    // the card's drawing options as batch's command-line drawing options (a refused one fails this row, as there)
    let read: ReadOptions | undefined, refusal: unknown;
    try { read = readOptionsOf(h.settings); } catch (e) { refusal = e; }
    const rows = jobRows(jobOf(key, i + 1), { defaults: {}, materials: userMaterials, read }, {
      part: () => { if (refusal) throw refusal; return { text: textOf(h) }; },
      reference: () => { throw new Error('no reference file in the page'); },
    });
    for (const r of rows) { const l = batchLine(r, undefined); csv += batchCsvRow(l); summary.add(l); all.push(r); }
  });
  const s = summary.finish(0);
  // the summary in the command line's words, without the line about workers and seconds (nothing to time here)
  const lines = summaryText(s).trimEnd().split('\n').filter((l) => !/ worker(s)?, .* s, .* parts\/s$/.test(l));
  return { csv, rows: all, summary: s, summaryLines: lines };
}

async function report(key: number): Promise<string> {
  const h = files.get(key)!;
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', h.bytes as Uint8Array<ArrayBuffer>));
  const sha256 = [...digest].map((b) => b.toString(16).padStart(2, '0')).join('');
  const s = h.settings;
  return reportHtml(modelsOf(h), {
    section: {}, given: given(s), materials: userMaterials,
    file: { name: h.name, sha256 }, version: PLATEWISE_VERSION, date: new Date().toISOString(),
    settings: { thickness: s.thickness || undefined, density: s.density || undefined, material: s.material || undefined, units: s.units || undefined },
  });
}

function compare(key: number, refName: string, refBytes: Uint8Array) {
  const h = files.get(key)!;
  const reference = readReference(decodeUtf8(refBytes, refName), refName);
  const models = modelsOf(h);
  const model: PlateModel = pickPart(models, h.name, reference.part, `${refName}:part`);
  const { comparison, meta } = comparePart(model, reference, { file: h.name, reference: refName }, { given: given(h.settings), materials: userMaterials });
  return {
    verdict: comparison.verdict, counts: comparison.counts, text: comparisonText(comparison, meta),
    json: JSON.stringify(comparisonJson(comparison, meta), null, 2) + '\n', csv: comparisonCsv(comparison),
    rows: comparison.rows.map((r) => ({
      quantity: r.quantity, verdict: r.verdict,
      stated: `${formatNumber(r.statedAsWritten)}${r.statedUnit ? ' ' + r.statedUnit : ''}`,
      computed: r.computed === null ? '—' : `${formatValue(r.computed, r.error ?? NaN)}${r.unit ? ' ' + r.unit : ''} ± ${formatError(r.error ?? NaN)}`,
      difference: r.difference === null ? '—' : formatNumber(r.difference, 4),
      tolerance: formatNumber(r.tolerance, 4), advice: rowAdvice(r),
    })),
  };
}

interface MemberQuantityJson { value: number; error: number; unit: string; errorIsBound?: false }
interface MemberPartJson {
  part: string; unit: string; exactFibres: boolean;
  plastic: Record<string, MemberQuantityJson>;
  torsion?: Record<string, MemberQuantityJson> & { method: Parameters<typeof torsionMethodText>[0]; notes: string[] };
  boltGroup?: Parameters<typeof boltGroupFigures>[0] & { count: number; selectedFrom: number };
  netSections?: (NetSectionDoc | null)[];
}

/**
 * `platewise member --json` on the file, with the page's --no-torsion, --bolts, --net-line and --print-unit: the
 * same call and the same writer; the tables are made from that very document, each figure rounded as the member
 * table rounds it.
 */
function member(key: number, torsion: boolean, bolts: boolean, lineTexts: string[], printUnitText: string): MemberView {
  const h = files.get(key)!;
  const t0 = performance.now();
  // --print-unit and --net-line as the command line checks them; the net area takes the file card's thickness
  const unit = printUnit(printUnitText);
  const netLines = lineTexts.length > 0 ? lineTexts.map((t) => parseNetLine(t, '--net-line')) : undefined;
  const thickness = netLines && h.settings.thickness.trim() !== '' ? h.settings.thickness.trim() : undefined;
  const results = analyzeMemberModels(modelsOf(h), { torsion: torsion ? {} : false, bolts: bolts ? [] : undefined, netLines }, thickness);
  const json = memberJson(results, unit);
  const doc = JSON.parse(json) as { parts: MemberPartJson[]; cautions: string[] };
  const group = (title: string, name: string, q: Record<string, unknown>): QuantityGroupView => ({
    title, group: name,
    rows: Object.entries(q).filter((e): e is [string, MemberQuantityJson] => typeof (e[1] as MemberQuantityJson)?.value === 'number').map(([k, v]) => {
      const t = memberFigureText(v);
      return { key: k, value: v.value, error: v.error, text: t.value, errorText: t.error, unit: v.unit, description: quantityInfo(k)?.description ?? '', bound: v.errorIsBound !== false };
    }),
  });
  const parts = doc.parts.map((p): MemberPartView => ({
    name: p.part, unit: p.unit,
    groups: [group('Plastic and principal moduli', 'plastic', p.plastic), ...(p.torsion ? [group('Torsion, shear centre, warping', 'torsion', p.torsion)] : [])],
    torsionMethod: p.torsion ? torsionMethodText(p.torsion.method) : undefined,
    notes: [...(p.exactFibres ? [] : [NUMERIC_FIBRES]), ...(p.torsion?.notes ?? [])],
    bolts: p.boltGroup ? { heading: boltGroupText(p.boltGroup, p.unit), rows: boltGroupFigures(p.boltGroup, p.unit) } : undefined,
    netSections: p.netSections?.map((n) => {
      if (!n) return null;
      const w = netSectionWords(n, p.unit);
      return { ...w, rows: w.rows.map((r) => ({ ...r, text: formatNumber(r.value), errorText: formatError(r.error) })) };
    }),
  }));
  return { parts, json, cautions: doc.cautions, notBound: NOT_A_BOUND, millis: performance.now() - t0 };
}

const scope = self as unknown as { onmessage: ((ev: MessageEvent<ToWorker>) => void) | null; postMessage(m: unknown): void };

scope.onmessage = async (ev) => {
  const m = ev.data;
  let reply: unknown;
  try {
    switch (m.op) {
      // an address of the worker's own: a blob URL made by the page does not load here (opaque origin of file://)
      case 'css-packages': (self as unknown as { platewiseCssUrl: string }).platewiseCssUrl = URL.createObjectURL(m.code); reply = null; break;
      case 'hold': files.set(m.key, { name: m.name, bytes: new Uint8Array(m.bytes), settings: m.settings }); reply = null; break;
      case 'settings': files.get(m.key)!.settings = m.settings; reply = null; break;
      case 'drop': files.delete(m.key); reply = null; break;
      case 'measure': reply = measure(m.key); break;
      case 'draw': reply = await drawings(m.key); break;
      case 'batch': reply = batch(m.keys); break;
      case 'report': reply = await report(m.key); break;
      case 'member': reply = member(m.key, m.torsion, m.bolts, m.netLines, m.printUnit); break;
      case 'compare': reply = compare(m.key, m.name, new Uint8Array(m.bytes)); break;
      case 'materials': reply = { ...materialList(), palette: { ...PALETTE } }; break;
      case 'materials-file':
        // read as the command line reads --materials-file: the same size limit, decoding and one-line refusals;
        // a refused file leaves the table as it was
        userMaterials = m.bytes === null ? undefined : loadMaterialFile(textOf({ name: m.name, bytes: new Uint8Array(m.bytes) }), m.name);
        reply = materialList();
        break;
    }
    scope.postMessage({ id: m.id, ok: true, value: reply });
  } catch (e) {
    scope.postMessage({ id: m.id, ok: false, message: `platewise: ${failureText(e)}` });
  }
};
