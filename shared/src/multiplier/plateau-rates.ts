import { EVENT_H, EVENT_L, type LadderNetwork } from './topologies';

/** Capacitor and node voltage rates per ampere of load through a flat-top phase (V/s per A). */
export interface PlateauRates {
  capRate: number[];
  nodeRate: number[];
  /** The part of `capRate` carried by the conducting diodes (capRate − the bare load rate). */
  diodeCapDelta: number[];
}

/**
 * Flat-top (pulse) drive: through a phase the source holds still and the diodes that conducted at its
 * start stay at their conduction boundary while the load draws current, so the load is shared through
 * them. For the rates the conducting diodes are short circuits and the winding ends fixed, which leaves
 * a capacitor network: nodal analysis over the nodes the diodes join (Laplacian of the capacitances,
 * the winding ends as the reference) gives the node rates, and Kirchhoff's current law, node by node
 * from the ends of each chain of conducting diodes, gives each diode's current. A diode that would need
 * reverse current drops out (it turns off just after the event) and the network is solved again
 * (active set). The nodes are numbered up the ladder, so the matrix is banded and each solve costs
 * time linear in the ladder's length. Null when the network is singular or a diode current is not
 * determined (then the phase is treated as instantaneous transfer).
 * Method: modified nodal analysis of a switched-capacitor network (Vlach & Singhal, Computer Methods for
 * Circuit Analysis and Design, 2nd ed., ch. 2, from memory); the banded LDLᵀ factorization of a symmetric
 * positive definite matrix (Golub & Van Loan, Matrix Computations, 4th ed., §4.3, from memory).
 */
export function plateauRates(net: LadderNetwork, loadRate: readonly number[], event: number): PlateauRates | null {
  const conducting = new Uint8Array(net.diodeEvent.length);
  let active = 0;
  for (let d = 0; d < conducting.length; d += 1) {
    if (net.diodeEvent[d] === event) {
      conducting[d] = 1;
      active += 1;
    }
  }
  const scratch = createScratch(net);
  // As many rounds as diodes are still conducting, counted as they drop out (about half the set).
  for (let round = 0; active > 0 && round <= active; round += 1) {
    if (!solveShorted(net, conducting, scratch)) return null;
    const diodeA = scratch.current;
    let worst = -1;
    for (let d = 0; d < conducting.length; d += 1) {
      if (conducting[d] && (diodeA[d] as number) < -1e-9) {
        if (worst < 0 || (diodeA[d] as number) < (diodeA[worst] as number)) worst = d;
      }
    }
    if (worst < 0) {
      const m = net.capF.length;
      const capRate = new Array<number>(m);
      const diodeCapDelta = new Array<number>(m);
      for (let c = 0; c < m; c += 1) {
        capRate[c] = scratch.capRate[c] as number;
        diodeCapDelta[c] = (scratch.capRate[c] as number) - (loadRate[c] as number);
      }
      return { capRate, nodeRate: Array.from(scratch.nodeRate.subarray(0, net.nodeCount)), diodeCapDelta };
    }
    conducting[worst] = 0;
    active -= 1;
  }
  return null;
}

/** Flat-top rates of both phases of a network; null when either phase has none (instantaneous transfer then). */
export interface FlatTopRates {
  h: PlateauRates;
  l: PlateauRates;
}

/** Networks remembered by `flatTopRates`: a stage scan visits a few dozen, and a Workbench edit of anything but the capacitors repeats them. */
const FLAT_TOP_CACHE_SIZE = 256;

/** A remembered network: its capacitor values over the first one, that first value (F), and its rates. */
interface CachedRates {
  ratios: Float64Array;
  scaleF: number;
  rates: FlatTopRates | null;
}

const flatTopCache = new Map<string, CachedRates>();

/** A key for a topology and its capacitor ratios: FNV-1a over the values' bits (equality is checked on a hit). */
function networkKey(net: LadderNetwork, ratios: Float64Array): string {
  const words = new Uint32Array(ratios.buffer);
  let hash = 0x811c9dc5;
  for (let i = 0; i < words.length; i += 1) hash = Math.imul(hash ^ (words[i] as number), 0x01000193);
  return `${net.topology}:${ratios.length}:${hash >>> 0}`;
}

