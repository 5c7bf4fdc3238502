// A record's provenance section: where its numbers came from, readable on
// the page (the same facts are inside the file as data, for `verify`).
import { countText } from '../core/index.js';
import { escapeHtml } from './html.js';

export interface ProvenanceView {
  wakesheet: string;
  writtenAt: string;
  sheet: { path: string; root: string };
  meta: Record<string, string>;
  overrides: ReadonlyArray<{ name: string; was: string; now: string; sheet: string }>;
  sources: ReadonlyArray<{ path: string; sha256: string; text: string }>;
  dataFiles: ReadonlyArray<{ path: string; sha256: string | null; bytes: number | null }>;
  inputs: ReadonlyArray<{ name: string; line: number; text: string; value: { display: string } }>;
  arguments: ReadonlyArray<{ line: number; name: string; fn: string; arg: string; text: string }>;
}

const META_KEYS = ['title', 'project', 'revision', 'author', 'date'];

function table(head: string[], rows: string[][], cls = ''): string {
  if (rows.length === 0) return '';
  const th = head.map((h) => `<th>${escapeHtml(h)}</th>`).join('');
  const body = rows.map((r) => `<tr>${r.map((c) => `<td>${c}</td>`).join('')}</tr>`).join('');
  return `<div class="ws-table-wrap"><table class="ws-table${cls ? ' ' + cls : ''}"><thead><tr>${th}</tr></thead><tbody>${body}</tbody></table></div>`;
}

const code = (s: string) => `<code>${escapeHtml(s)}</code>`;

export function provenanceHtml(p: ProvenanceView): string {
  const facts = [
    ['written', `${escapeHtml(p.writtenAt.replace('T', ' ').replace(/\.\d+Z$/, ' UTC'))} by Wakesheet ${escapeHtml(p.wakesheet)}`],
    ['sheet', `${code(p.sheet.path)} in ${code(p.sheet.root)}`],
    ...META_KEYS.filter((k) => p.meta[k]).map((k) => [k, escapeHtml(p.meta[k]!)]),
  ];
  const factRows = facts.map(([k, v]) => `<tr><th scope="row">${escapeHtml(k!)}</th><td>${v}</td></tr>`).join('');
  const overrides = p.overrides.length
    ? `<h3>Overridden for this record</h3><p class="ws-overrides">These inputs were not the sheet's own values when it was recorded:</p>${table(['input', 'defined in', 'on the sheet', 'used here'], p.overrides.map((o) => [code(o.name), code(o.sheet), escapeHtml(o.was), escapeHtml(o.now)]))}`
    : '<p>No input was overridden: every value is the sheet\'s own.</p>';
  const sources = table(
    ['source', 'SHA-256', 'size'],
    p.sources.map((s) => [code(s.path), `<code class="ws-hash">${s.sha256}</code>`, escapeHtml(countText(s.text.length, 'character'))]),
  );
  const sourceTexts = p.sources.map((s) => `<details class="ws-source-text"><summary>the text of ${code(s.path)}</summary><pre>${escapeHtml(s.text)}</pre></details>`).join('');
  const data = p.dataFiles.length
    ? table(['data file', 'SHA-256', 'size'], p.dataFiles.map((d) => [code(d.path), d.sha256 ? `<code class="ws-hash">${d.sha256}</code>` : 'could not be read when recorded', d.bytes === null ? '' : escapeHtml(countText(d.bytes, 'byte'))]))
    : '<p>The sheet reads no data files.</p>';
  const inputs = table(['input', 'line', 'as written', 'value'], p.inputs.map((i) => [code(i.name), String(i.line), code(i.text), escapeHtml(i.value.display)]));
  const args = table(['line', 'in', 'call', 'argument', 'as written'], p.arguments.map((a) => [String(a.line), a.name ? code(a.name) : '', code(`${a.fn}()`), escapeHtml(a.arg), code(a.text)]));
  return `<section class="ws-provenance" aria-label="set-up record">
<h2>Set-up record</h2>
<table class="ws-facts"><tbody>${factRows}</tbody></table>
${overrides}
<h3>Sources</h3>${sources}${sourceTexts}
<h3>Data files</h3>${data}
<h3>Inputs</h3>${inputs || '<p>No inputs.</p>'}
<h3>Arguments of calls</h3>${args || '<p>No literal arguments.</p>'}
</section>`;
}
