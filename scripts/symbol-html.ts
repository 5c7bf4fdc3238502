// A field's declared LaTeX symbol as plain HTML for the function guide's
// tables: prose is not typeset, so \tau_{w} becomes τ<sub>w</sub>. Only the
// few commands the declarations use are known; any other stops the script,
// so a symbol never reaches the guide half-converted.

const LETTERS: Record<string, string> = {
  alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', epsilon: 'ϵ', varepsilon: 'ε', zeta: 'ζ', eta: 'η', theta: 'θ', kappa: 'κ',
  lambda: 'λ', mu: 'μ', nu: 'ν', xi: 'ξ', pi: 'π', rho: 'ρ', sigma: 'σ', tau: 'τ', phi: 'ϕ', varphi: 'φ', chi: 'χ', psi: 'ψ', omega: 'ω',
  Gamma: 'Γ', Delta: 'Δ', Theta: 'Θ', Lambda: 'Λ', Pi: 'Π', Sigma: 'Σ', Phi: 'Φ', Psi: 'Ψ', Omega: 'Ω',
  ell: 'ℓ', infty: '∞', min: 'min', max: 'max', ',': '\u2009',
};
/** Commands whose one argument is shown as it is. */
const AS_IS = new Set(['mathrm', 'text', 'mathit', 'mathbf']);
const COMBINING_MACRON = '\u0304';

/** Characters Markdown or HTML would read as markup, written so that they show as themselves. */
export function markdownText(s: string): string {
  return s.replace(/[&<>]/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : '&gt;')).replace(/[\\`*_[\]|~]/g, (c) => `\\${c}`);
}

class SymbolReader {
  private at = 0;
  constructor(private readonly tex: string) {}

  /** Everything up to the end, or up to the closing brace of the group being read. */
  sequence(inGroup = false): string {
    let out = '';
    while (this.at < this.tex.length) {
      const c = this.tex[this.at]!;
      if (c === '}') {
        if (!inGroup) this.fail('a closing brace without its opening one');
        return out;
      }
      if (c === '_' || c === '^') {
        this.at++;
        const tag = c === '_' ? 'sub' : 'sup';
        out += `<${tag}>${this.argument()}</${tag}>`;
      } else {
        out += this.atom();
      }
    }
    if (inGroup) this.fail('an opening brace without its closing one');
    return out;
  }

  /** One character, one command, or one braced group. */
  private atom(): string {
    const c = this.tex[this.at]!;
    if (c === '{') return this.argument();
    if (c === '\\') return this.command();
    this.at++;
    if (c === ' ') return '';
    if (c === "'") return '′';
    return markdownText(c);
  }

  private argument(): string {
    if (this.tex[this.at] !== '{') return this.atom();
    this.at++;
    const inner = this.sequence(true);
    this.at++;
    return inner;
  }

  private command(): string {
    this.at++;
    const name = /^[A-Za-z]+|^./.exec(this.tex.slice(this.at))?.[0];
    if (!name) this.fail('a backslash at the end');
    this.at += name!.length;
    if (LETTERS[name!] !== undefined) return LETTERS[name!]!;
    if (AS_IS.has(name!)) return this.argument();
    if (name === 'bar') return `${this.argument()}${COMBINING_MACRON}`;
    if (name === 'frac') {
      const top = this.argument();
      const bottom = this.argument();
      return `${top}/(${bottom})`;
    }
    return this.fail(`\\${name} has no text form here`);
  }

  private fail(why: string): never {
    throw new Error(`symbol ${this.tex}: ${why}; teach scripts/symbol-html.ts the command or change the symbol`);
  }
}

/** HTML for a declared symbol: letters as Unicode, sub- and superscripts as <sub> and <sup>. */
export function symbolHtml(tex: string): string {
  return new SymbolReader(tex).sequence();
}
