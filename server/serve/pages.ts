// HTML shells of the two pages, and every piece of text the live page shows
// around a sheet (notice, footer, index rows): the page takes these from the
// server's messages rather than computing them again. The sheet's own markup
// comes from the engine (already sanitised); everything that comes from the
// file system or the front matter and lands here is escaped. Scripts load
// from /assets only.
import { countText, escapeHtml, nearestWord } from '../core/index.js';
import type { IndexEntry, SheetCondition, SheetUpdate } from './protocol.js';

/** URL of a sheet's page, each path segment encoded. */
export function sheetUrl(sheet: string): string {
  return '/sheet/' + sheet.split('/').map(encodeURIComponent).join('/');
}

function head(title: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<link rel="icon" href="/assets/favicon.svg" type="image/svg+xml">
<link rel="stylesheet" href="/assets/katex/katex.min.css">
<link rel="stylesheet" href="/assets/style.css">
<script type="module" src="/assets/client.js"></script>
</head>`;
}

function bar(crumb: string): string {
  return `<header class="live-bar">
<nav class="live-nav"><a class="live-home" href="/">Wakesheet</a>${crumb}</nav>
<p class="live-status" role="status" aria-live="polite" data-state="offline"><span class="live-dot"></span><span class="live-status-text">not connected</span></p>
</header>`;
}

export interface NoticeFacts extends Pick<SheetCondition, 'movedTo' | 'gone' | 'failure' | 'stale'> {
  path: string;
  movedFrom: string | null;
}

/** The notice above a sheet: why what is shown may not be current, or that it was just renamed. */
export function noticeText(condition: NoticeFacts): string | null {
  if (condition.movedTo) return `This sheet was renamed to ${condition.movedTo}.`;
  if (condition.gone) return 'This sheet was deleted. The content below is its last evaluation.';
  if (condition.failure && condition.stale) return `Showing the last good evaluation. ${condition.failure}`;
  if (condition.failure) return condition.failure;
  if (condition.movedFrom) return `Renamed from ${condition.movedFrom} to ${condition.path}.`;
  return null;
}

/** The footer under a sheet: when it was evaluated and how long that took. */
export function footHtml(evaluatedAt: string | null, elapsedMs: number | null): string {
  if (!evaluatedAt) return 'Not evaluated yet.';
  const ms = elapsedMs === null ? '' : ` in ${elapsedMs} ms`;
  return `Evaluated ${timeHtml(evaluatedAt)}${ms}.`;
}

/** A time the page shows in the reader's own time zone (the ISO text until then). */
function timeHtml(iso: string): string {
  return `<time datetime="${escapeHtml(iso)}">${escapeHtml(iso)}</time>`;
}

export function partHtml(key: string, hash: string, html: string): string {
  return `<div class="ws-part live-part" data-part="${escapeHtml(key)}" data-hash="${escapeHtml(hash)}">${html}</div>`;
}

/** Where a sheet's set-up record downloads from. */
export function recordUrl(sheet: string): string {
  return '/record/' + sheet.split('/').map(encodeURIComponent).join('/');
}

export function sheetPage(update: SheetUpdate): string {
  const { condition } = update;
  const parts = update.parts.map((p) => partHtml(p.key, p.hash, p.html ?? '')).join('\n');
  const mainClass = condition.stale ? 'ws-sheet live-main ws-stale' : 'ws-sheet live-main';
  return `${head(`${update.title} · Wakesheet`)}
<body class="ws-page live-sheet-page" data-sheet="${escapeHtml(update.sheet)}" data-version="${update.version}">
${bar(`<span class="live-crumb">${escapeHtml(update.sheet)}</span><a class="live-record" href="${escapeHtml(recordUrl(update.sheet))}" download>download the record</a>`)}
<div class="live-notice" role="alert"${condition.notice ? '' : ' hidden'}>${condition.notice ? escapeHtml(condition.notice) : ''}</div>
<div class="live-head">${update.headerHtml ?? ''}</div>
<div class="live-summary">${update.summaryHtml ?? ''}</div>
<main class="${mainClass}">
${parts}
</main>
<footer class="live-foot">${condition.footHtml}</footer>
</body>
</html>
`;
}

export function indexPage(folderName: string, entries: IndexEntry[]): string {
  return `${head(`${folderName} · Wakesheet`)}
<body class="live-index-page">
${bar(`<span class="live-crumb">${escapeHtml(folderName)}</span>`)}
<main class="live-index">
<h1>Worksheets</h1>
<p class="live-folder">The folder <code>${escapeHtml(folderName)}</code>: ${escapeHtml(countText(entries.length, 'sheet'))}, each updated as it is saved.</p>
<table class="live-sheets">
<thead><tr><th>Sheet</th><th class="live-num">Checks passed</th><th class="live-num">Checks failed</th><th class="live-num">Errors</th><th>Last evaluated</th></tr></thead>
<tbody>
${indexRowsHtml(entries)}
</tbody>
</table>
<p class="live-empty"${entries.length ? ' hidden' : ''}>No .md sheets in this folder yet. Add one and it appears here.</p>
</main>
</body>
</html>
`;
}

/**
 * The page for an address that names no sheet here (a typo, a sheet renamed or
 * deleted): says so, offers the nearest sheet by name, and links the index.
 */
export function missingSheetPage(folderName: string, asked: string, entries: IndexEntry[]): string {
  const near = nearestWord(asked, entries.map((e) => e.path));
  const hint = near ? `<p>Did you mean <a href="${escapeHtml(entries.find((e) => e.path === near)!.url)}">${escapeHtml(near)}</a>?</p>` : '';
  return `${head(`No such sheet · Wakesheet`)}
<body class="live-index-page">
${bar(`<span class="live-crumb">${escapeHtml(folderName)}</span>`)}
<main class="live-index">
<h1>No such sheet</h1>
<p>There is no sheet <code>${escapeHtml(asked)}</code> in the folder <code>${escapeHtml(folderName)}</code>.</p>
${hint}<p><a href="/">The sheets of this folder</a> (${escapeHtml(countText(entries.length, 'sheet'))})</p>
</main>
</body>
</html>
`;
}

export function indexRowsHtml(entries: IndexEntry[]): string {
  return entries.map(indexRow).join('\n');
}

function indexRow(entry: IndexEntry): string {
  const errorCount = entry.errors + (entry.failure ? 1 : 0);
  const num = (bad: boolean) => (bad ? 'live-num live-bad' : 'live-num');
  const when = entry.evaluatedAt ? timeHtml(entry.evaluatedAt) : escapeHtml(entry.state);
  return `<tr data-path="${escapeHtml(entry.path)}" data-state="${entry.state}">
<td><a href="${escapeHtml(entry.url)}">${escapeHtml(entry.title)}</a><span class="live-path">${escapeHtml(entry.path)}</span></td>
<td class="live-num">${entry.checksPassed}</td><td class="${num(entry.checksFailed > 0)}">${entry.checksFailed}</td><td class="${num(errorCount > 0)}">${errorCount}</td>
<td${entry.failure ? ` title="${escapeHtml(entry.failure)}"` : ''}>${when}</td></tr>`;
}
