/**
 * The page's member figures (the file as the cross-section of a long member) in Chromium: the built page
 * (dist/page/platewise.html) opened from a file URL, the tee sample and a drawing loaded through the file
 * input, the member figures asked for from the keyboard, and every figure shown (read from data-key /
 * data-value / data-error) checked against `platewise member --json` run on the same file to 1e-12 relative
 * (estimates of the plastic figures about turned principal axes to 1e-3: see ENGINE_ROUNDOFF_ESTIMATES); the
 * rounding against the command line's member table; the saved JSON against the command's output (the tee's
 * byte for byte, the drawing's with the same exception); a plate the command refuses gets its one line. Screenshots go to test-artifacts/page/ (git-ignored).
 * Needs `npm run build` and Chromium.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, launchChromium } from './chromium.js';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const PAGE = join(ROOT, 'dist', 'page', 'platewise.html');
const ARTIFACTS = join(ROOT, 'test-artifacts', 'page');
const NOT_A_BOUND = '(± an estimate, not a bound)';

let folder: string;
let browser: Browser | undefined;
let page: Page;
const leaving: string[] = [];

/** The command line run in the files' folder, so that part names made from file names match the page's. */
function platewise(args: string[]): string {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: folder, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`platewise ${args.join(' ')} exited ${r.status}: ${r.stderr}`);
  return r.stdout;
}

/** Relative agreement to `rel`, 1e-12 unless said (exact zero must be exact). */
const close = (a: number, b: number, rel = 1e-12) => a === b || Math.abs(a - b) <= rel * Math.abs(b);

/**
 * Estimates that may differ beyond 1e-12 between the page and the command line: those of the plastic figures
 * about turned principal axes. Chromium's Math.sin, cos, atan2, pow, exp and log differ from Node 20's in the
 * last bit on 3–11 % of 20,000 inputs (measured here, Chromium 156 against Node's V8 11.3); the axis direction
 * then differs in its last bit, the plastic axis bisection stops on another bracket, and the estimate's
 * round-off terms (src/properties/plastic.ts) move: on the bracket drawing by up to 4e-4 relative, while the
 * values agree to 1e-12. Same bundle run in Node: identical to the command line to the last digit.
 */
const ENGINE_ROUNDOFF_ESTIMATES = new Set(['Z1', 'Z2', 'plasticAxis1', 'plasticAxis2', 'shapeFactor1', 'shapeFactor2']);
const estimateTolerance = (group: string, key: string) => (group === 'plastic' && ENGINE_ROUNDOFF_ESTIMATES.has(key) ? 1e-3 : 1e-12);

/** The page's saved JSON against the command's: the same texts, keys and order; numbers as `close` with the estimate tolerance. */
function sameDocument(got: unknown, want: unknown, path: string[] = []): void {
  const where = path.join('.');
  if (typeof want === 'number') {
    const rel = path.at(-1) === 'error' ? estimateTolerance(path.at(-3) ?? '', path.at(-2) ?? '') : 1e-12;
    expect(close(got as number, want, rel), `${where}: ${got} vs ${want}`).toBe(true);
  } else if (want !== null && typeof want === 'object') {
    expect(Object.keys(got as object), where).toEqual(Object.keys(want));
    for (const k of Object.keys(want)) sameDocument((got as Record<string, unknown>)[k], (want as Record<string, unknown>)[k], [...path, k]);
  } else expect(got, where).toBe(want);
}

