import type { Command } from 'commander';
import { run } from '../run.js';

export function defineMaterials(program: Command): void {
  program
    .command('materials')
    .description('list the known materials: id, name, density in kg/m³ and where the figure comes from')
    .option('--materials-file <file>', 'also read materials from this JSON file (they come first and may replace built-in ones)')
    .option('--json', 'print JSON instead of a table')
    .action((opts) => run(async () => (await import('./materials.js')).materials(opts)));
}
