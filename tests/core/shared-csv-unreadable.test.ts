// A reader failure that names no row (an error that is not csv-parse's own,
// which always gives one) still says the file is unreadable, without a "near row".
// The project's own wording rule (no published source), checked as stated.
import { describe, expect, it, vi } from 'vitest';

vi.mock('csv-parse/sync', () => ({
  parse: () => {
    throw new Error('reader stopped');
  },
}));

const { readDelimited } = await import('../../server/core/shared/csv.js');

describe('an unreadable file without a row', () => {
  it('says so without naming a row', () => {
    expect(() => readDelimited('a,b\n1,2\n')).toThrow(/^the file is not readable as delimited text: reader stopped$/);
  });
});
