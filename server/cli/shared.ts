// What the commands share: the usage error, flag parsing against each
// command's own flags, colour, reading a sheet, running it in the sandbox
// with a sandbox failure as the sheet's error, and writing output files.
import { existsSync, readFileSync, renameSync, statSync, unlinkSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { nearestWord } from '../core/shared/words.js';
import { emptyReport } from '../pipeline/report-basics.js';
import type { RunOptions, SheetResult } from '../pipeline/types.js';
import { isSheetFile, sheetTooLarge } from '../read/sheet-files.js';
import { Sandbox, SandboxError } from '../sandbox/sandbox.js';

/** Bad arguments: one line, exit 2. */
export class UsageError extends Error {}

/** A command's flags without their dashes: a switch, a flag that takes a value, or one that may be given again (each value kept). Short forms map to long ones. */
export interface FlagSpec {
  flags: Record<string, 'switch' | 'value' | 'repeat'>;
  short?: Record<string, string>;
}

export interface Parsed {
  positional: string[];
  flags: Map<string, string | true>;
  /** The values of each repeatable flag, in order. */
  repeated: Map<string, string[]>;
}

export function parseArgs(argv: string[], spec: FlagSpec): Parsed {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  const repeated = new Map<string, string[]>();
  const known = Object.keys(spec.flags);
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (!a.startsWith('-') || a === '-') {
      positional.push(a);
      continue;
    }
    const m = /^(--?)([^=]+)(?:=(.*))?$/.exec(a)!;
    const name = m[1] === '-' && m[2]!.length === 1 ? (spec.short?.[m[2]!] ?? m[2]!) : m[2]!;
    const kind = Object.hasOwn(spec.flags, name) ? spec.flags[name] : undefined;
    if (!kind) {
      const hint = nearestWord(name, known);
      throw new UsageError(`unknown option ${a}${hint ? `; did you mean --${hint}?` : known.length ? `; the options are ${known.map((k) => `--${k}`).join(', ')}` : ''}`);
    }
    if (kind === 'switch') {
      if (m[3] !== undefined) throw new UsageError(`--${name} takes no value`);
      flags.set(name, true);
      continue;
    }
    const v = m[3] ?? argv[++i];
    if (v === undefined || v === '') throw new UsageError(`${a} needs a value`);
    if (kind === 'repeat') repeated.set(name, [...(repeated.get(name) ?? []), v]);
    else flags.set(name, v);
  }
  return { positional, flags, repeated };
}

/**
 * The inputs to replace, from `--set NAME=VALUE` (repeatable): name → value
 * as worksheet text. Whether the name is an input, and the value a value, the
 * sheet says; here only the form is checked.
 */
export function overridesOf(parsed: Parsed): Record<string, string> | undefined {
  const sets = parsed.repeated.get('set');
  if (!sets) return undefined;
  const out: Record<string, string> = {};
  for (const s of sets) {
    const m = /^\s*([A-Za-z_\u0370-\u03ff][A-Za-z0-9_\u0370-\u03ff]*)\s*=(.*)$/.exec(s);
    if (!m) throw new UsageError(`--set ${s}: write it as NAME=VALUE, e.g. --set U_inf=20m/s`);
    const [, name, value] = m as unknown as [string, string, string];
    if (value.trim() === '') throw new UsageError(`--set ${name}= needs a value after the "="`);
    if (Object.hasOwn(out, name)) throw new UsageError(`--set ${name} is given twice (${out[name]} and ${value.trim()}); give it once`);
    out[name] = value.trim();
  }
  return out;
}

export function colour(code: number, s: string): string {
  const on = process.stdout.isTTY && !process.env.NO_COLOR;
  return on ? `\u001b[${code}m${s}\u001b[0m` : s;
}

/** The sheet named on the command line: an existing Markdown file, or a usage error that says what it is instead. */
export function sheetArgument(file: string, command: string): string {
  if (!existsSync(file)) throw new UsageError(`no such file: ${file}`);
  if (statSync(file).isDirectory()) throw new UsageError(`${file} is a folder; ${command} takes one sheet (to evaluate every sheet in a folder: wakesheet check ${file})`);
  if (!isSheetFile(file)) throw new UsageError(`${file} is not a sheet: a worksheet is a Markdown file ending in .md`);
  return file;
}

/** A run of one sheet; `failure` says why the sandbox could not finish it (then the result holds only that error). */
export interface OneRun {
  result: SheetResult;
  text: string;
  failure?: string;
}

/** Runs one sheet; a sandbox failure (timeout, memory, crash) comes back as the sheet's one error. */
export async function runOne(sandbox: Sandbox, file: string, root: string, given?: string, extra: Omit<RunOptions, 'path' | 'root'> = {}): Promise<OneRun> {
  let text = given;
  if (text === undefined) {
    const tooLarge = sheetTooLarge(statSync(file).size);
    if (tooLarge) return failedRun(tooLarge, '');
    text = readFileSync(file, 'utf8');
  }
  try {
    return { result: await sandbox.run(text, { ...extra, path: resolve(file), root }), text };
  } catch (e) {
    if (!(e instanceof SandboxError)) throw e;
    return failedRun(e.message, text);
  }
}

/** A run that could not happen: the sheet's one error says why. */
function failedRun(message: string, text: string): OneRun {
  const report = emptyReport({ summary: { inputs: 0, results: 0, checksPassed: 0, checksFailed: 0, checksNotRun: 0, errors: 1 }, errors: [{ line: 1, column: 1, message, code: 'limit' }] });
  return { result: { ...report, html: '' }, text, failure: message };
}

export function failing(r: SheetResult): boolean {
  return r.errors.length > 0 || r.checks.some((c) => !c.passed);
}

/**
 * Writes an output file whole or not at all: into a temporary file beside the
 * target, then renamed over it, so an existing file is only ever replaced by a
 * complete one. A folder that does not exist, or a target that is a folder, is
 * a usage error in one line.
 */
export function writeOutput(target: string, text: string): void {
  const dir = dirname(resolve(target));
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new UsageError(`cannot write ${target}: the folder ${dirname(target)} does not exist`);
  if (existsSync(target) && statSync(target).isDirectory()) throw new UsageError(`cannot write ${target}: it is a folder`);
  const temp = join(dir, `.${basename(target)}.${process.pid}.tmp`);
  try {
    writeFileSync(temp, text);
    renameSync(temp, target);
  } catch (e) {
    try {
      unlinkSync(temp);
    } catch {
      // nothing was written
    }
    throw new UsageError(`cannot write ${target}: ${(e as NodeJS.ErrnoException).code === 'ENOSPC' ? 'the disk is full' : (e as Error).message}`);
  }
}


export { Sandbox };
