/**
 * Peer processes for the whole-process benchmarks (invented geometry, timing only), written independently
 * of src/ (they import nothing from it):
 *
 *   node dist/tests/bench/peers.js tri FILE     read a panel part JSON (rectangle outline, round cut-outs),
 *                                               chord each hole with 64 chords, triangulate the boundary
 *                                               with Delaunator and restore every boundary edge with
 *                                               Constrainautor: what a mesh-based tool must do at least
 *   node dist/tests/bench/peers.js exact FILE   the same part's area, centroid and second moments by
 *                                               exact boundary integrals (rectangle minus discs, closed
 *                                               forms), after checking every hole lies inside the outline
 *                                               and clear of the others (box-grid neighbours): the
 *                                               physical limit of a command-line tool
 */
import { readFileSync } from 'node:fs';
import ConstrainautorModule from '@kninnug/constrainautor';
import Delaunator from 'delaunator';

const Constrainautor = ConstrainautorModule as unknown as new (del: Delaunator<ArrayLike<number>>) => { constrainOne(a: number, b: number): void };

interface PanelJson { outline: { rectangle: { corner: [number, number]; size: [number, number] } }; cutouts: { circle: { center: [number, number]; diameter: number } }[] }

const [mode, file] = process.argv.slice(2);
const doc = JSON.parse(readFileSync(file, 'utf8')) as PanelJson;
const [x0, y0] = doc.outline.rectangle.corner, [W, H] = doc.outline.rectangle.size;
const holes = doc.cutouts.map((c) => ({ x: c.circle.center[0], y: c.circle.center[1], r: c.circle.diameter / 2 }));

if (mode === 'tri') {
  const CH = 64;
  const n = 4 + CH * holes.length;
  const coords = new Float64Array(2 * n);
  coords.set([x0, y0, x0 + W, y0, x0 + W, y0 + H, x0, y0 + H]);
  let k = 4;
  for (const h of holes) for (let i = 0; i < CH; i++, k++) {
    const a = (2 * Math.PI * i) / CH;
    coords[2 * k] = h.x + h.r * Math.cos(a); coords[2 * k + 1] = h.y + h.r * Math.sin(a);
  }
  const d = new Delaunator(coords);
  const c = new Constrainautor(d);
  for (let i = 0; i < 4; i++) c.constrainOne(i, (i + 1) % 4);
  for (let j = 0; j < holes.length; j++) {
    const b = 4 + CH * j;
    for (let i = 0; i < CH; i++) c.constrainOne(b + i, b + ((i + 1) % CH));
  }
  process.stdout.write(JSON.stringify({ vertices: n, triangles: d.triangles.length / 3 }) + '\n');
} else if (mode === 'exact') {
  // validation: inside the outline, and no two holes closer than touching (grid of cells of the largest diameter)
  const cell = Math.max(...holes.map((h) => 2 * h.r));
  const grid = new Map<string, number[]>();
  holes.forEach((h, i) => {
    if (h.x - h.r <= x0 || h.x + h.r >= x0 + W || h.y - h.r <= y0 || h.y + h.r >= y0 + H) throw new Error(`hole ${i} leaves the outline`);
    const gx = Math.floor(h.x / cell), gy = Math.floor(h.y / cell);
    for (let dx = -1; dx <= 1; dx++) for (let dy = -1; dy <= 1; dy++) {
      for (const j of grid.get(`${gx + dx},${gy + dy}`) ?? []) {
        const o = holes[j];
        if (Math.hypot(o.x - h.x, o.y - h.y) <= o.r + h.r) throw new Error(`holes ${i} and ${j} overlap`);
      }
    }
    const key = `${gx},${gy}`;
    (grid.get(key) ?? grid.set(key, []).get(key)!).push(i);
  });
  // exact moments about the outline's centre: rectangle minus discs (πr², πr⁴/4 and parallel axes)
  const ox = x0 + W / 2, oy = y0 + H / 2;
  let A = W * H, Sx = 0, Sy = 0, Ixx = W ** 3 * H / 12, Iyy = W * H ** 3 / 12, Ixy = 0;
  for (const h of holes) {
    const a = Math.PI * h.r * h.r, u = h.x - ox, v = h.y - oy, i0 = Math.PI * h.r ** 4 / 4;
    A -= a; Sx -= a * u; Sy -= a * v; Ixx -= i0 + a * u * u; Iyy -= i0 + a * v * v; Ixy -= a * u * v;
  }
  const cx = Sx / A, cy = Sy / A;
  process.stdout.write(JSON.stringify({ area: A, centroidX: ox + cx, centroidY: oy + cy, Ix: Iyy - A * cy * cy, Iy: Ixx - A * cx * cx, Ixy: Ixy - A * cx * cy }) + '\n');
} else {
  throw new Error('usage: peers.js tri|exact FILE');
}
