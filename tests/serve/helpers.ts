// Shared test helpers: temporary folders of sheets, waiting for a condition,
// and a WebSocket client that records what the server sends.
import { mkdtemp, mkdir, realpath, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { WebSocket } from 'ws';
import type { ServerMessage } from '../../server/serve/protocol.js';

export async function makeFolder(files: Record<string, string> = {}): Promise<{ dir: string; remove: () => Promise<void> }> {
  const dir = await realpath(await mkdtemp(path.join(tmpdir(), 'wakesheet-test-')));
  for (const [name, text] of Object.entries(files)) await put(dir, name, text);
  return { dir, remove: () => rm(dir, { recursive: true, force: true }) };
}

export async function put(dir: string, name: string, text: string): Promise<string> {
  const file = path.join(dir, name);
  await mkdir(path.dirname(file), { recursive: true });
  await writeFile(file, text);
  return file;
}

/** Polls until `check` returns a truthy value, or fails with `what`. */
export async function waitFor<T>(what: string, check: () => T | Promise<T>, timeoutMs = 5000): Promise<NonNullable<Awaited<T>>> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value as NonNullable<Awaited<T>>;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 10));
  }
}

export const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface RecordingClient {
  socket: WebSocket;
  messages: ServerMessage[];
  next(predicate: (m: ServerMessage) => boolean, what: string): Promise<ServerMessage>;
  close(): void;
}

/** Opens a WebSocket to `url` (http://host:port/) as a page of that origin would. */
export function connect(url: string, origin: string | undefined = url.replace(/\/$/, ''), options: { autoPong?: boolean } = {}): Promise<RecordingClient> {
  const wsUrl = url.replace(/^http/, 'ws') + 'live';
  const socket = new WebSocket(wsUrl, { ...options, ...(origin === undefined ? {} : { origin }) });
  const messages: ServerMessage[] = [];
  let seen = 0;
  socket.on('message', (data) => messages.push(JSON.parse(data.toString()) as ServerMessage));
  return new Promise((resolve, reject) => {
    socket.once('error', reject);
    socket.once('open', () =>
      resolve({
        socket,
        messages,
        async next(predicate, what) {
          const found = await waitFor(what, () => {
            const index = messages.findIndex((m, i) => i >= seen && predicate(m));
            if (index < 0) return null;
            seen = index + 1;
            return messages[index]!;
          });
          return found;
        },
        close: () => socket.close(),
      }),
    );
  });
}
