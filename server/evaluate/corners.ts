// Whether a check holds over the inputs' range as well as at their nominal
// values: the check is run again at every corner of the box x_i ± 2u(x_i)
// (2^n runs for the n uncertain inputs it depends on), or, past MAX_CORNER_INPUTS
// inputs, at each input's two ends with the others nominal. A check that
// holds at every corner may still fail inside the box when it is not
// monotonic in its inputs; the words say which points were tried.
import type { Diagnostic } from '../diagnostics.js';
import type { Value } from '../core/index.js';
import type { Rerun } from './rerun.js';
import { valueWords } from './sweep.js';
import { moved, type UncertainInput } from './uncertainty.js';

/** 2^10 = 1024 corners at most; more inputs are tried one at a time. */
export const MAX_CORNER_INPUTS = 10;
/** The box's half-width in standard uncertainties: about a 95 % range for each input. */
export const CORNER_SPAN = 2;

export interface RangeVerdict {
  /** The check held at every point tried. */
  readonly holds: boolean;
  readonly text: string;
}

/** Points of the box to try: each a value per input. */
function points(inputs: readonly UncertainInput[]): { changes: Map<string, Value>; corners: boolean } [] {
  const end = (i: UncertainInput, sign: number) => moved(i.value, i.value.si + sign * CORNER_SPAN * i.u);
  if (inputs.length <= MAX_CORNER_INPUTS) {
    const out = [];
    for (let mask = 0; mask < 1 << inputs.length; mask++) {
      out.push({ changes: new Map(inputs.map((inp, k) => [inp.name, end(inp, mask & (1 << k) ? 1 : -1)] as const)), corners: true });
    }
    return out;
  }
  return inputs.flatMap((inp) => [-1, 1].map((s) => ({ changes: new Map<string, Value>([[inp.name, end(inp, s)]]), corners: false })));
}

/** The check on `line` over the range; `rerun` runs it downstream of exactly these inputs. */
export function checkOverRange(line: number, nominal: boolean, inputs: readonly UncertainInput[], rerun: Rerun): RangeVerdict {
  const tried = points(inputs);
  const corners = tried[0]?.corners ?? true;
  let failedAt: Map<string, Value> | undefined;
  let heldAt: Map<string, Value> | undefined;
  let failures = 0;
  let cannot: Diagnostic | undefined;
  for (const p of tried) {
    const outcome = rerun.run(p.changes).checks.get(line);
    if (outcome === true) {
      heldAt ??= p.changes;
      continue;
    }
    failures++;
    if (outcome === false || outcome === undefined) failedAt ??= p.changes;
    else cannot ??= outcome;
  }
  const box = tried.length === 2 && corners ? 'the ±2u range' : corners ? 'the ±2u box' : undefined;
  const all = box ? (tried.length === 2 ? `both ends of ${box}` : `all ${tried.length} corners of ${box}`) : `the ±2u ends of each of the ${inputs.length} inputs, one at a time (more than ${MAX_CORNER_INPUTS} inputs)`;
  const some = box ? `${failures} of the ${tried.length} ${tried.length === 2 ? 'ends' : 'corners'} of ${box}` : `${failures} of the ${tried.length} ends tried one at a time (more than ${MAX_CORNER_INPUTS} inputs)`;
  const at = nominal ? 'holds at nominal' : 'fails at nominal';
  if (failures === 0) return { holds: true, text: `${at}${nominal ? ' and' : ', holds'} at ${all}` };
  const label = (m: Map<string, Value>) => [...m].map(([n, v]) => `${n} = ${valueWords(v)}`).join(', ');
  // Failing everywhere it was tried: one phrase, and for one input its two ends.
  if (failures === tried.length && !cannot) {
    const ends = tried.length === 2 && corners ? ` (${tried.map((p) => label(p.changes)).join(' and ')})` : '';
    return { holds: false, text: `${nominal ? 'holds at nominal, fails' : 'fails at nominal and'} at ${all}${ends}` };
  }
  if (!failedAt) return { holds: false, text: `${at}, cannot run at one point (line ${cannot!.line}: ${cannot!.message}) (${some})` };
  // Failing at nominal and at a point: say so once, and name a point where it holds,
  // which tells the reader which way the inputs must move.
  if (!nominal) return { holds: false, text: `fails at nominal and at ${label(failedAt)} (${some})${heldAt ? `; holds at ${label(heldAt)}` : ''}` };
  return { holds: false, text: `${at}, fails at ${label(failedAt)} (${some})` };
}
