/**
 * Plates with thickness and density: resolve each layer's thickness and density (file, command-line flags,
 * materials), integrate mass properties over every layer with error estimates (optionally adaptive to a
 * tolerance), and integrate a user expression with its resultant and point of action.
 *
 * Thickness and density are checked at every quadrature point that is evaluated: a value that is not
 * positive and finite stops the run with an InputError naming where the field was given and the part
 * coordinates of the first such point.
 */
import { InputError } from '../base/errors.js';
import { compileExpression } from '../expr/index.js';
import type { Part } from '../geometry/part.js';
import type { LayerSpec, PlateModel } from '../read/partJson.js';
import { findMaterial, type MaterialTable } from '../model/index.js';
import { type MeshOptions, buildMesh } from '../mesh/build.js';
import { MASS_KEYS, MASS_SUMS, type MassKey, type MassValues, massFromSums, propagateErrors, shiftMassSums } from '../properties/mass.js';
import type { Quantity } from '../properties/quantities.js';
import { DEFAULT_DEGREE } from '../quadrature/rules.js';
import type { LengthUnit } from '../base/units.js';
import { type AdaptiveResult, integrateAdaptive } from './adaptive.js';
import { type StopReason, combineStops } from '../quadrature/stop.js';
import { preparePart } from './measure.js';
import { checkPoles } from './singular.js';

/** A thickness or density ready to evaluate. */
export interface Field {
  /** Where it was given: a JSON path ("layers[1].thickness") or a flag ("--thickness"). */
  where: string;
  what: 'thickness' | 'density';
  text: string;
  evaluate: (x: number, y: number) => number;
  /** Value when the field does not depend on x, y. */
  constant?: number;
}

export interface ResolvedLayer {
  name: string;
  where: string;
  part: Part;
  thickness: Field;
  density: Field;
  /** Where the density comes from: "steel (EN 1993-1-1 …)", "7850 kg/m³ given at layers[0].density". */
  densitySource: string;
  material?: string;
  /** Underside height, part length unit. */
  z0: number;
}

export interface PlateFlags {
  thickness?: string;
  density?: string;
  material?: string;
  materials?: MaterialTable;
}

function fmt(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toPrecision(6))) : String(v);
}

/** Compile a thickness or density given as a number or expression text. */
export function makeField(value: number | string, where: string, what: 'thickness' | 'density'): Field {
  const unit = what === 'density' ? ' kg/m³' : '';
  if (typeof value === 'number') {
    if (!(value > 0) || !Number.isFinite(value)) throw new InputError(where, `expected a positive ${what}${unit}, got ${value}`);
    return { where, what, text: String(value), evaluate: () => value, constant: value };
  }
  const trimmed = value.trim();
  const asNumber = trimmed !== '' ? Number(trimmed) : NaN;
  if (Number.isFinite(asNumber)) return makeField(asNumber, where, what);
  const c = compileExpression(value, where);
  if (c.isConstant) {
    const v = c.constant!;
    if (!(v > 0) || !Number.isFinite(v)) throw new InputError(where, `is ${fmt(v)}; expected a positive ${what}${unit}`);
    return { where, what, text: value, evaluate: () => v, constant: v };
  }
  return { where, what, text: value, evaluate: c.evaluate };
}

/** The error for a thickness or density that is not positive and finite at a point. */
export function fieldError(field: Field, v: number, x: number, y: number): InputError {
  return new InputError(field.where, `is ${fmt(v)} at (${x.toFixed(1)}, ${y.toFixed(1)}); expected a positive ${field.what} everywhere on the part`);
}

/** Does the model or the flags say anything about thickness, density or material? */
export function hasMassInput(model: PlateModel, flags: PlateFlags): boolean {
  return flags.thickness !== undefined || flags.density !== undefined || flags.material !== undefined ||
    model.layers.some((l) => l.thickness !== undefined || l.density !== undefined || l.material !== undefined);
}

/**
 * Resolve thickness, density and height of every layer. Command-line flags fill in what the file leaves
 * unset; a flag for something the file already states is refused (one place for each figure).
 */
