// How the browser tests read a sheet back from the page: every rendered value
// carries data-name and data-si (its SI value), so tests compare numbers, not
// formatted text.
import type { Page } from 'playwright-core';

/** Waits until the value named `name` shows `si` (relative tolerance 1e-9). */
export async function waitForValue(page: Page, name: string, si: number, timeout = 8000): Promise<void> {
  await page.waitForFunction(
    ([n, v]) => {
      const el = document.querySelector(`main [data-name="${n}"][data-si]`);
      const shown = el ? Number(el.getAttribute('data-si')) : NaN;
      return Math.abs(shown - v) <= 1e-9 * Math.max(1, Math.abs(v));
    },
    [name, si] as const,
    { timeout },
  );
}

/** The SI value shown for `name`, or null when the page has none. */
export function valueShown(page: Page, name: string): Promise<number | null> {
  return page.evaluate((n) => {
    const el = document.querySelector(`main [data-name="${n}"][data-si]`);
    return el ? Number(el.getAttribute('data-si')) : null;
  }, name);
}

/** The text of the sheet's <main>. */
export function mainText(page: Page): Promise<string> {
  return page.evaluate(() => document.querySelector('main')?.textContent ?? '');
}

export async function waitForStatus(page: Page, state: string, timeout = 10000): Promise<void> {
  await page.waitForFunction((s) => (document.querySelector('.live-status') as HTMLElement | null)?.dataset.state === s, state, {
    timeout,
  });
}
