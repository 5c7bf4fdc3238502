// The package entry exports exactly these names (issue 2: renderSheet as a library).
import { describe, expect, it } from 'vitest';
import * as api from '../../server/index.js';

describe('public API', () => {
  it('exports the documented names only', () => {
    expect(Object.keys(api).sort()).toEqual(['ERROR_CODES', 'Sandbox', 'SandboxError', 'SheetPipeline', 'createRegistry', 'renderSheet', 'standalonePage']);
  });

  it('renderSheet returns html, values, checks and errors, with the sheet inside one <main>', async () => {
    const r = await api.renderSheet('# Van\n\n```basis\nU = 30 m/s\ncheck U < 40 m/s "below the tunnel limit"\n```\n', { path: 'van.md' });
    expect(Object.keys(r)).toEqual(expect.arrayContaining(['html', 'values', 'checks', 'errors']));
    expect(r.values.U).toEqual({ si: 30, unit: 'm/s', display: '30 m/s' });
    expect(r.checks).toEqual([{ line: 5, passed: true, text: 'below the tunnel limit' }]);
    const main = r.html.match(/<main[\s\S]*<\/main>/g)!;
    expect(main).toHaveLength(1);
    expect(main[0]).toContain('<h1>Van</h1>');
    expect(main[0]).not.toContain('ws-summary');
  });
});
