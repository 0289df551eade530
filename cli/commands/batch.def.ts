import type { Command } from 'commander';
import { intArg, addDrawingOptions } from '../options.js';
import { run } from '../run.js';

const BATCH_HELP = `
Manifest (CSV with a header; "file" required, the rest optional; an empty cell means "not given"):
  file          part file, relative to the manifest (.json part file, .svg, .dxf, .geojson, .wkt)
  quantity      pieces made, a whole number (default 1)
  material      a name from \`platewise materials\` (aliases and designations such as S355J2+N work)
  thickness     "10 mm", or a bare number under "thickness [mm]"
  density       "7850 kg/m3", or a bare number (kg/m3, or the heading's unit)
  reference     stated values (JSON or CSV, as for compare), relative to the manifest
  format, units how to read a drawing (as the options of the same names)
  note          free text, carried into the row's "note" column
  <quantity> [unit]  a stated value, e.g. "area [mm2]", "netMass [kg]", "pierces"
                (default tolerances as in compare)
  A part file's own thickness and material win; a row fills the gaps; --thickness, --material and
  --density fill what is still missing. A folder instead of a manifest: every part file in it,
  sorted by name; "<stem>.ref.json" or ".ref.csv" beside a part is its reference; "*.summary.json"
  is never a part.

Output: one row per part, in manifest order (a folder: sorted names), each written whole as soon
  as every row before it is done. CSV headings carry their unit in brackets ("netMass [kg]",
  "area [mm2]"); lengths are converted to mm. Line totals (quantity x value): lineArea,
  lineCutLength, linePierces, lineMarkingLength, lineMass, lineBlankMass. The note and the
  warnings are in each row.
  -o results.csv also writes results.summary.json (totals per material and thickness and in all);
  .jsonl ends with a summary line. Existing files are refused without --force.

Rates file (--rates, CSV; one row per material and thickness; every number's unit in its heading).
  The header, on one line in the file (wrapped here):
    material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],
    machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min],note
  A row: steel,10,1800,2,90,1.15,10,invented example
  units: thickness mm|cm|m|in; cuttingSpeed mm/min|m/min|mm/s|in/min; pierceTime s;
  setupTime min|s|h; money: any currency label, the same in machineRate [X/h] and
  materialPrice [X/kg] (never converted).
  Per part: time = cut length / cutting speed + pierces x pierce time; cost = time x machine rate +
  blank mass x material price. Per line (a row of results): quantity x part + setup once.
  Kerf, lead-ins, rapid moves, marking and nesting are not modelled: the tool computes, the shop
  decides.

Defaults: one worker per core (capped by free memory); CSV on standard output; RFC 4180 commas and
  decimal points unless --decimal-comma; no rates, no cost.

Exit status: 0 every part measured and every stated value passes; 1 a part failed or a stated
value failed or was inconclusive; 2 bad manifest, rates file or arguments (nothing is measured).`;

export function defineBatch(program: Command): void {
  addDrawingOptions(program
    .command('batch')
    .description('measure many parts at once: a folder of part files or a manifest (CSV); one result row per part, totals at the end')
    .argument('<source>', 'a folder (every .json, .svg, .dxf, .geojson, .wkt file in it) or a manifest .csv')
    .option('-o, --output <file>', 'write result rows to this new file, in manifest order as they finish (default: standard output)')
    .option('--force', 'allow --output (and its summary file) to replace an existing file (never an input)')
    .option('--jsonl', 'JSON Lines rows, the last line a summary (default: CSV, or by the --output extension .jsonl)')
    .option('--csv', 'CSV rows (RFC 4180)')
    .option('--jobs <n>', 'worker threads (default: one per core)', intArg('--jobs'))
    .option('--thickness <t>', 'plate thickness for every row that gives none, e.g. "10 mm"')
    .option('--material <name>', 'material for every row that gives none (its nominal density)')
    .option('--density <d>', 'density for every row that gives none, e.g. "7850 kg/m3"')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--levels <n>', 'uniform refinements after the base mesh', intArg('--levels'))
    .option('--quiet', 'no progress bar and no summary on standard error')
    .option('--decimal-comma', 'spreadsheet-locale CSV: semicolons between fields and decimal commas (1,5), for the manifest, the rates file and the CSV written')
    .option('--rates <file>', 'shop rates (CSV, see below): cutting time and cost per part, per line and in total')
    .addHelpText('after', BATCH_HELP))
    .action((source: string, opts) => run(async () => (await import('./batch.js')).batch(source, opts)));
}
