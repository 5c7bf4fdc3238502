// Basic maths for worksheets. Functions of plain numbers reject units; sqrt and
// abs/min/max keep them. Trigonometric arguments are in radians (deg converts).
import { add, power, quantity, withSi, type Quantity } from '../../units/quantity.js';
import { dimsEqual, isDimensionless } from '../../units/dims.js';
import { unitLabel } from '../../units/labels.js';
import { ANY_DIMENSION, type Args, type ParamSpec, type ResultSpec, type TradeFunction } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { num, type Value } from '../shared/values.js';

const X: ParamSpec[] = [{ name: 'x', type: 'quantity', unit: ANY_DIMENSION, doc: 'argument, in any unit' }];
const PLAIN_X: ParamSpec[] = [{ name: 'x', type: 'quantity', unit: '1', doc: 'the argument, without a unit' }];
const ANGLE_X: ParamSpec[] = [{ name: 'x', type: 'quantity', unit: '1', doc: 'an angle in radians, or in deg' }];
const PLAIN: ResultSpec = { symbol: '', unit: '1', doc: 'the result' };
const LIKE_ARGUMENTS: ResultSpec = { symbol: '', unit: ANY_DIMENSION, doc: 'the result, in the unit of the arguments' };

function q(args: Args, name = 'x'): Quantity {
  const v = args[name];
  if (!v || v.kind !== 'quantity') throw new TradeError(`${name} must be a number or quantity`);
  return v;
}

function plainArg(args: Args, fn: string): number {
  const v = q(args);
  if (!isDimensionless(v.dims)) throw new TradeError(`${fn} needs a plain number, not a quantity in ${unitLabel(v.dims)}`);
  return v.si;
}

function unary(name: string, doc: string, f: (x: number) => number, example: string, params = PLAIN_X): TradeFunction {
  return {
    name,
    params,
    returns: PLAIN,
    doc,
    source: 'ECMAScript Math (IEEE 754 double precision)',
    example,
    compute(args) {
      const y = f(plainArg(args, name));
      if (Number.isNaN(y)) throw new TradeError(`${name} is not defined for this argument`);
      return num(y);
    },
  };
}

function extremum(name: 'min' | 'max'): TradeFunction {
  return {
    name,
    params: [{ name: 'values', type: 'any', doc: 'a list, or several arguments' }],
    returns: LIKE_ARGUMENTS,
    doc: `the ${name === 'min' ? 'smallest' : 'largest'} of a list (units must agree)`,
    source: 'definition',
    example: `${name}([3, 1, 2] m)`,
    compute(args) {
      const items = collect(args);
      if (items.length === 0) throw new TradeError(`${name} of nothing`);
      let best = items[0]!;
      for (const v of items) {
        if (!dimsEqual(v.dims, best.dims)) throw new TradeError(`${name} cannot compare ${unitLabel(v.dims)} with ${unitLabel(best.dims)}`);
        if (name === 'min' ? v.si < best.si : v.si > best.si) best = v;
      }
      return best;
    },
  };
}

/** min/max accept a list or any number of positional arguments (values, _2, _3 …). */
function collect(args: Args): Quantity[] {
  const out: Quantity[] = [];
  const push = (v: Value) => {
    if (v.kind === 'list') v.items.forEach(push);
    else if (v.kind === 'quantity') out.push(v);
    else throw new TradeError('min and max take numbers or quantities');
  };
  for (const v of Object.values(args)) if (v) push(v);
  return out;
}

