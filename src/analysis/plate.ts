/**
 * Plates with thickness and density: resolve each layer's thickness and density (file, command-line flags,
 * materials), integrate mass properties over every layer with error estimates (optionally adaptive to a
 * tolerance), and integrate a user expression with its resultant and point of action.
 *
 * Thickness and density are checked at every quadrature point that is evaluated: a value that is not
 * positive and finite stops the run with an InputError naming where the field was given and the part
 * coordinates of the first such point.
 */
import { InputError, MethodError } from '../base/errors.js';
import type { Mesh } from '../mesh/mesh.js';
import { type CompiledExpression, type ExprNode, compileExpression, polynomialDegree } from '../expr/index.js';
import { kinkLines, rangeOnBox, roundingOnBox, smoothOnBox, type KinkLine } from '../expr/smooth.js';
import { type Part, partBox } from '../geometry/part.js';
import { type DensityOrigin, type ResolvedLayer, fieldError } from '../model/plate.js';
import { type MeshOptions, buildMesh, integrandChordLength, joinMeshes, localOrigin } from '../mesh/build.js';
import { MASS_KEYS, MASS_SUMS, type MassKey, type MassValues, massFromSums, propagateErrors, shiftMassSums } from '../properties/mass.js';
import type { Quantity } from '../properties/quantities.js';
import { DEFAULT_DEGREE } from '../quadrature/rules.js';
import type { LengthUnit } from '../base/units.js';
import { type AdaptiveResult, integrateAdaptive } from './adaptive.js';
import { type StopReason, combineStops } from '../quadrature/stop.js';
import { exactFigures, preparePart } from './measure.js';
import { MAX_BOUNDARY_DEGREE, boundCoordinate, boundMul, boundaryPolynomialIntegrals } from '../properties/boundaryPolynomial.js';
import { checkPoles } from './singular.js';
import { cutAlongLines } from './kinks.js';
import { type LocalPiece, localPiece } from './localize.js';

export interface IntegrationOptions extends MeshOptions {
  degree?: number;
  /** The layers' parts are validated and oriented already (the analysis entry point does it once). */
  prepared?: boolean;
  /** The mesh to use for layer i, when the caller has one (built at most once per run). */
  meshOf?: (layer: number) => Mesh;
  /**
   * Relative tolerance of adaptive refinement. Undefined: the default — mass properties take the two levels
   * (mesh and its uniform refinement), `integrateExpression` refines a non-polynomial integrand to
   * DEFAULT_INTEGRAL_TOLERANCE; null: the two levels only, never refined.
   */
  tolerance?: number | null;
  maxTriangles?: number;
  maxMillis?: number;
  /**
   * 'auto' (default): a polynomial integrand is integrated exactly from the boundary, anything else on the
   * mesh; 'mesh': always the mesh.
   */
  method?: 'auto' | 'mesh';
}

export interface IntegrationMethod {
  degree: number;
  rulePoints: number;
  /** 'exact boundary integrals': polynomial integrands, no mesh (src/analysis/boundaryMass.ts, integrateExpression). */
  estimator: 'uniform refinement' | 'adaptive refinement' | 'exact boundary integrals';
  /** 'levels' without a tolerance (mesh and one uniform refinement); otherwise why refinement stopped. */
  stopped: StopReason;
  tolerance: number | null;
  baseTriangles: number;
  triangles: number;
  rounds: number;
  points: number;
  millis: number;
  minJacobianRatio: number;
  /** False when smoothness was not proved on every triangle: the ± of every value is then not a bound. */
  errorIsBound: boolean;
  /** Triangles (leaves) on which the integrand was not proved smooth. */
  unverifiedTriangles: number;
  /** Base triangles counted 0 within a proved bound of their contribution, never evaluated (src/analysis/adaptive.ts). */
  boundedTriangles: number;
  /**
   * `integrate` only: the box the mesh was limited to, [x0, y0, x1, y1]; outside it the integrand was bounded
   * by interval arithmetic, and that bound is in the estimate (src/analysis/localize.ts).
   */
  meshedBox?: [number, number, number, number];
  /** Straight kink or jump lines of the integrand the part was cut along (0: none, or cutting failed). */
  kinkCuts: number;
}

