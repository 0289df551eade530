/**
 * The offline page (dist/page/platewise.html, built by web/build.mjs) in a real browser: Debian's Chromium
 * (/usr/bin/chromium; never downloaded) driven by playwright-core, headless, with a fresh profile folder.
 * The page is opened from a file URL; every request is intercepted and anything but the page itself and its
 * own blob:/data: URLs is refused and counted. One sample of each input format is loaded through the file
 * input with plate settings typed in; every figure the page shows (read from data-key / data-value /
 * data-error) must equal `measure --json` with the same settings to 1e-12 relative; a broken file must show
 * the command line's one-line message while the others are measured; a stated-values file must give
 * `compare`'s verdicts and advice; the saved CSV must equal `batch`'s for the same files and settings.
 * Screenshots of each state go to test-artifacts/page/ (git-ignored). Needs `npm run build` and Chromium.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BrowserContext, Page } from 'playwright-core';
import { type Browser, launchChromium } from './chromium.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/base/csv.js';
import { formatValue } from '../../src/output/numbers.js';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const PAGE = join(ROOT, 'dist', 'page', 'platewise.html');
const ARTIFACTS = join(ROOT, 'test-artifacts', 'page');

/** Run the command line in `cwd` (so its labels are the bare file names the page shows). */
function platewise(args: string[], cwd: string, ok: number[] = [0]): { stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd, encoding: 'utf8' });
  if (!ok.includes(r.status ?? -1)) throw new Error(`platewise ${args.join(' ')} exited ${r.status}: ${r.stderr}`);
  return { stdout: r.stdout, stderr: r.stderr };
}

// One file of each format, with the settings typed into the page (and given to the command line); the
// broken file is a part file cut short. Samples are the project's invented demo parts and DXF fixture.
const FILES = [
  { name: 'baseplate.wkt', from: 'samples/baseplate.wkt', thickness: '', material: '', quantity: 1 },
  { name: 'bracket.svg', from: 'samples/bracket.svg', thickness: '6 mm', material: 's355', quantity: 4 },
  { name: 'broken.json', text: '{"name": "cut short", "outline": {"rectangle": [100, 50]},\n', thickness: '', material: '', quantity: 1 },
  // a style sheet hides a construction circle: the page loads its CSS packages on demand (web/shims/module.ts)
  { name: 'etched-plate-ep7.svg', from: 'samples/etched-plate-ep7.svg', thickness: '3 mm', material: 's355', quantity: 2 },
  { name: 'endplate-e2.json', from: 'samples/job/endplate-e2.json', thickness: '12 mm', material: 's355', quantity: 6 },
  { name: 'gusset-g2.json', from: 'samples/gusset-g2.json', thickness: '10', material: 'aluminium', quantity: 2 },
  { name: 'gusset.geojson', from: 'samples/gusset.geojson', thickness: '', material: '', quantity: 1 },
  { name: 'lwpolyline-plate.dxf', from: 'tests/fixtures/dxf/lwpolyline-plate.dxf', thickness: '8 mm', material: '1.4301', quantity: 3 },
  // markup in a file name (the part is named after the file): it must stay text
  { name: '<b>odd<b> <img src=x onerror=alert(1)> &amp; co.wkt', text: 'POLYGON ((0 0, 100 0, 100 60, 0 60, 0 0), (20 20, 40 20, 40 40, 20 40, 20 20))\n', thickness: '', material: '', quantity: 1 },
];

let browser: Browser | undefined;
let folder: string;
let ctx: BrowserContext;
let page: Page;
const leaving: string[] = [];
/** The saved report, which the test itself opens from the artefacts folder. */
const REPORT = join(ARTIFACTS, 'gusset-g2.report.html');
const allowed = (url: string) => url === pathToFileURL(PAGE).href || url === pathToFileURL(REPORT).href || url.startsWith('blob:') || url.startsWith('data:');

