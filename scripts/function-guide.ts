// Writes worksheets/guide/functions.md, the reference of every trade function,
// from the registry's own declarations: parameters, returned fields, method and
// source, and the entry's example as a live `basis` block. Run `npm run guide`
// after changing an entry; tests/engine/function-guide.test.ts fails while the
// committed file differs from what this writes.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { ANY_DIMENSION, tradeFamilies, type FieldSpec, type ParamSpec, type TradeFamily, type TradeFunction } from '../server/core/index.js';
import { unitPlain } from '../server/render/numbers.js';
import { markdownText, symbolHtml } from './symbol-html.js';

export const GUIDE_PATH = 'worksheets/guide/functions.md';

/** A declared dimension for a unit column: "m/s", "1" (a plain number), "any unit". */
function dimensionText(unit: string): string {
  if (unit === ANY_DIMENSION) return 'any unit';
  if (unit === '1') return '1';
  if (unit === 'text' || unit === 'list' || unit === 'table') return unit;
  return unitPlain(unit);
}

function kindText(p: ParamSpec): string {
  switch (p.type) {
    case 'quantity':
      return dimensionText(p.unit ?? ANY_DIMENSION);
    case 'list':
      if (p.unit === undefined || p.unit === ANY_DIMENSION) return 'list';
      return p.unit === '1' ? 'list of plain numbers' : `list in ${unitPlain(p.unit)}`;
    case 'string':
      return 'text';
    case 'bool':
      return 'true or false';
    case 'fluid':
      return 'fluid record';
    case 'record':
      return 'record';
    case 'any':
      return 'any value';
  }
}

function code(s: string): string {
  return `\`${s.replace(/\|/g, '\\|')}\``;
}

function defaultText(p: ParamSpec): string {
  if (p.default !== undefined) return code(p.default);
  return p.optional ? 'optional' : 'required';
}

function row(cells: readonly string[]): string {
  return `| ${cells.join(' | ')} |`;
}

function table(head: readonly string[], rows: readonly (readonly string[])[]): string[] {
  return [row(head), row(head.map(() => '---')), ...rows.map(row)];
}

function paramTable(fn: TradeFunction): string[] {
  if (fn.params.length === 0) return ['Takes no arguments.'];
  const withChoices = fn.params.some((p) => p.choices);
  const head = ['parameter', 'unit', 'default', ...(withChoices ? ['choices'] : []), 'meaning'];
  const rows = fn.params.map((p) => [
    code(p.name),
    kindText(p),
    defaultText(p),
    ...(withChoices ? [(p.choices ?? []).map((c) => code(JSON.stringify(c))).join(', ')] : []),
    markdownText(p.doc),
  ]);
  return table(head, rows);
}

function symbolCell(symbol: string): string {
  return symbol === '' ? '' : symbolHtml(symbol);
}

/** What a one-value result is, after its meaning: ", a plain number", " in Pa"; nothing where the meaning says it. */
function resultDimension(unit: string): string {
  if (unit === ANY_DIMENSION || unit === 'list') return '';
  return unit === '1' ? ', a plain number' : `, in ${unitPlain(unit)}`;
}

function resultLines(fn: TradeFunction): string[] {
  if (fn.returns) {
    const r = fn.returns;
    const symbol = r.symbol === '' ? '' : `${symbolHtml(r.symbol)}, `;
    return [`Returns ${symbol}${markdownText(r.doc)}${resultDimension(r.unit)}.`];
  }
  const fields: readonly FieldSpec[] = fn.fields ?? [];
  return ['Returns a record:', '', ...table(['field', 'symbol', 'unit', 'meaning'], fields.map((f) => [code(f.name), symbolCell(f.symbol), dimensionText(f.unit), markdownText(f.doc)]))];
}

function functionSection(fn: TradeFunction): string[] {
  return [
    `### ${markdownText(fn.name)}`,
    '',
    `${markdownText(capitalised(fn.doc))}.`,
    '',
    ...paramTable(fn),
    '',
    ...resultLines(fn),
    '',
    `**Method and source.** ${markdownText(capitalised(fn.source))}.`,
    '',
    '```basis',
    fn.example,
    '```',
  ];
}

/** A sentence from a declaration's phrase: a leading word is capitalised, a leading symbol (e, k, y+) is not. */
function capitalised(s: string): string {
  const text = s.replace(/\.$/, '');
  return /^(?:[a-z]{2,}|a)\b(?![+_(])/.test(text) ? text.charAt(0).toUpperCase() + text.slice(1) : text;
}

function familySection(family: TradeFamily): string[] {
  const out = [`## ${family.title}`, '', markdownText(family.about)];
  for (const fn of family.entries) out.push('', ...functionSection(fn));
  return out;
}

/** The families and their functions in the order of the page, one line each. */
function contents(families: readonly TradeFamily[]): string[] {
  return families.map((family) => `- **${markdownText(family.title)}**: ${family.entries.map((fn) => code(fn.name)).join(', ')}`);
}

/** The guide's whole text: the same registry gives the same bytes (no dates, fixed order). */
export function functionGuide(families: readonly TradeFamily[] = tradeFamilies): string {
  const count = families.reduce((n, f) => n + f.entries.length, 0);
  const lines = [
    '---',
    'title: Trade functions',
    'project: Wakesheet documentation',
    'author: Wakesheet team',
    'sigfigs: 4',
    '---',
    '',
    '# Trade functions',
    '',
    `The ${count} functions a worksheet can call, family by family, with their`,
    'parameters, what they return, the method and its published source, and one',
    'example each. The examples are `basis` blocks evaluated on this page; their',
    'numbers are invented for illustration, and the data files they read are the',
    'invented demo data in `worksheets/data/`.',
    '',
    'This page is generated from the function registry by `npm run guide`',
    '(`scripts/function-guide.ts`): edit the entries, not this file. How calls,',
    'named arguments, records and sweeps work is in the [language guide](language.md).',
    '',
    'Arguments are given in order or by name (`air(T: 20 degC)`); a parameter',
    'with a default, or marked optional, may be left out. A unit column names the',
    'dimension a quantity must have, and any unit of that dimension is accepted;',
    'a unit of 1 is a plain number (a ratio, a count, or a percentage such as `5 %`).',
    '',
    '## Contents',
    '',
    ...contents(families),
  ];
  for (const family of families) lines.push('', ...familySection(family));
  return `${lines.join('\n')}\n`;
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  writeFileSync(fileURLToPath(new URL(`../${GUIDE_PATH}`, import.meta.url)), functionGuide());
}
