import type { Command } from 'commander';
import { addDrawingOptions, addMarkOptions, intArg } from '../options.js';
import { run } from '../run.js';

export function defineReport(program: Command): void {
  addMarkOptions(addDrawingOptions(program
    .command('report')
    .description('self-contained HTML report: drawing, quantities with estimates, method, convergence, mass, cautions')
    .argument('<file>', 'part file (platewise JSON, SVG, DXF, GeoJSON or WKT), or - for standard input')
    .option('-o, --output <file.html>', 'write here (default or -: standard output)')
    .option('--force', 'allow --output to replace an existing file (never an input, never a device or FIFO)')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--levels <n>', 'uniform refinements after the base mesh (the last two give the estimate)', intArg('--levels'))
    .option('--triangulation <mode>', 'delaunator (default), cdt2d or sweep')
    .option('--thickness <t>', 'plate thickness in the part\'s length unit (number or expression in x and y), for mass')
    .option('--density <rho>', 'density in kg/m³ (number or expression in x and y), for mass')
    .option('--material <name>', 'material from the built-in table (see platewise materials), for mass')))
    .action((file: string, opts) => run(async () => (await import('./report.js')).report(file, opts)));
}