export const mathsEntries: TradeFunction[] = [
  {
    name: 'sqrt',
    params: X,
    returns: { symbol: '', unit: ANY_DIMENSION, doc: 'the root, in the half power of the unit of x' },
    doc: 'square root (units take the half power)',
    source: 'definition',
    example: 'sqrt(4 m^2)',
    compute(args) {
      const v = q(args);
      if (v.si < 0) throw new TradeError('sqrt of a negative value');
      return power(v, num(0.5));
    },
  },
  {
    name: 'abs',
    params: X,
    returns: LIKE_ARGUMENTS,
    doc: 'absolute value (keeps the unit)',
    source: 'definition',
    example: 'abs(-3 m/s)',
    compute(args) {
      const v = q(args);
      // SI values of absolute temperatures are never negative; a difference stays a difference.
      return withSi(v, Math.abs(v.si));
    },
  },
  unary('exp', 'e to the power x', Math.exp, 'exp(1)'),
  unary('ln', 'natural logarithm', (x) => (x > 0 ? Math.log(x) : NaN), 'ln(10)'),
  unary('log10', 'base-10 logarithm', (x) => (x > 0 ? Math.log10(x) : NaN), 'log10(1e6)'),
  unary('sin', 'sine of an angle in radians (30 deg converts)', Math.sin, 'sin(30 deg)', ANGLE_X),
  unary('cos', 'cosine of an angle in radians', Math.cos, 'cos(pi/3)', ANGLE_X),
  unary('tan', 'tangent of an angle in radians', Math.tan, 'tan(45 deg)', ANGLE_X),
  extremum('min'),
  extremum('max'),
  {
    name: 'linspace',
    params: [
      { name: 'start', type: 'quantity', unit: ANY_DIMENSION, doc: 'first value' },
      { name: 'stop', type: 'quantity', unit: ANY_DIMENSION, doc: 'last value (same unit as start)' },
      { name: 'count', type: 'quantity', unit: '1', default: '11', doc: 'number of values, 2 to 100000' },
    ],
    returns: { symbol: '', unit: 'list', doc: 'a list of count values in the unit of start' },
    doc: 'evenly spaced values from start to stop, for sweeps',
    source: 'definition',
    example: 'linspace(10 m/s, 40 m/s, 4)',
    compute(args) {
      const a = q(args, 'start');
      const b = q(args, 'stop');
      const n = q(args, 'count').si;
      if (!dimsEqual(a.dims, b.dims)) throw new TradeError(`start and stop must have the same unit (${unitLabel(a.dims)} and ${unitLabel(b.dims)})`);
      if (!Number.isInteger(n) || n < 2 || n > 100_000) throw new TradeError(`count must be a whole number from 2 to 100000, not ${n}`);
      const items: Value[] = [];
      // Each value keeps the start's unit and temperature sense: linspace(10 degC, 20 degC, 3) are temperatures.
      for (let i = 0; i < n; i++) items.push(withSi(a, a.si + ((b.si - a.si) * i) / (n - 1)));
      return { kind: 'list', items };
    },
  },
  {
    name: 'sum',
    params: [{ name: 'values', type: 'list', unit: ANY_DIMENSION, doc: 'a list of numbers or quantities of one unit' }],
    returns: LIKE_ARGUMENTS,
    doc: 'the sum of a list',
    source: 'definition',
    example: 'sum([1, 2, 3] m)',
    compute(args) {
      return total(collect(args));
    },
  },
  {
    name: 'mean',
    params: [{ name: 'values', type: 'list', unit: ANY_DIMENSION, doc: 'a list of numbers or quantities of one unit' }],
    returns: LIKE_ARGUMENTS,
    doc: 'the arithmetic mean of a list',
    source: 'definition',
    example: 'mean([1, 2, 3] m)',
    compute(args) {
      const items = collect(args);
      if (items.length === 0) throw new TradeError('mean of an empty list');
      // The mean of temperatures is a temperature: averaged in kelvin, shown like the first.
      for (const v of items) if (!dimsEqual(v.dims, items[0]!.dims)) throw new TradeError(`cannot add ${unitLabel(v.dims)} to ${unitLabel(items[0]!.dims)}`);
      return withSi(items[0]!, items.reduce((s, v) => s + v.si, 0) / items.length);
    },
  },
];

/** The sum by the rules of `+`: two absolute temperatures never add, differences stay differences. */
function total(items: Quantity[]): Quantity {
  if (items.length === 0) return num(0);
  return items.slice(1).reduce((s, v) => add(s, v), items[0]!);
}
