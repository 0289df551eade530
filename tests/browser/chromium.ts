/**
 * Debian's Chromium (/usr/bin/chromium; never downloaded) through playwright-core, headless, with a fresh
 * profile folder, for the browser tests. Artefacts (screenshots, PDFs) go to test-artifacts/browser/.
 */
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type BrowserContext, chromium } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

export const ARTIFACTS = join(import.meta.dirname, '..', '..', 'test-artifacts', 'browser');
const CHROMIUM = '/usr/bin/chromium';

/** Launch Chromium before the file's tests and close it after; call browser() inside a test. */
export function useChromium(): () => BrowserContext {
  let profile: string | undefined;
  let ctx: BrowserContext | undefined;
  beforeAll(async () => {
    if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: install Debian's package (apt-get update && apt-get install -y chromium)`);
    mkdirSync(ARTIFACTS, { recursive: true });
    profile = mkdtempSync(join(tmpdir(), 'platewise-chromium-'));
    ctx = await chromium.launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
      viewport: { width: 1000, height: 900 },
    });
  });
  afterAll(async () => {
    await ctx?.close();
    if (profile) rmSync(profile, { recursive: true, force: true });
  });
  return () => {
    if (!ctx) throw new Error('Chromium was not started');
    return ctx;
  };
}
