/**
 * Poles of a user integrand inside the part. Quadrature points almost never land exactly on a pole such
 * as x = 50 in 1/(x − 50), so the sums stay finite and a divergent integral would come out as a number.
 * This check looks along every straight interior edge of the base mesh: where the integrand changes sign
 * between the two ends it bisects the edge down to round-off. A continuous function goes to zero there, a
 * jump stays bounded, a pole grows without bound (or gives a non-finite value): that is reported. A pole
 * curve that crosses the part's interior must cross some mesh edge or pass through a vertex, so odd-order
 * poles along curves that cross the mesh are found. Not found: even-order poles (1/(x − 50)², no sign
 * change), poles on the boundary (1/(x − 100) at the edge x = 100: boundary values are not examined, as
 * log(x) at x = 0 is infinite yet integrable), edges with several sign changes (tan(x) on a coarse mesh)
 * and pole curves that close inside one triangle; for those the refinement estimate stays large.
 */
import { InputError } from '../base/errors.js';
import type { Mesh } from '../mesh/mesh.js';

export interface PoleHit { x: number; y: number; value: number }

/** How much larger than the values at the edge's ends the integrand must grow to count as a pole. */
const POLE_GROWTH = 1e6;

/** The first pole of f found on the mesh (part coordinates), or null. */
export function findPole(mesh: Mesh, f: (x: number, y: number) => number): PoleHit | null {
  const [ox, oy] = mesh.origin;
  const c = mesh.coords, tri = mesh.triangles;
  const nv = c.length / 2;
  const val = new Float64Array(nv);
  let anyBad = false;
  for (let v = 0; v < nv; v++) {
    val[v] = f(ox + c[2 * v], oy + c[2 * v + 1]);
    if (val[v] === Infinity || val[v] === -Infinity) anyBad = true;
  }
  // edges that occur in two triangles are interior; only they are examined (a value at the boundary may be
  // infinite and still integrable, as log(x) at x = 0)
  const uses = new Map<number, number>();
  for (let i = 0; i < tri.length; i++) {
    const a = tri[i], b = tri[i % 3 === 2 ? i - 2 : i + 1];
    const key = Math.min(a, b) * nv + Math.max(a, b);
    uses.set(key, (uses.get(key) ?? 0) + 1);
  }
  if (anyBad) {
    const onBoundary = new Uint8Array(nv);
    for (const [key, n] of uses) if (n === 1) { onBoundary[Math.floor(key / nv)] = 1; onBoundary[key % nv] = 1; }
    for (let v = 0; v < nv; v++) {
      if ((val[v] === Infinity || val[v] === -Infinity) && !onBoundary[v]) return { x: ox + c[2 * v], y: oy + c[2 * v + 1], value: val[v] };
    }
  }
  for (let i = 0; i < tri.length; i++) {
    if (mesh.edgeCurve[i] >= 0) continue;
    const a = tri[i], b = tri[i % 3 === 2 ? i - 2 : i + 1];
    if (a > b || uses.get(a * nv + b) !== 2) continue;
    const fa = val[a], fb = val[b];
    if (!Number.isFinite(fa) || !Number.isFinite(fb) || !(fa * fb < 0)) continue;
    const ax = ox + c[2 * a], ay = oy + c[2 * a + 1], bx = ox + c[2 * b], by = oy + c[2 * b + 1];
    let lo = 0, hi = 1, flo = fa, fhi = fb;
    for (let k = 0; k < 80; k++) {
      const t = 0.5 * (lo + hi);
      const x = ax + (bx - ax) * t, y = ay + (by - ay) * t;
      const fm = f(x, y);
      if (Number.isNaN(fm)) break; // outside the function's domain: the quadrature points report NaN regions
      if (!Number.isFinite(fm)) return { x, y, value: fm };
      if (fm === 0) break;
      if ((fm < 0) === (flo < 0)) { lo = t; flo = fm; } else { hi = t; fhi = fm; }
      if (t === lo && t === hi) break;
    }
    const scale = Math.max(Math.abs(fa), Math.abs(fb));
    if (Math.min(Math.abs(flo), Math.abs(fhi)) > POLE_GROWTH * scale) {
      const t = 0.5 * (lo + hi);
      return { x: ax + (bx - ax) * t, y: ay + (by - ay) * t, value: Math.abs(flo) > Math.abs(fhi) ? flo : fhi };
    }
  }
  return null;
}

/** Throw an InputError naming `where` and the place when f has a pole inside the part. */
export function checkPoles(mesh: Mesh, f: (x: number, y: number) => number, where: string): void {
  const hit = findPole(mesh, f);
  if (!hit) return;
  const p = `(${hit.x.toFixed(1)}, ${hit.y.toFixed(1)})`;
  if (!Number.isFinite(hit.value)) throw new InputError(where, `is not a finite number at ${p} (${hit.value}); expected a finite value everywhere on the part`);
  throw new InputError(where, `is not a finite number at ${p}: it grows without bound there (a pole inside the part), so the integral does not exist`);
}
