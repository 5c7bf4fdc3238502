// The sheet page: follows one sheet, applies its updates, shows its
// condition. Every text around the sheet (notice, footer) comes from the server.
import { applyParts, holdPlace, replaceContent } from './apply-update.js';
import { localiseTimes } from './status.js';

/** @typedef {import('../server/serve/protocol.js').SheetUpdate} SheetUpdate */
/** @typedef {import('../server/serve/protocol.js').SheetCondition} SheetCondition */
/** @typedef {import('../server/serve/protocol.js').ServerMessage} ServerMessage */

/** Updates this far apart count as a pause: the sheet is laid out whole again. */
const REST_AFTER_MS = 2000;

/**
 * @param {ReturnType<typeof import('./status.js').createStatus>} status
 * @param {(message: import('../server/serve/protocol.js').ClientMessage) => void} send
 */
export function createSheetView(status, send) {
  const body = document.body;
  const main = /** @type {HTMLElement} */ (document.querySelector('main.live-main'));
  const summary = document.querySelector('.live-summary');
  const header = document.querySelector('.live-head');
  const notice = /** @type {HTMLElement | null} */ (document.querySelector('.live-notice'));
  const foot = document.querySelector('.live-foot');
  /** @type {ReturnType<typeof setTimeout> | undefined} */
  let restTimer;

  function follow() {
    send({ type: 'follow', target: 'sheet', sheet: body.dataset.sheet ?? '' });
  }

  /** @param {SheetUpdate} update */
  function apply(update) {
    if (update.sheet !== body.dataset.sheet) return;
    if (update.base !== null && String(update.base) !== body.dataset.version) return follow();
    const restorePlace = holdPlace(main);
    if (!applyParts(main, update)) return follow();
    if (update.headerHtml !== null && header) replaceContent(header, update.headerHtml);
    if (update.summaryHtml !== null && summary) replaceContent(summary, update.summaryHtml);
    body.dataset.version = String(update.version);
    document.title = `${update.title} · Wakesheet`;
    if (location.pathname !== update.url) history.replaceState(null, '', update.url);
    const record = document.querySelector('a.live-record');
    if (record && record.getAttribute('href') !== update.recordUrl) record.setAttribute('href', update.recordUrl);
    showCondition(update.condition);
    restorePlace(); // after everything above the reader's place has changed, notice included
    if (update.base !== null) updating();
    const { movedTo } = update.condition;
    if (movedTo) {
      // Same sheet under its new name: follow it there without a reload.
      body.dataset.sheet = movedTo;
      const crumb = document.querySelector('.live-crumb');
      if (crumb) crumb.textContent = movedTo;
      follow();
    }
  }

  /**
   * While updates come in, parts out of view are skipped by the browser
   * (style.css, .live-updating); once they pause, the sheet is laid out whole
   * again, so that it prints and is captured whole.
   */
  function updating() {
    // Turned on once this update has been laid out and painted, never under it:
    // the browser records each part's size after a frame, and a part it starts
    // skipping keeps the size it recorded last.
    requestAnimationFrame(() => requestAnimationFrame(() => main.classList.add('live-updating')));
    clearTimeout(restTimer);
    restTimer = setTimeout(() => main.classList.remove('live-updating'), REST_AFTER_MS);
  }

  /** @param {SheetCondition} condition */
  function showCondition(condition) {
    main.classList.toggle('ws-stale', condition.stale);
    if (notice) {
      notice.hidden = condition.notice === null;
      notice.textContent = condition.notice ?? '';
    }
    if (foot) {
      foot.innerHTML = condition.footHtml;
      localiseTimes(foot);
    }
    status.live(condition.evaluatedAt);
  }

  return {
    follow,
    /** @param {ServerMessage} message */
    receive(message) {
      if (message.type === 'sheet') apply(message);
      else if (message.type === 'busy' && message.sheet === body.dataset.sheet) status.evaluating();
      else if (message.type === 'progress' && message.sheet === body.dataset.sheet) status.progress(message.line, message.done, message.total);
    },
  };
}
