// The whole server on 127.0.0.1 with a real folder, real HTTP and a real
// WebSocket client.
import { request } from 'node:http';
import { symlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { WebSocket } from 'ws';
import { startServer, type RunningServer } from '../../server/serve/index.js';
import type { SheetUpdate } from '../../server/serve/protocol.js';
import { ParagraphRunner } from './fake-runner.js';
import { connect, makeFolder, put } from './helpers.js';

let cleanup: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const c of cleanup.reverse()) await c();
  cleanup = [];
});

async function serve(files: Record<string, string>, runner = new ParagraphRunner()): Promise<RunningServer & { dir: string }> {
  const folder = await makeFolder(files);
  const server = await startServer({ dir: folder.dir, port: 0, runner });
  cleanup.push(folder.remove, () => server.close());
  return { ...server, close: server.close, dir: folder.dir };
}

interface Reply {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

/** A raw GET, so the Host header and the path go out exactly as given. */
function get(port: number, pathname: string, headers: Record<string, string> = {}, method = 'GET'): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, path: pathname, method, headers }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c) => (body += c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('HTTP', () => {
  it('lists the sheets with their checks and serves each page', async () => {
    const server = await serve({ 'wing.md': '# Wing\n\nfail', 'guide/intro.md': 'hello', 'data/y.csv': '1' });
    const index = await get(server.port, '/');
    expect(index.status).toBe(200);
    expect(index.body).toContain('href="/sheet/wing.md">Wing</a>');
    expect(index.body).toContain('href="/sheet/guide/intro.md"');
    expect(index.body).not.toContain('y.csv');
    const wingRow = /<tr data-path="wing.md"[\s\S]*?<\/tr>/.exec(index.body)![0];
    expect(wingRow).toContain('<td class="live-num live-bad">1</td>');
    expect(/<tr data-path="guide\/intro.md"[\s\S]*?<\/tr>/.exec(index.body)![0]).not.toContain('live-bad');
    const page = await get(server.port, '/sheet/guide/intro.md');
    expect(page.status).toBe(200);
    expect(page.body).toContain('<p>hello</p>');
    expect(page.body).toContain('data-sheet="guide/intro.md"');
  });

  it('sends a CSP without inline scripts on every response', async () => {
    const server = await serve({ 'wing.md': 'w' });
    for (const p of ['/', '/sheet/wing.md', '/assets/style.css', '/nowhere']) {
      const reply = await get(server.port, p);
      const csp = String(reply.headers['content-security-policy']);
      expect(csp).toContain("script-src 'self'");
      expect(csp).not.toContain('unsafe-inline\'; script');
      expect(csp.split(';').find((d) => d.trim().startsWith('script-src'))).not.toContain('unsafe');
    }
  });

  it('serves the client and KaTeX assets locally, and nothing else of KaTeX', async () => {
    const server = await serve({});
    expect((await get(server.port, '/assets/client.js')).headers['content-type']).toMatch(/javascript/);
    const css = await get(server.port, '/assets/katex/katex.min.css');
    expect(css.status).toBe(200);
    const font = /url\(fonts\/([\w-]+\.woff2)\)/.exec(css.body)![1]!;
    expect((await get(server.port, `/assets/katex/fonts/${font}`)).status).toBe(200);
    expect((await get(server.port, '/assets/katex/katex.min.js')).status).toBe(404);
  });

  it('refuses a foreign Host header (DNS rebinding)', async () => {
    const server = await serve({ 'wing.md': 'w' });
    for (const host of ['rebind.evil.test', `rebind.evil.test:${server.port}`, `127.0.0.1:${server.port + 1}`]) {
      const reply = await get(server.port, '/sheet/wing.md', { Host: host });
      expect(reply.status).toBe(403);
      expect(reply.body).not.toContain('<p>w</p>');
    }
    expect((await get(server.port, '/', { Host: `localhost:${server.port}` })).status).toBe(200);
  });

  it('never takes a write', async () => {
    const server = await serve({ 'wing.md': 'w' });
    for (const method of ['POST', 'PUT', 'DELETE', 'PATCH']) expect((await get(server.port, '/sheet/wing.md', {}, method)).status).toBe(405);
  });

  it('answers a mistyped sheet address with a page that offers the nearest sheet and the index', async () => {
    const server = await serve({ 'wing.md': 'w', 'hull.md': 'h' });
    const reply = await get(server.port, '/sheet/wnig.md');
    expect(reply.status).toBe(404);
    expect(reply.body).toContain('There is no sheet <code>wnig.md</code> in the folder');
    expect(reply.body).toContain('Did you mean <a href="/sheet/wing.md">wing.md</a>?');
    expect(reply.body).toContain('<a href="/">The sheets of this folder</a> (2 sheets)');
    // What was asked is shown as text, never as markup.
    expect((await get(server.port, '/sheet/%3Cb%3Ex.md')).body).toContain('<code>&lt;b&gt;x.md</code>');
  });

  it('serves no file from outside the folder', async () => {
    const outside = await makeFolder({ 'secret.md': 'top secret' });
    cleanup.push(outside.remove);
    const folder = await makeFolder({ 'wing.md': 'w' });
    await symlink(path.join(outside.dir, 'secret.md'), path.join(folder.dir, 'leak.md'));
    await symlink(outside.dir, path.join(folder.dir, 'linked'));
    const server = await startServer({ dir: folder.dir, port: 0, runner: new ParagraphRunner() });
    cleanup.push(folder.remove, () => server.close());
    const probes = [
      '/sheet/../' + path.basename(outside.dir) + '/secret.md',
      '/sheet/%2e%2e/' + path.basename(outside.dir) + '/secret.md',
      '/sheet/..%2F' + path.basename(outside.dir) + '%2Fsecret.md',
      '/sheet/leak.md',
      '/sheet/linked/secret.md',
      '/sheet/%2Fetc%2Fpasswd.md',
      '/assets/../package.json',
      '/assets/%2e%2e/package.json',
    ];
    for (const probe of probes) {
      const reply = await get(server.port, probe);
      expect.soft(reply.status, probe).toBe(404);
      expect(reply.body).not.toContain('top secret');
    }
    expect((await get(server.port, '/')).body).not.toContain('leak.md');
  });
});

describe('WebSocket', () => {
  it('refuses an upgrade from a foreign Origin, and from a foreign Host', async () => {
    const server = await serve({ 'wing.md': 'w' });
    await expect(connect(server.url, 'http://evil.test')).rejects.toThrow(/403/);
    await expect(connect(server.url, `http://127.0.0.1:${server.port + 1}`)).rejects.toThrow(/403/);
    const ws = new WebSocket(`ws://127.0.0.1:${server.port}/live`, { headers: { Host: `evil.test:${server.port}` } });
    await expect(new Promise((resolve, reject) => (ws.on('open', resolve), ws.on('error', reject)))).rejects.toThrow(/403/);
    const own = await connect(server.url);
    own.close();
  });

  it('sends the complete sheet on follow and then patches only what changed', async () => {
    const server = await serve({ 'wing.md': 'one\n\ntwo' });
    await get(server.port, '/sheet/wing.md'); // returns once evaluated
    const client = await connect(server.url);
    cleanup.push(async () => client.close());
    client.socket.send(JSON.stringify({ type: 'follow', target: 'sheet', sheet: 'wing.md' }));
    const first = (await client.next((m) => m.type === 'sheet', 'the complete frame')) as SheetUpdate;
    expect(first.base).toBeNull();
    expect(first.parts.map((p) => p.html)).toEqual(['<p>one</p>', '<p>two</p>']);

    await writeFile(path.join(server.dir, 'wing.md'), 'one\n\nthree');
    await client.next((m) => m.type === 'busy', 'the busy notice');
    const patch = (await client.next((m) => m.type === 'sheet', 'the patch')) as SheetUpdate;
    expect(patch.base).toBe(first.version);
    expect(first.order).toEqual(['p0', 'p1']);
    expect(patch.parts).toEqual([{ key: 'p1', hash: expect.any(String), html: '<p>three</p>' }]);
    expect(patch.order).toBeNull();
  });

  it('re-evaluates a sheet when a data file it reads changes', async () => {
    const server = await serve({ 'wing.md': 'reads: data/yplus.csv', 'data/yplus.csv': '1' });
    const client = await connect(server.url);
    cleanup.push(async () => client.close());
    client.socket.send(JSON.stringify({ type: 'follow', target: 'sheet', sheet: 'wing.md' }));
    const first = (await client.next((m) => m.type === 'sheet', 'the complete frame')) as SheetUpdate;
    await writeFile(path.join(server.dir, 'data/yplus.csv'), '2');
    const again = (await client.next((m) => m.type === 'sheet', 'a new frame')) as SheetUpdate;
    expect(again.version).toBe(first.version + 1);
  });

  it('keeps index followers up to date as sheets come and go', async () => {
    const server = await serve({ 'wing.md': 'w' });
    const client = await connect(server.url);
    cleanup.push(async () => client.close());
    client.socket.send(JSON.stringify({ type: 'follow', target: 'index' }));
    await client.next((m) => m.type === 'index' && m.sheets.length === 1, 'the first index');
    await put(server.dir, 'tail.md', '# Tail\n\nt');
    await client.next((m) => m.type === 'index' && m.sheets.some((s) => s.title === 'Tail' && s.state === 'ready'), 'the new sheet');
  });

  it('closes on a malformed message or an unknown sheet', async () => {
    const server = await serve({ 'wing.md': 'w' });
    // An unknown sheet gets its own code, on which the page stops reconnecting.
    for (const [message, code] of [['not json', 1008], [JSON.stringify({ type: 'follow', target: 'sheet', sheet: '../x.md' }), 4404]] as const) {
      const client = await connect(server.url);
      const closed = new Promise<number>((resolve) => client.socket.on('close', (c) => resolve(c)));
      client.socket.send(message);
      expect(await closed).toBe(code);
    }
  });

  it('drops a client that stops answering pings', async () => {
    const folder = await makeFolder({ 'wing.md': 'w' });
    const server = await startServer({ dir: folder.dir, port: 0, runner: new ParagraphRunner(), live: { heartbeatMs: 50 } });
    cleanup.push(folder.remove, () => server.close());
    // A peer that never answers pings: frozen, or gone without a goodbye.
    const silent = await connect(server.url, undefined, { autoPong: false });
    const answering = await connect(server.url);
    const closed = new Promise<number>((resolve) => silent.socket.on('close', (code) => resolve(code)));
    expect(await closed).toBe(1006);
    expect(answering.socket.readyState).toBe(WebSocket.OPEN);
    answering.close();
  });
});
