import type { LadderCircuitSpec } from './build-ladder-circuit';
import { idealCapacitorVoltagesV } from './build-ladder-circuit';
import { solveDense } from '../sim/solver/dense-lu';

/**
 * Capacitor voltages of a loaded half-wave cascade at t = 0 of a drive period, from charge balance with
 * ideal diodes and a stiff drive: in the periodic steady state every diode of the chain passes the charge
 * q = I/f per cycle (the DC current of the chain), each diode ends its conduction at zero forward voltage
 * at the drive extreme where its anode node peaks, and between conduction instants only the load drains
 * the top node (the classic derivation of the cascade's droop, REFERENCES.md §1). The conditions are
 * linear in the charges: one dense solve of size cellCount. The load current is the current load plus
 * the bleeder and any resistive load at the ideal output. Other topologies get the ideal no-load voltages.
 * Used as the starting state of the periodic steady state, whose Newton iteration needs every diode to
 * conduct at its proper phase from the first period.
 */
export function chargeBalanceCapacitorVoltagesV(spec: LadderCircuitSpec): number[] {
  const ideal = idealCapacitorVoltagesV(spec);
  if (spec.topology !== 'half-wave') return ideal;
  const k = spec.cellCount;
  const c = spec.capacitorsF;
  const d = spec.drive;
  const periodS = 1 / d.frequencyHz;
  const plusV = d.kind === 'sine' ? d.peakV : d.forwardPeakV;
  const minusV = d.kind === 'sine' ? d.peakV : d.flybackPeakV;
  // Times of the positive and negative extremes within the period, as fractions.
  const plusAt = d.kind === 'sine' ? 0.25 : 0;
  const minusAt = d.kind === 'sine' ? 0.75 : d.dutyCycle;
  const idealTopV = Math.abs(ideal.reduce((sum, v, i) => (i % 2 === (k - 1) % 2 ? sum + Math.abs(v) : sum), 0));
  let loadA = spec.load?.kind === 'current' ? Math.abs(spec.load.currentA) : 0;
  if (spec.load?.kind === 'resistance') loadA += idealTopV / spec.load.resistanceOhm;
  if (spec.bleederOhm) loadA += idealTopV / spec.bleederOhm;
  const q = loadA * periodS;
  // Chain node j (−1 … k) carries coefficient(j)·source plus the capacitors down its parity line; of
  // the fixed nodes −1 and 0 one is the source, the other ground.
  const even = k % 2 === 0;
  const coefficient = (j: number): number => ((((j % 2) + 2) % 2 === 0) === even ? 0 : 1);
  // Charge changes of every capacitor (positive plate at chain node i) for diode transfers and a load drain.
  const changes = (transfer: (i: number) => number, drainC: number): Float64Array => {
    const dq = new Float64Array(k + 3);
    for (let i = k; i >= 1; i--) {
      const into = transfer(i) - (i + 1 <= k ? transfer(i + 1) : drainC);
      dq[i] = into + (i + 2 <= k ? dq[i + 2]! : 0);
    }
    return dq;
  };
  const conductsAtPlus = (i: number): boolean => coefficient(i - 1) - coefficient(i) > 0;
  const minusTransfer = changes((i) => (conductsAtPlus(i) ? 0 : q), q * ((minusAt - plusAt + 1) % 1));
  // Unknowns: the charges just after the positive-extreme conduction. Row per diode: forward voltage 0.
  const a = new Float64Array(k * k);
  const b = new Float64Array(k);
  for (let i = 1; i <= k; i++) {
    const atPlus = conductsAtPlus(i);
    const sourceV = atPlus ? plusV : -minusV;
    // Node voltage of chain node j = Σ of the capacitor voltages down its parity line + coefficient·source.
    let constant = 0;
    const addNode = (j: number, sign: number): void => {
      constant += sign * coefficient(j) * sourceV;
      for (let m = j; m >= 1; m -= 2) {
        a[(i - 1) * k + (m - 1)]! += sign / c[m - 1]!;
        if (!atPlus) constant += (sign * minusTransfer[m]!) / c[m - 1]!;
      }
    };
    addNode(i - 1, 1);
    addNode(i, -1);
    b[i - 1] = -constant;
  }
  solveDense(a, b, k);
  const afterMinus = changes(() => 0, q * ((1 - minusAt) % 1));
  const sign = spec.isNegative ? -1 : 1;
  return Array.from({ length: k }, (_, i) => (sign * (b[i]! + minusTransfer[i + 1]! + afterMinus[i + 1]!)) / c[i]!);
}
