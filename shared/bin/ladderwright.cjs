#!/usr/bin/env node
// Runs the TypeScript command line straight from source, so no build step is needed after `npm ci`.
require('tsx/cjs');
require('../cli/ladderwright.ts');
