// Turns "this part's html changed" into the few edits that make the page's
// copy match, when the markup kept its shape: same elements in the same
// order, only text and attribute values different. That is what a save that
// changes an input usually does (digits inside formulas), and sending three
// edited numbers instead of 40 KB of KaTeX markup spares the page parsing and
// laying out the whole block again.
//
// The page finds nodes by their position in document order, so the edits
// carry a fingerprint of the node sequence (`shape`). The page computes the
// same fingerprint from its own DOM and refuses the edits when the two differ
// (markup the browser's parser would restructure, such as a table without
// <tbody>); it then asks for a complete update instead.

/** Edits that turn the html with hash `from` into the part's new html. */
export interface PartEdits {
  from: string;
  /** FNV-1a of the node sequence: element names, and `#` for each text node. */
  shape: string;
  /** [text node index, old text, new text] */
  texts: [number, string, string][];
  /** [element index, element name, attribute name, new value or null to remove] */
  attrs: [number, string, string, string | null][];
}

const ATTRIBUTE = /([^\s"'>/=]+)(?:\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'=<>`]+)))?/g;
const NAMED_ENTITIES = new Map([
  ['amp', '&'],
  ['lt', '<'],
  ['gt', '>'],
  ['quot', '"'],
  ['apos', "'"],
  ['nbsp', '\u00a0'],
]);
const LT = 60;
const GT = 62;
const SLASH = 47;
const QUOTE = 34;
const BANG = 33;

/**
 * The edits from `before` to `after`, or null when the node sequence differs
 * or the markup is not plain enough to be sure of it. One pass, token by
 * token, with no token objects: this runs on every save. Where the two
 * strings are the same (before the first difference and after the last) only
 * one of them is read.
 */
export function htmlEdits(fromHash: string, before: string, after: string): PartEdits | null {
  const texts: PartEdits['texts'] = [];
  const attrs: PartEdits['attrs'] = [];
  let shape = FNV_OFFSET;
  const prefix = commonPrefix(before, after);
  const shift = before.length - after.length;
  const suffixStart = after.length - commonSuffix(before, after, prefix);
  let element = -1;
  let text = -1;
  let i = 0;
  let j = 0;
  while (i < before.length && j < after.length) {
    const jEnd = tokenEnd(after, j);
    if (jEnd < 0) return null;
    // Inside the common prefix, or aligned inside the common suffix, both strings hold the same token.
    const shared = jEnd <= prefix || (j >= suffixStart && i - j === shift);
    const iEnd = shared ? jEnd + (i - j) : tokenEnd(before, i);
    if (iEnd < 0) return null;
    const isTag = after.charCodeAt(j) === LT;
    if (!shared && isTag !== (before.charCodeAt(i) === LT)) return null;
    const same = shared || (iEnd - i === jEnd - j && before.startsWith(after.slice(j, jEnd), i));
    if (!isTag) {
      text++;
      shape = fnv(fnv(shape, HASH_SIGN), SPACE);
      if (!same) {
        const was = decodeEntities(before.slice(i, iEnd));
        const is = decodeEntities(after.slice(j, jEnd));
        if (was === null || is === null) return null;
        texts.push([text, was, is]);
      }
    } else if (after.charCodeAt(j + 1) === SLASH) {
      if (!shared && before.charCodeAt(i + 1) !== SLASH) return null;
    } else {
      element++;
      shape = feedTagName(after, j, shape);
      if (!same) {
        const name = tagName(after, j);
        if (before.charCodeAt(i + 1) === SLASH || tagName(before, i) !== name) return null;
        const was = attributesOf(before.slice(i, iEnd), name.length);
        const is = attributesOf(after.slice(j, jEnd), name.length);
        if (!was || !is) return null;
        for (const [attr, value] of is) if (was.get(attr) !== value) attrs.push([element, name, attr, value]);
        for (const attr of was.keys()) if (!is.has(attr)) attrs.push([element, name, attr, null]);
      }
    }
    i = iEnd;
    j = jEnd;
  }
  if (i < before.length || j < after.length) return null;
  return { from: fromHash, shape: shape.toString(36), texts, attrs };
}

function commonPrefix(a: string, b: string): number {
  const n = Math.min(a.length, b.length);
  let k = 0;
  while (k < n && a.charCodeAt(k) === b.charCodeAt(k)) k++;
  return k;
}

/** Length of the common ending, not reaching back into the common prefix. */
function commonSuffix(a: string, b: string, prefix: number): number {
  const n = Math.min(a.length, b.length) - prefix;
  let k = 0;
  while (k < n && a.charCodeAt(a.length - 1 - k) === b.charCodeAt(b.length - 1 - k)) k++;
  return k;
}

// The shape is FNV-1a over "name " for each element and "# " for each text
// node, names in lower case; web/edits.js computes the same from the DOM.
const FNV_OFFSET = 0x811c9dc5;
const HASH_SIGN = 35;
const SPACE = 32;

function fnv(hash: number, code: number): number {
  return Math.imul(hash ^ code, 0x01000193) >>> 0;
}

/** Feeds the start tag's name at `at`, lower-cased, and a space. */
function feedTagName(html: string, at: number, hash: number): number {
  const end = tagNameEnd(html, at);
  for (let k = at + 1; k < end; k++) {
    const c = html.charCodeAt(k);
    hash = fnv(hash, c >= 65 && c <= 90 ? c + 32 : c);
  }
  return fnv(hash, SPACE);
}

/**
 * End of the token starting at `at`: a tag runs to its closing `>` outside
 * double quotes, a text run to the next `<`. -1 for what this does not read
 * (comments, doctypes, a `<` that starts no tag, a tag left open).
 */
function tokenEnd(html: string, at: number): number {
  if (html.charCodeAt(at) !== LT) {
    const next = html.indexOf('<', at);
    return next < 0 ? html.length : next;
  }
  const second = html.charCodeAt(at + 1);
  if (second === BANG || !(isLetter(second) || (second === SLASH && isLetter(html.charCodeAt(at + 2))))) return -1;
  // Jump quote to quote: a '>' inside a double-quoted value does not end the tag.
  let end = html.indexOf('>', at);
  let quote = html.indexOf('"', at);
  while (end >= 0 && quote >= 0 && quote < end) {
    const closing = html.indexOf('"', quote + 1);
    if (closing < 0) return -1;
    if (closing > end) end = html.indexOf('>', closing);
    quote = html.indexOf('"', closing + 1);
  }
  return end < 0 ? -1 : end + 1;
}

function isLetter(code: number): boolean {
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
}

/** Lower-case element name of the start tag at `at`. */
function tagName(html: string, at: number): string {
  return html.slice(at + 1, tagNameEnd(html, at)).toLowerCase();
}

/** Where the name of the start tag at `at` ends: at `>`, `/` or white space. */
function tagNameEnd(html: string, at: number): number {
  let k = at + 1;
  while (k < html.length) {
    const c = html.charCodeAt(k);
    if (c === GT || c === SLASH || c === 32 || c === 9 || c === 10 || c === 12 || c === 13) break;
    k++;
  }
  return k;
}

function attributesOf(tag: string, nameLength: number): Map<string, string> | null {
  const body = tag.slice(1 + nameLength, tag.endsWith('/>') ? -2 : -1);
  const found = new Map<string, string>();
  for (const m of body.matchAll(ATTRIBUTE)) {
    const value = decodeEntities(m[2] ?? m[3] ?? m[4] ?? '');
    if (value === null) return null;
    if (!found.has(m[1]!)) found.set(m[1]!, value);
  }
  return found;
}

/** Text as the browser's parser reads it, or null for an entity this does not know. */
export function decodeEntities(raw: string): string | null {
  if (raw.includes('\r')) return null; // the parser folds line ends; leave that to a full update
  if (!raw.includes('&')) return raw;
  let unknown = false;
  const decoded = raw.replace(/&(#[xX][0-9a-fA-F]+|#[0-9]+|[A-Za-z][A-Za-z0-9]*);?/g, (whole, body: string) => {
    if (!whole.endsWith(';')) unknown = true;
    if (body[0] === '#') {
      const code = body[1] === 'x' || body[1] === 'X' ? parseInt(body.slice(2), 16) : parseInt(body.slice(1), 10);
      if (!(code > 0 && code <= 0x10ffff) || (code >= 0xd800 && code <= 0xdfff)) unknown = true;
      return unknown ? whole : String.fromCodePoint(code);
    }
    const named = NAMED_ENTITIES.get(body);
    if (named === undefined) unknown = true;
    return named ?? whole;
  });
  return unknown ? null : decoded;
}
