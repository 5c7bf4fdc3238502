// The guards between the network and the served folder. The server only reads:
// nothing here (or anywhere in serve/) opens a sheet for writing.
import { realpathSync } from 'node:fs';
import { isIP } from 'node:net';
import { hostname } from 'node:os';
import path from 'node:path';
import { isInside } from '../read/paths.js';

/** Sheets and static files are fetched, never posted. */
export const ALLOWED_METHODS = new Set(['GET', 'HEAD']);

/**
 * Content-Security-Policy for every response. No inline scripts and no inline
 * event handlers, so markup that slips into a sheet cannot run. Style
 * attributes stay allowed because KaTeX positions glyphs with them; <style>
 * elements do not.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self'",
  "style-src 'self'",
  "style-src-attr 'unsafe-inline'",
  "img-src 'self' data:",
  "font-src 'self'",
  "connect-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
  "object-src 'none'",
].join('; ');

export const SECURITY_HEADERS: Readonly<Record<string, string>> = {
  'Content-Security-Policy': CONTENT_SECURITY_POLICY,
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'no-referrer',
  'Cross-Origin-Opener-Policy': 'same-origin',
  'Cross-Origin-Resource-Policy': 'same-origin',
};

const LOOPBACK_NAMES = ['localhost', '127.0.0.1', '[::1]'];

export function isLoopbackHost(host: string): boolean {
  return host === 'localhost' || host === '::1' || host === '[::1]' || /^127\./.test(host);
}

export function isWildcardHost(host: string): boolean {
  return host === '0.0.0.0' || host === '::' || host === '[::]';
}

/** Formats a host for a URL or a Host header (IPv6 literals in brackets). */
export function hostForUrl(host: string): string {
  return isIP(host) === 6 ? `[${host}]` : host;
}

/**
 * Decides which Host headers name this server. A DNS-rebinding page reaches
 * us under its own domain name, so only names we know are accepted: the bound
 * address, the loopback names when bound to loopback, and for a wildcard bind
 * any IP literal plus this machine's name.
 */
export class HostPolicy {
  private readonly names: Set<string>;
  private readonly anyIp: boolean;

  constructor(
    boundHost: string,
    private readonly port: number,
  ) {
    const names = new Set<string>([hostForUrl(boundHost).toLowerCase()]);
    if (isLoopbackHost(boundHost)) for (const n of LOOPBACK_NAMES) names.add(n);
    this.anyIp = isWildcardHost(boundHost);
    if (this.anyIp) {
      for (const n of LOOPBACK_NAMES) names.add(n);
      names.add(hostname().toLowerCase());
    }
    this.names = names;
  }

  /** True when a Host header value ("name:port") addresses this server. */
  allowsHost(header: string | undefined): boolean {
    if (!header) return false;
    const match = /^(\[[0-9a-f:.]+\]|[^:[\]]+)(?::(\d+))?$/i.exec(header.trim());
    if (!match) return false;
    const name = match[1]!.toLowerCase();
    const port = match[2] === undefined ? 80 : Number(match[2]);
    if (port !== this.port) return false;
    if (this.names.has(name)) return true;
    const bare = name.startsWith('[') ? name.slice(1, -1) : name;
    return this.anyIp && isIP(bare) !== 0;
  }

  /**
   * True when a WebSocket's Origin is one of our own pages. A missing Origin
   * comes from a non-browser client, which no web page can forge into sending.
   */
  allowsOrigin(origin: string | undefined, hostHeader: string | undefined): boolean {
    if (origin === undefined) return true;
    let url: URL;
    try {
      url = new URL(origin);
    } catch {
      return false;
    }
    if (url.protocol !== 'http:') return false;
    if (!this.allowsHost(url.host || undefined)) return false;
    // The page must come from the very host the socket is addressed to.
    return hostHeader !== undefined && url.host.toLowerCase() === hostHeader.trim().toLowerCase();
  }
}

export class SheetPathError extends Error {
  constructor(
    message: string,
    readonly code: 'bad-path' | 'outside-folder' | 'not-a-sheet' | 'missing',
  ) {
    super(message);
    this.name = 'SheetPathError';
  }
}

/**
 * Checks a sheet path taken from a URL ("guide/language.md", already
 * percent-decoded) and returns the normalised relative path. Rejects anything
 * that could leave the folder before the file system is consulted.
 */
export function checkSheetPath(relative: string): string {
  if (relative.length === 0 || relative.length > 1024) throw new SheetPathError('empty or overlong path', 'bad-path');
  if (/[\0\\]/.test(relative) || relative.startsWith('/')) throw new SheetPathError('malformed path', 'bad-path');
  const segments = relative.split('/');
  for (const segment of segments) {
    if (segment === '' || segment === '.' || segment === '..') throw new SheetPathError('malformed path', 'bad-path');
    if (segment.startsWith('.')) throw new SheetPathError('hidden files are not served', 'bad-path');
  }
  if (!relative.endsWith('.md')) throw new SheetPathError('only .md sheets are served', 'not-a-sheet');
  return segments.join('/');
}

/**
 * Resolves a relative sheet path to a real file inside `realRoot` (the
 * folder's own realpath), following symlinks and refusing any that lead out.
 */
export async function resolveSheetFile(realRoot: string, relative: string): Promise<string> {
  return resolveSheetFileSync(realRoot, relative);
}

/**
 * The same, without a round trip through the thread pool: the store resolves
 * and reads the sheet on every save, and for a local text file two
 * asynchronous calls cost several times the work itself.
 */
export function resolveSheetFileSync(realRoot: string, relative: string): string {
  const checked = checkSheetPath(relative);
  const joined = path.join(realRoot, ...checked.split('/'));
  if (!isInside(realRoot, joined)) throw new SheetPathError('path leaves the folder', 'outside-folder');
  let real: string;
  try {
    real = realpathSync.native(joined);
  } catch {
    throw new SheetPathError('no such sheet', 'missing');
  }
  if (!isInside(realRoot, real)) throw new SheetPathError('sheet links outside the folder', 'outside-folder');
  return real;
}
