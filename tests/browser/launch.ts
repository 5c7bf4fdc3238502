// Real Chromium for the browser tests, through playwright-core. Where Chromium
// is missing the tests are skipped with the reason printed, unless
// WAKESHEET_REQUIRE_BROWSER=1 (CI), where a missing browser is a failure.
import { existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';
import { describe, it } from 'vitest';

export const CHROMIUM_PATH = process.env.WAKESHEET_CHROMIUM ?? '/usr/bin/chromium';
const required = process.env.WAKESHEET_REQUIRE_BROWSER === '1';
const missing = existsSync(CHROMIUM_PATH) ? null : `Chromium not found at ${CHROMIUM_PATH} (set WAKESHEET_CHROMIUM or apt-get install -y chromium)`;

/** A hostname Chromium resolves to 127.0.0.1, to act out a DNS-rebinding page. */
export const REBIND_HOST = 'rebind.wakesheet.test';

/** `describe` for tests that need Chromium. */
export function describeInBrowser(name: string, body: () => void): void {
  if (!missing) {
    describe(name, body);
    return;
  }
  if (required) {
    describe(name, () => {
      it('has Chromium to run in', () => {
        throw new Error(`${missing}, and WAKESHEET_REQUIRE_BROWSER=1 requires it`);
      });
    });
    return;
  }
  console.warn(`skipping browser tests "${name}": ${missing}`);
  describe.skip(name, body);
}

export interface Browser {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function launchBrowser(): Promise<Browser> {
  const profile = await mkdtemp(path.join(tmpdir(), 'wakesheet-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      // Only loopback traffic: the rebinding name maps to 127.0.0.1, every other name fails.
      `--host-resolver-rules=MAP ${REBIND_HOST} 127.0.0.1, MAP * ~NOTFOUND, EXCLUDE localhost, EXCLUDE 127.0.0.1`,
    ],
  });
  return {
    context,
    async close() {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}
