// Benchmark, not a test: the same netlist in our simulator and in ngspice, side by side.
// Run: npx tsx scripts/bench/sim.bench.ts [cycles] [stages] [settle cycles for ngspice, 0 to skip]
// The periodic steady state is compared with ngspice's transient run until it holds the same answer
// (its cycle mean within 0.5 % and 0.1 % of the steady-state mean from then on), not with a run that has
// not settled yet. Wall times on a shared machine swing with its load; CPU times (ours from the process,
// ngspice's from a separate run under bash's `times`) are printed beside them and are the fairer ratio.
import { buildLadderCircuit } from '../../shared/src/circuits/build-ladder-circuit';
import { sineCascadeSpec } from '../../shared/test/ngspice/sine-cascade';
import { MnaSystem } from '../../shared/src/sim/mna-system';
import { findPeriodicSteadyState } from '../../shared/src/sim/periodic-steady-state';
import { chargeBalanceCapacitorVoltagesV } from '../../shared/src/circuits/steady-state-estimate';
import { simulateTransient } from '../../shared/src/sim/transient-analysis';
import { toSpiceNetlist } from '../../shared/src/sim/to-spice-netlist';
import { windowMean, windowPeakToPeak } from '../../shared/src/sim/waveform-measures';
import { runNgspice } from '../../shared/test/ngspice/run-ngspice';
import { ngspiceCpuMs } from './ngspice-cpu';
import { cycleMeans, settledFrom } from '../../shared/test/ngspice/cycle-means';

async function main(): Promise<void> {
  const cycles = Number(process.argv[2] ?? 2000);
  const stages = Number(process.argv[3] ?? 20);
  const f = 20e3;
  const periodS = 1 / f;
  const spec = sineCascadeSpec(stages);
  const circuit = buildLadderCircuit(spec);
  const run = { stopTimeS: cycles * periodS, maxStepS: periodS / 200 };
  const from = (cycles - 1) * periodS;
  const to = cycles * periodS;

  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const ours = simulateTransient(circuit, { ...run, probes: ['top'], recordFromS: from - periodS });
  const oursMs = performance.now() - t0;
  const oursCpuMs = cpuMsSince(c0);
  const netlist = toSpiceNetlist(circuit, { transient: run });
  const ng = await runNgspice(netlist, ['v(top)']);
  const ngCpuMs = ngspiceCpuMs(netlist);
  const oursMean = windowMean(ours.timeS, ours.signals.top!, from, to);
  const ngMean = windowMean(ng.timeS, ng.signals['v(top)']!, from, to);
  console.log(`${stages}-stage half-wave cascade, ${cycles} cycles, max step T/200, from empty capacitors`);
  console.log(
    `  ours    ${oursMs.toFixed(0)} ms, ${ours.acceptedSteps} steps (${ours.rejectedSteps} rejected), ${(ours.newtonIterations / ours.acceptedSteps).toFixed(2)} Newton/step, last-cycle mean ${oursMean.toFixed(2)} V, ripple ${windowPeakToPeak(ours.timeS, ours.signals.top!, from, to).toFixed(3)} V`,
  );
  console.log(
    `  ngspice ${ng.elapsedMs.toFixed(0)} ms (process wall time), ${ng.timeS.length} points, last-cycle mean ${ngMean.toFixed(2)} V, ripple ${windowPeakToPeak(ng.timeS, ng.signals['v(top)']!, from, to).toFixed(3)} V`,
  );
  console.log(
    `  time ratio ours/ngspice = ${(oursMs / ng.elapsedMs).toFixed(2)} wall, ${(oursCpuMs / ngCpuMs).toFixed(2)} CPU (ours ${oursCpuMs.toFixed(0)} ms, ngspice ${ngCpuMs.toFixed(0)} ms) (target ≤ 0.33); mean differs by ${((oursMean / ngMean - 1) * 100).toFixed(4)} %`,
  );

  const system = new MnaSystem(circuit);
  const charges = Float64Array.from(chargeBalanceCapacitorVoltagesV(spec), (v, i) => v * spec.capacitorsF[i]!);
  const c1 = process.cpuUsage();
  const t1 = performance.now();
  const pss = findPeriodicSteadyState(system, {
    periodS,
    stepsPerPeriod: 200,
    initialCharges: charges,
    probes: ['top'],
  });
  const pssMs = performance.now() - t1;
  const pssCpuMs = cpuMsSince(c1);
  const pssMean = windowMean(pss.timeS, pss.signals.top!, 0, periodS);
  console.log(
    `periodic steady state (shooting, 200 steps/period, from the charge-balance estimate): ${pssMs.toFixed(0)} ms wall, ${pssCpuMs.toFixed(0)} ms CPU, converged ${pss.isConverged}, ${pss.iterations} iterations, residual ${pss.relativeResidual.toExponential(2)} (history ${pss.residualHistory.map((r) => r.toExponential(1)).join(' ')}), mean ${pssMean.toFixed(2)} V`,
  );
  console.log(
    `  (ngspice's ${cycles}-cycle transient above, not yet settled, differs by ${((pssMean / ngMean - 1) * 100).toFixed(3)} %)`,
  );

  const settleCycles = Number(process.argv[4] ?? 5000);
  if (!(settleCycles > 0)) return;
  const settleRun = { stopTimeS: settleCycles * periodS, maxStepS: periodS / 200 };
  const long = await runNgspice(toSpiceNetlist(circuit, { transient: settleRun }), ['v(top)']);
  const means = cycleMeans(long.timeS, long.signals['v(top)']!, periodS, settleCycles);
  const msPerCycle = long.elapsedMs / settleCycles;
  console.log(
    `ngspice transient from empty capacitors to the same steady state: ${settleCycles} cycles in ${long.elapsedMs.toFixed(0)} ms (${msPerCycle.toFixed(2)} ms/cycle), last-cycle mean ${means[settleCycles - 1]!.toFixed(2)} V (${((means[settleCycles - 1]! / pssMean - 1) * 100).toFixed(4)} % from the steady state)`,
  );
  for (const within of [0.005, 0.001]) {
    const c = settledFrom(means, pssMean, within);
    if (c < 0) {
      console.log(
        `  within ${within * 100} %: not reached in ${settleCycles} cycles; the steady state is at least ${(long.elapsedMs / pssMs).toFixed(1)}× faster`,
      );
      continue;
    }
    // ngspice's steps per cycle are the same from cycle to cycle (the maximum step bounds them), so its
    // time to cycle c is the run's time prorated.
    const ngMs = msPerCycle * c;
    const ngCpuToC = (ngCpuMs / cycles) * c;
    console.log(
      `  within ${within * 100} % of the steady-state mean from cycle ${c} on: ngspice ≈ ${ngMs.toFixed(0)} ms wall, ≈ ${ngCpuToC.toFixed(0)} ms CPU; steady state ${(ngMs / pssMs).toFixed(1)}× faster wall, ${(ngCpuToC / pssCpuMs).toFixed(1)}× CPU (target ≥ 50×)`,
    );
  }
}

function cpuMsSince(start: NodeJS.CpuUsage): number {
  const u = process.cpuUsage(start);
  return (u.user + u.system) / 1000;
}

void main();