/** The value column of the member table as the command line prints it: key → rounded value text, per part. */
function tableTexts(text: string): Map<string, string>[] {
  const parts: Map<string, string>[] = [];
  for (const line of text.split('\n')) {
    if (/^\S.*\(values in /.test(line)) parts.push(new Map());
    const m = /^ {2}(\w+) +(\S+) ± \S+/.exec(line);
    if (m && parts.length) parts.at(-1)!.set(m[1], m[2]);
  }
  return parts;
}

const card = (name: string) => `section.file[data-file="${name}"]`;

interface Shown { group: string; key: string; value: number; error: number | null; valueText: string; errorText: string }

async function shown(name: string, part: number): Promise<Shown[]> {
  return page.$$eval(`${card(name)} [data-role="member-part"][data-index="${part}"] tr[data-key]`, (rows) => rows.map((r) => ({
    group: r.getAttribute('data-group')!, key: r.getAttribute('data-key')!, value: Number(r.getAttribute('data-value')),
    error: r.hasAttribute('data-error') ? Number(r.getAttribute('data-error')) : null,
    valueText: r.querySelectorAll('td')[0].textContent!, errorText: r.querySelectorAll('td')[1].textContent!,
  })));
}

/** Ask for the member figures from the keyboard: Tab from the file's Remove button, past the drawing's controls, reaches the control. */
async function askFromKeyboard(name: string, torsion: boolean, bolts: boolean): Promise<void> {
  const c = card(name);
  for (const [role, want] of [['member-torsion', torsion], ['member-bolts', bolts]] as const) {
    const box = page.locator(`${c} input[data-role="${role}"]`);
    if ((await box.isChecked()) !== want) { await box.focus(); await page.keyboard.press('Space'); }
    expect(await box.isChecked()).toBe(want);
  }
  await page.locator(`${c} .toolbar button:text-is("Remove")`).focus();
  const on = () => page.evaluate(() => document.activeElement?.getAttribute('data-role') ?? document.activeElement?.textContent ?? '');
  const passed: string[] = [];
  for (let i = 0; i < 12 && (await on()) !== 'member'; i++) { await page.keyboard.press('Tab'); passed.push(await on()); }
  expect(passed.at(-1), `tabbed through ${passed.join(', ')}`).toBe('member');
  await page.keyboard.press('Enter');
  await page.waitForSelector(`${c} [data-role="member-result"][data-state="done"]`, { timeout: 120_000 });
}

/** Every figure the page shows equals the command's JSON; every figure of the JSON's groups is shown. */
function checkAgainst(doc: { parts: Record<string, any>[] }, texts: Map<string, string>[], rows: Shown[][], groups: string[]): void {
  expect(rows.length).toBe(doc.parts.length);
  doc.parts.forEach((p, i) => {
    for (const g of groups) {
      const want = Object.entries(p[g] as Record<string, { value?: number }>).filter(([, v]) => typeof v?.value === 'number');
      const got = rows[i].filter((r) => r.group === g);
      expect(got.map((r) => r.key)).toEqual(want.map(([k]) => k));
      for (const r of got) {
        const q = p[g][r.key];
        expect(close(r.value, q.value), `${g}.${r.key}: ${r.value} vs ${q.value}`).toBe(true);
        expect(close(r.error!, q.error, estimateTolerance(g, r.key)), `${g}.${r.key} estimate: ${r.error} vs ${q.error}`).toBe(true);
        // rounded as the command line's member table rounds it
        expect(r.valueText, `${g}.${r.key} text`).toBe(texts[i].get(r.key));
        expect(r.errorText.includes(NOT_A_BOUND), `${g}.${r.key} bound`).toBe(q.errorIsBound === false);
      }
    }
    const bolts = rows[i].filter((r) => r.group === 'boltGroup');
    if (!p.boltGroup) { expect(bolts).toEqual([]); return; }
    // centroid 2, sums 4, principal 2, angle 1, and four figures per bolt
    expect(bolts.length).toBe(9 + 4 * p.boltGroup.bolts.length);
    for (const r of bolts) {
      const v = r.key.split('.').reduce((o: any, k) => o[k], p.boltGroup) as number;
      expect(close(r.value, v), `boltGroup.${r.key}: ${r.value} vs ${v}`).toBe(true);
    }
  });
}

async function savedJson(name: string): Promise<string> {
  const [download] = await Promise.all([page.waitForEvent('download'), page.click(`${card(name)} [data-role="save-member-json"]`)]);
  return readFileSync((await download.path())!, 'utf8');
}

beforeAll(async () => {
  if (!existsSync(PAGE)) throw new Error(`${PAGE} is missing: run npm run build`);
  mkdirSync(ARTIFACTS, { recursive: true });
  folder = mkdtempSync(join(tmpdir(), 'platewise-page-member-'));
  // the project's invented demo parts: a welded tee and a drawn bracket with three bolt holes
  copyFileSync(join(ROOT, 'samples/tee-section-ts1.json'), join(folder, 'tee-section-ts1.json'));
  copyFileSync(join(ROOT, 'samples/bracket.svg'), join(folder, 'bracket.svg'));
  browser = await launchChromium({ width: 1280, height: 900 });
  const allowed = (url: string) => url === pathToFileURL(PAGE).href || url.startsWith('blob:') || url.startsWith('data:');
  await browser.ctx.route('**/*', (route) => {
    if (allowed(route.request().url())) return route.continue();
    leaving.push(route.request().url());
    return route.abort();
  });
  page = await browser.ctx.newPage();
  await page.goto(pathToFileURL(PAGE).href, { waitUntil: 'load' });
  await page.waitForSelector('body[data-ready="true"]');
  await page.setInputFiles('#pick', [join(folder, 'tee-section-ts1.json'), join(folder, 'bracket.svg')]);
  for (const f of ['tee-section-ts1.json', 'bracket.svg']) await page.waitForSelector(`${card(f)}[data-state="done"]`, { timeout: 60_000 });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe('member figures in the page', () => {
  it('shows the tee as `platewise member` does, torsion included, and saves the same JSON', async () => {
    const name = 'tee-section-ts1.json';
    await askFromKeyboard(name, true, false);
    const json = platewise(['member', name, '--json']);
    const doc = JSON.parse(json);
    checkAgainst(doc, tableTexts(platewise(['member', name])), [await shown(name, 0)], ['plastic', 'torsion']);
    // the caution and the prismatic-member note, once each, beside the figures
    const cautions = await page.$$eval(`${card(name)} [data-role="member-result"] .caution`, (e) => e.map((x) => x.textContent));
    expect(cautions).toEqual(doc.cautions);
    expect(cautions.length).toBe(2);
    expect(await savedJson(name)).toBe(json);
    await page.locator(card(name)).screenshot({ path: join(ARTIFACTS, 'member-tee.png') });
  }, 180_000);

  it('shows a drawing without torsion and with its bolt group, as `member --no-torsion --bolts`', async () => {
    const name = 'bracket.svg';
    await askFromKeyboard(name, false, true);
    const json = platewise(['member', name, '--no-torsion', '--bolts', '--json']);
    const doc = JSON.parse(json);
    expect(doc.parts[0].boltGroup.count).toBe(3);
    const rows = await shown(name, 0);
    expect(rows.some((r) => r.group === 'torsion')).toBe(false);
    checkAgainst(doc, tableTexts(platewise(['member', name, '--no-torsion', '--bolts'])), [rows], ['plastic']);
    const cautions = await page.$$eval(`${card(name)} [data-role="member-result"] .caution`, (e) => e.map((x) => x.textContent));
    expect(cautions).toEqual(doc.cautions);
    expect(cautions.length).toBe(1);
    // the same writer: byte for byte but for the last digits of the estimates named above
    const saved = await savedJson(name);
    sameDocument(JSON.parse(saved), doc);
    expect(saved.split('\n').length).toBe(json.split('\n').length);
    await page.locator(card(name)).screenshot({ path: join(ARTIFACTS, 'member-bracket.png') });
    // a narrow window: the member tables scroll sideways inside the panel, the page itself does not
    await page.setViewportSize({ width: 420, height: 900 });
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(420);
    await page.locator(`${card(name)} [data-role="member-result"]`).screenshot({ path: join(ARTIFACTS, 'member-bracket-420.png') });
    await page.setViewportSize({ width: 1280, height: 900 });
  }, 180_000);

  it('net sections along two lines with the card\'s thickness, in cm, as `member --no-torsion --net-line … --thickness --print-unit cm`', async () => {
    const name = 'bracket.svg';
    const c = card(name);
    await page.fill(`${c} input[name="thickness"]`, '6 mm');
    await page.waitForFunction((sel) => { const e = document.querySelector(sel) as HTMLElement; return JSON.parse(e.dataset.settings ?? '{}').thickness === '6 mm' && e.dataset.state === 'done'; }, c);
    const lines = ['30,0 30,60', '100,95 150,95'];
    await page.fill(`${c} textarea[data-role="member-net-lines"]`, lines.join('\n'));
    await page.selectOption(`${c} select[data-role="member-print-unit"]`, 'cm');
    await page.uncheck(`${c} input[data-role="member-torsion"]`);
    await page.uncheck(`${c} input[data-role="member-bolts"]`);
    await page.click(`${c} button[data-role="member"]`);
    await page.waitForFunction((sel) => { const e = document.querySelector(`${sel} [data-role="member-result"]`) as HTMLElement; return e.dataset.state === 'done' && JSON.parse(e.dataset.asked ?? '{}').printUnit === 'cm'; }, c, { timeout: 120_000 });
    const args = ['member', name, '--no-torsion', ...lines.flatMap((l) => ['--net-line', l]), '--thickness', '6 mm', '--print-unit', 'cm'];
    const doc = JSON.parse(platewise([...args, '--json']));
    const table = platewise(args);
    const shownNet = await page.$$eval(`${c} table[data-role="net-section"]`, (ts) => ts.map((t) => ({
      caption: t.querySelector('caption')!.textContent!,
      rows: [...t.querySelectorAll('tr[data-key]')].map((r) => ({ key: r.getAttribute('data-key')!, value: Number(r.getAttribute('data-value')), unit: r.querySelectorAll('td')[2].textContent! })),
    })));
    expect(shownNet.length).toBe(2);
    shownNet.forEach((t, j) => {
      const n = doc.parts[0].netSections[j];
      expect(table).toContain(` ${t.caption}\n`); // the member table's own heading
      for (const r of t.rows) {
        expect(close(r.value, n[r.key].value), `${j}.${r.key}`).toBe(true);
        expect(r.unit).toBe(n[r.key].unit);
      }
    });
    // the second line runs through the centre of the Ø10 hole at (110, 95) and 2 mm off the centre of the Ø10
    // hole at (135, 93): the holes take 10 + 2·√(5² − 2²) mm (chord of a circle, elementary), in cm
    const hole = shownNet[1].rows.find((r) => r.key === 'holeLength')!;
    expect(Math.abs(hole.value - (10 + 2 * Math.sqrt(21)) / 10)).toBeLessThanOrEqual(1e-10);
    const runs = await page.$$eval(`${c} [data-role="member-result"] ul.words li`, (li) => li.map((x) => x.textContent!));
    for (const r of runs.filter((x) => / to .*→/.test(x))) expect(table).toContain(`   ${r}\n`);
    const cautions = await page.$$eval(`${c} [data-role="member-result"] .caution`, (e) => e.map((x) => x.textContent));
    expect(cautions).toEqual(doc.cautions);
    sameDocument(JSON.parse(await savedJson(name)), doc);
    await page.locator(`${c} [data-role="member-result"]`).screenshot({ path: join(ARTIFACTS, 'member-net-sections.png') });
  }, 180_000);

  it('a plate the command refuses (two layers) shows the command line\'s one line beside the file', async () => {
    const name = 'tapered-doubler-td5.json';
    copyFileSync(join(ROOT, 'samples', name), join(folder, name));
    await page.setInputFiles('#pick', [join(folder, name)]);
    await page.waitForSelector(`${card(name)}[data-state="done"]`, { timeout: 60_000 });
    await page.click(`${card(name)} [data-role="member"]`);
    await page.waitForSelector(`${card(name)} [data-role="member-result"][data-state="failed"]`, { timeout: 60_000 });
    const r = spawnSync(process.execPath, [CLI, 'member', name], { cwd: folder, encoding: 'utf8' });
    expect(r.status).not.toBe(0);
    expect(r.stdout).toBe('');
    expect(await page.textContent(`${card(name)} [data-role="member-message"]`)).toBe(r.stderr.trim());
    expect(await page.$$(`${card(name)} [data-role="save-member-json"]`)).toEqual([]);
  }, 120_000);

  it('sent no request out of the page', () => {
    expect(leaving).toEqual([]);
  });
});