function methodOf(results: AdaptiveResult[], tolerance: number | undefined, kinkCuts: number[]): IntegrationMethod {
  const worst = combineStops(results.map((r) => r.stopped));
  return {
    degree: results[0].degree,
    rulePoints: results[0].rulePoints,
    estimator: tolerance === undefined ? 'uniform refinement' : 'adaptive refinement',
    stopped: worst,
    tolerance: tolerance ?? null,
    baseTriangles: results.reduce((n, r) => n + r.baseTriangles, 0),
    triangles: results.reduce((n, r) => n + r.triangles, 0),
    rounds: Math.max(...results.map((r) => r.rounds)),
    points: results.reduce((n, r) => n + r.points, 0),
    millis: results.reduce((n, r) => n + r.millis, 0),
    minJacobianRatio: Math.min(...results.map((r) => r.minJacobianRatio)),
    errorIsBound: results.every((r) => r.errorIsBound),
    unverifiedTriangles: results.reduce((n, r) => n + r.unverifiedLeaves, 0),
    boundedTriangles: results.reduce((n, r) => n + r.boundedLeaves, 0),
    kinkCuts: kinkCuts.reduce((a, b) => a + b, 0),
  };
}

/**
 * How to mesh a part for integrands given as expression trees (a constant field gives no tree): the straight
 * kink and jump lines of all trees (src/expr/smooth.ts) cut the part into pieces meshed separately and joined
 * (src/analysis/kinks.ts), long straight edges are split when an integrand is not a polynomial
 * (integrandChordLength), and `smoothOn` proves smoothness box by box for the adaptive stopping rule.
 */
export interface IntegrandMesh {
  mesh: Mesh;
  smoothOn: (x0: number, y0: number, x1: number, y1: number) => boolean;
  /** Lines cut along. */
  cuts: number;
}

export function meshForIntegrands(part: Part, trees: readonly ExprNode[], opts: MeshOptions): IntegrandMesh {
  const b = partBox(part);
  const polynomial = trees.every((t) => polynomialDegree(t) !== null);
  const lines: KinkLine[] = [];
  let cuttable = true;
  for (const t of trees) {
    const l = kinkLines(t, b);
    if (l === null) cuttable = false; else lines.push(...l);
  }
  const origin = localOrigin(part);
  const meshOpts: MeshOptions = { ...opts, origin, maxStraight: polynomial ? undefined : integrandChordLength(part, opts) };
  let mesh: Mesh | null = null, pieces = 1;
  if (cuttable && lines.length > 0) {
    // a piece the mesher cannot take (a line tangent to a hole leaves a pinch point), or a cut the booleans
    // refuse, drops the cut: the whole part is integrated and the triangles across the lines stay unverified
    try {
      const cut = cutAlongLines(part, lines);
      if (cut !== null) { mesh = joinMeshes(cut.map((p) => buildMesh(preparePart(p), meshOpts).mesh)); pieces = cut.length; }
    } catch (e) {
      if (!(e instanceof InputError || e instanceof MethodError)) throw e;
    }
    if (mesh === null) cuttable = false;
  }
  mesh ??= buildMesh(part, meshOpts).mesh;
  const linearCut = cuttable;
  return {
    mesh,
    smoothOn: (x0, y0, x1, y1) => trees.every((t) => smoothOnBox(t, [x0, y0, x1, y1], linearCut)),
    cuts: cuttable && pieces > 1 ? lines.length : 0,
  };
}

/** The quantities with the fact that their ± is not a bound, when it is not. */
function markBound<K extends string>(q: Record<K, Quantity>, bound: boolean): Record<K, Quantity> {
  if (bound) return q;
  for (const k of Object.keys(q) as K[]) q[k] = { ...q[k], errorIsBound: false };
  return q;
}

