// The sheet page: follows one sheet, applies frames, shows its condition.
import { holdPlace, patchParts, replaceContent } from './patch.js';
import { localTime } from './status.js';

/**
 * @param {ReturnType<typeof import('./status.js').createStatus>} status
 * @param {(message: object) => void} send
 */
export function createSheetView(status, send) {
  const body = document.body;
  const main = /** @type {HTMLElement} */ (document.querySelector('main.live-main'));
  const summary = document.querySelector('.live-summary');
  const header = document.querySelector('.live-head');
  const notice = /** @type {HTMLElement | null} */ (document.querySelector('.live-notice'));
  const foot = document.querySelector('.live-foot');
  /** Says where the page came from after following a rename, until the next change. */
  let renameNote = null;

  function follow() {
    send({ type: 'follow', target: 'sheet', sheet: body.dataset.sheet });
  }

  /** @param {import('./patch.js').SheetFrame} frame */
  function applyFrame(frame) {
    if (frame.sheet !== body.dataset.sheet) return;
    if (frame.base !== null && String(frame.base) !== body.dataset.version) return follow();
    const restorePlace = holdPlace(main);
    if (!patchParts(main, frame)) return follow();
    if (frame.base !== null) renameNote = null;
    if (frame.headerHtml !== null && header) replaceContent(header, frame.headerHtml);
    if (frame.summaryHtml !== null && summary) replaceContent(summary, frame.summaryHtml);
    body.dataset.version = String(frame.version);
    document.title = `${frame.title} · Wakesheet`;
    showCondition(frame.condition);
    restorePlace(); // after everything above the reader's place has changed, notice included
    const { movedTo } = frame.condition;
    if (movedTo) {
      // Same sheet under its new name: follow it there without a reload.
      renameNote = `Renamed from ${frame.sheet} to ${movedTo}; following it.`;
      body.dataset.sheet = movedTo;
      history.replaceState(null, '', '/sheet/' + movedTo.split('/').map(encodeURIComponent).join('/'));
      const crumb = document.querySelector('.live-crumb');
      if (crumb) crumb.textContent = movedTo;
      follow();
    }
  }

  /** @param {import('./patch.js').SheetCondition} condition */
  function showCondition(condition) {
    main.classList.toggle('ws-stale', condition.stale);
    const text = noticeText(condition) ?? renameNote;
    if (notice) {
      notice.hidden = text === null;
      notice.textContent = text ?? '';
    }
    if (foot) {
      foot.textContent = condition.evaluatedAt
        ? `Evaluated ${localTime(condition.evaluatedAt)}${condition.elapsedMs === null ? '' : ` in ${condition.elapsedMs} ms`}.`
        : 'Not evaluated yet.';
    }
    status.live(condition.evaluatedAt);
  }

  return {
    follow,
    /** @param {any} message */
    receive(message) {
      if (message.type === 'sheet') applyFrame(message);
      else if (message.type === 'busy' && message.sheet === body.dataset.sheet) status.evaluating();
    },
  };
}

/** Mirrors noticeText in server/serve/pages.ts. */
function noticeText(condition) {
  if (condition.movedTo) return `This sheet was renamed to ${condition.movedTo}.`;
  if (condition.gone) return 'This sheet was deleted. The content below is its last evaluation.';
  if (condition.failure && condition.stale) return `Showing the last good evaluation. ${condition.failure}`;
  if (condition.failure) return condition.failure;
  return null;
}
