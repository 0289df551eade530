/**
 * No label crossed by a line, no two labels on each other, nothing cut off: checked in Chromium on the real
 * glyph boxes (Debian's /usr/bin/chromium through playwright-core, as in report.test.ts). For every <text>
 * of a drawing (draw, draw --sheet, the report's figure and plots) its box (getBBox through getCTM, so
 * rotated labels count with their turned box) is tested against every stroked line, path, rectangle and
 * circle, sampled every drawing unit along its length (getPointAtLength), and against every other label;
 * each box must lie inside the picture. The mesh overlay and shading are texture under a white halo and
 * are left out. Screenshots go to test-artifacts/browser/ (git-ignored). The parts below are invented.
 * Needs the dist build and Chromium (.ci/run installs it).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ARTIFACTS, useChromium } from './chromium.js';

const ROOT = join(import.meta.dirname, '..', '..');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const dir = mkdtempSync(join(tmpdir(), 'platewise-overlap-'));

function platewise(args: string[]): void {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`platewise ${args.join(' ')} failed: ${r.stderr}`);
}

function part(name: string, doc: unknown): string {
  const p = join(dir, name);
  writeFileSync(p, JSON.stringify(doc));
  return p;
}

// invented parts that stress the layout
const SITE = part('site.json', {
  part: 'SP-12 splice plate at site coordinates, grid line C/14, level 3 (invented)', units: 'mm',
  outline: { rectangle: { corner: [2512345.678, 5612345.123], size: [240, 160] } },
  cutouts: [{ circle: { center: [2512385.678, 5612385.123], diameter: 22 } }, { circle: { center: [2512545.678, 5612465.123], diameter: 22 } }],
});
const TALL = part('tall.json', { part: 'flat bar (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [8, 400] } } });
const CENTRED = part('centred.json', {
  part: 'ring flange centred on the origin (invented)', units: 'mm',
  outline: { circle: { center: [0, 0], diameter: 300 } },
  cutouts: [{ circle: { center: [0, 0], diameter: 140 } }, { circle: { center: [110, 0], diameter: 18 } }],
});
const TILTED = part('tilted.json', {
  part: 'skewed cleat (invented)', units: 'mm',
  outline: { polygon: [[0, 0], [160, 40], [200, 200], [20, 90]] },
});
const SHEET = join(dir, 'sheet.geojson');
writeFileSync(SHEET, JSON.stringify({
  type: 'FeatureCollection', features: [
    { type: 'Feature', properties: { name: 'large panel (invented)' }, geometry: { type: 'Polygon', coordinates: [[[0, 0], [1200, 0], [1200, 600], [0, 600], [0, 0]], [[100, 100], [100, 300], [300, 300], [300, 100], [100, 100]]] } },
    { type: 'Feature', properties: { name: 'small washer plate (invented)' }, geometry: { type: 'Polygon', coordinates: [[[1500, 0], [1540, 0], [1540, 40], [1500, 40], [1500, 0]]] } },
  ],
}));

interface Finding { text: string; role: string | null; with: string }

/** In the page: every label against every stroked shape and every other label; labels inside the picture. */
function findOverlaps(svgs: SVGSVGElement[]): Finding[] {
  const out: Finding[] = [];
  for (const svg of svgs) {
    if (svg.ownerSVGElement) continue; // a nested viewport is checked with its drawing
    const root = svg.getCTM()!.inverse();
    const toRoot = (el: SVGGraphicsElement, x: number, y: number) => {
      const p = new DOMPoint(x, y).matrixTransform(root.multiply(el.getCTM()!));
      return [p.x, p.y] as const;
    };
    const vb = svg.viewBox.baseVal;
    const boxes = ([...svg.querySelectorAll('text')] as SVGTextElement[]).map((t) => {
      const b = t.getBBox();
      const c = [toRoot(t, b.x, b.y), toRoot(t, b.x + b.width, b.y), toRoot(t, b.x, b.y + b.height), toRoot(t, b.x + b.width, b.y + b.height)];
      // half a unit in from every side: strokes that only graze the em box are not counted
      return { el: t, x0: Math.min(...c.map((p) => p[0])) + 0.5, y0: Math.min(...c.map((p) => p[1])) + 0.5, x1: Math.max(...c.map((p) => p[0])) - 0.5, y1: Math.max(...c.map((p) => p[1])) - 0.5 };
    });
    const name = (el: Element) => `${el.tagName}${el.closest('[data-role]') ? ` in ${el.closest('[data-role]')!.getAttribute('data-role')}` : ''}`;
    for (const b of boxes) {
      if (b.x0 < vb.x - 0.5 || b.y0 < vb.y - 0.5 || b.x1 > vb.x + vb.width + 0.5 || b.y1 > vb.y + vb.height + 0.5) out.push({ text: b.el.textContent!, role: b.el.getAttribute('data-role'), with: 'the edge of the picture' });
    }
    for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i], b = boxes[j];
      if (a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1) out.push({ text: a.el.textContent!, role: a.el.getAttribute('data-role'), with: `label "${b.el.textContent}"` });
    }
    const shapes = [...svg.querySelectorAll('line, path, rect, circle')].filter((el) => {
      if (el.closest('[data-role="mesh"], [data-role="shading"]')) return false;
      const s = getComputedStyle(el);
      return s.stroke !== 'none' && parseFloat(s.strokeWidth) > 0;
    }) as SVGGeometryElement[];
    for (const sh of shapes) {
      // a shape inside a nested viewport (muted geometry) is seen only inside it: samples outside are skipped
      const port = sh.ownerSVGElement !== svg ? sh.ownerSVGElement : null;
      const pb = port ? [port.x.baseVal.value, port.y.baseVal.value, port.x.baseVal.value + port.width.baseVal.value, port.y.baseVal.value + port.height.baseVal.value] : null;
      const seen = (p: readonly [number, number]) => !pb || (p[0] >= pb[0] && p[0] <= pb[2] && p[1] >= pb[1] && p[1] <= pb[3]);
      const len = sh.getTotalLength();
      const n = Math.max(2, Math.ceil(len));
      let prev: readonly [number, number] | undefined;
      for (let i = 0; i <= n; i++) {
        const p = sh.getPointAtLength((len * i) / n);
        const q = toRoot(sh, p.x, p.y);
        // consecutive samples further apart than 2.5 steps lie on two subpaths: no line between them
        if (prev && seen(prev) && seen(q) && Math.hypot(q[0] - prev[0], q[1] - prev[1]) <= 2.5 * Math.max(1, len / n)) {
          for (const b of boxes) {
            // segment prev→q against the box (Liang–Barsky)
            let t0 = 0, t1 = 1;
            const dx = q[0] - prev[0], dy = q[1] - prev[1];
            const P = [-dx, dx, -dy, dy], Q = [prev[0] - b.x0, b.x1 - prev[0], prev[1] - b.y0, b.y1 - prev[1]];
            let hit = true;
            for (let k = 0; k < 4 && hit; k++) {
              if (P[k] === 0) { if (Q[k] < 0) hit = false; continue; }
              const r = Q[k] / P[k];
              if (P[k] < 0) t0 = Math.max(t0, r); else t1 = Math.min(t1, r);
              if (t0 > t1) hit = false;
            }
            if (hit) out.push({ text: b.el.textContent!, role: b.el.getAttribute('data-role'), with: name(sh) });
          }
        }
        prev = q;
      }
    }
  }
  // one finding per label and obstacle
  return [...new Map(out.map((f) => [`${f.text}|${f.with}`, f])).values()];
}

