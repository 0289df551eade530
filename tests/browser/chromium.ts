/**
 * Debian's Chromium (/usr/bin/chromium; never downloaded) through playwright-core, headless, with a fresh
 * profile folder that is removed again on close. Shared by the browser tests and the page's bench case.
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type BrowserContext, chromium } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';

export interface Browser { ctx: BrowserContext; close(): Promise<void> }

export async function launchChromium(viewport: { width: number; height: number }): Promise<Browser> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: install Debian's package (apt-get update && apt-get install -y chromium)`);
  const profile = mkdtempSync(join(tmpdir(), 'platewise-chromium-'));
  const ctx = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    viewport,
    acceptDownloads: true,
  });
  return {
    ctx,
    close: async () => {
      await ctx.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
