/**
 * Run the built command line in this process and write its peak resident memory (MB) to the file named by
 * PW_RSS_OUT when it exits: node dist/tests/bench/rss.js measure FILE … (whole-process peak memory).
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

const main = join(import.meta.dirname, '..', '..', 'cli', 'main.js');
process.argv = [process.argv[0], main, ...process.argv.slice(2)];
process.on('exit', () => { if (process.env.PW_RSS_OUT) writeFileSync(process.env.PW_RSS_OUT, String(process.resourceUsage().maxRSS / 1024)); });
await import(pathToFileURL(main).href);
