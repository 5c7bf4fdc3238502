// Splits a sheet into its parts, prose and `basis` blocks, keeping each
// block's file lines and each prose part's inline `=expr` values. marked's
// top-level tokens tile the (LF-normalised) text exactly, so summing their
// raw lengths gives every block's offset.
import { Lexer, type Token, type Tokens, type TokensList } from 'marked';
import { nearestWord } from '../core/shared/words.js';

export interface BlockLine {
  /** 1-based line in the file. */
  line: number;
  /** 1-based column where `text` starts. */
  col: number;
  text: string;
}

/** An inline value in prose: `=expr` in a code span. */
export interface InlineSource {
  /** The expression, as written after "=" (trimmed). */
  text: string;
  /** File line of the code span. */
  line: number;
}

/** An image in prose, `![alt](src)`: embedded from the project folder, never fetched. */
export interface ImageSource {
  src: string;
  line: number;
}

export type ProsePart = {
  kind: 'prose';
  tokens: Token[];
  firstLine: number;
  raw: string;
  inline: InlineSource[];
  images: ImageSource[];
  /** Set when the prose could not be read as Markdown: why; it is shown as plain text. */
  plain?: string;
};
export type BlockPart = { kind: 'block'; fenceLine: number; lines: BlockLine[] };
export type SourcePart = ProsePart | BlockPart;

/** A fence whose word is one slip from `basis` ("Basis", "bsis"): shown as code, so nothing in it would run unsaid. */
export interface FenceSlip {
  line: number;
  column: number;
  word: string;
}

export interface SplitSheet {
  parts: SourcePart[];
  /** Link definitions, needed when prose is rendered piece by piece. */
  links: TokensList['links'];
  fenceSlips: FenceSlip[];
}

export function normaliseNewlines(text: string): string {
  return text.replace(/\r\n?/g, '\n');
}

function fenceWord(t: Token): string | undefined {
  return t.type === 'code' && typeof (t as { lang?: string }).lang === 'string' ? (t as { lang: string }).lang.trim().split(/\s+/)[0] : undefined;
}

function isBasisFence(t: Token): t is Token & { type: 'code'; lang: string; raw: string } {
  return fenceWord(t) === 'basis';
}

// Code-block words one edit from "basis" that name something else.
const NOT_SLIPS = new Set(['basic']);

/** The fence of a code block that was surely meant as a basis block: its line and word, or undefined. */
function fenceSlip(t: Token, line: number): FenceSlip | undefined {
  const word = fenceWord(t);
  if (!word || word === 'basis' || NOT_SLIPS.has(word.toLowerCase()) || nearestWord(word, ['basis'], 1) === undefined) return undefined;
  const fenceLine = t.raw.replace(/^\n+/, '').split('\n', 1)[0]!;
  return { line: line + leadingNewlines(t.raw), column: fenceLine.indexOf(word) + 1, word };
}

export function splitParts(text: string): SplitSheet {
  let tokens: TokensList;
  try {
    tokens = new Lexer({ gfm: true }).lex(text);
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    return splitPlain(text);
  }
  const parts: SourcePart[] = [];
  let line = 1;
  let prose: Token[] = [];
  let proseLine = 1;
  let proseRaw = '';
  const fenceSlips: FenceSlip[] = [];
  const flush = () => {
    if (prose.length) parts.push({ kind: 'prose', tokens: prose, firstLine: proseLine, raw: proseRaw, ...proseSources(prose, proseRaw, proseLine) });
    prose = [];
    proseRaw = '';
  };
  for (const t of tokens) {
    const raw = t.raw;
    if (isBasisFence(t)) {
      flush();
      parts.push({ kind: 'block', fenceLine: line + leadingNewlines(raw), lines: blockLines(raw, line) });
    } else {
      const slip = fenceSlip(t, line);
      if (slip) fenceSlips.push(slip);
      if (prose.length === 0) proseLine = line;
      prose.push(t);
      proseRaw += raw;
    }
    line += countNewlines(raw);
  }
  flush();
  return { parts, links: tokens.links, fenceSlips };
}

/** Why prose is shown as plain text when marked cannot follow it. */
export const PLAIN_PROSE = 'This text nests Markdown (quotes, lists, emphasis) too deeply to be laid out; it is shown as plain text.';

/**
 * Markdown nested thousands deep (">" after ">", list in list) runs marked's
 * lexer out of stack. The sheet is then split line by line: basis blocks as
 * usual, the text between them kept as plain text, so the numbers still
 * evaluate.
 */
function splitPlain(text: string): SplitSheet {
  const lines = text.split('\n');
  const parts: SourcePart[] = [];
  let proseStart = 0;
  const prose = (end: number) => {
    if (end <= proseStart) return;
    const raw = lines.slice(proseStart, end).join('\n');
    parts.push({ kind: 'prose', tokens: [], firstLine: proseStart + 1, raw, inline: [], images: [], plain: PLAIN_PROSE });
  };
  for (let i = 0; i < lines.length; i++) {
    const open = /^ {0,3}(`{3,}|~{3,})[ \t]*basis(?:\s|$)/.exec(lines[i]!);
    if (!open) continue;
    prose(i);
    const fence = open[1]!;
    const body: BlockLine[] = [];
    let j = i + 1;
    for (; j < lines.length; j++) {
      const t = lines[j]!.trim();
      if (t.startsWith(fence) && t.replace(/[`~]/g, '') === '') break;
      body.push({ line: j + 1, col: 1, text: lines[j]! });
    }
    parts.push({ kind: 'block', fenceLine: i + 1, lines: body });
    i = j;
    proseStart = j + 1;
  }
  prose(lines.length);
  return { parts, links: Object.create(null) as TokensList['links'], fenceSlips: [] };
}

