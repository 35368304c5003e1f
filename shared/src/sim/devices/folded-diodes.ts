import type { DiodeModel } from '../circuit.types';
import type { BandedLu } from '../solver/banded-lu';
import { evaluateDiode, solveSeriesJunctionV, type DiodeOperatingPoint } from './diode';
import { criticalVoltageV, JUNCTION_GMIN_S, limitJunctionVoltage, THERMAL_VOLTAGE_V } from './junction';

// Local copies of the device functions, so the inner loop does not go through a module accessor per call.
const diodeAt = evaluateDiode;
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
export class FoldedDiodes {
  readonly count: number;
  private readonly models: DiodeModel[];
  private readonly anode: Int32Array;
  private readonly cathode: Int32Array;
  /** Band offsets of (a, a), (a, c), (c, a), (c, c) for each diode. */
  private readonly offsets: Int32Array;
  private readonly saturationA: Float64Array;
  private readonly vte: Float64Array;
  private readonly vcrit: Float64Array;
  private readonly seriesOhm: Float64Array;
  /** Terminal voltage below which the junction is a linear leak (see load); −Infinity if none. */
  private readonly farReverseV: Float64Array;
  private readonly farReverseScale: Float64Array;
  private readonly farReverseG: Float64Array;
  /** No breakdown knee: below −3·n·Vt the junction is the smooth leak of evaluateDiode's reverse branch. */
  private readonly reverseLeakOnly: Uint8Array;
  /** Junction voltage, current, junction and terminal conductance and terminal voltage at the last load. */
  readonly lastV: Float64Array;
  readonly lastI: Float64Array;
  private readonly lastJunctionG: Float64Array;
  private readonly lastG: Float64Array;
  private readonly lastTerminalV: Float64Array;
  /** Predicted junction voltage for the next load, where hasPrediction. */
  private readonly predictedV: Float64Array;
  private readonly hasPrediction: Uint8Array;
  /** Set by a state restore: lastI, lastTerminalV and lastJunctionG do not belong to lastV. */
  private readonly isStale: Uint8Array;
  private readonly out: DiodeOperatingPoint = { currentA: 0, conductanceS: 0 };

  constructor(diodes: ReadonlyArray<FoldedDiodeSpec>, lu: BandedLu) {
    const n = diodes.length;
    this.count = n;
    this.models = diodes.map((d) => d.model);
    this.anode = Int32Array.from(diodes, (d) => d.anode);
    this.cathode = Int32Array.from(diodes, (d) => d.cathode);
    this.offsets = new Int32Array(4 * n);
    const f64 = (): Float64Array => new Float64Array(n);
    this.saturationA = f64();
    this.vte = f64();
    this.vcrit = f64();
    this.seriesOhm = f64();
    this.farReverseV = f64();
    this.farReverseScale = f64();
    this.farReverseG = f64();
    this.reverseLeakOnly = new Uint8Array(n);
    this.lastV = f64();
    this.lastI = f64();
    this.lastJunctionG = f64();
    this.lastG = f64();
    this.lastTerminalV = f64();
    this.predictedV = f64();
    this.hasPrediction = new Uint8Array(n);
    this.isStale = new Uint8Array(n);
    diodes.forEach((d, k) => {
      const a = d.anode;
      const c = d.cathode;
      this.offsets.set([lu.offsetOf(a, a), lu.offsetOf(a, c), lu.offsetOf(c, a), lu.offsetOf(c, c)], 4 * k);
      const m = d.model;
      const vte = m.emissionCoefficient * THERMAL_VOLTAGE_V;
      const rs = m.seriesResistanceOhm;
      const leakOnly = !((m.breakdownVoltageV ?? 0) > 0);
      this.saturationA[k] = m.saturationCurrentA;
      this.vte[k] = vte;
      this.vcrit[k] = criticalVoltageV(m.saturationCurrentA, vte);
      this.seriesOhm[k] = rs;
      this.reverseLeakOnly[k] = leakOnly ? 1 : 0;
      // Far in reverse (|3·n·Vt/(e·v)| < 1e-3) the leak is −Is·(1 + ε) + gmin·v with ε < 1e-9: linear.
      this.farReverseV[k] = leakOnly ? -(3 * vte) / (Math.E * 1e-3) - rs * m.saturationCurrentA : -Infinity;
      this.farReverseScale[k] = 1 / (1 + rs * gminS);
      this.farReverseG[k] = gminS / (1 + rs * gminS);
    });
  }

