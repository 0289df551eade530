/**
 * Issue 16, items 1, 3 (reading) and 5 (signals): outputs are never inputs (device and inode), never devices
 * or FIFOs, replaced only with --force on every command; concurrent batches on one output cannot interleave;
 * long output names work; full disk and closed pipes end in one line with the documented status; reads stop
 * at the limit + 1 byte on devices and standard input; batch rows naming devices or FIFOs are refused by name;
 * SIGINT / SIGTERM end a batch with one line and an incomplete summary, no row torn. Every spawned process
 * has a timeout; every temporary file is removed in afterAll. Nothing here asserts on time.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { CLI, runCli } from '../helpers.js';

const base = mkdtempSync(join(tmpdir(), 'platewise-reliable-'));
let dir = '';
let n = 0;
beforeEach(() => { dir = join(base, String(n++)); mkdirSync(dir); });
afterAll(() => rmSync(base, { recursive: true, force: true }));

const hash = (p: string) => createHash('sha256').update(readFileSync(p)).digest('hex');
const cli = (args: string[], input?: string) => runCli(args, input, { cwd: dir, timeout: 60000 });
const PART = JSON.stringify({ part: 'reliability plate (invented)', outline: { rectangle: { corner: [0, 0], size: [100, 60] } }, cutouts: [{ circle: { center: [30, 30], diameter: 20 } }] }) + '\n';
const oneLine = (stderr: string) => {
  expect(stderr.split('\n').length, JSON.stringify(stderr)).toBe(2);
  expect(stderr).not.toMatch(/\n\s+at |internal error|Error:/);
};
const leftovers = () => readdirSync(dir).filter((f) => f.endsWith('.tmp') || f.endsWith('.lock'));
const manifest = (rows: number) => 'file,quantity\n' + 'p.json,1\n'.repeat(rows);

describe('outputs: never an input, never a device, --force everywhere', () => {
  it('a hard link to the part file or the manifest is refused as an output of batch, draw and report, even with --force', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(1));
    linkSync(join(dir, 'p.json'), join(dir, 'hard-part.csv'));
    linkSync(join(dir, 'job.csv'), join(dir, 'hard-job.csv'));
    linkSync(join(dir, 'p.json'), join(dir, 'hard.svg'));
    linkSync(join(dir, 'p.json'), join(dir, 'hard.html'));
    const before = [hash(join(dir, 'p.json')), hash(join(dir, 'job.csv'))];
    for (const args of [
      ['batch', 'job.csv', '-o', 'hard-part.csv', '--force'], ['batch', 'job.csv', '-o', 'hard-job.csv', '--force'],
      ['draw', 'p.json', '-o', 'hard.svg', '--force'], ['report', 'p.json', '-o', 'hard.html', '--force'],
    ]) {
      const r = cli(args);
      expect(r.status, args.join(' ')).toBe(2);
      oneLine(r.stderr);
      expect(r.stderr).toMatch(/^platewise: --output: ".*" is an input file of this run; choose another output name/);
    }
    expect([hash(join(dir, 'p.json')), hash(join(dir, 'job.csv'))]).toEqual(before);
    expect(leftovers()).toEqual([]);
  });

  it('a batch summary file that is a hard link to an input is refused before any row is written', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(1));
    linkSync(join(dir, 'p.json'), join(dir, 'res.summary.json'));
    const r = cli(['batch', 'job.csv', '-o', 'res.csv', '--force']);
    expect(r.status).toBe(2);
    oneLine(r.stderr);
    expect(existsSync(join(dir, 'res.csv'))).toBe(false);
    expect(readFileSync(join(dir, 'p.json'), 'utf8')).toBe(PART);
  });

  it('device nodes, FIFOs and symlinks to them are refused as outputs (even with --force); - is standard output', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(1));
    symlinkSync('/dev/null', join(dir, 'null-link.svg'));
    execFileSync('mkfifo', [join(dir, 'fifo.csv')]);
    for (const [args, what] of [
      [['draw', 'p.json', '-o', '/dev/null', '--force'], 'character device'],
      [['report', 'p.json', '-o', 'null-link.svg', '--force'], 'character device'],
      [['batch', 'job.csv', '-o', 'fifo.csv', '--force'], 'FIFO'],
      [['draw', 'p.json', '-o', '/dev/full', '--force'], 'character device'],
    ] as const) {
      const r = cli([...args]);
      expect(r.status, args.join(' ')).toBe(2);
      oneLine(r.stderr);
      expect(r.stderr).toContain(what);
      expect(r.stderr).toContain('use - for standard output');
    }
    const d = cli(['draw', 'p.json', '-o', '-']);
    expect(d.status, d.stderr).toBe(0);
    expect(d.stdout).toMatch(/^<svg/);
    expect(readdirSync(dir).sort()).toEqual(['fifo.csv', 'job.csv', 'null-link.svg', 'p.json']);
  });

  it('draw and report replace an existing file only with --force, like batch', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    for (const [cmd, name] of [['draw', 'x.svg'], ['report', 'x.html']]) {
      writeFileSync(join(dir, name), 'keep me');
      const r = cli([cmd, 'p.json', '-o', name]);
      expect(r.status).toBe(2);
      oneLine(r.stderr);
      expect(r.stderr).toMatch(/already exists; choose a new name or add --force to replace it/);
      expect(readFileSync(join(dir, name), 'utf8')).toBe('keep me');
      const f = cli([cmd, 'p.json', '-o', name, '--force']);
      expect(f.status, f.stderr).toBe(0);
      expect(readFileSync(join(dir, name), 'utf8')).not.toBe('keep me');
    }
    expect(leftovers()).toEqual([]);
  });

  it('a symlink to a regular file is written through (the link stays a link)', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'real.svg'), 'old');
    symlinkSync(join(dir, 'real.svg'), join(dir, 'link.svg'));
    const r = cli(['draw', 'p.json', '-o', 'link.svg', '--force']);
    expect(r.status, r.stderr).toBe(0);
    expect(readFileSync(join(dir, 'real.svg'), 'utf8')).toMatch(/^<svg/);
    expect(readdirSync(dir).sort()).toEqual(['link.svg', 'p.json', 'real.svg']);
  });

  it('an output name of 244 bytes (under the 255-byte limit) works for draw, report and batch with its summary', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(1));
    const long = (ext: string) => 'n'.repeat(244 - ext.length) + ext;
    for (const args of [['draw', 'p.json', '-o', long('.svg')], ['report', 'p.json', '-o', long('.html')], ['batch', 'job.csv', '-o', long('.csv'), '--quiet']]) {
      const r = cli(args);
      expect(r.status, `${args[0]}: ${r.stderr}`).toBe(0);
      expect(existsSync(join(dir, args[3])), args[0]).toBe(true);
    }
    expect(leftovers()).toEqual([]);
  });

  it('two concurrent batch -o same.csv --force runs never interleave: each ends whole or refused in one line', async () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(60));
    const runOne = () => new Promise<{ status: number | null; stderr: string }>((done) => {
      const c = spawn(process.execPath, [CLI, 'batch', 'job.csv', '-o', 'same.csv', '--force', '--quiet', '--jobs', '1'], { cwd: dir });
      let stderr = '';
      c.stderr.setEncoding('utf8').on('data', (d: string) => { stderr += d; });
      const t = setTimeout(() => c.kill('SIGKILL'), 120000);
      c.on('close', (status) => { clearTimeout(t); done({ status, stderr }); });
    });
    const [a, b] = await Promise.all([runOne(), runOne()]);
    for (const r of [a, b]) {
      expect([0, 2], r.stderr).toContain(r.status);
      if (r.status === 2) { oneLine(r.stderr); expect(r.stderr).toMatch(/is being written by another platewise run/); }
    }
    const lines = readFileSync(join(dir, 'same.csv'), 'utf8').split('\n');
    expect(lines[0]).toMatch(/^row,file,/);
    expect(lines.length).toBe(62); // header, 60 rows, final newline
    expect(new Set(lines.slice(1, 61).map((l) => l.split(',')[0])).size).toBe(60);
    expect(JSON.parse(readFileSync(join(dir, 'same.summary.json'), 'utf8')).summary.complete).toBe(true);
    expect(leftovers()).toEqual([]);
  }, 240000);
});

describe('full disk and closed pipes: one line, documented status', () => {
  it('standard output on /dev/full: exit 5, one line (measure, draw, batch)', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(2));
    for (const args of [['measure', 'p.json'], ['draw', 'p.json'], ['batch', 'job.csv', '--quiet']]) {
      const r = spawnSync('sh', ['-c', `"${process.execPath}" "${CLI}" ${args.join(' ')} > /dev/full`], { cwd: dir, encoding: 'utf8', timeout: 60000 });
      expect(r.status, `${args[0]}: ${r.stderr}`).toBe(5);
      oneLine(r.stderr);
      expect(r.stderr).toBe('platewise: standard output: cannot be written (ENOSPC: no space left on the device)\n');
    }
  });

  it('batch … | head -c 100 ends quietly with status 141 (as a Unix tool on SIGPIPE)', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(200));
    const r = spawnSync('bash', ['-c', `"${process.execPath}" "${CLI}" batch job.csv --quiet | head -c 100 > /dev/null; echo "status \${PIPESTATUS[0]}" >&2`], { cwd: dir, encoding: 'utf8', timeout: 120000 });
    expect(r.stderr).toBe('status 141\n');
  });
});

describe('reading stops at the limit + 1 byte', () => {
  it('measure /dev/zero and measure - < /dev/zero: exit 2, one line naming the limit', () => {
    for (const cmd of ['measure /dev/zero', 'measure - < /dev/zero']) {
      const r = spawnSync('sh', ['-c', `"${process.execPath}" "${CLI}" ${cmd}`], { cwd: dir, encoding: 'utf8', timeout: 60000 });
      expect(r.status, cmd).toBe(2);
      oneLine(r.stderr);
      expect(r.stderr).toMatch(/^platewise: (\/dev\/zero|stdin): is larger than the limit of 33554432 bytes \(reading stopped at 33554433 bytes\)\n$/);
    }
  });

  it('manifest rows naming /dev/zero, /dev/stdin, a FIFO or a folder fail by name; the good row is measured', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    execFileSync('mkfifo', [join(dir, 'pipe.json')]);
    mkdirSync(join(dir, 'sub'));
    writeFileSync(join(dir, 'job.csv'), 'file,quantity\n/dev/zero,1\n/dev/stdin,1\npipe.json,1\nsub,1\np.json,1\n');
    const r = cli(['batch', 'job.csv', '-o', 'out.jsonl', '--quiet']);
    expect(r.status).toBe(1);
    const rows = readFileSync(join(dir, 'out.jsonl'), 'utf8').trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    const byFile = new Map(rows.filter((x) => x.file).map((x) => [x.file, x]));
    expect(byFile.get('/dev/zero')?.error).toMatch(/device or process file, not a regular file/);
    expect(byFile.get('/dev/stdin')?.error).toMatch(/device or process file, not a regular file/);
    expect(byFile.get('pipe.json')?.error).toMatch(/is a FIFO \(named pipe\), not a regular file/);
    expect(byFile.get('sub')?.error).toMatch(/is a folder/);
    expect(byFile.get('p.json')?.status).toBe('ok');
  });
});

describe('SIGINT and SIGTERM end a batch with one line; the summary is marked incomplete; no row torn', () => {
  const TRIALS: [NodeJS.Signals, string][] = [['SIGINT', 'csv'], ['SIGTERM', 'csv'], ['SIGINT', 'jsonl'], ['SIGTERM', 'jsonl']];
  for (const [sig, ext] of TRIALS) {
    it(`${sig}, -o out.${ext}`, async () => {
      writeFileSync(join(dir, 'p.json'), PART);
      writeFileSync(join(dir, 'job.csv'), manifest(3000));
      const r = await new Promise<{ status: number | null; stderr: string }>((done) => {
        const c = spawn(process.execPath, [CLI, 'batch', 'job.csv', '-o', `out.${ext}`, '--quiet', '--jobs', '1'], { cwd: dir });
        let stderr = '';
        let sent = false;
        c.stderr.setEncoding('utf8').on('data', (d: string) => { stderr += d; });
        // signal once the first rows are on disk (the temporary file has grown): a state, not a time
        const poll = setInterval(() => {
          const tmp = readdirSync(dir).find((f) => f.endsWith('.tmp'));
          if (!sent && tmp && readFileSync(join(dir, tmp), 'utf8').split('\n').length > 5) { sent = true; c.kill(sig); }
        }, 20);
        const t = setTimeout(() => c.kill('SIGKILL'), 180000);
        c.on('close', (status) => { clearInterval(poll); clearTimeout(t); done({ status, stderr }); });
      });
      expect(r.status, r.stderr).toBe(sig === 'SIGINT' ? 130 : 143);
      oneLine(r.stderr);
      const m = new RegExp(`^platewise: interrupted by ${sig} after (\\d+) of 3000 rows; out\\.${ext} holds the \\d+ finished rows?`).exec(r.stderr);
      expect(m, r.stderr).not.toBeNull();
      const done = Number(m![1]);
      expect(done).toBeGreaterThan(0);
      expect(done).toBeLessThan(3000);
      const text = readFileSync(join(dir, `out.${ext}`), 'utf8');
      expect(text.endsWith('\n')).toBe(true);
      const lines = text.trim().split('\n');
      let summary: { complete: boolean; interrupted: { rowsFinished: number; rowsTotal: number } };
      if (ext === 'csv') {
        const width = lines[0].split(',').length;
        expect(lines.length).toBe(done + 1);
        for (const l of lines.slice(1)) expect(l.split(',').length, 'a torn row').toBe(width);
        summary = JSON.parse(readFileSync(join(dir, 'out.summary.json'), 'utf8')).summary;
      } else {
        expect(lines.length).toBe(done + 1);
        const parsed = lines.map((l) => JSON.parse(l)); // a torn line would not parse
        summary = parsed[parsed.length - 1].summary;
      }
      expect(summary.complete).toBe(false);
      expect(summary.interrupted).toMatchObject({ rowsFinished: done, rowsTotal: 3000 });
      expect(leftovers()).toEqual([]);
    }, 240000);
  }
});

describe('text: escaped for terminals, neutralised in CSV, exact in JSON', () => {
  const EVIL = '=HYPERLINK("x")\u001b[2J\u009b31m\u202eevil\u2066';
  const evilPart = JSON.stringify({ part: EVIL, outline: { rectangle: { corner: [-10, -5], size: [100, 60] } } }) + '\n';
  const UNSAFE = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

  it('measure: the table shows escapes, never the raw controls; --json reads back to the exact name', () => {
    writeFileSync(join(dir, 'e.json'), evilPart);
    const t = cli(['measure', 'e.json']);
    expect(t.status, t.stderr).toBe(0);
    expect(t.stdout).not.toMatch(UNSAFE);
    expect(t.stdout).toContain('\\u001b[2J\\u009b31m\\u202eevil\\u2066');
    const j = cli(['measure', 'e.json', '--json']);
    expect(j.stdout).not.toMatch(UNSAFE);
    expect(JSON.parse(j.stdout).part).toBe(EVIL);
  });

  it('an error line escapes C1 and bidirectional controls too', () => {
    writeFileSync(join(dir, 'e.json'), JSON.stringify({ part: 'p', material: 'st\u009b2J\u202eeel', thickness: 2, outline: { rectangle: { corner: [0, 0], size: [10, 10] } } }));
    const r = cli(['measure', 'e.json']);
    expect(r.status).toBe(2);
    oneLine(r.stderr);
    expect(r.stderr).not.toMatch(UNSAFE);
    expect(r.stderr).toContain('st\\u009b2J\\u202eeel');
  });

  it('batch CSV: text cells starting with = + - @ tab CR get a leading quote; numbers (negative ones too) stay numbers; JSONL keeps the text', () => {
    writeFileSync(join(dir, 'e.json'), evilPart);
    writeFileSync(join(dir, '-minus.json'), evilPart.replace(JSON.stringify(EVIL), '"@SUM(1)"'));
    writeFileSync(join(dir, 'job.csv'), 'file,quantity\ne.json,1\n-minus.json,1\n');
    const r = cli(['batch', 'job.csv', '-o', 'out.csv', '--quiet']);
    expect(r.status, r.stderr).toBe(0);
    const lines = readFileSync(join(dir, 'out.csv'), 'utf8').trim().split(/\r?\n/);
    const header = lines[0].split(',');
    const cx = header.indexOf('centroidX [mm]');
    const e = lines.find((l) => l.startsWith('1,'))!;
    expect(e).toContain(`"'=HYPERLINK(""x"")`);
    expect(e.split(',')[cx]).toBe('40'); // -10 + 50: a number, no quote
    const m = lines.find((l) => l.startsWith('2,'))!;
    expect(m.startsWith("2,'-minus.json,1,'@SUM(1),ok,")).toBe(true);
    const neg = cli(['batch', 'job.csv', '-o', 'out.jsonl', '--quiet']);
    expect(neg.status).toBe(0);
    const first = JSON.parse(readFileSync(join(dir, 'out.jsonl'), 'utf8').split('\n')[0]);
    expect(first.part).toBe(EVIL);
    expect(first.quantities.Ixy.value).toBeTypeOf('number');
  });
});

describe('numbers and workers in a batch', () => {
  it('a row whose mass overflows fails with the cause; the totals stay finite', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'o.json'), JSON.stringify({ part: 'o', thickness: '1e200*(x+1)', density: '1e200*(x+1)', outline: { rectangle: { corner: [0, 0], size: [100, 60] } } }));
    writeFileSync(join(dir, 'job.csv'), 'file,quantity,thickness,density\no.json,1,,\np.json,3,2,7850\n');
    const r = cli(['batch', 'job.csv', '-o', 'out.csv']);
    expect(r.status).toBe(1);
    expect(r.stderr).not.toMatch(/NaN|Infinity/);
    const rows = readFileSync(join(dir, 'out.csv'), 'utf8');
    expect(rows).toMatch(/part ""o"": the mass properties overflow the range of numbers/);
    const s = JSON.parse(readFileSync(join(dir, 'out.summary.json'), 'utf8')).summary;
    expect(Number.isFinite(s.netMassKg) && s.netMassKg > 0).toBe(true);
    expect(s.partsFailed).toBe(1);
  });

  it('--jobs 256 is capped by cores and memory, said in one line', () => {
    writeFileSync(join(dir, 'p.json'), PART);
    writeFileSync(join(dir, 'job.csv'), manifest(300));
    const r = cli(['batch', 'job.csv', '-o', 'out.csv', '--jobs', '256']);
    expect(r.status, r.stderr).toBe(0);
    const m = /^platewise: --jobs 256 capped at (\d+) workers? \(/.exec(r.stderr);
    expect(m, r.stderr).not.toBeNull();
    expect(Number(m![1])).toBeLessThanOrEqual(availableParallelism());
    expect(JSON.parse(readFileSync(join(dir, 'out.summary.json'), 'utf8')).summary.jobs).toBe(Number(m![1]));
  });
});
