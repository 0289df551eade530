/**
 * The drawing: what a drawing reader (SVG, DXF) hands to the one interpretation step that decides what
 * is cut, what is marking and what is ignored, removes duplicates, refuses (or unites) overlaps and
 * groups contours into parts. Readers only read: they resolve transforms, units and visibility and
 * report every contour exactly, with where it came from; they never decide roles or nesting.
 */
import type { Segment } from '../geometry/segments.js';
import type { LengthUnit } from '../base/units.js';

/** Where the length unit came from: stated by the file, chosen by the user, or assumed (with a warning). */
export type UnitSource = 'file' | 'option' | 'assumed';

export interface DrawingUnits {
  unit: LengthUnit;
  source: UnitSource;
  /** What the file said or what was assumed, as facts (e.g. { insunits: 4 } or { assumed: 'css-px' }). */
  detail?: Record<string, string | number>;
}

/** Why a contour is hidden: hidden content is never cut. */
export type HiddenReason = 'display-none' | 'visibility-hidden' | 'layer-off' | 'layer-frozen';

export interface DrawnContour {
  /** Exact segments in drawing units, after every transform; each starts where the previous ends. */
  segments: Segment[];
  /** True when the last segment ends where the first starts (within the reader's join tolerance). */
  closed: boolean;
  /** Layer (DXF layer, SVG layer group label or id) or undefined. */
  layer?: string;
  /** Colour as the drawing states it (DXF ACI number or true colour, SVG stroke/fill text). */
  colour?: number | string;
  /** Location for messages: "svg path#outline", "dxf LINE #2F layer CUT" … */
  where: string;
  /** Entity handles or element ids that make up this contour (DXF loose entities joined into one). */
  sources?: string[];
  /** A name the drawing gives this contour or its group (SVG <title>, group label, DXF block name). */
  name?: string;
  hidden?: HiddenReason;
  /**
   * Formats that state which ring is an outline and which a hole (GeoJSON, WKT): the polygon this ring
   * belongs to (a key unique in the drawing) and its index there (0 the outline, 1… the holes). The
   * interpretation still nests by geometry and refuses a hole that does not nest in its own outline.
   */
  ring?: { polygon: string; index: number };
  /** Formats that group polygons (GeoJSON features): a key shared by the contours of one group. */
  group?: string;
  /**
   * The same segments held about `Drawing.origin` (x − origin), built there by the reader so that constructed
   * points (arc centres, transformed coordinates) keep the digits site coordinates cannot hold; segment for
   * segment like `segments`. Parts made of such contours are held about that point (LocalFrame).
   */
  local?: Segment[];
}

/** A gap between loose ends that the joining step closed, or could not close. */
export interface JoinGap {
  x: number; y: number;
  /** Distance between the two ends (0 for a dangling end: `closed` false). */
  gap: number;
  closed: boolean;
  where: string;
  layer?: string;
}

/** Loose entities that retrace each other (a stretch drawn twice, an entity duplicated) or branch at a joint. */
export interface JoinFinding {
  finding: 'overlap' | 'duplicate' | 'branch';
  x: number; y: number;
  /** Length of the retraced stretch (overlap), in drawing units. */
  length?: number;
  where: string;
  layer?: string;
  /** Entity handles (as in DrawnContour.sources) of the pieces involved. */
  sources?: string[];
}

export interface Drawing {
  format: 'svg' | 'dxf' | 'geojson' | 'wkt' | 'part-json';
  /** File name or "stdin". */
  label: string;
  units: DrawingUnits;
  contours: DrawnContour[];
  /** Counts of what the reader skipped, by reason key ("text", "dimension", "hatch", "point", "paper-space", …). */
  ignored: Record<string, number>;
  /** Joining of loose entities: tolerance used, every gap met, and entities drawn twice or branching. */
  join?: { tolerance: number; gaps: JoinGap[]; findings?: JoinFinding[] };
  /** A name for the whole drawing (SVG <title> of the root), if any. */
  name?: string;
  /** The exactly representable point that contours' `local` segments are held about, when they are. */
  origin?: [number, number];
}
