/**
 * The HTML report in a real browser: Debian's Chromium (/usr/bin/chromium; never downloaded) driven by
 * playwright-core, headless, with a fresh profile folder. The report is opened from a file URL; every
 * value in its table must equal `measure --json` for the same part, the drawing must be there with the
 * part's cut-outs, and nothing may be fetched from the network. Screenshots and A4/Letter PDFs are kept
 * in test-artifacts/browser/ (git-ignored). Needs the dist build (tsc) and Chromium (.ci/run installs it).
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BrowserContext } from 'playwright-core';
import { type Browser, launchChromium } from './chromium.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const ARTIFACTS = join(ROOT, 'test-artifacts', 'browser');

function platewise(args: string[]) {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`platewise ${args.join(' ')} failed: ${r.stderr}`);
  return r.stdout;
}

// Samples and their number of cut-outs, counted in the sample files themselves.
const CASES = [
  { sample: 'samples/base-plate-bp1.json', cutouts: 5 },
  { sample: 'samples/bracket.svg', cutouts: 5 },
];

let browser: Browser | undefined;
let ctx: BrowserContext;

beforeAll(async () => {
  mkdirSync(ARTIFACTS, { recursive: true });
  browser = await launchChromium({ width: 1000, height: 900 });
  ctx = browser.ctx;
});

afterAll(async () => {
  await browser?.close();
});

describe('HTML report in Chromium', () => {
  for (const c of CASES) {
    const name = c.sample.replace(/^samples\//, '').replace(/\.\w+$/, '');
    it(`${c.sample}: table equals measure --json, drawing has ${c.cutouts} cut-outs, no network, screenshot`, async () => {
      const html = join(ARTIFACTS, `${name}.html`);
      platewise(['report', c.sample, '-o', html, '--force']); // test artefacts are replaced on every run
      const json = JSON.parse(platewise(['measure', c.sample, '--json']));
      const page = await ctx.newPage();
      const requested: string[] = [];
      page.on('request', (r) => requested.push(r.url()));
      await page.goto(pathToFileURL(html).href, { waitUntil: 'load' });

      const rows = await page.$$eval('table[data-role="quantities"] tr[data-key]', (trs) => trs.map((tr) => {
        const v = tr.querySelector('td[data-value]') as HTMLElement;
        const e = tr.querySelector('td[data-error]') as HTMLElement;
        return { key: tr.getAttribute('data-key')!, value: v.getAttribute('data-value')!, text: v.textContent!.trim(), error: e.getAttribute('data-error')! };
      }));
      expect(rows.map((r) => r.key)).toEqual(Object.keys(json.quantities));
      for (const r of rows) {
        expect(Number(r.value), r.key).toBe(json.quantities[r.key].value);
        expect(Number(r.text), `${r.key} as shown`).toBe(json.quantities[r.key].value);
        expect(Number(r.error), r.key).toBe(json.quantities[r.key].error);
      }

      const drawing = await page.$eval('figure[data-role="drawing"] svg', (svg) => ({
        cutouts: svg.querySelectorAll('path[data-loop="cutout"]').length,
        outers: svg.querySelectorAll('path[data-loop="outer"]').length,
        // the browser's own geometry: bounding box of the drawn material path, in drawing units
        box: (({ width, height }) => ({ width, height }))((svg.querySelector('path[data-role="material"]') as SVGGraphicsElement).getBBox()),
        scale: Number(svg.getAttribute('data-scale')),
      }));
      expect(drawing.cutouts).toBe(c.cutouts);
      expect(drawing.outers).toBe(1);
      // Chromium's bounding box of the exact path matches the part's width and height (to 1e-4 drawing units;
      // getBBox works in single precision)
      expect(Math.abs(drawing.box.width / drawing.scale - json.quantities.width.value)).toBeLessThan(1e-3);
      expect(Math.abs(drawing.box.height / drawing.scale - json.quantities.height.value)).toBeLessThan(1e-3);

      expect(await page.$$eval('svg[data-role="convergence"]', (s) => s.length)).toBe(2);
      expect(requested.filter((u) => !u.startsWith('file:'))).toEqual([]);

      await page.screenshot({ path: join(ARTIFACTS, `${name}.png`), fullPage: true });
      for (const format of ['A4', 'Letter'] as const) {
        const pdf = join(ARTIFACTS, `${name}-${format}.pdf`);
        await page.pdf({ path: pdf, format, printBackground: false, preferCSSPageSize: true });
        const bytes = readFileSync(pdf);
        expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
        expect(statSync(pdf).size).toBeGreaterThan(5000);
      }
      await page.close();
    });
  }
});
