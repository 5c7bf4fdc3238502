// Entry point of the browser client, loaded by both pages as a module.
import { createIndexView } from './index-view.js';
import { openLink } from './link.js';
import { createSheetView } from './sheet-view.js';
import { createStatus, localiseTimes } from './status.js';

const status = createStatus(document.querySelector('.live-status'));
status.connecting();
localiseTimes(document);

const isSheet = document.body.classList.contains('live-sheet-page');
const link = openLink({
  onOpen: () => {
    status.live();
    view.follow();
  },
  onMessage: (/** @type {import('../server/serve/protocol.js').ServerMessage} */ message) => {
    view.receive(message);
    if (!isSheet) status.live(new Date().toISOString());
  },
  onDown: (retryInMs) => status.offline(retryInMs),
  onGone: () => status.gone(),
});
const send = (/** @type {import('../server/serve/protocol.js').ClientMessage} */ message) => link.send(message);
const view = isSheet ? createSheetView(status, send) : createIndexView(send);

// A printed record shows everything: open every <details> while printing.
/** @type {HTMLDetailsElement[]} */
let openedForPrint = [];
window.addEventListener('beforeprint', () => {
  openedForPrint = [...document.querySelectorAll('details:not([open])')].filter((d) => d instanceof HTMLDetailsElement);
  for (const d of openedForPrint) d.open = true;
});
window.addEventListener('afterprint', () => {
  for (const d of openedForPrint) d.open = false;
  openedForPrint = [];
});
