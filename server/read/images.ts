// Images in prose are embedded from files inside the project folder, as
// data: URIs: the live page and the archived record never fetch anything.
// A remote address is refused in words (a record must open offline, and an
// image fetched on opening would tell someone it was opened).
import { statSync } from 'node:fs';
import { extname } from 'node:path';
import { SheetError } from '../diagnostics.js';
import { dataBytesReader, dataFileLocator } from './data-files.js';
import type { ImageSource } from './parts.js';

export type LoadedImage = { uri: string } | { error: string };

/** An image larger than this is refused: the record carries it whole. */
const MAX_IMAGE_BYTES = 4 * 1024 * 1024;

const TYPES: Record<string, string> = {
  '.png': 'image/png',
  '.jpg': 'image/jpeg',
  '.jpeg': 'image/jpeg',
  '.gif': 'image/gif',
  '.webp': 'image/webp',
  '.svg': 'image/svg+xml',
};

/** Images loaded before, by src, with the file's size and time: an unchanged file is not read again. */
export type ImageCache = Map<string, { stamp: string; image: LoadedImage }>;

export function loadImages(root: string, sheetDir: string, images: readonly ImageSource[], cache: ImageCache): Map<string, LoadedImage> {
  const out = new Map<string, LoadedImage>();
  let read: ((p: string) => Buffer) | undefined;
  let locate: ((p: string) => string) | undefined;
  for (const { src } of images) {
    if (out.has(src)) continue;
    out.set(src, load(src));
  }
  for (const src of cache.keys()) if (!out.has(src)) cache.delete(src);
  return out;

  function load(src: string): LoadedImage {
    if (/^[a-z][a-z0-9+.-]*:/i.test(src) || src.startsWith('//')) {
      return { error: `the image ${src} is not shown: images come from files inside the project folder, so that the page and its record never fetch anything; save it beside the sheet and name it by its relative path` };
    }
    const type = TYPES[extname(src.split(/[?#]/)[0]!).toLowerCase()];
    if (!type) return { error: `the image ${src} is not shown: only .png, .jpg, .gif, .webp and .svg files are embedded` };
    const path = decodeURI(src.split(/[?#]/)[0]!);
    try {
      locate ??= dataFileLocator(root, sheetDir);
      const st = statSync(locate(path));
      const stamp = `${st.size}:${st.mtimeMs}`;
      const cached = cache.get(src);
      if (cached?.stamp === stamp) return cached.image;
      if (st.size > MAX_IMAGE_BYTES) return { error: `the image ${src} is larger than ${MAX_IMAGE_BYTES / 1024 / 1024} MiB, too large to embed in the record` };
      read ??= dataBytesReader(root, sheetDir);
      const image = { uri: `data:${type};base64,${read(path).toString('base64')}` };
      cache.set(src, { stamp, image });
      return image;
    } catch (e) {
      if (e instanceof SheetError) return { error: `the image ${src}: ${e.message}` };
      throw e;
    }
  }
}
