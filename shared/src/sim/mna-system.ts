import { DomainError } from '../errors';
import type { Circuit } from './circuit.types';
import { GROUND_NODE } from './circuit.types';
import { emptyNpnOperatingPoint } from './devices/bjt';
import type { DiodeOperatingPoint } from './devices/diode';
import { DiodeInstance, hasInternalNode, isFolded } from './devices/diode-instance';
import { FoldedDiodes, type FoldedDiodeSpec } from './devices/folded-diodes';
import type { AddReactive } from './devices/junction-stamp';
import { NpnInstance, npnTerminalResistancesOhm } from './devices/npn-instance';
import { SaturableCoreInstance } from './devices/saturable-core';
import {
  addConductance,
  assertNamedElements,
  assertSaturableCore,
  positiveValue,
  ReactiveTable,
  stampLinearElement,
  switchStatesAt,
  addSwitchConductances,
  type SourceStamp,
  type SwitchStamp,
} from './element-stamps';
import { BandedLu } from './solver/banded-lu';
import { commonPeriodS, nextWaveformBreakpoint, waveformValue } from './source-waveforms';
import { orderUnknowns } from './unknown-ordering';

/**
 * Modified nodal analysis of a Circuit (C.-W. Ho, A. E. Ruehli and P. A. Brennan, IEEE Trans. Circuits
 * Syst. CAS-22(6), 1975): unknowns are node voltages and the currents of voltage sources and windings.
 * Every reactive element contributes a charge (capacitors, junctions) or a flux linkage (windings) q_r,
 * integrated as i_r = a0·q_r + hist_r; the integrator owns a0 and hist.
 *
 * Built once per circuit: the unknown ordering (reverse Cuthill–McKee), the band, every stamp's storage
 * offset, and the constant parts G and C of the matrix, so a Newton iteration is G + a0·C plus the
 * nonlinear devices, with no allocation. The ground is the slot `size` of every vector.
 */
export class MnaSystem {
  readonly size: number;
  readonly lu: BandedLu;
  readonly nodeIndex: Map<string, number>;
  readonly branchIndex: Map<string, number>;
  /** Internal junction node of each diode with series resistance, by element name. */
  readonly internalIndex: Map<string, number>;
  /** Unknown vector, length size + 1 (ground slot last, always 0). */
  readonly x: Float64Array;
  readonly rhs: Float64Array;
  /** Right-hand side of the current step (sources and integration history). */
  readonly stepRhs: Float64Array;
  private readonly conductanceBand: Float64Array;
  private readonly reactanceBand: Float64Array;
  private readonly linearBand: Float64Array;

  /** Reactive quantities: incidence (+1 at rowA, −1 at rowB) and gradient dq/dx in CSR form. */
  readonly reactiveCount: number;
  readonly reactiveRowA: Int32Array;
  readonly reactiveRowB: Int32Array;
  readonly gradientStart: Int32Array;
  readonly gradientIndex: Int32Array;
  readonly gradientValue: Float64Array;
  /** Charge or flux of each reactive quantity at the last load (nonlinear) or evaluation (linear). */
  readonly charge: Float64Array;
  readonly hist: Float64Array;
  readonly initialCharge: Float64Array;
  /** Names of the reactive quantities, e.g. 'C3' or 'T1.primary' or 'D2.junction'. */
  readonly reactiveNames: string[];
  private readonly linearReactiveCount: number;
  /** Whether any junction carries charge (its q(v) is then a nonlinearity the device test does not see). */
  readonly hasNonlinearCharges: boolean;

  private readonly sources: SourceStamp[] = [];
  private readonly switches: SwitchStamp[] = [];
  /** Diodes with an internal node or without series resistance; the folded ones are in `folded`. */
  private readonly diodes: DiodeInstance[] = [];
  private readonly folded: FoldedDiodes;
  private readonly npns: NpnInstance[] = [];
  private readonly cores: SaturableCoreInstance[] = [];
  private readonly diodeOut: DiodeOperatingPoint = { currentA: 0, conductanceS: 0 };
  private readonly npnOut = emptyNpnOperatingPoint();
  private readonly chargeOut = { chargeC: 0, capacitanceF: 0 };
  /** Extra conductance from every node to ground, used by gmin stepping. */
  shuntConductanceS = 0;
  private readonly nodeDiagonalOffsets: Int32Array;
  /** a0 and switch states of the present linearBand (NaN: not built yet). */
  private preparedA0 = NaN;
  private preparedKey = '';
  /**
   * Offsets of linearBand that a new a0 or switch state changes: where C is not zero, and the switches'
   * entries. Everywhere else linearBand stays G once built (nearly half a ladder's band).
   */
  private readonly varyingOffsets: Int32Array;

