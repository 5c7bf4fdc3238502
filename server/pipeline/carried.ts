// The uncertainties a sheet's names carry into the sheets that use it. An
// input's own ± goes as it is; a result's first-order u goes with the inputs
// it rests on, so that the using sheet can tell two correlated names apart.
// A name whose spread cannot go along (a record with uncertain fields, a list,
// one whose propagation failed) goes with the reason, so the using sheet says
// so instead of showing a bare number.
import type { Value } from '../core/index.js';
import type { CarriedSource, CarriedSpread, SheetEvaluation } from '../evaluate/index.js';

export interface Carried {
  readonly spreads: ReadonlyMap<string, CarriedSpread>;
  /** Names that depend on an uncertain input but carry no spread, with why. */
  readonly uncarried: ReadonlyMap<string, string>;
}

export const NOTHING_CARRIED: Carried = { spreads: new Map(), uncarried: new Map() };

/** What this sheet's names carry; `sheet` is its absolute path, `imported` what it brought in itself. */
export function carriedOf(evaluation: SheetEvaluation, sheet: string, imported: ReadonlyMap<string, { spread?: CarriedSpread }>, importedUncarried: ReadonlyMap<string, string>): Carried {
  const spreads = new Map<string, CarriedSpread>();
  const uncarried = new Map<string, string>(importedUncarried);
  for (const [name, entry] of imported) if (entry.spread) spreads.set(name, entry.spread);
  const sourcesOf = (input: string): readonly CarriedSource[] => imported.get(input)?.spread?.sources ?? [{ sheet, name: input }];
  const uncertainNames = new Set(evaluation.uncertain.map((i) => i.name));
  const touched = downstreamOf(evaluation, new Set([...uncertainNames, ...uncarried.keys()]));
  for (const r of evaluation.results) {
    if (r.stmt.type !== 'define' || !r.value || r.error) continue;
    const name = r.stmt.name;
    if (r.uncertain) {
      spreads.set(name, { u: r.uncertain.u, distribution: r.uncertain.distribution, sources: [{ sheet, name }], derived: false });
      continue;
    }
    const p = r.propagated;
    if (p && !p.problem && r.value.kind === 'quantity' && Number.isFinite(p.u)) {
      spreads.set(name, { u: p.u, distribution: 'normal', sources: unique(p.budget.flatMap((b) => sourcesOf(b.input))), derived: true });
    } else if (p?.problem) uncarried.set(name, `its uncertainty could not be propagated there (${p.problem})`);
    else if (touched.has(name)) uncarried.set(name, whyNot(r.value));
  }
  return { spreads, uncarried };
}

function whyNot(v: Value): string {
  if (v.kind === 'record') return 'the uncertainties of its fields do not come through a use';
  if (v.kind === 'list') return 'it is a list, and the uncertainties of a list do not come through a use';
  return 'its uncertainty does not come through a use';
}

/** The definitions that read any of `names`, directly or through others. */
function downstreamOf(evaluation: SheetEvaluation, names: ReadonlySet<string>): Set<string> {
  const out = new Set<string>();
  const reached = (n: string) => names.has(n) || out.has(n);
  let grew = true;
  while (grew) {
    grew = false;
    for (const r of evaluation.results) {
      if (r.stmt.type !== 'define' || out.has(r.stmt.name) || !r.uses.some(reached)) continue;
      out.add(r.stmt.name);
      grew = true;
    }
  }
  return out;
}

function unique(sources: readonly CarriedSource[]): CarriedSource[] {
  const seen = new Map<string, CarriedSource>();
  for (const s of sources) seen.set(`${s.sheet}\u0000${s.name}`, s);
  return [...seen.values()];
}

/** The first input two spreads both rest on, when one of them is a result (two inputs are never the same name). */
export function sharedSource(a: CarriedSpread, b: CarriedSpread): CarriedSource | undefined {
  if (!a.derived && !b.derived) return undefined;
  return a.sources.find((s) => b.sources.some((t) => t.sheet === s.sheet && t.name === s.name));
}