function flags(f: (typeof FILES)[number]): string[] {
  return [...(f.thickness ? ['--thickness', f.thickness] : []), ...(f.material ? ['--material', f.material] : [])];
}

beforeAll(async () => {
  if (!existsSync(PAGE)) throw new Error(`${PAGE} is missing: run npm run build`);
  mkdirSync(ARTIFACTS, { recursive: true });
  folder = mkdtempSync(join(tmpdir(), 'platewise-page-files-'));
  for (const f of FILES) {
    if (f.from) copyFileSync(join(ROOT, f.from), join(folder, f.name));
    else writeFileSync(join(folder, f.name), f.text!);
  }
  copyFileSync(join(ROOT, 'samples/job/endplate-e2.ref.csv'), join(folder, 'endplate-e2.ref.csv'));
  browser = await launchChromium({ width: 1280, height: 900 });
  ctx = browser.ctx;
  // request interception: the page file itself, and the page's own blob: and data: URLs, may load; anything else
  // is refused and counted
  await ctx.route('**/*', (route) => {
    const url = route.request().url();
    if (allowed(url)) return route.continue();
    leaving.push(url);
    return route.abort();
  });
  ctx.on('request', (r) => {
    if (!allowed(r.url())) leaving.push(r.url());
  });
  page = await ctx.newPage();
  await page.goto(pathToFileURL(PAGE).href, { waitUntil: 'load' });
  await page.waitForSelector('body[data-ready="true"]');
  await page.screenshot({ path: join(ARTIFACTS, '1-empty.png') });
  await page.setInputFiles('#pick', FILES.map((f) => join(folder, f.name)));
  for (const f of FILES) {
    const card = `section.file[data-file="${cssText(f.name)}"]`;
    await page.waitForSelector(card);
    if (f.thickness) await page.fill(`${card} input[name="thickness"]`, f.thickness);
    if (f.material) await page.fill(`${card} input[name="material"]`, f.material);
    if (f.quantity !== 1) await page.fill(`${card} input[name="quantity"]`, String(f.quantity));
  }
  // settled: every card measured (and drawn) with exactly its settings, and the table of all files made after them
  await page.waitForFunction((files) => files.every((f) => {
    const c = [...document.querySelectorAll('section.file')].find((x) => x.getAttribute('data-file') === f.name) as HTMLElement | undefined;
    if (!c || !c.dataset.settings || !(c.dataset.state === 'failed' || (c.dataset.state === 'done' && c.dataset.drawn === 'true'))) return false;
    const s = JSON.parse(c.dataset.settings);
    return s.thickness === f.thickness && s.material === f.material && s.quantity === f.quantity;
  }) && (document.getElementById('all') as HTMLElement).dataset.state === 'current', FILES, { timeout: 120_000 });
  await page.screenshot({ path: join(ARTIFACTS, '2-files-1280.png'), fullPage: true });
}, 180_000);

afterAll(async () => {
  await browser?.close();
  if (folder) rmSync(folder, { recursive: true, force: true });
});

