/**
 * Debian's Chromium for the browser tests (never a browser a tool downloads itself), started headless with the
 * flags that keep it off the network this machine does not have. playwright-core is imported on launch, so a
 * test file loads (and skips) where Chromium is absent.
 */
import { existsSync } from 'node:fs';
import type { BrowserContext } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';
export const hasChromium = existsSync(CHROMIUM);

const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** A fresh persistent context in `profileDir` (a new, empty user-data folder). */
export async function launchChromium(profileDir: string): Promise<BrowserContext> {
  const { chromium } = await import('playwright-core');
  return chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM,
    headless: true,
    args: chromiumArgs,
    viewport: { width: 1100, height: 900 },
  });
}
