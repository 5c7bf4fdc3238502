// The sheet's <main> as parts: each prose part and each basis block becomes
// one keyed piece of html. A part whose inputs are the same objects as last
// time keeps its html (and its token, cheap to compare downstream); inside a
// changed block each statement is memoised on its own. Block html is kept
// packed (packed-html.ts): a large sheet's html would otherwise take more
// memory than everything else the pipeline holds for it.
import type { Value } from '../core/index.js';
import { sameItems, type InlineResult, type StatementResult } from '../evaluate/index.js';
import type { BrokenLine, ParsedLine, Statement } from '../parse/index.js';
import { isStackOverflow, isStatement, isUse } from '../parse/index.js';
import type { LoadedImage } from '../read/images.js';
import { PLAIN_PROSE, type ImageSource, type InlineSource, type SplitSheet } from '../read/parts.js';
import { inlineHtml } from './inline.js';
import { useHtml, type UseView } from './use.js';
import { displayKey } from './numbers.js';
import { embedImages, inlineValueSpans, proseHtml } from './prose.js';
import { compactHtml, escapeHtml } from './html.js';
import { errorHtml, lastGoodHtml, statementHtml, untypesetHtml, type StatementView } from './statement.js';
import { PackedHtml } from './packed-html.js';

/** One piece of the sheet's <main>: a run of prose or one input block. */
export interface SheetPart {
  /** Stable within a file as long as the part keeps its place ("b3", "t4"). */
  key: string;
  html: string;
  /**
   * Equal exactly when the html is equal, and much shorter than it: what a
   * receiver keeps to tell whether the part changed. Without it, the html.
   */
  token?: string;
}

/** What rendering reads besides each statement's own result. */
export interface SheetView extends StatementView {
  lastGood: ReadonlyMap<string, Value>;
}

export interface PartsInput {
  sheet: SplitSheet;
  /** The parsed lines of each block part, in order. */
  blocks: readonly (readonly ParsedLine[])[];
  /** Statement results by file line. */
  results: ReadonlyMap<number, StatementResult>;
  inline: ReadonlyMap<string, InlineResult>;
  /** The prose's images, embedded or refused. */
  images: ReadonlyMap<string, LoadedImage>;
  /** Each `use` line by its file line: what it brought in, or why not. */
  uses: ReadonlyMap<number, UseView>;
  view: SheetView;
  /**
   * The sheet's time budget ends here (Date.now() ms): statements and prose not
   * typeset by then are shown as their source text, and typeset on a later run.
   */
  deadline?: number;
  /** The budget in ms, for the words of the notice. */
  budgetMs?: number;
}

export interface RenderedParts {
  parts: SheetPart[];
  /** Statements and prose parts shown as source text because the time ran out. */
  untypeset: number;
}

interface Memo {
  html: string;
  inputs: unknown[];
}

interface BlockMemo {
  packed: PackedHtml;
  inputs: unknown[];
}

/** A statement's html is the characters at..at+length of the block html that holds it. */
interface StatementMemo {
  inputs: unknown[];
  in: PackedHtml;
  at: number;
  length: number;
}

/** A statement's html, and what to memoise it by (not for one cut short by the time). */
interface Piece {
  html: string;
  keep?: { key: string; inputs: unknown[] };
}

export function inlineKey(line: number, text: string): string {
  return `${line}\u0000${text}`;
}

export class PartRenderer {
  private readonly prose = new Map<string, Memo>();
  private readonly blocks = new Map<string, BlockMemo>();
  /** Rendered statements of the last runs, by line and text. */
  private statements = new Map<string, StatementMemo>();
  /** Block html unpacked during this run, for the unchanged statements of changed blocks; emptied after it. */
  private readonly unpacked = new Map<PackedHtml, string>();
  /** How numbers were shown last time (figures, units): every memo holds for one. */
  private display = '';

  /** Pieces shown untypeset in the current run. */
  private cut = 0;

  render(input: PartsInput): RenderedParts {
    try {
      return this.renderParts(input);
    } finally {
      this.unpacked.clear();
    }
  }

