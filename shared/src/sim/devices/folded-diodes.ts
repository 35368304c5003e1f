import type { DiodeModel } from '../circuit.types';
import type { BandedLu } from '../solver/banded-lu';
import { solveSeriesJunctionV, type DiodeOperatingPoint } from './diode';
import { criticalVoltageV, JUNCTION_GMIN_S, limitJunctionVoltage, THERMAL_VOLTAGE_V } from './junction';

// Local copies of the device functions, so the inner loop does not go through a module accessor per call.
const solveJunction = solveSeriesJunctionV;
const limitJunction = limitJunctionVoltage;
const gminS = JUNCTION_GMIN_S;

/** A diode whose series resistance is folded into the element (no internal node, no junction charge). */
export interface FoldedDiodeSpec {
  model: DiodeModel;
  /** Unknown index of the anode and the cathode (the ground is the system size). */
  anode: number;
  cathode: number;
}

/**
 * The diodes of a circuit whose series resistance Rs is folded into the element: for the terminal voltage
 * u, the junction voltage v solves v + Rs·I(v) = u (solveSeriesJunctionV), and the element conducts I
 * with dI/du = g/(1 + Rs·g). The circuit matrix has one unknown fewer per diode than with an internal
 * node. A ladder has tens of them and most sit far in reverse most of the time, so they are kept as
 * parallel arrays and loaded in one loop, the reverse cases inline.
 */
// Per-diode record in FoldedDiodes.p (one Float64Array, so the loop touches one array, not twenty).
const IS = 0; // saturation current
const VTE = 1; // n·Vt
const VCRIT = 2; // critical voltage (pnjlim)
const RS = 3; // series resistance
const FAR_V = 4; // terminal voltage below which the junction is a linear leak (see load); −Infinity if none
const FAR_SCALE = 5;
const FAR_G = 6;
const LEAK_ONLY = 7; // 1: no breakdown knee, below −3·n·Vt the smooth leak of evaluateDiode's reverse branch
const LAST_V = 8; // junction voltage at the last load
const LAST_I = 9; // current at the last load
const LAST_GJ = 10; // junction conductance at the last load
const LAST_G = 11; // terminal conductance at the last load
const LAST_U = 12; // terminal voltage at the last load
const PREDICTED_V = 13; // junction voltage the next load linearizes at, when HAS_PREDICTION is 1
const HAS_PREDICTION = 14;
const STALE = 15; // 1 after a state restore: LAST_I, LAST_U and LAST_GJ do not belong to LAST_V
const INV_VTE = 16; // 1/(n·Vt): the hot loop multiplies, a division costs several multiplications
const IS_INV_VTE = 17; // Is/(n·Vt)
const RECORD = 18;
/**
 * Share of SPICE's device tolerance (reltol·|I| + abstol) by which the current of a converged diode's
 * linearization may miss its curve at the solution (the residual test of isConverged).
 */
const RESIDUAL_FRACTION = 0.1;
// Per-diode indices in FoldedDiodes.q: anode, cathode, band offsets of (a, a), (a, c), (c, a), (c, c).
const INDICES = 6;

export class FoldedDiodes {
  readonly count: number;
  private readonly models: DiodeModel[];
  private readonly p: Float64Array;
  private readonly q: Int32Array;
  private readonly out: DiodeOperatingPoint = { currentA: 0, conductanceS: 0 };

