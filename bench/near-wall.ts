// The near-wall plan's graph, shared by the re-run and the uncertainty
// benchmarks: as a sheet (speed and length, the first cell, the boundary
// layer, the layer stack and two checks), and as direct calls of the same
// trade functions.
import { createRegistry, num, si, str, type Args, type CallContext, type Value } from '../dist/server/core/index.js';

/** The plan with its two inputs as given and one more statement at the end (the form being measured). */
export function nearWallSheet(U: string, L: string, last: string): string {
  return [
    '```basis',
    `U = ${U}`,
    `L = ${L}`,
    'air_van = air(T: 28 degC)',
    'wr = first_cell(U, L, air_van, yplus: 1)',
    'bl = boundary_layer(U, L, air_van)',
    'stack = layer_stack(first: wr.height, growth: 1.2, total: bl.delta)',
    'check wr.height > 1 um "a first cell the mesher can make"',
    'check stack.count <= 40 "a stack of at most 40 layers"',
    last,
    '```',
    '',
  ].join('\n');
}

const registry = createRegistry();
const ctx: CallContext = {
  readData() {
    throw new Error('the near-wall benchmarks read no data files');
  },
  warn() {},
};
function call(name: string, args: Args): Value {
  return registry.get(name)!.compute(args, ctx);
}
const field = (v: Value, f: string): Value => (v.kind === 'record' ? v.fields.get(f)!.value : v);

/** The sheet's air, called once. */
export function vanAir(): Value {
  return call('air', { T: si(301.15, 'K'), p: si(101325, 'Pa'), RH: num(0) });
}

/** One pass of the plan's trade functions at speed U and length L (SI). */
export function nearWallCalls(U: number, L: number, air: Value): void {
  const u = si(U, 'm/s');
  const l = si(L, 'm');
  const wr = call('first_cell', { U: u, L: l, fluid: air, yplus: num(1), method: str('schlichting'), placement: str('centroid') });
  const bl = call('boundary_layer', { U: u, x: l, fluid: air });
  call('layer_stack', { first: field(wr, 'height'), growth: num(1.2), total: field(bl, 'delta'), scale: str('linear') });
}
