// A load generator in its own process, as outside clients are: fires every request of the plan at once, then
// one bystander GET, and prints each answer's status and the bystander's latency as JSON. Run by
// connection-pool.e2e.test.ts so that the burst's client work does not share the server's event loop.
//   node burst-client.mjs < plan.json   (plan: { baseUrl, cookie, requests: [{ path, body }], bystanderPath })
import { text } from 'node:stream/consumers';

const plan = JSON.parse(await text(process.stdin));
const headers = { cookie: plan.cookie, 'content-type': 'application/json' };

async function send(path, body) {
  const init = body === undefined ? { headers } : { method: 'POST', headers, body: JSON.stringify(body) };
  const response = await fetch(`${plan.baseUrl}${path}`, init);
  await response.arrayBuffer();
  return response.status;
}

// Open the bystander's connection first, so that its wait is the server's and not a connection set-up.
await send(plan.bystanderPath);
const burst = Promise.all(plan.requests.map((request) => send(request.path, request.body)));
const startedMs = performance.now();
const bystanderStatus = await send(plan.bystanderPath);
const bystanderMs = performance.now() - startedMs;
const statuses = await burst;
process.stdout.write(JSON.stringify({ statuses, bystanderStatus, bystanderMs }));
