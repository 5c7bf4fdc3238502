// Data files a sheet may read: by relative path, inside the project folder.
// No absolute paths, no ".." out of it, no symlinks that lead out of it.
import { readFileSync, realpathSync, statSync } from 'node:fs';
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { SheetError } from '../diagnostics.js';
import { isInside } from './paths.js';

const MAX_BYTES = 16 * 1024 * 1024;

/**
 * Returns a reader for data files named relative to the sheet's folder and
 * confined to `root`. Paths given to it come from sheet text: check all of it.
 */
export function dataReader(root: string, sheetDir: string): (relativePath: string) => string {
  const file = dataFileLocator(root, sheetDir);
  return (relativePath: string) => readFileSync(file(relativePath), 'utf8');
}

/** The same confinement, for files read as bytes (images embedded in a record, hashes of data files). */
export function dataBytesReader(root: string, sheetDir: string): (relativePath: string) => Buffer {
  const file = dataFileLocator(root, sheetDir);
  return (relativePath: string) => readFileSync(file(relativePath));
}

/** The real path of a data file named relative to the sheet, once every rule is checked. */
export function dataFileLocator(root: string, sheetDir: string): (relativePath: string) => string {
  const realRoot = realpathSync(root);
  return (relativePath: string) => {
    if (relativePath.includes('\0')) throw new SheetError('data-file', 'a file name cannot contain a NUL character');
    if (isAbsolute(relativePath) || /^[A-Za-z]:[\\/]/.test(relativePath)) {
      throw new SheetError('data-file', `"${relativePath}" is an absolute path; name data files relative to the sheet`);
    }
    const target = resolve(sheetDir, relativePath);
    if (!isInside(resolve(root), target)) throw new SheetError('data-file', `"${relativePath}" is outside the project folder`);
    let real: string;
    try {
      real = realpathSync(target);
    } catch {
      throw new SheetError('data-file', `the data file "${relativePath}" does not exist`);
    }
    if (!isInside(realRoot, real)) throw new SheetError('data-file', `"${relativePath}" leads outside the project folder`);
    const st = statSync(real);
    if (!st.isFile()) throw new SheetError('data-file', `"${relativePath}" is not a file`);
    if (st.size > MAX_BYTES) throw new SheetError('data-file', `"${relativePath}" is larger than ${MAX_BYTES / 1024 / 1024} MiB`);
    return real;
  };
}

/** The project-relative form of a data path, as reported in `reads`. */
export function projectPath(root: string, sheetDir: string, relativePath: string): string {
  return relative(resolve(root), resolve(sheetDir, relativePath)).split(sep).join('/');
}
