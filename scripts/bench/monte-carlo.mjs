// Monte Carlo of full driver simulations on the simulation worker pool: the same members with 1, 2 and 4 worker
// threads, each run timed wall-clock in the same process; the line states the speed-up against 1 worker. The
// members are what a Monte Carlo batch queues (`monteCarloDesigns`), run by the worker entry every app instance
// runs (server/dist/simulations/simulation.worker.js); the queue and the database are left out, so the figure is
// the pool's scaling alone (on several instances each instance's pool adds its threads the same way).
// A member costs some 7 to 10 s of one core (warm steady state two thirds, the 2 ms cold start one third), so 64
// members take about 10 min with 1 worker and 5 min with 2 on a quiet 2-core machine; run it alone on the machine.
//   node scripts/bench/monte-carlo.mjs [--trials 64] [--workers 1,2,4] [--startup-window-s 0.002]
import { availableParallelism, loadavg } from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { createRequire } from 'node:module';
import { Piscina } from 'piscina';
import { repoRoot, run } from '../lib/run.mjs';

const require = createRequire(import.meta.url);
const argValue = (name, fallback) => {
  const index = process.argv.indexOf(name);
  return index === -1 ? fallback : process.argv[index + 1];
};
const trials = Math.min(256, Math.max(1, Number(argValue('--trials', 64))));
const workerCounts = String(argValue('--workers', '1,2,4'))
  .split(',')
  .map(Number)
  .filter((count) => Number.isInteger(count) && count > 0);
const startUpWindowS = Number(argValue('--startup-window-s', 0.002));

async function runAll(members, threads) {
  const pool = new Piscina({
    filename: path.join(repoRoot, 'server', 'dist', 'simulations', 'simulation.worker.js'),
    name: 'runSimulationTask',
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 60_000,
  });
  // Threads up and their modules loaded before the clock starts, as in a running instance.
  await Promise.all(Array.from({ length: threads }, () => pool.run(null, { name: 'warmUp' }).catch(() => undefined)));
  const started = process.hrtime.bigint();
  const outcomes = await Promise.all(
    members.map(({ document }) => {
      const channel = new MessageChannel();
      channel.port1.unref();
      const task = {
        kind: 'full',
        document,
        options: { startUpWindowS },
        progressPort: channel.port2,
        cancelFlag: new Int32Array(new SharedArrayBuffer(4)),
      };
      return pool
        .run(task, { name: 'runSimulationTask', transferList: [channel.port2] })
        .finally(() => channel.port1.close());
    }),
  );
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  await pool.destroy();
  const failed = outcomes.filter((outcome) => !outcome.ok).length;
  return { seconds, failed };
}

async function main() {
  if ((await run('npm', ['run', 'build', '-w', 'shared'])) !== 0) throw new Error('shared build failed');
  if ((await run('npm', ['run', 'build', '-w', 'server'])) !== 0) throw new Error('server build failed');
  const { designExamples } = require(path.join(repoRoot, 'shared', 'dist', 'designs', 'index.js'));
  const { monteCarloDesigns } = require(path.join(repoRoot, 'shared', 'dist', 'sizing', 'index.js'));
  const members = monteCarloDesigns(designExamples.surfaceChargeTester, trials, 1);
  console.log(
    `\nMonte Carlo: ${trials} full simulations of surfaceChargeTester (start-up window ${startUpWindowS} s), ` +
      `${availableParallelism()} cores, Node ${process.version}`,
  );
  const results = new Map();
  for (const threads of workerCounts) {
    const result = await runAll(members, threads);
    results.set(threads, result);
    console.log(
      `${threads} worker(s): ${result.seconds.toFixed(1)} s wall${result.failed ? `, ${result.failed} failed` : ''}, ` +
        `load average ${loadavg()[0].toFixed(1)}`,
    );
  }
  const [referenceThreads] = workerCounts;
  const reference = results.get(referenceThreads);
  console.log('');
  for (const threads of workerCounts.slice(1)) {
    const result = results.get(threads);
    const speedUp = reference.seconds / result.seconds;
    const target =
      threads === 2
        ? ' (target >= 1.8)'
        : threads === 4
          ? ` (target >= 3.5 on 4 cores; this machine has ${availableParallelism()})`
          : '';
    console.log(
      `Monte Carlo of ${trials} full driver simulations, ${threads} workers: ${result.seconds.toFixed(1)} s wall ` +
        `against ${reference.seconds.toFixed(1)} s with ${referenceThreads} worker${referenceThreads === 1 ? '' : 's'}, ${speedUp.toFixed(2)}x${target}` +
        (result.failed || reference.failed ? `, ${result.failed + reference.failed} failed` : ''),
    );
  }
}

main().catch((error) => {
  console.error(`monte-carlo: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
