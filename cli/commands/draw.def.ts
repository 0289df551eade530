import type { Command } from 'commander';
import { addDrawingOptions, addMarkOptions, intArg } from '../options.js';
import { run } from '../run.js';

export function defineDraw(program: Command): void {
  addMarkOptions(addDrawingOptions(program
    .command('draw')
    .description('SVG drawing of a part: material, cut-outs, centroid, principal axes, bounding box, scale bar')
    .argument('<file>', 'part file (platewise JSON, SVG, DXF, GeoJSON or WKT), or - for standard input')
    .option('-o, --output <file.svg>', 'write here (several parts: name-1.svg, name-2.svg, …); default or -: standard output')
    .option('--force', 'allow --output to replace an existing file (never an input, never a device or FIFO)')
    .option('--mesh', 'overlay the triangles of the mesh (curved triangles drawn curved)')
    .option('--shade <what>', '"error" (refinement error indicator per triangle), "thickness" or "density" (from the part file), or an expression in x and y')
    .option('--sheet', 'all parts of the file on one drawing')
    .option('--degree <n>', 'Dunavant rule degree on curved triangles (1-20)', intArg('--degree'))
    .option('--triangulation <mode>', 'delaunator (default), cdt2d or sweep')))
    .action((file: string, opts) => run(async () => (await import('./draw.js')).draw(file, opts)));
}
