// The convergence functions in a sheet: the residuals table renders after the
// record's fields at full width, a half-written last line never gives an
// error, and the example worksheets hold what their text says.
import { mkdtemp, rm, writeFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';
import { historyCsv, range } from './convergence-helpers.js';

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), 'wakesheet-convergence-'));
  await mkdir(path.join(dir, 'data'));
});
afterAll(() => rm(dir, { recursive: true, force: true }));

const SHEET = '# Run\n\n```basis\nres = residuals("data/run.csv", window: 50)\n```\n';

async function render(csv: string) {
  await writeFile(path.join(dir, 'data/run.csv'), csv);
  return renderSheet(SHEET, { root: dir, path: path.join(dir, 'run.md') });
}

describe('residuals in a sheet', () => {
  const csv = historyCsv(range(1, 300), { p: (n) => Math.pow(0.99, n), U: (n) => Math.pow(0.98, n) });

  it('renders the fields, then the table at full width, then the plot', async () => {
    const r = await render(csv);
    expect(r.errors).toEqual([]);
    const html = r.parts.map((p) => p.html).join('');
    expect(html).toMatch(/data-name="res.iterations" data-si="300"/);
    const fields = html.indexOf('class="ws-fields"');
    const table = html.indexOf('<div class="ws-subtable">');
    const figure = html.indexOf('<figure class="ws-figure"');
    expect(fields).toBeGreaterThan(0);
    expect(table).toBeGreaterThan(fields);
    expect(figure).toBeGreaterThan(table);
    expect(html.slice(table)).toMatch(/^<div class="ws-subtable"><div class="ws-subtable-head"><span class="ws-field">(?:<span class="ws-sym">.*?<\/span>)?<code class="ws-field-name">table<\/code><\/span> <span class="ws-note">one row per field/);
    expect(html).toMatch(/<table class="ws-table" data-name="res.table"><thead><tr><th>field<\/th><th>initial<\/th><th>final<\/th><th>drop<\/th><th>factor<\/th><th>remaining<\/th><th>verdict<\/th>/);
  });

  it('a half-written last line is a remark, never an error', async () => {
    for (const tail of ['301,4.9e-', '301,', '301,4.9e-2,1.1e-3']) {
      const r = await render(csv + tail);
      expect(r.errors, tail).toEqual([]);
      expect(r.values['res']!.fields!['iterations']!.si).toBe(300);
      expect(r.parts.map((p) => p.html).join('')).toContain('has no line end yet, so it is left out');
    }
    const done = await render(csv + '301,4.9e-2,1.1e-3\n');
    expect(done.values['res']!.fields!['iterations']!.si).toBe(301);
  });

  it('a bad line in the middle is an error on the statement, naming the row', async () => {
    const lines = csv.split('\n');
    lines[40] = '40,abc,1';
    const r = await render(lines.join('\n'));
    expect(r.errors.map((e) => e.message).join(' ')).toMatch(/row 41: "abc" in column p is not a number/);
  });
});

describe('the example worksheets', () => {
  const example = (name: string) => import('node:fs/promises').then((fs) => fs.readFile(new URL(`../../worksheets/${name}`, import.meta.url), 'utf8'));

  it('the post-run review reads its invented data, says so, and passes its checks', async () => {
    const text = await example('towed-body-run-review.md');
    expect(text).toMatch(/The data are invented/);
    const r = await renderSheet(text, { root: 'worksheets', path: 'worksheets/towed-body-run-review.md' });
    expect(r.errors).toEqual([]);
    expect(r.checks.every((c) => c.passed)).toBe(true);
    expect(r.reads.sort()).toEqual(['data/towed-body-forces.csv', 'data/towed-body-residuals.csv', 'data/towed-body-yplus.csv']);
  });

  it('the three-grid study reproduces Celik et al. (2008) and passes its checks', async () => {
    const text = await example('towed-body-grid-study.md');
    expect(text).toMatch(/invented for this demonstration/);
    const r = await renderSheet(text, { root: 'worksheets', path: 'worksheets/towed-body-grid-study.md' });
    expect(r.errors).toEqual([]);
    expect(r.checks.length).toBeGreaterThanOrEqual(8);
    expect(r.checks.every((c) => c.passed)).toBe(true);
  });
});
