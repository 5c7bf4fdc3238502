#!/usr/bin/env node
// Runs the compiled CLI (npm install builds dist/ through the prepare script).
// A command that evaluates sheets starts its evaluator process first thing, so
// that the evaluator's start-up overlaps this process loading the command line.
const args = process.argv.slice(2);
if (['eval', 'check', 'render'].includes(args[0]) && !args.includes('--help') && !args.includes('-h')) {
  (await import('../dist/server/sandbox/spawn.js')).startEarly();
}
const { main } = await import('../dist/server/cli/main.js');

main(args).then(
  (code) => process.exit(code),
  (err) => {
    console.error(err instanceof Error ? err.stack : err);
    process.exit(70);
  },
);
