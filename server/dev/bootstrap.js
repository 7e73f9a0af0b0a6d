#!/usr/bin/env node
// Entry point of `npm start`, `npm test` and `npm run worker`. Plain Node so that it runs before any
// dependency is installed: it installs them when node_modules is missing or older than
// package-lock.json, then hands over to the TypeScript command in this folder (through tsx).
'use strict';
const { execFileSync } = require('node:child_process');
const crypto = require('node:crypto');
const fs = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '../..');
const commands = { start: './start.ts', test: './test-all.ts', worker: './worker.ts', load: '../cli/load.ts' };
const command = process.argv[2];
if (!commands[command]) {
  console.error(`usage: bootstrap.js ${Object.keys(commands).join('|')}`);
  process.exit(2);
}

function ensureDependencies() {
  const lock = path.join(root, 'package-lock.json');
  const stampFile = path.join(root, 'node_modules', '.parallax-installed');
  const wanted = crypto.createHash('sha256').update(fs.readFileSync(lock)).digest('hex');
  const have = fs.existsSync(stampFile) ? fs.readFileSync(stampFile, 'utf8').trim() : '';
  if (have === wanted) return;
  console.log('[parallax] installing dependencies (npm ci) ...');
  execFileSync('npm', ['ci', '--no-audit', '--no-fund'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' },
  });
  fs.writeFileSync(stampFile, wanted + '\n');
}

ensureDependencies();
require('tsx/cjs');
require(commands[command]).main(process.argv.slice(3)).catch((err) => {
  console.error(`[parallax] ${err && err.message ? err.message : err}`);
  process.exit(1);
});