export interface LayerMass {
  name: string;
  z0: number;
  densityFrom: DensityOrigin;
  material?: string;
  thickness: string;
  quantities: Record<MassKey, Quantity>;
}

export interface MassResult {
  part: string;
  units: LengthUnit;
  /** Whole part (all layers). SI units: kg, N, kg·m²; centres in the part's length unit. */
  quantities: Record<MassKey, Quantity>;
  layers: LayerMass[];
  method: IntegrationMethod;
}

const toQuantities = (values: MassValues, errors: MassValues): Record<MassKey, Quantity> => {
  const q = {} as Record<MassKey, Quantity>;
  for (const k of MASS_KEYS) q[k] = { value: values[k], error: errors[k] };
  return q;
};

/** Width and height of the mesh's vertex box. */
function boxSize(mesh: { coords: ArrayLike<number> }): [number, number] {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (let i = 0; i < mesh.coords.length; i += 2) {
    const x = mesh.coords[i], y = mesh.coords[i + 1];
    if (x < x0) x0 = x; if (x > x1) x1 = x; if (y < y0) y0 = y; if (y > y1) y1 = y;
  }
  return [x1 - x0, y1 - y0];
}

/** Integrate one layer's raw mass sums (about its mesh origin). */
function layerSums(layer: ResolvedLayer, index: number, opts: IntegrationOptions): { result: AdaptiveResult; origin: [number, number]; cuts: number } {
  const T = layer.thickness, R = layer.density, z0 = layer.z0;
  // fields given as expressions: their trees decide smoothness and the mesh shape; constant fields are smooth
  const trees = [T, R].filter((fld) => fld.constant === undefined).map((fld) => compileExpression(fld.text, fld.where).tree);
  const plain = trees.every((t) => polynomialDegree(t) !== null);
  let mesh: Mesh, cuts = 0;
  let smoothOn: (x0: number, y0: number, x1: number, y1: number) => boolean = () => true;
  if (plain) {
    // polynomial fields: smooth everywhere, and the shared mesh serves
    mesh = opts.meshOf ? opts.meshOf(index) : buildMesh(opts.prepared ? layer.part : preparePart(layer.part), opts).mesh;
  } else {
    const im = meshForIntegrands(opts.prepared ? layer.part : preparePart(layer.part), trees, opts);
    mesh = im.mesh; smoothOn = im.smoothOn; cuts = im.cuts;
  }
  const f = (x: number, y: number, lx: number, ly: number, out: Float64Array) => {
    const t = T.evaluate(x, y);
    if (!(t > 0) || !Number.isFinite(t)) throw fieldError(T, t, x, y);
    const rho = R.evaluate(x, y);
    if (!(rho > 0) || !Number.isFinite(rho)) throw fieldError(R, rho, x, y);
    const a = rho * t;
    const zm = rho * (z0 * t + 0.5 * t * t);
    const top = z0 + t;
    out[0] = a; out[1] = a * lx; out[2] = a * ly;
    out[3] = a * lx * lx; out[4] = a * lx * ly; out[5] = a * ly * ly;
    out[6] = zm; out[7] = zm * lx; out[8] = zm * ly;
    out[9] = rho * (top * top * top - z0 * z0 * z0) / 3;
  };
  const size = Math.hypot(...boxSize(mesh));
  const result = integrateAdaptive(mesh, MASS_SUMS, f, {
    degree: opts.degree ?? DEFAULT_DEGREE, tolerance: opts.tolerance ?? undefined,
    // first moments and products: to within tolerance × (mass or second moment) × size, like the centre
    absTolerance: (s, tol) => {
      const e1 = tol * Math.abs(s[0]) * size, e6 = tol * Math.abs(s[6]) * size;
      const e2 = tol * Math.sqrt(Math.abs(s[3] * s[5]));
      return [undefined, e1, e1, undefined, e2, undefined, undefined, e6, e6, undefined];
    },
    maxTriangles: opts.maxTriangles, maxMillis: opts.maxMillis, smoothOn,
  });
  return { result, origin: mesh.origin, cuts };
}