function scaled(values: readonly number[], factor: number): number[] {
  const out = new Array<number>(values.length);
  for (let i = 0; i < values.length; i += 1) out[i] = (values[i] as number) * factor;
  return out;
}

function scaledPhase(rates: PlateauRates, factor: number): PlateauRates {
  return {
    capRate: scaled(rates.capRate, factor),
    nodeRate: scaled(rates.nodeRate, factor),
    diodeCapDelta: scaled(rates.diodeCapDelta, factor),
  };
}

/**
 * `plateauRates` of the H and L phases together, as the charge-transfer model takes them: both or none.
 * The L phase first, since without its rates the H phase's are not used. The rates depend only on the
 * topology and the capacitor values (per ampere of load), so the last FLAT_TOP_CACHE_SIZE networks are
 * remembered. They are free of scale: with every capacitor k times larger every rate is k times smaller and
 * every diode current (per ampere) the same, so the same active set drops out; a network is remembered by
 * its capacitors over the first one, and a ladder of the same ratios (a uniform ladder edited to another
 * value) takes the remembered rates scaled. The arrays returned are shared and must not be written.
 */
export function flatTopRates(net: LadderNetwork, loadRate: readonly number[]): FlatTopRates | null {
  const m = net.capF.length;
  const scaleF = net.capF[0] as number;
  const ratios = new Float64Array(m);
  for (let c = 0; c < m; c += 1) ratios[c] = (net.capF[c] as number) / scaleF;
  const key = networkKey(net, ratios);
  const cached = flatTopCache.get(key);
  if (cached && cached.ratios.length === m && cached.ratios.every((r, c) => r === ratios[c])) {
    flatTopCache.delete(key);
    flatTopCache.set(key, cached);
    if (!cached.rates || cached.scaleF === scaleF) return cached.rates;
    const factor = cached.scaleF / scaleF;
    return { h: scaledPhase(cached.rates.h, factor), l: scaledPhase(cached.rates.l, factor) };
  }
  const l = plateauRates(net, loadRate, EVENT_L);
  const h = l ? plateauRates(net, loadRate, EVENT_H) : null;
  const rates = h && l ? { h, l } : null;
  flatTopCache.delete(key);
  flatTopCache.set(key, { ratios, scaleF, rates });
  if (flatTopCache.size > FLAT_TOP_CACHE_SIZE) flatTopCache.delete(flatTopCache.keys().next().value as string);
  return rates;
}

/** Work arrays of one network, reused by every active-set round (a round allocates nothing). */
interface Scratch {
  parent: Int32Array;
  index: Int32Array;
  groupOf: Int32Array;
  matrix: Float64Array;
  injection: Float64Array;
  x: Float64Array;
  nodeRate: Float64Array;
  capRate: Float64Array;
  degree: Int32Array;
  start: Int32Array;
  fill: Int32Array;
  incident: Int32Array;
  current: Float64Array;
  known: Uint8Array;
  queue: Int32Array;
}

/** The work arrays of the largest network solved yet, reused by smaller ones (every entry is written before it is read). */
let lastScratch: Scratch | null = null;

function createScratch(net: LadderNetwork): Scratch {
  const nodes = net.nodeCount;
  const diodes = net.diodeEvent.length;
  const m = net.capF.length;
  if (
    lastScratch &&
    lastScratch.parent.length >= nodes &&
    lastScratch.current.length >= diodes &&
    lastScratch.capRate.length >= m
  ) {
    return lastScratch;
  }
  lastScratch = {
    parent: new Int32Array(nodes),
    index: new Int32Array(nodes),
    groupOf: new Int32Array(nodes),
    matrix: new Float64Array(nodes * 4),
    injection: new Float64Array(nodes),
    x: new Float64Array(nodes),
    nodeRate: new Float64Array(nodes),
    capRate: new Float64Array(net.capF.length),
    degree: new Int32Array(nodes),
    start: new Int32Array(nodes + 1),
    fill: new Int32Array(nodes),
    incident: new Int32Array(2 * diodes),
    current: new Float64Array(diodes),
    known: new Uint8Array(diodes),
    queue: new Int32Array(nodes),
  };
  return lastScratch;
}