  constructor(circuit: Circuit) {
    const elements = circuit.elements;
    assertNamedElements(elements);

    const ordering = orderUnknowns(elements);
    const size = ordering.size;
    this.size = size;
    this.lu = new BandedLu(size, ordering.bandwidth, ordering.bandwidth);
    this.nodeIndex = ordering.nodeIndex;
    this.branchIndex = ordering.branchIndex;
    this.internalIndex = ordering.internalIndex;
    const { nodeAt } = ordering;

    this.x = new Float64Array(size + 1);
    this.rhs = new Float64Array(size + 1);
    this.stepRhs = new Float64Array(size + 1);
    const bandLength = this.lu.band.length;
    this.conductanceBand = new Float64Array(bandLength);
    this.reactanceBand = new Float64Array(bandLength);
    this.linearBand = new Float64Array(bandLength);
    this.nodeDiagonalOffsets = new Int32Array(
      [...this.nodeIndex.values(), ...this.internalIndex.values()].map((i) => this.lu.offsetOf(i, i)),
    );

    // Stamps. Reactive quantities: linear ones first, nonlinear junction charges after.
    const g = this.conductanceBand;
    const c = this.reactanceBand;
    const lu = this.lu;
    const reactives = new ReactiveTable();
    this.reactiveNames = reactives.names;
    const addReactive: AddReactive = (name, a, b, grad, q0) => reactives.add(name, a, b, grad, q0);
    const targets = { lu, conductance: g, reactance: c, reactives, sources: this.sources, switches: this.switches };
    const deferred: (() => void)[] = [];
    const foldedSpecs: FoldedDiodeSpec[] = [];
    elements.forEach((e, index) => {
      const path = `elements[${index}]`;
      switch (e.kind) {
        case 'diode': {
          const anode = nodeAt(e.anode);
          const junction = ordering.junctionAt(e);
          if (hasInternalNode(e.model)) addConductance(lu, g, anode, junction, 1 / e.model.seriesResistanceOhm);
          positiveValue(e.model.saturationCurrentA, `${path}.model.saturationCurrentA`);
          positiveValue(e.model.emissionCoefficient, `${path}.model.emissionCoefficient`);
          if (isFolded(e.model)) foldedSpecs.push({ model: e.model, anode, cathode: nodeAt(e.cathode) });
          else
            deferred.push(() =>
              this.diodes.push(new DiodeInstance(e.name, e.model, junction, nodeAt(e.cathode), lu, addReactive)),
            );
          break;
        }
        case 'npn': {
          for (const key of ['saturationCurrentA', 'forwardBeta', 'reverseBeta'] as const)
            positiveValue(e.model[key], `${path}.model.${key}`);
          // Terminal resistances from each terminal to the device's internal node behind it.
          const inner = ordering.npnTerminalsAt(e);
          const outer = [e.collector, e.base, e.emitter].map(nodeAt);
          npnTerminalResistancesOhm(e.model).forEach((r, k) => {
            if (r > 0) addConductance(lu, g, outer[k]!, inner[k]!, 1 / r);
          });
          const [c, b, em] = inner;
          deferred.push(() => this.npns.push(new NpnInstance(e.name, e.model, c, b, em, lu, addReactive)));
          break;
        }
        case 'coupled-inductors': {
          stampLinearElement(e, path, ordering, targets);
          const core = e.core;
          if (!core) break;
          assertSaturableCore(core, `${path}.core`);
          const l1 = e.windings[0]!.inductanceH;
          deferred.push(() =>
            this.cores.push(
              new SaturableCoreInstance(
                e.name,
                e.windings.map((w) => w.name),
                core,
                Int32Array.from(e.windings, (w) => ordering.branchAt(`${e.name}.${w.name}`)),
                Float64Array.from(e.windings, (w) => Math.sqrt(w.inductanceH / l1)),
                size,
                lu,
                addReactive,
              ),
            ),
          );
          break;
        }
        default:
          stampLinearElement(e, path, ordering, targets);
      }
    });
    this.linearReactiveCount = reactives.count;
    this.folded = new FoldedDiodes(foldedSpecs, lu);
    for (const f of deferred) f();
    this.reactiveCount = reactives.count;
    this.hasNonlinearCharges = this.reactiveCount > this.linearReactiveCount;
    this.reactiveRowA = Int32Array.from(reactives.rowA);
    this.reactiveRowB = Int32Array.from(reactives.rowB);
    this.gradientStart = Int32Array.from(reactives.gradStart);
    this.gradientIndex = Int32Array.from(reactives.gradIndex);
    this.gradientValue = Float64Array.from(reactives.gradValue);
    this.charge = new Float64Array(this.reactiveCount);
    this.hist = new Float64Array(this.reactiveCount);
    this.initialCharge = Float64Array.from(reactives.initial);
    g[lu.groundOffset] = 0;
    c[lu.groundOffset] = 0;
    const varying = new Set<number>();
    c.forEach((value, offset) => {
      if (value !== 0) varying.add(offset);
    });
    for (const sw of this.switches) for (const offset of sw.offsets) varying.add(offset);
    this.varyingOffsets = Int32Array.from(varying);
  }

