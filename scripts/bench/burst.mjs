// A bystander's wait during a burst of 50 saves and design creations, beside the same request on a quiet
// server in the same run. The built server runs in its own process; this process is only the client.
//   node scripts/bench/burst.mjs [--rounds 3]
import { run } from '../lib/run.mjs';
import { startBenchServer } from './bench-server.mjs';

const roundsIndex = process.argv.indexOf('--rounds');
const rounds = Math.min(10, Math.max(1, roundsIndex === -1 ? 3 : Number(process.argv[roundsIndex + 1])));
const BURST = 50;

async function timed(promise) {
  const startedMs = performance.now();
  const response = await promise;
  await response.arrayBuffer();
  return { status: response.status, ms: performance.now() - startedMs };
}

const median = (values) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

async function main() {
  if ((await run('npm', ['run', 'build', '-w', 'shared'])) !== 0) throw new Error('shared build failed');
  if ((await run('npm', ['run', 'build', '-w', 'server'])) !== 0) throw new Error('server build failed');
  const { baseUrl, stop } = await startBenchServer({ database: 'ladderwright_burst' });
  try {
    const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@northfold.test', password: 'Northfold-demo-1' }),
    });
    if (signIn.status !== 200) throw new Error(`demo sign-in answered ${signIn.status}`);
    const headers = {
      cookie: (signIn.headers.get('set-cookie') ?? '').split(';')[0],
      'content-type': 'application/json',
    };
    const post = (url, body) => fetch(url, { method: 'POST', headers, body: JSON.stringify(body) });
    const [project] = await (await fetch(`${baseUrl}/api/projects`, { headers })).json();
    const designsUrl = `${baseUrl}/api/projects/${project.id}/designs`;
    const from = { kind: 'template', templateId: 'ionizerBar' };
    const bystander = () => timed(fetch(`${baseUrl}/api/projects/${project.id}`, { headers }));

    const quietMs = [];
    const burstMs = [];
    let failures = 0;
    for (let round = 0; round < rounds; round += 1) {
      const designs = [];
      for (let i = 0; i < BURST / 2; i += 1)
        designs.push(await (await post(designsUrl, { name: `Burst ${round}-${i}`, from })).json());
      const revision = await (await fetch(`${designsUrl}/${designs[0].id}/revisions/1`, { headers })).json();
      for (let i = 0; i < 5; i += 1) quietMs.push((await bystander()).ms);
      const burst = [
        ...designs.map((design) =>
          post(`${designsUrl}/${design.id}/revisions`, {
            baseRevisionNumber: 1,
            document: revision.document,
            changeNote: 'burst',
          }),
        ),
        ...designs.map((_, i) => post(designsUrl, { name: `Burst new ${round}-${i}`, from })),
      ];
      const during = await bystander();
      burstMs.push(during.ms);
      const statuses = await Promise.all(burst.map((pending) => pending.then((response) => response.status)));
      failures += statuses.filter((status) => status !== 201).length + (during.status === 200 ? 0 : 1);
    }
    const quiet = median(quietMs);
    const loaded = median(burstMs);
    console.log(`\nburst: ${BURST} saves and creations at once, ${rounds} rounds, loopback, Node ${process.version}`);
    console.log(`bystander GET /api/projects/:id quiet (median of ${quietMs.length}): ${quiet.toFixed(0)} ms`);
    console.log(
      `bystander during the burst (median of ${burstMs.length}): ${loaded.toFixed(0)} ms, ${(loaded / quiet).toFixed(1)}x quiet ` +
        `(target < 1000 ms); answers other than 201/200: ${failures}`,
    );
  } finally {
    await stop();
  }
}

main().catch((error) => {
  console.error(`burst: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
