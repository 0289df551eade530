/**
 * The one interpretation step from a Drawing (SVG, DXF, GeoJSON, WKT) to parts. Readers only read; here the
 * same rules decide for every format:
 *
 * 1. Roles. Hidden contours are never cut (ignored, reason `hidden`). Contours on a skipped layer are ignored
 *    (`skipped-layer`); when cut layers are named, contours on other layers are ignored (`other-layer`) unless
 *    they are on a marking layer. Marking: open contours (`open-contour`), anything on a marking layer
 *    (`marking-layer`: the named ones, or by default a layer whose name has the word etch, etching, mark,
 *    marking, marks, engrave, engraving, scribe or scribing), anything in a marking colour (`marking-colour`).
 *    A closed contour on a marking layer is marking, never a hole. Everything else closed is cut.
 *    A layer (not named in any option) that holds both open and closed contours is refused: its role is
 *    ambiguous.
 * 2. Duplicates. Contours equal within the join tolerance (any start point and direction; same segments)
 *    are removed, the first kept, each removal reported with where it was.
 * 3. Overlaps. Cut contours that cross, touch or coincide are refused in one line naming both and a point
 *    where they meet. With `unite`, each group of crossing contours becomes one: at material level (even
 *    nesting depth) a member at least half of whose area lies inside a larger member it crosses is a
 *    cut-out (a notch) and is subtracted; the others are outlines and are united. At hole level (odd depth)
 *    crossing cut-outs are united into one cut-out. Exact curves are kept (src/geometry/booleans.ts).
 * 4. Nesting and parts. Depth 0, 2, … bound material, depth 1, 3, … are cut-outs of the loop around them.
 *    Each outer contour with its cut-outs is one part; `onePart` makes all of them one part.
 * 5. Material inside a cut-out (depth ≥ 2: a sheet border drawn around parts, or a part nested in another's
 *    hole) is refused by default, naming the enclosing outline; `sheetBorder: 'skip'` drops every outline
 *    that has material inside its cut-outs (the border), `sheetBorder: 'part'` keeps it as a part and the
 *    pieces inside as parts of their own.
 * 6. Marking lines are assigned to the part whose material holds their first point; their length is summed
 *    per part (`markingLength`). Marking off every part is counted (`marking-outside`).
 *
 * The result carries facts only (codes, counts, places); the output layer words them.
 */
import { InputError } from '../base/errors.js';
import { combineShapes } from '../geometry/booleans.js';
import { overlappingPairs } from '../geometry/boxgrid.js';
import { type Nesting, locatePoints, nestContours } from '../geometry/nesting.js';
import { type Loop, type Part, type Region, loopSignedArea, normalizePart, withLocalFrame } from '../geometry/part.js';
import { type Segment, ops, segmentEnd, segmentPoint, segmentStart } from '../geometry/segments.js';
import { mergedContour } from '../geometry/kinds/index.js';
import { intersect } from '../geometry/validate.js';
import type { Drawing, DrawingUnits, DrawnContour, JoinFinding } from './drawing.js';

export interface InterpretOptions {
  /** Only contours on these layers are cut (names compared without case). */
  cutLayers?: readonly string[];
  /** Contours on these layers are marking (replaces the default word list). */
  markLayers?: readonly string[];
  /** Contours on these layers are ignored. */
  skipLayers?: readonly string[];
  /** Contours in these colours are marking (SVG colour text, compared after normalising; DXF colour numbers). */
  markColours?: readonly (string | number)[];
  /** Unite crossing outlines and subtract cut-outs that cross them, instead of refusing. */
  unite?: boolean;
  /** All material in one part instead of one part per outer contour. */
  onePart?: boolean;
  /** Material inside a cut-out: 'refuse' (default), 'skip' the enclosing outlines, or take everything as 'part's. */
  sheetBorder?: 'refuse' | 'skip' | 'part';
}

/** Why a contour is not cut and not marking. */
export type IgnoreReason = 'hidden' | 'skipped-layer' | 'other-layer' | 'sheet-border';
export type MarkingReason = 'open-contour' | 'marking-layer' | 'marking-colour';
export type InterpretationWarning =
  | 'units-assumed' | 'units-assumed-mm' | 'hidden-content' | 'duplicates-removed' | 'foreign-content' | 'text-ignored'
  | 'marking-outside' | 'shapes-united' | 'open-contour-on-cut-layer' | 'css-selector-unsupported' | 'sheet-border-skipped';

