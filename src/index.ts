/**
 * platewise as a library: the same functions the CLI calls.
 */
export { InputError, isInputError } from './base/errors.js';
export type { LengthUnit } from './base/units.js';
export { LENGTH_UNITS, lengthFactor } from './base/units.js';
export type { Segment, LineSegment, ArcSegment, SegmentOps } from './geometry/segments.js';
export { OPS, segmentPoint } from './geometry/segments.js';
export type { Loop, Region, Part } from './geometry/part.js';
export { normalizePart, loopSignedArea, partBox, translatePart } from './geometry/part.js';
export { circleLoop, rectangleLoop, slotLoop, polygonLoop, pathLoop } from './geometry/shapes.js';
export { validatePart } from './geometry/validate.js';
export { pointInLoop, nestLoops } from './geometry/nesting.js';
export { transformSegment } from './geometry/transform.js';
export { readPartJson } from './read/partJson.js';
export { readParts } from './read/read.js';
export { readSvg } from './read/svg.js';
export { readGeoJson } from './read/geojson.js';
export { readWkt } from './read/wkt.js';
export { detectFormat } from './read/detect.js';
export { readInputText, writeFileAtomic } from './base/files.js';
export type { Mesh } from './mesh/mesh.js';
export { buildMesh } from './mesh/build.js';
export { refineUniform } from './mesh/refine.js';
export { integrate } from './quadrature/integrate.js';
export { getRule, listRules, SAFE_DEGREES, DEFAULT_DEGREE } from './quadrature/rules.js';
export type { Quantity, SectionQuantities, SectionValues } from './properties/quantities.js';
export { SECTION_QUANTITIES } from './properties/quantities.js';
export { sectionFromMoments } from './properties/section.js';
export type { SectionResult, MeasureOptions } from './analysis/measure.js';
export { measureSection, preparePart } from './analysis/measure.js';
export { sectionJson, sectionText } from './output/text.js';
export { GEOMETRY_CAUTION, MASS_CAUTION } from './output/cautions.js';
// expressions, materials, plates with thickness and density, mass, user integrands
export { compileExpression } from './expr/index.js';
export type { CompiledExpression } from './expr/index.js';
export { findMaterial, listMaterials, loadMaterialFile } from './model/index.js';
export { readPlateModel, plateModelFromObject } from './read/partJson.js';
export { resolvePlate, measureMass, integrateExpression } from './analysis/plate.js';
export { integrateAdaptive } from './analysis/adaptive.js';
// fabrication figures, QA references and verdicts, batches
export { fabricationFigures, minAreaRectangle } from './properties/fabrication.js';
export { boundaryMoments } from './properties/boundary.js';
export { readReference } from './qa/reference.js';
export { judge, compareAll } from './qa/verdict.js';
export { measurePart } from './qa/compute.js';
export { parseManifest, folderJobs } from './batch/manifest.js';
export { runJob } from './batch/task.js';
export { runPool } from './batch/pool.js';
export { parseCsv, parseCsvRecords, formatCsvRow } from './base/csv.js';
// drawings and reports (svg.js and svgdom load only when these run)
export { drawPart, drawSheet } from './output/draw.js';
export { buildReport } from './output/html.js';