export function resolvePlate(model: PlateModel, flags: PlateFlags): ResolvedLayer[] {
  if (flags.density !== undefined && flags.material !== undefined) throw new InputError('--material', 'given together with --density; give one or the other');
  const out: ResolvedLayer[] = [];
  model.layers.forEach((l: LayerSpec, i) => {
    const place = l.where || 'part';
    if (flags.thickness !== undefined && l.thickness) throw new InputError('--thickness', `the part file already gives a thickness at ${l.thickness.where}; give it in one place`);
    if ((flags.density !== undefined || flags.material !== undefined) && (l.density || l.material)) {
      throw new InputError(flags.density !== undefined ? '--density' : '--material', `the part file already gives ${l.density ? `a density at ${l.density.where}` : `a material at ${l.material!.where}`}; give it in one place`);
    }
    const thickness = l.thickness ? makeField(l.thickness.value, l.thickness.where, 'thickness')
      : flags.thickness !== undefined ? makeField(flags.thickness, '--thickness', 'thickness') : undefined;
    if (!thickness) throw new InputError(place, `no thickness for ${model.layered ? `layer "${l.name}"` : 'the part'}; expected "thickness" in the file or --thickness`);
    let density: Field | undefined;
    let densitySource = '';
    let material: string | undefined;
    const matName = l.material ? l.material : flags.material !== undefined ? { name: flags.material, where: '--material' } : undefined;
    if (l.density) {
      density = makeField(l.density.value, l.density.where, 'density');
      densitySource = `${density.text} kg/m³ given at ${l.density.where}`;
    } else if (flags.density !== undefined) {
      density = makeField(flags.density, '--density', 'density');
      densitySource = `${density.text} kg/m³ given by --density`;
    } else if (matName) {
      let m;
      try {
        m = findMaterial(matName.name, flags.materials);
      } catch (e) {
        if (e instanceof InputError) throw new InputError(matName.where, e.detail);
        throw e;
      }
      density = makeField(m.density, matName.where, 'density');
      material = m.id;
      densitySource = `${m.id}, ${m.density} kg/m³ (${m.source}${m.origin === 'built-in' ? '' : `; from ${m.origin}`})`;
    }
    if (!density) throw new InputError(place, `no density for ${model.layered ? `layer "${l.name}"` : 'the part'}; expected "density" or "material" in the file, or --density or --material`);
    let z0: number;
    if (l.z !== undefined) z0 = l.z;
    else if (i === 0) z0 = 0;
    else {
      const prev = out[i - 1];
      if (prev.thickness.constant === undefined) {
        throw new InputError(l.where, `expected "z" (height of the layer's underside): the layer below, "${prev.name}", has a variable thickness, so there is no single top to stack on`);
      }
      z0 = prev.z0 + prev.thickness.constant;
    }
    out.push({ name: l.name, where: l.where, part: l.part, thickness, density, densitySource, material, z0 });
  });
  return out;
}

export interface IntegrationOptions extends MeshOptions {
  degree?: number;
  tolerance?: number;
  maxTriangles?: number;
  maxMillis?: number;
}

export interface IntegrationMethod {
  degree: number;
  rulePoints: number;
  estimator: 'uniform refinement' | 'adaptive refinement';
  /** 'levels' without a tolerance (mesh and one uniform refinement); otherwise why refinement stopped. */
  stopped: StopReason;
  tolerance: number | null;
  baseTriangles: number;
  triangles: number;
  rounds: number;
  points: number;
  millis: number;
  minJacobianRatio: number;
}

function methodOf(results: AdaptiveResult[], tolerance: number | undefined): IntegrationMethod {
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
  };
}

export interface LayerMass {
  name: string;
  z0: number;
  densitySource: string;
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
function layerSums(layer: ResolvedLayer, opts: IntegrationOptions): { result: AdaptiveResult; origin: [number, number] } {
  const part = preparePart(layer.part);
  const { mesh } = buildMesh(part, opts);
  const T = layer.thickness, R = layer.density, z0 = layer.z0;
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
    degree: opts.degree ?? DEFAULT_DEGREE, tolerance: opts.tolerance,
    // first moments and products: to within tolerance × (mass or second moment) × size, like the centre
    absTolerance: (s, tol) => {
      const e1 = tol * Math.abs(s[0]) * size, e6 = tol * Math.abs(s[6]) * size;
      const e2 = tol * Math.sqrt(Math.abs(s[3] * s[5]));
      return [undefined, e1, e1, undefined, e2, undefined, undefined, e6, e6, undefined];
    },
    maxTriangles: opts.maxTriangles, maxMillis: opts.maxMillis,
  });
  return { result, origin: mesh.origin };
}