export interface DuplicateNote { where: string; layer?: string; duplicateOf: string; x: number; y: number }
export interface UniteNote { into: string; united: string[]; subtracted: string[] }

export interface InterpretationSummary {
  format: Drawing['format'];
  units: DrawingUnits;
  /** Contours the reader produced. */
  contours: number;
  outlines: number;
  cutouts: number;
  marking: number;
  /** Counts by reason: contour-level (IgnoreReason) and element-level from the reader (text, foreign-namespace, …). */
  ignored: Record<string, number>;
  markingBy: Partial<Record<MarkingReason, number>>;
  duplicates: DuplicateNote[];
  united: UniteNote[];
  /** Marking contours whose first point is on no part's material. */
  markingOutside: string[];
  /** The tolerance used for duplicates and touching (drawing units). */
  tolerance: number;
  /** Gaps between loose ends that joining closed (DXF), each with its place and size. */
  gapsClosed: { x: number; y: number; gap: number; where: string; layer?: string }[];
  /** Loose entities that retrace each other or branch (DXF joining), each with its place. */
  joinFindings: JoinFinding[];
  parts: { name: string; outlines: number; cutouts: number; markings: number; markingLength: number }[];
  warnings: InterpretationWarning[];
}

/** Geometry that is not cut, for drawings: marking lines and ignored contours (hidden, skipped, other layers, borders). */
export interface NotCut { marking: Segment[][]; ignored: Segment[][] }

export interface Interpretation { parts: Part[]; summary: InterpretationSummary; notCut: NotCut }

/** Words that make a layer a marking layer by default (whole words of its name, any case). */
export const DEFAULT_MARK_LAYER_WORDS: readonly string[] = ['etch', 'etching', 'mark', 'marking', 'marks', 'engrave', 'engraving', 'scribe', 'scribing'];

const fmt = (v: number) => Number(v.toPrecision(6)).toString();
const placeOf = (c: DrawnContour) => (c.layer !== undefined ? `${c.where} (layer ${c.layer})` : c.where);

/** Colour text in one form: lower case, #rgb → #rrggbb, rgb(r, g, b) → #rrggbb; numbers as they are. */
export function normaliseColour(c: string | number): string {
  if (typeof c === 'number') return String(c);
  const s = c.trim().toLowerCase();
  let m = /^#([0-9a-f])([0-9a-f])([0-9a-f])$/.exec(s);
  if (m) return `#${m[1]}${m[1]}${m[2]}${m[2]}${m[3]}${m[3]}`;
  m = /^rgb\(\s*(\d+)\s*,?\s*(\d+)\s*,?\s*(\d+)\s*\)$/.exec(s);
  if (m) return `#${[m[1], m[2], m[3]].map((v) => Math.min(255, Number(v)).toString(16).padStart(2, '0')).join('')}`;
  const named: Record<string, string> = { black: '#000000', white: '#ffffff', red: '#ff0000', lime: '#00ff00', blue: '#0000ff', yellow: '#ffff00', cyan: '#00ffff', aqua: '#00ffff', magenta: '#ff00ff', fuchsia: '#ff00ff', green: '#008000', gray: '#808080', grey: '#808080', orange: '#ffa500' };
  return named[s] ?? s;
}

const lower = (xs: readonly string[] | undefined) => (xs ? new Set(xs.map((x) => x.toLowerCase())) : undefined);

function isDefaultMarkLayer(layer: string): boolean {
  return layer.toLowerCase().split(/[^a-z0-9]+/).some((w) => DEFAULT_MARK_LAYER_WORDS.includes(w));
}

function contourLength(segs: readonly Segment[]): number {
  let s = 0;
  for (const g of segs) s += ops(g).length(g);
  return s;
}

// -------------------------------------------------------------------------------------------------
// duplicates

type P2 = readonly [number, number];
const near = (a: P2, b: P2, tol: number) => Math.abs(a[0] - b[0]) <= tol && Math.abs(a[1] - b[1]) <= tol;

/** Points that fix a segment's shape whatever its direction: ends (unordered), middle, and quarter points for curves. */
function segmentKey(s: Segment): { ends: [P2, P2]; mid: P2; quarters?: [P2, P2] } {
  const k: { ends: [P2, P2]; mid: P2; quarters?: [P2, P2] } = { ends: [segmentStart(s), segmentEnd(s)], mid: segmentPoint(s, 0.5) };
  if (s.kind !== 'line') k.quarters = [segmentPoint(s, 0.25), segmentPoint(s, 0.75)];
  return k;
}