  /** Index of a probe: a node name, or 'I(name)' for a source's or winding's branch current. */
  probeIndex(probe: string): number {
    const m = /^I\((.+)\)$/.exec(probe);
    const index = m ? this.branchIndex.get(m[1]!) : probe === GROUND_NODE ? this.size : this.nodeIndex.get(probe);
    if (index === undefined) throw new DomainError('invalid_argument', `unknown probe ${probe}`, 'probes');
    return index;
  }

  /** Builds G + a0·C for a step ending at timeS (switch states as they are during that step). */
  prepareLinearMatrix(a0: number, stepEndS: number): void {
    const key = switchStatesAt(this.switches, stepEndS);
    // Same step length and switch states as the last call (the usual case at the maximum step): unchanged.
    if (a0 === this.preparedA0 && key === this.preparedKey) return;
    const isBuilt = !Number.isNaN(this.preparedA0);
    this.preparedA0 = a0;
    this.preparedKey = key;
    const lb = this.linearBand;
    const gb = this.conductanceBand;
    const cb = this.reactanceBand;
    if (isBuilt) {
      const varying = this.varyingOffsets;
      for (let k = 0; k < varying.length; k++) {
        const i = varying[k]!;
        lb[i] = gb[i]! + a0 * cb[i]!;
      }
    } else for (let i = 0; i < lb.length; i++) lb[i] = gb[i]! + a0 * cb[i]!;
    addSwitchConductances(lb, this.switches, key);
  }

  /** Earliest source corner or switch event strictly after timeS. */
  nextBreakpoint(timeS: number): number {
    let t = Infinity;
    for (const s of this.sources) t = Math.min(t, nextWaveformBreakpoint(s.waveform, timeS));
    const eps = 1e-15 + Math.abs(timeS) * 1e-12;
    for (const s of this.switches) for (const ev of s.events) if (ev.timeS > timeS + eps) t = Math.min(t, ev.timeS);
    return t;
  }

  /** Whether a switch changes state at a time in (fromS, toS]. */
  hasSwitchEventIn(fromS: number, toS: number): boolean {
    for (const s of this.switches) for (const ev of s.events) if (ev.timeS > fromS && ev.timeS <= toS) return true;
    return false;
  }

  /** The period every time-varying source repeats with, or NaN (see commonPeriodS). */
  sourcePeriodS(): number {
    return commonPeriodS(this.sources.map((s) => s.waveform));
  }

  /** Right-hand side of a step ending at timeS: source values and Σ incidence·hist (hist must be set). */
  prepareStepRhs(timeS: number, sourceScale = 1): void {
    const r = this.stepRhs;
    r.fill(0);
    for (const s of this.sources) {
      const v = waveformValue(s.waveform, timeS) * sourceScale;
      if (s.isVoltage) r[s.row]! += v;
      else {
        r[s.row]! -= v;
        r[s.rowB]! += v;
      }
    }
    const h = this.hist;
    const rowA = this.reactiveRowA;
    const rowB = this.reactiveRowB;
    for (let k = 0; k < this.reactiveCount; k++) {
      const v = h[k]!;
      r[rowA[k]!]! -= v;
      r[rowB[k]!]! += v;
    }
    r[this.size] = 0;
  }

