// The values a failed check compared, in plain words for the command line and
// the JSON ("U_wind = 28 m/s"), so that a failure read away from the page says
// by how much. The page shows them in the check's substituted line.
import type { Expr } from '../parse/ast.js';
import type { Value } from '../core/index.js';
import { displayText } from './value-text.js';

/** The value of a name or a field path (`wr.height`) on the sheet; undefined for anything else. */
export function valueAt(e: Expr, values: ReadonlyMap<string, Value>): Value | undefined {
  if (e.type === 'name') return values.get(e.name);
  if (e.type === 'field') {
    const owner = valueAt(e.object, values);
    return owner?.kind === 'record' ? owner.fields.get(e.field)?.value : undefined;
  }
  return undefined;
}

/** A name or field path as written: "wr.height"; null for anything else. */
function pathText(e: Expr): string | null {
  if (e.type === 'name') return e.name;
  if (e.type === 'field') {
    const owner = pathText(e.object);
    return owner === null ? null : `${owner}.${e.field}`;
  }
  return null;
}

/** The names and field paths an expression reads, outermost first, in order of appearance. */
function pathsIn(e: Expr, out: Expr[]): Expr[] {
  if (pathText(e) !== null) {
    out.push(e);
    return out;
  }
  switch (e.type) {
    case 'unary':
      return pathsIn(e.arg, out);
    case 'binary':
      return pathsIn(e.right, pathsIn(e.left, out));
    case 'compare':
      for (const o of e.operands) pathsIn(o, out);
      return out;
    case 'call':
      for (const a of e.args) pathsIn(a.value, out);
      return out;
    case 'list':
      for (const i of e.items) pathsIn(i, out);
      return out;
    case 'index':
      return pathsIn(e.index, pathsIn(e.object, out));
    case 'field':
      return pathsIn(e.object, out);
    case 'paren':
    case 'convert':
      return pathsIn(e.expr, out);
    default:
      return out;
  }
}

/** Values shown in a line of text: a number, a flag or a word, never a whole record or table. */
function shownInline(v: Value): boolean {
  return v.kind === 'quantity' || v.kind === 'bool' || v.kind === 'string';
}

/** "U_wind = 28 m/s, L = 7.5 m" for the names and fields a check reads; undefined when none can be shown. */
export function comparedValuesText(e: Expr, values: ReadonlyMap<string, Value>, sig: number): string | undefined {
  const seen = new Set<string>();
  const parts: string[] = [];
  for (const p of pathsIn(e, [])) {
    const text = pathText(p)!;
    const v = valueAt(p, values);
    if (seen.has(text) || !v || !shownInline(v)) continue;
    seen.add(text);
    parts.push(`${text} = ${displayText(v, sig)}`);
  }
  return parts.length ? parts.join(', ') : undefined;
}