  constructor(diodes: ReadonlyArray<FoldedDiodeSpec>, lu: BandedLu) {
    const n = diodes.length;
    this.count = n;
    this.models = diodes.map((d) => d.model);
    this.p = new Float64Array(RECORD * n);
    this.q = new Int32Array(INDICES * n);
    diodes.forEach((d, k) => {
      const a = d.anode;
      const c = d.cathode;
      this.q.set([a, c, lu.offsetOf(a, a), lu.offsetOf(a, c), lu.offsetOf(c, a), lu.offsetOf(c, c)], INDICES * k);
      const m = d.model;
      const vte = m.emissionCoefficient * THERMAL_VOLTAGE_V;
      const rs = m.seriesResistanceOhm;
      const leakOnly = !((m.breakdownVoltageV ?? 0) > 0);
      const r = RECORD * k;
      const p = this.p;
      p[r + IS] = m.saturationCurrentA;
      p[r + VTE] = vte;
      p[r + INV_VTE] = 1 / vte;
      p[r + IS_INV_VTE] = m.saturationCurrentA / vte;
      p[r + VCRIT] = criticalVoltageV(m.saturationCurrentA, vte);
      p[r + RS] = rs;
      p[r + LEAK_ONLY] = leakOnly ? 1 : 0;
      // Far in reverse (|3·n·Vt/(e·v)| < 1e-3) the leak is −Is·(1 + ε) + gmin·v with ε < 1e-9: linear.
      p[r + FAR_V] = leakOnly ? -(3 * vte) / (Math.E * 1e-3) - rs * m.saturationCurrentA : -Infinity;
      p[r + FAR_SCALE] = 1 / (1 + rs * gminS);
      p[r + FAR_G] = gminS / (1 + rs * gminS);
    });
  }

