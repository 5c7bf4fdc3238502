// The set-up record: the rendered sheet as one self-contained HTML file that
// opens offline years later, with its provenance — the sources verbatim, the
// hash of every source and data file, the version, the time, the overrides,
// the front matter, every input — readable on the page and machine-readable
// inside it, so that `wakesheet verify` can run it again and compare.
import { createHash } from 'node:crypto';
import { relative } from 'node:path';
import { SheetError } from '../diagnostics.js';
import { dataBytesReader } from '../read/data-files.js';
import { packageVersion } from '../read/paths.js';
import { provenanceHtml } from '../render/provenance.js';
import { standaloneCss } from '../render/assets.js';
import { pageHtml, RECORD_POLICY } from '../render/page.js';
import type { ArgumentJson, CheckJson, ErrorJson, InputJson, Override, SheetReport, SheetSummary, ValueJson } from './types.js';

export const RECORD_FORMAT = 'wakesheet-record';
export const RECORD_FORMAT_VERSION = 1;


export interface RecordData {
  format: typeof RECORD_FORMAT;
  formatVersion: number;
  /** The Wakesheet version that wrote it. */
  wakesheet: string;
  writtenAt: string;
  /** The sheet, relative to the project folder, and that folder as it was. */
  sheet: { path: string; root: string };
  meta: Record<string, string>;
  overrides: Override[];
  /** The sheet first, then every sheet it uses: verbatim, with SHA-256. */
  sources: Array<{ path: string; sha256: string; text: string }>;
  /** Each data file the sheet read, with SHA-256 (null when it could not be read at writing). */
  dataFiles: Array<{ path: string; sha256: string | null; bytes: number | null }>;
  summary: SheetSummary;
  checks: CheckJson[];
  errors: ErrorJson[];
  inputs: InputJson[];
  arguments: ArgumentJson[];
  values: Record<string, ValueJson>;
}

export interface RecordFacts {
  /** The sheet's text and its absolute path. */
  source: string;
  path: string;
  /** The project folder (absolute): data files are read inside it. */
  root: string;
  /** The time written, for tests; now by default. */
  now?: Date;
}

export function sha256(data: string | Buffer): string {
  return createHash('sha256').update(data).digest('hex');
}

/** The record's data: what the page shows in its provenance section, and verify reads back. */
export function recordData(report: SheetReport, facts: RecordFacts): RecordData {
  const rel = (p: string) => relative(facts.root, p).split('\\').join('/');
  const bytes = dataBytesReader(facts.root, facts.root);
  // The sheets it uses are sources, kept verbatim below, not data files.
  const used = new Set(report.usedSheets.map((u) => u.path));
  const dataFiles = report.reads.filter((path) => !used.has(path)).map((path) => {
    try {
      const b = bytes(path);
      return { path, sha256: sha256(b), bytes: b.length };
    } catch (e) {
      if (e instanceof SheetError) return { path, sha256: null, bytes: null };
      throw e;
    }
  });
  // The sheets it uses come with the report, project-relative; one reached two ways is kept once.
  const sources = [{ path: rel(facts.path), text: facts.source }];
  for (const u of report.usedSheets) if (!sources.some((x) => x.path === u.path)) sources.push(u);
  return {
    format: RECORD_FORMAT,
    formatVersion: RECORD_FORMAT_VERSION,
    wakesheet: packageVersion(),
    writtenAt: (facts.now ?? new Date()).toISOString(),
    sheet: { path: rel(facts.path), root: facts.root },
    meta: report.meta,
    overrides: report.overrides,
    sources: sources.map((s) => ({ ...s, sha256: sha256(s.text) })),
    dataFiles,
    summary: report.summary,
    checks: report.checks,
    errors: report.errors,
    inputs: report.inputs,
    arguments: report.arguments,
    values: report.values,
  };
}

/** The JSON inside the record, safe inside a <script type="application/json"> (no "</script>", no line breaks that end it). */
function embeddedJson(data: RecordData): string {
  return JSON.stringify(data).replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

const DATA_ID = 'wakesheet-record';

/** The record as one HTML file: the sheet, its provenance, and the data, with a policy that forbids every request. */
export function recordPage(report: SheetReport, data: RecordData): string {
  const page = pageHtml({
    title: report.title,
    headerHtml: report.headerHtml,
    summaryHtml: report.summaryHtml,
    parts: report.parts,
    head: `<meta http-equiv="Content-Security-Policy" content="${RECORD_POLICY}"><style>${standaloneCss()}</style><script type="application/json" id="${DATA_ID}">${embeddedJson(data)}</script>`,
    after: provenanceHtml(data),
    footer: `Set-up record written by Wakesheet ${data.wakesheet} on ${data.writtenAt.slice(0, 16).replace('T', ' ')} UTC. Check it against today's engine and data with: wakesheet verify FILE`,
  });
  // Inline SVG and MathML need no namespace attribute in HTML: without them the
  // file names no web address at all, so nothing in it can be taken for one.
  return page.replace(/ xmlns="http:\/\/www\.w3\.org\/(?:2000\/svg|1998\/Math\/MathML)"/g, '');
}

/** The data inside a record, or null when the text is not one. */
export function readRecord(html: string): RecordData | null {
  const m = new RegExp(`<script type="application/json" id="${DATA_ID}">([\\s\\S]*?)</script>`).exec(html);
  if (!m) return null;
  try {
    const data = JSON.parse(m[1]!) as RecordData;
    return data.format === RECORD_FORMAT && Array.isArray(data.sources) ? data : null;
  } catch {
    return null;
  }
}
