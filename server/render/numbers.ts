// Numbers as an engineer reads them: significant figures from the sheet,
// scientific notation for very large or small values, and an engineering
// prefix on simple SI units when the sheet chose no unit (2.3e-5 m → 23 µm).
import type { Quantity, Unit } from '../units/quantity.js';
import { inUnit } from '../units/quantity.js';
import { isDimensionless } from '../units/dims.js';
import { engineeringPrefix, PREFIXABLE, unitLabel } from '../units/labels.js';
import { lookupUnit } from '../units/catalogue.js';

export interface Shown {
  /** Mantissa and exponent: value = mantissa × 10^exponent (exponent 0: plain). */
  mantissa: string;
  exponent: number;
  /** Unit as typed or chosen ("km/h", "µm", "degC", "%", ""). */
  unit: string;
}

/** The units a sheet asked for (front matter `units:`), by the SI unit of their dimension. */
let preferred: ReadonlyMap<string, Unit> = new Map();
let preferredKey = '';

/**
 * Sets the units the running sheet shows its quantities in, by dimension
 * ("Pa" → kPa). Rendering is synchronous, one sheet at a time: the pipeline
 * sets them before it renders. Returns whether they changed since last time.
 */
export function setPreferredUnits(units: ReadonlyMap<string, Unit>): boolean {
  const key = [...units].map(([k, u]) => `${k}=${u.text}`).join(';');
  if (key === preferredKey) return false;
  preferred = units;
  preferredKey = key;
  return true;
}

/** Changes whenever the preferred units do: part of every display cache's key. */
export function displayKey(sig: number): string {
  return `${sig};${preferredKey}`;
}

function roundSig(x: number, sig: number): number {
  return Number(x.toPrecision(sig));
}

/** Split x into mantissa text and power of ten, with `sig` significant figures; `scientific` always uses a power. */
export function formatNumber(x: number, sig: number, scientific = false): { mantissa: string; exponent: number } {
  if (x === 0) return { mantissa: '0', exponent: 0 };
  if (!Number.isFinite(x)) return { mantissa: String(x), exponent: 0 };
  const r = roundSig(x, sig);
  const exp = Math.floor(Math.log10(Math.abs(r)));
  if (scientific || exp >= 5 || exp < -3) {
    const m = roundSig(r / Math.pow(10, exp), sig);
    return { mantissa: trimZeros(m.toPrecision(sig)), exponent: exp };
  }
  // toFixed, not toPrecision: 12345 at 4 figures is 12350, never "1.235e+4".
  return { mantissa: trimZeros(r.toFixed(Math.max(0, sig - 1 - exp))), exponent: 0 };
}

function trimZeros(s: string): string {
  if (!s.includes('.') || s.includes('e')) return s;
  return s.replace(/0+$/, '').replace(/\.$/, '');
}

/** How a quantity is shown: its own unit if it has one, else SI with a prefix. */
export function showQuantity(q: Quantity, sig: number): Shown {
  if (q.unit && (q.pinned || !autoPrefixed(q.unit.text))) {
    const v = q.unit.text === '%' ? q.si * 100 : inUnit(q, q.unit);
    return { ...formatNumber(v, sig), unit: q.unit.text };
  }
  if (isDimensionless(q.dims)) return { ...formatNumber(q.si, sig), unit: '' };
  // A typed J stays an energy (and kJ re-prefixes to MJ), though force times length is shown as N·m.
  const label = (q.unit && prefixedBase(q.unit.text)) ?? unitLabel(q.dims);
  const wanted = q.unit ? undefined : preferred.get(label);
  if (wanted && !q.absolute) return { ...formatNumber(q.si / wanted.factor, sig), unit: wanted.text };
  const prefix = q.si !== 0 ? engineeringPrefix(label, Math.abs(roundSig(q.si, sig))) : null;
  if (prefix) return { ...formatNumber(q.si / prefix.factor, sig), unit: prefix.prefix + label };
  return { ...formatNumber(q.si, sig), unit: label };
}

