#!/usr/bin/env node
// Runs the compiled CLI (npm install builds dist/ through the prepare script).
// The exit code is set, not forced: process.exit() would cut off output still
// on its way to a pipe (stdout to a pipe is asynchronous), so the process ends
// by itself once everything it printed has been written.
import { main } from '../dist/server/cli/main.js';

// A reader that stops early (`| head`) is not an error of ours.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (err) => {
    if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw err;
  });
}

function finish(code) {
  process.exitCode = code;
  // Should anything still hold the event loop once the output is out, end anyway.
  const flushed = () => setTimeout(() => process.exit(code), 2000).unref();
  process.stdout.write('', () => process.stderr.write('', flushed));
}

main(process.argv.slice(2)).then(finish, (err) => {
  console.error(err instanceof Error ? err.stack : err);
  finish(70);
});