const browser = useChromium();
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function check(name: string, file: string): Promise<{ findings: Finding[]; page: import('playwright-core').Page }> {
  const page = await browser().newPage();
  const html = file.endsWith('.svg') ? `<!doctype html><html><body style="margin:0">${readFileSync(file, 'utf8')}</body></html>` : readFileSync(file, 'utf8');
  await page.setContent(html, { waitUntil: 'load' });
  const findings = await page.$$eval('svg', findOverlaps);
  await page.screenshot({ path: join(ARTIFACTS, `overlap-${name}.png`), fullPage: true, timeout: 120_000 });
  return { findings, page };
}

const DRAWINGS: [string, string[]][] = [
  ['gusset-g2', ['samples/gusset-g2.json']],
  ['bracket', ['samples/bracket.svg']],
  ['etched-plate-ep7', ['samples/etched-plate-ep7.svg']],
  ['lifting-lug-ll4', ['samples/lifting-lug-ll4.json']],
  ['notched-plate', ['samples/notched-plate.json']],
  ['base-plate-bp1', ['samples/base-plate-bp1.json']],
  ['site-coordinates', [SITE]],
  ['tall-bar', [TALL]],
  ['centred-flange', [CENTRED]],
  ['skewed-cleat', [TILTED]],
];

describe('labels clear of every line and of each other (Chromium glyph boxes)', () => {
  for (const [name, args] of DRAWINGS) {
    it(`draw ${name}`, async () => {
      const out = join(dir, `${name}.svg`);
      platewise(['draw', ...args, '-o', out]);
      const { findings, page } = await check(name, out);
      await page.close();
      expect(findings).toEqual([]);
    });
  }

  it('draw --sheet: a large panel and a small plate, at one scale, labels clear', async () => {
    const out = join(dir, 'sheet.svg');
    platewise(['draw', SHEET, '--units', 'mm', '--sheet', '-o', out]);
    const { findings, page } = await check('sheet', out);
    const scales = await page.$$eval('g[data-role="part-drawing"]', (gs) => gs.map((g) => Number(g.getAttribute('data-scale'))));
    const bars = await page.$$eval('g[data-role="scale-bar"]', (gs) => gs.map((g) => (g as SVGGraphicsElement).getBBox().width));
    await page.close();
    expect(scales).toHaveLength(2);
    expect(scales[1]).toBe(scales[0]);
    expect(bars[1]).toBeCloseTo(bars[0], 6);
    expect(findings).toEqual([]);
  });

  it('the report: figure with origin mark, plots where there are any, labels clear', async () => {
    for (const [name, args] of [['report-gusset', ['samples/gusset-g2.json', '--thickness', '10 mm', '--material', 'S355']], ['report-site', [SITE]], ['report-mesh', ['samples/bracket.svg', '--levels', '3']]] as const) {
      const out = join(dir, `${name}.html`);
      platewise(['report', ...args, '-o', out]);
      const { findings, page } = await check(name, out);
      const origin = await page.$$eval('figure[data-role="drawing"] [data-role="origin"], figure[data-role="drawing"] [data-role="origin-note"]', (e) => e.length);
      const plots = await page.$$eval('svg[data-role="convergence"]', (e) => e.length);
      await page.close();
      expect(origin, name).toBeGreaterThan(0);
      // plots only from a mesh run (--levels 3 on curved cut-outs), none for exact boundary results
      expect(plots, name).toBe(name === 'report-mesh' ? 2 : 0);
      expect(findings, name).toEqual([]);
    }
  });
});
