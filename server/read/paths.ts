// Where files may be read from: the one rule for staying inside a folder,
// and where the package and KaTeX are installed (for their assets).
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, isAbsolute, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * True when `target` is `folder` itself or lies inside it. Both must be
 * absolute and already resolved (for symlinks: both real paths).
 */
export function isInside(folder: string, target: string): boolean {
  const rel = relative(folder, target);
  return rel === '' || (rel !== '..' && !rel.startsWith('..' + sep) && !isAbsolute(rel));
}

let root: string | undefined;

/** The folder holding the package's package.json, from server/read or dist/server/read. */
export function packageRoot(): string {
  if (root) return root;
  let dir = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(dir, 'package.json'))) {
    const parent = dirname(dir);
    if (parent === dir) throw new Error('package.json not found above ' + fileURLToPath(import.meta.url));
    dir = parent;
  }
  return (root = dir);
}

/** The installed KaTeX's dist folder (its stylesheet and fonts). */
export function katexDistDir(): string {
  const require = createRequire(import.meta.url);
  return dirname(require.resolve('katex/dist/katex.min.css'));
}

/** This package's version, from its package.json. */
export function packageVersion(): string {
  return (JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version: string }).version;
}
