// Applies a sheet update from the server to the page. Only parts whose hash
// changed are touched, and inside them only the nodes that differ (morph.js);
// parts are added, moved and removed to follow the server's order. Opened
// <details> stay open, and holdPlace keeps the reader's place on screen.
import { forgetNodes, prepareEdits } from './edits.js';
import { morphContent } from './morph.js';

/** @typedef {import('../server/serve/protocol.js').SheetUpdate} SheetUpdate */

/** @type {WeakMap<HTMLElement, Map<string, HTMLElement>>} the parts of each <main> by key */
const partsOf = new WeakMap();

/** @param {HTMLElement} main */
function partsByKey(main) {
  let parts = partsOf.get(main);
  if (!parts) {
    parts = new Map();
    for (const child of main.children) {
      if (child instanceof HTMLElement && child.dataset.part) parts.set(child.dataset.part, child);
    }
    partsOf.set(main, parts);
  }
  return parts;
}

/**
 * @param {HTMLElement} main
 * @param {SheetUpdate} update
 * @returns {boolean} false when the update cannot be applied and a complete one is needed
 */
export function applyParts(main, update) {
  const existing = partsByKey(main);
  // Everything is checked before anything changes, so an update that does not
  // fit leaves the page as it was.
  /** @type {Map<string, () => void>} */
  const edits = new Map();
  for (const part of update.parts) {
    const element = existing.get(part.key);
    if (element?.dataset.hash === part.hash || part.html !== undefined) continue;
    const apply = element && part.edits ? prepareEdits(element, part.edits) : null;
    if (!apply) return false;
    edits.set(part.key, apply);
  }
  // A relative update lists only the parts that changed; it names every key only when the order changed.
  const changed = new Map(update.parts.map((p) => [p.key, p]));
  if (update.order) {
    for (const key of update.order) if (!existing.has(key) && changed.get(key)?.html === undefined) return false;
  } else if (update.parts.some((p) => !existing.get(p.key)?.isConnected)) {
    return false;
  }
  for (const part of update.parts) {
    let element = existing.get(part.key);
    if (!element) {
      element = document.createElement('div');
      element.className = 'ws-part live-part';
      element.dataset.part = part.key;
    }
    if (element.dataset.hash !== part.hash) {
      if (part.html !== undefined) replaceContent(element, part.html);
      else edits.get(part.key)?.();
      element.dataset.hash = part.hash;
    }
    existing.set(part.key, element);
  }
  if (update.order) reorder(main, existing, update.order);

  return true;
}

/**
 * Puts the parts in the server's order and drops those it no longer lists.
 * @param {HTMLElement} main @param {Map<string, HTMLElement>} parts @param {string[]} order
 */
function reorder(main, parts, order) {
  const wanted = new Set(order);
  for (const [key, element] of parts) {
    if (wanted.has(key)) continue;
    element.remove();
    parts.delete(key);
  }
  /** @type {Element | null} */
  let previous = null;
  for (const key of order) {
    const element = /** @type {HTMLElement} */ (parts.get(key));
    const expected = previous ? previous.nextElementSibling : main.firstElementChild;
    if (expected !== element) main.insertBefore(element, expected);
    previous = element;
  }
}

/**
 * Brings an element's content up to date, keeping open the <details> that were open.
 * @param {Element} element @param {string} html
 */
export function replaceContent(element, html) {
  const open = new Set();
  element.querySelectorAll('details').forEach((d, i) => {
    if (d.open) open.add(detailsId(d, i));
  });
  forgetNodes(element);
  morphContent(element, html);
  if (open.size === 0) return;
  element.querySelectorAll('details').forEach((d, i) => {
    if (open.has(detailsId(d, i))) d.open = true;
  });
}

/** @param {HTMLDetailsElement} details @param {number} index */
function detailsId(details, index) {
  const summary = details.querySelector('summary');
  return details.id || (summary ? `s:${summary.textContent?.trim()}` : `i:${index}`);
}

/**
 * Notes where the reader is: the first element in view, from the part down to
 * the statement, and how far it is from the top of the window. The returned
 * function scrolls so that the deepest of them still on the page is back at
 * that place, whatever changed above it (parts, the summary, the header).
 * @param {HTMLElement} main
 * @returns {() => void}
 */
export function holdPlace(main) {
  if (window.scrollY === 0) return () => {};
  /** @type {{element: Element, top: number}[]} */
  const chain = [];
  /** @type {Element | null} */
  let parent = main;
  for (let depth = 0; depth < 4 && parent; depth++) {
    parent = firstInView(parent);
    if (parent) chain.push({ element: parent, top: parent.getBoundingClientRect().top });
  }
  return () => {
    for (let i = chain.length - 1; i >= 0; i--) {
      const { element, top } = chain[i];
      if (!element.isConnected) continue;
      const shift = element.getBoundingClientRect().top - top;
      if (Math.abs(shift) >= 1) window.scrollBy(0, shift);
      return;
    }
  };
}

/** @param {Element} parent */
function firstInView(parent) {
  for (const child of parent.children) {
    if (child.getBoundingClientRect().bottom > 0) return child;
  }
  return null;
}
