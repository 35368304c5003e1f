import type { LadderNetwork } from './topologies';

/*
 * The flat-top network of one active set (plateau-rates.ts): the ladder's capacitors with the conducting diodes
 * shorted and the winding ends fixed, solved for the node and capacitor rates and each conducting diode's current
 * per ampere of load.
 */

/** Work arrays of one network, reused by every active-set round (a round allocates nothing). */
export interface Scratch {
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

export function createScratch(net: LadderNetwork): Scratch {
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
export function solveShorted(net: LadderNetwork, conducting: Uint8Array, s: Scratch): boolean {
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
