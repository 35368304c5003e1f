// `npm run bench -- NAME [ARGS…]`: runs one benchmark of this folder (NAME.bench.ts through tsx, or NAME.mjs with
// node); with no name, lists them. Benchmarks print each figure beside its reference measured in the same run;
// they are not tests, and CI does not run them.
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { repoRoot, run } from '../lib/run.mjs';

const folder = path.join(repoRoot, 'scripts', 'bench');
const helpers = new Set(['run', 'bench-server']);
const benches = readdirSync(folder)
  .flatMap((file) => {
    const match = /^(.+?)(\.bench\.ts|\.mjs)$/.exec(file);
    return match && !helpers.has(match[1]) ? [{ name: match[1], file, isTs: match[2] === '.bench.ts' }] : [];
  })
  .sort((a, b) => a.name.localeCompare(b.name));

const [name, ...args] = process.argv.slice(2);
const bench = benches.find((candidate) => candidate.name === name);
if (!bench) {
  if (name) console.error(`no benchmark named "${name}"`);
  console.log(`usage: npm run bench -- NAME [ARGS…]\nbenchmarks: ${benches.map((b) => b.name).join(', ')}`);
  process.exit(name ? 2 : 0);
}
const file = path.join(folder, bench.file);
process.exit(await (bench.isTs ? run('npx', ['tsx', file, ...args]) : run('node', [file, ...args])));
