// Sheets and renderers the browser tests share.
import { Sandbox } from '../../server/evaluate/sandbox.js';
import type { RenderOptions, SheetResult } from '../../server/sheet-types.js';
import type { SheetRenderer } from '../../server/serve/store.js';

export function wingSheet(speed: string, extra = ''): string {
  return `---
title: Wing section at cruise
---
# Wing section at cruise

The free stream and the chord set the Reynolds number.

\`\`\`basis
U_inf = ${speed}   # design speed
L = 4.2 m           # chord
nu = 1.47e-5 m^2/s
Re = U_inf * L / nu
check Re > 1e5 "turbulent boundary layer"
\`\`\`
${extra}
`;
}

/** A line that makes SandboxWithFaults fail the way a runaway sheet does. */
export const RUNAWAY = '<!-- test: this sheet never finishes -->';
/** A line that makes SandboxWithFaults take 800 ms longer, like a heavy sheet. */
export const SLOW = '<!-- test: this sheet takes a while -->';

/**
 * The real sandbox, except that a sheet containing RUNAWAY fails as a
 * timed-out evaluation would. Lets the tests break a sheet at the level of the
 * sandbox whatever the engine does today.
 */
export class SandboxWithFaults implements SheetRenderer {
  private readonly inner = new Sandbox({ timeoutMs: 2000 });

  render(text: string, opts: RenderOptions): Promise<SheetResult> {
    if (text.includes(RUNAWAY)) return Promise.reject(new Error('evaluation timed out after 2000 ms'));
    if (text.includes(SLOW)) return new Promise((r) => setTimeout(r, 800)).then(() => this.inner.render(text, opts));
    return this.inner.render(text, opts);
  }

  close(): Promise<void> {
    return this.inner.close();
  }
}


/**
 * Hands the sheet's text to the page as HTML, unsanitised: what the page would
 * get if the engine's sanitiser ever let something through. The CSP must
 * still stop any script in it.
 */
export class UnsanitisedRenderer implements SheetRenderer {
  async render(text: string): Promise<SheetResult> {
    return {
      title: 'unsanitised',
      meta: {},
      html: '',
      parts: [{ key: 'raw', html: text }],
      summaryHtml: '',
      summary: { inputs: 0, results: 0, checksPassed: 0, checksFailed: 0, errors: 0 },
      values: {},
      checks: [],
      errors: [],
      reads: [],
      elapsedMs: 0,
    };
  }

  async close(): Promise<void> {}
}
