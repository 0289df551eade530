/**
 * Area properties with an error estimate for every value.
 *
 * Every quantity is computed on the mesh and on its uniform refinement (curved edges split on the curve);
 * the refined value is reported, and the estimate is |refined − coarse| for that quantity itself (so the
 * estimate is propagated through each derived quantity), plus a round-off floor. Because the coarse
 * result's error bounds the refined one's for a converging method, the estimate errs on the safe side.
 */
import { OptionError } from '../base/errors.js';
import { type Part, allLoops, normalizePart, partBox } from '../geometry/part.js';
import { ops } from '../geometry/segments.js';
import { validatePart } from '../geometry/validate.js';
import { type MeshOptions, buildMesh, localOrigin } from '../mesh/build.js';
import { boundaryIntegrals } from '../properties/boundary.js';
import type { Triangulator } from '../mesh/triangulate.js';
import { type Mesh, countCurved, triangleCount } from '../mesh/mesh.js';
import { refineUniform, selectTriangles, splitByCurvature } from '../mesh/refine.js';
import { integrate } from '../quadrature/integrate.js';
import { DEFAULT_DEGREE, getRule } from '../quadrature/rules.js';
import { type Quantity, SECTION_QUANTITIES, type SectionKey, type SectionQuantities, type SectionValues } from '../properties/quantities.js';
import { type ExactFigures, REPRESENTATION_ULPS, propagateDerived, roundoffFloor, sectionFromMoments } from '../properties/section.js';
import type { StopReason } from '../quadrature/stop.js';

/** Triangles the refinement levels of one section may build (about 2 GB of typed arrays and maps). */
export const MAX_REFINED_TRIANGLES = 20_000_000;

export interface MeasureOptions extends MeshOptions {
  /** Dunavant rule degree for curved triangles (1–20). */
  degree?: number;
  /** Number of uniform refinements after the base mesh (≥ 1; the last two levels give the estimate). */
  levels?: number;
  /**
   * 'auto' (default): the exact boundary integrals (Green's theorem, every segment kind); 'mesh': always
   * the mesh. More than one refinement level also forces the mesh.
   */
  method?: 'auto' | 'mesh';
}

export interface LevelResult {
  level: number;
  triangles: number;
  values: SectionValues;
}

export interface MethodInfo {
  degree: number;
  rulePoints: number;
  /** How the numbers were made: the mesh with refinement, or the exact boundary integrals. */
  path: 'mesh' | 'boundary';
  estimator: 'uniform refinement' | 'exact boundary formula';
  /** Why the values stopped where they are: 'exact' (boundary formula) or 'levels' (refinement levels). */
  stopped: Extract<StopReason, 'exact' | 'levels'>;
  /** Triangles of the base mesh and of the finest mesh used. */
  baseTriangles: number;
  triangles: number;
  curvedTriangles: number;
  vertices: number;
  refinementLevels: number;
  chordSplits: number;
  triangulation: Triangulator;
  /** Smallest curved-map Jacobian over the straight triangle's, over all quadrature points used. */
  minJacobianRatio: number;
  localOrigin: [number, number];
}

/** Section warnings as facts; src/output words them. */
export type SectionWarning =
  | { code: 'principal-axes-undefined' }
  | { code: 'distorted-curved-triangle'; minJacobianRatio: number };

export interface SectionResult {
  part: string;
  units: Part['units'];
  quantities: SectionQuantities;
  method: MethodInfo;
  warnings: SectionWarning[];
  /** Every level's values, coarse to fine (for convergence plots). */
  levels: LevelResult[];
  /** The validated, normalised part and its base mesh (for drawings and further integration). */
  /**
   * The validated, normalised part and its base mesh (built on first use on the boundary path), and on the
   * boundary path its raw moments about method.localOrigin with their round-off bound and the boundary's
   * representation allowance Σδ·L (for mass properties without a mesh).
   */
  geometry: { part: Part; mesh: Mesh; boundary?: { moments: Float64Array; roundoff: Float64Array; shiftLength: number } };
}

/** Prepare a part read from any format: validate and orient loops. */
export function preparePart(part: Part): Part {
  validatePart(part);
  return normalizePart(part);
}

/**
 * Perimeter, bounding box and the representation allowance (src/properties/section.ts): each segment is
 * taken to lie within δ_s = REPRESENTATION_ULPS·ε·m_s of the segment the input describes, where m_s is the
 * largest coordinate magnitude its box reaches plus its size (an arc's centre may lie a radius away).
 */
