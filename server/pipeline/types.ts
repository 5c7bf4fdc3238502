// The shapes that leave the pipeline: what `renderSheet`, `wakesheet eval --json`
// and the live server all hand on. Changing them is a public-API change.
import type { SheetPart } from '../render/parts.js';
import type { SheetSummary } from '../render/page.js';
import type { ValueJson } from '../render/values.js';

export type { SheetPart, SheetSummary, ValueJson };

export interface CheckJson {
  line: number;
  passed: boolean;
  text: string;
}

export interface ErrorJson {
  line: number;
  column: number;
  message: string;
  /** Stable code, e.g. "unit-mismatch", "unknown-name". */
  code?: string;
}

/** One run of the pipeline over a sheet: everything but the standalone page. */
export interface SheetReport {
  title: string;
  /** Front matter as read (title, project, revision, author, sigfigs …). */
  meta: Record<string, string>;
  /** The sheet's header: title, front-matter facts, and the planning caution where due. */
  headerHtml: string;
  /** The inner content of <main>, in parts, for in-place updates. */
  parts: SheetPart[];
  /** The summary panel's HTML (outside <main>). */
  summaryHtml: string;
  summary: SheetSummary;
  values: Record<string, ValueJson>;
  checks: CheckJson[];
  errors: ErrorJson[];
  /** Data files the sheet read, as paths relative to the project root. */
  reads: string[];
  /** Milliseconds spent evaluating and rendering. */
  elapsedMs: number;
  /** The sheet computes something that can hurt someone (loads …): show the planning caution. */
  caution: boolean;
  /** Statements computed afresh in this run (the rest were reused). */
  freshStatements: number;
}

/** A report with its standalone page. */
export interface SheetResult extends SheetReport {
  /** A complete standalone HTML document (summary outside <main>, sheet inside). */
  html: string;
}

export interface RunOptions {
  /** Path of the sheet file (used in messages and to resolve data files). */
  path?: string;
  /** Project folder: data files are readable only inside it. */
  root?: string;
  /** false: values, checks and errors only, with no parts (the command line's eval and check). */
  render?: boolean;
}
