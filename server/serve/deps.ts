// Which sheets depend on which files. A sheet depends on itself and on every
// data file its last evaluation read (SheetResult.reads), so a change to a CSV
// re-evaluates only the sheets that read it. All paths are relative to the
// served folder, with forward slashes.

export class DependencyMap {
  private readonly readsBySheet = new Map<string, Set<string>>();
  private readonly sheetsByFile = new Map<string, Set<string>>();

  /** Replaces what `sheet` reads with the files of its latest evaluation. */
  setReads(sheet: string, reads: Iterable<string>): void {
    this.forget(sheet);
    const files = new Set<string>();
    for (const file of reads) {
      const normal = normaliseRelative(file);
      if (normal === null || normal === sheet) continue;
      files.add(normal);
      let readers = this.sheetsByFile.get(normal);
      if (!readers) this.sheetsByFile.set(normal, (readers = new Set()));
      readers.add(sheet);
    }
    this.readsBySheet.set(sheet, files);
  }

  /** Drops a sheet and everything it read (the sheet was deleted). */
  forget(sheet: string): void {
    const previous = this.readsBySheet.get(sheet);
    if (!previous) return;
    for (const file of previous) {
      const readers = this.sheetsByFile.get(file);
      readers?.delete(sheet);
      if (readers?.size === 0) this.sheetsByFile.delete(file);
    }
    this.readsBySheet.delete(sheet);
  }

  /** The files `sheet` read in its latest evaluation. */
  readsOf(sheet: string): string[] {
    return [...(this.readsBySheet.get(sheet) ?? [])].sort();
  }

  /** The sheets whose latest evaluation read `file` (not counting `file` itself). */
  readersOf(file: string): string[] {
    const normal = normaliseRelative(file);
    if (normal === null) return [];
    return [...(this.sheetsByFile.get(normal) ?? [])].sort();
  }

  /** True when any sheet reads `file`. */
  isRead(file: string): boolean {
    const normal = normaliseRelative(file);
    return normal !== null && this.sheetsByFile.has(normal);
  }
}

/**
 * Normalises a relative path ("./data//y.csv" → "data/y.csv"); returns null
 * for absolute paths and paths that climb out, which no sheet may read.
 */
export function normaliseRelative(file: string): string | null {
  const parts: string[] = [];
  for (const segment of file.replace(/\\/g, '/').split('/')) {
    if (segment === '' || segment === '.') continue;
    if (segment === '..') return null;
    parts.push(segment);
  }
  if (parts.length === 0 || file.startsWith('/') || /^[a-zA-Z]:/.test(file)) return null;
  return parts.join('/');
}
