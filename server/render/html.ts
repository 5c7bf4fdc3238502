// Attributes written from values: every value escaped by the one escaper.
import { escapeHtml } from '../core/shared/escape.js';

export { escapeHtml };

export function attrs(a: Record<string, string | number | undefined>): string {
  return Object.entries(a)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => ` ${k}="${escapeHtml(String(v))}"`)
    .join('');
}
