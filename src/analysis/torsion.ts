/**
 * Torsion constant, shear centre and warping constant of a part taken as the cross-section of a prismatic
 * member, with an error estimate on each value (finite elements: src/analysis/torsionSolve.ts).
 *
 * Levels: the base mesh (src/mesh/build.ts, graded toward corners) is refined uniformly until it has at least `minTriangles`
 * triangles (the coarse level), and once more (the fine level). The fine values are reported; each
 * estimate is
 *   SAFETY × |fine − coarse| + round-off and representation allowances,  SAFETY = 2.
 * Why this covers the error of the fine value: with an error behaving like C·h^r, the fine error is
 * |fine − coarse| / (2^r − 1). For smooth warping functions r = 2k for J (k the element order: 4 or more),
 * so the factor is ≤ 1/15; at a re-entrant corner of interior angle α the warping function has an
 * r^(π/α) singularity and the energy (hence J) converges with r = 2π/α on uniform meshes (from memory; the
 * classical corner-singularity result), e.g. 4/3 at 270°, 1 at a crack (360°), so the factor is ≤ 1; the
 * safety factor 2 covers pre-asymptotic departures of up to that ratio. This is an argument from the
 * asymptotic rate, not a bound. Before the uniform levels the base mesh is graded toward every re-entrant
 * corner (DEFAULT_GRADE_ROUNDS rounds, src/mesh/grade.ts; half as many at convex corners), which shrinks the
 * singular part of the error 15–40× on the sections checked and keeps the two levels in the asymptotic
 * regime; the result still carries the fact `{ code: 'reentrant-corners' }`, and the words say that the
 * estimate rests on the rate there. The largest shear stress is infinite at such a corner: its quantity
 * carries errorIsBound: false.
 *
 * The finite-element J is an upper bound of the true J (torsionSolve.ts), so J_fine − J_coarse ≤ 0 up to
 * the non-nested curved elements; the sign is reported as a fact when it is violated beyond round-off.
 */
import { type Part, allLoops } from '../geometry/part.js';
import { ops } from '../geometry/segments.js';
import { buildMesh, integrandChordLength, type MeshOptions } from '../mesh/build.js';
import { type Mesh, countCurved } from '../mesh/mesh.js';
import { gradeTowardVertices } from '../mesh/grade.js';
import { refineUniform } from '../mesh/refine.js';
import type { Quantity } from '../properties/quantities.js';
import { DEFAULT_DEGREE } from '../quadrature/rules.js';
import type { StopReason } from '../quadrature/stop.js';
import { exactFigures, preparePart } from './measure.js';
import { type TorsionLevelValues, solveTorsionLevels } from './torsionSolve.js';
import { OptionError } from '../base/errors.js';

export const TORSION_SAFETY = 2;
export const DEFAULT_TORSION_ORDER = 4;
export const DEFAULT_TORSION_TRIANGLES = 1000;
export const DEFAULT_GRADE_ROUNDS = 6;
/**
 * Relative residual target of the solve. J is evaluated from the stationary form, so its error from an
 * inexact solve is quadratic in the solve error; the shear centre's is linear and was measured at about
 * 1e-11 relative between targets 1e-10 and 1e-13. Tighter targets stall on round-off for large systems.
 */
export const TORSION_SOLVE_TOL = 1e-12;

export interface TorsionOptions extends MeshOptions {
  /** Element order 2–4 (default 4: the 1e-8 target on a square at 1,000 triangles; order 3 gave 1.1e-8). */
  order?: number;
  /** The coarse level has at least this many triangles (default 400); the fine level four times as many. */
  minTriangles?: number;
  /** Dunavant degree on curved triangles (default the project default, 10). */
  degree?: number;
  /** Rounds of geometric grading toward re-entrant corners before the uniform levels (default 6; convex
   * corners get half as many, rounded up). */
  gradeRounds?: number;
}

export type TorsionKey = 'J' | 'shearCentreX' | 'shearCentreY' | 'Iw' | 'tauPerTorque' | 'tauAtX' | 'tauAtY';

/** Facts about a torsion result; src/output words them. */
export type TorsionFact =
  | { code: 'reentrant-corners'; count: number; largestAngle: number }
  | { code: 'solve-not-converged'; residual: number }
  | { code: 'upper-bound-violated'; coarse: number; fine: number }
  | { code: 'shear-centre-ill-conditioned'; conditioning: number };

export interface TorsionResult {
  part: string;
  units: Part['units'];
  quantities: Record<TorsionKey, Quantity>;
  method: {
    order: number;
    degree: number;
    estimator: 'uniform refinement';
    safety: number;
    stopped: Extract<StopReason, 'levels'>;
    baseTriangles: number;
    coarseTriangles: number;
    triangles: number;
    curvedTriangles: number;
    unknowns: number;
    iterations: number;
    residual: number;
    localOrigin: [number, number];
  };
  facts: TorsionFact[];
  levels: TorsionLevelValues[];
}

