import { DRIVER_NODES } from '../circuits/build-driver-circuit';
import { capacitorName, LADDER_NODES } from '../circuits/build-ladder-circuit';
import type { Design } from '../designs/design.types';
import { DomainError } from '../errors';
import type { Circuit } from '../sim/circuit.types';
import { MnaSystem } from '../sim/mna-system';
import { TurnOnTrigger } from '../sim/turn-on-events';
import { TransientStepper } from '../sim/transient';
import { driverDesignCircuit } from './driver-design-circuit';

/** Unknowns of a driver circuit that a run reads at every step (indices into the system's solution). */
export interface DriverProbes {
  /** Ladder top, V. */
  top: number;
  collector: number;
  supply: number;
  secondary: number;
  /** Primary winding current, A. */
  primary: number;
}

/** One driver run's circuit, its stepper and what every phase of the run reads. */
export interface DriverRunFrame {
  circuit: Circuit;
  system: MnaSystem;
  stepper: TransientStepper;
  probes: DriverProbes;
  /** The transistor's turn-on events, which close windows and cycles. */
  trigger: TurnOnTrigger;
  /** Each ladder capacitor's reactive index (design order). */
  capIndex: number[];
  /** Ladder capacitances (design order), F. */
  capsF: number[];
  estimatePeriodS: number;
  /** Throws a DomainError of code 'cancelled' when the caller asked to stop. */
  checkCancel: () => void;
}

/**
 * The driver circuit of a design from the given ladder capacitor voltages (design order, V), its stepper
 * started from those charges (steps at most `maxStepS`), its probes and the turn-on trigger.
 */
export function openDriverRun(
  design: Design,
  initialCapacitorVoltagesV: ReadonlyArray<number>,
  estimatePeriodS: number,
  options: { maxStepS?: number; relativeTolerance?: number; shouldCancel?: () => boolean },
): DriverRunFrame {
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  const capsF = design.multiplier.capacitors.map((c) => c.valueF);
  const circuit = driverDesignCircuit(design, initialCapacitorVoltagesV);
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, {
    maxStepS: options.maxStepS ?? estimatePeriodS / 200,
    ...(options.relativeTolerance !== undefined ? { tolerances: { relative: options.relativeTolerance } } : {}),
  });
  stepper.startFromCharges(system.initialCharge);
  return {
    circuit,
    system,
    stepper,
    probes: {
      top: system.probeIndex(LADDER_NODES.ladderTop),
      collector: system.probeIndex(DRIVER_NODES.collector),
      supply: system.probeIndex(DRIVER_NODES.supply),
      secondary: system.probeIndex(DRIVER_NODES.secondary),
      primary: system.probeIndex('I(T1.Lp)'),
    },
    trigger: new TurnOnTrigger(design.drive.driver.transformer.saturationCurrentA, 3 * estimatePeriodS),
    capIndex: capsF.map((_, i) => system.reactiveNames.indexOf(capacitorName(i))),
    capsF,
    estimatePeriodS,
    checkCancel: () => {
      if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The run was cancelled');
    },
  };
}

/**
 * The cycle mark (s) the step just taken crossed, or NaN: the trigger fed with the frame's last step (a mark is
 * the end of a turn-on's conduction pulse, turn-on-events.ts).
 */
export function pushTurnOn({ stepper, system, probes, trigger }: DriverRunFrame): number {
  return trigger.push(stepper.timeS, system.x[probes.primary]!, system.x[probes.collector]! - system.x[probes.supply]!);
}

/** Each ladder capacitor's voltage now (design order), V. */
export function capacitorVoltagesV({ stepper, capIndex, capsF }: DriverRunFrame): number[] {
  return capIndex.map((k, i) => stepper.q0[k]! / capsF[i]!);
}
