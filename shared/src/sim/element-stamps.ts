import { DomainError } from '../errors';
import type { CircuitElement, SaturableCore, SourceWaveform } from './circuit.types';
import { inductanceMatrix } from './devices/coupled-inductors';
import type { BandedLu } from './solver/banded-lu';
import type { UnknownOrdering } from './unknown-ordering';

/** An independent source: a voltage source's branch row, or the two node rows of a current source. */
export interface SourceStamp {
  row: number;
  rowB: number;
  isVoltage: boolean;
  waveform: SourceWaveform;
}

/** A time-controlled switch: its four band offsets, on and off conductances and its events in time order. */
export interface SwitchStamp {
  offsets: Int32Array;
  onS: number;
  offS: number;
  initial: boolean;
  events: ReadonlyArray<{ timeS: number; isClosed: boolean }>;
}

/** Whether each switch is closed just after timeS (an event at exactly timeS applies to later times), as a key of '1' (closed) and '0' (open), one per switch. */
export function switchStatesAt(switches: ReadonlyArray<SwitchStamp>, timeS: number): string {
  let key = '';
  for (const s of switches) {
    let closed = s.initial;
    for (const ev of s.events) if (ev.timeS < timeS) closed = ev.isClosed;
    key += closed ? '1' : '0';
  }
  return key;
}

/** Adds each switch's on or off conductance (by its state in `key`, see switchStatesAt) to a band. */
export function addSwitchConductances(band: Float64Array, switches: ReadonlyArray<SwitchStamp>, key: string): void {
  for (let i = 0; i < switches.length; i++) {
    const s = switches[i]!;
    const gs = key[i] === '1' ? s.onS : s.offS;
    band[s.offsets[0]!]! += gs;
    band[s.offsets[1]!]! += gs;
    band[s.offsets[2]!]! -= gs;
    band[s.offsets[3]!]! -= gs;
  }
}

/**
 * The reactive quantities of a system as they are registered: incidence (+1 at rowA, −1 at rowB), the
 * gradient dq/dx in CSR form, and the initial charge or flux.
 */
export class ReactiveTable {
  readonly rowA: number[] = [];
  readonly rowB: number[] = [];
  readonly gradStart: number[] = [0];
  readonly gradIndex: number[] = [];
  readonly gradValue: number[] = [];
  readonly initial: number[] = [];
  readonly names: string[] = [];

  get count(): number {
    return this.rowA.length;
  }

  add(name: string, a: number, b: number, grad: ReadonlyArray<[number, number]>, q0: number): number {
    this.rowA.push(a);
    this.rowB.push(b);
    for (const [i, v] of grad) {
      this.gradIndex.push(i);
      this.gradValue.push(v);
    }
    this.gradStart.push(this.gradIndex.length);
    this.initial.push(q0);
    this.names.push(name);
    return this.rowA.length - 1;
  }
}

/** Where the linear elements stamp: G (conductance band), C (reactance band), reactives, sources, switches. */
export interface LinearStampTargets {
  lu: BandedLu;
  conductance: Float64Array;
  reactance: Float64Array;
  reactives: ReactiveTable;
  sources: SourceStamp[];
  switches: SwitchStamp[];
}

/** A conductance between unknowns a and b in a band. */
export function addConductance(lu: BandedLu, band: Float64Array, a: number, b: number, value: number): void {
  band[lu.offsetOf(a, a)]! += value;
  band[lu.offsetOf(b, b)]! += value;
  band[lu.offsetOf(a, b)]! -= value;
  band[lu.offsetOf(b, a)]! -= value;
}

/** The value, refused unless positive and finite (field path `path`). */
export function positiveValue(value: number, path: string): number {
  if (!(value > 0) || !Number.isFinite(value))
    throw new DomainError('invalid_argument', 'must be a positive finite number', path);
  return value;
}

/** Refuses a circuit without elements or with two elements of one name (field path of the second). */
export function assertNamedElements(elements: readonly CircuitElement[]): void {
  if (elements.length === 0) throw new DomainError('invalid_argument', 'the circuit has no elements', 'elements');
  const names = new Set<string>();
  elements.forEach((e, i) => {
    if (names.has(e.name))
      throw new DomainError('invalid_argument', `duplicate element name ${e.name}`, `elements[${i}].name`);
    names.add(e.name);
  });
}

