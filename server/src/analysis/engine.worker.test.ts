import { isMainThread, MessageChannel, receiveMessageOnPort } from 'node:worker_threads';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { packCheckRules } from '@ladderwright/shared/api';
import { designExamples, validateDesign } from '@ladderwright/shared/designs';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import { transferableSymbol, valueSymbol } from 'piscina';
import { engineTaskEntry, runEngineTask } from './engine.worker';

const document = designExamples.surfaceChargeTester;

/** `actual` and `expected` have the same shape and text, and numbers equal within 1e-8 relative. */
function expectSameJson(actual: unknown, expected: unknown, path: string): void {
  if (typeof expected === 'number' && typeof actual === 'number') {
    expect([path, Math.abs(actual - expected) <= 1e-8 * Math.max(1, Math.abs(expected))]).toEqual([path, true]);
  } else if (typeof expected === 'object' && expected !== null) {
    expect([path, typeof actual, Array.isArray(actual)]).toEqual([path, 'object', Array.isArray(expected)]);
    const actualRecord = actual as Record<string, unknown>;
    const expectedRecord = expected as Record<string, unknown>;
    expect([path, Object.keys(actualRecord)]).toEqual([path, Object.keys(expectedRecord)]);
    for (const key of Object.keys(expectedRecord)) {
      expectSameJson(actualRecord[key], expectedRecord[key], `${path}.${key}`);
    }
  } else {
    expect([path, actual]).toEqual([path, expected]);
  }
}

describe('engineTaskEntry', () => {
  it('moves the answer bytes across the thread boundary: the sender keeps none, the receiver reads the answer', () => {
    expect(isMainThread).toBe(true);
    const entry = engineTaskEntry({ kind: 'analyze', document, reportAs: 'answer-bytes' }) as unknown as Record<
      symbol,
      unknown
    >;
    const outcome = entry[valueSymbol] as { ok: true; report: Uint8Array };
    const transferred = entry[transferableSymbol] as ArrayBuffer;
    expect(outcome.ok).toBe(true);
    expect(transferred).toBe(outcome.report.buffer);
    // Its own memory, exactly the answer (not a slice of node's shared Buffer pool, which must never be moved).
    expect(transferred.byteLength).toBe(outcome.report.byteLength);

    // What piscina does with a moved value: post the outcome with the memory in the transfer list.
    const { port1, port2 } = new MessageChannel();
    port1.postMessage(outcome, [transferred]);
    expect(transferred.byteLength).toBe(0);
    const received = receiveMessageOnPort(port2)?.message as { ok: true; report: Uint8Array };
    port1.close();
    const answer = JSON.parse(Buffer.from(received.report).toString('utf8')) as unknown;
    // The engine's answer called here, through JSON (the route's answer is JSON text); the engine's remembered
    // solves settle to a fresh solve's within 1e-8 (DEVELOPERS.md), so numbers are compared to that.
    const expected = { engineVersion: ENGINE_VERSION, report: packCheckRules(analyzeDesign(validateDesign(document))) };
    expectSameJson(answer, JSON.parse(JSON.stringify(expected)), '');
  });

  it('returns the report object as runEngineTask does when the caller wants an object', () => {
    const task = { kind: 'analyze' as const, document };
    const outcome = engineTaskEntry(task);
    expect(outcome.ok && outcome.report instanceof Uint8Array).toBe(false);
    expectSameJson(outcome, runEngineTask(task), '');
  });

  it('returns a refusal as it is', () => {
    const task = {
      kind: 'analyze' as const,
      document: { ...document, schemaVersion: 999 } as never,
      reportAs: 'answer-bytes' as const,
    };
    const outcome = engineTaskEntry(task);
    expect(outcome).toMatchObject({ ok: false, error: { code: 'unsupported_version' } });
  });
});
