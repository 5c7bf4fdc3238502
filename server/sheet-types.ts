// The shapes that leave the pipeline: what `renderSheet`, `wakesheet eval --json`
// and the live server all hand on. Changing them is a public-API change.

export interface ValueJson {
  /** SI value; null for text, booleans, records, figures. */
  si: number | null;
  /** SI unit text ("m/s", "Pa s", "" for plain numbers). */
  unit: string;
  /** As rendered, e.g. "23 µm". */
  display: string;
  fields?: Record<string, ValueJson>;
  items?: ValueJson[];
}

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

/** One piece of the sheet's <main>: a run of prose or one input block. */
export interface SheetPart {
  /** Stable within a file as long as the part keeps its place ("b3", "t4"). */
  key: string;
  html: string;
}

export interface SheetSummary {
  inputs: number;
  results: number;
  checksPassed: number;
  checksFailed: number;
  errors: number;
}

export interface SheetResult {
  title: string;
  /** Front matter as read (title, project, revision, author, sigfigs …). */
  meta: Record<string, string>;
  /** A complete standalone HTML document (summary outside <main>, sheet inside). */
  html: string;
  /** The inner content of <main>, in parts, for in-place patching. */
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
}

export interface RenderOptions {
  /** Path of the sheet file (used in messages and to resolve data files). */
  path?: string;
  /** Project folder: data files are readable only inside it. */
  root?: string;
}
