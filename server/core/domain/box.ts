// The computational domain as a box around the body: boundary distances from
// a rule (rules.ts) or given outright, the box they make, and the blockage
// ratio = frontal area / domain cross-section (width × height), as COST 732
// (Franke et al. 2007) and the AIJ guidelines (Tominaga et al. 2008) define it.
import { TradeError } from '../shared/trade-error.js';
import { lengthText, numberText, percentText } from '../shared/words.js';
import { DOMAIN_RULES, referenceLength, type DomainRule, type RuleName } from './rules.js';

export const DISTANCES = ['upstream', 'downstream', 'lateral', 'top'] as const;
export type DistanceName = (typeof DISTANCES)[number];

export interface DomainInput {
  /** Streamwise length, width and height of the body. */
  body: readonly [number, number, number];
  rule: RuleName;
  /** Distances given on the sheet; they override the rule's. */
  given: Partial<Record<DistanceName, number>>;
  /** true: the body stands on the domain floor; false: it has `top` clearance below too. */
  ground: boolean;
  /** Projected frontal area; W × H when not given. */
  frontal?: number;
}

export interface DomainBox {
  rule: DomainRule;
  /** The rule's reference length (H or the largest body dimension). */
  reference: number;
  upstream: number;
  downstream: number;
  lateral: number;
  top: number;
  /** Clearance below the body: 0 on the ground, `top` otherwise. */
  below: number;
  /** What the rule asks for each distance. */
  required: Record<DistanceName, number>;
  /** Distances taken from the sheet rather than the rule. */
  overridden: DistanceName[];
  length: number;
  width: number;
  height: number;
  volume: number;
  frontal: number;
  blockage: number;
  warnings: string[];
}

/** Relative slack so that a distance typed as exactly the rule's value does not warn. */
const SLACK = 1e-9;

export function domainBox(input: DomainInput): DomainBox {
  const [L, W, H] = input.body;
  for (const [name, v] of [['length', L], ['width', W], ['height', H]] as const) {
    if (!(Number.isFinite(v) && v > 0)) throw new TradeError(`the body's ${name} must be a positive length, not ${numberText(v)} m`);
  }
  const rule = DOMAIN_RULES[input.rule];
  const reference = referenceLength(rule, L, W, H);
  const required = Object.fromEntries(DISTANCES.map((k) => [k, rule[k].times * reference])) as Record<DistanceName, number>;
  const chosen = {} as Record<DistanceName, number>;
  const overridden: DistanceName[] = [];
  const warnings: string[] = [];
  for (const k of DISTANCES) {
    const g = input.given[k];
    if (g === undefined) {
      chosen[k] = required[k];
      continue;
    }
    if (!(Number.isFinite(g) && g > 0)) throw new TradeError(`${k} must be a positive distance, not ${numberText(g)} m`);
    chosen[k] = g;
    overridden.push(k);
    if (g < required[k] * (1 - SLACK)) {
      warnings.push(
        `${k} ${lengthText(g)} is shorter than the ${numberText(rule[k].times)}${rule.symbol} = ${lengthText(required[k])} the ${rule.name} rule asks (${rule[k].source}); ` +
          `move that boundary out to at least ${lengthText(required[k])}, or show with domain_study that the shorter distance does not change the result.`,
      );
    }
  }
  const frontal = input.frontal ?? W * H;
  if (!(Number.isFinite(frontal) && frontal > 0)) throw new TradeError(`frontal must be a positive area, not ${numberText(frontal)} m²`);
  if (frontal > W * H * (1 + SLACK)) {
    throw new TradeError(`frontal ${numberText(frontal)} m² is larger than width × height = ${numberText(W * H)} m²; the body's outline seen from upstream lies within its width and height`);
  }
  const below = input.ground ? 0 : chosen.top;
  const length = chosen.upstream + L + chosen.downstream;
  const width = W + 2 * chosen.lateral;
  const height = below + H + chosen.top;
  const blockage = frontal / (width * height);
  if (blockage > rule.blockage.limit * (1 + SLACK)) {
    const lateralNeeded = (frontal / (rule.blockage.limit * height) - W) / 2;
    const heightNeeded = frontal / (rule.blockage.limit * width);
    const topNeeded = input.ground ? heightNeeded - H : (heightNeeded - H) / 2;
    warnings.push(
      `blockage ${percentText(blockage)} is above the ${percentText(rule.blockage.limit)} the ${rule.name} rule allows (${rule.blockage.source}); ` +
        `widen the domain to lateral ${lengthText(lateralNeeded)} or more, or raise top to ${lengthText(topNeeded)} or more.`,
    );
  }
  if (!input.ground && rule.grounded) {
    warnings.push(
      `the ${rule.name} rule is written for buildings standing on the ground, but ground: false floats the body with ${lengthText(below)} clearance below it; ` +
        'set ground: true for a body on the ground, or use rule: "three-lengths" for a body clear of any wall.',
    );
  }
  return {
    rule,
    reference,
    ...chosen,
    below,
    required,
    overridden,
    length,
    width,
    height,
    volume: length * width * height,
    frontal,
    blockage,
    warnings,
  };
}
