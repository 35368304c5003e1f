import { describe, expect, it } from 'vitest';
import { analyzeDesign } from '../../src/analysis';
import { buildLadderCircuit, ladderPartFromDesign } from '../../src/circuits/build-ladder-circuit';
import { designExamples, type Design } from '../../src/designs';
import { buildLadderNetwork } from '../../src/multiplier';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { firstFallTo } from '../../src/sim/waveform-measures';
import { hasNgspice, runNgspice } from './run-ngspice';

// Outside reference: ngspice (REFERENCES.md §7) on the netlist our exporter writes: the ladder of each demo with its
// drive stopped (the winding shorted through the source resistance), its capacitors at the steady state's mean
// voltages, the bleeder the only path (the current load is a model of the running equipment and is left out).
const ngspiceAvailable = hasNgspice();

/** The demo designs fed by a sine drive; a driver design's ladder discharges the same way once its drive stops. */
const demos = [
  { name: 'detector-bias tripler', design: designExamples.detectorBias },
  { name: 'ionizer bar, 14-cell half-wave, negative', design: designExamples.ionizerBar },
  { name: 'precipitator cell, 2-stage full-wave', design: designExamples.precipitatorCell },
  { name: 'surface-charge tester, 4-cell half-wave', design: designExamples.surfaceChargeTester },
];

/** Capacitor voltages (design order, V, signed) at the mean node voltages of the analysis; the return node at 0 V. */
function meanCapacitorVoltagesV(design: Design): number[] {
  const report = analyzeDesign(design);
  const network = buildLadderNetwork(
    report.analysis.topology,
    report.analysis.capacitors.map((c) => c.valueF),
  );
  const meanOf = new Map([['0', 0], ...report.analysis.nodes.map((node): [string, number] => [node.id, node.meanV])]);
  const anchors = network.anchorScale.length;
  const nodeV = (i: number) =>
    i < anchors ? (meanOf.get(network.nodeInfo[0]!.id) ?? 0) : meanOf.get(network.nodeInfo[i]!.id)!;
  return network.capTop.map((top, c) => nodeV(top) - nodeV(network.capBottom[c]!));
}

describe.skipIf(!ngspiceAvailable)('bleeder discharge of the demo ladders against ngspice', () => {
  it.concurrent.each(demos)(
    'times the discharge to the safe voltage like ngspice, within 3 % ($name)',
    async ({ design }) => {
      const report = analyzeDesign(design);
      const estimateS = report.dischargeTimeS!;
      const part = ladderPartFromDesign(design);
      const circuit = buildLadderCircuit({
        ...part,
        load: null,
        drive: { kind: 'sine', peakV: 1, frequencyHz: 1e3, sourceResistanceOhm: 100 },
        driveOffAtS: 0,
        initialCapacitorVoltagesV: meanCapacitorVoltagesV(design),
      });
      const run = { stopTimeS: 1.5 * estimateS, maxStepS: estimateS / 3000 };
      const ng = await runNgspice(toSpiceNetlist(circuit, { transient: run }), ['v(top)']);
      const sign = report.analysis.ladderTopMeanV < 0 ? -1 : 1;
      const magnitude = ng.signals['v(top)']!.map((v) => sign * v);
      const ngS = firstFallTo(ng.timeS, magnitude, design.targets.safeVoltageV);
      expect(ngS).toBeGreaterThan(0);
      // Within 3 %: the estimate's diodes are ideal, ngspice's drop some 0.5–1 V each on a fall to 50 V.
      expect(Math.abs(estimateS / ngS - 1)).toBeLessThan(0.03);
    },
  );
});