/** Refuses a saturable core whose figures cannot describe one (field paths under `path`). */
export function assertSaturableCore(core: SaturableCore, path: string): void {
  positiveValue(core.saturationCurrentA, `${path}.saturationCurrentA`);
  positiveValue(core.saturatedInductanceH, `${path}.saturatedInductanceH`);
  if (!(core.magnetizingInductanceH > core.saturatedInductanceH))
    throw new DomainError('invalid_argument', 'must exceed the saturated inductance', `${path}.magnetizingInductanceH`);
}

type LinearElement = Exclude<CircuitElement, { kind: 'diode' } | { kind: 'npn' }>;

/** Stamps one linear element (everything but the junction devices) into G, C and the source and switch lists. */
export function stampLinearElement(
  e: LinearElement,
  path: string,
  ordering: UnknownOrdering,
  t: LinearStampTargets,
): void {
  const { lu, conductance: g, reactance: c, reactives } = t;
  const { nodeAt } = ordering;
  const size = ordering.size;
  const positive = positiveValue;
  const addBranch = (branch: number, a: number, b: number): void => {
    // KCL: the branch current leaves a and enters b; branch row: Va − Vb − … = …
    g[lu.offsetOf(a, branch)]! += 1;
    g[lu.offsetOf(b, branch)]! -= 1;
    g[lu.offsetOf(branch, a)]! += 1;
    g[lu.offsetOf(branch, b)]! -= 1;
  };
  switch (e.kind) {
    case 'resistor':
      addConductance(lu, g, nodeAt(e.nodeA), nodeAt(e.nodeB), 1 / positive(e.resistanceOhm, `${path}.resistanceOhm`));
      break;
    case 'capacitor': {
      const a = nodeAt(e.nodeA);
      const b = nodeAt(e.nodeB);
      const cap = positive(e.capacitanceF, `${path}.capacitanceF`);
      addConductance(lu, c, a, b, cap);
      reactives.add(
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
      const br = ordering.branchAt(e.name);
      const l = positive(e.inductanceH, `${path}.inductanceH`);
      addBranch(br, nodeAt(e.nodeA), nodeAt(e.nodeB));
      g[lu.offsetOf(br, br)]! -= e.resistanceOhm ?? 0;
      c[lu.offsetOf(br, br)]! -= l;
      reactives.add(e.name, size, br, [[br, l]], l * (e.initialCurrentA ?? 0));
      break;
    }
    case 'coupled-inductors': {
      const m = inductanceMatrix(e, path);
      const n = e.windings.length;
      const branches = e.windings.map((w) => ordering.branchAt(`${e.name}.${w.name}`));
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
        reactives.add(`${e.name}.${w.name}`, size, br, grad, q0);
      });
      break;
    }
    case 'voltage-source': {
      const br = ordering.branchAt(e.name);
      addBranch(br, nodeAt(e.nodePlus), nodeAt(e.nodeMinus));
      t.sources.push({ row: br, rowB: size, isVoltage: true, waveform: e.waveform });
      break;
    }
    case 'current-source':
      t.sources.push({
        row: nodeAt(e.nodePlus),
        rowB: nodeAt(e.nodeMinus),
        isVoltage: false,
        waveform: e.waveform,
      });
      break;
    case 'switch': {
      const a = nodeAt(e.nodeA);
      const b = nodeAt(e.nodeB);
      t.switches.push({
        offsets: new Int32Array([lu.offsetOf(a, a), lu.offsetOf(b, b), lu.offsetOf(a, b), lu.offsetOf(b, a)]),
        onS: 1 / positive(e.onResistanceOhm, `${path}.onResistanceOhm`),
        offS: 1 / positive(e.offResistanceOhm, `${path}.offResistanceOhm`),
        initial: e.isInitiallyClosed,
        events: [...e.events].sort((p, q) => p.timeS - q.timeS),
      });
      break;
    }
  }
}
