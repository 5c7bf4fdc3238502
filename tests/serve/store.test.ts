import { writeFileSync } from 'node:fs';
import { rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import type { SheetUpdate } from '../../server/serve/protocol.js';
import { SheetStore } from '../../server/serve/store.js';
import { ParagraphRunner } from './fake-runner.js';
import { makeFolder, waitFor } from './helpers.js';

let cleanup: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const c of cleanup.reverse()) await c();
  cleanup = [];
});

async function storeWith(files: Record<string, string>) {
  const folder = await makeFolder(files);
  const runner = new ParagraphRunner();
  const store = new SheetStore(folder.dir, runner);
  const frames: SheetUpdate[] = [];
  store.on('sheet', (f) => frames.push(f));
  cleanup.push(folder.remove, () => store.close());
  store.addInitial(Object.keys(files));
  for (const name of Object.keys(files)) if (name.endsWith('.md')) await store.whenEvaluated(name);
  const write = (name: string, text: string) => writeFile(path.join(folder.dir, name), text);
  return { dir: folder.dir, store, runner, frames, write };
}

describe('SheetStore', () => {
  it('evaluates every sheet of the first scan, and only sheets', async () => {
    const { store, runner } = await storeWith({ 'a.md': '# A\n\none', 'b.md': 'two', 'data.csv': '1' });
    expect(runner.calls.map((c) => path.basename(c.opts.path!)).sort()).toEqual(['a.md', 'b.md']);
    expect(store.index().map((e) => [e.path, e.title, e.state])).toEqual([
      ['a.md', 'A', 'ready'],
      ['b.md', 'b', 'ready'],
    ]);
  });

  it('sends only the parts whose html changed', async () => {
    const { store, frames, write } = await storeWith({ 'a.md': 'one\n\ntwo\n\nthree' });
    await write('a.md', 'one\n\nTWO\n\nthree');
    store.handle({ kind: 'changed', file: 'a.md' });
    const delta = await waitFor('a second frame', () => frames[1]);
    expect(delta.base).toBe(1);
    expect(delta.version).toBe(2);
    expect(delta.parts).toEqual([{ key: 'p1', hash: expect.any(String), html: '<p>TWO</p>' }]);
    expect(delta.order).toBeNull(); // the same parts in the same order
    const complete = store.complete('a.md')!;
    expect(complete.parts.every((p) => p.html !== undefined)).toBe(true);
    expect(complete.order).toEqual(['p0', 'p1', 'p2']);
  });

  it('names the order of the parts when parts come or go', async () => {
    const { store, frames, write } = await storeWith({ 'a.md': 'one\n\ntwo' });
    await write('a.md', 'one\n\ntwo\n\nthree');
    store.handle({ kind: 'changed', file: 'a.md' });
    const delta = await waitFor('a second frame', () => frames[1]);
    expect(delta.order).toEqual(['p0', 'p1', 'p2']);
    expect(delta.parts).toEqual([{ key: 'p2', hash: expect.any(String), html: '<p>three</p>' }]);
  });

  it('sends small edits instead of html when only text and attributes changed', async () => {
    // A statement-like part: the number is a small text node among a lot of fixed markup.
    const runner = new ParagraphRunner();
    const plain = runner.run.bind(runner);
    runner.run = async (text, opts) => {
      const result = await plain(text, opts);
      const speed = /speed (\S+)/.exec(text)![1]!;
      const fixed = '<span class="katex">'.repeat(20) + 'U' + '</span>'.repeat(20);
      result.parts = [{ key: 'p0', html: `<div data-si="${speed}">${fixed}<b>${speed}</b></div>` }];
      return result;
    };
    const folder = await makeFolder({ 'a.md': 'speed 12' });
    const store = new SheetStore(folder.dir, runner);
    cleanup.push(folder.remove, () => store.close());
    const frames: SheetUpdate[] = [];
    store.on('sheet', (f) => frames.push(f));
    store.addInitial(['a.md']);
    await store.whenEvaluated('a.md');
    await writeFile(path.join(folder.dir, 'a.md'), 'speed 13.5');
    store.handle({ kind: 'changed', file: 'a.md' });
    const delta = await waitFor('a second frame', () => frames[1]);
    const [part] = delta.parts;
    expect(part!.html).toBeUndefined();
    // Element 0 is the div; text node 0 is the "U", text node 1 the number.
    expect(part!.edits).toMatchObject({ from: frames[0]!.parts[0]!.hash, texts: [[1, '12', '13.5']], attrs: [[0, 'div', 'data-si', '13.5']] });
  });

  it('passes on how far a long evaluation has come, for the sheet being evaluated', async () => {
    const runner = new ParagraphRunner();
    const plain = runner.run.bind(runner);
    runner.run = async (text, opts, _lane, onProgress) => {
      onProgress?.({ line: 4, done: 2000, total: 20000 });
      onProgress?.({ line: 4, done: 4000, total: 20000 });
      return plain(text, opts);
    };
    const folder = await makeFolder({ 'mc.md': 'a long one' });
    const store = new SheetStore(folder.dir, runner);
    cleanup.push(folder.remove, () => store.close());
    const heard: Array<[string, number, number]> = [];
    store.on('progress', (sheet, p) => heard.push([sheet, p.line, p.done]));
    store.addInitial(['mc.md']);
    await store.whenEvaluated('mc.md');
    expect(heard).toEqual([
      ['mc.md', 4, 2000],
      ['mc.md', 4, 4000],
    ]);
  });

  it('does not blank the page for a sheet caught empty in the middle of a save', async () => {
    const { dir, store, frames, write } = await storeWith({ 'a.md': 'one\n\ntwo' });
    await write('a.md', ''); // truncated; the new text lands a moment later
    store.handle({ kind: 'changed', file: 'a.md' }); // reads the file before it returns
    writeFileSync(path.join(dir, 'a.md'), 'one\n\nthree');
    const next = await waitFor('the next frame', () => frames[1]);
    expect(next.parts).toEqual([{ key: 'p1', hash: expect.any(String), html: '<p>three</p>' }]);
  });

  it('shows a sheet that stays empty as empty', async () => {
    const { store, frames, write } = await storeWith({ 'a.md': 'one' });
    await write('a.md', '');
    store.handle({ kind: 'changed', file: 'a.md' });
    const next = await waitFor('the empty frame', () => frames[1]);
    expect(next.order).toEqual([]);
  });

  it('re-evaluates only the sheets that read a changed data file', async () => {
    const { store, runner } = await storeWith({
      'wing.md': 'reads: data/yplus.csv',
      'tail.md': 'reads: data/residuals.csv',
      'data/yplus.csv': '1',
    });
    const before = runner.calls.length;
    store.handle({ kind: 'changed', file: 'data/yplus.csv' });
    await waitFor('one more evaluation', () => runner.calls.length === before + 1);
    await store.close();
    expect(path.basename(runner.calls.at(-1)!.opts.path!)).toBe('wing.md');
    expect(runner.calls.length).toBe(before + 1);
  });

  it('keeps the last good parts, marked stale, when evaluation fails, and recovers', async () => {
    const { store, frames, write } = await storeWith({ 'a.md': 'good' });
    await write('a.md', 'good\n\ncrash!');
    store.handle({ kind: 'changed', file: 'a.md' });
    const failed = await waitFor('the failure frame', () => frames[1]);
    expect(failed.condition).toMatchObject({ stale: true, failure: 'Evaluation failed: evaluation timed out after 2000 ms' });
    expect(failed.parts).toEqual([]); // nothing new to show: the page keeps what it has
    expect(failed.order).toBeNull();
    expect(store.index()[0]).toMatchObject({ state: 'failed', failure: expect.stringContaining('timed out') });

    await write('a.md', 'mended');
    store.handle({ kind: 'changed', file: 'a.md' });
    const mended = await waitFor('the recovery frame', () => frames[2]);
    expect(mended.condition).toMatchObject({ stale: false, failure: null });
    expect(mended.parts[0]!.html).toBe('<p>mended</p>');
  });

  it('keeps a deleted sheet for its open pages and recognises a rename', async () => {
    const { dir, store, frames } = await storeWith({ 'old.md': 'the same text' });
    await writeFile(path.join(dir, 'new.md'), 'the same text');
    await rm(path.join(dir, 'old.md'));
    store.handle({ kind: 'added', file: 'new.md' });
    await store.whenEvaluated('new.md');
    store.handle({ kind: 'removed', file: 'old.md' });
    const gone = frames.filter((f) => f.sheet === 'old.md').at(-1)!;
    expect(gone.condition).toMatchObject({ gone: true, stale: true, movedTo: 'new.md' });
    expect(store.has('old.md')).toBe(false);
    expect(store.knows('old.md')).toBe(true);
    expect(store.index().map((e) => e.path)).toEqual(['new.md']);
  });

  it('does not call a deletion a rename when the texts differ', async () => {
    const { dir, store, frames } = await storeWith({ 'old.md': 'first' });
    await writeFile(path.join(dir, 'new.md'), 'second');
    store.handle({ kind: 'added', file: 'new.md' });
    await store.whenEvaluated('new.md');
    store.handle({ kind: 'removed', file: 'old.md' });
    expect(frames.filter((f) => f.sheet === 'old.md').at(-1)!.condition).toMatchObject({ gone: true, movedTo: null });
  });

  it('evaluates a sheet someone follows before the others', async () => {
    const { store, runner } = await storeWith({ 'a.md': 'a', 'b.md': 'b', 'c.md': 'c' });
    runner.delayMs = 20;
    store.isFollowed = (sheet) => sheet === 'c.md';
    const before = runner.calls.length;
    store.handle({ kind: 'changed', file: 'a.md' });
    await waitFor('a.md being evaluated', () => runner.calls.length === before + 1);
    store.handle({ kind: 'changed', file: 'b.md' });
    store.handle({ kind: 'changed', file: 'c.md' });
    await waitFor('three evaluations', () => runner.calls.length === before + 3);
    // While a.md is evaluated, c.md (followed) jumps ahead of b.md.
    expect(runner.calls.slice(before).map((c) => path.basename(c.opts.path!))).toEqual(['a.md', 'c.md', 'b.md']);
  });
});
