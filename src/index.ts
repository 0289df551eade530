/**
 * platewise as a library: the same functions the CLI calls.
 */
export { InputError, isInputError } from './errors.js';
export type { LengthUnit } from './units.js';
export { LENGTH_UNITS, lengthFactor } from './units.js';
export type { Segment, LineSegment, ArcSegment, SegmentOps } from './geometry/segments.js';
export { OPS, segmentPoint } from './geometry/segments.js';
export type { Loop, Region, Part } from './geometry/part.js';
export { normalizePart, loopSignedArea, partBox, translatePart } from './geometry/part.js';
export { circleLoop, rectangleLoop, slotLoop, polygonLoop, pathLoop } from './geometry/shapes.js';
export { validatePart } from './geometry/validate.js';
export { pointInLoop, nestLoops } from './geometry/nesting.js';
export { transformSegment } from './geometry/transform.js';
export { readPartJson } from './io/partJson.js';
export { readParts } from './io/read.js';
export { readSvg } from './io/svg.js';
export { readGeoJson } from './io/geojson.js';
export { readWkt } from './io/wkt.js';
export { detectFormat } from './io/detect.js';
export { readInputText, writeFileAtomic } from './io/files.js';
export type { Mesh } from './mesh/mesh.js';
export { buildMesh } from './mesh/build.js';
export { refineUniform } from './mesh/refine.js';
export { integrate } from './quadrature/integrate.js';
export { getRule, listRules, SAFE_DEGREES, DEFAULT_DEGREE } from './quadrature/rules.js';
export type { Quantity, SectionQuantities, SectionValues } from './properties/quantities.js';
export { SECTION_QUANTITIES } from './properties/quantities.js';
export { sectionFromMoments } from './properties/section.js';
export type { SectionResult, MeasureOptions } from './accuracy/measure.js';
export { measureSection, preparePart } from './accuracy/measure.js';
export { sectionJson, sectionText } from './io/output.js';
export { GEOMETRY_CAUTION, MASS_CAUTION } from './cautions.js';
// expressions, materials, plates with thickness and density, mass, user integrands
export { compileExpression } from './functions/index.js';
export type { CompiledExpression } from './functions/index.js';
export { findMaterial, listMaterials, loadMaterialFile } from './materials/index.js';
export { readPlateModel, plateModelFromObject } from './io/partJson.js';
export { resolvePlate, measureMass, integrateExpression } from './accuracy/plate.js';
export { integrateAdaptive } from './accuracy/adaptive.js';
// fabrication figures, QA references and verdicts, batches
export { fabricationFigures, minAreaRectangle } from './properties/fabrication.js';
export { boundaryMoments } from './properties/boundary.js';
export { readReference } from './qa/reference.js';
export { judge, compareAll } from './qa/verdict.js';
export { measurePart } from './qa/compute.js';
export { parseManifest, folderJobs } from './batch/manifest.js';
export { runJob } from './batch/task.js';
export { runPool } from './batch/pool.js';
export { parseCsv, parseCsvRecords, formatCsvRow } from './io/csv.js';
// drawings and reports (svg.js and svgdom load only when these run)
export { drawPart, drawSheet } from './report/draw.js';
export { buildReport } from './report/html.js';
