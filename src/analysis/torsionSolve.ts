/**
 * Saint-Venant torsion on one mesh: the warping function by Lagrange finite elements of order k on the
 * exact curved mesh, and the torsion constant, shear centre and warping constant it gives.
 *
 * Conventions and derivation (elasticity of prismatic bars, Saint-Venant's semi-inverse method; written
 * from memory, e.g. as in Timoshenko & Goodier, "Theory of Elasticity", chapter on torsion). Twist rate θ
 * about the z axis through the point O (here the mesh's local origin); displacements
 *   u = −θ z y,  v = θ z x,  w = θ ω(x, y).
 * Shear strains γxz = θ(∂ω/∂x − y), γyz = θ(∂ω/∂y + x). Equilibrium without body forces gives ∇²ω = 0 in
 * the section; a traction-free mantle gives, on every boundary loop (outer and holes),
 *   ∂ω/∂n = y·nx − x·ny.
 * The torque is T = G θ J with
 *   J = ∫(x² + y²) dA + ∫(x ∂ω/∂y − y ∂ω/∂x) dA.
 * (The brief for this work wrote "− ∫(x ∂ω/∂y − y ∂ω/∂x)"; with the boundary condition above the sign is
 * "+": the "−" form belongs to the opposite-signed warping function ψ = −ω. Checked numerically: the "+"
 * form gives πd⁴/32 and √3a⁴/80, the other exceeds the polar moment.)
 *
 * Weak form: for every test function v, ∫∇ω·∇v dA = ∮ v (y nx − x ny) ds = ∫(y ∂v/∂x − x ∂v/∂y) dA
 * (divergence theorem with the divergence-free field (y, −x)), so the load is a domain integral and needs
 * no boundary quadrature on the curves. With v = ω: ∫(x ω_y − y ω_x) dA = −∫|∇ω|² dA, hence
 *   J = Ip_O − ∫|∇ω|² dA ≤ Ip_O.
 * The discrete problem minimises ½ a(v, v) − f(v); with ωh its minimiser, J_h = Ip_O − a(ωh, ωh) and
 * J_h − J = a(ω − ωh, ω − ωh) ≥ 0 (Galerkin orthogonality): the finite-element J is an upper bound that
 * converges like the energy error squared, O(h^2k) for smooth ω. We evaluate J from the stationary form
 * Ip_O − (2 fᵀω̃ − ω̃ᵀKω̃), whose error in an inexact algebraic solution ω̃ is quadratic.
 *
 * Multiply-connected sections: the warping function is single valued (the displacement w must be), and
 * the Neumann condition above holds on every loop, holes included; no extra condition is needed, unlike the
 * Prandtl stress function, which takes an unknown constant on each hole fixed by Bredt-type circulation
 * conditions. So the same weak form on the holed mesh is the whole problem.
 *
 * The Neumann problem fixes ω up to a constant on each connected part: one unknown per part is set to zero
 * (the constant has no effect on J or on the shear centre; the warping constant removes it by normalisation).
 *
 * Shear centre (Trefftz's definition, independent of Poisson's ratio; it is the one the thin-walled
 * formulas give). Moving the twist axis to a pole P = (xp, yp) changes the warping function to
 *   ω_P = ω_O − yp·x + xp·y + c
 * (it satisfies the boundary condition written about P). With centroidal coordinates x̄, ȳ, second moments
 * Ix = ∫ȳ², Iy = ∫x̄², Ixy = ∫x̄ȳ, and Iωx = ∫ω_C x̄, Iωy = ∫ω_C ȳ for the warping function about the
 * centroid, the shear centre S is the pole whose warping is orthogonal to x̄ and ȳ:
 *   Iωx − ȳs·Iy + x̄s·Ixy = 0,  Iωy − ȳs·Ixy + x̄s·Ix = 0,
 *   x̄s = (Ixy·Iωx − Iy·Iωy)/D,  ȳs = (Ix·Iωx − Ixy·Iωy)/D,  D = Ix·Iy − Ixy².
 * Warping constant Iw = ∫ω_S² dA with ω_S about the shear centre and normalised to ∫ω_S dA = 0.
 */
import { type MeshView, TriangleMap, isCurved } from '../mesh/mesh.js';
import { MultigridCycle } from '../numeric/multigrid.js';
import { type CsrMatrix, TripletBuilder, fixUnknown } from '../numeric/sparse.js';
import { conjugateGradients } from '../numeric/sparseSolve.js';
import { addCompensated } from '../numeric/sum.js';
import { getRule, safeDegreeAtLeast } from '../quadrature/rules.js';
import { type LagrangeTable, lagrangeNodes, lagrangeTable } from './torsionBasis.js';

