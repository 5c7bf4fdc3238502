// `wakesheet verify RECORD.html [--root DIR]`: runs a record's embedded
// sources again with this version of Wakesheet and the data files on disk,
// and reports every value that now shows differently, every check that turned,
// and every data file whose hash changed. Exit 0 only when everything matches.
import { existsSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { countText } from '../core/shared/words.js';
import type { ValueJson } from '../pipeline/index.js';
import { readRecord, sha256, type RecordData } from '../pipeline/record.js';
import { dataBytesReader } from '../read/data-files.js';
import { packageVersion } from '../read/paths.js';
import { colour, parseArgs, runOne, Sandbox, UsageError, type FlagSpec } from './shared.js';

export const VERIFY_HELP = `wakesheet verify RECORD.html [--root DIR]

Runs the sheet embedded in a set-up record (written by wakesheet render) again,
with this version of Wakesheet and the data files on disk, and lists every value
that now shows differently (beyond the significant figures shown, its ± too), every check
whose outcome changed, and every data file that changed or is missing. Data
files are looked for in the project folder the record names, or in --root DIR.
Exits 0 only when all of it matches, 1 otherwise.`;

const FLAGS: FlagSpec = { flags: { root: 'value' } };

export async function verifyCommand(argv: string[], sandbox = new Sandbox()): Promise<number> {
  const { positional, flags } = parseArgs(argv, FLAGS);
  if (positional.length !== 1) throw new UsageError('verify takes one record file');
  const file = positional[0]!;
  if (!existsSync(file) || statSync(file).isDirectory()) throw new UsageError(`no such record file: ${file}`);
  const data = readRecord(readFileSync(file, 'utf8'));
  if (!data) throw new UsageError(`${file} is not a Wakesheet set-up record (written by wakesheet render)`);
  const root = resolve((flags.get('root') as string | undefined) ?? (existsSync(data.sheet.root) ? data.sheet.root : dirname(resolve(file))));
  const differences = [...sourceIntegrity(data), ...dataFileChanges(data, root)];
  let checked = 0;
  try {
    // The run is of the recorded texts, the used sheets' too, with the inputs that were set then.
    const sources = Object.fromEntries(data.sources.slice(1).map((x) => [x.path, x.text]));
    const overrides = data.overrides.length ? Object.fromEntries(data.overrides.map((o) => [o.name, o.now])) : undefined;
    const { result, failure } = await runOne(sandbox, join(root, data.sheet.path), root, data.sources[0]!.text, { sources, ...(overrides ? { overrides } : {}), render: false });
    if (failure) differences.push(`the sheet could not be run again: ${failure}`);
    else {
      for (const [name, was] of Object.entries(data.values)) {
        checked++;
        compareValue(name, was, result.values[name], differences);
      }
      for (const name of Object.keys(result.values)) if (!(name in data.values)) differences.push(`${name} is computed now but was not in the record`);
      const now = new Map(result.checks.map((c) => [c.line, c.passed]));
      for (const c of data.checks) {
        const passes = now.get(c.line);
        if (passes === undefined) differences.push(`the check on line ${c.line} (${c.text}) did not run`);
        else if (passes !== c.passed) differences.push(`the check on line ${c.line} (${c.text}) ${c.passed ? 'held then and fails now' : 'failed then and holds now'}`);
      }
    }
  } finally {
    await sandbox.close();
  }
  const version = packageVersion();
  const engine = version === data.wakesheet ? `Wakesheet ${version}, as recorded` : `Wakesheet ${version} (the record was written by ${data.wakesheet})`;
  if (differences.length === 0) {
    process.stdout.write(`${colour(32, 'matches')}: ${countText(checked, 'value')}, ${countText(data.checks.length, 'check')} and ${countText(data.dataFiles.length, 'data file')} as recorded on ${data.writtenAt.slice(0, 10)}; ${engine}\n`);
    return 0;
  }
  for (const d of differences) process.stdout.write(`${colour(31, 'differs')}: ${d}\n`);
  process.stdout.write(`${countText(differences.length, 'difference')} from the record written ${data.writtenAt.slice(0, 10)}; ${engine}\n`);
  return 1;
}

/** The embedded sources still have the hashes recorded beside them. */
function sourceIntegrity(data: RecordData): string[] {
  return data.sources.filter((s) => sha256(s.text) !== s.sha256).map((s) => `the embedded text of ${s.path} does not match its recorded SHA-256: the record was altered`);
}

function dataFileChanges(data: RecordData, root: string): string[] {
  const bytes = dataBytesReader(root, root);
  const out: string[] = [];
  for (const f of data.dataFiles) {
    let now: string | null;
    try {
      now = sha256(bytes(f.path));
    } catch {
      now = null;
    }
    if (now === null) out.push(`the data file ${f.path} is missing or cannot be read in ${root}`);
    else if (f.sha256 !== now) out.push(`the data file ${f.path} has changed (SHA-256 ${f.sha256?.slice(0, 12) ?? 'unknown'}… then, ${now.slice(0, 12)}… now)`);
  }
  return out;
}

/** Differences in what a value shows, field by field and item by item. */
function compareValue(name: string, was: ValueJson, now: ValueJson | undefined, out: string[]): void {
  if (!now) {
    out.push(`${name} was ${was.display} and is not computed now`);
    return;
  }
  if (was.fields || now.fields) {
    for (const [field, f] of Object.entries(was.fields ?? {})) compareValue(`${name}.${field}`, f, now.fields?.[field], out);
    return;
  }
  if (was.items && now.items && was.items.length === now.items.length) {
    was.items.forEach((item, i) => compareValue(`${name}[${i + 1}]`, item, now.items![i], out));
    return;
  }
  if (was.display !== now.display) out.push(`${name} was ${was.display} and is ${now.display} now`);
  // An uncertainty is compared as shown, as the value is (records written before uDisplay have none to compare).
  else if (was.uDisplay !== undefined && was.uDisplay !== now.uDisplay) out.push(`the uncertainty of ${name} was ${was.uDisplay} and is ${now.uDisplay ?? 'none'} now`);
}
