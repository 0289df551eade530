/** The README's full example of the part format must read and measure (the documentation stays true). */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { measureSection } from '../../src/analysis/measure.js';
import { readPartJson } from '../../src/read/partJson.js';

const README = readFileSync(join(import.meta.dirname, '..', '..', 'README.md'), 'utf8');

describe('README', () => {
  it('the part-format example parses and measures', () => {
    const block = /## Part description format[\s\S]*?```json\n([\s\S]*?)```/.exec(README);
    expect(block).not.toBeNull();
    const r = measureSection(readPartJson(block![1], 'README example'));
    expect(r.quantities.area.value).toBeGreaterThan(0);
    expect(r.geometry.part.regions[0].holes).toHaveLength(4);
  });
  it('starts with one paragraph and then the install-and-run and the test commands', () => {
    const lines = README.split('\n');
    expect(lines[0]).toBe('# platewise');
    expect(README).toContain('npm install && npx platewise measure samples/base-plate-bp1.json');
    expect(README).toMatch(/```sh\nnpm test\n```/);
  });

  it('the quick starts of "Where to start" run as written (designer, fabricator: exit 0; inspector: 1 for the deliberate mismatch)', async () => {
    const { runCli } = await import('../helpers.js');
    const table = /### Where to start[\s\S]*?\n\n([\s\S]*?)\n\n/.exec(README)![1];
    const cmds = [...table.matchAll(/`npx platewise ([^`]+)`/g)].map((m) => m[1]);
    expect(cmds.length).toBeGreaterThanOrEqual(3);
    const statuses = cmds.map((c) => runCli(c.split(' ')).status);
    // designer, fabricator (measure), the job batch (one deliberate pierce mismatch), inspector (compare)
    expect(statuses).toEqual([0, 0, 1, 1]);
  });
});
