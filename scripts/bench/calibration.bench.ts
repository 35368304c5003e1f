// Benchmark, not a test: calibration of the demo handheld surface-charge tester.
// 1. Three parameters (transistor gain, coupling, cell internal resistance) against one output-vs-load sweep
//    by the engine's estimate, on this thread (one core): our loop (package steps, batched Jacobian) beside
//    ml-levenberg-marquardt's own loop on the same normalized problem. Target: ours under 2 s.
// 2. The same three parameters against one push-button start-up curve by the simulator, the model runs on a
//    pool of 1, 2 and 4 worker threads on the server's schedule (each step sent with the Jacobian's columns, a
//    refused step followed by a ladder of damping values): wall time, model runs, rounds (sequential batches),
//    speed-up per worker against the plain schedule (Jacobian, then step, one damping value at a time) on 1
//    worker and against the server's schedule on 1 worker, how even a batch's runs are, and the load average.
// The "measured" curves are the models' own at known values (gain 80, k 0.95, 0.4 Ω per cell) with 0.3 %
// seeded noise. Run: npx tsx scripts/bench/calibration.bench.ts [start-up window ms, default 3] [--start-up-only]
import { availableParallelism, loadavg } from 'node:os';
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

/** The fit's schedule of model runs: the plain one (Jacobian, then step, one damping value a batch) or the server's. */
type Schedule = 'plain' | 'server';

/** One calibration against the start-up curve with a pool of `workers` threads; batches as the fit sent them. */
async function startUpFit(dataset: CalibrationDataset, workers: number, schedule: Schedule) {
  const pool = new Piscina({
    filename: resolve(import.meta.dirname, 'calibration-worker.ts'),
    name: 'predict',
    execArgv: ['--conditions=source', '--import', 'tsx'],
    minThreads: workers,
    maxThreads: workers,
  });
  type Answer = { predictions: number[][] | null; runMs: number };
  const run = (d: Design, datasets: CalibrationDataset[]) => pool.run({ design: d, datasets }) as Promise<Answer>;
  // Warm-up outside the timing: each thread loads the sources and runs the simulator once, as a server's
  // long-lived workers have (a cold thread's first run takes about twice as long while V8 compiles it).
  await Promise.all(Array.from({ length: workers }, () => run(design, [dataset])));
  const batches: number[][] = [];
  const t0 = performance.now();
  const result = await calibrateDesign(
    { design, parameters: priors, datasets: [dataset] },
    (prepared) => async (designs) => {
      const answers = await Promise.all(designs.map((d: Design) => run(d, [...prepared])));
      batches.push(answers.map((answer) => answer.runMs));
      return answers.map((answer) => answer.predictions);
    },
    schedule === 'plain' ? { overlapJacobian: false, dampingTrials: 1 } : {},
  );
  const wallMs = performance.now() - t0;
  await pool.destroy();
  // Rounds: each batch takes ⌈size / workers⌉ runs' time on an idle pool of equal runs.
  const rounds = batches.reduce((sum, runs) => sum + Math.ceil(runs.length / workers), 0);
  // How even the runs of a batch are: its slowest run against its mean, over the batches of several runs.
  const spreads = batches
    .filter((runs) => runs.length > 1)
    .map((runs) => Math.max(...runs) / (runs.reduce((sum, ms) => sum + ms, 0) / runs.length) - 1);
  const slowestOverMean = spreads.length ? spreads.reduce((sum, x) => sum + x, 0) / spreads.length : 0;
  const sizes = batches.map((runs) => runs.length).join(' ');
  // A run's mean time on its thread: it grows with the workers when the pool gets no more CPU than one thread
  // (the other load on the machine, or the scheduler sharing CPU between sessions rather than threads).
  const runs = batches.flat();
  const meanRunMs = runs.reduce((sum, ms) => sum + ms, 0) / Math.max(runs.length, 1);
  return {
    result,
    wallMs,
    rounds,
    batches: batches.length,
    sizes,
    slowestOverMean,
    meanRunMs,
    load: loadavg()[0] as number,
  };
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
    `  machine: ${cores} cores; the server's schedule sends each step with the Jacobian's 3 columns and, after a refused step, 4 damping values at once (4 runs a batch), the same path on any pool; so 2 workers halve the rounds and 4 run a batch in one; past ${cores} workers the threads share ${cores} cores, so wall time cannot fall much further here`,
  );
  type Fit = Awaited<ReturnType<typeof startUpFit>>;
  const line = (name: string, fit: Fit, workers: number, reference: Fit, sameOnOne: Fit) => {
    const speedUp = reference.wallMs / fit.wallMs;
    const scaling = sameOnOne.wallMs / fit.wallMs;
    console.log(
      `  ${name}: ${(fit.wallMs / 1000).toFixed(1)} s wall, ${fit.result.evaluations} model runs in ${fit.batches} batches (${fit.sizes}; ${fit.rounds} rounds of ${workers}), ${fit.result.iterations} steps, speed-up ${speedUp.toFixed(2)} (${(speedUp / workers).toFixed(2)} per worker; against the same schedule on 1 worker ${scaling.toFixed(2)}, ${(scaling / workers).toFixed(2)} per worker), a run ${(fit.meanRunMs / 1000).toFixed(2)} s on its thread, a batch's slowest run ${(fit.slowestOverMean * 100).toFixed(0)} % over its mean, load ${fit.load.toFixed(2)}: ${describe(fit.result.parameters.map((p) => p.value))}`,
    );
  };
  // The reference: one worker, the plain schedule (the Jacobian, then the step, one damping value at a time),
  // the fewest runs in a row.
  const plain = await startUpFit(dataset, 1, 'plain');
  line('1 worker, Jacobian then step (reference)', plain, 1, plain, plain);
  // The server's schedule: the same path and batches for any number of workers.
  const fits: Fit[] = [];
  for (const workers of [1, 2, 4]) {
    const fit = await startUpFit(dataset, workers, 'server');
    fits.push(fit);
    line(`${workers} worker(s), server schedule`, fit, workers, plain, fits[0] as Fit);
  }
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  if (!args.includes('--start-up-only')) await sweepPart();
  await startUpPart(Number(args.find((arg) => !arg.startsWith('--')) ?? 3) * 1e-3);
}

void main();
