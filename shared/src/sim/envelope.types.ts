import type { SimulationTolerances } from './circuit.types';

export interface EnvelopeOptions {
  periodS: number;
  /** Fixed steps per period of the cycle map. */
  stepsPerPeriod: number;
  /** Charges and fluxes at t = 0 (MnaSystem reactive order); default the element initial conditions. */
  initialCharges?: Float64Array;
  /** Node whose cycle mean is followed (the charging curve). */
  probe: string;
  /** Local error allowed per envelope step, as a fraction of the largest charge; default 2e-3. */
  stepTolerance?: number;
  /** Periodic steady state: |Φ(q) − q| and the Newton update within this fraction of the largest charge; default 1e-6. */
  relativeTolerance?: number;
  /** Give up after this many cycles of circuit time; default 1e6. */
  maxCycles?: number;
  /** Give up after this many period evaluations (work); default 4000. */
  maxPeriods?: number;
  tolerances?: Partial<SimulationTolerances>;
  /** Probes recorded over one period at the last point (the periodic steady state's waveform when converged). */
  probes?: ReadonlyArray<string>;
  /** Called after each accepted point with the cycle reached and the periods run so far; may throw to cancel. */
  onPoint?: (cycle: number, periods: number) => void;
}

export interface EnvelopeResult {
  /** Cycle index of each point: the mean in `means` is over the cycle that starts there. */
  cycles: number[];
  /** Cycle mean of the probe at each point (on the start-up map, scaled to the final map's level when converged). */
  means: number[];
  /** Whether the last point is the periodic steady state (residual and Newton update within relativeTolerance). */
  isConverged: boolean;
  /** max |Φ(q) − q| / max |q| at the last point. */
  relativeResidual: number;
  /** Largest Newton update towards the fixed point at the last point, / max |q|: the distance still to go. */
  relativeDistance: number;
  /** State at the last point. */
  charges: Float64Array;
  /** Cycle mean of the probe at the last point. */
  finalMean: number;
  /** One period of the probes at the last point, from t = 0 to the period. */
  timeS: Float64Array;
  signals: Record<string, Float64Array>;
  periods: number;
  sensitivityPeriods: number;
  newtonIterations: number;
}
