/**
 * Messages a newcomer meets first (common practice, no source): a mistyped option or command gets a
 * suggestion on the same line; batch given one part file says what it takes; report refuses a .pdf name
 * rather than writing HTML into it. Each is one line on standard error with exit status 2.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';

const oneLine = (r: { status: number | null; stderr: string; stdout: string }) => {
  expect(r.status).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr.trim().split('\n')).toHaveLength(1);
};

describe('first messages', () => {
  it('--thicknes suggests --thickness; meassure suggests measure', () => {
    const a = runCli(['measure', 'samples/base-plate-bp1.json', '--thicknes', '3']);
    oneLine(a);
    expect(a.stderr).toMatch(/unknown option '--thicknes'; did you mean --thickness\?/);
    const b = runCli(['meassure', 'samples/base-plate-bp1.json']);
    oneLine(b);
    expect(b.stderr).toMatch(/unknown command 'meassure'; did you mean measure\?/);
  });
  it('batch on a part file says it takes a folder or a manifest', () => {
    const r = runCli(['batch', 'samples/base-plate-bp1.json']);
    oneLine(r);
    expect(r.stderr).toMatch(/is a part file; batch takes a folder of part files or a manifest/);
  });
  it('report -o x.pdf is refused (the report is HTML)', () => {
    const r = runCli(['report', 'samples/base-plate-bp1.json', '-o', 'out-never-written.pdf']);
    oneLine(r);
    expect(r.stderr).toMatch(/--output: the report is an HTML page; name the file \.html/);
  });
});