/** Mass properties of every layer and of the whole stack, each value with an error estimate. */
export function measureMass(name: string, units: LengthUnit, layers: ResolvedLayer[], opts: IntegrationOptions = {}): MassResult {
  if (layers.length === 0) throw new InputError('layers', 'expected at least one layer');
  const runs = layers.map((l, i) => layerSums(l, i, opts));
  const ref = runs[0].origin;
  const total = { fine: new Float64Array(MASS_SUMS), coarse: new Float64Array(MASS_SUMS), estimate: new Float64Array(MASS_SUMS), scale: new Float64Array(MASS_SUMS) };
  const out: LayerMass[] = [];
  runs.forEach(({ result, origin }, i) => {
    const derive = (s: Float64Array) => massFromSums(s, origin, units);
    // the estimate bounds the fine value's error by itself (src/analysis/adaptive.ts); the coarse value's
    // difference would only add the coarse value's error (10³–10⁵ times larger on smooth integrands)
    const { values, errors } = propagateErrors(derive, result.fine, result.fine, result.estimate, result.scale);
    const l = layers[i];
    out.push({ name: l.name, z0: l.z0, densityFrom: l.densityFrom, material: l.material, thickness: l.thickness.text, quantities: markBound(toQuantities(values, errors), result.errorIsBound) });
    const dx = origin[0] - ref[0], dy = origin[1] - ref[1];
    const f = shiftMassSums(result.fine, dx, dy), c = shiftMassSums(result.coarse, dx, dy);
    // estimates and scales shift with absolute values (bounds, not signed sums)
    const e = shiftMassSums(result.estimate, Math.abs(dx), Math.abs(dy)), s = shiftMassSums(result.scale, Math.abs(dx), Math.abs(dy));
    for (let k = 0; k < MASS_SUMS; k++) {
      total.fine[k] += f[k]; total.coarse[k] += c[k]; total.estimate[k] += e[k]; total.scale[k] += s[k];
    }
  });
  const { values, errors } = propagateErrors((s) => massFromSums(s, ref, units), total.fine, total.fine, total.estimate, total.scale);
  const method = methodOf(runs.map((r) => r.result), opts.tolerance ?? undefined, runs.map((r) => r.cuts));
  return { part: name, units, quantities: markBound(toQuantities(values, errors), method.errorIsBound), layers: out, method };
}

/** Warnings of a user integral, as facts (src/output/words.ts words them). */
export type IntegralWarning =
  | { code: 'integral-indistinguishable-from-zero'; value: number; estimate: number }
  | { code: 'integral-estimate-large'; value: number; estimate: number };

export interface ExpressionResult {
  part: string;
  units: LengthUnit;
  expression: string;
  /** ∫ f dA in (unit of f)·(length unit)². */
  integral: Quantity;
  /** Point of action of the resultant (part coordinates), or null when ∫ f dA is zero within its estimate. */
  pointX: Quantity | null;
  pointY: Quantity | null;
  /** First moments ∫ f·x dA and ∫ f·y dA about the part's origin. */
  momentX: Quantity;
  momentY: Quantity;
  method: IntegrationMethod;
  warnings: IntegralWarning[];
}

/**
 * Relative tolerance of `integrate` for an integrand that is not a polynomial, when none is asked for: the
 * mesh is refined adaptively until the estimate is below it (polynomials are exact from the boundary).
 */
export const DEFAULT_INTEGRAL_TOLERANCE = 1e-12;

/**
 * Integrate the expression `text` over a part: ∫ f dA, the first moments and the point of action of the
 * resultant. `where` names the expression's source in messages ("--expr").
 */
