import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { parseServeArgs, serveCommand, SERVE_HELP } from '../../server/cli/serve.js';
import { makeFolder } from './helpers.js';

describe('parseServeArgs', () => {
  it('defaults to this folder on 127.0.0.1', () => {
    expect(parseServeArgs([])).toEqual({ kind: 'run', args: { dir: '.', port: 4180, host: '127.0.0.1' } });
  });
  it('reads DIR, --port and --host in either spelling', () => {
    expect(parseServeArgs(['worksheets', '--port', '9000', '--host=0.0.0.0'])).toEqual({
      kind: 'run',
      args: { dir: 'worksheets', port: 9000, host: '0.0.0.0' },
    });
    expect(parseServeArgs(['--port=0', 'w'])).toMatchObject({ args: { dir: 'w', port: 0 } });
  });
  it.each([
    [['--port'], '--port needs a value'],
    [['--port', 'abc'], '--port must be a number'],
    [['--port', '70000'], '--port must be a number'],
    [['--colour'], 'unknown option --colour'],
    [['a', 'b'], 'only one folder'],
  ])('refuses %j', (argv, message) => {
    const parsed = parseServeArgs(argv);
    expect(parsed.kind).toBe('error');
    expect(parsed.kind === 'error' && parsed.message).toContain(message);
  });
});

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, io: { out: (t: string) => out.push(t), err: (t: string) => err.push(t) } };
}

describe('serveCommand', () => {
  it('prints help and exits 0', async () => {
    const c = capture();
    expect(await serveCommand(['--help'], c.io)).toBe(0);
    expect(c.out.join('')).toBe(SERVE_HELP);
  });

  it('exits 2 on bad usage, saying what was wrong', async () => {
    const c = capture();
    expect(await serveCommand(['--port', 'x'], c.io)).toBe(2);
    expect(c.err.join('')).toContain('wakesheet serve: --port must be a number');
  });

  it('exits 1 when the folder does not exist', async () => {
    const c = capture();
    expect(await serveCommand(['/nonexistent/wakesheet-folder', '--port', '0'], c.io)).toBe(1);
    expect(c.err.join('')).toContain('no such folder');
  });

  it('prints the address, serves until told to stop, and exits 0', async () => {
    const folder = await makeFolder({ 'wing.md': 'w' });
    const c = capture();
    let stop!: () => void;
    const stopSignal = new Promise<void>((resolve) => (stop = resolve));
    const running = serveCommand([folder.dir, '--port', '0'], { ...c.io, stopSignal });
    const url = await new Promise<string>((resolve) => {
      const poll = setInterval(() => {
        const m = /at (http:\/\/127\.0\.0\.1:\d+\/)/.exec(c.out.join(''));
        if (m) (clearInterval(poll), resolve(m[1]!));
      }, 10);
    });
    expect((await fetch(url)).status).toBe(200);
    stop();
    expect(await running).toBe(0);
    await expect(fetch(url)).rejects.toThrow();
    expect(c.err).toEqual([]);
    await folder.remove();
  });

  it('given a sheet, serves its folder and prints the address of the sheet', async () => {
    const folder = await makeFolder({ 'mast top.md': '```basis\nU = 34 m/s\n```\n' });
    const c = capture();
    let stop!: () => void;
    const running = serveCommand([join(folder.dir, 'mast top.md'), '--port', '0'], { ...c.io, stopSignal: new Promise((r) => (stop = r)) });
    const sheetAt = await new Promise<string>((resolve) => {
      const poll = setInterval(() => {
        const m = /This sheet: (http:\/\/127\.0\.0\.1:\d+\/sheet\/mast%20top\.md)\n/.exec(c.out.join(''));
        if (m) (clearInterval(poll), resolve(m[1]!));
      }, 10);
    });
    const page = await fetch(sheetAt);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('data-name="U"');
    stop();
    expect(await running).toBe(0);
    await folder.remove();
  });

  it('warns when asked to listen beyond loopback', async () => {
    const folder = await makeFolder({});
    const c = capture();
    const running = serveCommand([folder.dir, '--port', '0', '--host', '0.0.0.0'], { ...c.io, stopSignal: Promise.resolve() });
    expect(await running).toBe(0);
    expect(c.err.join('')).toMatch(/^warning: listening on 0\.0\.0\.0 \(every network interface\)/);
    await folder.remove();
  });

  it('explains a port that is taken', async () => {
    const folder = await makeFolder({});
    const first = capture();
    let stop!: () => void;
    const running = serveCommand([folder.dir, '--port', '0'], { ...first.io, stopSignal: new Promise((r) => (stop = r)) });
    const port = await new Promise<string>((resolve) => {
      const poll = setInterval(() => {
        const m = /:(\d+)\//.exec(first.out.join(''));
        if (m) (clearInterval(poll), resolve(m[1]!));
      }, 10);
    });
    const second = capture();
    expect(await serveCommand([folder.dir, '--port', port], { ...second.io, stopSignal: Promise.resolve() })).toBe(1);
    expect(second.err.join('')).toContain(`port ${port} on 127.0.0.1 is in use`);
    stop();
    await running;
    await folder.remove();
  });
});