function find(parent: Int32Array, n: number): number {
  let root = n;
  while (parent[root] !== root) root = parent[root] as number;
  while (parent[n] !== root) {
    const next = parent[n] as number;
    parent[n] = root;
    n = next;
  }
  return root;
}

/**
 * Node and capacitor rates with the `conducting` diodes shorted (into `s.nodeRate`, `s.capRate`), and each
 * diode's current (per A of load, into `s.current`); false when singular or undetermined.
 */
function solveShorted(net: LadderNetwork, conducting: Uint8Array, s: Scratch): boolean {
  const nodes = net.nodeCount;
  const anchors = net.anchorScale.length;
  const { parent, index, groupOf } = s;
  for (let n = 0; n < nodes; n += 1) parent[n] = n;
  // Anchors share one group: the winding ends hold still through the phase.
  for (let n = 1; n < anchors; n += 1) parent[n] = 0;
  for (let d = 0; d < conducting.length; d += 1) {
    if (!conducting[d]) continue;
    const a = find(parent, net.diodeAnode[d] as number);
    const b = find(parent, net.diodeCathode[d] as number);
    if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
  }
  // Unknowns: the groups not holding an anchor, numbered by their lowest node (up the ladder).
  index.fill(-1);
  let size = 0;
  for (let n = 0; n < nodes; n += 1) {
    const g = find(parent, n);
    groupOf[n] = g;
    if (g !== 0 && index[g] === -1) index[g] = size++;
  }
  const m = net.capF.length;
  let band = 0;
  for (let c = 0; c < m; c += 1) {
    const u = index[groupOf[net.capTop[c] as number] as number] as number;
    const v = index[groupOf[net.capBottom[c] as number] as number] as number;
    if (u >= 0 && v >= 0) band = Math.max(band, Math.abs(u - v));
  }
  const w = band + 1;
  // Lower band of the symmetric matrix: entry (i, j ≤ i) at i·w + (i − j).
  if (s.matrix.length < size * w) s.matrix = new Float64Array(size * w);
  const matrix = s.matrix;
  matrix.fill(0, 0, size * w);
  for (let c = 0; c < m; c += 1) {
    const u = index[groupOf[net.capTop[c] as number] as number] as number;
    const v = index[groupOf[net.capBottom[c] as number] as number] as number;
    if (u === v) continue;
    const f = net.capF[c] as number;
    if (u >= 0) matrix[u * w] = (matrix[u * w] as number) + f;
    if (v >= 0) matrix[v * w] = (matrix[v * w] as number) + f;
    if (u >= 0 && v >= 0) {
      const hi = Math.max(u, v);
      matrix[hi * w + Math.abs(u - v)] = (matrix[hi * w + Math.abs(u - v)] as number) - f;
    }
  }
  // One ampere out of the output node into the return node.
  const injection = s.injection;
  injection.fill(0);
  injection[net.outNode] = -1;
  injection[net.returnNode] = (injection[net.returnNode] as number) + 1;
  const x = s.x;
  x.fill(0, 0, size);
  for (let n = 0; n < nodes; n += 1) {
    const i = index[groupOf[n] as number] as number;
    if (i >= 0) x[i] = (x[i] as number) + (injection[n] as number);
  }
  if (!solveBandedSpd(matrix, x, size, band)) return false;
  const nodeRate = s.nodeRate;
  for (let n = 0; n < nodes; n += 1) {
    const i = index[groupOf[n] as number] as number;
    nodeRate[n] = i >= 0 ? (x[i] as number) : 0;
  }
  const capRate = s.capRate;
  // What each node must pass through its conducting diodes: its injection less what its capacitors take.
  const excess = injection;
  for (let c = 0; c < m; c += 1) {
    const top = net.capTop[c] as number;
    const bottom = net.capBottom[c] as number;
    const rate = (nodeRate[top] as number) - (nodeRate[bottom] as number);
    capRate[c] = rate;
    const currentA = (net.capF[c] as number) * rate;
    excess[top] = (excess[top] as number) - currentA;
    excess[bottom] = (excess[bottom] as number) + currentA;
  }
  return diodeCurrents(net, conducting, excess, anchors, s);
}

/**
 * Currents of the conducting diodes (anode to cathode, into `s.current`) from each node's excess, peeling
 * chains of diodes from their ends; a winding end takes any current, so it never ends a chain. False when
 * a diode is left undetermined (a loop of conducting diodes).
 */
