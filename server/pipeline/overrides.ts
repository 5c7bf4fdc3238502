// Inputs replaced for one run (`wakesheet eval --set U_inf=20m/s`): the
// statement that defines the input by a literal gets the given literal
// instead. Only inputs can be replaced, and only by a literal; anything else
// is an error on the line that defines the name, in words.
import { diagnostic, SheetError, type Diagnostic } from '../diagnostics.js';
import { isLiteral, parseStatement, type Statement } from '../parse/index.js';
import { describeValue, type Registry, type Value } from '../core/index.js';
import { literalValue } from '../evaluate/index.js';
import type { Override } from './types.js';

export interface OverridesOutcome {
  statements: Statement[];
  applied: Override[];
  errors: Diagnostic[];
  /** The names this sheet defines that were asked for, applied or refused. */
  answered: Set<string>;
}

type Define = Extract<Statement, { type: 'define' }>;

/** Replaced statements by original and text, so an unchanged override keeps its cached evaluation. */
export type OverrideMemo = WeakMap<Statement, Map<string, Define>>;

export function applyOverrides(statements: readonly Statement[], overrides: Readonly<Record<string, string>> | undefined, sheet: string, memo: OverrideMemo, registry: Registry): OverridesOutcome {
  const out: OverridesOutcome = { statements: [...statements], applied: [], errors: [], answered: new Set() };
  if (!overrides) return out;
  statements.forEach((stmt, i) => {
    if (stmt.type !== 'define' || !Object.hasOwn(overrides, stmt.name)) return;
    const text = overrides[stmt.name]!.trim();
    out.answered.add(stmt.name);
    const refuse = (message: string) => out.errors.push(diagnostic(new SheetError('bad-argument', message, stmt.nameSpan), stmt.line));
    if (!isLiteral(stmt.expr)) {
      refuse(`--set ${stmt.name}: ${stmt.name} is computed here, not an input; only a name defined by a value can be set`);
      return;
    }
    let replaced = memo.get(stmt)?.get(text);
    if (!replaced) {
      let expr;
      let uncertainty;
      try {
        // Read as the sheet would read the line, so that a value may bring its own uncertainty: U=20m/s±1m/s.
        if (text.includes('#')) throw new SheetError('syntax', 'a value holds no "#"', stmt.nameSpan);
        const parsed = parseStatement(`${stmt.name} = ${text}`, stmt.line) as Define | null;
        if (!parsed || parsed.type !== 'define') throw new SheetError('syntax', 'give a value', stmt.nameSpan);
        expr = parsed.expr;
        uncertainty = parsed.uncertainty;
      } catch (e) {
        if (!(e instanceof SheetError)) throw e;
        refuse(`--set ${stmt.name}=${text}: ${e.message}`);
        return;
      }
      if (!isLiteral(expr)) {
        refuse(`--set ${stmt.name}=${text}: give a value (a number with its unit, a list, text), not an expression`);
        return;
      }
      // A value of another kind or dimension (20 for 20 m/s) would run without a word: refuse it here.
      let given: string;
      let onSheet: string;
      try {
        given = shapeOf(literalValue(expr, registry));
        onSheet = shapeOf(literalValue(stmt.expr, registry));
      } catch (e) {
        if (!(e instanceof SheetError)) throw e;
        refuse(`--set ${stmt.name}=${text}: ${e.message}`);
        return;
      }
      if (given !== onSheet) {
        refuse(`--set ${stmt.name}=${text}: the sheet gives ${stmt.name} as ${onSheet}, and ${text} is ${given}`);
        return;
      }
      // The columns of the given text are not the sheet's: the whole statement stands at the name.
      // An uncertainty on the sheet stays with the new value (a share of it stays a share); one given with the value replaces it.
      const kept = uncertainty ? { ...uncertainty, span: stmt.expr.span } : stmt.uncertainty;
      const { uncertainty: _dropped, ...rest } = stmt;
      replaced = { ...rest, expr: { ...expr, span: stmt.expr.span }, source: `${stmt.name} = ${text}`, ...(kept ? { uncertainty: kept } : {}) } as Define;
      const byText = memo.get(stmt) ?? new Map<string, Define>();
      byText.set(text, replaced);
      memo.set(stmt, byText);
    }
    out.statements[i] = replaced;
    out.applied.push({ name: stmt.name, was: stmt.source.slice(stmt.source.indexOf('=') + 1).trim(), now: text, sheet });
  });
  return out;
}

/** What a value is, in the words of messages: "a quantity in m/s", "a list of a plain number". */
function shapeOf(v: Value): string {
  if (v.kind !== 'list') return describeValue(v);
  return v.items[0] ? `a list, each ${describeValue(v.items[0])}` : 'an empty list';
}
