/**
 * The README's walk-through of samples/job (an invented job) reruns as written: every `$ npx platewise …`
 * command of its code blocks runs in a scratch folder that sees the samples, every `$ echo $?` checks the
 * previous exit status, and every output line shown must appear in the output, in the order shown. Lines
 * marked `…` stand for lines left out; estimates (`± 1.2e-11`) are masked, since their last digits follow
 * the method, which has its own tests.
 */
import { mkdtempSync, readFileSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli } from '../helpers.js';

const README = readFileSync(join(ROOT, 'README.md'), 'utf8');
const section = /### Walk-through: `samples\/job\/`\n([\s\S]*?)\n## /.exec(README)![1];
const blocks = [...section.matchAll(/```\n([\s\S]*?)```/g)].map((m) => m[1].replace(/\n$/, '').split('\n'));
const mask = (l: string) => l.replace(/± [0-9.e+-]+/g, '± *').trimEnd();

describe('README walk-through: samples/job', () => {
  it('has the batch, the cost table and the compare', () => {
    const cmds = blocks.flat().filter((l) => l.startsWith('$ npx platewise'));
    expect(cmds.map((c) => c.split(' ')[3])).toEqual(['batch', 'batch', 'compare']);
    expect(cmds[1]).toContain('--rates samples/job/rates.csv');
  });

  const dir = mkdtempSync(join(tmpdir(), 'pw-walk-'));
  symlinkSync(join(ROOT, 'samples'), join(dir, 'samples'));
  let step = 0;
  for (const block of blocks) {
    let k = 0;
    let last: { status: number | null; out: string[] } | null = null;
    while (k < block.length) {
      const cmd = block[k++];
      expect(cmd.startsWith('$ '), `a block line outside a command: ${cmd}`).toBe(true);
      const shown: string[] = [];
      while (k < block.length && !block[k].startsWith('$ ')) shown.push(block[k++]);
      const n = ++step;
      const prev = last;
      if (cmd === '$ echo $?') {
        it(`step ${n}: the exit status is ${shown[0]}`, () => {
          expect(prev, 'echo $? after no command').not.toBeNull();
          expect(String(prev!.status)).toBe(shown[0]);
        });
        continue;
      }
      const args = cmd.replace(/^\$ npx platewise /, '').split(' ');
      const r = runCli(args, undefined, { cwd: dir, timeout: 120000 });
      last = { status: r.status, out: (r.stdout + r.stderr).split('\n').map(mask) };
      const out = last.out;
      it(`step ${n}: ${cmd.slice(2, 90)}: every line shown appears, in order`, () => {
        let at = 0;
        for (const line of shown) {
          if (line === '…') continue;
          const found = out.indexOf(mask(line), at);
          expect(found, `not in the output (after line ${at}): ${line}\n--- output:\n${out.join('\n')}`).toBeGreaterThanOrEqual(0);
          at = found + 1;
        }
      });
    }
  }
});