/**
 * Corners of the boundary (tangent jumps between consecutive segments) with the material's interior angle
 * in degrees and the point (part coordinates). Outer loops counter-clockwise and holes clockwise after
 * normalisation: material on the left, so a right turn between segments is re-entrant (angle > 180°).
 */
export function partCorners(part: Part): { angle: number; point: [number, number] }[] {
  const out: { angle: number; point: [number, number] }[] = [];
  const d0: [number, number] = [0, 0], d1: [number, number] = [0, 0];
  for (const loop of allLoops(part)) {
    const n = loop.segments.length;
    for (let i = 0; i < n; i++) {
      const a = loop.segments[i], b = loop.segments[(i + 1) % n];
      ops(a).derivative(a, 1, d0); ops(b).derivative(b, 0, d1);
      const cross = d0[0] * d1[1] - d0[1] * d1[0], dot = d0[0] * d1[0] + d0[1] * d1[1];
      const turn = Math.atan2(cross, dot); // left turn positive
      if (Math.abs(turn) <= 1e-9) continue;
      const point: [number, number] = [0, 0];
      ops(b).point(b, 0, point);
      out.push({ angle: 180 - (turn * 180) / Math.PI, point });
    }
  }
  return out;
}

/** Re-entrant corners (interior angle above 180°): their count and the largest angle, degrees. */
export function reentrantCorners(part: Part): { count: number; largestAngle: number } {
  const re = partCorners(part).filter((c) => c.angle > 180);
  return { count: re.length, largestAngle: Math.max(0, ...re.map((c) => c.angle)) };
}

/**
 * τmax/T = (|τ|/(Gθ))/J from the fine level, estimated as SAFETY × the change from the coarse level (plus
 * the change of J's share). Where it occurs: the fine level's point, with the distance to the coarse level's
 * point as its estimate, never a bound (two equal peaks, as on a rectangle's two long sides, make the point
 * jump between levels; the value is still sound). At a re-entrant corner the true stress is infinite (the
 * warping gradient grows like r^(π/α − 1)); the finite-element value only grows with refinement, so both
 * value and location carry errorIsBound: false and the words say the stress is singular there.
 */
function largestStressQuantities(c: TorsionLevelValues, f: TorsionLevelValues, o: [number, number], singular: boolean): Pick<Record<TorsionKey, Quantity>, 'tauPerTorque' | 'tauAtX' | 'tauAtY'> {
  const tf = f.stressPerTwist / f.J, tc = c.stressPerTwist / c.J;
  const round = 64 * Number.EPSILON * tf * 100; // the lattice values and J's round-off, generously
  const moved = Math.hypot(f.stressAt[0] - c.stressAt[0], f.stressAt[1] - c.stressAt[1]);
  const notBound = singular ? { errorIsBound: false as const } : {};
  return {
    tauPerTorque: { value: tf, error: TORSION_SAFETY * Math.abs(tf - tc) + round, ...notBound },
    tauAtX: { value: o[0] + f.stressAt[0], error: moved, errorIsBound: false },
    tauAtY: { value: o[1] + f.stressAt[1], error: moved, errorIsBound: false },
  };
}

/** The mesh vertices at the given part points (corners are always mesh vertices), with the point's index. */
function meshVertices(m: Mesh, points: readonly [number, number][]): { vertex: number; index: number }[] {
  const out: { vertex: number; index: number }[] = [];
  const c = m.coords, n = c.length / 2;
  for (let j = 0; j < points.length; j++) {
    const [px, py] = points[j];
    const x = px - m.origin[0], y = py - m.origin[1];
    let best = -1, bd = Infinity;
    for (let i = 0; i < n; i++) { const d = Math.hypot(c[2 * i] - x, c[2 * i + 1] - y); if (d < bd) { bd = d; best = i; } }
    if (best >= 0 && bd <= 1e-9 * (1 + Math.hypot(x, y))) out.push({ vertex: best, index: j });
  }
  return out;
}

