/**
 * The page's bench case (issue 18): the 2000 × 1000 panel with 1,250 round holes Ø20 measured in the page,
 * through Debian's Chromium, against the command line's whole process (`measure --json` on the same file).
 * Page runs and command-line runs alternate; medians of `reps`. A page run is a fresh load (the worker starts
 * from nothing, as a process does), timed on the page's own clock (performance marks of web/page.ts): from the
 * start of navigation until the worker is ready, plus from the moment the page takes the file until the figures
 * are shown. Left out is only what the automation adds between the two (Playwright's round trips to notice the
 * page is ready and to hand it the file, 200–350 ms here, where a person takes seconds to pick a file); the
 * whole time through Playwright, the time until the drawing is shown as well (it follows the figures) and the
 * worker's own time for the measure (read, analyse, write the JSON) are reported beside it.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { launchChromium } from '../browser/chromium.js';

export interface PageBench { pageMs: number; harnessMs: number; drawnMs: number; workerMs: number; cliMs: number; equal: boolean }

const median = (t: number[]) => [...t].sort((a, b) => a - b)[t.length >> 1];

export async function pageBench(root: string, file: string, reps: number): Promise<PageBench> {
  const cli = join(root, 'dist', 'cli', 'main.js');
  const url = pathToFileURL(join(root, 'dist', 'page', 'platewise.html')).href;
  const browser = await launchChromium({ width: 1280, height: 900 });
  const page = await browser.ctx.newPage();
  const pageT: number[] = [], harnessT: number[] = [], drawnT: number[] = [], workerT: number[] = [], cliT: number[] = [];
  let equal = true;
  try {
    for (let i = 0; i <= reps; i++) {
      const t0 = performance.now();
      await page.goto(url, { waitUntil: 'load' });
      await page.waitForSelector('body[data-worker="ready"]');
      await page.setInputFiles('#pick', file);
      await page.waitForSelector('section.file[data-state="done"]', { timeout: 600_000 });
      const t1 = performance.now();
      await page.waitForSelector('section.file[data-drawn="true"] [data-role="viewer"] img', { timeout: 600_000 });
      const t2 = performance.now();
      const own = await page.evaluate(() => {
        const at = (name: string) => { const m = performance.getEntriesByName(name); return m.length === 0 ? NaN : m[m.length - 1].startTime; };
        return at('platewise:worker-ready') + at('platewise:figures-shown') - at('platewise:files-taken');
      });
      const shown = await page.$eval('section.file', (s) => ({
        state: s.querySelector('[data-role="state"]')!.textContent ?? '',
        area: s.querySelector('tr[data-key="area"]')!.getAttribute('data-value'),
      }));
      const c0 = performance.now();
      const r = spawnSync(process.execPath, [cli, 'measure', file, '--json'], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 28 });
      const c1 = performance.now();
      if (r.status !== 0) throw new Error(`measure failed: ${r.stderr}`);
      equal &&= Number(shown.area) === JSON.parse(r.stdout).quantities.area.value;
      if (i === 0) continue; // warm-up of the browser's and the disk's caches
      pageT.push(own);
      harnessT.push(t1 - t0);
      drawnT.push(t2 - t0);
      workerT.push(Number(/measured in (\d+) ms/.exec(shown.state)?.[1] ?? NaN));
      cliT.push(c1 - c0);
    }
  } finally {
    await browser.close();
  }
  return { pageMs: median(pageT), harnessMs: median(harnessT), drawnMs: median(drawnT), workerMs: median(workerT), cliMs: median(cliT), equal };
}
