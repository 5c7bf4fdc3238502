#!/usr/bin/env node
// The exit code is set, not forced: process.exit() would cut off output still
// on its way to a pipe (stdout to a pipe is asynchronous), so the process ends
// by itself once everything it printed has been written.

// A command that evaluates sheets starts its evaluator process first thing, so
// that the evaluator's start-up overlaps this process loading the command line.
const args = process.argv.slice(2);
if (['eval', 'check', 'render', 'verify', 'export'].includes(args[0]) && !args.includes('--help') && !args.includes('-h')) {
  (await import('../dist/server/sandbox/spawn.js')).startEarly();
}
const { main } = await import('../dist/server/cli/main.js');

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

main(args).then(finish, (err) => {
  console.error(err instanceof Error ? err.stack : err);
  finish(70);
});
