import type { Command } from 'commander';
import { run } from '../run.js';

export function defineRules(program: Command): void {
  program
    .command('rules')
    .description("list Dunavant's triangle rules: degree, points, and marks for negative weights or points outside the triangle")
    .option('--json', 'print JSON instead of a table')
    .action((opts) => run(async () => (await import('./rules.js')).rules(opts)));
}
