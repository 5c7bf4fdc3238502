// The express app: the index, each sheet's page and the static assets (the
// client from web/, KaTeX's stylesheet and fonts from node_modules). Every
// response carries the security headers; requests naming another host are
// refused before any route runs.
import path from 'node:path';
import express, { type NextFunction, type Request, type Response } from 'express';
import { indexPage, missingSheetPage, sheetPage } from './pages.js';
import { ALLOWED_METHODS, checkSheetPath, resolveSheetFile, SECURITY_HEADERS, SheetPathError, type HostPolicy } from './security.js';
import { katexDistDir, packageRoot } from '../read/paths.js';
import type { SheetStore } from './store.js';

export interface AppContext {
  store: SheetStore;
  realRoot: string;
  folderName: string;
  /** Known once the server is listening (the port may have been 0). */
  policy: () => HostPolicy | null;
}

/** How long a page request waits for a sheet's first evaluation. */
const FIRST_EVALUATION_WAIT_MS = 10_000;
const INDEX_WAIT_MS = 1500;

export function createApp(context: AppContext): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('etag', false);

  app.use((req: Request, res: Response, next: NextFunction) => {
    res.set(SECURITY_HEADERS);
    const policy = context.policy();
    if (!policy || !policy.allowsHost(req.headers.host)) {
      res.status(403).type('text/plain').send('Forbidden: this server answers only to its own address.\n');
      return;
    }
    if (!ALLOWED_METHODS.has(req.method)) {
      res.status(405).set('Allow', 'GET, HEAD').type('text/plain').send('Only GET and HEAD: the server never changes sheets.\n');
      return;
    }
    next();
  });

  app.get('/', async (_req, res) => {
    // Right after start-up, give the first evaluations a moment so the index
    // has figures in it; the page updates itself afterwards anyway.
    await Promise.race([context.store.whenAllEvaluated(), delay(INDEX_WAIT_MS)]);
    res.type('html').set('Cache-Control', 'no-store').send(indexPage(context.folderName, context.store.index()));
  });

  app.use('/sheet', (req, res, next) => {
    void serveSheet(context, req, res).catch(next);
  });
  app.use('/record', (req, res, next) => {
    void serveRecord(context, req, res).catch(next);
  });

  const katex = katexDistDir();
  app.use('/assets/katex', (req, res, next) => {
    // Only the stylesheet and its fonts: the page never loads KaTeX's scripts.
    if (req.path === '/katex.min.css' || /^\/fonts\/[\w.-]+\.(woff2?|ttf)$/.test(req.path)) next();
    else res.status(404).type('text/plain').send('Not found\n');
  });
  app.use('/assets/katex', express.static(katex, { index: false, dotfiles: 'ignore', maxAge: '1d' }));
  app.use(
    '/assets',
    express.static(path.join(packageRoot(), 'web'), {
      index: false,
      dotfiles: 'ignore',
      setHeaders: (res) => res.setHeader('Cache-Control', 'no-cache'),
    }),
  );

  app.use((_req, res) => {
    res.status(404).type('text/plain').send('Not found\n');
  });
  app.use((error: unknown, _req: Request, res: Response, _next: NextFunction) => {
    console.error('wakesheet serve: request failed:', error);
    if (!res.headersSent) res.status(500).type('text/plain').send('Internal error\n');
  });
  return app;
}

/** The sheet a request's path names, once every check holds; null (after a 404) otherwise. */
async function requestedSheet(context: AppContext, req: Request, res: Response): Promise<string | null> {
  const notFound = () => {
    sendMissingSheet(context, req, res);
    return null;
  };
  let sheet: string;
  try {
    const raw = req.path.replace(/^\//, '');
    sheet = checkSheetPath(raw.split('/').map((s) => decodeURIComponent(s)).join('/'));
    if (raw.split('/').some((s) => decodeURIComponent(s).includes('/'))) throw new SheetPathError('encoded slash', 'bad-path');
  } catch {
    return notFound();
  }
  const { store } = context;
  // A deleted sheet stays with the pages that show it (they were told), not at its URL.
  if (!store.has(sheet)) return notFound();
  // Defence in depth: the store only lists files inside the folder, but
  // check the real path again before showing anything.
  try {
    await resolveSheetFile(context.realRoot, sheet);
  } catch (error) {
    if (!(error instanceof SheetPathError && error.code === 'missing')) return notFound();
  }
  await Promise.race([store.whenEvaluated(sheet), delay(FIRST_EVALUATION_WAIT_MS)]);
  return sheet;
}

/** The set-up record of a sheet's last good evaluation, as a file to download: the one `wakesheet render` writes. */
async function serveRecord(context: AppContext, req: Request, res: Response): Promise<void> {
  const sheet = await requestedSheet(context, req, res);
  if (sheet === null) return;
  const record = context.store.record(sheet);
  if (!record) {
    res.status(409).type('text/plain').send('This sheet has no evaluation to record yet.\n');
    return;
  }
  const name = path.posix.basename(sheet, '.md').replace(/[^\w.-]+/g, '_');
  res.type('html').set({ 'Cache-Control': 'no-store', 'Content-Disposition': `attachment; filename="${name}-record.html"` }).send(record);
}

async function serveSheet(context: AppContext, req: Request, res: Response): Promise<void> {
  const sheet = await requestedSheet(context, req, res);
  if (sheet === null) return;
  const { store } = context;
  const update = store.complete(sheet);
  if (!update) {
    sendMissingSheet(context, req, res);
    return;
  }
  res.type('html').set('Cache-Control', 'no-store').send(sheetPage(update));
}

function sendMissingSheet(context: AppContext, req: Request, res: Response): void {
  let asked: string;
  try {
    asked = decodeURIComponent(req.path.replace(/^\//, ''));
  } catch {
    asked = req.path.replace(/^\//, '');
  }
  res.status(404).type('html').set('Cache-Control', 'no-store').send(missingSheetPage(context.folderName, asked, context.store.index()));
}

function delay(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms).unref());
}
