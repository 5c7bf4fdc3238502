// The index page: shows the table rows each index message carries.
import { localiseTimes } from './status.js';

/** @typedef {import('../server/serve/protocol.js').ServerMessage} ServerMessage */

/** @param {(message: import('../server/serve/protocol.js').ClientMessage) => void} send */
export function createIndexView(send) {
  const tbody = document.querySelector('table.live-sheets tbody');
  const empty = /** @type {HTMLElement | null} */ (document.querySelector('.live-empty'));

  return {
    follow() {
      send({ type: 'follow', target: 'index' });
    },
    /** @param {ServerMessage} message */
    receive(message) {
      if (message.type !== 'index' || !tbody) return;
      // The rows are the server's own markup, every name in them escaped there.
      tbody.innerHTML = message.rowsHtml;
      localiseTimes(tbody);
      if (empty) empty.hidden = message.sheets.length > 0;
    },
  };
}
