import type { Command } from 'commander';
import { intArg, numberArg, addDrawingOptions } from '../options.js';
import { run } from '../run.js';

export function defineIntegrate(program: Command): void {
  addDrawingOptions(program
    .command('integrate')
    .description('integral of an expression f(x, y) over a part, its first moments and the point of action of the resultant')
    .argument('<file>', 'part file (platewise JSON, SVG, DXF, GeoJSON or WKT), or - for standard input')
    .requiredOption('--expr <expression>', 'the integrand in x and y (part coordinates), e.g. "9.81*(2000 - y)"')
    .option('--expr-unit <unit>', 'name of the unit of f, for printing only (e.g. kPa)')
    .option('--layer <name>', 'layer of a layered part file to integrate over (default: the first)')
    .option('--tolerance <t>', 'relative tolerance: refine adaptively until the estimate is below it', numberArg('--tolerance'))
    .option('--max-triangles <n>', 'cap on triangles for --tolerance (default 400000)', intArg('--max-triangles'))
    .option('--time-limit <seconds>', 'cap on time for --tolerance (default 30)', numberArg('--time-limit'))
    .option('--method <method>', 'auto (a polynomial integrand exactly from the boundary, anything else on a mesh) or mesh')
    .option('--degree <n>', 'Dunavant rule degree (a safe degree: 1, 2, 4, 5, 6, 8, 9, 10, 12, 13, 14, 17, 19)', intArg('--degree'))
    .option('--json', 'print JSON instead of a table'))
    .action((file: string, opts) => run(async () => (await import('./integrate.js')).integrate(file, opts)));
}
