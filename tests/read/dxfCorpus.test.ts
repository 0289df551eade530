/**
 * Corpus run over DXF files written by others (../shared/dxf-corpus, files from the ezdxf repository, MIT;
 * never copied into this repository). Each file must either give a Drawing or be refused with one
 * InputError line, never any other exception, and none may take more than a few seconds.
 */
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import { readDxf } from '../../src/read/dxf.js';

const ROOT = join(import.meta.dirname, '..', '..');
const CORPUS = join(ROOT, '..', 'shared', 'dxf-corpus');
const present = existsSync(CORPUS);
if (!present) console.log(`dxf corpus not found at ${CORPUS}: corpus run skipped`);

describe.skipIf(!present)('DXF corpus (ezdxf test files)', () => {
  it('reads or refuses every file in one line, within a few seconds each', () => {
    const files = readdirSync(CORPUS).filter((f) => /\.dxf$/i.test(f)).sort();
    expect(files.length).toBeGreaterThan(0);
    const tally: Record<string, number> = {};
    const rows: string[] = [];
    let read = 0;
    for (const f of files) {
      const text = readFileSync(join(CORPUS, f), 'latin1');
      const t0 = performance.now();
      let outcome: string;
      try {
        // mm where the file states no unit, so that the unit rule does not hide every other check
        const d = readDxf(text, { fileLabel: f, units: 'mm' });
        read++;
        const ign = Object.entries(d.ignored).map(([k, v]) => `${k} ${v}`).join(', ');
        outcome = `read: ${d.contours.length} contours (${d.contours.filter((c) => c.closed).length} closed), units ${d.units.unit} (${d.units.source}), gaps ${d.join?.gaps.length ?? 0}${ign ? `; ignored ${ign}` : ''}`;
      } catch (e) {
        if (!(e instanceof InputError)) throw new Error(`${f}: not an InputError: ${(e as Error)?.stack ?? e}`);
        expect(e.message).not.toMatch(/\n/);
        const reason = e.detail.replace(/"[^"]*"/g, '"…"').replace(/-?\d+(\.\d+)?(e[+-]?\d+)?/g, 'N');
        tally[reason] = (tally[reason] ?? 0) + 1;
        outcome = `refused: ${e.message}`;
      }
      const ms = performance.now() - t0;
      expect(ms, f).toBeLessThan(5000);
      rows.push(`${f}: ${outcome} [${ms.toFixed(0)} ms]`);
    }
    console.log(rows.join('\n'));
    console.log(`tally: ${files.length} files, read ${read}, refused ${files.length - read}`);
    for (const [k, v] of Object.entries(tally).sort((a, b) => b[1] - a[1])) console.log(`  refused ${v}: ${k}`);
  });
});