  /** Stamps every diode linearized at x (or at its predicted junction voltage) into band and rhs. */
  load(x: Float64Array, band: Float64Array, rhs: Float64Array): void {
    const out = this.out;
    const offsets = this.offsets;
    for (let k = 0; k < this.count; k++) {
      const a = this.anode[k]!;
      const c = this.cathode[k]!;
      const rs = this.seriesOhm[k]!;
      let u: number;
      let v: number;
      let i: number;
      let gj: number;
      let g: number;
      if (this.hasPrediction[k] === 1) {
        this.hasPrediction[k] = 0;
        // Linearized at the predicted junction voltage v: the point (u, I) = (v + Rs·I(v), I(v)) of the curve.
        v = this.predictedV[k]!;
        diodeAt(this.models[k]!, v, out);
        i = out.currentA;
        gj = out.conductanceS;
        if (Number.isFinite(i) && Number.isFinite(gj)) {
          u = v + rs * i;
          g = gj / (1 + rs * gj);
          this.record(k, u, v, i, gj, g);
          stamp(band, rhs, offsets, k, a, c, g, i - g * u);
          continue;
        }
      }
      u = x[a]! - x[c]!;
      const vte = this.vte[k]!;
      // After a restored state the last load's current and terminal voltage belong to an abandoned iterate:
      // start from the junction voltage alone.
      const isStale = this.isStale[k] === 1;
      this.isStale[k] = 0;
      const is = this.saturationA[k]!;
      const lastV = this.lastV[k]!;
      let iLin = 0;
      if (u < this.farReverseV[k]!) {
        // The linear leak, v + Rs·I(v) = u solved exactly with the constants of the constructor.
        v = (u + rs * is) * this.farReverseScale[k]!;
        i = gminS * v - is;
        gj = gminS;
        g = this.farReverseG[k]!;
      } else {
        const v0 = u - rs * this.lastI[k]!;
        if (!isStale && this.reverseLeakOnly[k] === 1 && u < -6 * vte && lastV < -3 * vte && v0 < -3 * vte) {
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
        } else if (!isStale && (iLin = this.lastI[k]! + this.lastG[k]! * (u - this.lastTerminalV[k]!)) > 0 && iLin < this.lastI[k]! && process.env.CURB) {
          v = vte * Math.log1p(iLin / is);
          diodeAt(this.models[k]!, v, out);
          i = out.currentA;
          gj = out.conductanceS;
          u = v + rs * i;
        } else {
          // Start the local solve at the Newton step from the last junction point (v moves by
          // du/(1 + Rs·gj)): a reverse junction, near linear, then needs one evaluation, a conducting one
          // one fewer.
          const guess = isStale ? lastV : lastV + (u - this.lastTerminalV[k]!) / (1 + rs * this.lastJunctionG[k]!);
          v = solveJunction(this.models[k]!, u, guess, out);
          i = out.currentA;
          gj = out.conductanceS;
        }
        g = gj / (1 + rs * gj);
      }
      this.record(k, u, v, i, gj, g);
      stamp(band, rhs, offsets, k, a, c, g, i - g * u);
    }
  }

  private record(k: number, u: number, v: number, i: number, gj: number, g: number): void {
    this.lastJunctionG[k] = gj;
    this.lastV[k] = v;
    this.lastTerminalV[k] = u;
    this.lastI[k] = i;
    this.lastG[k] = g;
  }

  /** SPICE's device test on every diode: the linearized current change to solution x is within tolerance. */
  isConverged(x: Float64Array, relative: number, absoluteA: number): boolean {
    for (let k = 0; k < this.count; k++) {
      const du = x[this.anode[k]!]! - x[this.cathode[k]!]! - this.lastTerminalV[k]!;
      const lastV = this.lastV[k]!;
      const knee = -3 * this.vte[k]!;
      // A junction that stays below −3·n·Vt without breakdown is a near-linear leak.
      if (lastV < knee && lastV + du < knee && this.reverseLeakOnly[k] === 1) continue;
      const lastI = this.lastI[k]!;
      const change = this.lastG[k]! * du;
      if (Math.abs(change) > relative * Math.max(Math.abs(lastI + change), Math.abs(lastI)) + absoluteA) return false;
    }
    return true;
  }

  /**
   * Moves each diode's last point from where it was linearized to the terminal voltage of solution x
   * along the linearization (v by du/(1 + Rs·gj), I by g·du): within the device tolerance of the curve
   * once Newton has converged, and where the next step's local solve and predictor should start.
   */
  moveTo(x: Float64Array): void {
    for (let k = 0; k < this.count; k++) {
      if (this.isStale[k] === 1) continue;
      const du = x[this.anode[k]!]! - x[this.cathode[k]!]! - this.lastTerminalV[k]!;
      if (du === 0) continue;
      this.lastV[k]! += du / (1 + this.seriesOhm[k]! * this.lastJunctionG[k]!);
      this.lastI[k]! += this.lastG[k]! * du;
      this.lastTerminalV[k]! += du;
    }
  }

  /** Junction voltages into `into` from `at` (after moveTo). */
  save(into: Float64Array, at: number): void {
    into.set(this.lastV, at);
  }

  restore(from: Float64Array, at: number): void {
    this.lastV.set(from.subarray(at, at + this.count));
    this.hasPrediction.fill(0);
    this.isStale.fill(1);
  }

  /**
   * Predictor for the first load of a step: each diode is linearized at its junction voltage extrapolated
   * from the last two accepted points (v0 + ratio·(v0 − v−1), pnjlim-limited against v0), not at the
   * terminal voltage of the predicted unknowns (see MnaSystem.predictJunctions). Diodes with a breakdown
   * knee, just restored, or far in reverse at both ends (a linear leak, exact at any predicted u) are left
   * to the predicted unknowns.
   */
  predict(current: Float64Array, previous: Float64Array, at: number, ratio: number): void {
    for (let k = 0; k < this.count; k++) {
      if (this.reverseLeakOnly[k] !== 1 || this.isStale[k] === 1) continue;
      const v0 = current[at + k]!;
      const extrapolated = v0 + ratio * (v0 - previous[at + k]!);
      const far = this.farReverseV[k]!;
      if (v0 < far && extrapolated < far) continue;
      const v = limitJunction(extrapolated, v0, this.vte[k]!, this.vcrit[k]!);
      if (!Number.isFinite(v)) continue;
      this.predictedV[k] = v;
      this.hasPrediction[k] = 1;
    }
  }
}

/** Linearized diode k: current g·(Va − Vc) + iEq from a to c. */
function stamp(
  band: Float64Array,
  rhs: Float64Array,
  offsets: Int32Array,
  k: number,
  a: number,
  c: number,
  g: number,
  iEq: number,
): void {
  const o = 4 * k;
  band[offsets[o]!]! += g;
  band[offsets[o + 1]!]! -= g;
  band[offsets[o + 2]!]! -= g;
  band[offsets[o + 3]!]! += g;
  rhs[a]! -= iEq;
  rhs[c]! += iEq;
}
