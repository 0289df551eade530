/**
 * The page's drawing unit (the `--units` of the command line) in Chromium: an invented unitless SVG plate is
 * read by the default rule (CSS pixels, with the warning) and, with "mm" chosen, as millimetres — each time
 * every section figure equal to `platewise measure --json` with the same flags to 1e-12 relative; a unit given
 * to a part file gets the command line's refusal line while the figures stay as the file says. The mass units
 * (the command line's --mass-unit with --inertia-unit): every mass figure shown and the saved JSON equal
 * `measure --json` with the same flags, and each unit cell says the unit chosen. A materials file (the command
 * line's --materials-file): a material of its own gives the figures of `measure --materials-file`, and a
 * refused file shows the command line's one line while the figures stay.
 * Needs `npm run build` and Chromium.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
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

// invented test data: a 160 × 80 plate with a Ø30 hole, in SVG user units with no unit stated
const SVG = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 160 80"><path fill-rule="evenodd" d="M0 0H160V80H0Z M95 40A15 15 0 1 0 65 40A15 15 0 1 0 95 40Z"/></svg>\n';
const PART = JSON.stringify({ part: 'unit test plate', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [120, 60] } } });

let folder: string;
let browser: Browser | undefined;
let page: Page;

function platewise(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: folder, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
const close = (a: number, b: number) => a === b || Math.abs(a - b) <= 1e-12 * Math.abs(b);
const card = (name: string) => `section.file[data-file="${name}"]`;

async function settled(name: string, units: string): Promise<void> {
  await page.waitForFunction(([c, u]) => {
    const e = document.querySelector(c) as HTMLElement | null;
    return !!e && !!e.dataset.settings && JSON.parse(e.dataset.settings).units === u && (e.dataset.state === 'done' || e.dataset.state === 'failed');
  }, [card(name), units] as const, { timeout: 60_000 });
}

async function settledMass(name: string, massUnits: string): Promise<void> {
  await page.waitForFunction(([c, m]) => {
    const e = document.querySelector(c) as HTMLElement | null;
    return !!e && !!e.dataset.settings && JSON.parse(e.dataset.settings).massUnits === m && e.dataset.state === 'done';
  }, [card(name), massUnits] as const, { timeout: 60_000 });
}

async function sectionShown(name: string): Promise<Map<string, number>> {
  const rows = await page.$$eval(`${card(name)} tr[data-key][data-value][data-group="section"]`, (trs) => trs.map((t) => [t.getAttribute('data-key')!, Number(t.getAttribute('data-value'))] as const));
  return new Map(rows);
}

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'platewise-page-units-'));
  mkdirSync(ARTIFACTS, { recursive: true });
  writeFileSync(join(folder, 'plate.svg'), SVG);
  writeFileSync(join(folder, 'plate.json'), PART);
  // the project's invented demo drawing with a cut layer, an etch layer and a hidden notes layer
  writeFileSync(join(folder, 'etched.svg'), readFileSync(join(ROOT, 'samples', 'etched-plate-ep7.svg')));
  // invented materials for the test: one of its own, and a file the reader refuses (no "source")
  writeFileSync(join(folder, 'shop.json'), JSON.stringify({ materials: { 'shop-alloy-7': { density: 2.81, unit: 'g/cm3', source: 'invented for a test', name: 'Shop alloy 7 (invented)' } } }));
  writeFileSync(join(folder, 'bad-materials.json'), JSON.stringify({ materials: { 'no-source': { density: 7850, unit: 'kg/m3' } } }));
  browser = await launchChromium({ width: 1280, height: 900 });
  page = await browser.ctx.newPage();
  await page.goto(pathToFileURL(PAGE).href);
  await page.waitForSelector('body[data-ready="true"]');
  await page.setInputFiles('#pick', [join(folder, 'plate.svg'), join(folder, 'plate.json'), join(folder, 'etched.svg')]);
}, 120_000);

afterAll(async () => {
  await browser?.close();
  rmSync(folder, { recursive: true, force: true });
});

describe('the drawing unit in the page', () => {
  it('a unitless SVG: the default rule with its warning, then mm as chosen; figures equal measure --json with the same flags', async () => {
    await settled('plate.svg', '');
    const byDefault = JSON.parse(platewise(['measure', 'plate.svg', '--json']).stdout);
    let got = await sectionShown('plate.svg');
    expect(got.size).toBe(Object.keys(byDefault.quantities).length);
    for (const [k, q] of Object.entries(byDefault.quantities) as [string, { value: number }][]) expect(close(got.get(k)!, q.value), k).toBe(true);
    expect(await page.textContent(card('plate.svg'))).toContain('CSS pixels');
    await page.selectOption(`${card('plate.svg')} select[name="units"]`, 'mm');
    await settled('plate.svg', 'mm');
    const inMm = JSON.parse(platewise(['measure', 'plate.svg', '--json', '--units', 'mm']).stdout);
    got = await sectionShown('plate.svg');
    for (const [k, q] of Object.entries(inMm.quantities) as [string, { value: number }][]) expect(close(got.get(k)!, q.value), k).toBe(true);
    // the closed form of the invented plate: 160 × 80 − π·15² (elementary)
    expect(close(got.get('area')!, 160 * 80 - Math.PI * 225)).toBe(true);
    await page.locator(card('plate.svg')).screenshot({ path: join(ARTIFACTS, 'units-mm.png') });
  });

  it('a unit given to a part file: the command line\'s refusal next to it, the figures as the file says', async () => {
    await page.selectOption(`${card('plate.json')} select[name="units"]`, 'cm');
    await settled('plate.json', 'cm');
    const refused = platewise(['measure', 'plate.json', '--units', 'cm']);
    expect(refused.status).toBe(2);
    expect((await page.textContent(`${card('plate.json')} [data-role="message"]`))!.trim()).toBe(refused.stderr.trim());
    const asFile = JSON.parse(platewise(['measure', 'plate.json', '--json']).stdout);
    const got = await sectionShown('plate.json');
    expect(close(got.get('area')!, asFile.quantities.area.value)).toBe(true);
  });
});

describe('the mass units in the page', () => {
  it('lb with lb·in²: the mass figures and their units equal measure --json --mass-unit lb --inertia-unit lb·in²', async () => {
    // the part file's plate: 120 × 60 mm; 10 mm of s355 typed in, as --thickness and --material
    await page.selectOption(`${card('plate.json')} select[name="units"]`, '');
    await page.fill(`${card('plate.json')} input[name="thickness"]`, '10 mm');
    await page.fill(`${card('plate.json')} input[name="material"]`, 's355');
    await page.selectOption(`${card('plate.json')} select[name="massUnits"]`, 'lb');
    await settledMass('plate.json', 'lb');
    await page.waitForFunction((c) => JSON.parse((document.querySelector(c) as HTMLElement).dataset.settings!).material === 's355', card('plate.json'));
    await page.waitForSelector(`${card('plate.json')}[data-state="done"] tr[data-group="mass"]`);
    const cli = JSON.parse(platewise(['measure', 'plate.json', '--json', '--thickness', '10 mm', '--material', 's355', '--mass-unit', 'lb', '--inertia-unit', 'lb·in²']).stdout);
    const rows = await page.$$eval(`${card('plate.json')} tr[data-group="mass"]`, (trs) => trs.map((t) => ({ key: t.getAttribute('data-key')!, value: Number(t.getAttribute('data-value')), unit: t.lastElementChild!.textContent!.trim() })));
    expect(rows.length).toBe(Object.keys(cli.massProperties.quantities).length);
    for (const r of rows) {
      expect(close(r.value, cli.massProperties.quantities[r.key].value), r.key).toBe(true);
      if (r.key === 'mass') expect(r.unit).toBe('lb');
      if (r.key === 'massMomentZ') expect(r.unit).toBe('lb·in²');
    }
    expect(cli.massProperties.units.mass).toBe('lb');
    // 120 × 60 × 10 mm of steel at 7850 kg/m³ (design value of density for steel, EN 1993-1-1:2005, 3.2.6, the
    // built-in table's figure for s355) in pounds (1 lb = 0.45359237 kg exactly, NIST SP 811 appendix B)
    const mass = rows.find((r) => r.key === 'mass')!.value;
    expect(Math.abs(mass - 0.12 * 0.06 * 0.01 * 7850 / 0.45359237)).toBeLessThanOrEqual(1e-12 * mass);
  });
});

describe('a materials file in the page', () => {
  it('a material of its own: figures equal measure --materials-file; a refused file shows the one line, figures stay', async () => {
    await page.setInputFiles('#materials-pick', join(folder, 'shop.json'));
    await page.waitForSelector('body[data-materials-file="shop.json"]');
    expect(await page.textContent('#materials-state')).toMatch(/shop\.json: 1 material/);
    await page.selectOption(`${card('plate.json')} select[name="massUnits"]`, '');
    await page.fill(`${card('plate.json')} input[name="material"]`, 'shop-alloy-7');
    await page.waitForFunction((c) => { const e = document.querySelector(c) as HTMLElement; const s = JSON.parse(e.dataset.settings!); return s.material === 'shop-alloy-7' && s.massUnits === '' && e.dataset.state === 'done'; }, card('plate.json'));
    await page.waitForSelector(`${card('plate.json')} tr[data-group="mass"][data-key="mass"]`);
    const cli = JSON.parse(platewise(['measure', 'plate.json', '--json', '--thickness', '10 mm', '--material', 'shop-alloy-7', '--materials-file', 'shop.json']).stdout);
    const shown = Number(await page.getAttribute(`${card('plate.json')} tr[data-group="mass"][data-key="mass"]`, 'data-value'));
    expect(close(shown, cli.massProperties.quantities.mass.value)).toBe(true);
    // 120 × 60 × 10 mm at 2.81 g/cm³ = 2810 kg/m³ (1 g/cm³ = 1000 kg/m³ exactly)
    expect(Math.abs(shown - 0.12 * 0.06 * 0.01 * 2810)).toBeLessThanOrEqual(1e-12 * shown);
    const refused = platewise(['materials', '--materials-file', 'bad-materials.json']);
    expect(refused.status).toBe(2);
    await page.setInputFiles('#materials-pick', join(folder, 'bad-materials.json'));
    await page.waitForSelector('body[data-materials-file="refused"]');
    expect((await page.textContent('#materials-message'))!.trim()).toBe(refused.stderr.trim());
    // the table stays as it was, and says so: the same figures
    expect(await page.textContent('#materials-state')).toMatch(/shop\.json: 1 material/);
    const again = Number(await page.getAttribute(`${card('plate.json')} tr[data-group="mass"][data-key="mass"]`, 'data-value'));
    expect(again).toBe(shown);
  });
});

describe('drawing options in the page', () => {
  it('--skip-layers as typed: the reading and the figures of measure --skip-layers; a refused --cut-layers shows the command line\'s line', async () => {
    const c = card('etched.svg');
    await page.click(`${c} details[data-role="drawing-options"] summary`);
    await page.fill(`${c} input[name="skipLayers"]`, 'etch');
    await page.waitForFunction((sel) => { const e = document.querySelector(sel) as HTMLElement; return JSON.parse(e.dataset.settings ?? '{}').skipLayers === 'etch' && e.dataset.state === 'done'; }, c);
    const cli = platewise(['measure', 'etched.svg', '--skip-layers', 'etch']);
    const readLine = cli.stdout.split('\n').find((l) => l.startsWith('read as'))!;
    expect(readLine).toMatch(/skipped-layer 2/);
    expect(await page.textContent(c)).toContain(readLine);
    const json = JSON.parse(platewise(['measure', 'etched.svg', '--skip-layers', 'etch', '--json']).stdout);
    const got = await sectionShown('etched.svg');
    for (const [k, q] of Object.entries(json.quantities) as [string, { value: number }][]) expect(close(got.get(k)!, q.value), k).toBe(true);
    // the etch layer holds open lines: as cut layers they are refused; the page shows that line and the figures as the file says
    await page.fill(`${c} input[name="skipLayers"]`, '');
    await page.fill(`${c} input[name="cutLayers"]`, 'etch');
    await page.waitForFunction((sel) => { const e = document.querySelector(sel) as HTMLElement; const s = JSON.parse(e.dataset.settings ?? '{}'); return s.cutLayers === 'etch' && s.skipLayers === '' && e.dataset.state === 'done'; }, c);
    const refused = platewise(['measure', 'etched.svg', '--cut-layers', 'etch']);
    expect(refused.status).toBe(2);
    expect((await page.textContent(`${c} [data-role="message"]`))!.trim()).toBe(refused.stderr.trim());
    const asFile = JSON.parse(platewise(['measure', 'etched.svg', '--json']).stdout);
    expect(close((await sectionShown('etched.svg')).get('area')!, asFile.quantities.area.value)).toBe(true);
    await page.locator(c).screenshot({ path: join(ARTIFACTS, 'drawing-options.png') });
  });
});