export function exactFigures(part: Part): ExactFigures {
  let perimeter = 0, shiftLength = 0, maxShift = 0, shiftPerimeter = 0;
  for (const l of allLoops(part)) {
    for (const s of l.segments) {
      const o = ops(s);
      const len = o.length(s);
      const [x0, y0, x1, y1] = o.bbox(s);
      const mag = Math.max(Math.abs(x0), Math.abs(x1), Math.abs(y0), Math.abs(y1)) + Math.max(x1 - x0, y1 - y0);
      const d = REPRESENTATION_ULPS * Number.EPSILON * mag;
      perimeter += len;
      shiftLength += d * len;
      maxShift = Math.max(maxShift, d);
      shiftPerimeter += d * (2 + (o.straight ? 0 : o.turning(s, 0, 1)));
    }
  }
  return { perimeter, box: partBox(part), representation: { shiftLength, maxShift, perimeter: shiftPerimeter } };
}

/** principalAngle is undefined when I1 and I2 are equal within their estimates. */
function checkPrincipalAngle(q: SectionQuantities, warnings: SectionWarning[]): void {
  if (!(q.I1.value - q.I2.value > q.I1.error + q.I2.error)) {
    q.principalAngle = { value: 0, error: 90 };
    warnings.push({ code: 'principal-axes-undefined' });
  } else if (q.principalAngle.error > 90) {
    q.principalAngle.error = 90;
  }
}

/**
 * Polynomial integrands (the section's moments), any segment kinds: the boundary integrals are exact, so
 * each estimate is the round-off allowance (the segments' own bound and the usual floor) plus the
 * representation allowance. The mesh is built only if someone asks for it (drawings, non-polynomial mass).
 */
function boundaryResult(input: Part, moments: Float64Array, roundoff: Float64Array, origin: [number, number], exact: ExactFigures, degree: number, options: MeasureOptions): SectionResult {
  const values = sectionFromMoments(moments, origin, exact);
  const floor = roundoffFloor(moments, origin, values, exact, roundoff);
  propagateDerived(values, floor);
  const quantities = {} as SectionQuantities;
  for (const info of SECTION_QUANTITIES) {
    const k = info.key as SectionKey;
    quantities[k] = { value: values[k], error: floor[k] };
  }
  const warnings: SectionWarning[] = [];
  checkPrincipalAngle(quantities, warnings);
  let vertices = 0;
  for (const r of input.regions) for (const l of [r.outer, ...r.holes]) vertices += l.segments.length;
  let mesh: Mesh | undefined;
  let oriented: Part | undefined;
  return {
    part: input.name,
    units: input.units,
    quantities,
    method: {
      degree,
      rulePoints: getRule(degree).n,
      path: 'boundary',
      estimator: 'exact boundary formula',
      stopped: 'exact',
      baseTriangles: 0,
      triangles: 0,
      curvedTriangles: 0,
      vertices,
      refinementLevels: 0,
      chordSplits: 0,
      triangulation: options.triangulation ?? 'delaunator',
      minJacobianRatio: 1,
      localOrigin: origin,
    },
    warnings,
    levels: [{ level: 0, triangles: 0, values }],
    geometry: {
      get part() { return (oriented ??= normalizePart(input)); },
      get mesh() { return (mesh ??= buildMesh(this.part, options).mesh); },
      boundary: { moments, roundoff, shiftLength: exact.representation?.shiftLength ?? 0 },
    },
  };
}

/** Rule degrees below this one also estimate with a companion rule (COMPANION_DEGREE) on the same meshes. */
const COMPANION_BELOW = 3;
const COMPANION_DEGREE = 4;

function allTriangles(m: Mesh): Uint32Array {
  const n = m.count;
  const out = new Uint32Array(n);
  for (let i = 0; i < n; i++) out[i] = i;
  return out;
}

function addSums(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let k = 0; k < a.length; k++) out[k] = a[k] + b[k];
  return out;
}

function angleDiff(a: number, b: number): number {
  let d = Math.abs(a - b) % 180;
  if (d > 90) d = 180 - d;
  return d;
}

