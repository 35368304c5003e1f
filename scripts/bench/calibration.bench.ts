// Benchmark, not a test: calibration of the demo handheld surface-charge tester.
// 1. Three parameters (transistor gain, coupling, cell internal resistance) against one output-vs-load sweep
//    by the engine's estimate, on this thread (one core): our loop (package steps, batched Jacobian) beside
//    ml-levenberg-marquardt's own loop on the same normalized problem. Target: ours under 2 s.
// 2. The same three parameters against one push-button start-up curve by the simulator, the model runs on a
//    pool of 1, 2 and 4 worker threads: wall time, model runs and speed-up per worker against the 1-worker run;
//    beside them the schedule without overlap (Jacobian, then the step) on 2 workers.
// The "measured" curves are the models' own at known values (gain 80, k 0.95, 0.4 Ω per cell) with 0.3 %
// seeded noise. Run: npx tsx scripts/bench/calibration.bench.ts [start-up window ms, default 3] [--start-up-only]
import { availableParallelism } from 'node:os';
import { resolve } from 'node:path';
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { Piscina } from 'piscina';
import {
  applyParameterValues,
  calibrateDesign,
  inProcessPredictor,
  loadSweepEstimate,
  predictDatasets,
  startUpSimulation,
  toU,
  toValue,
  type CalibrationDataset,
  type CalibrationParameterId,
  type ChosenParameter,
} from '../../shared/src/calibration';
import { designExamples } from '../../shared/src/designs/design-examples';
import type { Design } from '../../shared/src/designs/design.types';

const design = designExamples.surfaceChargeTester;
const ids: CalibrationParameterId[] = ['transistorGain', 'couplingCoefficient', 'cellInternalResistance'];
const truth = [80, 0.95, 0.4];
const priors: ChosenParameter[] = [
  { id: 'transistorGain', prior: { min: 20, max: 500 } },
  { id: 'couplingCoefficient', prior: { min: 0.85, max: 0.999 } },
  { id: 'cellInternalResistance', prior: { min: 0.02, max: 3 } },
];

function noisy(values: number[], seed: number): number[] {
  let state = seed;
  const uniform = () => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return state / 2147483648;
  };
  return values.map(
    (v) => v * (1 + 0.003 * Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform())),
  );
}

function describe(values: number[]): string {
  return values.map((v, j) => `${ids[j]} ${v.toPrecision(4)}`).join(', ');
}

async function sweepPart(): Promise<void> {
  const currents = [0, 5e-6, 10e-6, 15e-6, 20e-6, 25e-6, 30e-6, 35e-6];
  const measured = noisy(loadSweepEstimate(applyParameterValues(design, ids, truth), currents), 7);
  const dataset: CalibrationDataset = {
    benchRunId: 'sweep',
    label: 'sweep',
    use: 'load-sweep',
    points: currents.map((x, i) => ({ x, y: measured[i]! })),
  };
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const ours = await calibrateDesign({ design, parameters: priors, datasets: [dataset] }, inProcessPredictor());
  const cpu = process.cpuUsage(c0);
  const oursMs = performance.now() - t0;

  // The package's own loop on the same problem: u ∈ [0, 1] per prior, predictions / largest measured value.
  const scale = Math.max(...measured);
  const fits = priors.map((p) => ({
    prior: p.prior,
    scale: p.id === 'couplingCoefficient' ? ('linear' as const) : ('log' as const),
    initialValue: 0,
  }));
  const start = [100, 0.98, 0.15].map((v, j) => toU(fits[j]!, v));
  let packageEvaluations = 0;
  const t1 = performance.now();
  const theirs = levenbergMarquardt(
    { x: currents.map((_, i) => i), y: measured.map((v) => v / scale) },
    (u: number[]) => {
      packageEvaluations += 1;
      const values = u.map((ui, j) => toValue(fits[j]!, ui));
      const predicted = predictDatasets(applyParameterValues(design, ids, values), [dataset]);
      return (i: number) => (predicted ? predicted[0]![i]! / scale : NaN);
    },
    {
      initialValues: start,
      minValues: [0, 0, 0],
      maxValues: [1, 1, 1],
      gradientDifference: 1e-3,
      maxIterations: 30,
      errorTolerance: 1e-9,
    },
  );
  const theirsMs = performance.now() - t1;
  const theirValues = theirs.parameterValues.map((u, j) => toValue(fits[j]!, u));

  console.log('1. three parameters against one output-vs-load sweep (8 points), estimate, one core');
  console.log(`  truth      ${describe(truth)}`);
  console.log(
    `  ours       ${oursMs.toFixed(0)} ms wall, ${((cpu.user + cpu.system) / 1000).toFixed(0)} ms CPU, ${ours.evaluations} model runs, ${ours.iterations} steps: ${describe(ours.parameters.map((p) => p.value))}`,
  );
  console.log(`             warnings: ${ours.warnings.map((w) => w.kind).join(', ') || 'none'}`);
  console.log(
    `  package    ${theirsMs.toFixed(0)} ms wall, ${packageEvaluations} model runs, ${theirs.iterations} steps: ${describe(theirValues)}`,
  );
  console.log(
    `  ratio ours/package = ${(oursMs / theirsMs).toFixed(2)} wall; ours against the 2 s target = ${(oursMs / 2000).toFixed(3)}`,
  );
}