/** Mass properties of every layer and of the whole stack, each value with an error estimate. */
export function measureMass(name: string, units: LengthUnit, layers: ResolvedLayer[], opts: IntegrationOptions = {}): MassResult {
  if (layers.length === 0) throw new InputError('layers', 'expected at least one layer');
  const runs = layers.map((l) => layerSums(l, opts));
  const ref = runs[0].origin;
  const total = { fine: new Float64Array(MASS_SUMS), coarse: new Float64Array(MASS_SUMS), estimate: new Float64Array(MASS_SUMS), scale: new Float64Array(MASS_SUMS) };
  const out: LayerMass[] = [];
  runs.forEach(({ result, origin }, i) => {
    const derive = (s: Float64Array) => massFromSums(s, origin, units);
    const { values, errors } = propagateErrors(derive, result.fine, result.coarse, result.estimate, result.scale);
    const l = layers[i];
    out.push({ name: l.name, z0: l.z0, densitySource: l.densitySource, material: l.material, thickness: l.thickness.text, quantities: toQuantities(values, errors) });
    const dx = origin[0] - ref[0], dy = origin[1] - ref[1];
    const f = shiftMassSums(result.fine, dx, dy), c = shiftMassSums(result.coarse, dx, dy);
    // estimates and scales shift with absolute values (bounds, not signed sums)
    const e = shiftMassSums(result.estimate, Math.abs(dx), Math.abs(dy)), s = shiftMassSums(result.scale, Math.abs(dx), Math.abs(dy));
    for (let k = 0; k < MASS_SUMS; k++) {
      total.fine[k] += f[k]; total.coarse[k] += c[k]; total.estimate[k] += e[k]; total.scale[k] += s[k];
    }
  });
  const { values, errors } = propagateErrors((s) => massFromSums(s, ref, units), total.fine, total.coarse, total.estimate, total.scale);
  return { part: name, units, quantities: toQuantities(values, errors), layers: out, method: methodOf(runs.map((r) => r.result), opts.tolerance) };
}

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
  warnings: string[];
}

/**
 * Integrate the expression `text` over a part: ∫ f dA, the first moments and the point of action of the
 * resultant. `where` names the expression's source in messages ("--expr").
 */
export function integrateExpression(input: Part, text: string, opts: IntegrationOptions & { where?: string } = {}): ExpressionResult {
  const where = opts.where ?? 'expression';
  const expr = compileExpression(text, where);
  const ev = expr.evaluate;
  const part = preparePart(input);
  const { mesh } = buildMesh(part, opts);
  if (!expr.isConstant) checkPoles(mesh, ev, where);
  const f = (x: number, y: number, lx: number, ly: number, out: Float64Array) => {
    const v = ev(x, y);
    if (!Number.isFinite(v)) throw new InputError(where, `is ${v} at (${x.toFixed(1)}, ${y.toFixed(1)}); expected a finite value everywhere on the part`);
    out[0] = v; out[1] = v * lx; out[2] = v * ly;
  };
  const size = Math.hypot(...boxSize(mesh));
  const r = integrateAdaptive(mesh, 3, f, {
    degree: opts.degree ?? DEFAULT_DEGREE, tolerance: opts.tolerance,
    // first moments: the point of action to within tolerance × part size
    absTolerance: (s, tol) => [undefined, tol * Math.abs(s[0]) * size, tol * Math.abs(s[0]) * size],
    maxTriangles: opts.maxTriangles, maxMillis: opts.maxMillis,
  });
  const [ox, oy] = mesh.origin;
  const derive = (s: Float64Array) => ({
    integral: s[0], momentX: s[1] + ox * s[0], momentY: s[2] + oy * s[0], pointX: ox + s[1] / s[0], pointY: oy + s[2] / s[0],
  });
  const { values, errors } = propagateErrors(derive, r.fine, r.coarse, r.estimate, r.scale);
  const q = (k: keyof typeof values): Quantity => ({ value: values[k], error: errors[k] });
  const warnings: string[] = [];
  const definedPoint = Math.abs(values.integral) > errors.integral && Number.isFinite(values.pointX) && Number.isFinite(values.pointY);
  const rough = 'the integrand may be singular (a pole, division by zero) inside the part or too rough for this mesh: check it, and try --tolerance';
  if (!definedPoint) {
    warnings.push(`∫ f dA is not distinguishable from zero within its estimate (${errors.integral.toPrecision(2)} against |${values.integral.toPrecision(6)}|): either the load balances (a pure couple) or ${rough}. No point of action is given.`);
  } else if (errors.integral > 1e-3 * Math.abs(values.integral)) {
    warnings.push(`the estimate of ∫ f dA is ${(100 * errors.integral / Math.abs(values.integral)).toPrecision(2)}% of its value: ${rough}.`);
  }
  const method = methodOf([r], opts.tolerance);
  // a cap (method.stopped) is a fact of the method; the writers in src/output say it in words
  return {
    part: part.name, units: part.units, expression: text,
    integral: q('integral'), momentX: q('momentX'), momentY: q('momentY'),
    pointX: definedPoint ? q('pointX') : null, pointY: definedPoint ? q('pointY') : null,
    method, warnings,
  };
}