/** A typed unit that is only a prefixed SI unit (mm, kPa, m) is re-prefixed to fit the value. */
function autoPrefixed(text: string): boolean {
  return prefixedBase(text) !== undefined;
}

/** The SI unit a typed unit is a prefixed form of (kJ → J, mm → m), if it is one. */
function prefixedBase(text: string): string | undefined {
  for (const label of PREFIXABLE) {
    if (text === label) return label;
    if (text.endsWith(label) && text.length === label.length + 1 && 'GMkmuµμn'.includes(text[0]!)) return label;
  }
  return undefined;
}

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '.': '·' };

function superscript(s: string): string {
  return [...s].map((c) => SUPERSCRIPT[c] ?? c).join('');
}

/** Unit text for people: "m²/s", "°C", "µm", "Pa·s". */
export function unitPlain(unit: string): string {
  return unit
    .replace(/\^(-?[\d.]+)/g, (_, e: string) => superscript(e))
    .replace(/\bdelta_degC\b/g, 'Δ°C')
    .replace(/\bdelta_degF\b/g, 'Δ°F')
    .replace(/\bdegC\b/g, '°C')
    .replace(/\bdegF\b/g, '°F')
    .replace(/\bu(?=[a-zA-Z])/g, (m, off: number, s: string) => (off === 0 || /[\s/(]/.test(s[off - 1]!) ? 'µ' : m))
    .replace(/ (?=[A-Za-zµ])/g, '·');
}

export function shownPlain(s: Shown): string {
  // A real minus sign in text; LaTeX sets its own.
  const mantissa = s.mantissa.replace('-', '\u2212');
  const n = s.exponent === 0 ? mantissa : `${mantissa}×10${superscript(String(s.exponent))}`;
  if (!s.unit) return n;
  return s.unit === '%' ? `${n} %` : `${n} ${unitPlain(s.unit)}`;
}

function unitFactorLatex(f: string): string {
  if (f === 'delta_degC') return '\\Delta{}^{\\circ}\\mathrm{C}';
  if (f === 'delta_degF') return '\\Delta{}^{\\circ}\\mathrm{F}';
  if (f === 'degC') return '{}^{\\circ}\\mathrm{C}';
  if (f === 'degF') return '{}^{\\circ}\\mathrm{F}';
  if (f === '%') return '\\%';
  const m = /^([A-Za-zµμ_][A-Za-z0-9_]*?)(?:\^(-?[\d.]+))?$/.exec(f);
  if (!m) return `\\mathrm{${f}}`;
  let name = m[1]!;
  let micro = '';
  if (isMicro(name)) {
    micro = '\\mu ';
    name = name.slice(1);
  }
  const base = `${micro}\\mathrm{${name.replace(/_/g, '\\_')}}`;
  return m[2] ? `${base}^{${m[2]}}` : base;
}

/** "um", "µs", "uPa": a micro prefix (mathjs reads "u" as micro). */
function isMicro(name: string): boolean {
  if (name.length < 2 || !/^[uµμ]/.test(name)) return false;
  const whole = lookupUnit(name.replace(/^[µμ]/, 'u'));
  const rest = lookupUnit(name.slice(1));
  return !!whole && !!rest && Math.abs(whole.factor / rest.factor - 1e-6) < 1e-18;
}

/** LaTeX for unit text: "kg/m^3" → \mathrm{kg}/\mathrm{m}^{3}. */
export function unitLatex(unit: string): string {
  if (!unit) return '';
  return unit
    .split(/(\/|\(|\)|\s+|·)/)
    .filter((p) => p !== '')
    .map((p) => (p === '/' ? '/' : p === '(' || p === ')' ? p : /^\s+$|^·$/.test(p) ? '\\,' : unitFactorLatex(p)))
    .join('');
}

export function shownLatex(s: Shown): string {
  const n = s.exponent === 0 ? s.mantissa : `${s.mantissa}\\times 10^{${s.exponent}}`;
  return s.unit ? `${n}\\,${unitLatex(s.unit)}` : n;
}
