// The library entry: `renderSheet` evaluates and renders a sheet in this
// process (interpreter limits apply); the server and CLI run the same
// pipeline inside the sandbox child instead.
import { withPage } from './page.js';
import { SheetPipeline } from './pipeline.js';
import type { RunOptions, SheetResult } from './types.js';

export { standalonePage, withPage } from './page.js';

export async function renderSheet(text: string, opts: RunOptions = {}): Promise<SheetResult> {
  return withPage(new SheetPipeline().run(text, opts));
}
