/**
 * `platewise page` writes a copy of the built page: byte for byte the file the build made; an existing file
 * is replaced only with --force; a name that is not .html is refused; each refusal is one line with exit 2
 * and leaves the target as it was.
 */
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';

const BUILT = join(import.meta.dirname, '..', '..', 'dist', 'page', 'platewise.html');
const dir = mkdtempSync(join(tmpdir(), 'platewise-page-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('platewise page', () => {
  it('writes the built page, refuses to replace it without --force, replaces it with --force', () => {
    const target = join(dir, 'for-the-office.html');
    const first = runCli(['page', '-o', target]);
    expect(first.status).toBe(0);
    expect(first.stdout).toBe('');
    expect(readFileSync(target).equals(readFileSync(BUILT))).toBe(true);
    writeFileSync(target, 'kept');
    const again = runCli(['page', '-o', target]);
    expect(again.status).toBe(2);
    expect(again.stderr.trim().split('\n')).toHaveLength(1);
    expect(again.stderr).toMatch(/already exists; choose a new name or add --force/);
    expect(readFileSync(target, 'utf8')).toBe('kept');
    expect(runCli(['page', '-o', target, '--force']).status).toBe(0);
    expect(statSync(target).size).toBe(statSync(BUILT).size);
  });
  it('refuses a name that is not .html, in one line, writing nothing', () => {
    const r = runCli(['page', '-o', join(dir, 'page.pdf')]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--output: the page is an HTML file; name it \.html/);
    expect(() => statSync(join(dir, 'page.pdf'))).toThrow();
  });
  it('without -o prints the page; the built file stays under 2 MB', () => {
    const r = runCli(['page']);
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(readFileSync(BUILT, 'utf8'));
    expect(statSync(BUILT).size).toBeLessThan(2 * 1024 * 1024);
  });
});
