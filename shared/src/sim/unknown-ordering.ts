import { DomainError } from '../errors';
import type { CircuitElement } from './circuit.types';
import { GROUND_NODE } from './circuit.types';
import { hasInternalNode } from './devices/diode-instance';
import { npnInternalNodeName, npnTerminalResistancesOhm } from './devices/npn-instance';
import { reverseCuthillMcKee } from './solver/node-ordering';

/**
 * The unknowns of a circuit's MNA system in solve order: node voltages, the currents of voltage sources
 * and windings, and the internal junction node of each diode that keeps one. Ordered by reverse
 * Cuthill–McKee over the elements' couplings so the matrix is banded; the ground is the slot `size`.
 */
export interface UnknownOrdering {
  size: number;
  /** Largest distance between two coupled unknowns (the band's half-width). */
  bandwidth: number;
  nodeIndex: Map<string, number>;
  branchIndex: Map<string, number>;
  /**
   * Internal junction node of each diode with series resistance and junction charge, by element name, and
   * of each transistor terminal with a resistance (npnInternalNodeName).
   */
  internalIndex: Map<string, number>;
  /** Position of the branch current of element `name` (a winding is `name.winding`). */
  branchAt: (name: string) => number;
  /** Position of a node voltage; the ground (and a node no element touches) is `size`. */
  nodeAt: (node: string) => number;
  /** Position of the junction node of a diode: its internal node, or its anode. */
  junctionAt: (e: Extract<CircuitElement, { kind: 'diode' }>) => number;
  /** Positions of a transistor's internal collector, base and emitter (a terminal itself without resistance). */
  npnTerminalsAt: (e: Extract<CircuitElement, { kind: 'npn' }>) => [number, number, number];
}

/** Keys of a transistor's collector, base and emitter behind their resistances (the node key without one). */
function npnTerminalKeys(e: Extract<CircuitElement, { kind: 'npn' }>): string[] {
  const resistances = npnTerminalResistancesOhm(e.model);
  return [e.collector, e.base, e.emitter].map((terminal, k) =>
    resistances[k]! > 0 ? `i:${npnInternalNodeName(e.name, k)}` : terminal === GROUND_NODE ? terminal : `n:${terminal}`,
  );
}

/** Orders the unknowns of a list of elements (see UnknownOrdering). */
export function orderUnknowns(elements: ReadonlyArray<CircuitElement>): UnknownOrdering {
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
      case 'npn': {
        const inner = npnTerminalKeys(e).map(unknownOf);
        couple(...inner);
        [e.collector, e.base, e.emitter].forEach((terminal, k) => couple(node(terminal), inner[k]!));
        break;
      }
    }
  }
  const size = provisional.size;
  if (size === 0) throw new DomainError('invalid_argument', 'the circuit has only the ground node', 'elements');
  const positionOf = reverseCuthillMcKee(size, edges);
  let bandwidth = 0;
  for (const [a, b] of edges) bandwidth = Math.max(bandwidth, Math.abs(positionOf[a]! - positionOf[b]!));
  const nodeIndex = new Map<string, number>();
  const branchIndex = new Map<string, number>();
  const internalIndex = new Map<string, number>();
  for (const [key, k] of provisional) {
    if (key.startsWith('n:')) nodeIndex.set(key.slice(2), positionOf[k]!);
    if (key.startsWith('b:')) branchIndex.set(key.slice(2), positionOf[k]!);
    if (key.startsWith('i:')) internalIndex.set(key.slice(2), positionOf[k]!);
  }
  const at = (key: string): number => {
    if (key === GROUND_NODE) return size;
    const k = provisional.get(key);
    return k === undefined ? size : positionOf[k]!;
  };
  return {
    size,
    bandwidth,
    nodeIndex,
    branchIndex,
    internalIndex,
    branchAt: (name) => at(`b:${name}`),
    nodeAt: (n) => at(n === GROUND_NODE ? n : `n:${n}`),
    junctionAt: (e) => at(hasInternalNode(e.model) ? `i:${e.name}` : `n:${e.anode}`),
    npnTerminalsAt: (e) => {
      const [c, b, x] = npnTerminalKeys(e).map(at);
      return [c!, b!, x!];
    },
  };
}