/** The `=expr` code spans and the images of a prose part, in document order, with their file lines. */
function proseSources(tokens: Token[], raw: string, firstLine: number): { inline: InlineSource[]; images: ImageSource[] } {
  const inline: InlineSource[] = [];
  const images: ImageSource[] = [];
  // Tokens come in source order: each is looked for after the one before, so
  // that `=x` quoted inside a longer span does not take x's place.
  let cursor = 0;
  const lineOf = (tokenRaw: string) => {
    const at = raw.indexOf(tokenRaw, cursor);
    if (at >= 0) cursor = at + tokenRaw.length;
    return firstLine + countNewlines(raw.slice(0, Math.max(0, at)));
  };
  walkInline(tokens, (t) => {
    if (t.type === 'image') {
      images.push({ src: (t as Tokens.Image).href, line: lineOf(t.raw) });
      return;
    }
    if (t.type === 'html') {
      // An <img> written as HTML is embedded, or refused, like a Markdown one.
      const line = lineOf(t.raw);
      for (const m of t.raw.matchAll(/<img\b[^>]*?\ssrc\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s>]+))/gi)) images.push({ src: m[1] ?? m[2] ?? m[3]!, line });
      return;
    }
    const span = t as Tokens.Codespan;
    const line = lineOf(span.raw);
    const text = span.text.slice(1).trim();
    if (!span.text.startsWith('=') || span.text.startsWith('==') || text === '') return;
    inline.push({ text, line });
  });
  return { inline, images };
}

function walkInline(tokens: readonly Token[], visit: (t: Token) => void): void {
  for (const t of tokens) {
    if (t.type === 'codespan' || t.type === 'image' || t.type === 'html') visit(t);
    const any = t as { tokens?: Token[]; items?: Token[]; header?: { tokens: Token[] }[]; rows?: { tokens: Token[] }[][] };
    if (any.tokens) walkInline(any.tokens, visit);
    if (any.items) walkInline(any.items, visit);
    if (any.header) for (const cell of any.header) walkInline(cell.tokens, visit);
    if (any.rows) for (const row of any.rows) for (const cell of row) walkInline(cell.tokens, visit);
  }
}

function countNewlines(s: string): number {
  let n = 0;
  for (let i = 0; i < s.length; i++) if (s.charCodeAt(i) === 10) n++;
  return n;
}

function leadingNewlines(raw: string): number {
  let n = 0;
  while (raw[n] === '\n') n++;
  return n;
}

/** The content lines of a fenced block, with their file positions. */
function blockLines(raw: string, startLine: number): BlockLine[] {
  const all = raw.split('\n');
  let first = 0;
  while (first < all.length && all[first]!.trim() === '') first++;
  const fence = all[first]!;
  const indent = fence.length - fence.trimStart().length;
  const marker = fence.trimStart().slice(0, 3);
  const out: BlockLine[] = [];
  for (let i = first + 1; i < all.length; i++) {
    const textLine = all[i]!;
    if (textLine.trimStart().startsWith(marker) && textLine.trim().replace(/[`~]/g, '') === '') break;
    const strip = Math.min(indent, textLine.length - textLine.trimStart().length);
    out.push({ line: startLine + i, col: strip + 1, text: textLine.slice(strip) });
  }
  return out;
}

const FENCE_LIKE = /^\s*(`{3,}|~{3,})/;

/**
 * The parts of `next`, reusing `prev`'s when the edit only rewrote lines inside
 * one basis block (the usual save: one input changed). Falls back to a full
 * lex whenever the edit could change the document's structure.
 */
export function resplitParts(prevText: string, prev: SplitSheet, next: string): SplitSheet {
  if (prevText === next) return prev;
  const a = prevText.split('\n');
  const b = next.split('\n');
  if (a.length !== b.length) return splitParts(next);
  let first = 0;
  while (first < a.length && a[first] === b[first]) first++;
  let last = a.length - 1;
  while (last > first && a[last] === b[last]) last--;
  // Lines first..last (0-based) differ; they must all be content lines of one block.
  for (let i = first; i <= last; i++) if (FENCE_LIKE.test(a[i]!) || FENCE_LIKE.test(b[i]!)) return splitParts(next);
  const lineFirst = first + 1;
  const lineLast = last + 1;
  const index = prev.parts.findIndex(
    (s) => s.kind === 'block' && s.lines.length > 0 && s.lines[0]!.line <= lineFirst && s.lines[s.lines.length - 1]!.line >= lineLast,
  );
  if (index < 0) return splitParts(next);
  const block = prev.parts[index] as BlockPart;
  // Indented fences strip their indentation from content lines: leave those to the full lex.
  if (block.lines.some((l) => l.col !== 1)) return splitParts(next);
  const lines = block.lines.map((l) => (l.line >= lineFirst && l.line <= lineLast ? { ...l, text: b[l.line - 1]! } : l));
  const parts = prev.parts.slice();
  parts[index] = { ...block, lines };
  return { parts, links: prev.links, fenceSlips: prev.fenceSlips };
}