export function integrateExpression(input: Part, text: string, opts: IntegrationOptions & { where?: string } = {}): ExpressionResult {
  const where = opts.where ?? 'expression';
  const expr = compileExpression(text, where);
  const ev = expr.evaluate;
  const part = preparePart(input);
  if ((opts.method ?? 'auto') === 'auto') {
    const exact = boundaryExpression(part, text, expr);
    if (exact) return exact;
  }
  const tree = expr.tree;
  const tolerance = opts.tolerance === null ? undefined : opts.tolerance ?? (expr.polynomialDegree === null ? DEFAULT_INTEGRAL_TOLERANCE : undefined);
  const f = (x: number, y: number, lx: number, ly: number, out: Float64Array) => {
    const v = ev(x, y);
    if (!Number.isFinite(v)) throw new InputError(where, `is ${v} at (${x.toFixed(1)}, ${y.toFixed(1)}); expected a finite value everywhere on the part`);
    out[0] = v; out[1] = v * lx; out[2] = v * ly;
  };
  const [bx0, by0, bx1, by1] = partBox(part);
  const size = Math.hypot(bx1 - bx0, by1 - by0);
  /** Integrate over `on` (the part, or its piece where f matters with the bound of the rest), or null to retry whole. */
  const attempt = (on: Part, local: LocalPiece | null) => {
    const im = expr.isConstant ? null : meshForIntegrands(on, [tree], opts);
    const mesh = im ? im.mesh : buildMesh(on, opts).mesh;
    if (!expr.isConstant) checkPoles(mesh, ev, where);
    const [ox, oy] = mesh.origin;
    const outside = local ? local.outside(ox, oy) : undefined;
    const r = integrateAdaptive(mesh, 3, f, {
      degree: opts.degree ?? DEFAULT_DEGREE, tolerance,
      // first moments: the point of action to within tolerance × part size
      absTolerance: (s, tol) => [undefined, tol * Math.abs(s[0]) * size, tol * Math.abs(s[0]) * size],
      maxTriangles: opts.maxTriangles, maxMillis: opts.maxMillis, smoothOn: im ? im.smoothOn : () => true,
      // |f|, |f·lx|, |f·ly| on a box by interval arithmetic (outward rounded; the margin covers the products' rounding)
      boundsOn: (x0, y0, x1, y1, out) => {
        const range = rangeOnBox(tree, [x0, y0, x1, y1]);
        if (range === null) return false;
        const B = Math.max(Math.abs(range[0]), Math.abs(range[1])) * (1 + 1e-12);
        out[0] = B;
        out[1] = B * Math.max(Math.abs(x0 - ox), Math.abs(x1 - ox)) * (1 + 1e-12);
        out[2] = B * Math.max(Math.abs(y0 - oy), Math.abs(y1 - oy)) * (1 + 1e-12);
        return true;
      },
      // what lies outside the piece: bounded, in the estimate; worth it only if far below the tolerance
      outside,
    });
    if (outside && tolerance !== undefined) for (let k = 0; k < 3; k++) if (!(outside[k] <= 0.1 * r.target[k])) return null;
    return { r, ox, oy, cuts: im?.cuts ?? 0, box: local ? local.box : null };
  };
  const local = expr.isConstant ? null : localPiece(part, tree);
  const run = (local ? attempt(local.part, local) : null) ?? attempt(part, null)!;
  const { r, ox, oy } = run;
  const derive = (s: Float64Array) => ({
    integral: s[0], momentX: s[1] + ox * s[0], momentY: s[2] + oy * s[0], pointX: ox + s[1] / s[0], pointY: oy + s[2] / s[0],
  });
  // the estimate bounds the fine value's error by itself (see measureMass)
  const { values, errors } = propagateErrors(derive, r.fine, r.fine, r.estimate, r.scale);
  const method = methodOf([r], tolerance, [run.cuts]);
  if (run.box) method.meshedBox = run.box;
  // a cap (method.stopped) is a fact of the method; the writers in src/output say it in words
  return expressionResult(part, text, values, errors, r.errorIsBound, method);
}