  /** Loads band and rhs at the current x (one Newton linearization). Returns true if any junction was limited. */
  load(a0: number): boolean {
    const band = this.lu.band;
    band.set(this.linearBand);
    this.rhs.set(this.stepRhs);
    if (this.shuntConductanceS > 0) for (const o of this.nodeDiagonalOffsets) band[o]! += this.shuntConductanceS;
    let limited = false;
    this.folded.load(this.x, band, this.rhs);
    for (const d of this.diodes)
      limited =
        d.load(
          this.x,
          band,
          this.rhs,
          a0,
          this.charge,
          this.gradientValue,
          this.gradientStart,
          this.diodeOut,
          this.chargeOut,
        ) || limited;
    for (const q of this.npns)
      limited =
        q.load(
          this.x,
          band,
          this.rhs,
          a0,
          this.charge,
          this.gradientValue,
          this.gradientStart,
          this.npnOut,
          this.chargeOut,
        ) || limited;
    for (const k of this.cores) k.load(this.x, band, this.rhs, a0, this.charge, this.gradientValue, this.gradientStart);
    band[this.lu.groundOffset] = 0;
    return limited;
  }

  /** Whether every junction's current, linearized at its last load, moves within tolerance to solution x. */
  devicesConverged(x: Float64Array, relative: number, absoluteA: number): boolean {
    if (!this.folded.isConverged(x, relative, absoluteA)) return false;
    for (const d of this.diodes) if (!d.isConverged(x, relative, absoluteA)) return false;
    for (const q of this.npns) if (!q.isConverged(x, relative, absoluteA)) return false;
    // Flux tolerance: the current tolerance through a millihenry (far below any winding's flux of note).
    for (const k of this.cores) if (!k.isConverged(x, relative, absoluteA * 1e-3)) return false;
    return true;
  }

  /** Solves the loaded system into rhs and returns it (ground slot cleared). */
  solveLoaded(): Float64Array {
    this.lu.factorAndSolve(this.rhs);
    this.rhs[this.size] = 0;
    return this.rhs;
  }

  /** Charges and fluxes of the linear reactive elements at x (nonlinear ones are set by load). */
  evaluateLinearCharges(): void {
    const x = this.x;
    const start = this.gradientStart;
    const index = this.gradientIndex;
    const value = this.gradientValue;
    const charge = this.charge;
    for (let k = 0; k < this.linearReactiveCount; k++) {
      const from = start[k]!;
      const to = start[k + 1]!;
      // A capacitor's charge has two terms, C·Va − C·Vb.
      if (to - from === 2) {
        charge[k] = value[from]! * x[index[from]!]! + value[from + 1]! * x[index[from + 1]!]!;
        continue;
      }
      let q = 0;
      for (let p = from; p < to; p++) q += value[p]! * x[index[p]!]!;
      charge[k] = q;
    }
  }

  /**
   * Junction voltages used by voltage limiting and prediction; saved and restored around rejected steps.
   * Saved at a solution x: folded diodes first move their state from the last linearization point to x
   * along that linearization (see FoldedDiodes.moveToAndSave), so that a step accepted at its first iteration
   * does not leave the junction history at the predictor. Layout: folded diodes, other diodes, then Vbe
   * and Vbc of each transistor.
   */
  saveJunctionState(into: Float64Array): void {
    this.folded.moveToAndSave(this.x, into, 0);
    let k = this.folded.count;
    for (const d of this.diodes) into[k++] = d.lastV;
    for (const q of this.npns) {
      into[k++] = q.lastVbe;
      into[k++] = q.lastVbc;
    }
  }

  restoreJunctionState(from: Float64Array): void {
    this.folded.restore(from, 0);
    let k = this.folded.count;
    for (const d of this.diodes) d.lastV = from[k++]!;
    for (const q of this.npns) {
      q.lastVbe = from[k++]!;
      q.lastVbc = from[k++]!;
    }
  }

  /**
   * Predictor for the first load of a step: each folded diode is linearized there at its predicted
   * junction voltage (from the stepper, in the layout of saveJunctionState), not at the terminal voltage
   * of the predicted unknowns. The junction voltage of a conducting diode is a logarithm of its current
   * and moves slowly; its terminal voltage adds Rs·I and follows the current pulse (the MODEINITPRED
   * junction prediction of SPICE3's dioload). `current` is the state at the last accepted point.
   */
  predictJunctions(current: Float64Array, predicted: Float64Array): void {
    this.folded.predict(current, predicted, 0);
  }

  /** Whether the circuit has a transistor (see the stepper's default truncation-error factor). */
  get hasTransistors(): boolean {
    return this.npns.length > 0;
  }

  get junctionStateLength(): number {
    return this.folded.count + this.diodes.length + 2 * this.npns.length;
  }
}
