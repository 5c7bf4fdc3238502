// Debian's Chromium for the picture scripts (screenshot.ts, guide-pictures.ts):
// headless, in a profile of its own that is removed on close, reaching only loopback.
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

export async function openChromium(viewport: { width: number; height: number }): Promise<{ context: BrowserContext; close(): Promise<void> }> {
  const profile = await mkdtemp(path.join(tmpdir(), 'wakesheet-shot-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.WAKESHEET_CHROMIUM ?? '/usr/bin/chromium',
    headless: true,
    viewport,
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    async close() {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}