export interface TorsionLevelValues {
  triangles: number;
  curvedTriangles: number;
  unknowns: number;
  /** torsion constant */
  J: number;
  /** shear centre in the mesh's local coordinates */
  shearCentre: [number, number];
  /** warping constant about the shear centre, ∫ω_S² dA with ∫ω_S dA = 0 */
  Iw: number;
  /** centroid (local) and area, from the same quadrature (for the round-off allowances) */
  centroid: [number, number];
  area: number;
  /** polar moment about the local origin, ∫(x² + y²) dA */
  polarAtOrigin: number;
  /** sums whose rounding bounds the round-off of J: Ip_O + |2 fᵀω| + |ωᵀKω| */
  jMagnitude: number;
  /** largest |ω_S| met at a quadrature point plus its linear part's size (round-off of Iw) */
  warpingMagnitude: number;
  /**
   * largest shear-stress magnitude per unit twist, |τ|/(Gθ) = |∇ω + (−y, x)|, over the evaluation lattice
   * (edges and vertices included), and where it occurs (local coordinates)
   */
  stressPerTwist: number;
  stressAt: [number, number];
  /** D / (Ix·Iy): near 0 when the second-moment matrix is ill-conditioned */
  shearCentreConditioning: number;
  iterations: number;
  residual: number;
  converged: boolean;
  /** IC(0) diagonal shift that was needed (0 = none) */
  preconditionerShift: number;
}

export interface TorsionSolveOptions {
  /** element order k (2–4) */
  order: number;
  /** Dunavant degree used on curved triangles */
  curvedDegree: number;
  /** relative residual target of the conjugate-gradient solve */
  tol: number;
}

/**
 * Numbering of the order-k unknowns: every vertex, k − 1 per edge (ordered from the lower vertex index to
 * the higher, so neighbours agree), (k − 1)(k − 2)/2 per triangle; numbered in order of first use while
 * walking the triangles (keeps neighbours' numbers close, which helps IC(0)).
 */
function numberUnknowns(mesh: MeshView, k: number): { dofs: Int32Array; total: number; nodes: number } {
  const nodes = ((k + 1) * (k + 2)) / 2;
  const nT = mesh.count;
  const dofs = new Int32Array(nT * nodes);
  let maxV = 0;
  for (let i = 0; i < 3 * nT; i++) if (mesh.triangles[i] > maxV) maxV = mesh.triangles[i];
  const nV = maxV + 1;
  const vDof = new Int32Array(nV).fill(-1);
  const edgeFirst = new Map<number, number>();
  let next = 0;
  const inner = ((k - 1) * (k - 2)) / 2;
  for (let t = 0; t < nT; t++) {
    const base = t * nodes;
    const v = [mesh.triangles[3 * t], mesh.triangles[3 * t + 1], mesh.triangles[3 * t + 2]];
    for (let j = 0; j < 3; j++) {
      if (vDof[v[j]] < 0) vDof[v[j]] = next++;
      dofs[base + j] = vDof[v[j]];
    }
    for (let e = 0; e < 3; e++) {
      const a = v[e], b = v[(e + 1) % 3];
      const key = a < b ? a * nV + b : b * nV + a;
      let first = edgeFirst.get(key);
      if (first === undefined) { first = next; next += k - 1; edgeFirst.set(key, first); }
      for (let j = 1; j < k; j++) {
        // local inner node j lies j/k of the way from a to b; global order runs from min(a,b)
        dofs[base + 3 + e * (k - 1) + (j - 1)] = a < b ? first + j - 1 : first + (k - 1 - j);
      }
    }
    for (let j = 0; j < inner; j++) dofs[base + 3 + 3 * (k - 1) + j] = next++;
  }
  return { dofs, total: next, nodes };
}

interface Tables { straight: { w: Float64Array; l1: Float64Array; l2: Float64Array; tab: LagrangeTable }; curved: { w: Float64Array; l1: Float64Array; l2: Float64Array; tab: LagrangeTable } }

