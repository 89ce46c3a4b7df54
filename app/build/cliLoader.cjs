// The command line's entry, copied by app/build/build-cli.mjs to dist/cli.cjs: it runs the bundle
// beside it (cli-bundle.cjs) from V8's code cache of that bundle (cli-bundle.cache), written when the
// bundle is built, so a command does not compile the 1.9 MB bundle again at every start (about 80 ms
// of a start-up of 250 ms on the machine of bench/results). The cache is only a shortcut: when it is
// missing, was made by another V8 (Electron's, an upgraded Node) or does not match the bundle, V8
// refuses it and compiles the bundle as usual; when the bundle cannot be read or compiled this way,
// it is loaded by require, as any CommonJS file. Either way the command runs the same code.
'use strict';
const { readFileSync, writeFileSync } = require('node:fs');
const { createRequire } = require('node:module');
const { join } = require('node:path');
const { Script } = require('node:vm');

const bundle = join(__dirname, 'cli-bundle.cjs');
const cacheFile = join(__dirname, 'cli-bundle.cache');

let compiled = null;
try {
  let cachedData;
  try {
    cachedData = readFileSync(cacheFile);
  } catch {
    cachedData = undefined;
  }
  // The wrapper Node gives every CommonJS file, so the bundle sees what it would under require.
  const source = `(function (exports, require, module, __filename, __dirname) {${readFileSync(bundle, 'utf8')}\n})`;
  compiled = new Script(source, { filename: bundle, cachedData });
} catch {
  compiled = null;
}

if (compiled === null) {
  require(bundle);
} else {
  // Set only by the build (app/build/build-cli.mjs), which runs a few commands through this file to make the cache.
  if (process.env.CHELATION_LEDGER_WRITE_CODE_CACHE === '1') process.once('exit', () => writeFileSync(cacheFile, compiled.createCachedData()));
  const bundleModule = { exports: {}, filename: bundle, id: bundle, loaded: false };
  compiled.runInThisContext()(bundleModule.exports, createRequire(bundle), bundleModule, bundle, __dirname);
}
