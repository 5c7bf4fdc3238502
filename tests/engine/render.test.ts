// Rendering: the KaTeX of issue 2's Reynolds-number example, names as
// mathematics, number display, and sanitising of raw HTML in the prose.
import { describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';
import { symbolLatex } from '../../server/render/symbols.js';
import { formatNumber } from '../../server/render/numbers.js';
import { sheet } from './helpers.js';

function annotations(html: string): string[] {
  return [...html.matchAll(/<annotation encoding="application\/x-tex">([^<]*)<\/annotation>/g)].map((m) => m[1]!.replace(/&amp;/g, '&'));
}

/** The TeX of the formula that starts with `head`, put back together from the pieces it is typeset in. */
function formulaTex(html: string, head: string): string {
  const all = annotations(html);
  const start = all.findIndex((t) => t.startsWith(head));
  let tex = all[start]!;
  for (const piece of all.slice(start + 1)) {
    if (!piece.startsWith('{} ')) break;
    tex += piece.slice(2);
  }
  return tex;
}

describe('the Reynolds-number example', () => {
  it('renders formula, substituted values with units, and the result', async () => {
    const r = await sheet(['U_inf = 12 m/s', 'L = 4.2 m', 'nu = 1.47e-5 m^2/s', 'Re = U_inf * L / nu'], 'sigfigs: 3');
    const block = r.parts.find((p) => p.html.includes('data-name="Re"'))!.html;
    const tex = formulaTex(block, '\\mathrm{Re}');
    expect(tex).toBe(
      '\\mathrm{Re} = \\frac{{U}_{\\infty} \\cdot L}{\\nu} = \\frac{\\left(12\\,\\mathrm{m}/\\mathrm{s}\\right) \\cdot \\left(4.2\\,\\mathrm{m}\\right)}{1.47\\times 10^{-5}\\,\\mathrm{m}^{2}/\\mathrm{s}} = 3.43\\times 10^{6}',
    );
    // KaTeX drew it (HTML and MathML), and the value is machine-readable.
    expect(block).toContain('class="katex"');
    expect(block).toMatch(/data-name="Re" data-si="3428571.428\d*" data-unit=""/);
  });
});

describe('names as mathematics', () => {
  const cases: Array<[string, string]> = [
    ['U_inf', '{U}_{\\infty}'],
    ['nu', '\\nu'],
    ['rho_air', '{\\rho}_{\\text{air}}'],
    ['yplus', 'y^{+}'],
    ['y_plus', 'y^{+}'],
    ['Delta_t', '\\Delta t'],
    ['tau_w', '{\\tau}_{w}'],
    ['Re', '\\mathrm{Re}'],
    ['y1', 'y_{1}'],
  ];
  for (const [name, tex] of cases) it(`${name} → ${tex}`, () => expect(symbolLatex(name)).toBe(tex));
});

describe('numbers', () => {
  it('uses significant figures and scientific notation at the extremes', () => {
    expect(formatNumber(3428571.43, 4)).toEqual({ mantissa: '3.429', exponent: 6 });
    expect(formatNumber(0.000147, 3)).toEqual({ mantissa: '1.47', exponent: -4 });
    expect(formatNumber(542.49, 4)).toEqual({ mantissa: '542.5', exponent: 0 });
    expect(formatNumber(9.99951, 4)).toEqual({ mantissa: '10', exponent: 0 });
  });
  it('chooses an engineering prefix when no unit is asked for', async () => {
    const r = await sheet(['y1 = 2.3e-5 m', 'p = 101325 Pa', 'dt = 0.0004 s', 'y2 = y1 to mm']);
    expect(r.values.y1!.display).toBe('23 µm');
    expect(r.values.p!.display).toBe('101.3 kPa');
    expect(r.values.dt!.display).toBe('400 µs');
    expect(r.values.y2!.display).toBe('0.023 mm');
  });
});

describe('sanitising', () => {
  it('removes script tags, event handlers and javascript: links from the prose', async () => {
    const r = await renderSheet('# Sheet\n\n<script>window.x=1</script>\n\n<img src="a.png" onerror="alert(1)">\n\n<a href="javascript:alert(1)">go</a>\n\n[ok](https://example.org)\n');
    const main = /<main[^>]*>([\s\S]*)<\/main>/.exec(r.html)![1]!;
    expect(main).not.toMatch(/<script/i);
    expect(main).not.toMatch(/onerror/i);
    expect(main).not.toMatch(/javascript:/i);
    // The image is not fetched: there is no such file in the project to embed, and the page says so.
    expect(main).toMatch(/<span class="ws-image-refused" role="note">the image a\.png: the data file &quot;a\.png&quot; does not exist<\/span>/);
    expect(main).toContain('<a href="https://example.org">ok</a>');
  });

  it('renders prose as marked does and keeps inline values', async () => {
    const r = await renderSheet('Speed is `=U` here.\n\n```basis\nU = 12 m/s\n```\n\n```python\nprint(1)\n```\n');
    expect(r.html).toMatch(/<span class="ws-inline" data-name="U" data-si="12" data-unit="m\/s">12 m\/s<\/span>/);
    expect(r.html).toContain('<pre><code class="language-python">print(1)\n</code></pre>');
    expect(r.html.match(/<main/g)).toHaveLength(1);
  });
});

describe('checks', () => {
  // A failed comparison shows the relation that holds, so the substituted line is never a false statement.
  it('write a failed comparison with the negated relation, and a passed one as written', async () => {
    const r = await sheet(['Re = 1.8e5', 'check Re > 2e5', 'check Re <= 1e5', 'check Re >= 1e5', 'check 1e5 < Re < 1.5e5']);
    const checks = r.parts.filter((p) => p.html.includes('ws-check')).map((p) => p.html);
    const html = checks.join('');
    const tex = annotations(html).map((t) => t.replace(/&lt;/g, '<').replace(/&gt;/g, '>'));
    expect(tex).toContain('{} \\quad\\text{but}\\quad 1.8\\times 10^{5} \\ngtr 2\\times 10^{5}');
    expect(tex).toContain('{} \\quad\\text{but}\\quad 1.8\\times 10^{5} \\nleq 1\\times 10^{5}');
    expect(tex).toContain('{} \\quad\\Longrightarrow\\quad 1.8\\times 10^{5} \\ge 1\\times 10^{5}');
    // A chain is negated as a whole: which link failed is not singled out.
    expect(tex).toContain('{} \\quad\\text{but}\\quad \\text{not}\\ (1\\times 10^{5} < 1.8\\times 10^{5} < 1.5\\times 10^{5})');
    expect(html.match(/data-passed="false"/g)).toHaveLength(3);
  });

  it('keep the values of a failed check over a list as written: some items may hold', async () => {
    const r = await sheet(['L = [1, 4] m', 'check L < 3 m']);
    const tex = annotations(r.parts.map((p) => p.html).join('')).map((t) => t.replace(/&lt;/g, '<'));
    expect(tex.some((t) => t.includes('\\nless') || t.includes('\\text{but}'))).toBe(false);
    expect(tex).toContain('{} \\quad\\Longrightarrow\\quad \\left[1\\,\\mathrm{m},\\ 4\\,\\mathrm{m}\\right] < 3\\,\\mathrm{m}');
  });
});
