// Benchmark, not a test: the ladder engine's steady-state analysis and the Sizer, each beside a simple
// reference computation (the textbook closed forms) run in the same process.
// Run: npx tsx scripts/bench/engine.bench.ts
import { analyzeLadder } from '../../shared/src/multiplier/analyze-ladder';
import type { LadderInput } from '../../shared/src/multiplier/ladder.types';
import { sizeLadder } from '../../shared/src/sizing/size-ladder';

const stages = 10;
const input: LadderInput = {
  topology: 'half-wave',
  capacitorsF: Array<number>(2 * stages).fill(2.2e-9),
  drive: { kind: 'sine', peakV: 480, frequencyHz: 25e3, sourceResistanceOhm: 150 },
  diode: { saturationCurrentA: 2e-9, emissionCoefficient: 8, seriesResistanceOhm: 40 },
  polarity: -1,
  load: { kind: 'current', currentA: 30e-6 },
  bleederOhm: 1e9,
  seriesOutputResistanceOhm: 10e6,
};

/** Reference: the published closed forms (REFERENCES.md §1) for the same ladder. */
function closedForm(n: number, c: number, vmax: number, f: number, current: number): number {
  const q = current / f;
  const ripple = ((q / c) * n * (n + 1)) / 2;
  const drop = (q / c) * ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6);
  return 2 * n * vmax - drop - ripple / 2;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] as number;
}

/**
 * Median per-call time (µs) over `batches` batches of `perBatch` calls, after a warm-up: wall clock, and
 * process CPU time (user + system), which is what one core spends when the machine is shared.
 */
function timePerCallUs(
  fn: (i: number) => number,
  perBatch: number,
  batches: number,
): { medianUs: number; medianCpuUs: number; sink: number } {
  let sink = 0;
  for (let i = 0; i < perBatch; i += 1) sink += fn(i);
  const samples: number[] = [];
  const cpuSamples: number[] = [];
  for (let b = 0; b < batches; b += 1) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    for (let i = 0; i < perBatch; i += 1) sink += fn(i);
    const c = process.cpuUsage(c0);
    samples.push(((performance.now() - t0) * 1000) / perBatch);
    cpuSamples.push((c.user + c.system) / perBatch);
  }
  return { medianUs: median(samples), medianCpuUs: median(cpuSamples), sink };
}

function cpuMs<T>(fn: () => T): { result: T; cpuMs: number; wallMs: number } {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const result = fn();
  const c = process.cpuUsage(c0);
  return { result, cpuMs: (c.user + c.system) / 1000, wallMs: performance.now() - t0 };
}

const analysis = timePerCallUs(
  (i) => analyzeLadder({ ...input, load: { kind: 'current', currentA: 30e-6 * (1 + (i % 7) * 1e-3) } }).outputMeanV,
  2000,
  15,
);
const reference = timePerCallUs((i) => closedForm(stages, 2.2e-9, 480, 25e3, 30e-6 * (1 + (i % 7) * 1e-3)), 200000, 15);
console.log(
  `steady-state analysis, ${stages} stages: median ${analysis.medianUs.toFixed(2)} µs wall, ${analysis.medianCpuUs.toFixed(2)} µs CPU per analysis (target < 10 µs CPU${analysis.medianCpuUs < 10 ? ', met' : ', NOT met'})`,
);
console.log(
  `  reference (textbook closed-form ripple and drop): ${reference.medianCpuUs.toFixed(4)} µs CPU; ratio ${(analysis.medianCpuUs / reference.medianCpuUs).toFixed(0)}×`,
);

const request = {
  targetOutputV: -6000,
  loadCurrentA: 30e-6,
  rippleMaxV: 30,
  drive: input.drive,
  safeVoltageV: 50,
  series: 'E24' as const,
  extraCells: 10,
  maxCandidates: 10000,
};
sizeLadder({ ...request, maxCandidates: 1000 }); // warm-up
// Median of five runs: one run's CPU time swings with the JIT's progress and the collector.
const sizerRuns = Array.from({ length: 5 }, () => cpuMs(() => sizeLadder(request))).sort((a, b) => a.cpuMs - b.cpuMs);
const sizer = sizerRuns[2] as (typeof sizerRuns)[number];
const sizerReference = cpuMs(() => {
  let sink = 0;
  for (let i = 0; i < 10000; i += 1) sink += closedForm(7 + (i % 10), 1e-10 * (1 + (i % 61)), 480, 25e3, 30e-6);
  return sink;
});
console.log(
  `Sizer: ${sizer.result.evaluatedCount} candidates in ${sizer.wallMs.toFixed(0)} ms wall, ${sizer.cpuMs.toFixed(0)} ms CPU (target < 250 ms CPU on one core${sizer.cpuMs < 250 ? ', met' : ', NOT met'}); ${sizer.result.meetingSpecCount} met the spec`,
);
console.log(
  `  reference (10 000 closed-form evaluations): ${sizerReference.cpuMs.toFixed(2)} ms CPU; ratio ${(sizer.cpuMs / Math.max(sizerReference.cpuMs, 1e-3)).toFixed(0)}×`,
);
console.log(
  `(sinks ${analysis.sink.toExponential(3)} ${reference.sink.toExponential(3)} ${sizerReference.result.toExponential(3)})`,
);