function tables(k: number, curvedDegree: number): Tables {
  // straight triangles: the Jacobian is constant, every integrand is a polynomial of degree ≤ 2k (ω²)
  const rs = getRule(safeDegreeAtLeast(2 * k));
  const rc = getRule(Math.max(curvedDegree, safeDegreeAtLeast(2 * k)));
  return {
    straight: { w: rs.w, l1: rs.l1, l2: rs.l2, tab: lagrangeTable(k, rs.l1, rs.l2) },
    curved: { w: rc.w, l1: rc.l1, l2: rc.l2, tab: lagrangeTable(k, rc.l1, rc.l2) },
  };
}

/** The assembled warping problem of one mesh, one unknown per connected part fixed at zero. */
export interface TorsionSystem {
  mesh: MeshView;
  order: number;
  dofs: Int32Array;
  nodes: number;
  total: number;
  K: CsrMatrix;
  f: Float64Array;
  /** A, ∫x, ∫y, ∫x², ∫xy, ∫y² (local coordinates) */
  moments: Float64Array;
  curvedCount: number;
  tables: Tables;
}

/** Assemble the stiffness and load of the warping problem on one mesh (element loops on typed arrays). */
export function assembleTorsion(mesh: MeshView, opts: Pick<TorsionSolveOptions, 'order' | 'curvedDegree'>): TorsionSystem {
  const k = opts.order;
  const { dofs, total, nodes } = numberUnknowns(mesh, k);
  const T = tables(k, opts.curvedDegree);
  const nT = mesh.count;
  const B = new TripletBuilder(total, nT * nodes * nodes);
  const f = new Float64Array(total);
  const map = new TriangleMap();
  const Ke = new Float64Array(nodes * nodes), fe = new Float64Array(nodes);
  const gx = new Float64Array(nodes), gy = new Float64Array(nodes);
  // moments: A, ∫x, ∫y, ∫x², ∫xy, ∫y² (local)
  const mom = new Float64Array(6), momC = new Float64Array(6);
  let curvedCount = 0;
  for (let t = 0; t < nT; t++) {
    map.load(mesh, t);
    const c = isCurved(mesh, t);
    if (c) curvedCount++;
    const R = c ? T.curved : T.straight;
    const tab = R.tab;
    Ke.fill(0); fe.fill(0);
    let a = 0, sx = 0, sy = 0, sxx = 0, sxy = 0, syy = 0;
    for (let q = 0; q < R.w.length; q++) {
      map.at(R.l1[q], R.l2[q]);
      const det = map.jac, x = map.x, y = map.y;
      const w = R.w[q] * det * 0.5;
      const off = q * nodes;
      for (let i = 0; i < nodes; i++) {
        const du = tab.du[off + i], dv = tab.dv[off + i];
        gx[i] = (map.yv * du - map.yu * dv) / det;
        gy[i] = (map.xu * dv - map.xv * du) / det;
      }
      for (let i = 0; i < nodes; i++) {
        const wgx = w * gx[i], wgy = w * gy[i];
        fe[i] += y * wgx - x * wgy;
        for (let j = i; j < nodes; j++) Ke[i * nodes + j] += wgx * gx[j] + wgy * gy[j];
      }
      a += w; sx += w * x; sy += w * y; sxx += w * x * x; sxy += w * x * y; syy += w * y * y;
    }
    addCompensated(mom, momC, 0, a); addCompensated(mom, momC, 1, sx); addCompensated(mom, momC, 2, sy);
    addCompensated(mom, momC, 3, sxx); addCompensated(mom, momC, 4, sxy); addCompensated(mom, momC, 5, syy);
    const base = t * nodes;
    for (let i = 0; i < nodes; i++) {
      const gi = dofs[base + i];
      f[gi] += fe[i];
      B.add(gi, gi, Ke[i * nodes + i]);
      for (let j = i + 1; j < nodes; j++) {
        const gj = dofs[base + j], v = Ke[i * nodes + j];
        B.add(gi, gj, v); B.add(gj, gi, v);
      }
    }
  }
  for (let i = 0; i < 6; i++) mom[i] += momC[i];
  // The Neumann problem fixes ω up to one constant per connected part: the first unknown of each part is
  // set to zero (row and column made the identity), which leaves a definite system. The constant changes
  // none of the values (J uses fᵀω and ωᵀKω, whose fixed entries meet ω = 0; Iw removes the mean).
  const K = B.toCsr();
  for (const i of firstOfEachPart(dofs, nodes, total)) fixUnknown(K, f, i, 0);
  return { mesh, order: k, dofs, nodes, total, K, f, moments: mom, curvedCount, tables: T };
}

