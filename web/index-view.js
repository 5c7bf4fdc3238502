// The index page: rebuilds the table of sheets from each index message.
// Titles come from the sheets' front matter, so they are set as text.
import { localTime } from './status.js';

/** @param {(message: object) => void} send */
export function createIndexView(send) {
  const tbody = document.querySelector('table.live-sheets tbody');
  const empty = /** @type {HTMLElement | null} */ (document.querySelector('.live-empty'));

  return {
    follow() {
      send({ type: 'follow', target: 'index' });
    },
    /** @param {any} message */
    receive(message) {
      if (message.type !== 'index' || !tbody) return;
      tbody.replaceChildren(...message.sheets.map(row));
      if (empty) empty.hidden = message.sheets.length > 0;
    },
  };
}

function cell(text, className) {
  const td = document.createElement('td');
  td.textContent = String(text);
  if (className) td.className = className;
  return td;
}

function row(entry) {
  const tr = document.createElement('tr');
  tr.dataset.path = entry.path;
  tr.dataset.state = entry.state;
  const name = document.createElement('td');
  const link = document.createElement('a');
  link.href = '/sheet/' + entry.path.split('/').map(encodeURIComponent).join('/');
  link.textContent = entry.title;
  const where = document.createElement('span');
  where.className = 'live-path';
  where.textContent = entry.path;
  name.append(link, where);
  const errors = entry.errors + (entry.failure ? 1 : 0);
  const when = cell(entry.evaluatedAt ? localTime(entry.evaluatedAt) : entry.state);
  if (entry.failure) when.title = entry.failure;
  tr.append(
    name,
    cell(entry.checksPassed, 'live-num'),
    cell(entry.checksFailed, entry.checksFailed > 0 ? 'live-num live-bad' : 'live-num'),
    cell(errors, errors > 0 ? 'live-num live-bad' : 'live-num'),
    when,
  );
  return tr;
}
