// The "did you mean" hint: the option nearest by Levenshtein edit distance
// (Levenshtein 1966, insertions, deletions and substitutions each count one),
// case ignored, within a limit of edits.
import { describe, expect, it } from 'vitest';
import { nearestWord } from '../../server/core/shared/words.js';

describe('nearestWord', () => {
  it('takes the option with the fewest edits, ignoring case', () => {
    expect(nearestWord('aire', ['air', 'water', 'seawater'])).toBe('air');
    expect(nearestWord('SEAWATR', ['air', 'water', 'seawater'])).toBe('seawater');
  });

  it('gives nothing beyond two edits by default', () => {
    // kitten → sitting is 3 edits (the classic example of the distance).
    expect(nearestWord('kitten', ['sitting'])).toBeUndefined();
    expect(nearestWord('kitten', ['sittin'])).toBe('sittin');
  });

  it('keeps to a tighter limit when asked', () => {
    expect(nearestWord('D_strt', ['D_strut'], 1)).toBe('D_strut');
    expect(nearestWord('U_wnd', ['U_wind2'], 1)).toBeUndefined();
    expect(nearestWord('U_wnd', ['U_wind2'], 2)).toBe('U_wind2');
  });
});
