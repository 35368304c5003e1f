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

/** Series resistances of the collector, base and emitter (RC, RB, RE), 0 where the model has none. */
export function npnTerminalResistancesOhm(model: NpnModel): [number, number, number] {
  return [model.collectorResistanceOhm ?? 0, model.baseResistanceOhm ?? 0, model.emitterResistanceOhm ?? 0];
}

/** Name of the internal node behind terminal k (0 collector, 1 base, 2 emitter) of transistor `name`. */
export function npnInternalNodeName(name: string, terminal: number): string {
  return `${name}.${'cbe'[terminal]!}`;
}

/**
 * An NPN transistor (Gummel–Poon subset, see evaluateNpn) between its internal collector, base and emitter
 * (the terminals themselves where the model has no terminal resistance; those resistances are linear and
 * stamped by the system): its stamp, load and convergence test. Charges as SPICE's bjtload: base-emitter
 * depletion (CJE, VJE, MJE) plus TF times the forward diffusion current, which through qb also depends on
 * Vbc; base-collector depletion (CJC, VJC, MJC) plus TR times the reverse diffusion current; fc = 0.5.
 */
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
    this.bcOffsets = junctionOffsets(lu, base, collector);
    // The base-emitter charge depends on Vbc too (through qb) when there is a forward transit time.
    this.reactiveBe =
      (model.baseEmitterCapacitanceF ?? 0) > 0 || (model.forwardTransitTimeS ?? 0) > 0
        ? addReactive(
            `${name}.be`,
            base,
            emitter,
            [
              [base, 0],
              [emitter, 0],
              [collector, 0],
            ],
            0,
          )
        : -1;
    this.reactiveBc =
      (model.baseCollectorCapacitanceF ?? 0) > 0 || (model.reverseTransitTimeS ?? 0) > 0
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
    if (this.reactiveBe >= 0) {
      depletionAt(
        vbe,
        m.baseEmitterCapacitanceF ?? 0,
        m.baseEmitterPotentialV ?? 0.75,
        m.baseEmitterGrading ?? 0.33,
        qOut,
      );
      const tf = m.forwardTransitTimeS ?? 0;
      const q = qOut.chargeC + tf * out.forwardA;
      const cbe = qOut.capacitanceF + tf * out.dForwardDVbe;
      const cbc = tf * out.dForwardDVbc;
      const k = this.reactiveBe;
      charge[k] = q;
      const p = gradientStart[k]!;
      gradient[p] = cbe + cbc;
      gradient[p + 1] = -cbe;
      gradient[p + 2] = -cbc;
      // Current a0·q from base to emitter, linear in Vbe and Vbc.
      const gbe = a0 * cbe;
      const gbc = a0 * cbc;
      const iEq = a0 * (q - cbe * vbe - cbc * vbc);
      band[r[4]!]! += gbe + gbc;
      band[r[5]!]! -= gbe;
      band[r[3]!]! -= gbc;
      band[r[7]!]! -= gbe + gbc;
      band[r[8]!]! += gbe;
      band[r[6]!]! += gbc;
      rhs[this.base]! -= iEq;
      rhs[this.emitter]! += iEq;
    }
    if (this.reactiveBc >= 0) {
      depletionAt(
        vbc,
        m.baseCollectorCapacitanceF ?? 0,
        m.baseCollectorPotentialV ?? 0.75,
        m.baseCollectorGrading ?? 0.33,
        qOut,
      );
      const tr = m.reverseTransitTimeS ?? 0;
      const q = qOut.chargeC + tr * out.reverseA;
      const c = qOut.capacitanceF + tr * out.dReverseDVbc;
      const k = this.reactiveBc;
      charge[k] = q;
      const p = gradientStart[k]!;
      gradient[p] = c;
      gradient[p + 1] = -c;
      stamp(band, rhs, this.bcOffsets, this.base, this.collector, a0 * c, a0 * (q - c * vbc));
    }
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
}
