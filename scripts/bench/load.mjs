// Load figures: autocannon against a built server it starts itself on loopback, with its own database.
// Each measured route runs beside GET /api/health (the baseline) in the same run; the ratio is route/baseline.
// Then GET /api/health p99 with driver-design evaluates running at full load beside the same without them,
// and the server's resident memory after all of it beside a minimal NestJS app loaded the same way.
// Every comparison runs in --rounds pairs (reference, then measured), and the line states the median of the
// rounds' ratios: on a machine shared with other work, a burst of that work in one run moves one round only.
//   node scripts/bench/load.mjs [--duration-s 5] [--connections 10] [--rounds 3]
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import autocannon from 'autocannon';
import { repoRoot, run } from '../lib/run.mjs';
import { freePort, startBenchServer } from './bench-server.mjs';

const argValue = (name, fallback) => {
  const index = process.argv.indexOf(name);
  return index === -1 ? fallback : Number(process.argv[index + 1]);
};
const durationS = Math.min(30, Math.max(1, argValue('--duration-s', 5)));
const connections = Math.min(50, Math.max(1, argValue('--connections', 10)));
const rounds = Math.min(9, Math.max(1, argValue('--rounds', 3)));

function median(values) {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

const roundsNote = (ratios) => (rounds > 1 ? `, median of ${ratios.map((ratio) => ratio.toFixed(2)).join(', ')}` : '');

/** Nearest-rank percentile of the response times (autocannon's histogram has p90 and p97.5, not p95). */
function percentile(values, pct) {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((pct / 100) * sorted.length) - 1)];
}

function measure(title, options) {
  return new Promise((resolve, reject) => {
    const responseTimesMs = [];
    const instance = autocannon({ connections, duration: durationS, ...options }, (error, result) => {
      if (error) reject(error);
      else
        resolve({
          title,
          rps: result.requests.average,
          p50Ms: result.latency.p50,
          // A run in a worker thread reports no single responses (its p95 is not known here).
          p95Ms: options.workers ? '-' : Math.round(percentile(responseTimesMs, 95)),
          p99Ms: result.latency.p99,
          errors: result.errors + result.timeouts + result.non2xx,
          total: result.requests.total,
        });
    });
    instance.on('response', (_client, _statusCode, _bytes, responseTimeMs) => responseTimesMs.push(responseTimeMs));
  });
}

/** Resident set size of a process in MiB, from /proc (Linux). */
function rssMiB(pid) {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kib = Number(/VmRSS:\s+(\d+)\s+kB/.exec(status)?.[1] ?? Number.NaN);
  return kib / 1024;
}

/** Starts scripts/bench/minimal-nest-app.cjs; resolves when it answers. */
async function startMinimalNest() {
  const port = await freePort();
  const child = spawn(process.execPath, [path.join(repoRoot, 'scripts', 'bench', 'minimal-nest-app.cjs')], {
    cwd: repoRoot,
    env: { ...process.env, PORT: String(port) },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      if ((await fetch(`${baseUrl}/api/health`)).status === 200) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline || child.exitCode !== null) throw new Error('the minimal NestJS app did not start');
    await new Promise((done) => setTimeout(done, 200));
  }
  const stop = () =>
    new Promise((done) => {
      child.once('exit', done);
      child.kill('SIGTERM');
    });
  return { baseUrl, pid: child.pid, stop };
}

const row = (cells, widths) =>
  cells.map((cell, i) => String(cell)[i === 0 ? 'padEnd' : 'padStart'](widths[i])).join(' ');
const WIDTHS = [46, 7, 8, 7, 7, 7];

function printRun(result) {
  console.log(
    row([result.title, result.rps.toFixed(0), result.p50Ms, result.p95Ms, result.p99Ms, result.errors], WIDTHS),
  );
}

