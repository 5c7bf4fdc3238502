// Bundles the sandbox child (the whole engine) into one CommonJS file after tsc,
// with a loader that runs it from V8's code cache: one script, already compiled,
// instead of about a hundred ES modules (and marked's own), is most of the command
// line's start-up. The sandbox uses the loader only when the bundle is newer than
// the compiled child, so a plain `tsc` never runs a stale bundle.
import { execFileSync } from 'node:child_process';
import { copyFileSync, existsSync } from 'node:fs';
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

const dir = fileURLToPath(new URL('../dist/server/sandbox/', import.meta.url));
const root = fileURLToPath(new URL('..', import.meta.url));

await build({
  entryPoints: [`${dir}child.js`],
  outfile: `${dir}child.bundle.cjs`,
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  minify: true,
  logLevel: 'warning',
  // The engine finds its package (KaTeX's fonts, the stylesheet) from its own file's URL.
  define: { 'import.meta.url': '__bundleUrl' },
  banner: { js: 'var __bundleUrl=require("node:url").pathToFileURL(__filename).href;' },
});
copyFileSync(`${root}scripts/child-loader.cjs`, `${dir}child-loader.cjs`);

// The code cache, made with the flags the sandbox starts its child with (sandbox.ts).
const warmUp = `${root}worksheets/van-and-towed-body.md`;
if (existsSync(warmUp)) {
  execFileSync(process.execPath, ['--max-old-space-size=256', '--stack-size=2000', `${dir}child-loader.cjs`, '--make-cache', warmUp], { stdio: 'inherit' });
}