/** The lowest unknown of each connected part (unknowns linked through shared triangles). */
function firstOfEachPart(dofs: Int32Array, nodes: number, n: number): number[] {
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (i: number): number => { while (parent[i] !== i) { parent[i] = parent[parent[i]]; i = parent[i]; } return i; };
  for (let e = 0; e < dofs.length; e += nodes) {
    for (let i = 1; i < nodes; i++) { const a = find(dofs[e]), b = find(dofs[e + i]); if (a !== b) parent[a] = b; }
  }
  const seen = new Uint8Array(n), out: number[] = [];
  for (let i = 0; i < n; i++) { const r = find(i); if (!seen[r]) { seen[r] = 1; out.push(i); } }
  return out;
}

/**
 * Prolongation from the order-k space of `coarse` to that of `fine`, where fine is coarse refined uniformly
 * (children of triangle t are 4t … 4t + 3, src/mesh/refine.ts): each fine unknown takes the coarse
 * function's value at its node, read in the parent's reference coordinates. Exact for straight triangles;
 * on curved ones the children follow the curve, so it is a close approximation, which is all a
 * preconditioner needs.
 */
export function torsionProlongation(coarse: TorsionSystem, fine: TorsionSystem): CsrMatrix {
  const k = coarse.order, nodes = coarse.nodes;
  if (fine.mesh.count !== 4 * coarse.mesh.count) throw new Error('torsionProlongation: fine mesh is not a uniform refinement');
  // the child's vertices in the parent's barycentric (l1, l2) coordinates, in refine.ts's order
  const childVerts = [
    [[0, 0], [0.5, 0], [0, 0.5]],
    [[0.5, 0], [1, 0], [0.5, 0.5]],
    [[0, 0.5], [0.5, 0.5], [0, 1]],
    [[0.5, 0], [0.5, 0.5], [0, 0.5]],
  ];
  const alpha = lagrangeNodes(k);
  const l1 = new Float64Array(4 * nodes), l2 = new Float64Array(4 * nodes);
  for (let c = 0; c < 4; c++) {
    const [v0, v1, v2] = childVerts[c];
    for (let i = 0; i < nodes; i++) {
      const a0 = alpha[3 * i] / k, a1 = alpha[3 * i + 1] / k, a2 = alpha[3 * i + 2] / k;
      l1[c * nodes + i] = a0 * v0[0] + a1 * v1[0] + a2 * v2[0];
      l2[c * nodes + i] = a0 * v0[1] + a1 * v1[1] + a2 * v2[1];
    }
  }
  const W = lagrangeTable(k, l1, l2).phi; // [ (c·nodes + i)·nodes + j ]
  const nF = fine.total;
  const source = new Int32Array(nF).fill(-1); // fine unknown → fine triangle·nodes + local node
  for (let s = 0; s < fine.mesh.count; s++) {
    for (let i = 0; i < nodes; i++) { const g = fine.dofs[s * nodes + i]; if (source[g] < 0) source[g] = s * nodes + i; }
  }
  const rowPtr = new Int32Array(nF + 1);
  const col = new Int32Array(nF * nodes), val = new Float64Array(nF * nodes);
  let e = 0;
  for (let g = 0; g < nF; g++) {
    const s = (source[g] / nodes) | 0, i = source[g] - s * nodes;
    const t = s >> 2, c = s & 3, off = (c * nodes + i) * nodes;
    for (let j = 0; j < nodes; j++) {
      const w = W[off + j];
      if (Math.abs(w) < 1e-14) continue;
      col[e] = coarse.dofs[t * nodes + j]; val[e] = w; e++;
    }
    rowPtr[g + 1] = e;
  }
  return { n: nF, rowPtr, col: col.slice(0, e), val: val.slice(0, e) };
}

/**
 * Prolongation from the linear space to the order-k space on the same mesh: each order-k unknown takes the
 * linear function's value at its node, Σ λ_j v_j with λ the node's barycentric coordinates.
 */
export function orderProlongation(linear: TorsionSystem, high: TorsionSystem): CsrMatrix {
  if (linear.order !== 1 || linear.mesh !== high.mesh) throw new Error('orderProlongation: needs the linear and the order-k system of one mesh');
  const k = high.order, nodes = high.nodes, alpha = lagrangeNodes(k);
  const nH = high.total;
  const source = new Int32Array(nH).fill(-1);
  for (let e = 0; e < high.dofs.length; e++) if (source[high.dofs[e]] < 0) source[high.dofs[e]] = e;
  const rowPtr = new Int32Array(nH + 1), col = new Int32Array(3 * nH), val = new Float64Array(3 * nH);
  let n = 0;
  for (let g = 0; g < nH; g++) {
    const t = (source[g] / nodes) | 0, i = source[g] - t * nodes;
    for (let j = 0; j < 3; j++) {
      const w = alpha[3 * i + j] / k;
      if (w === 0) continue;
      col[n] = linear.dofs[3 * t + j]; val[n] = w; n++;
    }
    rowPtr[g + 1] = n;
  }
  return { n: nH, rowPtr, col: col.slice(0, n), val: val.slice(0, n) };
}

