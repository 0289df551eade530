/**
 * Debian's Chromium (/usr/bin/chromium; never downloaded) through playwright-core, headless, with a fresh
 * profile folder that is removed again on close. Shared by the browser tests and the page's bench case.
 * Artefacts (screenshots, PDFs) go to test-artifacts/browser/.
 */
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type BrowserContext, chromium } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

export const CHROMIUM = '/usr/bin/chromium';
export const ARTIFACTS = join(import.meta.dirname, '..', '..', 'test-artifacts', 'browser');

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

/** Launch Chromium before the file's tests and close it after; call the returned function inside a test. */
export function useChromium(): () => BrowserContext {
  let b: Browser | undefined;
  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    b = await launchChromium({ width: 1000, height: 900 });
  });
  afterAll(async () => { await b?.close(); });
  return () => {
    if (!b) throw new Error('Chromium was not started');
    return b.ctx;
  };
}
