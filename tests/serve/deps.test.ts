import { describe, expect, it } from 'vitest';
import { DependencyMap, normaliseRelative } from '../../server/serve/deps.js';

describe('DependencyMap', () => {
  it('maps a data file to the sheets that read it', () => {
    const deps = new DependencyMap();
    deps.setReads('wing.md', ['data/residuals.csv', 'data/yplus.csv']);
    deps.setReads('tail.md', ['data/yplus.csv']);
    expect(deps.readersOf('data/yplus.csv')).toEqual(['tail.md', 'wing.md']);
    expect(deps.readersOf('data/residuals.csv')).toEqual(['wing.md']);
    expect(deps.readersOf('data/other.csv')).toEqual([]);
  });

  it('replaces what a sheet reads on each evaluation', () => {
    const deps = new DependencyMap();
    deps.setReads('wing.md', ['a.csv', 'b.csv']);
    deps.setReads('wing.md', ['b.csv', 'c.csv']);
    expect(deps.readersOf('a.csv')).toEqual([]);
    expect(deps.isRead('a.csv')).toBe(false);
    expect(deps.readsOf('wing.md')).toEqual(['b.csv', 'c.csv']);
  });

  it('forgets a deleted sheet entirely', () => {
    const deps = new DependencyMap();
    deps.setReads('wing.md', ['a.csv']);
    deps.setReads('tail.md', ['a.csv']);
    deps.forget('wing.md');
    expect(deps.readersOf('a.csv')).toEqual(['tail.md']);
    expect(deps.readsOf('wing.md')).toEqual([]);
  });

  it('matches paths however they were spelled', () => {
    const deps = new DependencyMap();
    deps.setReads('wing.md', ['./data//yplus.csv']);
    expect(deps.readersOf('data/yplus.csv')).toEqual(['wing.md']);
    expect(deps.readersOf('data\\yplus.csv')).toEqual(['wing.md']);
  });

  it('ignores reads that leave the folder and the sheet itself', () => {
    const deps = new DependencyMap();
    deps.setReads('wing.md', ['../secret.csv', '/etc/passwd', 'wing.md']);
    expect(deps.readsOf('wing.md')).toEqual([]);
  });
});

describe('normaliseRelative', () => {
  it.each([
    ['a/b.csv', 'a/b.csv'],
    ['./a/./b.csv', 'a/b.csv'],
    ['a\\b.csv', 'a/b.csv'],
    ['../a.csv', null],
    ['a/../../b.csv', null],
    ['/abs.csv', null],
    ['C:/x.csv', null],
    ['', null],
  ])('%s → %s', (input, expected) => {
    expect(normaliseRelative(input)).toBe(expected);
  });
});