async function main() {
  if ((await run('npm', ['run', 'build', '-w', 'shared'])) !== 0) throw new Error('shared build failed');
  if ((await run('npm', ['run', 'build', '-w', 'server'])) !== 0) throw new Error('server build failed');
  const { baseUrl, stop, pid } = await startBenchServer({ database: 'ladderwright_bench' });
  const lines = [];
  try {
    const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@northfold.test', password: 'Northfold-demo-1' }),
    });
    if (signIn.status !== 200) throw new Error(`demo sign-in answered ${signIn.status}`);
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    const headers = { cookie, 'content-type': 'application/json' };
    const getJson = async (url) => {
      const response = await fetch(url, { headers });
      if (response.status !== 200) throw new Error(`GET ${url} answered ${response.status}`);
      return response.json();
    };
    const templates = await getJson(`${baseUrl}/api/design-templates`);
    const ladder = templates.find((template) => template.document.drive.kind !== 'driver');
    const driver = templates.find((template) => template.document.drive.kind === 'driver');
    if (!ladder || !driver) throw new Error('the demo templates lack a ladder or a driver design');
    const [project] = await getJson(`${baseUrl}/api/projects`);
    const designs = await getJson(`${baseUrl}/api/projects/${project.id}/designs`);
    const design = (designs.items ?? designs)[0];
    const revisionUrl = `${baseUrl}/api/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber ?? 1}`;
    await getJson(revisionUrl);
    const evaluate = (document) => ({
      url: `${baseUrl}/api/analysis/evaluate`,
      method: 'POST',
      headers,
      body: JSON.stringify({ document }),
    });
    for (const body of [evaluate(ladder.document), evaluate(driver.document)]) {
      const check = await fetch(body.url, { method: 'POST', headers, body: body.body });
      if (check.status !== 200) throw new Error(`POST /api/analysis/evaluate answered ${check.status}`);
    }

    console.log(
      `\nload: ${connections} connections, ${durationS} s per run, ${rounds} rounds, loopback, Node ${process.version}`,
    );
    console.log(row(['route', 'req/s', 'p50 ms', 'p95 ms', 'p99 ms', 'errors'], WIDTHS));
    for (const [title, options, target] of [
      ['GET /api/projects', { url: `${baseUrl}/api/projects`, headers }, 0.5],
      ['GET a revision', { url: revisionUrl, headers }, 0.4],
      [`POST /api/analysis/evaluate (${ladder.id})`, evaluate(ladder.document), 0.3],
    ]) {
      const ratios = [];
      for (let round = 0; round < rounds; round += 1) {
        const baseline = await measure('  GET /api/health (baseline)', { url: `${baseUrl}/api/health` });
        const route = await measure(title, options);
        printRun(baseline);
        printRun(route);
        ratios.push(baseline.rps > 0 ? route.rps / baseline.rps : 0);
      }
      lines.push(
        `${title}: ${median(ratios).toFixed(3)} of GET /api/health req/s${roundsNote(ratios)} (target >= ${target})`,
      );
    }

    // GET /api/health p99 alone, then with driver evaluates filling every connection at the same time. The evaluates
    // are sent from an autocannon worker thread, so that reading their large answers never delays this thread's
    // clock on a health answer: the p99 is the server's, not this script's event loop.
    const p99Ratios = [];
    for (let round = 0; round < rounds; round += 1) {
      const quiet = await measure('GET /api/health alone', { url: `${baseUrl}/api/health` });
      const [loaded, heavy] = await Promise.all([
        measure('GET /api/health beside driver evaluates', { url: `${baseUrl}/api/health` }),
        measure(`  POST /api/analysis/evaluate (${driver.id})`, { ...evaluate(driver.document), workers: 1 }),
      ]);
      for (const result of [quiet, loaded, heavy]) printRun(result);
      p99Ratios.push(quiet.p99Ms > 0 ? loaded.p99Ms / quiet.p99Ms : 0);
      if (round === rounds - 1) {
        lines.push(
          `GET /api/health p99 beside driver evaluates: ${loaded.p99Ms} ms against ${quiet.p99Ms} ms alone (last round), ` +
            `${median(p99Ratios).toFixed(2)}x${roundsNote(p99Ratios)} (target <= 2)`,
        );
      }
    }

    // Memory: the server after all of the above, beside a minimal NestJS app after the same health load.
    const serverRss = rssMiB(pid);
    const minimal = await startMinimalNest();
    try {
      const reference = await measure('minimal NestJS GET /api/health', { url: `${minimal.baseUrl}/api/health` });
      printRun(reference);
      const minimalRss = rssMiB(minimal.pid);
      lines.push(
        `server RSS after the load: ${serverRss.toFixed(0)} MiB against ${minimalRss.toFixed(0)} MiB for a minimal ` +
          `NestJS app, ${(serverRss / minimalRss).toFixed(2)}x (target <= 1.5)`,
      );
    } finally {
      await minimal.stop();
    }
  } finally {
    await stop();
  }
  console.log('');
  for (const line of lines) console.log(line);
}

main().catch((error) => {
  console.error(`load: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
