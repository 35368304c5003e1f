// The 80-stage half-wave cascade of the deep-droop reference (ngspice, from empty capacitors), shared by the
// test that reads the reference and the script that makes it (make-deep-droop-reference.ts).
import { buildLadderCircuit, type LadderCircuitSpec } from '../../../src/circuits/build-ladder-circuit';
import type { Circuit } from '../../../src/sim/circuit.types';
import { sineCascadeSpec } from '../sine-cascade';

export const DEEP_DROOP_STAGES = 80;
export const DEEP_DROOP_FREQUENCY_HZ = 20e3;
export const DEEP_DROOP_STEPS_PER_PERIOD = 200;

/** 80 stages (160 cells) of 10 nF, 500 V 20 kHz through 10 Ω, 100 µA load: far past the textbook droop limit. */
export const deepDroopSpec: LadderCircuitSpec = sineCascadeSpec(DEEP_DROOP_STAGES);

export function deepDroopCircuit(): Circuit {
  return buildLadderCircuit(deepDroopSpec);
}

export const DEEP_DROOP_REFERENCE_FILE = 'deep-droop-80-stages.ngspice.json';
