// The WebSocket side: who follows which sheet, what to send them, and a
// heartbeat that drops connections that stopped answering. Each client gets a
// complete update when it starts following (so a reconnect re-syncs), then
// relative updates that carry only the parts whose html changed. Every frame
// is serialised once and the same bytes go to every client; a client that
// lets more than MAX_QUEUED_BYTES pile up unread is dropped.
import type { IncomingMessage } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocket, WebSocketServer } from 'ws';
import { MAX_CLIENT_MESSAGE_BYTES, parseClientMessage, type ServerMessage, type SheetUpdate } from './protocol.js';
import type { HostPolicy } from './security.js';
import type { SheetStore } from './store.js';

export const LIVE_PATH = '/live';

export interface LiveOptions {
  /** Interval of the heartbeat ping; a client that missed one is dropped. */
  heartbeatMs?: number;
  /** Index changes come in bursts (one per sheet at start-up): send at most this often. */
  indexThrottleMs?: number;
  /** Bytes a client may leave unread; past them it is dropped (its page reconnects and re-follows). */
  maxQueuedBytes?: number;
}

const DEFAULTS: Required<LiveOptions> = { heartbeatMs: 15_000, indexThrottleMs: 40, maxQueuedBytes: 16 * 1024 * 1024 };

/** Close code for a follow of a sheet that no longer exists: the page stops reconnecting. */
export const NO_SUCH_SHEET = 4404;
/** Close code for a client that does not read what it is sent. */
export const NOT_READING = 4408;

interface Client {
  socket: WebSocket;
  alive: boolean;
  follows: { target: 'index' } | { target: 'sheet'; sheet: string; version: number } | null;
}

export class LiveHub {
  private readonly wss: WebSocketServer;
  private readonly clients = new Set<Client>();
  private readonly options: Required<LiveOptions>;
  private readonly heartbeat: NodeJS.Timeout;
  private indexTimer: NodeJS.Timeout | null = null;
  /** The complete update of each sheet as sent, for the version it was made for. */
  private readonly completeFrames = new Map<string, { version: number; frame: Buffer }>();

  constructor(
    private readonly store: SheetStore,
    private readonly policy: () => HostPolicy | null,
    options: LiveOptions = {},
  ) {
    this.options = { ...DEFAULTS, ...options };
    this.wss = new WebSocketServer({ noServer: true, maxPayload: MAX_CLIENT_MESSAGE_BYTES, perMessageDeflate: false });
    this.heartbeat = setInterval(() => this.beat(), this.options.heartbeatMs);
    this.heartbeat.unref();
    store.on('sheet', (update) => this.sendUpdate(update));
    store.on('forgotten', (sheet) => this.completeFrames.delete(sheet));
    store.on('busy', (sheet) => this.sendToFollowers(sheet, { type: 'busy', sheet }));
    store.on('progress', (sheet, p) => this.sendToFollowers(sheet, { type: 'progress', sheet, line: p.line, done: p.done, total: p.total }));
    store.on('index', () => this.scheduleIndex());
    store.isFollowed = (sheet) => this.isFollowed(sheet);
  }

  get clientCount(): number {
    return this.clients.size;
  }

  /** The http server's 'upgrade' handler: checks where the request comes from first. */
  handleUpgrade(req: IncomingMessage, socket: Duplex, head: Buffer): void {
    const url = new URL(req.url ?? '/', 'http://placeholder');
    if (url.pathname !== LIVE_PATH) return refuse(socket, 404, 'No WebSocket here.');
    const policy = this.policy();
    if (!policy || !policy.allowsHost(req.headers.host)) return refuse(socket, 403, 'Unexpected Host header.');
    if (!policy.allowsOrigin(req.headers.origin, req.headers.host)) return refuse(socket, 403, 'Foreign origin.');
    this.wss.handleUpgrade(req, socket, head, (ws) => this.accept(ws));
  }

  async close(): Promise<void> {
    clearInterval(this.heartbeat);
    if (this.indexTimer) clearTimeout(this.indexTimer);
    for (const client of this.clients) client.socket.close(1001, 'server stopping');
    // Give the close frames a moment, then cut whatever is left.
    await new Promise((resolve) => setTimeout(resolve, 20));
    for (const client of this.clients) client.socket.terminate();
    this.clients.clear();
    await new Promise<void>((resolve) => this.wss.close(() => resolve()));
  }

