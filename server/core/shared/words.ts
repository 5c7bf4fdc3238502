// Numbers as they appear in warnings, remarks, error messages and figure
// labels: the one wording every trade family uses. A few significant figures
// with trailing zeros dropped, a real minus sign, powers of ten as "1.2e7".

export interface NumberStyle {
  /** Significant figures (default 3). */
  digits?: number;
  /** "sci": always a power of ten, as Reynolds numbers are written (5e5, 1.2e7). */
  notation?: 'auto' | 'sci';
}

/**
 * 0.0400 → "0.04", 101325 → "101325" (a whole number below a million keeps
 * every digit), 2.3e-5 → "2.3e−5", −3 → "−3".
 */
export function numberText(x: number, style: NumberStyle = {}): string {
  const digits = style.digits ?? 3;
  if (!Number.isFinite(x)) return Number.isNaN(x) ? 'not a number' : x > 0 ? 'infinity' : '−infinity';
  if (x === 0) return '0';
  const a = Math.abs(x);
  let text: string;
  if (style.notation === 'sci' || a >= 1e6 || a < 1e-3) text = exponentText(x, digits);
  else if (Number.isInteger(x)) text = String(x);
  else text = String(Number(x.toPrecision(digits)));
  return text.replace(/-/g, '\u2212');
}

function exponentText(x: number, digits: number): string {
  const [mantissa, exponent] = x.toExponential(Math.max(0, digits - 1)).split('e');
  // A mantissa without a point has one non-zero digit, so stripping trailing zeros is safe either way.
  const m = mantissa!.replace(/0+$/, '').replace(/\.$/, '');
  return `${m}e${exponent!.replace('+', '')}`;
}

/**
 * Significant figures for a value a message refuses: enough to show every digit
 * a sheet gave (20000.001 m is not "20000 m"), few enough to hide floating-point
 * noise (373.151 K − 273.15 is 100.001 °C, not 100.00100000000003).
 */
export const EXACT = 15;

/** A refused value in full: 20000.001 → "20000.001", −1e-9 → "−1e−9". */
export function exactText(x: number): string {
  return numberText(x, { digits: EXACT });
}

/** A temperature given in kelvin, written in °C for the reader (EXACT digits for a refused one). */
export function celsiusText(T: number, digits = 4): string {
  // Rounded to 1e-10 K first: the subtraction leaves noise near 1e-13 that EXACT digits would show.
  return `${numberText(Math.round((T - 273.15) * 1e10) / 1e10, { digits })} \u00b0C`;
}

/** A length in m shown in µm, mm or m by its size: 2.3e-5 → "23 µm". */
export function lengthText(m: number): string {
  const a = Math.abs(m);
  if (a >= 1) return `${numberText(m)} m`;
  if (a >= 1e-3) return `${numberText(m * 1e3)} mm`;
  return `${numberText(m * 1e6)} µm`;
}

/** A fraction as a percentage: 0.0512 → "5.12 %". */
export function percentText(fraction: number, digits = 3): string {
  return `${numberText(fraction * 100, { digits })} %`;
}

/** Words quoted for a message: "linear", "log". */
export function quotedList(words: readonly string[]): string {
  return words.map((w) => `"${w}"`).join(', ');
}

/** "1 sheet", "3 sheets", "0 errors": a count with its noun, plural where due. */
export function countText(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${nounFor(n, singular, plural)}`;
}

/** The noun for a count: "error" for 1, "errors" otherwise. */
export function nounFor(n: number, singular: string, plural = `${singular}s`): string {
  return n === 1 ? singular : plural;
}

/** The option nearest to `word` by edit distance (at most `maxEdits`, case ignored), for "did you mean" hints. */
export function nearestWord(word: string, options: readonly string[], maxEdits = 2): string | undefined {
  let best: string | undefined;
  let bestD = maxEdits + 1;
  for (const o of options) {
    const d = editDistance(word.toLowerCase(), o.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = o;
    }
  }
  return best;
}

function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let prev = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const cur = row[j]!;
      row[j] = Math.min(row[j]! + 1, row[j - 1]! + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = cur;
    }
  }
  return row[b.length]!;
}
