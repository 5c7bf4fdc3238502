// The small status in the page's top bar: live, evaluating, or reconnecting,
// with the time of the last update.

/** @param {string | null | undefined} iso */
export function localTime(iso) {
  if (!iso) return '';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '' : date.toLocaleTimeString();
}

/**
 * Server-rendered times are ISO strings in <time datetime>; show them in the
 * reader's time zone.
 * @param {ParentNode} root
 */
export function localiseTimes(root) {
  for (const time of root.querySelectorAll('time[datetime]')) {
    const shown = localTime(time.getAttribute('datetime'));
    if (shown) time.textContent = shown;
  }
}

/**
 * Most evaluations finish in a few tens of milliseconds: saying "evaluating"
 * for those only makes the bar flicker (and costs the browser frames while
 * the evaluator wants the processor). Say it once one has taken this long.
 */
const EVALUATING_AFTER_MS = 150;

/** @param {HTMLElement | null} element */
export function createStatus(element) {
  const text = element?.querySelector('.live-status-text') ?? null;
  /** @type {string | null} */
  let lastUpdate = null;
  /** @type {ReturnType<typeof setTimeout> | null} */
  let pending = null;

  /** @param {'live' | 'evaluating' | 'offline' | 'connecting'} state @param {string} words */
  function show(state, words) {
    if (pending !== null) clearTimeout(pending);
    pending = null;
    if (!element || !text) return;
    element.dataset.state = state;
    text.textContent = words;
  }

  return {
    connecting() {
      show('connecting', 'connecting…');
    },
    /** @param {string | null} [evaluatedAt] */
    live(evaluatedAt) {
      if (evaluatedAt) lastUpdate = evaluatedAt;
      show('live', lastUpdate ? `live · updated ${localTime(lastUpdate)}` : 'live');
    },
    evaluating() {
      if (pending !== null || element?.dataset.state === 'evaluating') return;
      pending = setTimeout(() => show('evaluating', 'evaluating…'), EVALUATING_AFTER_MS);
    },
    /**
     * A long statement is on its way (the server tells only past a moment).
     * @param {number} line @param {number} done @param {number} total
     */
    progress(line, done, total) {
      const share = total > 0 ? Math.floor((100 * done) / total) : 0;
      show('evaluating', `evaluating… line ${line}: ${done.toLocaleString('en')} of ${total.toLocaleString('en')} (${share} %)`);
    },
    /** The sheet was deleted: what the page shows is all there is. */
    gone() {
      show('offline', 'this sheet no longer exists on the server');
    },
    /** @param {number} retryInMs */
    offline(retryInMs) {
      const seconds = Math.max(1, Math.round(retryInMs / 1000));
      show('offline', `server not reachable · retrying in ${seconds} s`);
    },
  };
}
