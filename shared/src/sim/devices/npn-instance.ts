import type { NpnModel } from '../circuit.types';
import type { BandedLu } from '../solver/banded-lu';
import { evaluateNpn, type NpnOperatingPoint } from './bjt';
import { criticalVoltageV, depletionCharge, limitJunctionVoltage, THERMAL_VOLTAGE_V, wasLimited } from './junction';
import { junctionOffsets, stampJunction, type AddReactive } from './junction-stamp';

// Local copies of the device functions, so the inner loop does not go through a module accessor per call.
const npnAt = evaluateNpn;
const limitJunction = limitJunctionVoltage;
const lastWasLimited = wasLimited;
const depletionAt = depletionCharge;
const stamp = stampJunction;

/** An NPN transistor (Ebers–Moll with junction charges): its stamp, load and convergence test. */
export class NpnInstance {
  lastVbe = 0;
  lastVbc = 0;
  private lastIc = 0;
  private lastIb = 0;
  private gcbe = 0;
  private gcbc = 0;
  private gbbe = 0;
  private gbbc = 0;
  private readonly vcrit: number;
  private readonly rows: Int32Array;
  private readonly reactiveBe: number;
  private readonly reactiveBc: number;
  private readonly beOffsets: Int32Array;
  private readonly bcOffsets: Int32Array;

  constructor(
    name: string,
    readonly model: NpnModel,
    readonly collector: number,
    readonly base: number,
    readonly emitter: number,
    lu: BandedLu,
    addReactive: AddReactive,
  ) {
    this.vcrit = criticalVoltageV(model.saturationCurrentA, THERMAL_VOLTAGE_V);
    // rows C, B, E × columns C, B, E
    const t = [collector, base, emitter];
    this.rows = new Int32Array(9);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) this.rows[i * 3 + j] = lu.offsetOf(t[i]!, t[j]!);
    this.beOffsets = junctionOffsets(lu, base, emitter);
    this.bcOffsets = junctionOffsets(lu, base, collector);
    this.reactiveBe =
      (model.baseEmitterCapacitanceF ?? 0) > 0
        ? addReactive(
            `${name}.be`,
            base,
            emitter,
            [
              [base, 0],
              [emitter, 0],
            ],
            0,
          )
        : -1;
    this.reactiveBc =
      (model.baseCollectorCapacitanceF ?? 0) > 0
        ? addReactive(
            `${name}.bc`,
            base,
            collector,
            [
              [base, 0],
              [collector, 0],
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
    out: NpnOperatingPoint,
    qOut: { chargeC: number; capacitanceF: number },
  ): boolean {
    const vb = x[this.base]!;
    const vbe = limitJunction(vb - x[this.emitter]!, this.lastVbe, THERMAL_VOLTAGE_V, this.vcrit);
    let limited = lastWasLimited();
    const vbc = limitJunction(vb - x[this.collector]!, this.lastVbc, THERMAL_VOLTAGE_V, this.vcrit);
    limited = limited || lastWasLimited();
    this.lastVbe = vbe;
    this.lastVbc = vbc;
    npnAt(this.model, vbe, vbc, out);
    // Currents into C and B as linear functions of Vbe = Vb − Ve, Vbc = Vb − Vc; Ie = −(Ic + Ib).
    const gcbe = out.dCollectorDVbe;
    const gcbc = out.dCollectorDVbc;
    const gbbe = out.dBaseDVbe;
    const gbbc = out.dBaseDVbc;
    this.lastIc = out.collectorA;
    this.lastIb = out.baseA;
    this.gcbe = gcbe;
    this.gcbc = gcbc;
    this.gbbe = gbbe;
    this.gbbc = gbbc;
    const icEq = out.collectorA - gcbe * vbe - gcbc * vbc;
    const ibEq = out.baseA - gbbe * vbe - gbbc * vbc;
    const r = this.rows;
    // row C: d/dVc = −gcbc, d/dVb = gcbe + gcbc, d/dVe = −gcbe
    band[r[0]!]! -= gcbc;
    band[r[1]!]! += gcbe + gcbc;
    band[r[2]!]! -= gcbe;
    band[r[3]!]! -= gbbc;
    band[r[4]!]! += gbbe + gbbc;
    band[r[5]!]! -= gbbe;
    band[r[6]!]! += gcbc + gbbc;
    band[r[7]!]! -= gcbe + gcbc + gbbe + gbbc;
    band[r[8]!]! += gcbe + gbbe;
    rhs[this.collector]! -= icEq;
    rhs[this.base]! -= ibEq;
    rhs[this.emitter]! += icEq + ibEq;
    const m = this.model;
    const vj = m.junctionPotentialV ?? 0.75;
    const mj = m.gradingCoefficient ?? 0.33;
    if (this.reactiveBe >= 0)
      this.loadJunctionCharge(
        this.reactiveBe,
        this.beOffsets,
        this.base,
        this.emitter,
        vbe,
        m.baseEmitterCapacitanceF ?? 0,
        vj,
        mj,
        band,
        rhs,
        a0,
        charge,
        gradient,
        gradientStart,
        qOut,
      );
    if (this.reactiveBc >= 0)
      this.loadJunctionCharge(
        this.reactiveBc,
        this.bcOffsets,
        this.base,
        this.collector,
        vbc,
        m.baseCollectorCapacitanceF ?? 0,
        vj,
        mj,
        band,
        rhs,
        a0,
        charge,
        gradient,
        gradientStart,
        qOut,
      );
    return limited;
  }

  /** SPICE's device test on the collector and base currents (as bjtconv). */
  isConverged(x: Float64Array, relative: number, absoluteA: number): boolean {
    const vb = x[this.base]!;
    const dvbe = vb - x[this.emitter]! - this.lastVbe;
    const dvbc = vb - x[this.collector]! - this.lastVbc;
    const ic = this.lastIc + this.gcbe * dvbe + this.gcbc * dvbc;
    const ib = this.lastIb + this.gbbe * dvbe + this.gbbc * dvbc;
    return (
      Math.abs(ic - this.lastIc) <= relative * Math.max(Math.abs(ic), Math.abs(this.lastIc)) + absoluteA &&
      Math.abs(ib - this.lastIb) <= relative * Math.max(Math.abs(ib), Math.abs(this.lastIb)) + absoluteA
    );
  }

  private loadJunctionCharge(
    reactive: number,
    o: Int32Array,
    a: number,
    b: number,
    v: number,
    cj0: number,
    vj: number,
    mj: number,
    band: Float64Array,
    rhs: Float64Array,
    a0: number,
    charge: Float64Array,
    gradient: Float64Array,
    gradientStart: Int32Array,
    qOut: { chargeC: number; capacitanceF: number },
  ): void {
    depletionAt(v, cj0, vj, mj, qOut);
    charge[reactive] = qOut.chargeC;
    const p = gradientStart[reactive]!;
    gradient[p] = qOut.capacitanceF;
    gradient[p + 1] = -qOut.capacitanceF;
    const gEq = a0 * qOut.capacitanceF;
    const iEq = a0 * (qOut.chargeC - qOut.capacitanceF * v);
    stamp(band, rhs, o, a, b, gEq, iEq);
  }
}