/** Same contour within tol: the same segments (each matched once) whatever the start point and direction. */
function sameContour(a: readonly Segment[], b: readonly Segment[], tol: number): boolean {
  if (a.length !== b.length) return false;
  const kb = b.map(segmentKey);
  const order = kb.map((_, i) => i).sort((i, j) => kb[i].mid[0] - kb[j].mid[0]);
  const xs = order.map((i) => kb[i].mid[0]);
  const used = new Uint8Array(b.length);
  for (const s of a) {
    const k = segmentKey(s);
    // first index with mid x ≥ k.mid[0] − tol
    let lo = 0, hi = xs.length;
    while (lo < hi) { const m = (lo + hi) >> 1; if (xs[m] < k.mid[0] - tol) lo = m + 1; else hi = m; }
    let hit = -1;
    for (let p = lo; p < xs.length && xs[p] <= k.mid[0] + tol; p++) {
      const j = order[p];
      if (used[j]) continue;
      const q = kb[j];
      if (!near(k.mid, q.mid, tol)) continue;
      const fwd = near(k.ends[0], q.ends[0], tol) && near(k.ends[1], q.ends[1], tol);
      const bwd = near(k.ends[0], q.ends[1], tol) && near(k.ends[1], q.ends[0], tol);
      if (!fwd && !bwd) continue;
      if (k.quarters) {
        if (!q.quarters) continue;
        const ok = fwd ? near(k.quarters[0], q.quarters[0], tol) && near(k.quarters[1], q.quarters[1], tol)
          : near(k.quarters[0], q.quarters[1], tol) && near(k.quarters[1], q.quarters[0], tol);
        if (!ok) continue;
      } else if (q.quarters) continue;
      hit = j;
      break;
    }
    if (hit < 0) return false;
    used[hit] = 1;
  }
  return true;
}

/**
 * The same closed contour drawn with other splits (a circle as two arcs or as four, an edge in two pieces):
 * compare the contours with runs on one line or one circle merged. A contour that merges into one closed
 * segment (a full circle or ellipse) is compared by its box (already equal), enclosed area and length.
 */
function sameMerged(a: readonly Segment[], b: readonly Segment[], tol: number): boolean {
  const ma = mergedContour(a, tol), mb = mergedContour(b, tol);
  if (ma.length === 1 && mb.length === 1) {
    const sa = ma[0], sb = mb[0];
    const la = ops(sa).length(sa), lb = ops(sb).length(sb);
    return Math.abs(la - lb) <= 4 * tol && Math.abs(Math.abs(ops(sa).areaTerm(sa)) - Math.abs(ops(sb).areaTerm(sb))) <= 2 * tol * Math.max(la, lb);
  }
  return sameContour(ma, mb, tol);
}

function contourBox(segs: readonly Segment[]): [number, number, number, number] {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const s of segs) {
    const b = ops(s).bbox(s);
    if (b[0] < x0) x0 = b[0];
    if (b[1] < y0) y0 = b[1];
    if (b[2] > x1) x1 = b[2];
    if (b[3] > y1) y1 = b[3];
  }
  return [x0, y0, x1, y1];
}

// -------------------------------------------------------------------------------------------------

interface Item { c: DrawnContour; index: number; box: [number, number, number, number] }
/**
 * The part held about the drawing's origin when every one of its loops is a contour as drawn whose reader
 * gave its local segments (a united or subtracted loop is new and has none: the part then goes without).
 */
function localRegions(part: Part, local: ReadonlyMap<Loop, Segment[]>): Region[] | null {
  const out: Region[] = [];
  const twin = (l: Loop): Loop | null => {
    const segs = local.get(l);
    return segs === undefined ? null : { ...l, segments: segs };
  };
  for (const r of part.regions) {
    const outer = twin(r.outer);
    const holes = r.holes.map(twin);
    if (outer === null || holes.some((h) => h === null)) return null;
    out.push({ outer, holes: holes as Loop[] });
  }
  return out;
}

interface RegionNote { region: Region; name: string | undefined; markingLength: number; markings: number }

