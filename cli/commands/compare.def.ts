import type { Command } from 'commander';
import { intArg, addDrawingOptions } from '../options.js';
import { run } from '../run.js';

const COMPARE_HELP = `
Stated values (--reference), CSV with a header or JSON:
  quantity,value,unit,tolerance,note
  area,34913,mm2,,from the customer sheet
  cutLength,1258.7,mm,0.5 mm,all contours
  JSON: {"part": "<name, optional>", "values": [{"quantity", "value", "unit", "tolerance", "note"}]}
  quantity   any key of measure --json (area, centroidX, Ix, cutLength, pierces, netMass, ...)
  unit       always converted, never assumed (in2 -> mm2 is exactly 645.16); empty for counts
  tolerance  optional: "0.5%", "0.002 rel", "0.05 mm", or a bare number for counts and ratios
  note       optional free text, shown under the table and in JSON and CSV

Default tolerances (common practice, no source), where a row gives none:
  lengths 0.01 mm + 0.01 % of the part size; areas, moments, moduli 0.1 %; products of inertia
  0.1 % of Ix + Iy; angles 0.05 degrees; counts exact; ratios 0.001; masses and forces 0.5 %.
  --digits-tolerance: half a unit in the last written digit instead (0.588 m: +/- 0.0005 m).
Verdict: pass when |difference| + our estimate <= tolerance; fail when |difference| - estimate
  > tolerance; inconclusive otherwise, or when the quantity was not computed.

Exit status: 0 every stated value passes; 1 any fails or is inconclusive; 2 bad input.`;

export function defineCompare(program: Command): void {
  addDrawingOptions(program
    .command('compare')
    .description('check stated values (a drawing, a customer sheet) against computed ones: pass, fail or inconclusive per quantity')
    .argument('<file>', 'part file (platewise JSON, SVG, DXF, GeoJSON or WKT), or - for standard input')
    .requiredOption('--reference <file>', 'stated values with units and optional tolerances (.json or .csv)')
    .option('--digits-tolerance', 'values without a tolerance of their own are taken as right to half a unit in their last written digit (0.588 m: ± 0.0005 m), instead of the defaults')
    .option('--json', 'print JSON instead of a table')
    .option('--csv', 'print CSV (RFC 4180) instead of a table')
    .option('--decimal-comma', 'with --csv: spreadsheet-locale CSV, semicolons between fields and decimal commas (1,5)')
    .option('--thickness <t>', 'plate thickness, e.g. "10 mm" (a bare number is in the part\'s unit); enables masses')
    .option('--material <name>', 'material from the built-in table (run `platewise materials`), for its density')
    .option('--density <d>', 'density, e.g. "7850 kg/m3" or "7.85 g/cm3" (a bare number is kg/m³); overrides the material')
    .option('--part <name>', 'which part, when the file holds several')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--levels <n>', 'uniform refinements after the base mesh (the last two give the estimate)', intArg('--levels'))
    .addHelpText('after', COMPARE_HELP))
    .action((file: string, opts) => run(async () => (await import('./compare.js')).compare(file, opts)));
}
