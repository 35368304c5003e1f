import type { Circuit, TransientOptions, TransientResult } from './circuit.types';
import { MnaSystem } from './mna-system';
import { SampleBuffer } from './sample-buffer';
import { TransientStepper } from './transient';

/**
 * Transient analysis of a circuit from 0 to stopTimeS; records each accepted point of the probes.
 * Units: seconds, volts, amperes. Methods: see TransientStepper.
 */
export function simulateTransient(circuit: Circuit, options: TransientOptions): TransientResult {
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, options);
  if ((options.startFrom ?? 'element-initial-conditions') === 'operating-point') stepper.startFromOperatingPoint();
  else stepper.startFromCharges(system.initialCharge);
  const probes = options.probes ?? [...system.nodeIndex.keys()];
  const indices = probes.map((p) => system.probeIndex(p));
  const recordFromS = options.recordFromS ?? 0;
  const time = new SampleBuffer();
  const buffers = probes.map(() => new SampleBuffer());
  const record = (): void => {
    if (stepper.timeS < recordFromS) return;
    time.push(stepper.timeS);
    indices.forEach((index, i) => buffers[i]!.push(system.x[index]!));
  };
  if ((options.startFrom ?? 'element-initial-conditions') === 'operating-point') record();
  while (stepper.timeS < options.stopTimeS * (1 - 1e-12)) {
    stepper.step(options.stopTimeS);
    record();
  }
  const signals: Record<string, Float64Array> = {};
  probes.forEach((p, i) => {
    signals[p] = buffers[i]!.toArray();
  });
  return {
    timeS: time.toArray(),
    signals,
    acceptedSteps: stepper.acceptedSteps,
    rejectedSteps: stepper.rejectedSteps,
    newtonIterations: stepper.newtonIterations,
  };
}