class UnionFind {
  private readonly p: Int32Array;
  constructor(n: number) { this.p = new Int32Array(n).map((_, i) => i); }
  find(i: number): number { while (this.p[i] !== i) { this.p[i] = this.p[this.p[i]]; i = this.p[i]; } return i; }
  union(a: number, b: number): void { const ra = this.find(a), rb = this.find(b); if (ra !== rb) this.p[Math.max(ra, rb)] = Math.min(ra, rb); }
}

/** Apply the shared rules to a drawing. Throws InputError (one line, naming the place) when a rule refuses. */
export function interpretDrawing(drawing: Drawing, options: InterpretOptions = {}): Interpretation {
  const cutLayers = lower(options.cutLayers), markLayers = lower(options.markLayers), skipLayers = lower(options.skipLayers);
  const markColours = options.markColours ? new Set(options.markColours.map(normaliseColour)) : undefined;
  const ignored: Record<string, number> = { ...drawing.ignored };
  const bump = (k: string) => { ignored[k] = (ignored[k] ?? 0) + 1; };
  const markingBy: Partial<Record<MarkingReason, number>> = {};
  const warnings = new Set<InterpretationWarning>();
  const cut: Item[] = [], mark: Item[] = [];
  const notCut: NotCut = { marking: [], ignored: [] };
  const markingReasonOf = new Map<Item, MarkingReason>();
  const localOf = new Map<Loop, Segment[]>();
  const heldAboutOrigin = (p: Part): Part => {
    if (drawing.origin === undefined) return p;
    const local = localRegions(p, localOf);
    return local === null ? p : withLocalFrame(p, drawing.origin, local);
  };

  // 0. joints that almost meet: an outline with a gap just over the join tolerance is never taken silently as a
  //    marking line (that would drop the plate's material); a gap on a marking or skipped layer does not matter
  for (const g of drawing.join?.gaps ?? []) {
    if (g.closed || !(g.gap > 0)) continue;
    const lay = g.layer?.toLowerCase();
    if (lay !== undefined && (skipLayers?.has(lay) || (markLayers ? markLayers.has(lay) : isDefaultMarkLayer(g.layer!)))) continue;
    if (cutLayers && !(lay !== undefined && cutLayers.has(lay))) continue;
    const tol = drawing.join!.tolerance;
    throw new InputError(g.where + (g.layer !== undefined ? ` (layer ${g.layer})` : ''),
      `the contour is open: two ends are ${fmt(g.gap)} apart near (${fmt(g.x)}, ${fmt(g.y)}), more than the join tolerance ${fmt(tol)}; close the gap in the drawing, or give --join-tolerance ${fmt(g.gap * 1.5)} to join it`);
  }
  const gapsClosed = (drawing.join?.gaps ?? []).filter((g) => g.closed);

  // 1. roles
  const layerOpen = new Map<string, DrawnContour>(), layerClosed = new Map<string, DrawnContour>();
  drawing.contours.forEach((c, index) => {
    if (c.segments.length === 0) return;
    const lay = c.layer?.toLowerCase();
    if (c.hidden !== undefined) { bump('hidden'); warnings.add('hidden-content'); notCut.ignored.push(c.segments); return; }
    if (lay !== undefined && skipLayers?.has(lay)) { bump('skipped-layer'); notCut.ignored.push(c.segments); return; }
    const onMarkLayer = lay !== undefined && (markLayers ? markLayers.has(lay) : isDefaultMarkLayer(c.layer!));
    const inMarkColour = markColours !== undefined && c.colour !== undefined && markColours.has(normaliseColour(c.colour));
    const item: Item = { c, index, box: contourBox(c.segments) };
    if (cutLayers && !onMarkLayer && !(lay !== undefined && cutLayers.has(lay)) && !inMarkColour) { bump('other-layer'); notCut.ignored.push(c.segments); return; }
    let reason: MarkingReason | undefined;
    if (onMarkLayer) reason = 'marking-layer';
    else if (inMarkColour) reason = 'marking-colour';
    else if (!c.closed) {
      reason = 'open-contour';
      if (lay !== undefined && cutLayers?.has(lay)) warnings.add('open-contour-on-cut-layer');
    }
    if (reason) { markingBy[reason] = (markingBy[reason] ?? 0) + 1; mark.push(item); markingReasonOf.set(item, reason); notCut.marking.push(c.segments); } else cut.push(item);
    if (lay !== undefined && !onMarkLayer && !inMarkColour && !cutLayers?.has(lay)) {
      if (c.closed) { if (!layerClosed.has(lay)) layerClosed.set(lay, c); } else if (!layerOpen.has(lay)) layerOpen.set(lay, c);
    }
  });
  // a stretch of loose entities drawn twice over leaves an open piece behind on a cut layer: that is a drawing
  // fault, not a marking line (a whole contour drawn twice is no open piece: it is removed as a duplicate below)
  for (const f of drawing.join?.findings ?? []) {
    if (f.finding !== 'overlap' || !f.sources) continue;
    const hit = mark.find((it) => !it.c.closed && markingReasonOf.get(it) === 'open-contour' && it.c.sources?.some((h) => f.sources!.includes(h)));
    if (!hit) continue;
    throw new InputError(f.where + (f.layer !== undefined ? ` (layer ${f.layer})` : ''),
      `drawn twice over: these entities retrace each other for ${fmt(f.length ?? 0)} near (${fmt(f.x)}, ${fmt(f.y)}); delete the extra entity in the drawing, or move it to a layer you skip`);
  }
  for (const [lay, open] of layerOpen) {
    const closed = layerClosed.get(lay);
    if (closed) {
      throw new InputError(`layer ${open.layer}`, `holds open contours (marking, e.g. ${open.where}) and closed ones (cut, e.g. ${closed.where}); name the layer among the marking layers or the cut layers`);
    }
  }

  // tolerance: the reader's join tolerance, else 1e-9 of the drawing's extent, and never below the round-off
  // of its coordinates (1e-13 of the largest magnitude: about 450 units in the last place of a double, room
  // for the few rounded operations of a reader's transforms)
  let big = 0, x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const it of [...cut, ...mark]) {
    for (const v of it.box) big = Math.max(big, Math.abs(v));
    x0 = Math.min(x0, it.box[0]); y0 = Math.min(y0, it.box[1]); x1 = Math.max(x1, it.box[2]); y1 = Math.max(y1, it.box[3]);
  }
  const extent = Math.max(x1 - x0, y1 - y0);
  const tol = drawing.join?.tolerance ?? Math.max(1e-9 * (extent > 0 ? extent : 1), 1e-13 * big);

  const duplicates: DuplicateNote[] = [];
  const united: UniteNote[] = [];
  const markingOutside: string[] = [];
  let cutouts = 0, markCount = 0;
  const solve = (cutIn: Item[], markIn: Item[]): RegionNote[] => {
    // 2. duplicates (within each role)
    const dedupe = (items: Item[]): Item[] => {
      const n = items.length;
      const boxes = new Float64Array(4 * n);
      items.forEach((it, i) => boxes.set([it.box[0] - tol, it.box[1] - tol, it.box[2] + tol, it.box[3] + tol], 4 * i));
      const gone = new Uint8Array(n);
      const pairs: [number, number][] = [];
      overlappingPairs(boxes, (i, j) => {
        const a = items[i].box, b = items[j].box;
        if (Math.abs(a[0] - b[0]) <= tol && Math.abs(a[1] - b[1]) <= tol && Math.abs(a[2] - b[2]) <= tol && Math.abs(a[3] - b[3]) <= tol) pairs.push([i, j]);
      });
      pairs.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
      for (const [i, j] of pairs) {
        if (gone[i] || gone[j]) continue;
        const a = items[i].c, b = items[j].c;
        if (a.closed !== b.closed || !(sameContour(a.segments, b.segments, tol) || (a.closed && sameMerged(a.segments, b.segments, tol)))) continue;
        gone[j] = 1;
        const [x, y] = segmentStart(b.segments[0]);
        const note: DuplicateNote = { where: b.where, duplicateOf: a.where, x, y };
        if (b.layer !== undefined) note.layer = b.layer;
        duplicates.push(note);
      }
      return items.filter((_, i) => !gone[i]);
    };
    let cutItems = dedupe(cutIn);
    const markItems = dedupe(markIn);
    markCount += markItems.length;
    if (duplicates.length > 0) warnings.add('duplicates-removed');

    // 3. crossings between cut contours
    let loops: Loop[] = cutItems.map((it) => ({ segments: it.c.segments, where: it.c.where }));
    // loops that stay as drawn keep the segments their reader held about the drawing's origin
    loops.forEach((l, i) => { if (cutItems[i].c.local !== undefined) localOf.set(l, cutItems[i].c.local!); });
    const crossings = findCrossings(loops, tol);
    if (crossings.length > 0) {
      if (!options.unite) {
        const [i, j, x, y] = crossings[0];
        throw new InputError(placeOf(cutItems[i].c), `crosses, touches or coincides with ${placeOf(cutItems[j].c)} at (${fmt(x)}, ${fmt(y)}); cut contours must lie apart: redraw them as one outline, or let overlapping outlines be united (and cut-outs across them subtracted)`);
      }
      warnings.add('shapes-united');
      const uf = new UnionFind(loops.length);
      const partners = new Map<number, Set<number>>();
      for (const [i, j] of crossings) {
        uf.union(i, j);
        if (!partners.has(i)) partners.set(i, new Set());
        if (!partners.has(j)) partners.set(j, new Set());
        partners.get(i)!.add(j); partners.get(j)!.add(i);
      }
      const clusters = new Map<number, number[]>();
      for (const i of partners.keys()) {
        const r = uf.find(i);
        const list = clusters.get(r);
        if (list) list.push(i); else clusters.set(r, [i]);
      }
      const pre = nestContours(loops, (i, j) => partners.has(i) && partners.has(j) && uf.find(i) === uf.find(j));
      const area = loops.map((l) => Math.abs(loopSignedArea(l)));
      const replaced = new Set<number>();
      const added: { loop: Loop; item: Item }[] = [];
      for (const members of [...clusters.values()].sort((a, b) => Math.min(...a) - Math.min(...b))) {
        members.sort((a, b) => area[b] - area[a] || a - b);
        const base = members[0];
        const materialLevel = pre.depth[base] % 2 === 0;
        const add: Loop[] = [], cutouts: Loop[] = [];
        for (const k of members.slice(1)) {
          if (!materialLevel) { add.push(loops[k]); continue; }
          // the largest partner it crosses that is at least as large
          let big = -1;
          for (const q of partners.get(k)!) if (area[q] >= area[k] && (big < 0 || area[q] > area[big])) big = q;
          if (big < 0) { add.push(loops[k]); continue; }
          const u = combineShapes({ outline: loops[big], add: [loops[k]] });
          const uArea = Math.abs(loopSignedArea(u.outer)) - u.holes.reduce((s, h) => s + Math.abs(loopSignedArea(h)), 0);
          const insideFraction = (area[k] + area[big] - uArea) / area[k];
          if (insideFraction >= 0.5 - 1e-9) cutouts.push(loops[k]); else add.push(loops[k]);
        }
        const region = combineShapes({ outline: loops[base], add, cutouts });
        const into = loops[base].where ?? `contour ${base}`;
        united.push({ into, united: [into, ...add.map((l) => l.where ?? '')], subtracted: cutouts.map((l) => l.where ?? '') });
        for (const k of members) replaced.add(k);
        const baseItem = cutItems[base];
        added.push({ loop: { ...region.outer, where: into }, item: baseItem });
        region.holes.forEach((h, k) => added.push({ loop: { ...h, where: `${into} cut-out ${k + 1}` }, item: { ...baseItem, c: { ...baseItem.c, name: undefined } } }));
      }
      const keep = loops.map((_, i) => i).filter((i) => !replaced.has(i));
      loops = [...keep.map((i) => loops[i]), ...added.map((a) => a.loop)];
      cutItems = [...keep.map((i) => cutItems[i]), ...added.map((a) => a.item)];
      const again = findCrossings(loops, tol);
      if (again.length > 0) {
        const [i, j, x, y] = again[0];
        throw new InputError(loops[i].where ?? 'contour', `still crosses or touches ${loops[j].where ?? 'contour'} at (${fmt(x)}, ${fmt(y)}) after uniting`);
      }
    }

    // 4./5. nesting, material inside cut-outs
    let nest = nestContours(loops);
    const borders = (n: Nesting): number[] => {
      const out = new Set<number>();
      for (let i = 0; i < loops.length; i++) {
        if (n.depth[i] < 2 || n.depth[i] % 2 !== 0) continue;
        let a = i;
        while (n.parent[a] >= 0) a = n.parent[a];
        out.add(a);
      }
      return [...out].sort((a, b) => a - b);
    };
    const enclosing = borders(nest);
    if (enclosing.length > 0) {
      const mode = options.sheetBorder ?? 'refuse';
      if (mode === 'refuse') {
        const b = enclosing[0];
        let island = -1;
        for (let i = 0; i < loops.length; i++) {
          if (nest.depth[i] < 2 || nest.depth[i] % 2 !== 0) continue;
          let a = i;
          while (nest.parent[a] >= 0) a = nest.parent[a];
          if (a === b) { island = i; break; }
        }
        const hole = nest.parent[island];
        throw new InputError(placeOf(cutItems[b].c), `encloses ${placeOf(cutItems[hole].c)} which holds ${placeOf(cutItems[island].c)}: material inside a cut-out, as when a sheet border is drawn around the parts; skip the border's layer, or choose to skip enclosing outlines or to take every piece as a part`);
      }
      if (mode === 'skip') {
        const drop = new Set(enclosing);
        for (let k = 0; k < enclosing.length; k++) { bump('sheet-border'); notCut.ignored.push(cutItems[enclosing[k]].c.segments); }
        warnings.add('sheet-border-skipped');
        loops = loops.filter((_, i) => !drop.has(i));
        cutItems = cutItems.filter((_, i) => !drop.has(i));
        nest = nestContours(loops);
      }
    }
    // GeoJSON/WKT: a declared hole must nest directly in its own polygon's outline
    const ringOwner = new Map<string, number>();
    cutItems.forEach((it, i) => { if (it.c.ring?.index === 0) ringOwner.set(it.c.ring.polygon, i); });
    cutItems.forEach((it, i) => {
      const r = it.c.ring;
      if (!r || r.index === 0) return;
      const owner = ringOwner.get(r.polygon);
      if (owner === undefined || nest.parent[i] !== owner || nest.depth[i] % 2 !== 1) {
        throw new InputError(it.c.where, `is a hole of ${owner !== undefined ? cutItems[owner].c.where : `polygon ${r.polygon}`} but does not lie inside that outline alone; a hole must be inside its own outline and apart from other rings`);
      }
    });

    // regions
    const regionOf = new Map<number, number>();
    const regions: RegionNote[] = [];
    loops.forEach((l, i) => {
      if (nest.depth[i] % 2 === 0) { regionOf.set(i, regions.length); regions.push({ region: { outer: l, holes: [] }, name: cutItems[i].c.name, markingLength: 0, markings: 0 }); }
    });
    loops.forEach((l, i) => {
      if (nest.depth[i] % 2 === 1) { regions[regionOf.get(nest.parent[i])!].region.holes.push(l); cutouts++; }
    });

    // 6. marking lines onto parts
    if (markItems.length > 0) {
      const where = locatePoints(markItems.map((it) => segmentPoint(it.c.segments[0], 0.5)), loops, nest);
      markItems.forEach((it, k) => {
        const i = where[k];
        if (i < 0 || nest.depth[i] % 2 !== 0) { markingOutside.push(placeOf(it.c)); return; }
        const r = regions[regionOf.get(i)!];
        r.markingLength += contourLength(it.c.segments);
        r.markings++;
      });
      if (markingOutside.length > 0) warnings.add('marking-outside');
    }
    return regions;
  };

  // formats that group contours (GeoJSON features, WKT geometries): each group is read on its own, so that
  // separate features may overlap in space (each is its own plate)
  const groupKeys: (string | undefined)[] = [];
  const byGroup = new Map<string | undefined, { cut: Item[]; mark: Item[] }>();
  const slot = (it: Item) => {
    const k = it.c.group;
    let g = byGroup.get(k);
    if (!g) { g = { cut: [], mark: [] }; byGroup.set(k, g); groupKeys.push(k); }
    return g;
  };
  for (const it of cut) slot(it).cut.push(it);
  for (const it of mark) slot(it).mark.push(it);
  const regions: RegionNote[] = [];
  for (const k of groupKeys) { const g = byGroup.get(k)!; regions.push(...solve(g.cut, g.mark)); }

  if (regions.length === 0) {
    const open = mark.find((it) => !it.c.closed);
    if (open) {
      const [sx, sy] = segmentStart(open.c.segments[0]);
      const [ex, ey] = segmentEnd(open.c.segments[open.c.segments.length - 1]);
      throw new InputError(placeOf(open.c), `open contour: it ends at (${fmt(ex)}, ${fmt(ey)}), not at its start (${fmt(sx)}, ${fmt(sy)}), and the drawing has no closed contour to cut; an open contour is a marking line: close the outline (end a path with Z) to cut it`);
    }
    throw new InputError(drawing.format === 'svg' ? 'svg' : drawing.label, `expected at least one closed contour to cut, found none (${mark.length > 0 ? `${mark.length} marking contour(s)` : 'no drawn contours'}${Object.keys(ignored).length > 0 ? `; ignored: ${Object.entries(ignored).map(([k, v]) => `${k} ${v}`).join(', ')}` : ''})`);
  }

  // parts and names
  const units = drawing.units;
  const nameBase = (ri: number): string | undefined => regions[ri].name;
  const groups: number[][] = options.onePart ? [regions.map((_, i) => i)] : regions.map((_, i) => [i]);
  const used = new Map<string, number>();
  // a name from the drawing, else the file's own name (not the folders it was found in)
  const fallback = drawing.name ?? (drawing.label.split(/[\\/]/).pop() || drawing.label);
  const parts: Part[] = [];
  const partNotes: InterpretationSummary['parts'] = [];
  groups.forEach((g, k) => {
    const base = (options.onePart ? drawing.name : nameBase(g[0])) ?? (groups.length === 1 ? fallback : `${fallback}-${k + 1}`);
    const seen = used.get(base) ?? 0;
    used.set(base, seen + 1);
    const name = seen === 0 ? base : `${base}-${seen + 1}`;
    const markingLength = g.reduce((s, ri) => s + regions[ri].markingLength, 0);
    const part: Part = normalizePart(heldAboutOrigin({ name, units: units.unit, regions: g.map((ri) => regions[ri].region), unitSource: units.source, markingLength }));
    parts.push(part);
    partNotes.push({
      name,
      outlines: g.length,
      cutouts: g.reduce((s, ri) => s + regions[ri].region.holes.length, 0),
      markings: g.reduce((s, ri) => s + regions[ri].markings, 0),
      markingLength,
    });
  });
  // SVG user units are CSS pixels when nothing says otherwise; GeoJSON and WKT coordinates are taken as mm
  if (units.source === 'assumed') warnings.add(units.detail?.assumed === 'css-px' ? 'units-assumed' : 'units-assumed-mm');
  if ((ignored['foreign-namespace'] ?? 0) > 0) warnings.add('foreign-content');
  if ((ignored.text ?? 0) > 0) warnings.add('text-ignored');
  if ((ignored['css-selector-unsupported'] ?? 0) > 0) warnings.add('css-selector-unsupported');

  const summary: InterpretationSummary = {
    format: drawing.format,
    units,
    contours: drawing.contours.length,
    outlines: regions.length,
    cutouts,
    marking: markCount,
    ignored,
    markingBy,
    duplicates,
    united,
    markingOutside,
    tolerance: tol,
    gapsClosed: gapsClosed.map((g) => ({ x: g.x, y: g.y, gap: g.gap, where: g.where, layer: g.layer })),
    joinFindings: drawing.join?.findings ?? [],
    parts: partNotes,
    warnings: [...warnings].sort(),
  };
  return { parts, summary, notCut };
}