export function measureTorsion(input: Part, options: TorsionOptions = {}): TorsionResult {
  const order = options.order ?? DEFAULT_TORSION_ORDER;
  if (!(Number.isInteger(order) && order >= 2 && order <= 4)) throw new OptionError('order', `expected 2, 3 or 4, got ${order}`);
  const minTriangles = options.minTriangles ?? DEFAULT_TORSION_TRIANGLES;
  if (!(Number.isInteger(minTriangles) && minTriangles >= 1 && minTriangles <= 2_000_000)) {
    throw new OptionError('triangles', `expected a whole number from 1 to 2000000, got ${minTriangles}`);
  }
  const degree = options.degree ?? DEFAULT_DEGREE;
  const part = preparePart(input);
  // long straight edges are chopped (as for non-polynomial integrands): a straight edge left whole becomes
  // the base of a fan of slivers, which slows the solver's smoothing and the convergence of the values
  const { mesh: base } = buildMesh(part, { ...options, maxStraight: options.maxStraight ?? integrandChordLength(part, options) });
  const corners = reentrantCorners(part);
  const rounds = options.gradeRounds ?? DEFAULT_GRADE_ROUNDS;
  const all = partCorners(part);
  const at = meshVertices(base, all.map((c) => c.point));
  const graded = gradeTowardVertices(base, at.map((c) => c.vertex), at.map((c) => (all[c.index].angle > 180 ? rounds : Math.ceil(rounds / 2))));
  const meshes: Mesh[] = [graded];
  while (meshes[meshes.length - 1].count < minTriangles) meshes.push(refineUniform(meshes[meshes.length - 1]));
  meshes.push(refineUniform(meshes[meshes.length - 1]));
  const coarse = meshes[meshes.length - 2], fine = meshes[meshes.length - 1];
  const [c, f] = solveTorsionLevels(meshes, { order, curvedDegree: degree, tol: TORSION_SOLVE_TOL });
  const o = base.origin;
  const eps = Number.EPSILON;
  // representation allowance (src/properties/section.ts): every segment may lie δ from the described one;
  // J moves by at most about δ·perimeter·(largest |∇ω − (−y, x)|²) ≤ δ·perimeter·4R², R the largest
  // distance from the origin of the local frame (a generous factor on the shear-stress magnitude θGR).
  const ex = exactFigures(part);
  const box = ex.box;
  const R = Math.max(Math.abs(box[0] - o[0]), Math.abs(box[2] - o[0])) + Math.max(Math.abs(box[1] - o[1]), Math.abs(box[3] - o[1]));
  const jRep = (ex.representation?.maxShift ?? 0) * ex.perimeter * 4 * R * R;
  const jRound = 64 * eps * f.jMagnitude;
  const dJ = Math.abs(f.J - c.J);
  const sRound = 64 * eps * (Math.abs(o[0]) + Math.abs(o[1]) + R) / Math.max(f.shearCentreConditioning, 1e-300) + (ex.representation?.maxShift ?? 0);
  const dS = Math.hypot(f.shearCentre[0] - c.shearCentre[0], f.shearCentre[1] - c.shearCentre[1]);
  const iwRound = 64 * eps * (f.Iw + f.area * f.warpingMagnitude * f.warpingMagnitude);
  const q = (v: number, d: number, floor: number): Quantity => ({ value: v, error: TORSION_SAFETY * d + floor });
  const quantities: Record<TorsionKey, Quantity> = {
    J: q(f.J, dJ, jRound + jRep),
    // one estimate for the point, from the distance between the levels' shear centres (a per-axis
    // difference understated the y error of a thin channel whose levels happened to agree in y)
    shearCentreX: q(o[0] + f.shearCentre[0], dS, sRound),
    shearCentreY: q(o[1] + f.shearCentre[1], dS, sRound),
    Iw: q(f.Iw, Math.abs(f.Iw - c.Iw), iwRound),
    ...largestStressQuantities(c, f, o, corners.count > 0),
  };
  const facts: TorsionFact[] = [];
  if (corners.count > 0) facts.push({ code: 'reentrant-corners', ...corners });
  // the target is aimed at; round-off can leave order-4 systems just above it (1.4e-12 measured on a circle),
  // which changes no value beyond its round-off allowance: only ten times the target is reported
  for (const l of [c, f]) if (l.residual > 10 * TORSION_SOLVE_TOL) facts.push({ code: 'solve-not-converged', residual: l.residual });
  if (f.J - c.J > 16 * (jRound + jRep)) facts.push({ code: 'upper-bound-violated', coarse: c.J, fine: f.J });
  if (f.shearCentreConditioning < 1e-8) facts.push({ code: 'shear-centre-ill-conditioned', conditioning: f.shearCentreConditioning });
  return {
    part: input.name,
    units: input.units,
    quantities,
    method: {
      order, degree, estimator: 'uniform refinement', safety: TORSION_SAFETY, stopped: 'levels',
      baseTriangles: base.count, coarseTriangles: coarse.count, triangles: fine.count, curvedTriangles: countCurved(fine),
      unknowns: f.unknowns, iterations: c.iterations + f.iterations, residual: Math.max(c.residual, f.residual),
      localOrigin: [o[0], o[1]],
    },
    facts,
    levels: [c, f],
  };
}