  /** Stamps every diode linearized at x (or at its predicted junction voltage) into band and rhs. */
  load(x: Float64Array, band: Float64Array, rhs: Float64Array): void {
    const out = this.out;
    const p = this.p;
    const q = this.q;
    for (let k = 0, r = 0, o = 0; k < this.count; k++, r += RECORD, o += INDICES) {
      const a = q[o]!;
      const c = q[o + 1]!;
      const rs = p[r + RS]!;
      let u: number;
      let v = 0;
      let i = 0;
      let gj = 0;
      let g: number;
      let isPredicted = false;
      if (p[r + HAS_PREDICTION] === 1) {
        p[r + HAS_PREDICTION] = 0;
        // Linearized at the predicted junction voltage v: the point (u, I) = (v + Rs·I(v), I(v)) of the curve.
        // Only junctions without a breakdown knee are predicted (see predict), so evaluateDiode's two
        // branches inline: the exponential from −3·n·Vt up, the reverse cubic below.
        v = p[r + PREDICTED_V]!;
        const vte = p[r + VTE]!;
        const is = p[r + IS]!;
        if (v >= -3 * vte) {
          const e = Math.exp(v * p[r + INV_VTE]!);
          i = is * (e - 1) + gminS * v;
          gj = p[r + IS_INV_VTE]! * e + gminS;
        } else {
          const arg = (3 * vte) / (v * Math.E);
          const arg3 = arg * arg * arg;
          i = -is * (1 + arg3) + gminS * v;
          gj = (is * 3 * arg3) / v + gminS;
        }
        isPredicted = Number.isFinite(i) && Number.isFinite(gj);
      }
      if (isPredicted) {
        u = v + rs * i;
        g = gj / (1 + rs * gj);
      } else {
        u = x[a]! - x[c]!;
        // After a restored state the last load's current and terminal voltage belong to an abandoned iterate:
        // start from the junction voltage alone.
        const isStale = p[r + STALE] === 1;
        p[r + STALE] = 0;
        const is = p[r + IS]!;
        if (u < p[r + FAR_V]!) {
          // The linear leak, v + Rs·I(v) = u solved exactly with the constants of the constructor.
          v = (u + rs * is) * p[r + FAR_SCALE]!;
          i = gminS * v - is;
          gj = gminS;
          g = p[r + FAR_G]!;
        } else {
          const vte = p[r + VTE]!;
          const lastV = p[r + LAST_V]!;
          const v0 = u - rs * p[r + LAST_I]!;
          if (!isStale && p[r + LEAK_ONLY] === 1 && u < -6 * vte && lastV < -3 * vte && v0 < -3 * vte) {
            // Reverse junction without breakdown: the leak I(v) = −Is·(1 + (3·n·Vt/(e·v))³) + gmin·v is nearly
            // linear, so one Newton step of v + Rs·I(v) = u from v0 = u − Rs·I_last leaves a residual of the
            // order of Rs·I″·Δv² (far below a femtovolt): the local solve in one evaluation, inline.
            const arg = (3 * vte) / (v0 * Math.E);
            const arg3 = arg * arg * arg;
            gj = (is * 3 * arg3) / v0 + gminS;
            i = -is * (1 + arg3) + gminS * v0;
            const dv = -(v0 + rs * i - u) / (1 + rs * gj);
            i += gj * dv;
            v = v0 + dv;
          } else {
            // Start the local solve at the Newton step from the last junction point (v moves by
            // du/(1 + Rs·gj)): a reverse junction, near linear, then needs one evaluation, a conducting one
            // one fewer.
            const guess = isStale ? lastV : lastV + (u - p[r + LAST_U]!) / (1 + rs * p[r + LAST_GJ]!);
            // Forward junction without a knee: Newton on v + Rs·I(v) = u inline from the guess (a call
            // would box its doubles), handing over to the bracketed solver if it leaves the forward
            // branch, overflows or has not converged in four evaluations.
            let isSolved = false;
            if (p[r + LEAK_ONLY] === 1 && !isStale) {
              const tolerance = 1e-12 * (1 + Math.abs(u));
              const invVte = p[r + INV_VTE]!;
              const isInvVte = p[r + IS_INV_VTE]!;
              const wMin = -3 * vte;
              const wMax = u > 0 ? u : 0;
              let w = guess;
              for (let it = 0; it < 4 && w >= wMin && w <= wMax; it++) {
                const e = Math.exp(w * invVte);
                const iw = is * (e - 1) + gminS * w;
                const gw = isInvVte * e + gminS;
                const residual = w + rs * iw - u;
                if (!(Math.abs(residual) < Infinity)) break;
                if (Math.abs(residual) <= tolerance) {
                  v = w;
                  i = iw;
                  gj = gw;
                  isSolved = true;
                  break;
                }
                const dw = -residual / (1 + rs * gw);
                // A short step (|x| < 1e-3, x = dw/(n·Vt)) leaves the residual Rs·Is·e^(w/nVt)·(e^x − 1 − x);
                // when that is within tolerance the point w + dw is the answer, its exponential the series of
                // e^x to x⁴ (truncation below 1e-17 relative): one exp per converged junction, not two.
                const xs = dw * invVte;
                if (xs < 1e-3 && xs > -1e-3) {
                  const rest = xs * xs * (0.5 + xs * (1 / 6 + xs / 24));
                  const vs = w + dw;
                  if (rs * is * e * rest <= tolerance && vs >= wMin && vs <= wMax) {
                    const es = e * (1 + xs + rest);
                    v = vs;
                    i = is * (es - 1) + gminS * vs;
                    gj = isInvVte * es + gminS;
                    isSolved = true;
                    break;
                  }
                }
                w += dw;
              }
            }
            if (!isSolved) {
              v = solveJunction(this.models[k]!, u, guess, out);
              i = out.currentA;
              gj = out.conductanceS;
            }
          }
          g = gj / (1 + rs * gj);
        }
      }
      // Record and stamp inline (a call would box every double argument): current g·(Va − Vc) + iEq.
      p[r + LAST_GJ] = gj;
      p[r + LAST_V] = v;
      p[r + LAST_U] = u;
      p[r + LAST_I] = i;
      p[r + LAST_G] = g;
      band[q[o + 2]!]! += g;
      band[q[o + 3]!]! -= g;
      band[q[o + 4]!]! -= g;
      band[q[o + 5]!]! += g;
      const iEq = i - g * u;
      rhs[a]! -= iEq;
      rhs[c]! += iEq;
    }
  }

