// Sheet names as mathematics: U_inf → U_∞, rho_air → ρ_air, yplus → y⁺,
// Delta_t → Δt, Re → Re upright, y1 → y₁, Greek letters by name.
const GREEK = new Set([
  'alpha', 'beta', 'gamma', 'delta', 'epsilon', 'varepsilon', 'zeta', 'eta', 'theta', 'vartheta', 'iota', 'kappa', 'lambda', 'mu', 'nu', 'xi', 'pi', 'rho', 'sigma', 'tau', 'upsilon', 'phi', 'varphi', 'chi', 'psi', 'omega',
  'Gamma', 'Delta', 'Theta', 'Lambda', 'Xi', 'Pi', 'Sigma', 'Upsilon', 'Phi', 'Psi', 'Omega',
]);
// Dimensionless groups are set upright by convention (ISO 80000-11).
const GROUPS = new Set(['Re', 'Ma', 'St', 'Fr', 'Pr', 'Co', 'Eu', 'Sr', 'Kn', 'We', 'Gr', 'Ra', 'Nu', 'Pe', 'Sc', 'Ri']);
const SUB_WORDS = new Map([['inf', '\\infty'], ['infty', '\\infty']]);

// In text mode \^ and \~ are accents (they would put a hat on the next
// letter), so those two and the backslash are written as their text symbols.
const TEXT_SYMBOLS: Record<string, string> = { '\\': '\\textbackslash{}', '^': '\\textasciicircum{}', '~': '\\textasciitilde{}' };

function escapeText(s: string): string {
  return s.replace(/[\\{}$&#^_%~]/g, (c) => TEXT_SYMBOLS[c] ?? `\\${c}`);
}

function base(word: string): string {
  if (GREEK.has(word)) return `\\${word}`;
  if (GROUPS.has(word)) return `\\mathrm{${word}}`;
  if (/^(Delta|delta)[A-Za-z]$/.test(word)) return `${word.startsWith('D') ? '\\Delta' : '\\delta'} ${word.slice(-1)}`;
  const m = /^([A-Za-z])(\d+)$/.exec(word);
  if (m) return `${m[1]}_{${m[2]}}`;
  if (word.length === 1) return word;
  return `\\mathit{${escapeText(word)}}`;
}

function subscript(part: string): string {
  const word = SUB_WORDS.get(part);
  if (word) return word;
  if (GREEK.has(part)) return `\\${part}`;
  if (/^\d+$/.test(part) || part.length === 1) return part;
  return `\\text{${escapeText(part)}}`;
}

/** LaTeX for a sheet name. */
export function symbolLatex(name: string): string {
  const plus = /^(.*?)_?plus$/.exec(name);
  if (plus && plus[1] && !plus[1].endsWith('_')) {
    // yplus, y_plus, uplus → y⁺, u⁺
    return `${symbolLatex(plus[1])}^{+}`;
  }
  const parts = name.split('_').filter((p) => p !== '');
  if (parts.length === 0) return `\\mathit{${escapeText(name)}}`;
  const [head, ...rest] = parts;
  // Delta_t → Δt: a Greek capital followed by a one-letter variable reads as one symbol.
  if ((head === 'Delta' || head === 'delta') && rest.length >= 1 && rest[0]!.length === 1) {
    const tail = rest.slice(1);
    const sym = `${head === 'Delta' ? '\\Delta' : '\\delta'} ${rest[0]}`;
    return tail.length ? `${sym}_{${tail.map(subscript).join(',')}}` : sym;
  }
  const b = base(head!);
  if (rest.length === 0) return b;
  return `{${b}}_{${rest.map(subscript).join(',')}}`;
}

/** LaTeX for a record field: air.nu → ν_air, wr.height → height_wr. */
export function fieldLatex(object: string, field: string, declared?: string): string {
  const parts = object.split('_').filter((p) => p !== '');
  const sub = parts.map(subscript).join(',');
  if (declared) return withOwner(declared, sub);
  const f = symbolLatex(field);
  // A field that already carries a subscript keeps it and adds the owner's.
  const m = /^\{(.*)\}_\{(.*)\}$/.exec(f);
  if (m) return `{${m[1]}}_{${m[2]},${sub}}`;
  if (f.endsWith('^{+}')) return `{${f.slice(0, -4)}}_{${sub}}^{+}`;
  return `{${f}}_{${sub}}`;
}

/**
 * A declared symbol with its owner's name added to the subscript:
 * \tau_{w} of wr → \tau_{w,wr}; \delta^{*} of bl → \delta^{*}_{bl}.
 */
function withOwner(symbol: string, sub: string): string {
  const braced = /^(.*)_\{([^{}]*)\}(\^\{[^{}]*\})?$/.exec(symbol);
  if (braced) return `${braced[1]}_{${braced[2]},${sub}}${braced[3] ?? ''}`;
  const single = /^(.*)_([A-Za-z0-9])(\^\{[^{}]*\})?$/.exec(symbol);
  if (single) return `${single[1]}_{${single[2]},${sub}}${single[3] ?? ''}`;
  const sup = /^([^_]*)(\^\{[^{}]*\})$/.exec(symbol);
  if (sup) return `{${sup[1]}}_{${sub}}${sup[2]}`;
  return `{${symbol}}_{${sub}}`;
}

export function textLatex(s: string): string {
  return `\\text{${escapeText(s)}}`;
}
