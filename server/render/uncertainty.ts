// A value's standard uncertainty beside it, compact: "± 0.61 m/s" in the
// unit the value is shown in, with two significant digits (JCGM 100:2008
// §7.2.6: an uncertainty is seldom worth more), and the relative figure for
// a result. A temperature's uncertainty is a difference: no offset.
import type { Quantity } from '../units/quantity.js';
import { parseUnit } from '../units/unit-expr.js';
import { attrs, escapeHtml } from './html.js';
import { formatNumber, showQuantity, shownPlain } from './numbers.js';

/** Significant digits of an uncertainty as shown. */
export const U_DIGITS = 2;

/** "± 0.61 m/s" for u (SI) of the quantity q, in the unit q is shown in. */
export function uncertaintyText(q: Quantity, u: number, sig: number): string {
  if (!Number.isFinite(u)) return '± ?';
  const shown = showQuantity(q, sig);
  let factor = 1;
  if (shown.unit === '%') factor = 0.01;
  else if (shown.unit) {
    try {
      factor = parseUnit(shown.unit).factor;
    } catch {
      factor = 1;
    }
  }
  const unit = shown.unit.startsWith('deg') ? `delta_${shown.unit}` : shown.unit;
  // Beside a value in powers of ten the spread is too ("1.8×10⁵ ± 1.5×10⁴", not "± 15000").
  return `± ${shownPlain({ ...formatNumber(u / factor, U_DIGITS, shown.exponent !== 0), unit })}`;
}

/**
 * Whether a spread is shown beside a value: a field that depends on no uncertain
 * input (a growth ratio given on the sheet, say) has u = 0 and shows none, on the
 * page and in text output alike.
 */
export function showsSpread(u: number): boolean {
  return u !== 0;
}

export interface UncertaintyView {
  u: number;
  /** Set for an input: how its uncertainty was given. */
  distribution?: 'normal' | 'uniform';
  /** Why the uncertainty could not be propagated. */
  problem?: string;
}

/** The uncertainty beside a value, with its SI number in data-u. */
export function uncertaintyHtml(q: Quantity, view: UncertaintyView, sig: number): string {
  const text = uncertaintyText(q, view.u, sig);
  const rel = view.distribution === undefined && Number.isFinite(view.u) && q.si !== 0 && !q.absolute ? ` (${shownPlain({ ...formatNumber((100 * view.u) / Math.abs(q.si), U_DIGITS), unit: '%' })})` : '';
  const how = view.distribution === 'uniform' ? ' (uniform)' : '';
  const title = view.problem ?? (view.distribution ? 'standard uncertainty of the input' : 'standard uncertainty, first order (JCGM 100:2008)');
  return `<span class="ws-u"${attrs({ 'data-u': Number.isFinite(view.u) ? view.u : undefined, title })}>${escapeHtml(`${text}${rel}${how}`)}</span>`;
}
