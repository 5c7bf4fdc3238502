// Brings an element's content in line with new html by changing only what
// differs. A save usually changes a few digits inside formulas that are
// otherwise the same; replacing the whole block would make the browser build
// and lay out every node again (tens of milliseconds for a block of KaTeX),
// while editing the text nodes that differ costs next to nothing. Nodes are
// matched by id where they have one (statements, line anchors), otherwise by
// position and tag. A <details> keeps the open state the reader gave it.

const template = document.createElement('template');

/**
 * @param {Element} element
 * @param {string} html
 */
export function morphContent(element, html) {
  template.innerHTML = html;
  morphChildren(element, template.content);
  template.innerHTML = '';
}

/**
 * Elements with an id and content are matched by id. Empty ones (the line
 * anchors, whose ids follow line numbers) go by position: after a line is
 * added above, matching them by id would move every statement down the page.
 * @param {Node} node
 */
function keyOf(node) {
  if (node.nodeType !== Node.ELEMENT_NODE) return null;
  const element = /** @type {Element} */ (node);
  return element.id && element.firstChild ? element.id : null;
}

/**
 * Invariant: the children of `from` before `cursor` already match the wanted
 * children seen so far; from `cursor` on are the old ones not yet used.
 * @param {Node} from the live node whose children change
 * @param {Node} to the parsed node whose children are wanted
 */
function morphChildren(from, to) {
  const keys = keyedChildren(from, to);
  let cursor = from.firstChild;
  for (let wanted = to.firstChild; wanted; ) {
    const nextWanted = wanted.nextSibling;
    if (keys) cursor = dropUnwanted(from, cursor, keys);
    const key = keys ? keyOf(wanted) : null;
    let match = key && keys ? keys.live.get(key) ?? null : cursor && !(keys && keyOf(cursor)) ? cursor : null;
    if (match && !sameKind(match, wanted)) match = null;
    if (match) {
      if (key) keys?.live.delete(key);
      if (match === cursor) cursor = cursor.nextSibling;
      else from.insertBefore(match, cursor);
      morphNode(match, wanted);
    } else {
      from.insertBefore(wanted, cursor); // moves it out of the template
    }
    wanted = nextWanted;
  }
  while (cursor) {
    const next = cursor.nextSibling;
    from.removeChild(cursor);
    cursor = next;
  }
}

/**
 * The keyed children on both sides, or null when neither side has any (most
 * nodes inside a formula): then matching is purely by position.
 * @param {Node} from @param {Node} to
 */
function keyedChildren(from, to) {
  /** @type {{live: Map<string, Node>, wanted: Map<string, string>} | null} */
  let keys = null;
  for (let child = from.firstChild; child; child = child.nextSibling) {
    const key = keyOf(child);
    if (key) (keys ??= { live: new Map(), wanted: new Map() }).live.set(key, child);
  }
  for (let child = to.firstChild; child; child = child.nextSibling) {
    const key = keyOf(child);
    if (key) (keys ??= { live: new Map(), wanted: new Map() }).wanted.set(key, child.nodeName);
  }
  return keys;
}

/**
 * Removes, from the cursor on, keyed old nodes that no wanted node will use.
 * @param {Node} from @param {ChildNode | null} cursor
 * @param {{live: Map<string, Node>, wanted: Map<string, string>}} keys
 */
function dropUnwanted(from, cursor, keys) {
  while (cursor) {
    const key = keyOf(cursor);
    if (!key || (keys.wanted.get(key) === cursor.nodeName && keys.live.get(key) === cursor)) return cursor;
    const next = cursor.nextSibling;
    from.removeChild(cursor);
    cursor = next;
  }
  return cursor;
}

/** @param {Node} a @param {Node} b */
function sameKind(a, b) {
  return a.nodeType === b.nodeType && a.nodeName === b.nodeName;
}

/** @param {Node} live @param {Node} wanted */
function morphNode(live, wanted) {
  if (live.nodeType !== Node.ELEMENT_NODE) {
    if (live.nodeValue !== wanted.nodeValue) live.nodeValue = wanted.nodeValue;
    return;
  }
  morphAttributes(/** @type {Element} */ (live), /** @type {Element} */ (wanted));
  morphChildren(live, wanted);
}

/**
 * By name, not through `attributes`: walking that map makes the browser
 * create an Attr object for every attribute, which made the whole morph
 * several times slower.
 * @param {Element} live @param {Element} wanted
 */
function morphAttributes(live, wanted) {
  const keepOpen = live.localName === 'details';
  const names = wanted.getAttributeNames();
  for (const name of names) {
    if (keepOpen && name === 'open') continue;
    const value = /** @type {string} */ (wanted.getAttribute(name));
    if (live.getAttribute(name) !== value) live.setAttribute(name, value);
  }
  if (live.attributes.length === names.length) return;
  for (const name of live.getAttributeNames()) {
    if (keepOpen && name === 'open') continue;
    if (!wanted.hasAttribute(name)) live.removeAttribute(name);
  }
}
