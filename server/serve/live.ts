// The WebSocket side: who follows which sheet, what to send them, and a
// heartbeat that drops connections that stopped answering. Each client gets a
// complete update when it starts following (so a reconnect re-syncs), then
// relative updates that carry only the parts whose html changed.
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
}

const DEFAULTS: Required<LiveOptions> = { heartbeatMs: 15_000, indexThrottleMs: 40 };

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
    store.on('busy', (sheet) => this.sendToFollowers(sheet, { type: 'busy', sheet }));
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
        this.send(client, this.store.indexMessage());
        return;
      }
      const update = this.store.complete(msg.sheet);
      if (!update) return socket.close(1008, 'no such sheet');
      client.follows = { target: 'sheet', sheet: msg.sheet, version: update.version };
      this.send(client, update);
    });
    socket.on('close', () => this.clients.delete(client));
    socket.on('error', () => this.clients.delete(client));
  }

  private isFollowed(sheet: string): boolean {
    for (const c of this.clients) if (c.follows?.target === 'sheet' && c.follows.sheet === sheet) return true;
    return false;
  }

  private sendUpdate(update: SheetUpdate): void {
    let complete: SheetUpdate | null = null;
    for (const client of this.clients) {
      const follows = client.follows;
      if (follows?.target !== 'sheet' || follows.sheet !== update.sheet) continue;
      // A client that missed a version (it joined mid-way) gets the complete update.
      const message = follows.version === update.base ? update : (complete ??= this.store.complete(update.sheet));
      if (!message) continue;
      follows.version = update.version;
      this.send(client, message);
    }
  }

  private sendToFollowers(sheet: string, message: ServerMessage): void {
    for (const client of this.clients) {
      if (client.follows?.target === 'sheet' && client.follows.sheet === sheet) this.send(client, message);
    }
  }

  private scheduleIndex(): void {
    if (this.indexTimer) return;
    this.indexTimer = setTimeout(() => {
      this.indexTimer = null;
      let json: string | null = null;
      for (const client of this.clients) {
        if (client.follows?.target !== 'index') continue;
        json ??= JSON.stringify(this.store.indexMessage() satisfies ServerMessage);
        if (client.socket.readyState === WebSocket.OPEN) client.socket.send(json);
      }
    }, this.options.indexThrottleMs);
  }

  private send(client: Client, message: ServerMessage): void {
    if (client.socket.readyState === WebSocket.OPEN) client.socket.send(JSON.stringify(message));
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

function refuse(socket: Duplex, status: 403 | 404, message: string): void {
  const reason = status === 403 ? 'Forbidden' : 'Not Found';
  const body = message + '\n';
  socket.once('finish', () => socket.destroy());
  socket.end(
    `HTTP/1.1 ${status} ${reason}\r\nConnection: close\r\nContent-Type: text/plain\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n${body}`,
  );
}
