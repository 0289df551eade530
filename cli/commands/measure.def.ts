import type { Command } from 'commander';
import { intArg } from '../options.js';
import { run } from '../run.js';

export function defineMeasure(program: Command): void {
  program
    .command('measure')
    .description('area properties of a part: area, centroid, second moments, principal axes, section moduli')
    .argument('<file>', 'part file (platewise JSON, SVG, GeoJSON or WKT), or - for standard input')
    .option('--json', 'print JSON instead of a table')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--levels <n>', 'uniform refinements after the base mesh (the last two give the estimate)', intArg('--levels'))
    .option('--triangulation <mode>', 'delaunator (default), cdt2d or sweep')
    .option('--format <format>', 'input format: part-json, svg, geojson or wkt (default: by extension, then content)')
    .option('--units <unit>', 'length unit of drawing coordinates (SVG, GeoJSON, WKT): mm, cm, m, in, ft')
    .action((file: string, opts) => run(async () => (await import('./measure.js')).measure(file, opts)));
}