  /**
   * Device test on every diode: SPICE's (the linearized current change to solution x is within tolerance),
   * or a residual test: the linearization's current at x is within RESIDUAL_FRACTION of that tolerance of
   * the diode's own curve, so x solves the diode's equation although Newton's step to it was larger. A
   * charging ladder's conducting diodes pass the second one iteration earlier.
   */
  isConverged(x: Float64Array, relative: number, absoluteA: number): boolean {
    const p = this.p;
    const q = this.q;
    for (let k = 0, r = 0, o = 0; k < this.count; k++, r += RECORD, o += INDICES) {
      const du = x[q[o]!]! - x[q[o + 1]!]! - p[r + LAST_U]!;
      const lastV = p[r + LAST_V]!;
      const knee = -3 * p[r + VTE]!;
      // A junction that stays below −3·n·Vt without breakdown is a near-linear leak.
      if (lastV < knee && lastV + du < knee && p[r + LEAK_ONLY] === 1) continue;
      const lastI = p[r + LAST_I]!;
      const g = p[r + LAST_G]!;
      const change = g * du;
      const tolerance = relative * Math.max(Math.abs(lastI + change), Math.abs(lastI)) + absoluteA;
      if (Math.abs(change) <= tolerance) continue;
      // The step is larger, but x may still solve the diode's equation: the tangent's error there is
      // ½·I″·du² with I″ = g·(1 − Rs·g)²/(n·Vt) on the exponential (dv = (1 − Rs·g)·du is the junction's
      // move). Within RESIDUAL_FRACTION of the tolerance, and for a junction move below a tenth of n·Vt
      // (where the second-order term is the error to within ten per cent), x is converged.
      if (p[r + LEAK_ONLY] === 1 && lastV >= knee) {
        const dv = (1 - p[r + RS]! * g) * du;
        if (
          dv < 0.1 * p[r + VTE]! &&
          dv > -0.1 * p[r + VTE]! &&
          0.5 * g * dv * dv * p[r + INV_VTE]! <= RESIDUAL_FRACTION * tolerance
        )
          continue;
      }
      return false;
    }
    return true;
  }

  /**
   * Moves each diode's last point from where it was linearized to the terminal voltage of solution x
   * along the linearization (v by du/(1 + Rs·gj), I by g·du): within the device tolerance of the curve
   * once Newton has converged, and where the next step's local solve and predictor should start; then
   * writes the junction voltages into `into` from `at`.
   */
  moveToAndSave(x: Float64Array, into: Float64Array, at: number): void {
    const p = this.p;
    const q = this.q;
    for (let k = 0, r = 0, o = 0; k < this.count; k++, r += RECORD, o += INDICES) {
      if (p[r + STALE] !== 1) {
        const du = x[q[o]!]! - x[q[o + 1]!]! - p[r + LAST_U]!;
        if (du !== 0) {
          p[r + LAST_V]! += du / (1 + p[r + RS]! * p[r + LAST_GJ]!);
          p[r + LAST_I]! += p[r + LAST_G]! * du;
          p[r + LAST_U]! += du;
        }
      }
      // The junction voltages, into `into` from `at`.
      into[at + k] = p[r + LAST_V]!;
    }
  }

  restore(from: Float64Array, at: number): void {
    for (let k = 0, r = 0; k < this.count; k++, r += RECORD) {
      this.p[r + LAST_V] = from[at + k]!;
      this.p[r + HAS_PREDICTION] = 0;
      this.p[r + STALE] = 1;
    }
  }

  /**
   * Predictor for the first load of a step: each diode is linearized at a junction voltage extrapolated
   * by the stepper (predicted[at + k], pnjlim-limited against the present v0 = current[at + k]), not at
   * the terminal voltage of the predicted unknowns (see MnaSystem.predictJunctions). Diodes with a
   * breakdown knee, just restored, or far in reverse at both ends (a linear leak, exact at any predicted u)
   * are left to the predicted unknowns.
   */
  predict(current: Float64Array, predicted: Float64Array, at: number): void {
    const p = this.p;
    for (let k = 0, r = 0; k < this.count; k++, r += RECORD) {
      if (p[r + LEAK_ONLY] !== 1 || p[r + STALE] === 1) continue;
      const v0 = current[at + k]!;
      const extrapolated = predicted[at + k]!;
      const far = p[r + FAR_V]!;
      if (v0 < far && extrapolated < far) continue;
      const v = limitJunction(extrapolated, v0, p[r + VTE]!, p[r + VCRIT]!);
      if (!Number.isFinite(v)) continue;
      p[r + PREDICTED_V] = v;
      p[r + HAS_PREDICTION] = 1;
    }
  }
}
