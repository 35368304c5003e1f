// Benchmark, not a test: the same netlist in our simulator and in ngspice, side by side.
// Run: npx tsx scripts/bench/sim.bench.ts [cycles]
import { buildLadderCircuit, type LadderCircuitSpec } from '../../shared/src/sim/build-circuit';
import { MnaSystem } from '../../shared/src/sim/mna-system';
import { findPeriodicSteadyState } from '../../shared/src/sim/periodic-steady-state';
import { chargeBalanceCapacitorVoltagesV } from '../../shared/src/sim/steady-state-estimate';
import { simulateTransient } from '../../shared/src/sim/transient';
import { toSpiceNetlist } from '../../shared/src/sim/to-spice-netlist';
import { windowMean, windowPeakToPeak } from '../../shared/src/sim/waveform-measures';
import { runNgspice } from '../../shared/test/ngspice/run-ngspice';

async function main(): Promise<void> {
  const cycles = Number(process.argv[2] ?? 2000);
  const stages = Number(process.argv[3] ?? 20);
  const f = 20e3;
  const periodS = 1 / f;
  const spec: LadderCircuitSpec = {
    topology: 'half-wave',
    cellCount: 2 * stages,
    capacitorsF: Array<number>(2 * stages).fill(10e-9),
    diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
    drive: { kind: 'sine', peakV: 500, frequencyHz: f, sourceResistanceOhm: 10 },
    load: { kind: 'current', currentA: 100e-6 },
  };
  const circuit = buildLadderCircuit(spec);
  const run = { stopTimeS: cycles * periodS, maxStepS: periodS / 200 };
  const from = (cycles - 1) * periodS;
  const to = cycles * periodS;

  const t0 = performance.now();
  const ours = simulateTransient(circuit, { ...run, probes: ['top'], recordFromS: from - periodS });
  const oursMs = performance.now() - t0;
  const ng = await runNgspice(toSpiceNetlist(circuit, { transient: run }), ['v(top)']);
  const oursMean = windowMean(ours.timeS, ours.signals.top!, from, to);
  const ngMean = windowMean(ng.timeS, ng.signals['v(top)']!, from, to);
  console.log(`${stages}-stage half-wave cascade, ${cycles} cycles, max step T/200, from empty capacitors`);
  console.log(`  ours    ${oursMs.toFixed(0)} ms, ${ours.acceptedSteps} steps (${ours.rejectedSteps} rejected), ${(ours.newtonIterations / ours.acceptedSteps).toFixed(2)} Newton/step, last-cycle mean ${oursMean.toFixed(2)} V, ripple ${windowPeakToPeak(ours.timeS, ours.signals.top!, from, to).toFixed(3)} V`);
  console.log(`  ngspice ${ng.elapsedMs.toFixed(0)} ms (process wall time), ${ng.timeS.length} points, last-cycle mean ${ngMean.toFixed(2)} V, ripple ${windowPeakToPeak(ng.timeS, ng.signals['v(top)']!, from, to).toFixed(3)} V`);
  console.log(`  time ratio ours/ngspice = ${(oursMs / ng.elapsedMs).toFixed(2)} (target ≤ 0.33); mean differs by ${((oursMean / ngMean - 1) * 100).toFixed(4)} %`);

  const system = new MnaSystem(circuit);
  const charges = Float64Array.from(chargeBalanceCapacitorVoltagesV(spec), (v, i) => v * spec.capacitorsF[i]!);
  const t1 = performance.now();
  const pss = findPeriodicSteadyState(system, { periodS, stepsPerPeriod: 200, initialCharges: charges, probes: ['top'] });
  const pssMs = performance.now() - t1;
  const pssMean = windowMean(pss.timeS, pss.signals.top!, 0, periodS);
  console.log(`periodic steady state (shooting, 200 steps/period, from the charge-balance estimate): ${pssMs.toFixed(0)} ms, converged ${pss.isConverged}, ${pss.iterations} iterations, residual ${pss.relativeResidual.toExponential(2)} (history ${pss.residualHistory.map((r) => r.toExponential(1)).join(' ')}), mean ${pssMean.toFixed(2)} V`);
  console.log(`  against ngspice's ${cycles}-cycle transient: ${(ng.elapsedMs / pssMs).toFixed(1)}× faster (target ≥ 50×); mean differs by ${((pssMean / ngMean - 1) * 100).toFixed(3)} % (ngspice's run may not have settled yet)`);
}

void main();
