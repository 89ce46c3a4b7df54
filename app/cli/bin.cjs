#!/usr/bin/env node
// Launcher for the built command line (dist/cli.cjs, built by `npm run build`,
// which `npm install` runs through the prepare script).
const path = require('node:path');
const fs = require('node:fs');
const built = path.join(__dirname, '..', '..', 'dist', 'cli.cjs');
if (!fs.existsSync(built)) {
  process.stderr.write('chelation-ledger is not built yet: run "npm install" (or "npm run build") in the project folder.\n');
  process.exit(2);
}
require(built);
