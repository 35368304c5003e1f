// Benchmark, not a test: `ladderwright simulate --until steady` (steady state, start-up, ripple) as a whole
// process, against ngspice's transient of the same exported netlist from empty capacitors, run until it holds the
// same answer, side by side in the same run.
// Run: npx tsx scripts/bench/simulate-steady.bench.ts [stages,…] [ngspice cycles,…]
// Ours: `node shared/bin/ladderwright.cjs simulate …` (the bundle, rebuilt first), CPU of the whole process from
// bash's `times`. ngspice: a transient from empty capacitors at the same maximum step (T/200), CPU likewise,
// prorated to the cycle from which its cycle mean stays within 0.1 % of our steady-state mean (the answer held);
// when it never gets there within the cycles given, the ratio printed is a lower bound. The answers are printed
// beside each other: ngspice's time to 90 % and to within 1 % are taken on its own curve against its last cycle.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { buildLadderCircuit } from '../../shared/src/circuits/build-ladder-circuit';
import { toSpiceNetlist } from '../../shared/src/sim/to-spice-netlist';
import { parseCommandArguments } from '../../shared/cli/arguments';
import { ladderSpecFromFlags, simulateSyntax } from '../../shared/cli/commands/simulate';
import { runNgspiceCycleMeans } from './ngspice-cpu';
import { settledFrom } from '../../shared/test/ngspice/cycle-means';

const repoRoot = path.join(__dirname, '..', '..');
const frequencyHz = 20e3;
const periodS = 1 / frequencyHz;
const stepsPerPeriod = 200;

const flagsOf = (stages: number): string[] =>
  `--stages ${stages} --peak 500 --freq 20k --cap 10n --rs 10 --load-current 100u --diode-is 1n --diode-n 1.8 --diode-rs 1 --max-step-per-period ${stepsPerPeriod}`.split(
    ' ',
  );

interface OurAnswer {
  outputMeanV: number;
  ripplePeakToPeakV: number;
  timeToSteadyStateS: number | null;
  timeTo1PercentS?: number | null;
  method: string;
  isSettled: boolean;
}

/** The CLI as a whole process: its JSON answer and the CPU time of the process (bash `times`). */
function runOurs(stages: number): { answer: OurAnswer; cpuMs: number; wallMs: number } {
  const dir = mkdtempSync(path.join(tmpdir(), 'lw-steady-'));
  try {
    const out = path.join(dir, 'answer.json');
    const cli = path.join(repoRoot, 'shared', 'bin', 'ladderwright.cjs');
    const script = `node "$1" simulate --until steady ${flagsOf(stages).join(' ')} > "$2"; times`;
    const started = performance.now();
    const times = execFileSync('bash', ['-c', script, 'bash', cli, out], { encoding: 'utf8' });
    const wallMs = performance.now() - started;
    const children = times.trim().split('\n').pop()!.trim().split(/\s+/);
    const seconds = (t: string): number => {
      const m = /^(\d+)m([\d.]+)s$/.exec(t)!;
      return 60 * Number(m[1]) + Number(m[2]);
    };
    const cpuMs = 1000 * (seconds(children[0]!) + seconds(children[1]!));
    return { answer: JSON.parse(readFileSync(out, 'utf8')) as OurAnswer, cpuMs, wallMs };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** First cycle whose mean reaches `fraction` of `final` (counted as the end of that cycle), in seconds. */
function timeToFraction(means: Float64Array, final: number, fraction: number): number | null {
  const i = means.findIndex((m) => m >= fraction * final);
  return i < 0 ? null : (i + 1) * periodS;
}

const fmt = (s: number | null | undefined): string => (s == null ? '—' : `${(s * 1e3).toFixed(1)} ms`);

function measure(stages: number, ngCycles: number): void {
  const ours = runOurs(stages);
  const { spec } = ladderSpecFromFlags(parseCommandArguments(flagsOf(stages), simulateSyntax).flags);
  const netlist = toSpiceNetlist(buildLadderCircuit(spec), {
    transient: { stopTimeS: ngCycles * periodS, maxStepS: periodS / stepsPerPeriod },
  });
  const ng = runNgspiceCycleMeans(netlist, 'v(top)', periodS, ngCycles);
  const a = ours.answer;
  const ngLast = ng.means[ngCycles - 1]!;
  const from = settledFrom(ng.means, a.outputMeanV, 0.001);
  const ngToHoldCpuMs = from < 0 ? ng.cpuMs : (ng.cpuMs / ngCycles) * from;
  const ratio = ngToHoldCpuMs / ours.cpuMs;
  // ngspice's own start-up figures: against its last cycle, within 1 % from the first cycle it stays there.
  const ng90 = timeToFraction(ng.means, ngLast, 0.9);
  const ng1 = settledFrom(ng.means, ngLast, 0.01);
  console.log(
    `${String(stages).padStart(3)} stages: ours ${ours.cpuMs.toFixed(0)} ms CPU (${ours.wallMs.toFixed(0)} ms wall), ${a.method}, settled ${a.isSettled}, mean ${a.outputMeanV.toFixed(1)} V, ripple ${a.ripplePeakToPeakV.toFixed(1)} V, to 90 % ${fmt(a.timeToSteadyStateS)}, to 1 % ${fmt(a.timeTo1PercentS)} | ` +
      `ngspice ${ngCycles} cycles ${ng.cpuMs.toFixed(0)} ms CPU, last-cycle mean ${ngLast.toFixed(1)} V (ours ${((a.outputMeanV / ngLast - 1) * 100).toFixed(3)} %), to 90 % ${fmt(ng90)}, to 1 % ${fmt(ng1 < 0 ? null : ng1 * periodS)} | ` +
      (from < 0
        ? `ngspice not within 0.1 % of ours in ${ngCycles} cycles: ratio ngspice/ours ≥ ${ratio.toFixed(1)}`
        : `ngspice holds within 0.1 % from cycle ${from}: ratio ngspice/ours ${ratio.toFixed(1)}`),
  );
}

function main(): void {
  execFileSync('node', [path.join(repoRoot, 'shared', 'scripts', 'bundle-cli.mjs')], {
    cwd: path.join(repoRoot, 'shared'),
    stdio: 'ignore',
  });
  const sizes = (process.argv[2] ?? '20,40').split(',').map(Number);
  const cycles = (process.argv[3] ?? '8000,30000').split(',').map(Number);
  console.log(
    `simulate --until steady vs ngspice transient from empty capacitors, half-wave cascades, 10 nF, 500 V 20 kHz, 10 Ω, 100 µA load, T/${stepsPerPeriod}`,
  );
  sizes.forEach((stages, i) => measure(stages, cycles[i] ?? cycles[cycles.length - 1]!));
}

main();
