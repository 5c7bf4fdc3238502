// A word after a number is read as a unit, in the unit namespace. When the
// sheet also defines that word as a name (L for a reference length, h for a
// height, m for a mass), the line reads two ways and the unit reading is very
// likely not what was meant: `0.5 L` with `L = 5 m` would be half a litre.
// Such a line is an error that shows both readings and how to write each.
import { SheetError } from '../diagnostics.js';
import type { Expr, UnitNode } from '../parse/ast.js';
import { unitText } from '../parse/units.js';
import { otherSpellings } from '../units/catalogue.js';
import type { UnitFactor } from '../units/unit-expr.js';

/** Where the sheet defines a name: its line and, when it parsed, the statement's text. */
export interface NameDefinition {
  line: number;
  source?: string;
}

export type DefinedName = (name: string) => NameDefinition | undefined;

/** The first unit name in `e` that the sheet also defines, as an error; undefined when there is none. */
export function unitNameClash(e: Expr, defined: DefinedName): SheetError | undefined {
  switch (e.type) {
    case 'number':
      return e.unit ? clashIn(String(e.value), e.unit, defined, e.span) : undefined;
    case 'list':
      return firstOf(e.items, defined) ?? (e.unit ? clashIn('[…]', e.unit, defined, e.span) : undefined);
    case 'unary':
      return unitNameClash(e.arg, defined);
    case 'binary':
      return unitNameClash(e.left, defined) ?? unitNameClash(e.right, defined);
    case 'compare':
      return firstOf(e.operands, defined);
    case 'call':
      return firstOf(e.args.map((a) => a.value), defined);
    case 'field':
      return unitNameClash(e.object, defined);
    case 'convert':
    case 'paren':
      return unitNameClash(e.expr, defined);
    case 'name':
    case 'string':
    case 'bool':
      return undefined;
  }
}

function firstOf(items: readonly Expr[], defined: DefinedName): SheetError | undefined {
  for (const item of items) {
    const clash = unitNameClash(item, defined);
    if (clash) return clash;
  }
  return undefined;
}

function clashIn(value: string, unit: UnitNode, defined: DefinedName, span: SheetError['span']): SheetError | undefined {
  const factors = [...unit.num.map((f) => ({ f, below: false })), ...unit.den.map((f) => ({ f, below: true }))];
  for (const { f, below } of factors) {
    const where = defined(f.name);
    if (!where) continue;
    const written = `${value} ${unit.unit.text}`;
    const spelling = otherSpellings(f.name).find((s) => s.length >= 4 && /^[A-Za-z]+$/.test(s) && !defined(s));
    const asName = nameReading(value, unit, f, below);
    const asUnit = spelling ? `${value} ${unitText(swap(unit.num, f, spelling), swap(unit.den, f, spelling))}` : undefined;
    const definedAt = where.source ? `line ${where.line}: ${where.source}` : `line ${where.line}`;
    return new SheetError(
      'ambiguous-unit',
      `in ${written}, "${f.name}" is read as a unit (${spelling ?? f.name}), but ${f.name} is also a name on this sheet (${definedAt}); ` +
        `write ${asName} to use the name${asUnit ? `, or ${asUnit} for the unit` : `, or rename ${f.name} to keep the unit`}`,
      span,
    );
  }
  return undefined;
}

/** The line written with the name as a factor: 0.5 * L, 3 kg/s^2 * m, (12 m) / h. */
function nameReading(value: string, unit: UnitNode, f: UnitFactor, below: boolean): string {
  const num = unit.num.filter((x) => x !== f);
  const den = unit.den.filter((x) => x !== f);
  const rest = num.length || den.length ? `(${value} ${unitText(num, den)})` : value;
  const power = f.power === 1 ? f.name : `${f.name}^${f.power}`;
  return `${rest} ${below ? '/' : '*'} ${power}`;
}

function swap(list: readonly UnitFactor[], f: UnitFactor, name: string): UnitFactor[] {
  return list.map((x) => (x === f ? { name, power: x.power } : x));
}
