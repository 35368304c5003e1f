import type { LadderCircuitSpec } from '../../src/circuits/build-ladder-circuit';

/**
 * The half-wave cascade the simulator comparisons and benchmarks share: `stages` stages (2·stages cells) of
 * 10 nF, a 500 V 20 kHz sine through 10 Ω, a 100 µA load; past about 60 stages that load is beyond the
 * textbook droop limit.
 */
export function sineCascadeSpec(stages: number, loadA = 100e-6): LadderCircuitSpec {
  return {
    topology: 'half-wave',
    cellCount: 2 * stages,
    capacitorsF: Array<number>(2 * stages).fill(10e-9),
    diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
    drive: { kind: 'sine', peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 10 },
    load: { kind: 'current', currentA: loadA },
  };
}