function diodeCurrents(
  net: LadderNetwork,
  conducting: Uint8Array,
  excess: Float64Array,
  anchors: number,
  s: Scratch,
): boolean {
  const nodes = net.nodeCount;
  const { degree, start, fill, incident, current, known, queue } = s;
  degree.fill(0);
  let open = 0;
  for (let d = 0; d < conducting.length; d += 1) {
    if (!conducting[d]) continue;
    degree[net.diodeAnode[d] as number] = (degree[net.diodeAnode[d] as number] as number) + 1;
    degree[net.diodeCathode[d] as number] = (degree[net.diodeCathode[d] as number] as number) + 1;
    open += 1;
  }
  // Conducting diodes at each node, as a flat adjacency list.
  for (let n = 0; n < nodes; n += 1) start[n + 1] = (start[n] as number) + (degree[n] as number);
  fill.set(start.subarray(0, nodes));
  for (let d = 0; d < conducting.length; d += 1) {
    if (!conducting[d]) continue;
    const anode = net.diodeAnode[d] as number;
    incident[fill[anode] as number] = d;
    fill[anode] = (fill[anode] as number) + 1;
    const cathode = net.diodeCathode[d] as number;
    incident[fill[cathode] as number] = d;
    fill[cathode] = (fill[cathode] as number) + 1;
  }
  current.fill(0);
  known.fill(0);
  let queued = 0;
  for (let n = anchors; n < nodes; n += 1) if (degree[n] === 1) queue[queued++] = n;
  while (queued > 0) {
    const n = queue[--queued] as number;
    if (degree[n] !== 1) continue;
    let d = -1;
    for (let k = start[n] as number; k < (start[n + 1] as number); k += 1) {
      if (!known[incident[k] as number]) d = incident[k] as number;
    }
    if (d < 0) continue;
    const isAnode = net.diodeAnode[d] === n;
    const x = isAnode ? (excess[n] as number) : -(excess[n] as number);
    current[d] = x;
    known[d] = 1;
    open -= 1;
    degree[n] = 0;
    const other = isAnode ? (net.diodeCathode[d] as number) : (net.diodeAnode[d] as number);
    excess[other] = (excess[other] as number) + (isAnode ? x : -x);
    degree[other] = (degree[other] as number) - 1;
    if (other >= anchors && degree[other] === 1) queue[queued++] = other;
  }
  return open === 0;
}

/** Solves A·x = b in place for a symmetric positive definite band matrix (lower band, width `band`); false when not. */
function solveBandedSpd(a: Float64Array, b: Float64Array, n: number, band: number): boolean {
  const w = band + 1;
  const at = (i: number, j: number): number => i * w + (i - j);
  // LDLᵀ: L unit lower (stored below the diagonal), D on the diagonal.
  for (let j = 0; j < n; j += 1) {
    let dj = a[at(j, j)] as number;
    for (let k = Math.max(0, j - band); k < j; k += 1) {
      const ljk = a[at(j, k)] as number;
      dj -= ljk * ljk * (a[at(k, k)] as number);
    }
    if (!(dj > 0)) return false;
    a[at(j, j)] = dj;
    const last = Math.min(n - 1, j + band);
    for (let i = j + 1; i <= last; i += 1) {
      let s = a[at(i, j)] as number;
      for (let k = Math.max(0, i - band); k < j; k += 1) {
        s -= (a[at(i, k)] as number) * (a[at(j, k)] as number) * (a[at(k, k)] as number);
      }
      a[at(i, j)] = s / dj;
    }
  }
  for (let i = 0; i < n; i += 1) {
    let s = b[i] as number;
    for (let k = Math.max(0, i - band); k < i; k += 1) s -= (a[at(i, k)] as number) * (b[k] as number);
    b[i] = s;
  }
  for (let i = 0; i < n; i += 1) b[i] = (b[i] as number) / (a[at(i, i)] as number);
  for (let i = n - 1; i >= 0; i -= 1) {
    let s = b[i] as number;
    const last = Math.min(n - 1, i + band);
    for (let k = i + 1; k <= last; k += 1) s -= (a[at(k, i)] as number) * (b[k] as number);
    b[i] = s;
  }
  return true;
}