/** One calibration against the start-up curve with a pool of `workers` threads; batches as the fit sent them. */
async function startUpFit(dataset: CalibrationDataset, workers: number, overlapJacobian: boolean) {
  const pool = new Piscina({
    filename: resolve(import.meta.dirname, 'calibration-worker.ts'),
    name: 'predict',
    execArgv: ['--conditions=source', '--import', 'tsx'],
    minThreads: workers,
    maxThreads: workers,
  });
  // Warm-up outside the timing: each thread loads and compiles the sources once (seconds under tsx).
  await Promise.all(Array.from({ length: workers }, () => pool.run({ design, datasets: [] })));
  const batches: number[] = [];
  const t0 = performance.now();
  const result = await calibrateDesign(
    { design, parameters: priors, datasets: [dataset] },
    (prepared) => (designs) => {
      batches.push(designs.length);
      return Promise.all(
        designs.map((d: Design) => pool.run({ design: d, datasets: prepared }) as Promise<number[][] | null>),
      );
    },
    // Refused steps are retried with as many damping values at once as there are workers.
    { overlapJacobian, dampingTrials: workers },
  );
  const wallMs = performance.now() - t0;
  await pool.destroy();
  // Rounds: each batch takes ⌈size / workers⌉ runs' time on an idle pool of equal runs.
  const rounds = batches.reduce((sum, size) => sum + Math.ceil(size / workers), 0);
  return { result, wallMs, rounds, batches: batches.length };
}

async function startUpPart(windowS: number): Promise<void> {
  const times = Array.from({ length: 16 }, (_, i) => ((i + 1) * windowS) / 16);
  const measured = noisy(startUpSimulation(applyParameterValues(design, ids, truth), times), 11);
  const dataset: CalibrationDataset = {
    benchRunId: 'start',
    label: 'start-up',
    use: 'start-up',
    points: times.map((x, i) => ({ x, y: measured[i]! })),
  };
  const cores = availableParallelism();
  console.log(
    `2. the same three parameters against one start-up curve (${(windowS * 1e3).toFixed(1)} ms, 16 points), simulator`,
  );
  console.log(
    `  machine: ${cores} cores; each step goes out with the Jacobian's 3 columns (4 runs a round), so 2 workers halve the rounds and 4 run an iteration in one; past ${cores} workers the threads share ${cores} cores, so wall time cannot fall much further here`,
  );
  let oneWorkerMs = 0;
  for (const workers of [1, 2, 4]) {
    const { result, wallMs, rounds, batches } = await startUpFit(dataset, workers, true);
    if (workers === 1) oneWorkerMs = wallMs;
    const speedUp = oneWorkerMs / wallMs;
    console.log(
      `  ${workers} worker(s) ${(wallMs / 1000).toFixed(1)} s wall, ${result.evaluations} model runs in ${batches} batches (${rounds} rounds), ${result.iterations} steps, speed-up ${speedUp.toFixed(2)} (${(speedUp / workers).toFixed(2)} per worker): ${describe(result.parameters.map((p) => p.value))}`,
    );
  }
  const plain = await startUpFit(dataset, 2, false);
  console.log(
    `  reference, Jacobian then step (two batches an iteration), 2 workers: ${(plain.wallMs / 1000).toFixed(1)} s wall, ${plain.result.evaluations} model runs in ${plain.batches} batches (${plain.rounds} rounds), ${plain.result.iterations} steps, speed-up ${(oneWorkerMs / plain.wallMs).toFixed(2)} against the 1-worker run above: ${describe(plain.result.parameters.map((p) => p.value))}`,
  );
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  if (!args.includes('--start-up-only')) await sweepPart();
  await startUpPart(Number(args.find((arg) => !arg.startsWith('--')) ?? 3) * 1e-3);
}

void main();
