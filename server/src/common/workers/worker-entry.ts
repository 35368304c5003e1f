import { existsSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Where a worker-thread entry is. A built server (`npm run build`) has `<name>.js` beside the caller. Run
 * from TypeScript sources (jest with ts-jest, which compiles in memory and writes no .js), the entry is
 * the .ts file: the worker thread loads it through tsx, and `--conditions=source` makes
 * `@ladderwright/shared/*` resolve to the shared sources, as jest's moduleNameMapper does on the main thread.
 */
export function workerEntry(directory: string, name: string): { filename: string; execArgv?: string[] } {
  const compiled = join(directory, `${name}.js`);
  if (existsSync(compiled)) return { filename: compiled };
  return {
    filename: join(directory, `${name}.ts`),
    execArgv: ['--conditions=source', '--import', require.resolve('tsx')],
  };
}
