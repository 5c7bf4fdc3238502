// Resolving `use` lines: each other sheet is run by a pipeline of its own
// (so its caches stay warm), and its definitions come into this sheet
// read-only. A circle of uses, a name brought in from two sheets, a name the
// other sheet does not define: each an error on the use line, in words.
import { readFileSync, statSync } from 'node:fs';
import { relative } from 'node:path';
import type { Value } from '../core/index.js';
import type { CarriedSpread, ImportedValue } from '../evaluate/index.js';
import { diagnostic, SheetError, type Diagnostic, type ErrorCode } from '../diagnostics.js';
import type { UseLine } from '../parse/index.js';
import { dataFileLocator } from '../read/data-files.js';
import { isSheetFile, sheetTooLarge } from '../read/sheet-files.js';
import type { UseView } from '../render/use.js';
import { sharedSource, type Carried } from './carried.js';
import type { Override, RunOptions, SheetReport } from './types.js';

/** What the pipeline of a used sheet hands back besides its report. */
export interface UsedRun {
  report: SheetReport;
  /** Its names that have a value (its own and those it uses in turn). */
  values: ReadonlyMap<string, Value>;
  /** Its names that failed. */
  failed: ReadonlySet<string>;
  /** Every name defined in it or in the sheets it uses. */
  defined: ReadonlySet<string>;
  /** The sheet (absolute path) each of its names is defined in. */
  origins: ReadonlyMap<string, string>;
  /** The uncertainties its names carry, and the names whose uncertainty cannot come along. */
  carried: Carried;
}

export interface UseEnv {
  root: string;
  sheetDir: string;
  /** The sheets on the way here (absolute paths), this one last: a use of one of them is a circle. */
  chain: readonly string[];
  opts: RunOptions;
  run(absolutePath: string, text: string, opts: RunOptions): UsedRun;
}

export interface UsesOutcome {
  imported: Map<string, ImportedValue>;
  /** Names brought in whose uncertainty could not come along, with why (said on their use line too). */
  uncarried: Map<string, string>;
  /** The sheet (absolute path) each name brought in is defined in. */
  origins: Map<string, string>;
  /** Every name the used sheets define, brought in or not (for --set). */
  defined: Set<string>;
  /** Names that failed in the sheet they come from: what reads them waits. */
  failedNames: Map<string, number>;
  views: Map<number, UseView>;
  errors: Diagnostic[];
  /** Project-relative files the used sheets are and read. */
  reads: string[];
  /** The used sheets' texts (and the ones they use), project-relative. */
  sources: Array<{ path: string; text: string }>;
  /** Overrides applied in the used sheets. */
  overrides: Override[];
}

