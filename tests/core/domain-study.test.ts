import { describe, expect, it } from 'vitest';
import { num, si, str } from '../../server/core/index.js';
import { domainStudy } from '../../server/core/domain/study.js';
import { asRecord, call, relErr, siField, textField } from './domain-helpers.js';

describe('domain-independence verdicts', () => {
  it('the change is taken against the enlarged domain, as e_a21 against the finer grid', () => {
    // Celik et al. (2008), J. Fluids Eng. 130, 078001, Table 1, column 1 (from memory):
    // φ1 = 6.063 (fine), φ2 = 5.972 give e_a21 = 1.5 % (1.501 % recomputed).
    const s = domainStudy(5.972, 6.063, 0.01);
    expect(Math.abs(s.change * 100 - 1.501)).toBeLessThan(0.0005);
    expect(s.verdict).toBe('enlarge the domain');
    expect(domainStudy(5.972, 6.063, 0.02).verdict).toBe('domain independent');
  });

  it('a change within the tolerance either way is domain independent; at the tolerance it still is', () => {
    expect(domainStudy(0.412, 0.409, 0.01).verdict).toBe('domain independent');
    expect(relErr(domainStudy(0.412, 0.409, 0.01).change, -0.003 / 0.409)).toBeLessThan(1e-12);
    expect(domainStudy(0.99, 1, 0.01).verdict).toBe('domain independent');
    expect(domainStudy(0.98, 1, 0.01).verdict).toBe('enlarge the domain');
    expect(domainStudy(1.02, 1, 0.01).verdict).toBe('enlarge the domain');
  });

  it('refuses a zero reference and a bad tolerance', () => {
    expect(() => domainStudy(0.1, 0, 0.01)).toThrow(/relative change is not defined/);
    expect(() => domainStudy(1, 1, 0)).toThrow(/tol must be a positive fraction/);
  });

  it('the entry takes two quantities of one dimension and warns when the domain must grow', () => {
    const r = asRecord(call('domain_study', { small: si(412, 'N'), large: si(400, 'N') }));
    expect(relErr(siField(r, 'change'), -12 / 400)).toBeLessThan(1e-12);
    expect(textField(r, 'verdict')).toBe('enlarge the domain');
    expect(r.warnings.join('\n')).toMatch(/changes by −3 % when the domain is enlarged, more than the 1 % allowed/);
    const ok = asRecord(call('domain_study', { small: num(0.3), large: num(0.301), tol: num(0.005) }));
    expect(textField(ok, 'verdict')).toBe('domain independent');
    expect(ok.warnings).toEqual([]);
    expect(() => call('domain_study', { small: si(412, 'N'), large: num(0.3) })).toThrow(/compare the same quantity/);
  });
});

describe('domain study: what it refuses and what it states', () => {
  it('refuses values that are not finite numbers', () => {
    expect(() => domainStudy(Number.NaN, 1, 0.01)).toThrow('small and large must be finite numbers');
    expect(() => domainStudy(1, Number.POSITIVE_INFINITY, 0.01)).toThrow('small and large must be finite numbers');
  });

  it('the entry refuses a value that is not a quantity, and names it', () => {
    expect(() => call('domain_study', { small: str('0.41'), large: num(0.4) })).toThrow(/^small and large must be numbers or quantities, not /);
    expect(() => call('domain_study', { small: num(0.41), large: str('0.4') })).toThrow(/^small and large must be numbers or quantities, not /);
    expect(() => call('domain_study', { large: num(0.4) })).toThrow(/^small and large must be numbers or quantities, not /);
    expect(() => call('domain_study', { small: num(0.41) })).toThrow(/^small and large must be numbers or quantities, not /);
  });

  it('states the rule it applies (Celik et al. 2008, e_a against the finer grid)', () => {
    const r = asRecord(call('domain_study', { small: num(0.3), large: num(0.301), tol: num(0.005) }));
    expect(r.tag).toBe('domain study');
    expect(r.remarks).toEqual([
      'change = (large − small) / large: the enlarged domain is the better estimate, as the finer grid is in the approximate relative error of Celik et al. (2008).',
      'Verdict "domain independent" when |change| ≤ 0.5 %; otherwise "enlarge the domain" and repeat until the change is negligible.',
    ]);
  });
});
