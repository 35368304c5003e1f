// Bundles the `ladderwright` command line (cli/ladderwright.ts and the shared sources it imports) into one
// CommonJS file, dist/ladderwright.cjs, with the esbuild that is installed locally: bin/ladderwright.cjs
// then starts without compiling TypeScript. Run by `npm run build -w shared` and after `npm ci` (root
// "prepare" script); nothing is downloaded.
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

await build({
  absWorkingDir: root,
  entryPoints: ['cli/ladderwright.ts'],
  outfile: 'dist/ladderwright.cjs',
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  conditions: ['source'],
  packages: 'bundle',
  legalComments: 'none',
  logLevel: 'warning',
});