  private renderParts(input: PartsInput): RenderedParts {
    this.cut = 0;
    const display = displayKey(input.view.sig);
    if (display !== this.display) {
      this.prose.clear();
      this.blocks.clear();
      this.statements.clear();
      this.display = display;
    }
    const out: SheetPart[] = [];
    let blockIndex = 0;
    let statementCount = 0;
    input.sheet.parts.forEach((part, i) => {
      if (part.kind === 'prose') {
        const key = `t${i}`;
        out.push({ key, html: part.plain ? compactHtml(plainHtml(part.raw, part.plain)) : this.proseHtml(key, part.raw, part.tokens, part.inline, input, part.images) });
        return;
      }
      const items = input.blocks[blockIndex++]!;
      statementCount += items.length;
      const key = `b${i}`;
      out.push(this.block(key, part.fenceLine, items, input));
    });
    // Forget statements that left the sheet, now and then rather than every run.
    if (this.statements.size > 2 * statementCount + 100) this.forgetStatements(input);
    return { parts: out, untypeset: this.cut };
  }

  private outOfTime(input: PartsInput): boolean {
    return input.deadline !== undefined && Date.now() > input.deadline;
  }

  private timeReason(input: PartsInput): string {
    const budget = input.budgetMs === undefined ? 'its time limit' : `its ${input.budgetMs.toLocaleString('en')} ms time limit`;
    return `the sheet reached ${budget} first; shown as its source text until a later run typesets it`;
  }

  private block(key: string, fenceLine: number, items: readonly ParsedLine[], input: PartsInput): SheetPart {
    const { view } = input;
    const inputs: unknown[] = [];
    for (const item of items) {
      if (isStatement(item)) statementInputs(input.results.get(item.line)!, view, inputs);
      else if (isUse(item)) useInputs(input.uses.get(item.line), inputs);
      else inputs.push(item.message, item.line, item.column, view.lastGood.get(item.name ?? ''));
    }
    const memo = this.blocks.get(key);
    if (memo && sameItems(memo.inputs, inputs)) return packedPart(key, memo.packed);
    if (this.outOfTime(input)) {
      // Out of time before the block began: its lines as they stand, in one piece (cheap for a huge sheet).
      const count = items.length;
      this.cut += count;
      const source = items.map((item) => item.source).join('\n');
      return { key, html: compactHtml(`<div class="ws-block ws-untypeset" data-fence-line="${fenceLine}"><p class="ws-untypeset-note">${count === 1 ? 'This statement is' : `These ${count.toLocaleString('en')} statements are`} not typeset: ${escapeHtml(this.timeReason(input))}.</p><pre class="ws-plain-text">${escapeHtml(source)}</pre></div>`) };
    }
    const cutBefore = this.cut;
    const pieces = items.map((item): Piece =>
      isStatement(item) ? this.statement(input.results.get(item.line)!, input) : { html: compactHtml(isUse(item) ? useHtml(item.line, input.uses.get(item.line)!, view.sig) : brokenHtml(item, view)) },
    );
    const open = `<div class="ws-block" data-fence-line="${fenceLine}">`;
    const html = `${open}${pieces.map((p) => p.html).join('')}</div>`;
    const packed = PackedHtml.of(html);
    this.shareStatements(pieces, packed, open.length);
    // A block with statements cut short is not kept: the next run finishes it.
    if (this.cut === cutBefore) this.blocks.set(key, { packed, inputs });
    else this.blocks.delete(key);
    return { key, html, token: packed.token };
  }

  /**
   * The html of a block is held once: each statement's memo is a place in
   * the block's packed html, instead of a copy of its own beside it.
   */
  private shareStatements(pieces: readonly Piece[], packed: PackedHtml, start: number): void {
    let at = start;
    for (const { html, keep } of pieces) {
      if (keep) this.statements.set(keep.key, { inputs: keep.inputs, in: packed, at, length: html.length });
      at += html.length;
    }
  }

  /** One statement's HTML, reused while its result and inputs are the same objects. */
  private statement(r: StatementResult, input: PartsInput): Piece {
    const { view } = input;
    const key = statementKey(r.stmt);
    const inputs = statementInputs(r, view, []);
    const memo = this.statements.get(key);
    if (memo && sameItems(memo.inputs, inputs)) return { html: this.memoHtml(memo), keep: { key, inputs: memo.inputs } };
    const anchor = `<a id="L${r.stmt.line}" class="ws-anchor"></a>`;
    if (this.outOfTime(input)) {
      this.cut++;
      return { html: compactHtml(anchor + untypesetHtml(r, view, this.timeReason(input))) };
    }
    let body: string;
    try {
      body = statementHtml(r, view);
    } catch (e) {
      // One formula the typesetter cannot take is that statement's problem only.
      const reason = isStackOverflow(e) ? 'its formula nests too deeply for the typesetter' : `a fault inside Wakesheet while typesetting it (please report it): ${e instanceof Error ? e.message : String(e)}`;
      body = untypesetHtml(r, view, reason);
    }
    return { html: compactHtml(anchor + body), keep: { key, inputs } };
  }