/**
 * Pairs of different loops that cross, touch or coincide (within tol), with a point where they meet:
 * candidate segment pairs from the box grid, exact intersections (src/geometry/validate.ts `intersect`).
 */
function findCrossings(loops: readonly Loop[], tol: number): [number, number, number, number][] {
  let n = 0;
  for (const l of loops) n += l.segments.length;
  const boxes = new Float64Array(4 * n);
  const owner = new Int32Array(n);
  const segs: Segment[] = new Array(n);
  let k = 0;
  loops.forEach((l, li) => {
    for (const s of l.segments) {
      const b = ops(s).bbox(s);
      boxes[4 * k] = b[0] - tol; boxes[4 * k + 1] = b[1] - tol; boxes[4 * k + 2] = b[2] + tol; boxes[4 * k + 3] = b[3] + tol;
      owner[k] = li; segs[k] = s; k++;
    }
  });
  const found = new Map<string, [number, number, number, number]>();
  overlappingPairs(boxes, (i, j) => {
    const a = owner[i], b = owner[j];
    if (a === b) return;
    const key = a < b ? `${a},${b}` : `${b},${a}`;
    if (found.has(key)) return;
    const hits = intersect(segs[i], segs[j], tol);
    if (hits.length > 0) found.set(key, a < b ? [a, b, hits[0].x, hits[0].y] : [b, a, hits[0].x, hits[0].y]);
  });
  return [...found.values()].sort((p, q) => p[0] - q[0] || p[1] - q[1]);
}
