// The set-up record: one HTML file that opens offline, names no web address,
// and carries its provenance readable on the page and as data inside it.
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { renderSheet } from '../../server/pipeline/index.js';
import { readRecord, recordData, recordPage, sha256 } from '../../server/pipeline/record.js';

const dir = mkdtempSync(join(tmpdir(), 'ws-record-'));
mkdirSync(join(dir, 'data'));
const csv = 'face,yplus,area\na,0.8,1\nb,1.2,1\nc,2,1\n';
writeFileSync(join(dir, 'data', 'run.csv'), csv);
// A 1×1 PNG, so that the image can be embedded.
const png = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000'
  + '1f15c4890000000d49444154789c6300010000000500010d0a2db40000000049454e44ae426082', 'hex');
writeFileSync(join(dir, 'pod.png'), png);
const sheet = `---
title: Anemometer pod
project: Survey train
revision: C
author: Test desk
---
# Anemometer pod

![pod](pod.png)

\`\`\`basis
U = 160 km/h
D = 0.12 m
gas = air(T: 12 degC, p: 96 kPa)
Re = U * D / gas.nu
rep = yplus_report("data/run.csv", first: 20 um)
check Re > 2e5 "past the drag crisis"
\`\`\`
`;
const path = join(dir, 'pod.md');
writeFileSync(path, sheet);

async function record() {
  const r = await renderSheet(sheet, { path, root: dir });
  const data = recordData(r, { source: sheet, path, root: dir, now: new Date('2026-12-02T08:00:00Z') });
  return { r, data, html: recordPage(r, data) };
}

describe('the set-up record', () => {
  it('names no web address, forbids every request in its own policy, and needs no script', async () => {
    const { html } = await record();
    expect(html).not.toMatch(/https?:/);
    expect(html).toMatch(/<meta http-equiv="Content-Security-Policy" content="default-src 'none';[^"]*">/);
    expect(html).not.toMatch(/<script(?![^>]*type="application\/json")/);
    expect(html).not.toMatch(/<link\b/);
    expect(html).toContain('<img src="data:image/png;base64,');
    expect(html).toContain('data:font/woff2;base64,');
  });

  it('carries the sources verbatim with their SHA-256, the data files\' hashes, the version, the time and the front matter', async () => {
    const { data, html } = await record();
    const back = readRecord(html)!;
    expect(back).toEqual(JSON.parse(JSON.stringify(data)));
    expect(back.sources).toEqual([{ path: 'pod.md', text: sheet, sha256: sha256(sheet) }]);
    expect(back.dataFiles).toEqual(expect.arrayContaining([{ path: 'data/run.csv', sha256: sha256(csv), bytes: csv.length }, { path: 'pod.png', sha256: sha256(png), bytes: png.length }]));
    expect(back.meta).toMatchObject({ title: 'Anemometer pod', project: 'Survey train', revision: 'C', author: 'Test desk' });
    expect(back.writtenAt).toBe('2026-12-02T08:00:00.000Z');
    expect(back.wakesheet).toMatch(/^\d+\.\d+\.\d+/);
    // SHA-256 of "abc" (FIPS 180-2, appendix B.1): the hash is the standard one.
    expect(sha256('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('lists every input with its value and the literal arguments of calls, on the page and in the data', async () => {
    const { data, html } = await record();
    expect(data.inputs.map((i) => [i.name, i.text, i.value.display])).toEqual([
      ['U', '160 km/h', '160 km/h'],
      ['D', '0.12 m', '120 mm'],
    ]);
    expect(data.arguments).toEqual(
      expect.arrayContaining([
        { line: 14, name: 'gas', fn: 'air', arg: 'T', text: '12 degC' },
        { line: 14, name: 'gas', fn: 'air', arg: 'p', text: '96 kPa' },
        { line: 16, name: 'rep', fn: 'yplus_report', arg: 'first', text: '20 um' },
      ]),
    );
    expect(html).toContain('<h2>Set-up record</h2>');
    expect(html).toContain(`<code class="ws-hash">${sha256(csv)}</code>`);
    expect(html).toMatch(/<code>gas<\/code><\/td><td><code>air\(\)<\/code><\/td><td>T<\/td><td><code>12 degC<\/code>/);
  });
});

describe('images in prose', () => {
  it('are embedded from the project folder; a remote one is refused on the sheet, never fetched', async () => {
    const r = await renderSheet('# Pod\n\n![photo](https://example.org/pod.jpg)\n\n<img src="http://example.org/pixel.gif" alt="">\n\n![missing](nowhere.png)\n', { path, root: dir });
    const html = r.parts.map((p) => p.html).join('');
    expect(html).not.toMatch(/<img[^>]+https?:/);
    expect(html.match(/class="ws-image-refused"/g)).toHaveLength(3);
    expect(r.errors.map((e) => [e.line, e.message.slice(0, 40)])).toEqual([
      [3, 'the image https://example.org/pod.jpg is'],
      [5, 'the image http://example.org/pixel.gif i'],
      [7, 'the image nowhere.png: the data file "no'],
    ]);
  });
});

describe('values in JSON', () => {
  it('carry the warnings and remarks of their statement and record', async () => {
    const r = await renderSheet('```basis\ncf = skin_friction(1e8, method: "power")\nw = first_cell(30 m/s, 4 m, air(T: 20 degC))\n```\n');
    // The power law is fitted up to Re_x = 1e7 (Schlichting, Eq. 21.12).
    expect(r.values.cf!.warnings!.join(' ')).toMatch(/above 1e7/);
    expect(r.values.w!.remarks!.join(' ')).toMatch(/viscous sublayer/);
  });
});
