// From a sheet's parts before and after an evaluation to the update a page
// needs: only the parts whose html changed, as edits where the markup kept
// its shape, and the order of the parts only when it changed.
import { createHash } from 'node:crypto';
import type { SheetPart } from '../pipeline/index.js';
import { htmlEdits, type PartEdits } from './html-edits.js';
import type { PartUpdate } from './protocol.js';

export interface HashedPart {
  key: string;
  hash: string;
  html: string;
}

export function hashHtml(html: string): string {
  return createHash('sha1').update(html).digest('base64url').slice(0, 12);
}

export interface PartsChange {
  parts: HashedPart[];
  /** The parts a page that has `before` must be sent. */
  changed: PartUpdate[];
  /** The keys in page order, or null when they are the same as before. */
  order: string[] | null;
}

export function changeOfParts(before: readonly HashedPart[], after: readonly SheetPart[]): PartsChange {
  const old = new Map(before.map((p) => [p.key, p]));
  // Unchanged parts arrive as the very same strings: keep their hash instead of rehashing megabytes.
  const parts = after.map((p) => {
    const was = old.get(p.key);
    return { key: p.key, hash: was && was.html === p.html ? was.hash : hashHtml(p.html), html: p.html };
  });
  const changed: PartUpdate[] = [];
  for (const p of parts) {
    const was = old.get(p.key);
    if (was?.hash === p.hash) continue;
    const edits = was ? htmlEdits(was.hash, was.html, p.html) : null;
    changed.push(edits && editsAreSmaller(edits, p.html) ? { key: p.key, hash: p.hash, edits } : { key: p.key, hash: p.hash, html: p.html });
  }
  return { parts, changed, order: sameKeys(before, parts) ? null : parts.map((p) => p.key) };
}

function sameKeys(a: readonly { key: string }[], b: readonly { key: string }[]): boolean {
  return a.length === b.length && a.every((p, i) => p.key === b[i]!.key);
}

/** Edits win unless nearly everything changed (a rough size count, no serialising). */
function editsAreSmaller(edits: PartEdits, html: string): boolean {
  let size = 0;
  for (const [, was, is] of edits.texts) size += was.length + is.length + 12;
  for (const [, tag, name, value] of edits.attrs) size += tag.length + name.length + (value?.length ?? 0) + 16;
  return size < html.length / 2;
}
