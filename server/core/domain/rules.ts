// Domain-size rules: how far the boundaries sit from the body, as multiples of
// a reference length, and the highest blockage each allows. COST Action 732
// best practice guideline (Franke et al. 2007) and the AIJ guidelines
// (Tominaga et al. 2008) for buildings; three body lengths as common practice.
// Each number carries its source and how sure we are of it.

export const RULE_NAMES = ['three-lengths', 'cost732', 'aij'] as const;
export type RuleName = (typeof RULE_NAMES)[number];

/** A distance a rule asks for: `times` × the rule's reference length, and where the number comes from. */
export interface RuleDistance {
  times: number;
  source: string;
}

export interface DomainRule {
  name: RuleName;
  /** Which body length the multiples refer to. */
  reference: 'height' | 'largest';
  /** How the reference length is written on the sheet: "H", "L_max". */
  symbol: string;
  title: string;
  /** Written for bodies standing on the ground (buildings). */
  grounded: boolean;
  upstream: RuleDistance;
  downstream: RuleDistance;
  lateral: RuleDistance;
  top: RuleDistance;
  /** Highest blockage (frontal area / domain cross-section) the rule allows, as a fraction. */
  blockage: { limit: number; source: string };
}

const COMMON = 'common practice';
const COST = 'COST Action 732 best practice guideline (Franke et al. 2007)';
const AIJ = 'AIJ guidelines (Tominaga et al. 2008, J. Wind Eng. Ind. Aerodyn. 96)';

export const DOMAIN_RULES: Readonly<Record<RuleName, DomainRule>> = {
  'three-lengths': {
    name: 'three-lengths',
    reference: 'largest',
    symbol: 'L_max',
    title: 'three body lengths on every side (common practice)',
    grounded: false,
    upstream: { times: 3, source: COMMON },
    downstream: { times: 3, source: COMMON },
    lateral: { times: 3, source: COMMON },
    top: { times: 3, source: COMMON },
    // Wind-tunnel practice: below about 5 % blockage no correction is applied.
    blockage: { limit: 0.05, source: `${COMMON} (wind-tunnel practice: below about 5 %, no blockage correction)` },
  },
  cost732: {
    name: 'cost732',
    reference: 'height',
    symbol: 'H',
    title: `${COST}, single building`,
    grounded: true,
    upstream: { times: 5, source: `${COST}, "Extension of the domain in flow direction": 5H when the approach-flow profiles are well known` },
    downstream: { times: 15, source: `${COST}, same section: at least 15H behind the building` },
    lateral: { times: 5, source: `${COST}: 5H to each side (from memory)` },
    top: { times: 5, source: `${COST}: 5H above the building (as summarised with Tominaga et al. 2008)` },
    blockage: { limit: 0.03, source: `${COST}: blockage below 3 % (from memory)` },
  },
  aij: {
    name: 'aij',
    reference: 'height',
    symbol: 'H',
    title: `${AIJ}, target building`,
    grounded: true,
    upstream: { times: 5, source: `${AIJ} leave the inflow length to the modelled surroundings; 5H as in COST 732 unless given (from memory)` },
    downstream: { times: 10, source: `${AIJ}: at least 10H behind the building (from memory)` },
    lateral: { times: 5, source: `${AIJ}: 5H or more to each side` },
    top: { times: 5, source: `${AIJ}: 5H or more above the building` },
    blockage: { limit: 0.03, source: `${AIJ}: blockage below 3 % (from memory)` },
  },
};

/** The rule's reference length for a body of streamwise length L, width W and height H. */
export function referenceLength(rule: DomainRule, L: number, W: number, H: number): number {
  return rule.reference === 'height' ? H : Math.max(L, W, H);
}
