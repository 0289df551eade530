/**
 * platewise as a library: the jobs, the same functions the command line calls.
 *
 *   measure    readModels → analyzePart → reportsText / reportsJson
 *   mass       analyzePart with thickness, density or material (in the file or as `given` settings)
 *   integrate  integrateExpression
 *   compare    readReference → compareAll on a report's quantities
 *   batch      parseManifest / folderJobs → runPool (or runJob in-process) → InJobOrder → batchLine
 *              (line totals; priceLine under parseRates) → the writers
 *   draw       drawPart / drawSheet (the drawing stack loads only when called)
 *   report     buildReport
 *
 * The building blocks (geometry, readers, mesh, quadrature, properties) are on the subpath
 * `platewise/parts` (src/parts.ts).
 */
export { InputError, OptionError, MethodError, EXIT, isInputError, isMethodError } from './base/errors.js';
export type { LengthUnit } from './base/units.js';
export type { Quantity, QuantityKey, QuantityInfo } from './properties/quantities.js';
export { QUANTITIES, quantityInfo } from './properties/quantities.js';
export type { PlateModel, PlateSettings, UnitSource } from './model/plate.js';
export type { GivenSetting } from './model/settings.js';
export { findMaterial, listMaterials, loadMaterialFile } from './model/index.js';
export type { ReadOptions } from './read/read.js';
export { readModels } from './read/models.js';
// measure and mass
export type { AnalysisRequest, AnalysisWarning, PartReport } from './analysis/analyze.js';
export { analyzePart } from './analysis/analyze.js';
export type { SectionResult } from './analysis/measure.js';
export type { MassResult, ExpressionResult } from './analysis/plate.js';
export { reportsJson, reportsText } from './output/partReport.js';
export { warningText } from './output/words.js';
export { GEOMETRY_CAUTION, MASS_CAUTION } from './output/cautions.js';
// integrate
export { integrateExpression } from './analysis/plate.js';
// compare
export { readReference } from './qa/reference.js';
export { judge, compareAll } from './qa/verdict.js';
export { explainMissing, partSize } from './qa/compute.js';
// batch
export { parseManifest, folderJobs } from './batch/manifest.js';
export { runJob } from './batch/task.js';
export type { BatchRow, JobSettings } from './batch/task.js';
export { runPool } from './batch/pool.js';
export { InJobOrder } from './batch/order.js';
export { batchLine, lineFigures, priceLine } from './batch/lines.js';
export type { BatchLine, LineCost, LineFigures, NoCost } from './batch/lines.js';
export { parseRates, findRate } from './batch/rates.js';
export type { ShopRate, ShopRates } from './batch/rates.js';
export { SummaryBuilder, batchCsvHeader, batchCsvRow, batchJsonLine, summaryText, COST_ASSUMPTIONS } from './output/batchRows.js';
export type { BatchSummary, GroupTotals, CostTotals } from './output/batchRows.js';
// drawings and reports
export { drawPart, drawSheet } from './output/draw.js';
export { buildReport } from './output/html.js';
