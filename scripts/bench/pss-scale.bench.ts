// Benchmark, not a test: periodic steady state (shooting) against ngspice's transient on the same exported
// netlist, at several ladder sizes, side by side in the same run.
// Run: npx tsx scripts/bench/pss-scale.bench.ts [stages,…] [ngspice cycles]
// Both start from the charge-balance estimate (ngspice through the netlist's initial conditions), so the
// transient has only the slow modes left to settle. ngspice's time is prorated to the cycle from which its
// cycle mean stays within 0.1 % of the steady state; when it never gets there within the cycles given, the
// ratio printed is a lower bound. CPU times: ours from the process, ngspice's from a separate run under
// bash's `times`.
import { buildLadderCircuit } from '../../shared/src/circuits/build-ladder-circuit';
import { sineCascadeSpec } from '../../shared/test/ngspice/sine-cascade';
import { MnaSystem } from '../../shared/src/sim/mna-system';
import { findPeriodicSteadyState } from '../../shared/src/sim/periodic-steady-state';
import { chargeBalanceCapacitorVoltagesV } from '../../shared/src/circuits/steady-state-estimate';
import { toSpiceNetlist } from '../../shared/src/sim/to-spice-netlist';
import { windowMean } from '../../shared/src/sim/waveform-measures';
import { runNgspice } from '../../shared/test/ngspice/run-ngspice';
import { ngspiceCpuMs } from './ngspice-cpu';
import { cycleMeans, settledFrom } from '../../shared/test/ngspice/cycle-means';

const f = 20e3;
const periodS = 1 / f;
const stepsPerPeriod = 200;

async function measure(stages: number, ngCycles: number): Promise<void> {
  const spec = sineCascadeSpec(stages);
  const estimateV = chargeBalanceCapacitorVoltagesV(spec);
  const circuit = buildLadderCircuit({ ...spec, initialCapacitorVoltagesV: estimateV });
  const charges = Float64Array.from(estimateV, (v, i) => v * spec.capacitorsF[i]!);
  const c0 = process.cpuUsage();
  const pss = findPeriodicSteadyState(new MnaSystem(circuit), {
    periodS,
    stepsPerPeriod,
    initialCharges: charges,
    probes: ['top'],
  });
  const u = process.cpuUsage(c0);
  const pssCpuMs = (u.user + u.system) / 1000;
  const pssMean = windowMean(pss.timeS, pss.signals.top!, 0, periodS);
  // Past the textbook droop limit (droop ≥ the ideal output) the linear estimate goes negative: a poor start.
  const isOverloaded = estimateV.some((v) => v < 0);

  const netlist = toSpiceNetlist(circuit, {
    transient: { stopTimeS: ngCycles * periodS, maxStepS: periodS / stepsPerPeriod },
  });
  const ng = await runNgspice(netlist, ['v(top)']);
  const ngCpuMs = ngspiceCpuMs(netlist);
  const means = cycleMeans(ng.timeS, ng.signals['v(top)']!, periodS, ngCycles);
  const ngLast = means[ngCycles - 1]!;
  const from = settledFrom(means, pssMean, 0.001);
  const ngToSettleCpuMs = from < 0 ? ngCpuMs : (ngCpuMs / ngCycles) * from;
  const ratio = ngToSettleCpuMs / pssCpuMs;
  console.log(
    `${String(stages).padStart(3)} stages${isOverloaded ? ' (estimate has negative capacitor voltages)' : ''}: PSS ${pssCpuMs.toFixed(0)} ms CPU, converged ${pss.isConverged} (${pss.iterations} iterations, residual ${pss.relativeResidual.toExponential(1)}), mean ${pssMean.toFixed(1)} V | ngspice ${ngCycles} cycles ${ngCpuMs.toFixed(0)} ms CPU, last-cycle mean ${ngLast.toFixed(1)} V (${((pssMean / ngLast - 1) * 100).toFixed(3)} %) | ` +
      (!pss.isConverged
        ? 'no ratio: the periodic steady state did not converge'
        : from < 0
          ? `ngspice not within 0.1 % of the PSS in ${ngCycles} cycles: ratio ngspice/PSS ≥ ${ratio.toFixed(2)}`
          : `ngspice within 0.1 % from cycle ${from}: ratio ngspice/PSS ${ratio.toFixed(2)}`),
  );
}

async function main(): Promise<void> {
  const sizes = (process.argv[2] ?? '5,20,40,80,160').split(',').map(Number);
  const ngCycles = Number(process.argv[3] ?? 2000);
  console.log(
    `Periodic steady state vs ngspice transient, half-wave cascades, 10 nF, 500 V 20 kHz, 100 µA load, T/${stepsPerPeriod}`,
  );
  for (const stages of sizes) await measure(stages, ngCycles);
}

void main();
