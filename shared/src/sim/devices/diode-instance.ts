import type { DiodeModel } from '../circuit.types';
import type { BandedLu } from '../solver/banded-lu';
import { evaluateDiode, type DiodeOperatingPoint } from './diode';
import { criticalVoltageV, depletionCharge, limitJunctionVoltage, THERMAL_VOLTAGE_V, wasLimited } from './junction';
import { junctionOffsets, stampJunction, type AddReactive } from './junction-stamp';

// Local copies of the device functions, so the inner loop does not go through a module accessor per call.
const diodeAt = evaluateDiode;
const limitJunction = limitJunctionVoltage;
const lastWasLimited = wasLimited;
const depletionAt = depletionCharge;
const stamp = stampJunction;

/**
 * A diode keeps an internal node between its series resistance and its junction only when the junction
 * carries charge; otherwise the resistance is folded into the element (the junction voltage is solved
 * locally, so the circuit matrix has one unknown fewer per diode; see FoldedDiodes).
 */
export function hasInternalNode(model: DiodeModel): boolean {
  return model.seriesResistanceOhm > 0 && ((model.junctionCapacitanceF ?? 0) > 0 || (model.transitTimeS ?? 0) > 0);
}

/** Whether a diode is one of the FoldedDiodes (series resistance, no junction charge). */
export function isFolded(model: DiodeModel): boolean {
  return model.seriesResistanceOhm > 0 && !hasInternalNode(model);
}

/** A diode with an internal node (series resistance and junction charge) or without series resistance. */
export class DiodeInstance {
  lastV = 0;
  /** DC current and conductance at lastV, for the device convergence test. */
  lastI = 0;
  lastG = 0;
  private readonly vte: number;
  private readonly vcrit: number;
  private readonly offsets: Int32Array;
  private readonly reactive: number;
  private readonly hasCharge: boolean;

  constructor(
    name: string,
    readonly model: DiodeModel,
    readonly junction: number,
    readonly cathode: number,
    lu: BandedLu,
    addReactive: AddReactive,
  ) {
    this.vte = model.emissionCoefficient * THERMAL_VOLTAGE_V;
    this.vcrit = criticalVoltageV(model.saturationCurrentA, this.vte);
    this.offsets = junctionOffsets(lu, junction, cathode);
    this.hasCharge = (model.junctionCapacitanceF ?? 0) > 0 || (model.transitTimeS ?? 0) > 0;
    this.reactive = this.hasCharge
      ? addReactive(
          `${name}.junction`,
          junction,
          cathode,
          [
            [junction, 0],
            [cathode, 0],
          ],
          0,
        )
      : -1;
  }

  load(
    x: Float64Array,
    band: Float64Array,
    rhs: Float64Array,
    a0: number,
    charge: Float64Array,
    gradient: Float64Array,
    gradientStart: Int32Array,
    out: DiodeOperatingPoint,
    qOut: { chargeC: number; capacitanceF: number },
  ): boolean {
    let v = limitJunction(x[this.junction]! - x[this.cathode]!, this.lastV, this.vte, this.vcrit);
    let limited = lastWasLimited();
    // In reverse breakdown the same limiting applies to the voltage beyond the knee (SPICE3 dioload).
    const bv = this.model.breakdownVoltageV;
    if (bv !== undefined && bv > 0 && !limited && v < Math.min(0, -bv + 10 * this.vte)) {
      v = -(limitJunction(-(v + bv), -(this.lastV + bv), this.vte, this.vcrit) + bv);
      limited = lastWasLimited();
    }
    this.lastV = v;
    diodeAt(this.model, v, out);
    this.lastI = out.currentA;
    this.lastG = out.conductanceS;
    let gEq = out.conductanceS;
    let iEq = out.currentA - gEq * v;
    if (this.hasCharge) {
      const m = this.model;
      depletionAt(v, m.junctionCapacitanceF ?? 0, m.junctionPotentialV ?? 1, m.gradingCoefficient ?? 0.5, qOut);
      const tt = m.transitTimeS ?? 0;
      const q = qOut.chargeC + tt * out.currentA;
      const cap = qOut.capacitanceF + tt * out.conductanceS;
      charge[this.reactive] = q;
      const p = gradientStart[this.reactive]!;
      gradient[p] = cap;
      gradient[p + 1] = -cap;
      gEq += a0 * cap;
      iEq += a0 * (q - cap * v);
    }
    stamp(band, rhs, this.offsets, this.junction, this.cathode, gEq, iEq);
    return limited;
  }

  /** SPICE's device test: the linearized current change to the new solution is within tolerance. */
  isConverged(x: Float64Array, relative: number, absoluteA: number): boolean {
    const v = x[this.junction]! - x[this.cathode]!;
    // Below −3·n·Vt and above any breakdown knee the junction is a near-linear leak (−Is and gmin): its
    // linearization is exact there, so the test would only chase the node voltages' rounding.
    const bv = this.model.breakdownVoltageV;
    const knee = bv !== undefined && bv > 0 ? -bv + 10 * this.vte : -Infinity;
    if (v < -3 * this.vte && this.lastV < -3 * this.vte && v > knee && this.lastV > knee) return true;
    const delta = v - this.lastV;
    const predicted = this.lastI + this.lastG * delta;
    return (
      Math.abs(predicted - this.lastI) <= relative * Math.max(Math.abs(predicted), Math.abs(this.lastI)) + absoluteA
    );
  }
}
