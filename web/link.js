// One WebSocket to the server that comes back by itself: after a drop it
// retries with a growing delay (with jitter, so many tabs do not reconnect in
// step) and calls onOpen again, where the page asks for a fresh copy. A close
// with NO_SUCH_SHEET (the sheet was deleted and let go) ends it for good.

const FIRST_DELAY_MS = 200;
const MAX_DELAY_MS = 5000;
/** The server's close code for a sheet that no longer exists (serve/live.ts). */
const NO_SUCH_SHEET = 4404;

/**
 * @param {{
 *   onOpen: () => void,
 *   onMessage: (message: any) => void,
 *   onDown: (retryInMs: number) => void,
 *   onGone: () => void,
 * }} handlers
 */
export function openLink(handlers) {
  const url = `${location.protocol === 'https:' ? 'wss' : 'ws'}://${location.host}/live`;
  let delay = FIRST_DELAY_MS;
  /** @type {WebSocket | null} */
  let socket = null;

  function connect() {
    const ws = new WebSocket(url);
    socket = ws;
    ws.addEventListener('open', () => {
      delay = FIRST_DELAY_MS;
      handlers.onOpen();
    });
    ws.addEventListener('message', (event) => {
      let message;
      try {
        message = JSON.parse(event.data);
      } catch {
        return;
      }
      handlers.onMessage(message);
    });
    ws.addEventListener('close', (event) => {
      if (socket !== ws) return;
      if (event.code === NO_SUCH_SHEET) {
        socket = null;
        handlers.onGone();
        return;
      }
      const wait = Math.round(delay * (0.8 + Math.random() * 0.4));
      delay = Math.min(delay * 2, MAX_DELAY_MS);
      handlers.onDown(wait);
      setTimeout(connect, wait);
    });
  }

  connect();
  return {
    /** @param {object} message */
    send(message) {
      if (socket && socket.readyState === WebSocket.OPEN) socket.send(JSON.stringify(message));
    },
  };
}
