import type { Command } from 'commander';
import { addDrawingOptions, addNetLineOption, intArg } from '../options.js';
import { run } from '../run.js';

export function defineMember(program: Command): void {
  addNetLineOption(addDrawingOptions(program
    .command('member')
    .description('the part as a member cross-section: torsion constant, shear centre, warping constant, plastic and principal moduli, bolt group, net sections along lines')
    .argument('<file>', 'part file (platewise JSON, SVG, DXF, GeoJSON or WKT), or - for standard input')
    .option('--json', 'print JSON instead of a table')
    .option('--print-unit <unit>', 'length unit of the results: mm, cm, m or in (I in unit⁴, S and Z in unit³)')
    .option('--order <k>', 'finite-element order for torsion, 2-4 (default 4)', intArg('--order'))
    .option('--triangles <n>', 'torsion: the coarser of the two meshes has at least this many triangles (default 1000; the mesh is first graded toward corners)', intArg('--triangles'))
    .option('--no-torsion', 'skip torsion, shear centre and warping constant')
    .option('--thickness <t>', 'plate thickness for the net area (a number, or with a unit: "10 mm"); the part file\'s own thickness otherwise')
    .option('--bolts [diameters]', 'bolt group of the circular holes: all, or those of the comma-separated diameters')))
    .action((file: string, opts) => run(async () => (await import('./member.js')).member(file, opts)));
}
