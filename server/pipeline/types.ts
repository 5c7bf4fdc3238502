// The shapes that leave the pipeline: what `renderSheet`, `wakesheet eval --json`
// and the live server all hand on. Changing them is a public-API change.
import type { SheetPart } from '../render/parts.js';
import type { SheetSummary } from '../render/page.js';
import type { ValueJson } from '../render/value-json.js';

export type { SheetPart, SheetSummary, ValueJson };

export interface CheckJson {
  line: number;
  passed: boolean;
  text: string;
  /** On a failed check: the values it compared, as text ("U_wind = 28 m/s"). */
  compared?: string;
  /** For a check that depends on inputs with an uncertainty: whether it holds over their ±2u range too. */
  range?: { holds: boolean; text: string };
}

export interface ErrorJson {
  line: number;
  column: number;
  message: string;
  /** Stable code, e.g. "unit-mismatch", "unknown-name". */
  code?: string;
}

/** An input of the sheet: a name defined by a literal, with its value. */
export interface InputJson {
  name: string;
  line: number;
  /** As written on the sheet: `110 km/h`. */
  text: string;
  value: ValueJson;
}

/** A literal argument of a call: `air(T: 28 degC)` gives {fn: "air", arg: "T", text: "28 degC"}. */
export interface ArgumentJson {
  line: number;
  /** The name the statement defines, or "" for a check or a bare expression. */
  name: string;
  fn: string;
  /** The parameter's name, or "#2" for the second positional argument. */
  arg: string;
  text: string;
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
  /** Every defined value, with the warnings and remarks of its statement. */
  values: Record<string, ValueJson>;
  /** The inputs (names defined by a literal) and the literal arguments of calls, for the record. */
  inputs: InputJson[];
  arguments: ArgumentJson[];
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
  /**
   * Statements and prose parts shown as source text because the sheet's time
   * budget ran out while typesetting; a later run of the same text typesets more.
   */
  untypeset: number;
  /** The sheets it uses, with their texts (project-relative paths). */
  usedSheets: Array<{ path: string; text: string }>;
  /** Inputs replaced for this run, here or in a used sheet. */
  overrides: Override[];
  /** The names asked to be set that this sheet or a sheet it uses defines (set, or refused with an error). */
  overridesMatched: string[];
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
  /** Inputs replaced for this run (`--set U_inf=20m/s`): name → the value as worksheet text. */
  overrides?: Record<string, string>;
  /** A name to set that this sheet does not define is no error here (a check of a folder sets each name where it is defined). */
  overridesElsewhere?: boolean;
  /** Texts of used sheets by project-relative path, read instead of the files (a record being verified). */
  sources?: Record<string, string>;
  /** The sheets on the way to this one through `use` (absolute paths), to find circles. */
  chain?: string[];
  /** false: values, checks and errors only, with no parts (the command line's eval and check). */
  render?: boolean;
}

/** How far a long statement of a run has come (a Monte Carlo run): told while the run goes on. */
export interface RunProgress {
  /** The statement's line. */
  line: number;
  done: number;
  total: number;
}

/** What a run tells as it goes; functions, so never part of RunOptions (which crosses to the sandbox). */
export interface RunHooks {
  progress?: (p: RunProgress) => void;
}

/** An input replaced for one run. */
export interface Override {
  name: string;
  /** As the sheet writes it. */
  was: string;
  /** As it was given. */
  now: string;
  /** The sheet it is an input of (project-relative). */
  sheet: string;
}
