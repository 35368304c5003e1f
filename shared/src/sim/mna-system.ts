import { DomainError } from '../errors';
import type { Circuit, CircuitElement, DiodeModel, NpnModel, SourceWaveform } from './circuit.types';
import { GROUND_NODE } from './circuit.types';
import { evaluateNpn, type NpnOperatingPoint } from './devices/bjt';
import { inductanceMatrix } from './devices/coupled-inductors';
import { evaluateDiode, type DiodeOperatingPoint } from './devices/diode';
import { FoldedDiodes, type FoldedDiodeSpec } from './devices/folded-diodes';
import {
  criticalVoltageV,
  depletionCharge,
  limitJunctionVoltage,
  THERMAL_VOLTAGE_V,
  wasLimited,
} from './devices/junction';
import { BandedLu } from './solver/banded-lu';
import { reverseCuthillMcKee } from './solver/node-ordering';
import { nextWaveformBreakpoint, waveformValue } from './source-waveforms';

// Local copies of the device functions, so the inner loop does not go through a module accessor per call.
const diodeAt = evaluateDiode;
const npnAt = evaluateNpn;
const limitJunction = limitJunctionVoltage;
const lastWasLimited = wasLimited;
const depletionAt = depletionCharge;

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
  readonly nodeIndex = new Map<string, number>();
  readonly branchIndex = new Map<string, number>();
  /** Internal junction node of each diode with series resistance, by element name. */
  readonly internalIndex = new Map<string, number>();
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
  readonly reactiveNames: string[] = [];
  private readonly linearReactiveCount: number;
  /** Whether any junction carries charge (its q(v) is then a nonlinearity the device test does not see). */
  readonly hasNonlinearCharges: boolean;

  private readonly sources: { row: number; rowB: number; isVoltage: boolean; waveform: SourceWaveform }[] = [];
  private readonly switches: {
    offsets: Int32Array;
    onS: number;
    offS: number;
    initial: boolean;
    events: ReadonlyArray<{ timeS: number; isClosed: boolean }>;
  }[] = [];
  /** Diodes with an internal node or without series resistance; the folded ones are in `folded`. */
  private readonly diodes: CompiledDiode[] = [];
  private readonly folded: FoldedDiodes;
  private readonly npns: CompiledNpn[] = [];
  private readonly diodeOut: DiodeOperatingPoint = { currentA: 0, conductanceS: 0 };
  private readonly npnOut: NpnOperatingPoint = {
    collectorA: 0,
    baseA: 0,
    dCollectorDVbe: 0,
    dCollectorDVbc: 0,
    dBaseDVbe: 0,
    dBaseDVbc: 0,
  };
  private readonly chargeOut = { chargeC: 0, capacitanceF: 0 };
  /** Extra conductance from every node to ground, used by gmin stepping. */
  shuntConductanceS = 0;
  private readonly nodeDiagonalOffsets: Int32Array;
  /** a0 and switch states of the present linearBand (NaN: not built yet). */
  private preparedA0 = NaN;
  private preparedKey = '';

  constructor(circuit: Circuit) {
    const elements = circuit.elements;
    if (elements.length === 0) throw new DomainError('invalid_argument', 'the circuit has no elements', 'elements');
    const names = new Set<string>();
    elements.forEach((e, i) => {
      if (names.has(e.name))
        throw new DomainError('invalid_argument', `duplicate element name ${e.name}`, `elements[${i}].name`);
      names.add(e.name);
    });

    // 1. Unknowns in provisional order, and the structure for ordering.
    const provisional = new Map<string, number>();
    const unknownOf = (key: string): number => {
      if (key === GROUND_NODE) return -1;
      let k = provisional.get(key);
      if (k === undefined) {
        k = provisional.size;
        provisional.set(key, k);
      }
      return k;
    };
    const node = (n: string): number => unknownOf(n === GROUND_NODE ? n : `n:${n}`);
    const edges: [number, number][] = [];
    const couple = (...u: number[]): void => {
      for (const a of u) for (const b of u) if (a >= 0 && b >= 0 && a < b) edges.push([a, b]);
    };
    const diodeJunctionNode = (e: Extract<CircuitElement, { kind: 'diode' }>): number =>
      hasInternalNode(e.model) ? unknownOf(`i:${e.name}`) : node(e.anode);
    for (const e of elements) {
      switch (e.kind) {
        case 'resistor':
        case 'capacitor':
        case 'switch':
          couple(node(e.nodeA), node(e.nodeB));
          break;
        case 'inductor':
          couple(node(e.nodeA), node(e.nodeB), unknownOf(`b:${e.name}`));
          break;
        case 'coupled-inductors': {
          const branches = e.windings.map((w) => unknownOf(`b:${e.name}.${w.name}`));
          e.windings.forEach((w, i) => couple(node(w.nodeA), node(w.nodeB), branches[i]!));
          couple(...branches);
          break;
        }
        case 'voltage-source':
          couple(node(e.nodePlus), node(e.nodeMinus), unknownOf(`b:${e.name}`));
          break;
        case 'current-source':
          node(e.nodePlus);
          node(e.nodeMinus);
          break;
        case 'diode':
          couple(node(e.anode), diodeJunctionNode(e));
          couple(diodeJunctionNode(e), node(e.cathode));
          break;
        case 'npn':
          couple(node(e.collector), node(e.base), node(e.emitter));
          break;
      }
    }
    const size = provisional.size;
    if (size === 0) throw new DomainError('invalid_argument', 'the circuit has only the ground node', 'elements');
    this.size = size;
    const positionOf = reverseCuthillMcKee(size, edges);
    let bandwidth = 0;
    for (const [a, b] of edges) bandwidth = Math.max(bandwidth, Math.abs(positionOf[a]! - positionOf[b]!));
    this.lu = new BandedLu(size, bandwidth, bandwidth);
    for (const [key, k] of provisional) {
      if (key.startsWith('n:')) this.nodeIndex.set(key.slice(2), positionOf[k]!);
      if (key.startsWith('b:')) this.branchIndex.set(key.slice(2), positionOf[k]!);
      if (key.startsWith('i:')) this.internalIndex.set(key.slice(2), positionOf[k]!);
    }
    const at = (key: string): number => {
      if (key === GROUND_NODE) return size;
      const k = provisional.get(key);
      return k === undefined ? size : positionOf[k]!;
    };
    const nodeAt = (n: string): number => at(n === GROUND_NODE ? n : `n:${n}`);

    this.x = new Float64Array(size + 1);
    this.rhs = new Float64Array(size + 1);
    this.stepRhs = new Float64Array(size + 1);
    const bandLength = this.lu.band.length;
    this.conductanceBand = new Float64Array(bandLength);
    this.reactanceBand = new Float64Array(bandLength);
    this.linearBand = new Float64Array(bandLength);
    this.nodeDiagonalOffsets = new Int32Array(
      [...this.nodeIndex.values()]
        .map((i) => this.lu.offsetOf(i, i))
        .concat([...provisional.keys()].filter((k) => k.startsWith('i:')).map((k) => this.lu.offsetOf(at(k), at(k)))),
    );

    // 2. Stamps. Reactive quantities: linear ones first, nonlinear junction charges after.
    const g = this.conductanceBand;
    const c = this.reactanceBand;
    const lu = this.lu;
    const addConductance = (band: Float64Array, a: number, b: number, value: number): void => {
      band[lu.offsetOf(a, a)]! += value;
      band[lu.offsetOf(b, b)]! += value;
      band[lu.offsetOf(a, b)]! -= value;
      band[lu.offsetOf(b, a)]! -= value;
    };
    const rowA: number[] = [];
    const rowB: number[] = [];
    const gradStart: number[] = [0];
    const gradIndex: number[] = [];
    const gradValue: number[] = [];
    const initial: number[] = [];
    const addReactive = (
      name: string,
      a: number,
      b: number,
      grad: ReadonlyArray<[number, number]>,
      q0: number,
    ): number => {
      rowA.push(a);
      rowB.push(b);
      for (const [i, v] of grad) {
        gradIndex.push(i);
        gradValue.push(v);
      }
      gradStart.push(gradIndex.length);
      initial.push(q0);
      this.reactiveNames.push(name);
      return rowA.length - 1;
    };
    const positive = (value: number, path: string): number => {
      if (!(value > 0) || !Number.isFinite(value))
        throw new DomainError('invalid_argument', 'must be a positive finite number', path);
      return value;
    };
    const addBranch = (branch: number, a: number, b: number): void => {
      // KCL: the branch current leaves a and enters b; branch row: Va − Vb − … = …
      g[lu.offsetOf(a, branch)]! += 1;
      g[lu.offsetOf(b, branch)]! -= 1;
      g[lu.offsetOf(branch, a)]! += 1;
      g[lu.offsetOf(branch, b)]! -= 1;
    };
    const deferred: (() => void)[] = [];
    const foldedSpecs: FoldedDiodeSpec[] = [];
    elements.forEach((e, index) => {
      const path = `elements[${index}]`;
      switch (e.kind) {
        case 'resistor':
          addConductance(g, nodeAt(e.nodeA), nodeAt(e.nodeB), 1 / positive(e.resistanceOhm, `${path}.resistanceOhm`));
          break;
        case 'capacitor': {
          const a = nodeAt(e.nodeA);
          const b = nodeAt(e.nodeB);
          const cap = positive(e.capacitanceF, `${path}.capacitanceF`);
          addConductance(c, a, b, cap);
          addReactive(
            e.name,
            a,
            b,
            [
              [a, cap],
              [b, -cap],
            ],
            cap * (e.initialVoltageV ?? 0),
          );
          break;
        }
        case 'inductor': {
          const br = at(`b:${e.name}`);
          const l = positive(e.inductanceH, `${path}.inductanceH`);
          addBranch(br, nodeAt(e.nodeA), nodeAt(e.nodeB));
          g[lu.offsetOf(br, br)]! -= e.resistanceOhm ?? 0;
          c[lu.offsetOf(br, br)]! -= l;
          addReactive(e.name, size, br, [[br, l]], l * (e.initialCurrentA ?? 0));
          break;
        }
        case 'coupled-inductors': {
          const m = inductanceMatrix(e.windings, e.couplingCoefficient, path);
          const n = e.windings.length;
          const branches = e.windings.map((w) => at(`b:${e.name}.${w.name}`));
          e.windings.forEach((w, i) => {
            const br = branches[i]!;
            addBranch(br, nodeAt(w.nodeA), nodeAt(w.nodeB));
            g[lu.offsetOf(br, br)]! -= w.resistanceOhm;
            const grad: [number, number][] = [];
            let q0 = 0;
            for (let j = 0; j < n; j++) {
              const mij = m[i * n + j]!;
              c[lu.offsetOf(br, branches[j]!)]! -= mij;
              grad.push([branches[j]!, mij]);
              q0 += mij * (e.windings[j]!.initialCurrentA ?? 0);
            }
            addReactive(`${e.name}.${w.name}`, size, br, grad, q0);
          });
          break;
        }
        case 'voltage-source': {
          const br = at(`b:${e.name}`);
          addBranch(br, nodeAt(e.nodePlus), nodeAt(e.nodeMinus));
          this.sources.push({ row: br, rowB: size, isVoltage: true, waveform: e.waveform });
          break;
        }
        case 'current-source':
          this.sources.push({
            row: nodeAt(e.nodePlus),
            rowB: nodeAt(e.nodeMinus),
            isVoltage: false,
            waveform: e.waveform,
          });
          break;
        case 'switch': {
          const a = nodeAt(e.nodeA);
          const b = nodeAt(e.nodeB);
          this.switches.push({
            offsets: new Int32Array([lu.offsetOf(a, a), lu.offsetOf(b, b), lu.offsetOf(a, b), lu.offsetOf(b, a)]),
            onS: 1 / positive(e.onResistanceOhm, `${path}.onResistanceOhm`),
            offS: 1 / positive(e.offResistanceOhm, `${path}.offResistanceOhm`),
            initial: e.isInitiallyClosed,
            events: [...e.events].sort((p, q) => p.timeS - q.timeS),
          });
          break;
        }
        case 'diode': {
          const anode = nodeAt(e.anode);
          const junction = at(hasInternalNode(e.model) ? `i:${e.name}` : `n:${e.anode}`);
          if (hasInternalNode(e.model)) addConductance(g, anode, junction, 1 / e.model.seriesResistanceOhm);
          positive(e.model.saturationCurrentA, `${path}.model.saturationCurrentA`);
          positive(e.model.emissionCoefficient, `${path}.model.emissionCoefficient`);
          if (isFolded(e.model)) foldedSpecs.push({ model: e.model, anode, cathode: nodeAt(e.cathode) });
          else
            deferred.push(() =>
              this.diodes.push(new CompiledDiode(e.name, e.model, junction, nodeAt(e.cathode), lu, addReactive)),
            );
          break;
        }
        case 'npn':
          positive(e.model.saturationCurrentA, `${path}.model.saturationCurrentA`);
          positive(e.model.forwardBeta, `${path}.model.forwardBeta`);
          positive(e.model.reverseBeta, `${path}.model.reverseBeta`);
          deferred.push(() =>
            this.npns.push(
              new CompiledNpn(e.name, e.model, nodeAt(e.collector), nodeAt(e.base), nodeAt(e.emitter), lu, addReactive),
            ),
          );
          break;
      }
    });
    this.linearReactiveCount = rowA.length;
    this.folded = new FoldedDiodes(foldedSpecs, lu);
    for (const f of deferred) f();
    this.reactiveCount = rowA.length;
    this.hasNonlinearCharges = this.reactiveCount > this.linearReactiveCount;
    this.reactiveRowA = Int32Array.from(rowA);
    this.reactiveRowB = Int32Array.from(rowB);
    this.gradientStart = Int32Array.from(gradStart);
    this.gradientIndex = Int32Array.from(gradIndex);
    this.gradientValue = Float64Array.from(gradValue);
    this.charge = new Float64Array(this.reactiveCount);
    this.hist = new Float64Array(this.reactiveCount);
    this.initialCharge = Float64Array.from(initial);
    g[lu.groundOffset] = 0;
    c[lu.groundOffset] = 0;
  }

  /** Index of a probe: a node name, or 'I(name)' for a source's or winding's branch current. */
  probeIndex(probe: string): number {
    const m = /^I\((.+)\)$/.exec(probe);
    const index = m ? this.branchIndex.get(m[1]!) : probe === GROUND_NODE ? this.size : this.nodeIndex.get(probe);
    if (index === undefined) throw new DomainError('invalid_argument', `unknown probe ${probe}`, 'probes');
    return index;
  }

  /** Whether each switch is closed just after timeS (an event at exactly timeS applies to later times). */
  private switchKeyAt(timeS: number): string {
    let key = '';
    for (const s of this.switches) {
      let closed = s.initial;
      for (const ev of s.events) if (ev.timeS < timeS) closed = ev.isClosed;
      key += closed ? '1' : '0';
    }
    return key;
  }

  /** Builds G + a0·C for a step ending at timeS (switch states as they are during that step). */
  prepareLinearMatrix(a0: number, stepEndS: number): void {
    const key = this.switchKeyAt(stepEndS);
    // Same step length and switch states as the last call (the usual case at the maximum step): unchanged.
    if (a0 === this.preparedA0 && key === this.preparedKey) return;
    this.preparedA0 = a0;
    this.preparedKey = key;
    const lb = this.linearBand;
    const gb = this.conductanceBand;
    const cb = this.reactanceBand;
    for (let i = 0; i < lb.length; i++) lb[i] = gb[i]! + a0 * cb[i]!;
    for (let i = 0; i < this.switches.length; i++) {
      const s = this.switches[i]!;
      const gs = key[i] === '1' ? s.onS : s.offS;
      lb[s.offsets[0]!]! += gs;
      lb[s.offsets[1]!]! += gs;
      lb[s.offsets[2]!]! -= gs;
      lb[s.offsets[3]!]! -= gs;
    }
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

  /**
   * The period every time-varying source repeats with (sine 1/f, pulse its period), or NaN when there is
   * none, a source does not repeat (piecewise-linear) or two sources repeat differently.
   */
  sourcePeriodS(): number {
    let period = NaN;
    for (const { waveform: w } of this.sources) {
      let p: number;
      if (w.kind === 'dc') continue;
      else if (w.kind === 'sine') p = w.frequencyHz > 0 ? 1 / w.frequencyHz : NaN;
      else if (w.kind === 'pulse') p = w.periodS > 0 ? w.periodS : NaN;
      else return NaN;
      if (!(p > 0)) return NaN;
      if (Number.isNaN(period)) period = p;
      else if (Math.abs(p - period) > 1e-12 * period) return NaN;
    }
    return period;
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
    band[this.lu.groundOffset] = 0;
    return limited;
  }

  /** Whether every junction's current, linearized at its last load, moves within tolerance to solution x. */
  devicesConverged(x: Float64Array, relative: number, absoluteA: number): boolean {
    if (!this.folded.isConverged(x, relative, absoluteA)) return false;
    for (const d of this.diodes) if (!d.isConverged(x, relative, absoluteA)) return false;
    for (const q of this.npns) if (!q.isConverged(x, relative, absoluteA)) return false;
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

/**
 * A diode keeps an internal node between its series resistance and its junction only when the junction
 * carries charge; otherwise the resistance is folded into the element (the junction voltage is solved
 * locally, so the circuit matrix has one unknown fewer per diode; see FoldedDiodes).
 */
function hasInternalNode(model: DiodeModel): boolean {
  return model.seriesResistanceOhm > 0 && ((model.junctionCapacitanceF ?? 0) > 0 || (model.transitTimeS ?? 0) > 0);
}

function isFolded(model: DiodeModel): boolean {
  return model.seriesResistanceOhm > 0 && !hasInternalNode(model);
}

type AddReactive = (name: string, a: number, b: number, grad: ReadonlyArray<[number, number]>, q0: number) => number;

function junctionOffsets(lu: BandedLu, a: number, b: number): Int32Array {
  return new Int32Array([lu.offsetOf(a, a), lu.offsetOf(a, b), lu.offsetOf(b, a), lu.offsetOf(b, b)]);
}

/** Linearized two-terminal element: current gEq·(Va − Vb) + iEq from a to b. */
function stampJunction(
  band: Float64Array,
  rhs: Float64Array,
  o: Int32Array,
  a: number,
  b: number,
  gEq: number,
  iEq: number,
): void {
  band[o[0]!]! += gEq;
  band[o[1]!]! -= gEq;
  band[o[2]!]! -= gEq;
  band[o[3]!]! += gEq;
  rhs[a]! -= iEq;
  rhs[b]! += iEq;
}

/** A diode with an internal node (series resistance and junction charge) or without series resistance. */
class CompiledDiode {
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
    stampJunction(band, rhs, this.offsets, this.junction, this.cathode, gEq, iEq);
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

class CompiledNpn {
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
    stampJunction(band, rhs, o, a, b, gEq, iEq);
  }
}
