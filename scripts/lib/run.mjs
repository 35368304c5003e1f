// Small process helpers for the root scripts (start, test, bench).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Runs a command to completion with inherited output; resolves to its exit code. */
export function run(command, args, options = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: repoRoot, stdio: 'inherit', ...options });
    child.on('error', (error) => {
      console.error(`[ladderwright] could not run ${command}: ${error.message}`);
      resolve(127);
    });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

/** Runs a command synchronously and returns whether it exited 0 (output hidden). */
export function succeeds(command, args) {
  return spawnSync(command, args, { cwd: repoRoot, stdio: 'ignore' }).status === 0;
}

export function hasCommand(name) {
  return succeeds('sh', ['-c', `command -v ${name}`]);
}

/** Installs npm packages when node_modules is missing (a fresh clone). */
export async function ensureNodeModules() {
  if (existsSync(path.join(repoRoot, 'node_modules', '.package-lock.json'))) return 0;
  console.log('[ladderwright] installing npm packages (npm ci) ...');
  return run('npm', ['ci', '--no-audit', '--no-fund']);
}

/** Installs missing Debian packages: `wanted` maps a command to the package that provides it. */
export async function ensureDebianPackages(wanted) {
  const missing = Object.entries(wanted)
    .filter(([command]) => !hasCommand(command))
    .map(([, pkg]) => pkg);
  if (missing.length === 0) return 0;
  console.log(`[ladderwright] installing Debian packages: ${missing.join(' ')}`);
  const update = await run('apt-get', ['update', '-qq']);
  if (update !== 0) return update;
  return run('apt-get', ['install', '-y', '-qq', ...missing], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

/**
 * Node flags of the server process wherever a script starts it (npm start, the benchmarks). A 2 MiB semi-space
 * for the request thread in place of V8's 16 MiB: a request leaves almost nothing alive (the engine runs on its
 * own threads), so the young generation collects as well while keeping some 25 MiB less resident. A 512 MiB old
 * generation in place of V8's size from the machine's memory (4 GiB here): besides the ceiling (about ten times what
 * the request thread keeps alive, some 45 MiB), V8 then lets the heap grow to about 1.4 times what was alive after
 * the last full collection rather than up to 4 times, so the garbage of a busy spell (requests in flight outlive a
 * young collection and are promoted) is collected at some 60 MiB of heap rather than piling up past 100 MiB.
 * Garbage collection runs on the collecting thread alone (`--single-threaded-gc`), not on V8's helper threads: under
 * load every core is taken (request thread, engine threads, the database, the clients), a helper waits for a core,
 * and the request thread waited for it in its pauses (young collections, freeing dead ArrayBuffers such as an
 * evaluate answer's bytes, the end of a full collection). Traced under driver evaluates at full load
 * (`--trace-gc-nvp`, two 5 s rounds each, load average 11 to 12): the request thread's pauses over 5 ms were 19 and
 * 24 (278 and 393 ms in all, longest 65 and 72 ms) with helpers, 6 and 14 (84 and 333 ms) with only young collections
 * and ArrayBuffer freeing on the thread itself, 9 and 7 (136 and 49 ms, longest 54 and 12 ms) with all of it there.
 * It also keeps an engine thread's collections on that thread, at its niceness, rather than on helpers at the
 * request thread's.
 */
export const SERVER_NODE_FLAGS = ['--max-semi-space-size=2', '--max-old-space-size=512', '--single-threaded-gc'];