/** How the algebraic solve of one level went. */
export interface SolveRecord { iterations: number; residual: number; converged: boolean; preconditionerShift: number }

/**
 * Solve the warping problem on a hierarchy of meshes, each the uniform refinement of the one before, and
 * return the values of the last two levels. Conjugate gradients preconditioned by a multigrid cycle over
 * the whole hierarchy (src/numeric/multigrid.ts); the finer solve starts from the coarser solution
 * prolongated. All levels' systems are assembled once.
 */
export function solveTorsionLevels(meshes: readonly MeshView[], opts: TorsionSolveOptions): [TorsionLevelValues, TorsionLevelValues] {
  if (meshes.length < 2) throw new Error('solveTorsionLevels: needs at least two levels');
  // below the order-k levels: the linear (order-1) space on the base mesh, so that the level factorised
  // directly stays small even when the base mesh is large (a plate with many holes)
  const linear = assembleTorsion(meshes[0], { order: 1, curvedDegree: opts.curvedDegree });
  const systems = [linear, ...meshes.map((m) => assembleTorsion(m, opts))];
  const P: CsrMatrix[] = [orderProlongation(linear, systems[1])];
  for (let l = 2; l < systems.length; l++) P.push(torsionProlongation(systems[l - 1], systems[l]));
  const mg = new MultigridCycle(systems.map((s) => s.K), P);
  const top = systems.length - 1;
  const out: TorsionLevelValues[] = [];
  let x0: Float64Array | undefined;
  for (const l of [top - 1, top]) {
    const S = systems[l];
    const sol = conjugateGradients(S.K, S.f, mg.at(l), { tol: opts.tol, x0 });
    out.push(torsionValues(S, sol.x, { iterations: sol.iterations, residual: sol.residual, converged: sol.converged, preconditionerShift: 0 }));
    x0 = new Float64Array(systems[l + 1]?.total ?? 0);
    if (l < top) mg.prolongate(l + 1, sol.x, x0);
  }
  return [out[0], out[1]];
}

/** J, shear centre and Iw from a solved warping function on one level. */
function torsionValues(S: TorsionSystem, omega: Float64Array, rec: SolveRecord): TorsionLevelValues {
  const { mesh, tables: T, dofs, nodes, total, f, moments: mom } = S;
  const map = new TriangleMap();
  // J from the stationary form
  let fw = 0, wKw = 0;
  {
    const { rowPtr, col, val } = S.K;
    for (let i = 0; i < total; i++) {
      fw += f[i] * omega[i];
      let s = 0;
      for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) s += val[p] * omega[col[p]];
      wKw += omega[i] * s;
    }
  }
  const area = mom[0];
  const polarAtOrigin = mom[3] + mom[5];
  const J = polarAtOrigin - (2 * fw - wKw);

  // second pass: ∫ω, ∫ωx, ∫ωy (ω about the local origin)
  const wm = new Float64Array(3), wmC = new Float64Array(3);
  forEachPoint(mesh, T, dofs, nodes, omega, map, (w, x, y, om) => {
    addCompensated(wm, wmC, 0, w * om); addCompensated(wm, wmC, 1, w * om * x); addCompensated(wm, wmC, 2, w * om * y);
  });
  for (let i = 0; i < 3; i++) wm[i] += wmC[i];
  const cx = mom[1] / area, cy = mom[2] / area;
  const Iy = mom[3] - area * cx * cx, Ix = mom[5] - area * cy * cy, Ixy = mom[4] - area * cx * cy;
  // ω_C = ω_O − cy·x + cx·y; Iωx = ∫ω_C (x − cx), Iωy = ∫ω_C (y − cy)
  const Iwx = (wm[1] - cx * wm[0]) - cy * Iy + cx * Ixy;
  const Iwy = (wm[2] - cy * wm[0]) - cy * Ixy + cx * Ix;
  const D = Ix * Iy - Ixy * Ixy;
  const xs = cx + (Ixy * Iwx - Iy * Iwy) / D;
  const ys = cy + (Ix * Iwx - Ixy * Iwy) / D;
  // third pass: Iw = ∫(ω_S − mean)², ω_S = ω_O − ys·x + xs·y
  const mean = (wm[0] - ys * mom[1] + xs * mom[2]) / area;
  const iw = new Float64Array(1), iwC = new Float64Array(1);
  let big = 0;
  forEachPoint(mesh, T, dofs, nodes, omega, map, (w, x, y, om) => {
    const v = om - ys * x + xs * y - mean;
    const mag = Math.abs(om) + Math.abs(ys * x) + Math.abs(xs * y) + Math.abs(mean);
    if (mag > big) big = mag;
    addCompensated(iw, iwC, 0, w * v * v);
  });
  const peak = largestStress(S, omega, map);
  return {
    triangles: mesh.count, curvedTriangles: S.curvedCount, unknowns: total,
    stressPerTwist: peak.value, stressAt: peak.at,
    J, shearCentre: [xs, ys], Iw: iw[0] + iwC[0],
    centroid: [cx, cy], area, polarAtOrigin,
    jMagnitude: Math.abs(polarAtOrigin) + Math.abs(2 * fw) + Math.abs(wKw),
    warpingMagnitude: big,
    shearCentreConditioning: D / (Ix * Iy),
    iterations: rec.iterations, residual: rec.residual, converged: rec.converged, preconditionerShift: rec.preconditionerShift,
  };
}

