/**
 * Torsion bench: J, shear centre and Iw of a plate with curved edges meshed into about 10^4 curved-map
 * triangles (fine level), whole process (node start to exit). Run: npm run bench builds it; then
 *   node dist/tests/bench/torsion.js [minTriangles]
 * Prints triangles, unknowns, iterations and the times of mesh + both solves.
 */
import { measureTorsion } from '../../src/analysis/torsion.js';
import { partFromObject } from '../../src/read/partJson.js';

const t0 = performance.now();
const minTriangles = Number(process.argv[2] ?? 2500);
const cut = [];
for (let i = 0; i < 6; i++) cut.push({ circle: { center: [40 + 60 * i, 60], diameter: 22 } });
const part = partFromObject({ outline: { path: { start: [0, 0], segments: [{ to: [400, 0] }, { to: [400, 120] }, { to: [300, 120], center: [350, 120], turn: 'ccw' }, { to: [0, 120] }] } }, cutouts: cut });
const order = Number(process.argv[3] ?? 3);
const r = measureTorsion(part, { minTriangles, order });
const t1 = performance.now();
console.log(`torsion order ${order}: ${r.method.triangles} triangles (${r.method.curvedTriangles} curved), ${r.method.unknowns} unknowns, ${r.method.iterations} CG iterations; J = ${r.quantities.J.value.toPrecision(10)} ± ${r.quantities.J.error.toExponential(1)}; in-process ${(t1 - t0).toFixed(0)} ms; rss ${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MiB`);
