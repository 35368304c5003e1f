import type { MethodInfo } from '../methods';
import type { PulseDrive, SineDrive, Topology } from '../designs/design.types';

/**
 * The Shockley parameters the steady-state model needs from a diode: the part of the simulator's diode
 * model (sim/circuit.types.ts DiodeModel) that the charge-transfer model reads.
 */
export interface ShockleyDiode {
  saturationCurrentA: number;
  emissionCoefficient: number;
  seriesResistanceOhm: number;
  /** Zero-bias junction capacitance (F), SPICE CJO: not in the steady-state model, but in the driver's ring-back. */
  junctionCapacitanceF?: number;
}

/**
 * A bare ladder for analysis: capacitors in the MultiplierSpec order (from the source upward),
 * a resolved secondary waveform, the diode model and what is connected at the output.
 */
export interface LadderInput {
  topology: Topology;
  capacitorsF: readonly number[];
  drive: SineDrive | PulseDrive;
  diode: ShockleyDiode;
  /** +1 for a positive ladder, −1 for a negative one (diodes reversed; forward and flyback swap roles). */
  polarity: 1 | -1;
  /** External load at the load terminal (after the series output resistor); null for none. */
  load: { kind: 'current'; currentA: number } | { kind: 'resistance'; resistanceOhm: number } | null;
  /** Total resistance of the bleeder string across the ladder top; null for none. */
  bleederOhm: number | null;
  seriesOutputResistanceOhm: number;
  /** Stray capacitance of every ladder node to ground (default 0). */
  strayCapacitanceF?: number;
  /** Largest current the source can deliver (an energy-limited driver); caps the switch-on surge estimate. */
  sourceCurrentLimitA?: number;
  /** Junction temperature for the thermal voltage; default 300 K. */
  temperatureK?: number;
}

/** Operating figures of one capacitor over the steady-state cycle. */
export interface CapacitorStress {
  index: number;
  column: 'oscillating' | 'smoothing' | 'oscillating-a' | 'oscillating-b' | 'bridge';
  stage: number;
  valueF: number;
  /** Largest magnitude of its voltage over the cycle. */
  maxVoltageV: number;
  /** Peak-to-peak change of its voltage over the cycle. */
  swingV: number;
}

/** Operating figures of one diode over the steady-state cycle. */
export interface DiodeStress {
  index: number;
  /** Largest reverse voltage over the cycle (at the opposite extreme of the drive). */
  peakInverseV: number;
  averageCurrentA: number;
  /** Mean current during conduction (charge per conduction over the conduction time). */
  conductionCurrentA: number;
  /** First-cycle charging current at switch-on with empty capacitors: drive peak over source plus diode resistance. */
  surgeCurrentA: number;
  forwardDropV: number;
}

/** Column of a ladder node: a winding end, a capacitor column, or the load terminal after the series resistor. */
export type LadderNodeColumn = 'oscillating' | 'smoothing' | 'source' | 'output';

/** Voltage of one ladder node to the circuit ground over the steady-state cycle (signed by polarity). */
export interface LadderNodeVoltage {
  /** The simulator's name of the same node (sim/build-circuit.ts): 's', 'n3', 'top', 'out', 'a2', 'mid', … */
  id: string;
  label: string;
  column: LadderNodeColumn;
  /** Stage the node belongs to (0 for a winding end). */
  stage: number;
  /** 1-based index of the capacitor whose upper plate is this node; null for a winding end or the load terminal. */
  capacitorIndex: number | null;
  meanV: number;
  minV: number;
  maxV: number;
}

/** Steady-state result of analyzeLadder, SI units, signed by the ladder polarity. */
export interface LadderAnalysis {
  topology: Topology;
  cellCount: number;
  stageCount: number;
  /** Load terminal, no external load (the bleeder still draws). */
  noLoadOutputV: number;
  /** Load terminal, cycle mean / min / max at the operating load. */
  outputMeanV: number;
  outputMinV: number;
  outputMaxV: number;
  ripplePeakToPeakV: number;
  /** |no-load mean − loaded mean|. */
  droopV: number;
  /** −d(mean output)/d(load current) at the operating point, including the series output resistor. */
  outputImpedanceOhm: number;
  /** Mean at the ladder top (where the bleeder sits). */
  ladderTopMeanV: number;
  loadCurrentA: number;
  bleederCurrentA: number;
  /** Current the ladder delivers: load plus bleeder. */
  ladderCurrentA: number;
  outputPowerW: number;
  /** Ideal no-load output: cells × peak for half-wave sine (see method). */
  idealNoLoadV: number;
  capacitors: CapacitorStress[];
  diodes: DiodeStress[];
  /** Every ladder node's voltage to ground at the operating point, winding ends first, the load terminal last. */
  nodes: LadderNodeVoltage[];
  nodeMethod: MethodInfo;
  /** Published closed forms where their conditions hold (equal capacitors; the doubler with any two); null otherwise. */
  textbook: TextbookFigures;
  method: MethodInfo;
}

export interface TextbookFigures {
  rippleV: number | null;
  dropV: number | null;
  regulation: number | null;
  optimumStages: number | null;
  method: MethodInfo;
}

export interface CurvePoint {
  x: number;
  y: number;
}

export interface LadderCurves {
  /** Mean load-terminal output vs external load current, 0 to short circuit. */
  regulation: CurvePoint[];
  shortCircuitCurrentA: number;
  /** Mean load-terminal output vs stage count at the operating load. */
  outputVsStages: CurvePoint[];
  optimumStages: number;
  optimumOutputV: number;
  method: MethodInfo;
}
