/**
 * platewise building blocks (import from `platewise/parts`): exact segment kinds and parts, readers,
 * mesh, quadrature rules and the integration kernel, section and fabrication properties. The jobs
 * themselves are in the main entry point (src/index.ts).
 */
export type { Segment, LineSegment, ArcSegment, SegmentOps } from './geometry/segments.js';
export { OPS, segmentPoint } from './geometry/segments.js';
export type { Loop, Region, Part } from './geometry/part.js';
export { normalizePart, loopSignedArea, partBox, translatePart } from './geometry/part.js';
export { circleLoop, rectangleLoop, slotLoop, polygonLoop, pathLoop } from './geometry/shapes.js';
export { validatePart } from './geometry/validate.js';
export { pointInLoop, nestLoops } from './geometry/nesting.js';
export { transformSegment } from './geometry/transform.js';
export { readPartJson, readPlateModel, plateModelFromObject } from './read/partJson.js';
export { readParts } from './read/read.js';
export { readSvg } from './read/svg.js';
export { readGeoJson } from './read/geojson.js';
export { readWkt } from './read/wkt.js';
export { detectFormat } from './read/detect.js';
export { readInputText, writeFileAtomic } from './base/files.js';
export { LENGTH_UNITS, lengthFactor } from './base/units.js';
export type { Mesh } from './mesh/mesh.js';
export { buildMesh } from './mesh/build.js';
export { refineUniform } from './mesh/refine.js';
export { integrate } from './quadrature/integrate.js';
export { getRule, listRules, SAFE_DEGREES, DEFAULT_DEGREE } from './quadrature/rules.js';
export type { SectionQuantities, SectionValues } from './properties/quantities.js';
export { SECTION_QUANTITIES } from './properties/quantities.js';
export { sectionFromMoments } from './properties/section.js';
export { boundaryMoments } from './properties/boundary.js';
export { fabricationFigures, minAreaRectangle } from './properties/fabrication.js';
export type { MeasureOptions } from './analysis/measure.js';
export { measureSection, preparePart } from './analysis/measure.js';
export { measureMass } from './analysis/plate.js';
export { integrateAdaptive } from './analysis/adaptive.js';
export { resolveLayers, singleLayerModel } from './model/plate.js';
export { parseThickness, parseDensity, parseLengthUnit } from './model/settings.js';
export { compileExpression } from './expr/index.js';
export type { CompiledExpression } from './expr/index.js';
export { parseCsv, parseCsvRecords, formatCsvRow, RFC_4180, SPREADSHEET_LOCALE } from './base/csv.js';
export type { CsvDialect } from './base/csv.js';
export { sectionJson, sectionText } from './output/text.js';
