// Benchmark, not a test: a 20 ms cold (push-button) start of the demo handheld surface-charge tester —
// blocking oscillator, saturating transformer, four-cell ladder — in our simulator and in ngspice on the
// same exported netlist, side by side. Run: npx tsx scripts/bench/driver-start.bench.ts [window ms]
// ngspice runs at reltol 1e-5: at 1e-4 it stops on "timestep too small" in this circuit, and at its default
// 1e-3 its own answer moves by a few % (test/driver). ngspice runs once: its data and its CPU time come from
// the same run. Ours runs at its defaults. The answer compared is
// the output (ladder top) at the end and its mean over the last 0.5 ms. CPU times (ours from the process,
// ngspice's from bash's `times`) are the fairer ratio on a shared machine; target ours/ngspice ≤ 0.33.
import { designExamples } from '../../shared/src/designs/design-examples';
import { driverDesignCircuit, driverPeriodGuessS } from '../../shared/src/runs/driver-design-circuit';
import { simulateTransient } from '../../shared/src/sim/transient-analysis';
import { toSpiceNetlist } from '../../shared/src/sim/to-spice-netlist';
import { windowMean } from '../../shared/src/sim/waveform-measures';
import { runNgspiceTimed } from './ngspice-cpu';

function main(): void {
  const windowS = Number(process.argv[2] ?? 20) * 1e-3;
  const design = designExamples.surfaceChargeTester;
  if (design.drive.kind !== 'driver') throw new Error('the demo tester has a driver stage');
  const circuit = driverDesignCircuit(
    design,
    design.multiplier.capacitors.map(() => 0),
  );
  const run = { stopTimeS: windowS, maxStepS: driverPeriodGuessS(design.drive.driver) / 200 };
  const fromS = windowS - 0.5e-3;

  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const ours = simulateTransient(circuit, { ...run, probes: ['top'] });
  const oursMs = performance.now() - t0;
  const cpu = process.cpuUsage(c0);
  const oursCpuMs = (cpu.user + cpu.system) / 1000;
  const oursTop = ours.signals.top!;

  const netlist = toSpiceNetlist(circuit, {
    transient: { ...run, startFrom: 'element-initial-conditions' },
    extraLines: ['.options reltol=1e-5'],
  });
  // One ngspice run gives both the answer and its times (at reltol 1e-5 it takes minutes on this circuit).
  const ng = runNgspiceTimed(netlist, ['v(top)']);
  const ngCpuMs = ng.cpuMs;
  const ngTop = ng.signals['v(top)']!;
  const oursMean = windowMean(ours.timeS, oursTop, fromS, windowS);
  const ngMean = windowMean(ng.timeS, ngTop, fromS, windowS);
  console.log(
    `demo tester cold start, ${(windowS * 1e3).toFixed(1)} ms, max step ${(run.maxStepS * 1e9).toFixed(0)} ns`,
  );
  console.log(
    `  ours     ${oursMs.toFixed(0)} ms wall, ${oursCpuMs.toFixed(0)} ms CPU, ${ours.acceptedSteps} steps, top at end ${oursTop[oursTop.length - 1]!.toFixed(2)} V, last 0.5 ms mean ${oursMean.toFixed(2)} V`,
  );
  console.log(
    `  ngspice  ${ng.wallMs.toFixed(0)} ms wall, ${ngCpuMs.toFixed(0)} ms CPU, ${ng.timeS.length} points, top at end ${ngTop[ngTop.length - 1]!.toFixed(2)} V, last 0.5 ms mean ${ngMean.toFixed(2)} V`,
  );
  console.log(
    `  ratio ours/ngspice = ${(oursCpuMs / ngCpuMs).toFixed(3)} CPU, ${(oursMs / ng.wallMs).toFixed(3)} wall (target ≤ 0.33); mean differs by ${((oursMean / ngMean - 1) * 100).toFixed(3)} %`,
  );
}

main();
