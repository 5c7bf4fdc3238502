// The sandbox: runaway sheets end with an error and the next sheet works; data
// files outside the project folder cannot be read (issue 2).
import { mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { Sandbox, SandboxError } from '../../server/sandbox/sandbox.js';
import { renderSheet } from '../../server/pipeline/index.js';

const block = (lines: string[]) => '```basis\n' + lines.join('\n') + '\n```\n';

// A list of 1e5 items, then lists of lists that multiply the work by ten each line.
const heavy = (rows: number) => block(['a = linspace(0, 1, 100000)', ...Array.from({ length: rows }, (_, i) => `b${i} = a * ${i + 2} + a`)]);
const bomb = block(['a = linspace(0, 1, 100000)', 'b = [a, a, a, a, a, a, a, a, a, a] * 2', 'c = [b, b, b, b, b, b, b, b, b, b] * 2', 'd = [c, c, c, c, c, c, c, c, c, c] * 2']);

describe('sandbox', () => {
  const sandboxes: Sandbox[] = [];
  afterAll(async () => {
    await Promise.all(sandboxes.map((s) => s.close()));
  });

  it('tells how far a long Monte Carlo run has come while it runs, and only a long one', async () => {
    const sandbox = new Sandbox({ timeoutMs: 30000 });
    sandboxes.push(sandbox);
    const sheet = (samples: number) => block(['x1 = 0 ± 1', 'x2 = 0 ± 1', 'x3 = 0 ± 1 (uniform)', 'y = x1 * x2 + x3', `mc = propagate(y, samples: ${samples})`]);
    const quick: number[] = [];
    await sandbox.run(sheet(1000), {}, 0, (p) => quick.push(p.done));
    expect(quick).toEqual([]);
    const heard: Array<{ line: number; done: number; total: number }> = [];
    const r = await sandbox.run(sheet(600000), {}, 0, (p) => heard.push(p));
    expect(r.errors).toEqual([]);
    expect(heard.length).toBeGreaterThan(0);
    expect(heard.every((p) => p.line === 6 && p.total === 600000 && p.done < 600000)).toBe(true);
    expect(heard.map((p) => p.done)).toEqual([...heard.map((p) => p.done)].sort((a, b) => a - b));
  });

  it('stops an endless computation at the time limit, then evaluates the next sheet', async () => {
    const sandbox = new Sandbox({ timeoutMs: 300, limits: { maxSteps: 1e12, maxHeldItems: 1e12 } });
    sandboxes.push(sandbox);
    // The interpreter stops itself at 300 ms; on a loaded machine the sandbox's
    // backstop may kill the child first. Either way the caller gets a time error.
    const slow = await sandbox.run(heavy(400), {}).then(
      (r) => r.errors.find((e) => e.code === 'limit')?.message,
      (e: unknown) => (e instanceof SandboxError && e.code === 'timeout' ? e.message : String(e)),
    );
    expect(slow).toMatch(/stopped after 300 ms|took longer than 300 ms/);
    const next = await sandbox.run(block(['x = 2 m', 'y = x * 3']), {});
    expect(next.errors).toEqual([]);
    expect(next.values.y!.si).toBe(6);
  });

  it('stops at the step limit with a clear error', async () => {
    const sandbox = new Sandbox({ timeoutMs: 30000, limits: { maxSteps: 1_000_000 } });
    sandboxes.push(sandbox);
    const r = await sandbox.run(heavy(30), {});
    expect(r.errors.some((e) => e.code === 'limit' && /1,000,000 evaluation steps/.test(e.message))).toBe(true);
  });

  it('survives a memory bomb: the child dies, the caller gets an error, the next sheet works', async () => {
    // With the sheet's own limits lifted, only the heap cap is left to stop it.
    const sandbox = new Sandbox({ heapMb: 96, timeoutMs: 20000, limits: { maxSteps: 1e12, maxHeldItems: 1e12 } });
    sandboxes.push(sandbox);
    const err = await sandbox.run(bomb, {}).then(
      () => null,
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(SandboxError);
    expect((err as SandboxError).code).toBe('memory');
    expect((err as SandboxError).message).toMatch(/96 MiB memory limit/);
    const next = await sandbox.run(block(['U = 12 m/s']), {});
    expect(next.values.U!.si).toBe(12);
  });
});

describe('data files stay inside the project folder', () => {
  const root = mkdtempSync(join(tmpdir(), 'ws-root-'));
  const outside = mkdtempSync(join(tmpdir(), 'ws-outside-'));
  mkdirSync(join(root, 'data'));
  writeFileSync(join(root, 'data', 'yplus.csv'), 'face,yplus,area\n1,0.8,1\n2,1.2,1\n');
  writeFileSync(join(outside, 'secret.csv'), 'face,yplus,area\n1,99,1\n');
  symlinkSync(join(outside, 'secret.csv'), join(root, 'data', 'link.csv'));
  const sheetPath = join(root, 'sheet.md');
  const read = (path: string) => renderSheet(block([`r = yplus_report("${path}", first: 10 um)`]), { path: sheetPath, root });

  it('reads a file inside the folder', async () => {
    const r = await read('data/yplus.csv');
    expect(r.errors).toEqual([]);
    expect(r.reads).toEqual(['data/yplus.csv']);
  });
  for (const [what, path, message] of [
    ['an absolute path', join(outside, 'secret.csv'), /is an absolute path/],
    ['a path up and out', '../' + outside.split('/').pop() + '/secret.csv', /outside the project folder/],
    ['a symlink out', 'data/link.csv', /leads outside the project folder/],
    ['a missing file', 'data/none.csv', /does not exist/],
  ] as const) {
    it(`refuses ${what}`, async () => {
      const r = await read(path);
      expect(r.errors).toHaveLength(1);
      expect(r.errors[0]!.message).toMatch(message);
      expect(r.errors[0]!.code).toBe('data-file');
    });
  }
});
