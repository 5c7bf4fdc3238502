// Registry entry for wall-layer stacks: solves the missing one of first,
// growth, count and total, compares the stack with the boundary layer and the
// core mesh, and draws it.
import { figure, list, num, optionalSi, record, si } from '../build.js';
import { TradeError, type TradeFunction } from '../registry.js';
import type { Value } from '../values.js';
import { choiceArg, guarded } from './args.js';
import { layersInside, solveStack, STACK_LIMITS, type Stack } from './layer-stack.js';
import { stackSvg, type StackScale } from './stack-svg.js';
import { lengthLabel, sig3 } from './svg.js';

const SCALES: readonly StackScale[] = ['linear', 'log'];

export const layer_stack: TradeFunction = {
  name: 'layer_stack',
  params: [
    { name: 'first', type: 'quantity', unit: 'm', optional: true, doc: 'first-layer height at the wall' },
    { name: 'growth', type: 'quantity', unit: '1', optional: true, doc: 'growth ratio between neighbouring layers' },
    { name: 'count', type: 'quantity', unit: '1', optional: true, doc: 'number of layers' },
    { name: 'total', type: 'quantity', unit: 'm', optional: true, doc: 'total stack thickness' },
    { name: 'core', type: 'quantity', unit: 'm', optional: true, doc: 'size of the core cell next to the stack' },
    { name: 'delta', type: 'quantity', unit: 'm', optional: true, doc: 'boundary-layer thickness' },
    { name: 'scale', type: 'string', default: '"linear"', choices: SCALES, doc: 'axis of the picture: linear or log' },
  ],
  doc: 'wall-layer stack from any three of first, growth, count, total: first, growth, count, total, last, heights (+ jump, inside, coverage)',
  source: 'geometric series: total = first (growth^count − 1)/(growth − 1), last = first growth^(count−1); growth by bracketed bisection',
  example: 'layer_stack(first: 20 um, growth: 1.2, total: 30 mm, delta: 60 mm)',
  compute: guarded((args) => {
    const given = {
      first: optionalSi(args, 'first', 'm'),
      growth: optionalSi(args, 'growth'),
      count: optionalSi(args, 'count'),
      total: optionalSi(args, 'total', 'm'),
    };
    const core = optionalSi(args, 'core', 'm');
    const delta = optionalSi(args, 'delta', 'm');
    for (const [k, v] of [['core', core], ['delta', delta]] as const) {
      if (v !== undefined && !(v > 0)) throw new TradeError(`${k} must be a positive length`);
    }
    const scale = choiceArg(args, 'scale', SCALES);
    const s = solveStack(given);
    const fields: Array<[string, Value, string?]> = [
      ['first', si(s.first, 'm'), 'first-layer height'],
      ['growth', num(s.growth), 'growth ratio'],
      ['count', num(s.count), 'number of layers'],
      ['total', si(s.total, 'm'), 'stack thickness'],
      ['last', si(s.last, 'm'), 'last (outermost) layer height'],
      ['heights', list(s.heights.map((h) => si(h, 'm'))), 'layer heights from the wall out'],
    ];
    const inside = delta === undefined ? undefined : layersInside(s.heights, delta);
    if (core !== undefined) fields.push(['jump', num(core / s.last), 'core cell / last layer']);
    if (delta !== undefined) {
      fields.push(['inside', num(inside!), 'layers inside the boundary layer']);
      fields.push(['coverage', num(s.total / delta), 'stack thickness / δ']);
    }
    return record(fields, {
      warnings: stackWarnings(s, core, delta, inside),
      remarks: stackRemarks(s, delta),
      figure: figure(stackSvg({ heights: s.heights, growth: s.growth, scale, ...(delta === undefined ? {} : { delta }), ...(core === undefined ? {} : { core }) }), `Wall-layer stack to scale (${scale} axis)`),
      tag: 'layer stack',
    });
  }),
};

/** Rules of thumb (common practice): gentle growth, a small jump to the core, ten or more cells across δ. */
function stackWarnings(s: Stack, core: number | undefined, delta: number | undefined, inside: number | undefined): string[] {
  const w: string[] = [];
  if (s.growth > STACK_LIMITS.growth) w.push(`growth ratio ${sig3(s.growth)} is above about ${STACK_LIMITS.growth} (common practice); neighbouring layers differ too much in size.`);
  if (s.growth < 1) w.push(`growth ratio ${sig3(s.growth)} is below 1: the layers get thinner away from the wall.`);
  if (core !== undefined && core / s.last > STACK_LIMITS.jump) {
    w.push(`the core cell is ${sig3(core / s.last)} × the last layer, above about ${STACK_LIMITS.jump} (common practice); add layers or shrink the core cells near the wall.`);
  }
  if (delta !== undefined && inside !== undefined) {
    // Core cells above the stack also lie across δ when the stack is thinner than δ.
    const across = inside + (core !== undefined && s.total < delta ? (delta - s.total) / core : 0);
    if (across < STACK_LIMITS.cellsAcross) {
      w.push(`only about ${Math.floor(across)} cells lie across the boundary layer (δ = ${lengthLabel(delta)}); about ${STACK_LIMITS.cellsAcross} or more are usual (common practice).`);
    }
  }
  return w;
}

function stackRemarks(s: Stack, delta: number | undefined): string[] {
  const r = [`Solved for ${s.solved}.`];
  if (s.solved === 'count' && s.askedTotal !== undefined && Math.abs(s.total - s.askedTotal) > 1e-9 * s.askedTotal) {
    r.push(`The count is rounded up to whole layers, so the stack is ${lengthLabel(s.total)} thick rather than the ${lengthLabel(s.askedTotal)} asked for.`);
  }
  if (delta !== undefined) {
    r.push(
      s.total < delta
        ? `The stack covers ${sig3((100 * s.total) / delta)} % of δ; the rest of the boundary layer lies in the core mesh.`
        : `The stack reaches past the boundary-layer edge (${sig3((100 * s.total) / delta)} % of δ).`,
    );
  }
  return r;
}