/** The result of an integral from its derived values and estimates, with the warnings they call for. */
function expressionResult(part: Part, text: string, values: Record<'integral' | 'momentX' | 'momentY' | 'pointX' | 'pointY', number>, errors: Record<string, number>, bound: boolean, method: IntegrationMethod): ExpressionResult {
  const q = (k: keyof typeof values): Quantity => (bound ? { value: values[k], error: errors[k] } : { value: values[k], error: errors[k], errorIsBound: false });
  const warnings: IntegralWarning[] = [];
  const definedPoint = Math.abs(values.integral) > errors.integral && Number.isFinite(values.pointX) && Number.isFinite(values.pointY);
  if (!definedPoint) {
    warnings.push({ code: 'integral-indistinguishable-from-zero', value: values.integral, estimate: errors.integral });
  } else if (errors.integral > 1e-3 * Math.abs(values.integral)) {
    warnings.push({ code: 'integral-estimate-large', value: values.integral, estimate: errors.integral });
  }
  return {
    part: part.name, units: part.units, expression: text,
    integral: q('integral'), momentX: q('momentX'), momentY: q('momentY'),
    pointX: definedPoint ? q('pointX') : null, pointY: definedPoint ? q('pointY') : null,
    method, warnings,
  };
}

/**
 * A polynomial integrand (degree ≤ MAX_BOUNDARY_DEGREE) integrated exactly from the boundary
 * (src/properties/boundaryPolynomial.ts): ∫f, ∫f·x, ∫f·y about the local origin; the estimate is their
 * round-off bound plus the representation allowance (Σδ·L times the integrand's bound). Null otherwise.
 */
function boundaryExpression(part: Part, text: string, expr: CompiledExpression): ExpressionResult | null {
  const d = expr.polynomialDegree;
  if (d === null || d + 1 > MAX_BOUNDARY_DEGREE) return null;
  const started = performance.now();
  const origin = localOrigin(part);
  const [ox, oy] = origin;
  const ev = expr.evaluate;
  const r = boundaryPolynomialIntegrals(part, origin, {
    count: 3, degree: d + 1,
    fill(x, y, lx, ly, out) { const v = ev(x, y); out[0] = v; out[1] = v * lx; out[2] = v * ly; },
    bounds(X, Y, posErr, out) {
      // part coordinates ox + λ·lx: the position error, λ·lx's rounding and the sum's
      const input = posErr + 2 * Number.EPSILON * (Math.max(Math.abs(ox), Math.abs(oy)) + Math.max(X, Y));
      const f = roundingOnBox(expr.tree, [ox - X, oy - Y, ox + X, oy + Y], input);
      if (!f) { out.fill(Infinity); return; }
      const v = [f.max, f.error] as const, fx = boundMul(v, boundCoordinate(X, posErr)), fy = boundMul(v, boundCoordinate(Y, posErr));
      out[0] = v[0]; out[1] = fx[0]; out[2] = fy[0];
      out[3] = v[1]; out[4] = fx[1]; out[5] = fy[1];
    },
  });
  const rep = exactFigures(part).representation?.shiftLength ?? 0;
  const estimate = new Float64Array(3), scale = new Float64Array(3);
  for (let k = 0; k < 3; k++) { estimate[k] = r.roundoff[k] + rep * r.bound[k]; scale[k] = Math.abs(r.sums[k]); }
  const derive = (s: Float64Array) => ({
    integral: s[0], momentX: s[1] + ox * s[0], momentY: s[2] + oy * s[0], pointX: ox + s[1] / s[0], pointY: oy + s[2] / s[0],
  });
  const { values, errors } = propagateErrors(derive, r.sums, r.sums, estimate, scale);
  if (!Number.isFinite(values.integral) || !Number.isFinite(errors.integral)) return null;
  return expressionResult(part, text, values, errors, true, {
    degree: 0, rulePoints: 0, estimator: 'exact boundary integrals', stopped: 'exact', tolerance: null,
    baseTriangles: 0, triangles: 0, rounds: 0, points: r.nodes, millis: performance.now() - started, minJacobianRatio: 1,
    errorIsBound: true, unverifiedTriangles: 0, boundedTriangles: 0, kinkCuts: 0,
  });
}