  private memoHtml(memo: StatementMemo): string {
    let whole = this.unpacked.get(memo.in);
    if (whole === undefined) {
      whole = memo.in.html();
      this.unpacked.set(memo.in, whole);
    }
    return whole.slice(memo.at, memo.at + memo.length);
  }

  private proseHtml(key: string, raw: string, tokens: Parameters<typeof proseHtml>[0], inline: readonly InlineSource[], input: PartsInput, images: readonly ImageSource[]): string {
    const memo = this.prose.get(key);
    const imageInputs = images.map((i) => input.images.get(i.src));
    let base: string;
    if (memo && memo.inputs[0] === raw && sameItems(memo.inputs.slice(1), imageInputs)) base = memo.html;
    else if (this.outOfTime(input)) {
      this.cut++;
      return compactHtml(plainHtml(raw, `Not laid out yet: ${this.timeReason(input)}.`));
    } else {
      try {
        base = compactHtml(embedImages(proseHtml(tokens, input.sheet.links), input.images));
      } catch (e) {
        if (!isStackOverflow(e)) throw e;
        base = compactHtml(plainHtml(raw, PLAIN_PROSE));
      }
      this.prose.set(key, { html: base, inputs: [raw, ...imageInputs] });
    }
    if (inline.length === 0) return base;
    // The code spans in the html are the inline sources in document order; a
    // <code> written as raw HTML in the prose has no source and stays as it is.
    const queue = new Map<string, InlineSource[]>();
    for (const s of inline) {
      const list = queue.get(s.text);
      if (list) list.push(s);
      else queue.set(s.text, [s]);
    }
    let html = base;
    for (const span of inlineValueSpans(base)) {
      const source = queue.get(span.expr.trim())?.shift();
      if (!source) continue;
      const result = input.inline.get(inlineKey(source.line, source.text));
      if (result) html = html.replace(span.match, () => inlineHtml(source.text, result, input.view.sig));
    }
    return compactHtml(html);
  }

  private forgetStatements(input: PartsInput): void {
    const live = new Set<string>();
    for (const items of input.blocks) for (const item of items) if (isStatement(item)) live.add(statementKey(item));
    for (const k of this.statements.keys()) if (!live.has(k)) this.statements.delete(k);
  }
}

/** A kept block as a part: its html is unpacked only if it is read. */
function packedPart(key: string, packed: PackedHtml): SheetPart {
  return { key, token: packed.token, get html() { return packed.html(); } };
}

/** What a use line shows: its sheet, its error, each name and value (values by identity). */
function useInputs(u: UseView | undefined, out: unknown[]): void {
  out.push(u?.path, u?.error?.message, u?.error?.column);
  for (const n of u?.names ?? []) out.push(n.name, n.value, n.u);
  out.push(u?.notes?.join('\n'));
}

function statementKey(s: Statement): string {
  return `${s.line}\u0000${s.source}`;
}

/** Prose that is not laid out as Markdown: its text as it stands, and why. */
function plainHtml(raw: string, reason: string): string {
  return `<div class="ws-plain"><p class="ws-untypeset-note">${escapeHtml(reason)}</p><pre class="ws-plain-text">${escapeHtml(raw)}</pre></div>`;
}

function brokenHtml(item: BrokenLine, view: SheetView): string {
  return `<div class="ws-stmt ws-broken" id="L${item.line}" data-line="${item.line}">${errorHtml(item.message, item.line, item.column, item.source)}${lastGoodHtml(item.name, view)}</div>`;
}

/** What a statement's HTML depends on, appended to `out`. */
function statementInputs(r: StatementResult, view: SheetView, out: unknown[]): unknown[] {
  out.push(r.stmt.line, r.stmt.source, r.value, r.error?.message, r.error?.column, r.blockedBy, r.skipped, r.warnings.length ? r.warnings.join('\n') : '');
  // The ± shown and the range verdict, by value: an input's spread can change while the values stay the same objects.
  const p = r.propagated;
  out.push(p?.u, p?.problem, p?.fields ? [...p.fields].map(([k, f]) => `${k}:${f.u}`).join(',') : undefined, r.uncertain?.distribution, r.range?.text);
  for (const n of r.uses) out.push(view.values.get(n));
  if ((r.error || r.blockedBy) && r.stmt.type === 'define') out.push(view.lastGood.get(r.stmt.name));
  return out;
}
