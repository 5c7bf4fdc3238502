// HTML shells of the two pages. The sheet's own markup comes from the engine
// (already sanitised); everything that comes from the file system or the
// front matter and lands here is escaped. Scripts load from /assets only.
import { escapeHtml } from '../core/index.js';
import type { IndexEntry, SheetCondition, SheetFrameMessage } from './protocol.js';

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

/** The notice above a sheet: why what is shown may not be current. */
export function noticeText(condition: SheetCondition): string | null {
  if (condition.movedTo) return `This sheet was renamed to ${condition.movedTo}.`;
  if (condition.gone) return 'This sheet was deleted. The content below is its last evaluation.';
  if (condition.failure && condition.stale) return `Showing the last good evaluation. ${condition.failure}`;
  if (condition.failure) return condition.failure;
  return null;
}

export function sheetPage(frame: SheetFrameMessage): string {
  const { condition } = frame;
  const notice = noticeText(condition);
  const parts = frame.parts
    .map((p) => `<div class="ws-part live-part" data-key="${escapeHtml(p.key)}" data-hash="${escapeHtml(p.hash)}">${p.html ?? ''}</div>`)
    .join('\n');
  const mainClass = condition.stale ? 'ws-sheet live-main ws-stale' : 'ws-sheet live-main';
  return `${head(`${frame.title} · Wakesheet`)}
<body class="ws-page live-sheet-page" data-sheet="${escapeHtml(frame.sheet)}" data-version="${frame.version}">
${bar(`<span class="live-crumb">${escapeHtml(frame.sheet)}</span>`)}
<div class="live-notice" role="alert"${notice ? '' : ' hidden'}>${notice ? escapeHtml(notice) : ''}</div>
<div class="live-head">${frame.headerHtml ?? ''}</div>
<div class="live-summary">${frame.summaryHtml ?? ''}</div>
<main class="${mainClass}">
${parts}
</main>
<footer class="live-foot">${footText(condition)}</footer>
</body>
</html>
`;
}

function footText(condition: SheetCondition): string {
  if (!condition.evaluatedAt) return 'Not evaluated yet.';
  const ms = condition.elapsedMs === null ? '' : ` in ${condition.elapsedMs} ms`;
  return `Evaluated <time datetime="${escapeHtml(condition.evaluatedAt)}">${escapeHtml(condition.evaluatedAt)}</time>${ms}.`;
}

export function indexPage(folderName: string, entries: IndexEntry[]): string {
  const rows = entries.map(indexRow).join('\n');
  return `${head(`${folderName} · Wakesheet`)}
<body class="live-index-page">
${bar(`<span class="live-crumb">${escapeHtml(folderName)}</span>`)}
<main class="live-index">
<h1>Worksheets in ${escapeHtml(folderName)}</h1>
<table class="live-sheets">
<thead><tr><th>Sheet</th><th>Checks passed</th><th>Checks failed</th><th>Errors</th><th>Last evaluated</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>
<p class="live-empty"${entries.length ? ' hidden' : ''}>No .md sheets in this folder yet. Add one and it appears here.</p>
</main>
</body>
</html>
`;
}

function indexRow(entry: IndexEntry): string {
  const errorCount = entry.errors + (entry.failure ? 1 : 0);
  const num = (bad: boolean) => (bad ? 'live-num live-bad' : 'live-num');
  const when = entry.evaluatedAt
    ? `<time datetime="${escapeHtml(entry.evaluatedAt)}">${escapeHtml(entry.evaluatedAt)}</time>`
    : escapeHtml(entry.state);
  return `<tr data-path="${escapeHtml(entry.path)}" data-state="${entry.state}">
<td><a href="${escapeHtml(sheetUrl(entry.path))}">${escapeHtml(entry.title)}</a><span class="live-path">${escapeHtml(entry.path)}</span></td>
<td class="live-num">${entry.checksPassed}</td><td class="${num(entry.checksFailed > 0)}">${entry.checksFailed}</td><td class="${num(errorCount > 0)}">${errorCount}</td>
<td${entry.failure ? ` title="${escapeHtml(entry.failure)}"` : ''}>${when}</td></tr>`;
}
