// Applies the small edits the server sends when a part's markup kept its
// shape (server/serve/html-edits.ts makes them). Nodes are found by position
// in document order, so nothing is touched unless this part's own node
// sequence has the fingerprint the server computed, and every text to change
// still reads what the server says it did.

/** @typedef {import('../server/serve/html-edits.js').PartEdits} PartEdits */

/**
 * @typedef {{shape: string, elements: Element[], texts: Text[]}} PartNodes
 * A part's nodes in document order, kept between updates: edits change text
 * and attributes only, so the list stays true until the part is replaced
 * (forgetNodes), and the next update need not walk the part again.
 * @type {WeakMap<Element, PartNodes>}
 */
const known = new WeakMap();

/** Call whenever a part's nodes are added, removed or replaced. */
export function forgetNodes(/** @type {Element} */ part) {
  known.delete(part);
}

/**
 * Checks the edits against the part and returns a function that applies
 * them, or null when they do not fit (then the page asks for a complete update).
 * @param {HTMLElement} part
 * @param {PartEdits} edits
 * @returns {(() => void) | null}
 */
export function prepareEdits(part, edits) {
  if (part.dataset.hash !== edits.from) return null;
  let nodes = known.get(part);
  if (!nodes) known.set(part, (nodes = walk(part)));
  const { elements, texts } = nodes;
  if (nodes.shape !== edits.shape) return null;
  for (const [index, was] of edits.texts) if (texts[index]?.data !== was) return null;
  for (const [index, tag] of edits.attrs) if (elements[index]?.localName.toLowerCase() !== tag) return null;

  return () => {
    for (const [index, , text] of edits.texts) texts[index].data = text;
    for (const [index, tag, name, value] of edits.attrs) {
      // The reader opened or closed this themselves: leave it so.
      if (tag === 'details' && name === 'open') continue;
      if (value === null) elements[index].removeAttribute(name);
      else elements[index].setAttribute(name, value);
    }
  };
}

/**
 * The part's elements and text nodes in document order, and the fingerprint
 * of that sequence (FNV-1a, as server/serve/html-edits.ts computes it).
 * @param {HTMLElement} part
 * @returns {PartNodes}
 */
function walk(part) {
  /** @type {Element[]} */
  const elements = [];
  /** @type {Text[]} */
  const texts = [];
  let hash = 0x811c9dc5;
  const feed = (/** @type {string} */ s) => {
    for (let i = 0; i < s.length; i++) {
      hash ^= s.charCodeAt(i);
      hash = Math.imul(hash, 0x01000193) >>> 0;
    }
  };
  const walker = document.createTreeWalker(part, NodeFilter.SHOW_ELEMENT | NodeFilter.SHOW_TEXT);
  for (let node = walker.nextNode(); node; node = walker.nextNode()) {
    if (node.nodeType === Node.TEXT_NODE) {
      texts.push(/** @type {Text} */ (node));
      feed('# ');
    } else {
      const element = /** @type {Element} */ (node);
      elements.push(element);
      feed(element.localName.toLowerCase() + ' ');
    }
  }
  return { shape: hash.toString(36), elements, texts };
}
