import type { Command } from 'commander';
import { intArg, numberArg, addDrawingOptions } from '../options.js';
import { run } from '../run.js';

export function defineMeasure(program: Command): void {
  addDrawingOptions(program
    .command('measure')
    .description('area properties of a part: area, centroid, second moments, principal axes, section moduli')
    .argument('<file>', 'part file (platewise JSON, SVG, DXF, GeoJSON or WKT), or - for standard input')
    .option('--json', 'print JSON instead of a table')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--levels <n>', 'uniform refinements after the base mesh (the last two give the estimate)', intArg('--levels'))
    .option('--method <method>', 'auto (exact boundary integrals for the area properties; a mesh only where an integrand needs one) or mesh')
    .option('--triangulation <mode>', 'delaunator (default), cdt2d or sweep')
    .option('--fabrication', 'add fabrication figures: cut length, pierces, bounding and minimum-area rectangles, scrap; masses with a thickness and a material or density')
    // mass properties (cli/commands/measureMass.ts)
    .option('--thickness <t>', 'plate thickness in the part\'s length unit: a number or an expression in x and y')
    .option('--density <rho>', 'density in kg/m³: a number or an expression in x and y')
    .option('--material <name>', 'material by id or alias (see platewise materials) for the density')
    .option('--materials-file <file>', 'JSON file of extra materials')
    .option('--mass-unit <unit>', 'unit of mass: kg (default), g or lb')
    .option('--inertia-unit <unit>', 'unit of mass moments of inertia: kg·m² (default), kg·mm², g·cm², lb·in² or lb·ft²')
    .option('--tolerance <t>', 'relative tolerance for mass properties: refine adaptively until met', numberArg('--tolerance'))
    .option('--max-triangles <n>', 'cap on triangles for --tolerance (default 400000)', intArg('--max-triangles'))
    .option('--time-limit <seconds>', 'cap on time for --tolerance (default 30)', numberArg('--time-limit')))
    .action((file: string, opts) => run(async () => (await import('./measure.js')).measure(file, opts)));
}
