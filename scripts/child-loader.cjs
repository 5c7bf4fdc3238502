// Starts the bundled sandbox child from V8's code cache (written at build time
// after a warm-up run), so that neither the bundle nor the functions a run
// needs are compiled again on every start. A cache that does not fit this node
// or these flags is ignored by V8 and the bundle compiles as usual.
// `node child-loader.cjs --make-cache SHEET.md` runs SHEET.md once and writes the cache.
'use strict';
const { readFileSync, writeFileSync } = require('node:fs');
const Module = require('node:module');
const path = require('node:path');
const vm = require('node:vm');

const bundle = path.join(__dirname, 'child.bundle.cjs');
const cacheFile = path.join(__dirname, 'child.bundle.cache');
const making = process.argv[2] === '--make-cache';

let cachedData;
if (!making) {
  try {
    cachedData = readFileSync(cacheFile);
  } catch {
    cachedData = undefined;
  }
}
const script = new vm.Script(Module.wrap(readFileSync(bundle, 'utf8')), { filename: bundle, cachedData });
if (making) process.send = () => true;
const module_ = { exports: {} };
script.runInThisContext()(module_.exports, Module.createRequire(bundle), module_, bundle, __dirname);

if (making) {
  const sheet = process.argv[3];
  process.emit('message', { id: 0, text: readFileSync(sheet, 'utf8'), opts: { path: sheet, root: path.dirname(sheet), render: false }, limits: { maxSteps: 5e6, maxListLength: 1e5, timeoutMs: 10000 } });
  writeFileSync(cacheFile, script.createCachedData());
}
