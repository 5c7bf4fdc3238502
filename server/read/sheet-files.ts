// Which files are worksheets: the one rule, used by the server's watcher and
// by `wakesheet check` alike. Hidden files, editor backups and lock files
// (".#x.md", "#x.md#", "x.md~") and dependency folders are never sheets.
import { readdirSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';

/** Names that are never sheets or data: hidden, editor backups, dependency folders. */
export function isIgnoredName(name: string): boolean {
  return (
    name.startsWith('.') ||
    name.startsWith('#') ||
    name.startsWith('~') ||
    name.endsWith('~') ||
    name === 'node_modules' ||
    /\.(swp|swx|tmp|bak|crswap)$/i.test(name)
  );
}

/** A path (any separator) names a sheet: a Markdown file with a name that is not ignored. */
export function isSheetFile(file: string): boolean {
  return file.endsWith('.md') && !isIgnoredName(basename(file.replace(/\\/g, '/')));
}

/** Every sheet under `dir`, in a stable order; ignored folders are not entered. */
export function findSheets(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const name of readdirSync(d).sort()) {
      if (isIgnoredName(name)) continue;
      const p = join(d, name);
      const st = statSync(p);
      if (st.isDirectory()) walk(p);
      else if (st.isFile() && isSheetFile(name)) out.push(p);
    }
  };
  walk(dir);
  return out;
}

/** The largest sheet read, in bytes: past it a sheet is refused with its own message, before it is read. */
export const MAX_SHEET_BYTES = 8 * 1024 * 1024;

/** Why a sheet of `bytes` bytes is not read, or null when it may be. */
export function sheetTooLarge(bytes: number): string | null {
  if (bytes <= MAX_SHEET_BYTES) return null;
  const mib = (n: number) => `${(n / 1024 / 1024).toFixed(1).replace(/\.0$/, '')} MiB`;
  return `The sheet is ${mib(bytes)}; sheets are read up to ${mib(MAX_SHEET_BYTES)}. Keep large tables in a CSV file that the sheet reads.`;
}
