// Load on loopback (issue 17): 50 WebSocket clients follow one sheet while it
// is saved 100 times in 10 s, evaluated by the real sandbox; every client ends
// on the final content with no update lost or reordered, and the server's
// memory comes back near where it started. A client that asks for a 5 MB
// sheet 100 times and reads nothing is dropped, and its memory returned.
// Bounds are generous: the figures are printed for the record, not judged here.
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { afterEach, describe, expect, it } from 'vitest';
import { WebSocket } from 'ws';
import { startServer } from '../../server/serve/index.js';
import type { ServerMessage, SheetUpdate } from '../../server/serve/protocol.js';
import { ParagraphRunner } from './fake-runner.js';
import { makeFolder, pause, waitFor } from './helpers.js';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as () => void;

/** The server's heap and buffers after garbage collection (it runs in this process). */
function memory(): number {
  gc();
  gc();
  const m = process.memoryUsage();
  return m.heapUsed + m.external;
}

const MB = 1024 * 1024;

let cleanup: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const c of cleanup.reverse()) await c();
  cleanup = [];
});

/** A page as the protocol sees it: the hash of each part, and the version it has. */
class Follower {
  version = -1;
  hashes = new Map<string, string>();
  order: string[] = [];
  /** Relative updates that did not apply to the version this follower had. */
  gaps = 0;
  /** Updates whose version did not grow. */
  reordered = 0;
  frames = 0;
  readonly socket: WebSocket;

  constructor(url: string, readonly sheet: string) {
    this.socket = new WebSocket(url.replace(/^http/, 'ws') + 'live', { origin: url.replace(/\/$/, '') });
    this.socket.on('open', () => this.socket.send(JSON.stringify({ type: 'follow', target: 'sheet', sheet })));
    this.socket.on('message', (data) => this.receive(JSON.parse(data.toString()) as ServerMessage));
  }

  private receive(m: ServerMessage): void {
    if (m.type !== 'sheet') return;
    this.frames++;
    if (m.version <= this.version) this.reordered++;
    if (m.base !== null && m.base !== this.version) {
      this.gaps++;
      return;
    }
    if (m.base === null) this.hashes = new Map();
    for (const p of m.parts) this.hashes.set(p.key, p.hash);
    if (m.order) this.order = m.order;
    this.version = m.version;
  }

  matches(update: SheetUpdate): boolean {
    return this.version === update.version && update.parts.every((p) => this.hashes.get(p.key) === p.hash) && this.order.join() === update.order!.join();
  }
}

/** The complete update as a fresh page would get it now. */
async function completeNow(url: string, sheet: string): Promise<SheetUpdate> {
  const probe = new Follower(url, sheet);
  let first: SheetUpdate | undefined;
  probe.socket.on('message', (data) => (first ??= JSON.parse(data.toString()) as SheetUpdate));
  await waitFor('a complete update', () => first);
  probe.socket.close();
  return first!;
}

function sheetText(i: number): string {
  return `# Load\n\nSaved ${i} times.\n\n\`\`\`basis\nU = ${10 + i / 10} m/s\nL = 2 m\nnu = 1.5e-5 m^2/s\nRe = U * L / nu\ncheck Re > 1000 "turbulent"\n\`\`\`\n\nRe is \`=Re\`.\n`;
}

describe('load', () => {
  it('50 clients on one sheet, 100 saves in 10 s: all end on the final content, nothing lost or out of order', async () => {
    const folder = await makeFolder({ 'load.md': sheetText(0) });
    const server = await startServer({ dir: folder.dir, port: 0 });
    cleanup.push(folder.remove, () => server.close());
    const file = path.join(folder.dir, 'load.md');
    const clients = Array.from({ length: 50 }, () => new Follower(server.url, 'load.md'));
    cleanup.push(async () => clients.forEach((c) => c.socket.terminate()));
    await waitFor('every client following', () => clients.every((c) => c.version >= 1), 30_000);
    const start = memory();

    const t0 = Date.now();
    for (let i = 1; i <= 100; i++) {
      await writeFile(file, sheetText(i));
      await pause(Math.max(0, t0 + i * 100 - Date.now()));
    }
    const writing = Date.now() - t0;
    // The last save shows: the value of U in the final complete update.
    let final: SheetUpdate | undefined;
    await waitFor('the final save in the sheet', async () => {
      final = await completeNow(server.url, 'load.md');
      return final.parts.some((p) => p.html?.includes('data-si="20"'));
    }, 30_000);
    await waitFor('every client on the final version', () => clients.every((c) => c.version === final!.version), 30_000);
    for (const c of clients) {
      expect(c.matches(final!)).toBe(true);
      expect(c.gaps).toBe(0);
      expect(c.reordered).toBe(0);
    }
    for (const c of clients) c.socket.close();
    await waitFor('the clients gone', async () => (await pause(50), true));
    const end = memory();
    console.log(
      `load: 50 clients, 100 saves in ${writing} ms; each client got ${Math.min(...clients.map((c) => c.frames))}–${Math.max(...clients.map((c) => c.frames))} frames, ` +
        `final version ${final!.version}; server heap+buffers ${(start / MB).toFixed(1)} MB before, ${(end / MB).toFixed(1)} MB after`,
    );
    expect(end - start).toBeLessThan(64 * MB);
  }, 120_000);

  it('a client that asks for a 5 MB sheet 100 times and reads nothing is dropped, and the memory comes back', async () => {
    const big = Array.from({ length: 2500 }, (_, i) => `Paragraph ${i}: ${'wind load on the roof edge '.repeat(80)}`).join('\n\n');
    const folder = await makeFolder({ 'big.md': big });
    const server = await startServer({ dir: folder.dir, port: 0, runner: new ParagraphRunner() });
    cleanup.push(folder.remove, () => server.close());
    expect(big.length).toBeGreaterThan(5_000_000);
    // Evaluated once, and its complete frame made once (a page's follow).
    await completeNow(server.url, 'big.md');
    const start = memory();

    const greedy = new WebSocket(server.url.replace(/^http/, 'ws') + 'live');
    let closedWith = 0;
    greedy.on('close', (code) => (closedWith = code));
    await new Promise((r) => greedy.once('open', r));
    // Stop reading: the server's frames pile up on its side of the connection.
    (greedy as unknown as { _socket: { pause(): void } })._socket.pause();
    for (let i = 0; i < 100; i++) greedy.send(JSON.stringify({ type: 'follow', target: 'sheet', sheet: 'big.md' }));
    await pause(1500);
    const during = memory();
    (greedy as unknown as { _socket: { resume(): void } })._socket.resume();
    await waitFor('the greedy client dropped', () => closedWith !== 0, 20_000);
    await pause(200);
    const after = memory();
    // A page that reads gets the sheet as before.
    const page = await completeNow(server.url, 'big.md');
    expect(page.parts).toHaveLength(2500);
    console.log(
      `slow client: 100 follows of a ${(big.length / MB).toFixed(1)} MB sheet, unread; server heap+buffers ${(start / MB).toFixed(1)} MB before, ` +
        `${(during / MB).toFixed(1)} MB while it held them, ${(after / MB).toFixed(1)} MB after it was dropped (closed with ${closedWith})`,
    );
    // Without a bound, 100 queued copies would be 500 MB and more.
    expect(during - start).toBeLessThan(100 * MB);
    expect(after - start).toBeLessThan(32 * MB);
  }, 60_000);
});
