// The one wording of a name that is not defined, with the nearest defined name
// as a hint: a typo (`D_strt`) is the usual cause. Short names are too close to
// each other for a hint to mean much: none under 3 characters, one edit under 5.
import { SheetError, type Span } from '../diagnostics.js';
import { nearestWord } from '../core/shared/words.js';

export function unknownName(name: string, span: Span, known: Iterable<string>): SheetError {
  const hint = name.length < 3 ? undefined : nearestWord(name, [...known], name.length < 5 ? 1 : 2);
  return new SheetError('unknown-name', `\`${name}\` is not defined (line ${span.line})${hint ? `; did you mean \`${hint}\`?` : ''}`, span);
}
