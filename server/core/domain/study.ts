// Domain-independence study: the relative change of a quantity of interest
// when the domain is enlarged, taken against the enlarged domain's value (the
// better estimate), as the approximate relative error e_a21 = |(φ1 − φ2)/φ1| of
// Celik et al. (2008), J. Fluids Eng. 130, 078001, procedure step 5, takes it
// against the finer grid (from memory).
import { TradeError } from '../shared/trade-error.js';
import { numberText } from '../shared/words.js';

export const DOMAIN_VERDICTS = ['domain independent', 'enlarge the domain'] as const;
export type DomainVerdict = (typeof DOMAIN_VERDICTS)[number];

export interface DomainStudy {
  /** (large − small) / large, signed. */
  change: number;
  verdict: DomainVerdict;
}

export function domainStudy(small: number, large: number, tol: number): DomainStudy {
  if (!Number.isFinite(small) || !Number.isFinite(large)) throw new TradeError('small and large must be finite numbers');
  if (large === 0) throw new TradeError('the enlarged domain gives 0, so a relative change is not defined; compare a quantity that is not zero (a force rather than a net lift near zero)');
  if (!(Number.isFinite(tol) && tol > 0)) throw new TradeError(`tol must be a positive fraction such as 1 %, not ${numberText(tol)}`);
  const change = (large - small) / large;
  return { change, verdict: Math.abs(change) <= tol * (1 + 1e-12) ? DOMAIN_VERDICTS[0] : DOMAIN_VERDICTS[1] };
}
