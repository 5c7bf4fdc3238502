// Sheets and renderers the browser tests share.
import { Sandbox } from '../../server/sandbox/sandbox.js';
import type { RunOptions, SheetResult } from '../../server/pipeline/index.js';
import type { SheetRunner } from '../../server/serve/store.js';
import { fakeResult } from '../serve/fake-runner.js';

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
export class SandboxWithFaults implements SheetRunner {
  private readonly inner = new Sandbox({ timeoutMs: 2000 });

  run(text: string, opts: RunOptions): Promise<SheetResult> {
    if (text.includes(RUNAWAY)) return Promise.reject(new Error('evaluation timed out after 2000 ms'));
    if (text.includes(SLOW)) return new Promise((r) => setTimeout(r, 800)).then(() => this.inner.run(text, opts));
    return this.inner.run(text, opts);
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
export class UnsanitisedRunner implements SheetRunner {
  async run(text: string): Promise<SheetResult> {
    return fakeResult({ title: 'unsanitised', parts: [{ key: 'raw', html: text }] });
  }

  async close(): Promise<void> {}
}
