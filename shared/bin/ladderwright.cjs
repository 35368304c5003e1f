#!/usr/bin/env node
// Starts the bundled command line (dist/ladderwright.cjs, built by `npm run build -w shared` and after
// `npm ci`). When the bundle is missing or older than a source file under src/ or cli/ (a change not yet
// built), runs the TypeScript sources through tsx instead, so the command never answers from stale code.
const fs = require('node:fs');
const path = require('node:path');

const root = path.join(__dirname, '..');
const bundle = path.join(root, 'dist', 'ladderwright.cjs');

function newestMtimeMs(dir) {
  let newest = 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestMtimeMs(p));
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.test.ts'))
      newest = Math.max(newest, fs.statSync(p).mtimeMs);
  }
  return newest;
}

function isBundleCurrent() {
  try {
    const builtMs = fs.statSync(bundle).mtimeMs;
    return builtMs >= newestMtimeMs(path.join(root, 'src')) && builtMs >= newestMtimeMs(path.join(root, 'cli'));
  } catch {
    return false;
  }
}

if (isBundleCurrent()) {
  require(bundle);
} else {
  require('tsx/cjs');
  require('../cli/ladderwright.ts');
}
