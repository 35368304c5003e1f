// Benchmark, not a test: the cost of a designed transformer in the live recompute. analyzeDesign of the demo
// handheld tester with its transformer section ('designed') beside the same design with the given numbers,
// run side by side in this process, and analyzeTransformer alone, and the transformer Sizer over the demo cores.
// The two designs are timed in alternation after a common warm-up, so a change of machine load between them
// (seven people share two cores) lands on both; the added cost is the median of the paired differences.
// Run: npx tsx scripts/bench/transformer.bench.ts
import { analyzeDesign } from '../../shared/src/analysis/analyze-design';
import { designExamples } from '../../shared/src/designs/design-examples';
import type { Design } from '../../shared/src/designs/design.types';
import { analyzeTransformer } from '../../shared/src/transformer/analyze-transformer';
import {
  demoCoreKinds,
  demoTapeKinds,
  demoTransformerSection,
  demoWireKinds,
} from '../../shared/src/transformer/demo-kinds';
import { pulseOperatingPoint } from '../../shared/src/transformer/operating-point';
import { sizeTransformer } from '../../shared/src/transformer/size-transformer';

/** Target: the section adds at most 5 ms CPU to a driver design's recompute (one core). */
const ADDED_TARGET_MS = 5;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] as number;
}

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

const given = designExamples.surfaceChargeTester;
if (given.drive.kind !== 'driver') throw new Error('the demo tester has a driver drive');
const designed: Design = {
  ...given,
  drive: {
    ...given.drive,
    driver: { ...given.drive.driver, transformerChoice: 'designed', transformerDesign: demoTransformerSection },
  },
};
/** CPU time (ms) of one call of each of `a` and `b`, timed in alternation: medians and the median difference. */
function pairedCpuMs(a: () => unknown, b: () => unknown, runs: number, warmUp: number) {
  for (let i = 0; i < warmUp; i += 1) {
    a();
    b();
  }
  const cpuOf = (fn: () => unknown) => {
    const c0 = process.cpuUsage();
    fn();
    const c = process.cpuUsage(c0);
    return (c.user + c.system) / 1000;
  };
  const as: number[] = [];
  const bs: number[] = [];
  const differences: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const ta = cpuOf(a);
    const tb = cpuOf(b);
    as.push(ta);
    bs.push(tb);
    differences.push(tb - ta);
  }
  return { aMs: median(as), bMs: median(bs), differenceMs: median(differences) };
}

const paired = pairedCpuMs(
  () => analyzeDesign(given),
  () => analyzeDesign(designed),
  61,
  20,
);
const givenMs = paired.aMs;
const designedMs = paired.bMs;
const addedMs = paired.differenceMs;
console.log(
  `analyzeDesign handheld tester: designed transformer ${designedMs.toFixed(2)} ms CPU, given ${givenMs.toFixed(2)} ms ` +
    `(reference, same run); ratio ${(designedMs / givenMs).toFixed(2)}×; added ${addedMs.toFixed(2)} ms ` +
    `(target < ${ADDED_TARGET_MS} ms${addedMs < ADDED_TARGET_MS ? ', met' : ', NOT met'})`,
);

const point = pulseOperatingPoint({
  frequencyHz: 30e3,
  onTimeS: 15e-6,
  flybackTimeS: 8e-6,
  primaryPeakCurrentA: 0.1,
  baseCurrentA: 1e-3,
  primaryOnVoltageV: 2.8,
  forwardSecondaryPeakV: 168,
  flybackSecondaryPeakV: 600,
  primaryTurns: 20,
  feedbackTurns: 8,
  secondaryTurns: 1200,
  ambientTemperatureC: 25,
});
const spacing = { pollutionDegree: 2, materialGroup: 'IIIa', pcb: false } as const;
const sectionMs =
  cpuMsPerCall(
    () => {
      for (let i = 0; i < 10; i += 1) analyzeTransformer(demoTransformerSection, point, spacing);
    },
    21,
    3,
  ) / 10;
console.log(
  `analyzeTransformer demo section: ${sectionMs.toFixed(2)} ms CPU; ratio to the given design's analyzeDesign ${(sectionMs / givenMs).toFixed(2)}×`,
);

const request = {
  primaryInductanceH: 1e-3,
  primaryPeakCurrentA: 0.15,
  turnsRatio: 60,
  feedbackRatio: 0.4,
  frequencyHz: 30e3,
  dutyOnFraction: 0.5,
  primaryWire: demoWireKinds[2]!,
  feedbackWire: demoWireKinds[1]!,
  secondaryWire: demoWireKinds[0]!,
  windingTape: demoTapeKinds[1]!,
  windingTapeWraps: 3,
  layerTape: demoTapeKinds[0]!,
  secondaryPeakV: 600,
};
const sizerMs = cpuMsPerCall(() => sizeTransformer(demoCoreKinds, request, spacing), 21, 3);
console.log(
  `sizeTransformer over ${demoCoreKinds.length} demo cores: ${sizerMs.toFixed(2)} ms CPU; ` +
    `${(sizerMs / demoCoreKinds.length).toFixed(2)} ms a core`,
);
