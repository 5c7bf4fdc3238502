// The small status in the page's top bar: live, evaluating, or reconnecting,
// with the time of the last update.

/** @param {string | null | undefined} iso */
export function localTime(iso) {
  if (!iso) return '';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '' : date.toLocaleTimeString();
}

/** @param {HTMLElement | null} element */
export function createStatus(element) {
  const text = element?.querySelector('.live-status-text') ?? null;
  /** @type {string | null} */
  let lastUpdate = null;

  /** @param {'live' | 'evaluating' | 'offline' | 'connecting'} state @param {string} words */
  function show(state, words) {
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
      show('evaluating', 'evaluating…');
    },
    /** @param {number} retryInMs */
    offline(retryInMs) {
      const seconds = Math.max(1, Math.round(retryInMs / 1000));
      show('offline', `server not reachable · retrying in ${seconds} s`);
    },
  };
}
