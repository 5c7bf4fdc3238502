// Entry point of the browser client, loaded by both pages as a module.
import { createIndexView } from './index-view.js';
import { openLink } from './link.js';
import { createSheetView } from './sheet-view.js';
import { createStatus, localTime } from './status.js';

const status = createStatus(document.querySelector('.live-status'));
status.connecting();

// Server-rendered times are ISO strings; show them in the reader's time zone.
for (const time of document.querySelectorAll('time[datetime]')) {
  const shown = localTime(time.getAttribute('datetime'));
  if (shown) time.textContent = shown;
}

const isSheet = document.body.classList.contains('live-sheet-page');
const link = openLink({
  onOpen: () => {
    status.live();
    view.follow();
  },
  onMessage: (message) => {
    view.receive(message);
    if (!isSheet) status.live(new Date().toISOString());
  },
  onDown: (retryInMs) => status.offline(retryInMs),
});
const send = (message) => link.send(message);
const view = isSheet ? createSheetView(status, send) : createIndexView(send);

// A printed record shows everything: open every <details> while printing.
/** @type {HTMLDetailsElement[]} */
let openedForPrint = [];
window.addEventListener('beforeprint', () => {
  openedForPrint = [...document.querySelectorAll('details:not([open])')];
  for (const d of openedForPrint) d.open = true;
});
window.addEventListener('afterprint', () => {
  for (const d of openedForPrint) d.open = false;
  openedForPrint = [];
});
