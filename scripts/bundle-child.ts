// Bundles the sandbox child (the whole engine) into one file after tsc:
// loading one module instead of about a hundred (and marked's and yaml's own)
// is most of the command line's start-up. The sandbox uses the bundle only
// when it is newer than the compiled child, so a plain `tsc` never runs a stale one.
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

const dir = fileURLToPath(new URL('../dist/server/sandbox/', import.meta.url));

await build({
  entryPoints: [`${dir}child.js`],
  outfile: `${dir}child.bundle.mjs`,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  minify: true,
  logLevel: 'warning',
  // CommonJS packages inside an ES module bundle need a require of their own.
  banner: { js: "import { createRequire as __bundleRequire } from 'node:module'; const require = __bundleRequire(import.meta.url);" },
});
