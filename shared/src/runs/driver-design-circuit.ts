import { capacitorName, ladderPartFromDesign } from '../circuits/build-ladder-circuit';
import { buildDriverCircuit } from '../circuits/build-driver-circuit';
import { analyzeDesign } from '../analysis/analyze-design';
import type { DriverStage } from '../designs/driver-stage.types';
import type { Design } from '../designs/design.types';
import { supplyThevenin } from '../driver/battery';
import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import { DomainError, isDomainError } from '../errors';
import type { Circuit } from '../sim/circuit.types';
import { withEffectiveTransformer } from '../transformer/given-numbers';

/**
 * Steady-state capacitor voltages (design order, V) of a driver design from the engine: analyzeDesign's
 * per-node cycle means, each capacitor the difference of its two nodes (node ids are the simulator's).
 */
export function engineCapacitorVoltagesV(givenDesign: Design): number[] {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  const report = analyzeDesign(design);
  const mean = new Map<string, number>(report.analysis.nodes.map((n) => [n.id, n.meanV]));
  mean.set('0', 0);
  const circuit = buildDriverCircuit(design.drive.driver, { ladder: ladderPartFromDesign(design) });
  return design.multiplier.capacitors.map((_, i) => {
    const c = circuit.elements.find((e) => e.kind === 'capacitor' && e.name === capacitorName(i));
    if (!c || c.kind !== 'capacitor')
      throw new DomainError('invalid_design', `no capacitor ${capacitorName(i)} in the circuit`);
    const a = mean.get(c.nodeA);
    const b = mean.get(c.nodeB);
    if (a === undefined || b === undefined)
      throw new DomainError('invalid_design', `the engine reports no voltage for ${capacitorName(i)}'s nodes`);
    return a - b;
  });
}

/** The driver circuit of a design with the ladder capacitors starting at the given voltages (design order). */
export function driverDesignCircuit(givenDesign: Design, initialCapacitorVoltagesV: ReadonlyArray<number>): Circuit {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  return buildDriverCircuit(design.drive.driver, {
    ladder: { ...ladderPartFromDesign(design), initialCapacitorVoltagesV },
  });
}

/**
 * A first guess of the oscillation period (s), for step sizes and time-outs: the engine's estimate, or
 * when that refuses the design, twice the time the primary current takes to ramp to the core's saturation
 * current from the supply's open-circuit voltage (ramp and an equal flyback).
 */
export function driverPeriodGuessS(driver: DriverStage): number {
  try {
    const f = estimateBlockingOscillator(driver).frequencyHz.value;
    if (f > 0 && Number.isFinite(f)) return 1 / f;
  } catch (error) {
    if (!isDomainError(error)) throw error;
  }
  const { openCircuitV } = supplyThevenin(driver.supply, 1);
  return (
    (2 * driver.transformer.primaryInductanceH * driver.transformer.saturationCurrentA) / Math.max(openCircuitV, 1e-3)
  );
}
