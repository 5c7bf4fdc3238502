// Applies a sheet frame from the server to the page. Only parts whose hash
// changed are touched, and inside them only the nodes that differ (morph.js);
// parts are added, moved and removed to follow the server's order. The
// reader's place is kept: the first part in view stays where it was on
// screen, and opened <details> stay open.
import { forgetNodes, prepareEdits } from './edits.js';
import { morphContent } from './morph.js';

/**
 * @typedef {{key: string, hash: string, html?: string, edits?: import('./edits.js').PartEdits}} PartFrame
 * @typedef {{stale: boolean, failure: string | null, gone: boolean, movedTo: string | null,
 *            evaluatedAt: string | null, elapsedMs: number | null}} SheetCondition
 * @typedef {{type: 'sheet', sheet: string, version: number, base: number | null, title: string,
 *            parts: PartFrame[], order: string[] | null, headerHtml: string | null, summaryHtml: string | null,
 *            condition: SheetCondition}} SheetFrame
 */

/** @type {WeakMap<HTMLElement, Map<string, HTMLElement>>} the parts of each <main> by key */
const partsOf = new WeakMap();

/** @param {HTMLElement} main */
function partsByKey(main) {
  let parts = partsOf.get(main);
  if (!parts) {
    parts = new Map();
    for (const child of main.children) {
      if (child instanceof HTMLElement && child.dataset.key) parts.set(child.dataset.key, child);
    }
    partsOf.set(main, parts);
  }
  return parts;
}

/**
 * @param {HTMLElement} main
 * @param {SheetFrame} frame
 * @returns {boolean} false when the frame cannot be applied and a complete one is needed
 */
export function patchParts(main, frame) {
  const existing = partsByKey(main);
  // Everything is checked before anything changes, so a frame that does not
  // fit leaves the page as it was.
  /** @type {Map<string, () => void>} */
  const edits = new Map();
  for (const part of frame.parts) {
    const element = existing.get(part.key);
    if (element?.dataset.hash === part.hash || part.html !== undefined) continue;
    const apply = element && part.edits ? prepareEdits(element, part.edits) : null;
    if (!apply) return false;
    edits.set(part.key, apply);
  }
  // A patch lists only the parts that changed; it names every key only when the order changed.
  const changed = new Map(frame.parts.map((p) => [p.key, p]));
  if (frame.order) {
    for (const key of frame.order) if (!existing.has(key) && changed.get(key)?.html === undefined) return false;
  } else if (frame.parts.some((p) => !existing.get(p.key)?.isConnected)) {
    return false;
  }
  const anchor = findAnchor(main);

  for (const part of frame.parts) {
    let element = existing.get(part.key);
    if (!element) {
      element = document.createElement('div');
      element.className = 'ws-part live-part';
      element.dataset.key = part.key;
    }
    if (element.dataset.hash !== part.hash) {
      if (part.html !== undefined) replaceContent(element, part.html);
      else edits.get(part.key)?.();
      element.dataset.hash = part.hash;
    }
    existing.set(part.key, element);
  }
  if (frame.order) reorder(main, existing, frame.order);

  if (anchor) restoreAnchor(main, anchor);
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

/** Brings an element's content up to date, keeping open the <details> that were open. */
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

/** The first part at least partly in view and its distance from the top. */
function findAnchor(main) {
  if (window.scrollY === 0) return null;
  for (const child of main.children) {
    if (!(child instanceof HTMLElement)) continue;
    const rect = child.getBoundingClientRect();
    if (rect.bottom > 0) return { key: child.dataset.key, top: rect.top };
  }
  return null;
}

function restoreAnchor(main, anchor) {
  for (const child of main.children) {
    if (child instanceof HTMLElement && child.dataset.key === anchor.key) {
      const shift = child.getBoundingClientRect().top - anchor.top;
      if (Math.abs(shift) >= 1) window.scrollBy(0, shift);
      return;
    }
  }
}
