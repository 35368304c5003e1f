// Benchmark, not a test: analyzeDesign (the Workbench's live preview and the server's evaluate/save) on each
// demo design, beside the plain steady-state analysis of the same ladder run in the same process.
// Run: npx tsx scripts/bench/analyze-design.bench.ts
import { designExamples } from '../../shared/src/designs/design-examples';
import type { Design } from '../../shared/src/designs/design.types';
import { analyzeDesign, ladderInputOf, resolveDrive } from '../../shared/src/analysis/analyze-design';
import { analyzeLadder } from '../../shared/src/multiplier/analyze-ladder';

/** Targets per analyzeDesign call (ms, one core): the driver design solves the driver's operating curve too. */
const TARGET_MS = { driver: 25, ladder: 5 } as const;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] as number;
}

/** Median process CPU time (user + system) per call, ms, over `runs` calls after `warmUp` calls. */
function cpuMsPerCall(fn: () => unknown, runs: number, warmUp: number): number {
  for (let i = 0; i < warmUp; i += 1) fn();
  const samples: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const c0 = process.cpuUsage();
    fn();
    const c = process.cpuUsage(c0);
    samples.push((c.user + c.system) / 1000);
  }
  return median(samples);
}

/** Reference calls are ~100× shorter than the design: time them in batches so the CPU clock resolves them. */
function cpuMsPerBatchedCall(fn: () => unknown, perBatch: number, runs: number): number {
  return (
    cpuMsPerCall(
      () => {
        for (let i = 0; i < perBatch; i += 1) fn();
      },
      runs,
      3,
    ) / perBatch
  );
}

for (const [name, design] of Object.entries(designExamples)) {
  const resolved = resolveDrive(design);
  const input = ladderInputOf(design, resolved.drive, resolved.currentLimitA);
  const designMs = cpuMsPerCall(() => analyzeDesign(design), 41, 10);
  const referenceMs = cpuMsPerBatchedCall(() => analyzeLadder(input), 200, 21);
  const targetMs = design.drive.kind === 'driver' ? TARGET_MS.driver : TARGET_MS.ladder;
  console.log(
    `${name.padEnd(20)} analyzeDesign median ${designMs.toFixed(2)} ms CPU (target < ${targetMs} ms${designMs < targetMs ? ', met' : ', NOT met'}); ` +
      `reference analyzeLadder ${(referenceMs * 1000).toFixed(1)} µs; ratio ${(designMs / referenceMs).toFixed(0)}×`,
  );
}

// The blocking-oscillator design's live recompute against a sine-drive demo design, side by side in this run:
// target ≤ 1.5 ms CPU and a ratio ≤ 2 (the Workbench recomputes on every edit). Each call edits the design as
// a keystroke would: the load current (the networks the engine remembers are reused); every capacitor to a
// new common value (a uniform ladder edited and copied up: the remembered flat-top rates scale, the stage
// scan's networks are new); and one capacitor alone (every network is new, the flat-top rates solved afresh).
{
  type Edit = 'load edit' | 'all-capacitor edit' | 'one-capacitor edit';
  const edited = (design: Design, i: number, edit: Edit): Design => {
    const scale = 1 + (i % 97) * 1e-6;
    return {
      ...design,
      load: design.load?.kind === 'current' ? { ...design.load, currentA: design.load.currentA * scale } : design.load,
      multiplier:
        edit === 'load edit'
          ? design.multiplier
          : {
              ...design.multiplier,
              capacitors: design.multiplier.capacitors.map((c, k) =>
                edit === 'all-capacitor edit' || k === 0 ? { ...c, valueF: c.valueF * (1 + i * 1e-9) } : c,
              ),
            },
    };
  };
  // The reference is detectorBias, the quickest sine-drive demo, timed right after the driver design as it always
  // was; the ratio against each sine-drive demo follows (they are timed after it, in the same run).
  const sineDesigns = Object.entries(designExamples)
    .filter(([, design]) => design.drive.kind === 'sine')
    .sort(([a], [b]) => Number(b === 'detectorBias') - Number(a === 'detectorBias'));
  for (const edit of ['load edit', 'all-capacitor edit', 'one-capacitor edit'] as const) {
    let call = 0;
    const driverDesign = designExamples.surfaceChargeTester;
    const driverMs = cpuMsPerCall(() => analyzeDesign(edited(driverDesign, (call += 1), edit)), 41, 10);
    const sineMs = new Map(
      sineDesigns.map(([name, design]) => [
        name,
        cpuMsPerCall(() => analyzeDesign(edited(design, (call += 1), edit)), 41, 10),
      ]),
    );
    const referenceMs = sineMs.get('detectorBias') as number;
    const ratio = driverMs / referenceMs;
    console.log(
      `blocking-oscillator analyzeDesign, ${edit}: ${driverMs.toFixed(2)} ms CPU (target ≤ 1.5 ms${driverMs <= 1.5 ? ', met' : ', NOT met'}); ` +
        `sine-drive detectorBias ${referenceMs.toFixed(2)} ms; ratio ${ratio.toFixed(2)} (target ≤ 2${ratio <= 2 ? ', met' : ', NOT met'})`,
    );
    console.log(
      `  ratio against every sine-drive demo, ${edit}: ` +
        [...sineMs].map(([name, ms]) => `${name} ${ms.toFixed(2)} ms → ${(driverMs / ms).toFixed(2)}`).join('; '),
    );
  }
}
