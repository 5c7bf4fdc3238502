import { appendFile, rename, rm, symlink, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { findSheets, isIgnoredName, isSheetFile } from '../../server/read/sheet-files.js';
import { FolderWatcher, type FileEvent } from '../../server/serve/watch.js';
import { makeFolder, pause, put, waitFor } from './helpers.js';

let cleanup: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const c of cleanup.reverse()) await c();
  cleanup = [];
});

async function watched(files: Record<string, string>) {
  const folder = await makeFolder(files);
  const events: FileEvent[] = [];
  const watcher = await FolderWatcher.start(folder.dir, { onEvent: (e) => events.push(e) });
  cleanup.push(folder.remove, () => watcher.close());
  const eventsFor = (file: string) => events.filter((e) => e.file === file).map((e) => e.kind);
  return { dir: folder.dir, events, watcher, eventsFor };
}

describe('FolderWatcher', () => {
  it('lists the files of the first scan, without hidden files or editor leftovers', async () => {
    const { watcher, events } = await watched({
      'wing.md': 'a',
      'data/yplus.csv': '1',
      '.wing.md.swp': 'x',
      'wing.md~': 'x',
      'node_modules/x/readme.md': 'x',
    });
    expect(watcher.files()).toEqual(['data/yplus.csv', 'wing.md']);
    expect(events).toEqual([]);
  });

  it('reports an in-place save once its content is on disk', async () => {
    const { dir, eventsFor } = await watched({ 'wing.md': 'U = 12 m/s\n' });
    await writeFile(path.join(dir, 'wing.md'), 'U = 13 m/s\n');
    await waitFor('a change event', () => eventsFor('wing.md').includes('changed'));
  });

  it('reports a write that goes on after the first event', async () => {
    const { dir, eventsFor } = await watched({ 'wing.md': 'start\n' });
    const file = path.join(dir, 'wing.md');
    await writeFile(file, 'part one\n');
    await pause(30);
    await appendFile(file, 'part two\n');
    await waitFor('two change events', () => eventsFor('wing.md').filter((k) => k === 'changed').length >= 2, 3000);
  });

  it('treats a temporary file renamed over the sheet as a change, again and again', async () => {
    const { dir, eventsFor, events } = await watched({ 'wing.md': 'v0\n' });
    for (let i = 1; i <= 3; i++) {
      const tmp = path.join(dir, `.wing.md.${i}.tmp`);
      await writeFile(tmp, `v${i}\n`);
      await rename(tmp, path.join(dir, 'wing.md'));
      await waitFor(`change ${i}`, () => eventsFor('wing.md').filter((k) => k === 'changed').length >= i);
    }
    expect(eventsFor('wing.md')).not.toContain('removed');
    expect(events.some((e) => e.file.includes('tmp'))).toBe(false);
  });

  it('does not report a delete followed at once by the new version as a removal', async () => {
    const { dir, eventsFor } = await watched({ 'wing.md': 'v0\n' });
    const file = path.join(dir, 'wing.md');
    await unlink(file);
    await writeFile(file, 'v1\n');
    await waitFor('a change', () => eventsFor('wing.md').includes('changed'));
    await pause(120);
    expect(eventsFor('wing.md')).not.toContain('removed');
  });

  it('reports new, deleted and renamed files', async () => {
    const { dir, eventsFor, watcher } = await watched({ 'wing.md': 'w\n' });
    await put(dir, 'sub/tail.md', 't\n');
    await waitFor('the new sheet', () => eventsFor('sub/tail.md').includes('added'));
    await rename(path.join(dir, 'sub/tail.md'), path.join(dir, 'sub/fin.md'));
    await waitFor('the old name removed', () => eventsFor('sub/tail.md').includes('removed'));
    await waitFor('the new name added', () => eventsFor('sub/fin.md').includes('added'));
    await rm(path.join(dir, 'wing.md'));
    await waitFor('the deleted sheet', () => eventsFor('wing.md').includes('removed'));
    expect(watcher.files()).toEqual(['sub/fin.md']);
  });

  it('reports data files too, and files in a folder that is removed', async () => {
    const { dir, eventsFor } = await watched({ 'wing.md': 'w\n', 'data/yplus.csv': '1\n' });
    await writeFile(path.join(dir, 'data/yplus.csv'), '2\n');
    await waitFor('data change', () => eventsFor('data/yplus.csv').includes('changed'));
    await rm(path.join(dir, 'data'), { recursive: true });
    await waitFor('data removal', () => eventsFor('data/yplus.csv').includes('removed'));
  });

  it('does not follow a symlinked folder out of the watched folder', async () => {
    const outside = await makeFolder({ 'secret.md': 's' });
    cleanup.push(outside.remove);
    const folder = await makeFolder({ 'wing.md': 'w' });
    await symlink(outside.dir, path.join(folder.dir, 'linked'));
    const watcher = await FolderWatcher.start(folder.dir, { onEvent: () => {} });
    cleanup.push(folder.remove, () => watcher.close());
    expect(watcher.files().some((f) => f.includes('secret'))).toBe(false);
  });
});

describe('file names', () => {
  it.each(['.wing.md.swp', '#wing.md#', '~wing.md', 'wing.md~', 'wing.md.tmp', 'node_modules', '.git'])('ignores %s', (name) => {
    expect(isIgnoredName(name)).toBe(true);
  });
  it('knows a sheet when it sees one', () => {
    expect(isSheetFile('guide/language.md')).toBe(true);
    expect(isSheetFile('data/yplus.csv')).toBe(false);
    expect(isSheetFile('guide/.draft.md')).toBe(false);
  });
  it('finds for `wakesheet check` exactly the sheets the server shows', async () => {
    const folder = await makeFolder({ 'wing.md': 'w', '#scratch.md': 's', 'notes.md~': 'n', '.draft/x.md': 'x', 'sub/tail.md': 't', 'sub/data.csv': '1' });
    const watcher = await FolderWatcher.start(folder.dir, { onEvent: () => {} });
    cleanup.push(folder.remove, () => watcher.close());
    const found = findSheets(folder.dir).map((f) => path.relative(folder.dir, f).split(path.sep).join('/'));
    expect(found).toEqual(['sub/tail.md', 'wing.md']);
    expect(watcher.files().filter(isSheetFile)).toEqual(found);
  });
});
