// Load figures: autocannon against a built server it starts itself on loopback, with its own database.
// Each measured route runs beside GET /api/health (the baseline) in the same run; the ratio is route/baseline.
//   node scripts/bench/load.mjs [--duration-s 5] [--connections 10]
import autocannon from 'autocannon';
import { run } from '../lib/run.mjs';
import { startBenchServer } from './bench-server.mjs';

const argValue = (name, fallback) => {
  const index = process.argv.indexOf(name);
  return index === -1 ? fallback : Number(process.argv[index + 1]);
};
const durationS = Math.min(30, Math.max(1, argValue('--duration-s', 5)));
const connections = Math.min(50, Math.max(1, argValue('--connections', 10)));

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
          p95Ms: Math.round(percentile(responseTimesMs, 95)),
          p99Ms: result.latency.p99,
          errors: result.errors + result.timeouts + result.non2xx,
          total: result.requests.total,
        });
    });
    instance.on('response', (_client, _statusCode, _bytes, responseTimeMs) => responseTimesMs.push(responseTimeMs));
  });
}

async function main() {
  if ((await run('npm', ['run', 'build', '-w', 'shared'])) !== 0) throw new Error('shared build failed');
  if ((await run('npm', ['run', 'build', '-w', 'server'])) !== 0) throw new Error('server build failed');
  const { baseUrl, stop } = await startBenchServer({ database: 'ladderwright_bench' });
  try {
    const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@northfold.test', password: 'Northfold-demo-1' }),
    });
    if (signIn.status !== 200) throw new Error(`demo sign-in answered ${signIn.status}`);
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    const headers = { cookie, 'content-type': 'application/json' };
    const templates = await (await fetch(`${baseUrl}/api/design-templates`, { headers })).json();
    const document = templates[0]?.document;
    if (!document) throw new Error('no demo design template to evaluate');
    const evaluateBody = JSON.stringify({ document });
    const check = await fetch(`${baseUrl}/api/analysis/evaluate`, { method: 'POST', headers, body: evaluateBody });
    if (check.status !== 200) throw new Error(`POST /api/analysis/evaluate answered ${check.status}`);

    const rows = [];
    for (const [title, options] of [
      ['GET /api/projects', { url: `${baseUrl}/api/projects`, headers }],
      [
        `POST /api/analysis/evaluate (${templates[0].id})`,
        { url: `${baseUrl}/api/analysis/evaluate`, method: 'POST', headers, body: evaluateBody },
      ],
    ]) {
      const baseline = await measure('GET /api/health (baseline)', { url: `${baseUrl}/api/health` });
      const route = await measure(title, options);
      rows.push({ route, baseline });
    }

    console.log(`\nload: ${connections} connections, ${durationS} s per run, loopback, Node ${process.version}`);
    console.log(
      'route                                         req/s   p50 ms  p95 ms  p99 ms  errors  | baseline req/s  ratio',
    );
    for (const { route, baseline } of rows) {
      const ratio = baseline.rps > 0 ? route.rps / baseline.rps : 0;
      console.log(
        `${route.title.padEnd(44)} ${route.rps.toFixed(0).padStart(6)} ${String(route.p50Ms).padStart(8)} ${String(route.p95Ms).padStart(7)} ${String(route.p99Ms).padStart(7)} ${String(route.errors).padStart(7)}  | ${baseline.rps.toFixed(0).padStart(14)}  ${ratio.toFixed(3)}`,
      );
      console.log(
        `${'  baseline GET /api/health'.padEnd(44)} ${baseline.rps.toFixed(0).padStart(6)} ${String(baseline.p50Ms).padStart(8)} ${String(baseline.p95Ms).padStart(7)} ${String(baseline.p99Ms).padStart(7)} ${String(baseline.errors).padStart(7)}`,
      );
    }
  } finally {
    await stop();
  }
}

main().catch((error) => {
  console.error(`load: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