export function resolveUses(lines: readonly UseLine[], env: UseEnv): UsesOutcome {
  const out: UsesOutcome = { imported: new Map(), uncarried: new Map(), origins: new Map(), defined: new Set(), failedNames: new Map(), views: new Map(), errors: [], reads: [], sources: [], overrides: [] };
  const locate = dataFileLocator(env.root, env.sheetDir);
  const rel = (abs: string) => relative(env.root, abs).split('\\').join('/');
  for (const line of lines) {
    const view: UseView & { names: Array<{ name: string; value?: Value; u?: number }>; notes: string[] } = { path: line.path, names: [], source: line.source, notes: [] };
    out.views.set(line.line, view);
    const fail = (e: SheetError) => {
      const d = diagnostic(e, line.line);
      view.error = d;
      out.errors.push(d);
    };
    try {
      if (!isSheetFile(line.path)) throw new SheetError('data-file', `"${line.path}" is not a sheet: use names another worksheet, a .md file`, line.pathSpan);
      let abs: string;
      try {
        abs = locate(line.path);
      } catch (e) {
        if (e instanceof SheetError) throw new SheetError(e.code, e.message.replace('the data file', 'the sheet'), line.pathSpan);
        throw e;
      }
      if (env.chain.includes(abs)) {
        const circle = [...env.chain.slice(env.chain.indexOf(abs)), abs].map(rel).join(' → ');
        throw new SheetError('cycle', `these sheets use each other in a circle: ${circle}`, line.pathSpan);
      }
      const path = rel(abs);
      const given = env.opts.sources?.[path];
      const tooLarge = given === undefined ? sheetTooLarge(statSync(abs).size) : null;
      if (tooLarge) throw new SheetError('limit', `${line.path}: ${tooLarge}`, line.pathSpan);
      const text = given ?? readFileSync(abs, 'utf8');
      const used = env.run(abs, text, { ...env.opts, path: abs, root: env.root, chain: [...env.chain, abs] });
      out.reads.push(path, ...used.report.reads);
      out.sources.push({ path, text }, ...used.report.usedSheets);
      out.overrides.push(...used.report.overrides);
      for (const name of used.defined) out.defined.add(name);
      const wanted = line.names ?? [...new Set([...used.values.keys(), ...used.failed])].map((name) => ({ name, span: line.pathSpan }));
      for (const { name, span } of wanted) {
        if (!used.values.has(name) && !used.failed.has(name)) {
          fail(new SheetError('unknown-name', `${line.path} defines no \`${name}\``, span));
          continue;
        }
        // The same definition reached two ways (this sheet uses a.md and b.md, and b.md uses a.md) is one name.
        const origin = used.origins.get(name) ?? abs;
        const earlier = out.origins.get(name);
        if (earlier !== undefined && earlier !== origin) {
          const first = out.imported.get(name)?.line ?? out.failedNames.get(name);
          fail(new SheetError('redefined', `\`${name}\` is defined in two sheets, ${rel(earlier)} and ${rel(origin)} (brought in on line ${first} and here); bring it in from one`, span));
          continue;
        }
        out.origins.set(name, origin);
        const value = used.values.get(name);
        const spread = used.carried.spreads.get(name);
        const correlated = spread && correlatedWith(out.imported, name, spread);
        if (correlated) {
          fail(new SheetError('bad-argument', `\`${name}\` and \`${correlated.other}\` (line ${correlated.line}) both rest on the uncertain \`${correlated.source}\` of ${rel(correlated.sheet)}, so their uncertainties are correlated, which a use cannot carry; bring in \`${correlated.source}\` and compute \`${name}\` on this sheet`, span));
          out.failedNames.set(name, line.line);
          continue;
        }
        if (value) out.imported.set(name, { value, line: line.line, from: line.path, ...(spread ? { spread } : {}) });
        else out.failedNames.set(name, line.line);
        const why = used.carried.uncarried.get(name);
        if (value && why) {
          out.uncarried.set(name, why);
          view.notes.push(`\`${name}\` depends on inputs with an uncertainty in ${line.path}, and shows here at its nominal value only: ${why}. Bring in those inputs and compute \`${name}\` on this sheet to carry it.`);
        }
        view.names.push(value ? { name, value, ...(spread ? { u: spread.u } : {}) } : { name });
      }
      const errs = used.report.errors;
      if (errs.length && !view.error) {
        fail(new SheetError((errs[0]!.code ?? 'data-file') as ErrorCode, `${line.path} has ${errs.length === 1 ? 'an error' : `${errs.length} errors`}; the first, on its line ${errs[0]!.line}: ${errs[0]!.message}`, line.pathSpan));
      }
    } catch (e) {
      if (!(e instanceof SheetError)) throw e;
      fail(e);
    }
  }
  return out;
}

/** The first name already brought in whose uncertainty is correlated with this one's. */
function correlatedWith(imported: ReadonlyMap<string, ImportedValue>, name: string, spread: CarriedSpread) {
  for (const [other, entry] of imported) {
    if (other === name || !entry.spread) continue;
    const shared = sharedSource(spread, entry.spread);
    if (shared) return { other, line: entry.line, source: shared.name, sheet: shared.sheet };
  }
  return undefined;
}
