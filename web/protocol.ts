/** Messages between the page (web/page.ts) and its worker (web/worker.ts): plain data only. */

/**
 * A file card's settings as typed (the worker parses them with the library's own grammar): the command line's
 * --thickness, --material, --density, the pieces, --units ('' for what the drawing says), the mass units ('' =
 * kg with kg·m², else a key of MASS_CHOICES in web/worker.ts: --mass-unit with --inertia-unit), and the drawing
 * options --cut-layers, --mark-layers, --skip-layers (comma-separated), --join-tolerance and --unite ('yes' or '').
 */
export interface FileSettings {
  thickness: string; material: string; density: string; quantity: number; units: string; massUnits: string;
  cutLayers: string; markLayers: string; skipLayers: string; joinTolerance: string; unite: string;
}

/** A new card's settings: nothing given, one piece. */
export const NO_SETTINGS: Readonly<FileSettings> = {
  thickness: '', material: '', density: '', quantity: 1, units: '', massUnits: '',
  cutLayers: '', markLayers: '', skipLayers: '', joinTolerance: '', unite: '',
};

/** The settings that change how the drawing is read (a refusal of one falls back to the file as it says). */
export const READING_SETTINGS = ['units', 'cutLayers', 'markLayers', 'skipLayers', 'joinTolerance', 'unite'] as const;

export type ToWorker = { id: number } & (
  // sent once by web/start.js (id 0) before anything else: the CSS packages' code, loaded on first use
  | { op: 'css-packages'; code: Blob }
  | { op: 'hold'; key: number; name: string; bytes: ArrayBuffer; settings: FileSettings }
  | { op: 'settings'; key: number; settings: FileSettings }
  | { op: 'drop'; key: number }
  | { op: 'measure'; key: number }
  | { op: 'draw'; key: number }
  | { op: 'batch'; keys: number[] }
  | { op: 'report'; key: number }
  | { op: 'compare'; key: number; name: string; bytes: ArrayBuffer }
  | { op: 'materials' }
  // the command line's --materials-file: a user's materials file for every file of the page (null bytes: forget it)
  | { op: 'materials-file'; name: string; bytes: ArrayBuffer | null }
  // `platewise member` on the file: --no-torsion, --bolts, --net-line (one line of text each), --print-unit ('' = the part's)
  | { op: 'member'; key: number; torsion: boolean; bolts: boolean; netLines: string[]; printUnit: string }
);

export interface QuantityView {
  key: string; value: number; error: number; text: string; errorText: string; unit: string; description: string;
  /** false when the estimate is not a bound (the library's errorIsBound: false). */
  bound: boolean;
}
export interface QuantityGroupView { title: string; group: string; rows: QuantityView[] }

export interface PartView {
  name: string; units: string; groups: QuantityGroupView[]; warnings: string[]; reading: string[];
  cautions: string[]; plate?: string; missing: string[];
}

export type FileView =
  /** `refused`: the plate settings were refused (the line says why); the figures are those without them. */
  | { ok: true; parts: PartView[]; json: string; millis: number; refused?: string }
  | { ok: false; message: string; millis: number };

export interface CompareView {
  verdict: 'pass' | 'fail' | 'inconclusive'; counts: Record<string, number>; text: string; json: string; csv: string;
  rows: { quantity: string; verdict: string; stated: string; computed: string; difference: string; tolerance: string; advice: string[] }[];
}

export interface BatchView {
  csv: string;
  rows: { row: number; file: string; part: string | null; status: string; quantity: number; units: string | null; error: string | null; verdict: string | null;
    quantities: Record<string, { value: number; error: number }> }[];
  summary: { pieces: number; netMassKg: number; netMassErrorKg: number; blankMassKg: number; cutLengthM: number; pierces: number; partsMeasured: number; partsFailed: number; partsWithoutMass: number };
  summaryLines: string[];
}

export interface MaterialView { id: string; name: string; density: number; aliases: string[]; fromFile: boolean }

/** One part of `platewise member --json`'s document as the page shows it (every figure from that document). */
export interface MemberPartView {
  name: string; unit: string;
  /** plastic and principal moduli; torsion when asked for */
  groups: QuantityGroupView[];
  torsionMethod?: string;
  notes: string[];
  bolts?: { heading: string; rows: { path: string; label: string; value: number; text: string; unit: string }[] };
  /** one per net line, in the member table's words; null where the line misses this part */
  netSections?: ({ heading: string; rows: { key: string; value: number; error: number; text: string; errorText: string; unit: string; what: string }[]; noArea?: string; runsHeading: string; runs: string[]; note?: string } | null)[];
}
export interface MemberView { parts: MemberPartView[]; json: string; cautions: string[]; notBound: string; millis: number }