export function measureSection(input: Part, options: MeasureOptions = {}): SectionResult {
  const degree = options.degree ?? DEFAULT_DEGREE;
  const rule = getRule(degree);
  const levelsWanted = Math.max(1, Math.floor(options.levels ?? 1));
  validatePart(input);
  const exact = exactFigures(input);
  if ((options.method ?? 'auto') === 'auto' && levelsWanted === 1) {
    // the boundary formula copes with either loop direction, so the (large) part is not copied to reorient it
    // every segment kind has exact boundary moments, so any part takes the boundary path here
    const origin = localOrigin(input);
    const { moments, roundoff } = boundaryIntegrals(input, origin);
    return boundaryResult(input, moments, roundoff, origin, exact, degree, options);
  }
  const part = normalizePart(input);
  const { mesh, chordSplits } = buildMesh(part, options);

  // Straight triangles integrate the moment integrands (polynomials of degree 2) exactly with the degree-2
  // rule, so refining them cannot change their sum: they are integrated once, and only the curved
  // triangles are refined level by level. The sums equal those of a uniform refinement of the whole mesh.
  const levels: LevelResult[] = [];
  // (with a degree-1 rule nothing is exact for second moments, so every triangle is refined)
  const { curved, straight } = degree >= 2 ? splitByCurvature(mesh) : { curved: allTriangles(mesh), straight: new Uint32Array(0) };
  const straightSums = integrate(mesh, { degree, only: straight }).sums;
  // the refined meshes hold straight + curved·4^L triangles: refuse before building what cannot fit
  const planned = straight.length + curved.length * 4 ** levelsWanted;
  if (planned > MAX_REFINED_TRIANGLES) {
    throw new OptionError('levels', `${levelsWanted} refinement levels would make ${planned.toExponential(2)} triangles from this part's ${curved.length} curved ones, more than ${MAX_REFINED_TRIANGLES.toExponential(0)}; use fewer levels`);
  }
  let m = selectTriangles(mesh, curved);
  let minJac = Infinity;
  let lastMoments: Float64Array = new Float64Array(6);
  // Degrees 1 and 2 converge slowly and their two-level difference is not an upper bound on coarse meshes
  // (a quarter disc's centroid at degree 1: true error 4× the difference; Ix of a plate bounded by
  // elliptical arcs at degree 2, one level: 1.7×), so their estimate also takes a companion rule of
  // higher degree on the same two levels (see below).
  const companion: SectionValues[] = [];
  for (let L = 0; L <= levelsWanted; L++) {
    if (L > 0) m = refineUniform(m);
    const r = integrate(m, { degree });
    minJac = Math.min(minJac, r.minJacobianRatio);
    const sums = addSums(straightSums, r.sums);
    lastMoments = sums;
    levels.push({ level: L, triangles: straight.length + triangleCount(m), values: sectionFromMoments(sums, mesh.origin, exact) });
    if (degree < COMPANION_BELOW && L >= levelsWanted - 1) {
      companion.push(sectionFromMoments(addSums(straightSums, integrate(m, { degree: COMPANION_DEGREE }).sums), mesh.origin, exact));
    }
  }
  const fine = levels[levels.length - 1].values;
  const coarse = levels[levels.length - 2].values;
  const floor = roundoffFloor(lastMoments, mesh.origin, fine, exact);
  const errors = {} as Record<SectionKey, number>;
  const dist = (k: SectionKey, a: SectionValues, b: SectionValues) => (k === 'principalAngle' ? angleDiff(a[k], b[k]) : Math.abs(a[k] - b[k]));
  for (const info of SECTION_QUANTITIES) {
    const k = info.key as SectionKey;
    let diff = dist(k, fine, coarse);
    if (companion.length === 2) {
      // |Q − v| ≤ |v − w| + |w − Q| for the companion's value w on the finest mesh, whose own error is
      // estimated by its two-level difference (honest at degree ≥ 2 in the sweep of tests/analysis)
      diff = Math.max(diff, dist(k, fine, companion[1]) + dist(k, companion[1], companion[0]));
    }
    errors[k] = diff + floor[k];
  }
  propagateDerived(fine, errors);
  const quantities = {} as SectionQuantities;
  for (const info of SECTION_QUANTITIES) {
    const k = info.key as SectionKey;
    quantities[k] = { value: fine[k], error: errors[k] } satisfies Quantity;
  }
  const warnings: SectionWarning[] = [];
  checkPrincipalAngle(quantities, warnings);
  if (!(minJac > 0.01)) warnings.push({ code: 'distorted-curved-triangle', minJacobianRatio: minJac });

  return {
    part: part.name,
    units: part.units,
    quantities,
    method: {
      degree,
      rulePoints: rule.n,
      path: 'mesh',
      estimator: 'uniform refinement',
      stopped: 'levels',
      baseTriangles: triangleCount(mesh),
      triangles: levels[levels.length - 1].triangles,
      curvedTriangles: countCurved(mesh),
      vertices: mesh.coords.length / 2,
      refinementLevels: levelsWanted,
      chordSplits,
      triangulation: options.triangulation ?? 'delaunator',
      minJacobianRatio: minJac,
      localOrigin: mesh.origin,
    },
    warnings,
    levels,
    geometry: { part, mesh },
  };
}
