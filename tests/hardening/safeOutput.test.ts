/**
 * Safe output: never overwrite an input, write through a temporary name in the same folder and rename,
 * leave nothing behind when a run fails (DESIGN.md "Errors"; common practice, no source).
 * CLI cases spawn the built command line (dist/cli/main.js).
 */
import { createHash } from 'node:crypto';
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';
import { InputError } from '../../src/base/errors.js';
import { writeFileAtomic, writeFilesAtomic } from '../../src/base/files.js';

const base = mkdtempSync(join(tmpdir(), 'platewise-safe-'));
let dir = '';
let n = 0;
beforeEach(() => { dir = join(base, String(n++)); mkdirSync(dir); });
afterAll(() => rmSync(base, { recursive: true, force: true }));

const hash = (p: string) => createHash('sha256').update(readFileSync(p)).digest('hex');
const cli = (args: string[]) => runCli(args, undefined, { cwd: dir, timeout: 30000 });
const PART = JSON.stringify({ part: 'safe-output plate (invented)', outline: { rectangle: { corner: [0, 0], size: [100, 60] } }, cutouts: [{ circle: { center: [30, 30], diameter: 20 } }] }) + '\n';
const noTemp = () => expect(readdirSync(dir).filter((f) => f.endsWith('.tmp')), 'temporary files left').toEqual([]);

describe('the CLI never overwrites an input', () => {
  for (const [cmd, ext] of [['draw', 'svg'], ['report', 'html']] as const) {
    it(`${cmd} -o <the input> (same name, ./ prefix, absolute path, a symlink): exit 2, input unchanged`, () => {
      writeFileSync(join(dir, 'p.json'), PART);
      symlinkSync(join(dir, 'p.json'), join(dir, `link.${ext}`));
      const before = hash(join(dir, 'p.json'));
      for (const target of ['p.json', './p.json', join(dir, 'p.json'), `link.${ext}`]) {
        const r = cli([cmd, 'p.json', '-o', target]);
        expect(r.status, `${target}: ${r.stderr}`).toBe(2);
        expect(r.stderr).toMatch(/^platewise: .*is (an|the) input file of this run; choose another output name \(inputs are never overwritten\)\n$/);
        expect(hash(join(dir, 'p.json'))).toBe(before);
      }
      noTemp();
    });
  }

  it('batch -o <the manifest> and -o <a part file> (even with --force): exit 2, inputs unchanged, nothing written', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), 'file,quantity\np.json,2\n');
    const h = [hash(join(dir, 'p.json')), hash(join(dir, 'job.csv'))];
    for (const args of [['batch', 'job.csv', '-o', 'job.csv'], ['batch', 'job.csv', '-o', 'p.json', '--force'], ['batch', '.', '-o', 'p.json', '--force']]) {
      const r = cli(args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(/^platewise: --output: ".*" is an input file of this run; choose another output name \(inputs are never overwritten\)\n$/);
    }
    expect([hash(join(dir, 'p.json')), hash(join(dir, 'job.csv'))]).toEqual(h);
    expect(readdirSync(dir).sort()).toEqual(['job.csv', 'p.json']);
  });

  it('draw into a folder that does not exist: exit 2, one line, nothing left', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    const r = cli(['draw', 'p.json', '-o', 'missing/out.svg']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^platewise: --output: "missing\/out\.svg": cannot be written \(ENOENT\)\n$/);
    expect(readdirSync(dir)).toEqual(['p.json']);
  });

  it('a successful draw -o leaves exactly the output (written under a temporary name, then renamed)', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    const r = cli(['draw', 'p.json', '-o', 'p.svg']);
    expect(r.status, r.stderr).toBe(0);
    expect(readdirSync(dir).sort()).toEqual(['p.json', 'p.svg']);
    expect(readFileSync(join(dir, 'p.svg'), 'utf8')).toMatch(/^<svg[\s\S]*<\/svg>\n$/);
  });

  // Known bug (reported, not fixed here: cli/commands/draw.ts was being edited by its owner): a drawing of
  // several parts checks each numbered name only as it writes it, so when the second name is the input the
  // first file is already written. writeFilesAtomic (below) checks every name first; draw should call it.
  // Remove `.fails` when draw uses it.
  it('draw of a two-part file whose second numbered name is the input leaves nothing behind', () => {
    writeFileSync(join(dir, 'd-2.svg'), '<svg xmlns="http://www.w3.org/2000/svg" width="300mm" height="100mm" viewBox="0 0 300 100"><rect x="0" y="0" width="100" height="100"/><rect x="150" y="0" width="100" height="100"/></svg>\n');
    const before = hash(join(dir, 'd-2.svg'));
    const r = cli(['draw', './d-2.svg', '-o', 'd.svg']);
    expect(r.status).toBe(2);
    expect(hash(join(dir, 'd-2.svg'))).toBe(before);
    expect(readdirSync(dir)).toEqual(['d-2.svg']);
  });
});

describe('writeFileAtomic and writeFilesAtomic', () => {
  it('writes the data, replaces an earlier output, leaves no temporary file', () => {
    const t = join(dir, 'out.txt');
    writeFileAtomic(t, 'one\n');
    writeFileAtomic(t, 'two\n');
    expect(readFileSync(t, 'utf8')).toBe('two\n');
    expect(readdirSync(dir)).toEqual(['out.txt']);
  });

  it('refuses an input (also through a symlink) and leaves it unchanged', () => {
    const i = join(dir, 'in.json');
    writeFileSync(i, PART);
    symlinkSync(i, join(dir, 'alias.json'));
    for (const t of [i, join(dir, 'alias.json')]) {
      expect(() => writeFileAtomic(t, 'x', [i])).toThrow(InputError);
    }
    expect(readFileSync(i, 'utf8')).toBe(PART);
    noTemp();
  });

  it('a write that fails (the target is a folder) throws InputError and leaves no temporary file', () => {
    mkdirSync(join(dir, 'taken'));
    expect(() => writeFileAtomic(join(dir, 'taken'), 'x')).toThrow(/taken: is a folder; expected a file name/);
    expect(readdirSync(dir)).toEqual(['taken']);
  });

  it('several files: all names are checked before any is written; a later failure removes the earlier ones', () => {
    const i = join(dir, 'in.json');
    writeFileSync(i, PART);
    expect(() => writeFilesAtomic([{ target: join(dir, 'a.svg'), data: 'a' }, { target: i, data: 'b' }], [i])).toThrow(/is an input file of this run/);
    expect(readdirSync(dir)).toEqual(['in.json']);
    expect(() => writeFilesAtomic([{ target: join(dir, 'a.svg'), data: 'a' }, { target: join(dir, 'a.svg'), data: 'b' }], [i])).toThrow(/named twice/);
    mkdirSync(join(dir, 'taken'));
    expect(() => writeFilesAtomic([{ target: join(dir, 'a.svg'), data: 'a' }, { target: join(dir, 'taken'), data: 'b' }], [i])).toThrow(/is a folder/);
    expect(readdirSync(dir).sort()).toEqual(['in.json', 'taken']);
    writeFilesAtomic([{ target: join(dir, 'a.svg'), data: 'a' }, { target: join(dir, 'b.svg'), data: 'b' }], [i]);
    expect(readdirSync(dir).sort()).toEqual(['a.svg', 'b.svg', 'in.json', 'taken']);
    copyFileSync(i, join(dir, 'copy.json')); // a copy is not the input: writing over it is allowed
    writeFilesAtomic([{ target: join(dir, 'copy.json'), data: 'c' }], [i]);
    expect(readFileSync(join(dir, 'copy.json'), 'utf8')).toBe('c');
  });
});
