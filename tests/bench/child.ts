/**
 * One benchmark measurement in a fresh process (for a clean peak-memory reading):
 *   node dist/tests/bench/child.js square N      → straight plate of about N vertices
 * Prints JSON { n, ms, greenMs, meshMs?, rssMB }.
 */
import { measureSection, preparePart } from '../../src/analysis/measure.js';
import { greenMoments } from './green.js';
import { squareHoles } from './cases.js';

const [kind, nArg] = process.argv.slice(2);
if (kind !== 'square') throw new Error('usage: child.js square N');
const raw = squareHoles(Number(nArg));
let n = 0;
for (const r of raw.regions) for (const l of [r.outer, ...r.holes]) n += l.segments.length;
const reps = n >= 1e6 ? 1 : n >= 1e5 ? 3 : 7;
const median = (fn: () => unknown, k = reps) => {
  const ts: number[] = [];
  for (let i = 0; i < k; i++) { const t = performance.now(); fn(); ts.push(performance.now() - t); }
  ts.sort((a, b) => a - b);
  return ts[ts.length >> 1];
};
// measure() from the part as read: validation, orientation and the moments (at 10^6 vertices a single
// cold run, so the peak memory is that of one measurement, not of a warm-up's garbage as well)
if (n < 1e6) measureSection(raw); // warm-up
const ms = median(() => measureSection(raw));
const prepared = preparePart(raw);
greenMoments(prepared);
const greenMs = median(() => greenMoments(prepared), Math.max(reps, 5));
const meshMs = n <= 1e5 ? median(() => measureSection(raw, { method: 'mesh' })) : undefined;
console.log(JSON.stringify({ n, ms, greenMs, meshMs, rssMB: process.resourceUsage().maxRSS / 1024 }));
