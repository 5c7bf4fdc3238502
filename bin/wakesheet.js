#!/usr/bin/env node
// Runs the compiled CLI (npm install builds dist/ through the prepare script).
import { main } from '../dist/server/cli/main.js';

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err) => {
    console.error(err instanceof Error ? err.stack : err);
    process.exit(70);
  },
);