/**
 * Largest |∇ω + (−y, x)| over a lattice of order k + 2 in every triangle: its vertices, edges and interior,
 * pulled 1e-9 toward the centre (the curved map divides by zero exactly at a vertex of a curved edge).
 * The magnitude squared is subharmonic (the Prandtl stress function φ has ∇²φ = −2, so ∇²|∇φ|² = 2Σφ_ij²
 * ≥ 0), so the largest value lies on the boundary, which the lattice covers in every boundary triangle.
 */
function largestStress(S: TorsionSystem, omega: Float64Array, map: TriangleMap): { value: number; at: [number, number] } {
  const { mesh, dofs, nodes, order: k } = S;
  const m = k + 2, pts: number[][] = [];
  for (let i = 0; i <= m; i++) for (let j = 0; i + j <= m; j++) pts.push([i / m, j / m]);
  const shrink = 1e-9, l1 = new Float64Array(pts.length), l2 = new Float64Array(pts.length);
  for (let q = 0; q < pts.length; q++) { l1[q] = shrink / 3 + (1 - shrink) * pts[q][0]; l2[q] = shrink / 3 + (1 - shrink) * pts[q][1]; }
  const tab = lagrangeTable(k, l1, l2);
  let best = -1;
  const at: [number, number] = [0, 0];
  for (let t = 0; t < mesh.count; t++) {
    map.load(mesh, t);
    const base = t * nodes;
    for (let q = 0; q < pts.length; q++) {
      map.at(l1[q], l2[q]);
      let wu = 0, wv = 0;
      const off = q * nodes;
      for (let i = 0; i < nodes; i++) { const o = omega[dofs[base + i]]; wu += tab.du[off + i] * o; wv += tab.dv[off + i] * o; }
      const det = map.jac;
      const wx = (map.yv * wu - map.yu * wv) / det, wy = (map.xu * wv - map.xv * wu) / det;
      const tx = wx - map.y, ty = wy + map.x;
      const v = tx * tx + ty * ty;
      if (v > best) { best = v; at[0] = map.x; at[1] = map.y; }
    }
  }
  return { value: Math.sqrt(best), at };
}

/** Visit every quadrature point with its weight (area element), local point and ω value. */
function forEachPoint(mesh: MeshView, T: Tables, dofs: Int32Array, nodes: number, omega: Float64Array, map: TriangleMap,
  visit: (w: number, x: number, y: number, om: number) => void): void {
  for (let t = 0; t < mesh.count; t++) {
    map.load(mesh, t);
    const R = isCurved(mesh, t) ? T.curved : T.straight;
    const base = t * nodes;
    for (let q = 0; q < R.w.length; q++) {
      map.at(R.l1[q], R.l2[q]);
      let om = 0;
      const off = q * nodes;
      for (let i = 0; i < nodes; i++) om += R.tab.phi[off + i] * omega[dofs[base + i]];
      visit(R.w[q] * map.jac * 0.5, map.x, map.y, om);
    }
  }
}
