// Benchmark, not a test: the transient of a half-wave ladder, 2,000 cycles at T/200 from empty capacitors, as
// whole processes side by side: our command line (`ladderwright simulate --cycles`, the bundled start that
// `npx ladderwright` runs) against ngspice on the same netlist, at several ladder sizes.
// Run: npx tsx scripts/bench/sim-process.bench.ts [stages,…] [cycles]
// CPU times of both processes come from bash's `times` for its children (loading Node and the bundle, parsing,
// the run and the answer all count); ngspice measures its last cycle's mean with `meas`, so neither writes a
// waveform. Target: ours/ngspice ≤ 0.25 at every size, and a growth exponent from 40 to 80 stages (CPU time
// ∝ stages^k) no larger than ngspice's.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildLadderCircuit } from '../../shared/src/circuits/build-ladder-circuit';
import { toSpiceNetlist } from '../../shared/src/sim/to-spice-netlist';
import { parseCommandArguments } from '../../shared/cli/arguments';
import { ladderSpecFromFlags, simulateSyntax } from '../../shared/cli/commands/simulate';

const repo = join(import.meta.dirname, '..', '..');
const bin = join(repo, 'shared', 'bin', 'ladderwright.cjs');
const bundle = join(repo, 'shared', 'dist', 'ladderwright.cjs');
const frequencyHz = 20e3;

/** `times` prints the shell's user/system times, then its children's: "0m1.234s 0m0.056s". */
function childrenCpuMs(timesOutput: string): number {
  const [user, system] = timesOutput.trim().split('\n').pop()!.trim().split(/\s+/);
  const seconds = (t: string | undefined): number => {
    const m = /^(\d+)m([\d.]+)s$/.exec(t ?? '');
    return m ? 60 * Number(m[1]) + Number(m[2]) : NaN;
  };
  return 1000 * (seconds(user) + seconds(system));
}

/** Runs a shell command line, returning its standard output, the children's CPU time and the wall time. */
function timed(script: string, args: string[]): { stdout: string; cpuMs: number; wallMs: number } {
  const started = performance.now();
  const out = execFileSync('bash', ['-c', `${script}; echo "@@times"; times`, 'bash', ...args], {
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
  });
  const wallMs = performance.now() - started;
  const [stdout, times] = out.split('@@times');
  return { stdout: stdout!, cpuMs: childrenCpuMs(times!), wallMs };
}

function ladderFlags(stages: number, cycles: number): string[] {
  return [
    '--stages',
    String(stages),
    '--peak',
    '500',
    '--freq',
    '20k',
    '--cap',
    '10n',
    '--rs',
    '10',
    '--load-current',
    '100u',
    '--diode-is',
    '1n',
    '--diode-n',
    '1.8',
    '--diode-rs',
    '1',
    '--cycles',
    String(cycles),
  ];
}

function measure(stages: number, cycles: number): { oursCpuMs: number; ngCpuMs: number } {
  const flags = ladderFlags(stages, cycles);
  const ours = timed('node "$@"', [bin, 'simulate', ...flags]);
  const oursMean = (JSON.parse(ours.stdout) as { outputMeanV: number }).outputMeanV;

  // The same ladder as the command line builds from the same flags, exported for ngspice.
  const { spec } = ladderSpecFromFlags(parseCommandArguments(flags, simulateSyntax).flags);
  const periodS = 1 / frequencyHz;
  const netlist = toSpiceNetlist(buildLadderCircuit(spec), {
    transient: { stopTimeS: cycles * periodS, maxStepS: periodS / 200 },
  });
  const control = [
    '.control',
    'run',
    `meas tran lastmean avg v(top) from=${(cycles - 1) * periodS} to=${cycles * periodS}`,
    '.endc',
  ];
  const dir = mkdtempSync(join(tmpdir(), 'lw-sim-process-'));
  try {
    const path = join(dir, 'circuit.cir');
    writeFileSync(path, netlist.replace(/^\.end\s*$/m, `${control.join('\n')}\n.end`));
    const ng = timed('ngspice -b "$1" 2>&1', [path]);
    const match = /lastmean\s*=\s*([-+0-9.eE]+)/.exec(ng.stdout);
    const ngMean = match ? Number(match[1]) : NaN;
    console.log(
      `${String(stages).padStart(3)} stages: ours ${ours.cpuMs.toFixed(0)} ms CPU (${ours.wallMs.toFixed(0)} ms wall), ngspice ${ng.cpuMs.toFixed(0)} ms CPU (${ng.wallMs.toFixed(0)} ms wall); ` +
        `ours/ngspice ${(ours.cpuMs / ng.cpuMs).toFixed(2)} CPU (target ≤ 0.25${ours.cpuMs / ng.cpuMs <= 0.25 ? ', met' : ', NOT met'}); ` +
        `last-cycle mean ${oursMean.toFixed(2)} V vs ${ngMean.toFixed(2)} V (${((oursMean / ngMean - 1) * 100).toFixed(4)} %)`,
    );
    return { oursCpuMs: ours.cpuMs, ngCpuMs: ng.cpuMs };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function main(): void {
  const stagesList = (process.argv[2] ?? '5,10,20,40,80').split(',').map(Number);
  const cycles = Number(process.argv[3] ?? 2000);
  // The bundle the command starts from; the launcher runs the TypeScript sources instead when it is stale.
  execFileSync('node', [join(repo, 'shared', 'scripts', 'bundle-cli.mjs')], { stdio: 'inherit' });
  console.log(
    `half-wave ladder, ${cycles} cycles at T/200 from empty capacitors, whole processes (bundle ${(statSync(bundle).size / 1e3).toFixed(0)} kB)`,
  );
  const results = new Map<number, { oursCpuMs: number; ngCpuMs: number }>();
  for (const stages of stagesList) results.set(stages, measure(stages, cycles));
  const at40 = results.get(40);
  const at80 = results.get(80);
  if (at40 && at80) {
    const ours = Math.log2(at80.oursCpuMs / at40.oursCpuMs);
    const ng = Math.log2(at80.ngCpuMs / at40.ngCpuMs);
    console.log(
      `growth exponent 40→80 stages (CPU ∝ stages^k): ours ${ours.toFixed(2)}, ngspice ${ng.toFixed(2)} (target ours ≤ ngspice's${ours <= ng ? ', met' : ', NOT met'})`,
    );
  }
}

main();
