import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { list, num, si, str, TradeError, type Value } from '../../server/core/index.js';
import { asRecord, call, relErr, siField, stubContext } from './wall-helpers.js';

const FIXTURE = readFileSync(new URL('../fixtures/wall-yplus-small.csv', import.meta.url), 'utf8');

/** The fixture read by hand: plain comma split, header skipped. */
const rows = FIXTURE.trim().split('\n').slice(1).map((l) => l.split(','));
const yp = rows.map((r) => Number(r[1]));
const area = rows.map((r) => Number(r[2]));

/** Hyndman & Fan (1996), "Sample quantiles in statistical packages", definition 7: h = (n − 1)p + 1, 1-based. */
function hf7(values: number[], p: number): number {
  const x = [...values].sort((a, b) => a - b);
  const h = (x.length - 1) * p + 1;
  const j = Math.floor(h);
  return x[j - 1]! + (h - j) * ((x[Math.min(j, x.length - 1)] ?? x[j - 1]!) - x[j - 1]!);
}

function report(files: Record<string, string>, extra: Record<string, Value> = {}) {
  const ctx = stubContext(files);
  const args: Record<string, Value> = {
    path: str('data/run.csv'),
    column: str('yplus'),
    weight: str('area'),
    target: num(1),
    band: list([num(0.5), num(5)]),
    ...extra,
  };
  return asRecord(call('yplus_report', args, ctx));
}

describe('y+ report of a run', () => {
  it('summarises the fixture: count, extremes, means, percentiles, share in band', () => {
    const r = report({ 'data/run.csv': FIXTURE }, { first: si(40e-6, 'm') });
    expect([...r.fields.keys()]).toEqual(['count', 'min', 'max', 'mean', 'weighted_mean', 'p05', 'p50', 'p95', 'in_band', 'corrected_first']);
    const wsum = area.reduce((a, b) => a + b, 0);
    const wmean = yp.reduce((s, v, i) => s + v * area[i]!, 0) / wsum;
    expect(siField(r, 'count')).toBe(yp.length);
    expect(siField(r, 'min')).toBe(Math.min(...yp));
    expect(siField(r, 'max')).toBe(Math.max(...yp));
    expect(relErr(siField(r, 'mean'), yp.reduce((a, b) => a + b, 0) / yp.length)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'weighted_mean'), wmean)).toBeLessThan(1e-12);
    // With an even count the median is the mean of the two middle values (textbook definition).
    const sorted = [...yp].sort((a, b) => a - b);
    expect(relErr(siField(r, 'p50'), (sorted[3]! + sorted[4]!) / 2)).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'p05'), hf7(yp, 0.05))).toBeLessThan(1e-12);
    expect(relErr(siField(r, 'p95'), hf7(yp, 0.95))).toBeLessThan(1e-12);
    const inBand = yp.reduce((s, v, i) => s + (v >= 0.5 && v <= 5 ? area[i]! : 0), 0) / wsum;
    expect(relErr(siField(r, 'in_band'), inBand)).toBeLessThan(1e-12);
    // corrected_first = first × target / observed (weighted) mean, as issue 5 defines it.
    expect(relErr(siField(r, 'corrected_first'), (40e-6 * 1) / wmean)).toBeLessThan(1e-12);
    expect(r.figure?.svg).toMatch(/^<svg/);
    expect(r.figure?.svg).toMatch(/band 0.5–5/);
  });

  it('flags a low share in band (common practice: most of the wall)', () => {
    const r = report({ 'data/run.csv': FIXTURE });
    expect(r.warnings.join(' ')).toMatch(/inside 0.5–5/);
    expect(r.fields.has('corrected_first')).toBe(false);
    expect(r.remarks.join(' ')).toMatch(/Pass first:/);
  });

  it('without the weight column every face counts equally', () => {
    const text = 'face,yplus\na,1\nb,3\n';
    const r = report({ 'data/run.csv': text });
    expect(siField(r, 'weighted_mean')).toBe(siField(r, 'mean'));
    expect(r.remarks.join(' ')).toMatch(/no column area/);
  });

  it('reads semicolons with decimal commas, and tabs', () => {
    const semi = report({ 'data/run.csv': 'face;yplus;area\na;0,5;1\nb;1,5;3\n' });
    expect(relErr(siField(semi, 'weighted_mean'), (0.5 * 1 + 1.5 * 3) / 4)).toBeLessThan(1e-12);
    const tab = report({ 'data/run.csv': 'face\typlus\tarea\na\t2\t1\nb\t4\t1\n' });
    expect(siField(tab, 'mean')).toBe(3);
  });

  it('matches the column name regardless of case and a byte-order mark', () => {
    const r = report({ 'data/run.csv': '\uFEFFFace,YPlus,Area\na,2,1\n' });
    expect(siField(r, 'mean')).toBe(2);
  });
});

describe('bad CSVs give plain errors naming the row (header is row 1)', () => {
  const bad = (text: string) => () => report({ 'data/run.csv': text });
  it('missing column', () => {
    expect(bad('face,yp,area\na,1,1\n')).toThrow('no column "yplus" in the header (columns: face, yp, area)');
  });
  it('text where a number belongs', () => {
    expect(bad('face,yplus,area\na,1,1\nb,abc,1\n')).toThrow('row 3: "abc" in column yplus is not a number');
  });
  it('a blank line does not shift the row numbers', () => {
    expect(bad('face,yplus,area\n\na,1,1\nb,1,x\n')).toThrow('row 4: "x" in column area is not a number');
  });
  it('empty cell, short row, negative y+', () => {
    expect(bad('face,yplus,area\na,,1\n')).toThrow('row 2: the cell in column yplus is empty');
    expect(bad('face,yplus,area\na,1\n')).toThrow('row 2: 2 cells where the header has 3');
    expect(bad('face,yplus,area\na,-1,1\n')).toThrow(/row 2: .* is negative/);
  });
  it('an unclosed quote', () => {
    expect(bad('face,yplus,area\na,1,1\n"b,2,1\n')).toThrow(/not readable as delimited text near row 3/);
  });
  it('no rows, or nothing at all', () => {
    expect(bad('face,yplus,area\n')).toThrow('the file has a header but no rows of samples');
    expect(bad('')).toThrow(/the file is empty/);
  });
  it('errors reach the sheet as TradeError', () => {
    expect(bad('face,yplus\n')).toThrow(TradeError);
    expect(() => report({ 'data/run.csv': FIXTURE }, { band: list([num(5), num(0.5)]) })).toThrow(/low then high/);
  });
});
