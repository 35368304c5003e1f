import { LADDER_NODES } from '../circuits/build-ladder-circuit';
import { followEnvelope, type EnvelopeResult } from '../sim/envelope-following';
import type { MnaSystem } from '../sim/mna-system';

/** The start-up of a ladder from empty capacitors to its periodic steady state, by envelope following. */
export interface LadderStartUp {
  envelope: EnvelopeResult;
  /** Cycle mean of the output at each envelope point: time at the start of the cycle, s; volts. */
  curve: { timeS: number[]; values: number[] };
  /** Cycle mean of the output at the periodic steady state, V (NaN when the envelope did not converge). */
  finalMeanV: number;
  /** End of the cycle whose mean first reaches 90 % of the final mean, s. */
  timeTo90PercentS: number | null;
  /** End of the cycle from which every cycle mean stays within 1 % of the final mean, s. */
  timeTo1PercentS: number | null;
}

/**
 * Cycle index (fractional, on the envelope's points joined by straight lines) where the curve first reaches
 * `level`, going the way of `sign`; null when it never does.
 */
function firstReach(cycles: number[], means: number[], level: number, sign: number): number | null {
  for (let i = 0; i < means.length; i++) {
    if (sign * means[i]! < sign * level) continue;
    if (i === 0) return cycles[0]!;
    const a = means[i - 1]!;
    const b = means[i]!;
    return cycles[i - 1]! + ((cycles[i]! - cycles[i - 1]!) * (level - a)) / (b - a);
  }
  return null;
}

/** Cycle index from which the curve stays within `band` of `final` (linear between points); null when it ends outside. */
function staysWithin(cycles: number[], means: number[], final: number, band: number): number | null {
  const n = means.length;
  const inside = (m: number): boolean => Math.abs(m - final) <= band;
  if (n === 0 || !inside(means[n - 1]!)) return null;
  let i = n - 1;
  while (i > 0 && inside(means[i - 1]!)) i--;
  if (i === 0) return cycles[0]!;
  const a = means[i - 1]!;
  const b = means[i]!;
  const edge = a < final ? final - band : final + band;
  return cycles[i - 1]! + ((cycles[i]! - cycles[i - 1]!) * (edge - a)) / (b - a);
}

/**
 * Start-up of a ladder from empty capacitors by envelope following over its cycle-to-cycle map
 * (`followEnvelope`, sim/envelope-following.ts: Petzold 1981; White and Leeb 1991), ending at the periodic
 * steady state: the charging curve as cycle means of the ladder top, the times to 90 % and to within 1 % of
 * the final mean (each the end of the cycle concerned, as a cycle-by-cycle transient counts them), and one
 * period of the steady-state output. Seconds and volts.
 */
export function followLadderStartUp(
  system: MnaSystem,
  options: {
    periodS: number;
    stepsPerPeriod: number;
    isNegative: boolean;
    onPoint?: (cycle: number, periods: number) => void;
  },
): LadderStartUp {
  const envelope = followEnvelope(system, {
    periodS: options.periodS,
    stepsPerPeriod: options.stepsPerPeriod,
    initialCharges: system.initialCharge,
    probe: LADDER_NODES.ladderTop,
    probes: [LADDER_NODES.ladderTop],
    ...(options.onPoint ? { onPoint: options.onPoint } : {}),
  });
  const { cycles, means } = envelope;
  const finalMeanV = envelope.isConverged ? envelope.finalMean : NaN;
  const sign = options.isNegative ? -1 : 1;
  const at90 = envelope.isConverged ? firstReach(cycles, means, 0.9 * finalMeanV, sign) : null;
  const at1 = envelope.isConverged ? staysWithin(cycles, means, finalMeanV, 0.01 * Math.abs(finalMeanV)) : null;
  return {
    envelope,
    curve: { timeS: cycles.map((k) => k * options.periodS), values: [...means] },
    finalMeanV,
    timeTo90PercentS: at90 === null ? null : (at90 + 1) * options.periodS,
    timeTo1PercentS: at1 === null ? null : (at1 + 1) * options.periodS,
  };
}