  private accept(socket: WebSocket): void {
    const client: Client = { socket, alive: true, follows: null };
    this.clients.add(client);
    socket.on('pong', () => {
      client.alive = true;
    });
    socket.on('message', (data, isBinary) => {
      const msg = isBinary ? null : parseClientMessage(data.toString());
      if (!msg) return socket.close(1008, 'unexpected message');
      if (msg.target === 'index') {
        client.follows = { target: 'index' };
        this.send(client, encode(this.store.indexMessage()));
        return;
      }
      const complete = this.completeFrame(msg.sheet);
      if (!complete) return socket.close(NO_SUCH_SHEET, 'no such sheet');
      client.follows = { target: 'sheet', sheet: msg.sheet, version: complete.version };
      this.send(client, complete.frame);
    });
    socket.on('close', () => this.clients.delete(client));
    socket.on('error', () => this.clients.delete(client));
  }

  private isFollowed(sheet: string): boolean {
    for (const c of this.clients) if (c.follows?.target === 'sheet' && c.follows.sheet === sheet) return true;
    return false;
  }

  /** The complete update of a sheet, serialised once per version however many pages ask. */
  private completeFrame(sheet: string): { version: number; frame: Buffer } | null {
    const update = this.store.complete(sheet);
    if (!update) return null;
    const cached = this.completeFrames.get(sheet);
    if (cached?.version === update.version) return cached;
    const made = { version: update.version, frame: encode(update) };
    this.completeFrames.set(sheet, made);
    return made;
  }

  private sendUpdate(update: SheetUpdate): void {
    let relative: Buffer | null = null;
    let complete: Buffer | null = null;
    for (const client of this.clients) {
      const follows = client.follows;
      if (follows?.target !== 'sheet' || follows.sheet !== update.sheet) continue;
      // A client that missed a version (it joined mid-way) gets the complete update.
      const frame = follows.version === update.base ? (relative ??= encode(update)) : (complete ??= this.completeFrame(update.sheet)?.frame ?? null);
      if (!frame) continue;
      follows.version = update.version;
      this.send(client, frame);
    }
  }

  private sendToFollowers(sheet: string, message: ServerMessage): void {
    let frame: Buffer | null = null;
    for (const client of this.clients) {
      if (client.follows?.target === 'sheet' && client.follows.sheet === sheet) this.send(client, (frame ??= encode(message)));
    }
  }

  private scheduleIndex(): void {
    if (this.indexTimer) return;
    this.indexTimer = setTimeout(() => {
      this.indexTimer = null;
      let frame: Buffer | null = null;
      for (const client of this.clients) {
        if (client.follows?.target !== 'index') continue;
        this.send(client, (frame ??= encode(this.store.indexMessage())));
      }
    }, this.options.indexThrottleMs);
  }

  /** Sends a frame (text, the same bytes for every client), or drops a client that leaves its frames unread. */
  private send(client: Client, frame: Buffer): void {
    const socket = client.socket;
    if (socket.readyState !== WebSocket.OPEN) return;
    if (socket.bufferedAmount + frame.length > this.options.maxQueuedBytes && socket.bufferedAmount > 0) {
      this.clients.delete(client);
      socket.close(NOT_READING, 'not reading');
      // A peer that does not read will not read the close frame either.
      setTimeout(() => socket.terminate(), 1000).unref();
      return;
    }
    socket.send(frame, { binary: false });
  }

  private beat(): void {
    for (const client of this.clients) {
      if (!client.alive) {
        client.socket.terminate();
        this.clients.delete(client);
        continue;
      }
      client.alive = false;
      client.socket.ping();
    }
  }
}

function encode(message: ServerMessage): Buffer {
  return Buffer.from(JSON.stringify(message));
}

function refuse(socket: Duplex, status: 403 | 404, message: string): void {
  const reason = status === 403 ? 'Forbidden' : 'Not Found';
  const body = message + '\n';
  socket.once('finish', () => socket.destroy());
  socket.end(
    `HTTP/1.1 ${status} ${reason}\r\nConnection: close\r\nContent-Type: text/plain\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n${body}`,
  );
}