/** A file name inside a CSS attribute selector's double quotes. */
function cssText(s: string): string {
  return s.replace(/["\\]/g, '\\$&');
}

/** Relative agreement to 1e-12 (exact zero must be exact). */
function close(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-12 * Math.abs(b);
}

describe('the offline page in Chromium', () => {
  for (const f of FILES.filter((x) => x.name !== 'broken.json')) {
    it(`${f.name}: every figure shown equals measure --json ${flags(f).join(' ')}`, async () => {
      const out = JSON.parse(platewise(['measure', f.name, '--json', ...flags(f)], folder).stdout);
      const docs = out.parts ?? [out];
      const parts = await page.$$eval(`section.file[data-file="${cssText(f.name)}"] article[data-role="part"]`, (arts) => arts.map((a) => ({
        name: a.getAttribute('data-part'),
        rows: [...a.querySelectorAll('tr[data-key][data-value]')].map((tr) => ({
          group: tr.getAttribute('data-group')!, key: tr.getAttribute('data-key')!, value: tr.getAttribute('data-value')!, error: tr.getAttribute('data-error')!,
          text: tr.querySelector('td.num')?.textContent ?? '',
        })),
        drawn: a.querySelectorAll('[data-role="viewer"] img').length,
      })));
      expect(parts.length).toBe(docs.length);
      parts.forEach((p, i) => {
        const doc = docs[i];
        expect(p.name).toBe(doc.part);
        expect(p.drawn).toBe(1);
        const expected: Record<string, Record<string, { value: number; error: number }>> = {
          section: doc.quantities, mass: doc.massProperties?.quantities ?? {}, fabrication: doc.fabrication?.quantities ?? {},
        };
        for (const [group, q] of Object.entries(expected)) {
          const shown = p.rows.filter((r) => r.group === group);
          expect(shown.map((r) => r.key), `${f.name} ${group}`).toEqual(Object.keys(q));
          for (const r of shown) {
            expect(close(Number(r.value), q[r.key].value), `${f.name} ${r.key}: page ${r.value}, CLI ${q[r.key].value}`).toBe(true);
            expect(close(Number(r.error), q[r.key].error), `${f.name} ${r.key} estimate: page ${r.error}, CLI ${q[r.key].error}`).toBe(true);
            // shown rounded to what its estimate supports, by the command line's own rule
            expect(r.text, `${f.name} ${r.key} shown`).toBe(formatValue(Number(r.value), Number(r.error)));
          }
        }
        if (f.material) expect(Object.keys(expected.mass).length, `${f.name}: mass shown`).toBeGreaterThan(0);
      });
    });
  }

  it('a broken file shows the command line\'s one-line message beside it, and the other files are measured', async () => {
    const cli = spawnSync(process.execPath, [CLI, 'measure', 'broken.json'], { cwd: folder, encoding: 'utf8' });
    expect(cli.status).toBe(2);
    const line = cli.stderr.trim();
    expect(line.split('\n')).toHaveLength(1);
    const card = 'section.file[data-file="broken.json"]';
    expect(await page.getAttribute(card, 'data-state')).toBe('failed');
    expect((await page.textContent(`${card} [data-role="message"]`))!.trim()).toBe(line);
    expect(await page.$$(`${card} article[data-role="part"]`)).toHaveLength(0);
    expect(await page.$$eval('section.file[data-state="done"]', (s) => s.length)).toBe(FILES.length - 1);
    await page.locator(card).screenshot({ path: join(ARTIFACTS, '3-broken-file.png') });
  });

  it('a stated-values file gives compare\'s verdict, hints and advice for each quantity', async () => {
    const f = FILES.find((x) => x.name === 'endplate-e2.json')!;
    const cli = JSON.parse(platewise(['compare', f.name, '--reference', 'endplate-e2.ref.csv', '--json', ...flags(f)], folder, [0, 1]).stdout);
    const card = `section.file[data-file="${f.name}"]`;
    await page.setInputFiles(`${card} input[data-role="reference"]`, join(folder, 'endplate-e2.ref.csv'));
    await page.waitForSelector(`${card} table[data-role="verdicts"]`);
    const shown = await page.$$eval(`${card} table[data-role="verdicts"] tbody tr`, (trs) => trs.map((tr) => ({
      key: tr.getAttribute('data-key'), verdict: tr.getAttribute('data-verdict'), advice: tr.lastElementChild!.textContent,
    })));
    expect(shown.map((r) => r.key)).toEqual(cli.rows.map((r: { quantity: string }) => r.quantity));
    expect(shown.map((r) => r.verdict)).toEqual(cli.rows.map((r: { verdict: string }) => r.verdict));
    expect(shown.map((r) => r.advice)).toEqual(cli.rows.map((r: { advice: string[] }) => r.advice.join(' ')));
    // the demo reference misses the slot among the pierces on purpose: the check must find it
    expect(shown.some((r) => r.verdict === 'fail')).toBe(true);
    expect(await page.getAttribute(`${card} [data-verdict]`, 'data-verdict')).toBe(cli.verdict);
    await page.locator(card).screenshot({ path: join(ARTIFACTS, '4-compare.png') });
  });

  it('the saved CSV equals batch --csv on a manifest with the same files and settings; totals equal batch\'s summary', async () => {
    const manifest = ['file,quantity,material,thickness', ...FILES.map((f) => `${f.name},${f.quantity},${f.material},${f.thickness}`)].join('\n') + '\n';
    writeFileSync(join(folder, 'manifest.csv'), manifest);
    const cli = platewise(['batch', 'manifest.csv', '--csv', '--jobs', '1', '--quiet'], folder, [0, 1]).stdout;
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#batch-csv')]);
    const saved = readFileSync((await download.path())!, 'utf8');
    writeFileSync(join(ARTIFACTS, 'batch-page.csv'), saved);
    writeFileSync(join(ARTIFACTS, 'batch-cli.csv'), cli);
    // Same writer, same rows: every text cell equal, every number equal to 1e-12 relative. Not byte for byte:
    // Chromium's JavaScript engine and Node 20's differ in the last bit of Math.atan2 (measured here:
    // atan2(-6991546.61882785, -7263310.854925769) is -2.3752568567200214 in Node 20.19 / V8 11.3 and
    // -2.375256856720022 in Chromium 156), so principalAngle can differ in its 16th digit.
    const a = parseCsv(saved, 'page'), b = parseCsv(cli, 'batch');
    expect(a.length).toBe(b.length);
    a.forEach((row, i) => {
      expect(row.length, `row ${i}`).toBe(b[i].length);
      row.forEach((cell, k) => {
        const x = Number(cell), y = Number(b[i][k]);
        if (cell !== '' && Number.isFinite(x) && Number.isFinite(y) && b[i][k] !== '') expect(close(x, y), `row ${i}, ${b[0][k]}: page ${cell}, batch ${b[i][k]}`).toBe(true);
        else expect(cell, `row ${i}, ${b[0][k]}`).toBe(b[i][k]);
      });
    });
    platewise(['batch', 'manifest.csv', '--output', 'out.csv', '--quiet'], folder, [0, 1]);
    const summary = JSON.parse(readFileSync(join(folder, 'out.summary.json'), 'utf8')).summary;
    for (const k of ['pieces', 'netMassKg', 'blankMassKg', 'cutLengthM', 'pierces']) {
      const v = Number(await page.getAttribute(`#totals [data-total="${k}"]`, 'data-value'));
      expect(close(v, summary[k]), `total ${k}: page ${v}, batch ${summary[k]}`).toBe(true);
    }
    await page.locator('#all').screenshot({ path: join(ARTIFACTS, '5-all-files.png') });
  });

  it('names and texts from files stay text: no element made from a file name', async () => {
    const f = FILES.at(-1)!;
    const card = `section.file[data-file="${cssText(f.name)}"]`;
    expect(await page.textContent(`${card} h2`)).toBe(f.name);
    expect(await page.$$(`${card} b`)).toHaveLength(0);
    expect(await page.$$('main img:not([data-role="viewer"] img)')).toHaveLength(0);
    expect(await page.getAttribute(`${card} article[data-role="part"]`, 'data-part')).toBe(f.name);
  });

  it('the saved HTML report of a part shows the figures of measure --json', async () => {
    const f = FILES.find((x) => x.name === 'gusset-g2.json')!;
    const out = JSON.parse(platewise(['measure', f.name, '--json', ...flags(f)], folder).stdout);
    const [download] = await Promise.all([page.waitForEvent('download'), page.click(`section.file[data-file="${f.name}"] [data-role="save-report"]`)]);
    writeFileSync(REPORT, readFileSync((await download.path())!));
    const report = await ctx.newPage();
    await report.goto(pathToFileURL(REPORT).href);
    const rows = await report.$$eval('table[data-role="quantities"] tr[data-key]', (trs) => trs.map((tr) => ({
      key: tr.getAttribute('data-key')!, value: Number(tr.querySelector('td[data-value]')!.getAttribute('data-value')),
    })));
    expect(rows.map((r) => r.key)).toEqual(Object.keys(out.quantities));
    for (const r of rows) expect(close(r.value, out.quantities[r.key].value), r.key).toBe(true);
    expect(await report.$$('figure[data-role="drawing"] svg path[data-loop="cutout"]')).toHaveLength(6);
    // the trace block names the file and the SHA-256 of its bytes, computed in the browser
    expect(await report.textContent('[data-role="file"]')).toBe(f.name);
    expect(await report.textContent('[data-role="sha256"]')).toBe(createHash('sha256').update(readFileSync(join(folder, f.name))).digest('hex'));
    await report.close();
  });

  it('the drawing zooms and pans from the keyboard', async () => {
    const viewer = 'section.file[data-file="bracket.svg"] [data-role="viewer"]';
    await page.focus(viewer);
    const before = await page.$eval(`${viewer} img`, (i) => (i as HTMLElement).style.transform);
    await page.keyboard.press('+');
    await page.keyboard.press('ArrowLeft');
    const after = await page.$eval(`${viewer} img`, (i) => (i as HTMLElement).style.transform);
    const scale = (t: string) => Number(/scale\(([\d.e-]+)\)/.exec(t)![1]);
    expect(scale(after) / scale(before)).toBeCloseTo(1.25, 5); // the style keeps 6 significant digits
    await page.keyboard.press('0');
    expect(scale(await page.$eval(`${viewer} img`, (i) => (i as HTMLElement).style.transform)) / scale(before)).toBeCloseTo(1, 5);
  });

  it('a file dropped on the page is taken once, measured, and can be removed again', async () => {
    const before = await page.$$eval('section.file', (x) => x.length);
    await page.evaluate(() => {
      const dt = new DataTransfer();
      dt.items.add(new File(['POLYGON ((0 0, 50 0, 50 20, 0 20, 0 0))'], 'dropped.wkt'));
      document.getElementById('intake')!.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    });
    const card = 'section.file[data-file="dropped.wkt"][data-state="done"]';
    await page.waitForSelector(card);
    expect(await page.$$eval('section.file', (x) => x.length)).toBe(before + 1);
    expect(Number(await page.getAttribute(`${card} tr[data-key="area"]`, 'data-value'))).toBe(1000); // 50 × 20
    await page.click(`${card} button:text("Remove")`);
    expect(await page.$$eval('section.file', (x) => x.length)).toBe(before);
  });

  it('works in a narrow window: no sideways scrolling of the page, controls reachable by keyboard', async () => {
    await page.setViewportSize({ width: 420, height: 900 });
    await page.waitForTimeout(200);
    const wide = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(wide).toBeLessThanOrEqual(0);
    await page.screenshot({ path: join(ARTIFACTS, '6-narrow.png'), fullPage: false });
    // every control has a name a screen reader can say
    const unnamed = await page.$$eval('button, input:not(.visually-hidden), [tabindex="0"]', (els) => els.filter((e) => {
      const id = e.getAttribute('id');
      const label = id ? document.querySelector(`label[for="${id}"]`) : null;
      return !(e.getAttribute('aria-label') || e.textContent?.trim() || label || e.closest('label'));
    }).length);
    expect(unnamed).toBe(0);
    await page.setViewportSize({ width: 1280, height: 900 });
    // Tab from the top reaches the file picker first
    // a click on the title band sets where keyboard focus starts, as a person's click would
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.mouse.click(640, 20);
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('pick');
  });

  it('no request left the page', () => {
    expect(leaving).toEqual([]);
  });
});
