import { DomainError } from '../errors';
import type { Topology } from '../designs/design.types';
import type { CapacitorStress, LadderNodeColumn } from './ladder.types';

/** Drive extremes: event H is the positive extreme of the hot winding end, event L the negative one. */
export type DriveEvent = 0 | 1;
export const EVENT_H: DriveEvent = 0;
export const EVENT_L: DriveEvent = 1;

/**
 * A ladder as a network for the charge-transfer model. Nodes 0..anchorCount−1 are fixed by the drive:
 * node 0 ground (scale 0), node 1 the hot winding end (scale +1), node 2 the antiphase end of a
 * full-wave secondary (scale −1). Every other node is the top of exactly one capacitor, and capacitors
 * are listed so that a capacitor's bottom node is known before its top node. Each capacitor has the one
 * diode whose end-of-conduction condition fixes its voltage.
 */
export interface LadderNetwork {
  topology: Topology;
  cellCount: number;
  stageCount: number;
  nodeCount: number;
  anchorScale: readonly number[];
  capTop: number[];
  capBottom: number[];
  capF: number[];
  capColumn: CapacitorStress['column'][];
  capStage: number[];
  /** Determining diode of each capacitor (index into the diode arrays). */
  capDiode: number[];
  diodeAnode: number[];
  diodeCathode: number[];
  diodeEvent: number[];
  /** Fraction of the ladder's charge per cycle each diode passes (1 in a half-wave chain, ½ full-wave). */
  diodeShare: number[];
  /** Root anchor of every node (the anchor its capacitor column stands on). */
  nodeRoot: number[];
  outNode: number;
  returnNode: number;
  /** Ideal no-load output in units of the drive: coefficients of the H and L extremes (V = kH·Vh + kL·Vl). */
  idealCoefficientH: number;
  idealCoefficientL: number;
  /** Name, label and place of every node; the return node is the circuit ground ('0'). */
  nodeInfo: LadderNodeInfo[];
}

/**
 * Where a node sits. `id` is the name the simulator's circuit gives the same node (sim/build-circuit.ts),
 * so engine and simulator figures can be matched node by node.
 */
export interface LadderNodeInfo {
  id: string;
  label: string;
  column: LadderNodeColumn;
  stage: number;
  /** 1-based index of the capacitor whose upper plate (in the circuit) is this node; null for a winding end. */
  capacitorIndex: number | null;
}

const columnOfCapacitor = (column: CapacitorStress['column']): LadderNodeColumn =>
  column === 'smoothing' || column === 'bridge' ? 'smoothing' : 'oscillating';

/** Plain arrays: for ladders of tens of nodes they allocate far faster than typed arrays. */
function zeros(length: number): number[] {
  return new Array<number>(length).fill(0);
}

interface Builder {
  caps: Array<{
    top: number;
    bottom: number;
    f: number;
    column: CapacitorStress['column'];
    stage: number;
    diode: number;
  }>;
  diodes: Array<{ anode: number; cathode: number; event: DriveEvent; share: number }>;
}

function finish(
  topology: Topology,
  cellCount: number,
  stageCount: number,
  anchorScale: number[],
  b: Builder,
  outNode: number,
  returnNode: number,
  ideal: [number, number],
  nodeInfo: LadderNodeInfo[],
): LadderNetwork {
  const m = b.caps.length;
  const dCount = b.diodes.length;
  const nodeCount = anchorScale.length + m;
  const net: LadderNetwork = {
    topology,
    cellCount,
    stageCount,
    nodeCount,
    anchorScale,
    capTop: zeros(m),
    capBottom: zeros(m),
    capF: zeros(m),
    capColumn: new Array<CapacitorStress['column']>(m),
    capStage: zeros(m),
    capDiode: zeros(m),
    diodeAnode: zeros(dCount),
    diodeCathode: zeros(dCount),
    diodeEvent: zeros(dCount),
    diodeShare: zeros(dCount),
    nodeRoot: zeros(nodeCount),
    outNode,
    returnNode,
    idealCoefficientH: ideal[0],
    idealCoefficientL: ideal[1],
    nodeInfo,
  };
  for (let i = 0; i < anchorScale.length; i += 1) net.nodeRoot[i] = i;
  for (let c = 0; c < m; c += 1) {
    const cap = b.caps[c] as Builder['caps'][number];
    net.capTop[c] = cap.top;
    net.capBottom[c] = cap.bottom;
    net.capF[c] = cap.f;
    net.capColumn[c] = cap.column;
    net.capStage[c] = cap.stage;
    net.capDiode[c] = cap.diode;
    net.nodeRoot[cap.top] = net.nodeRoot[cap.bottom] as number;
  }
  for (let d = 0; d < dCount; d += 1) {
    const diode = b.diodes[d] as Builder['diodes'][number];
    net.diodeAnode[d] = diode.anode;
    net.diodeCathode[d] = diode.cathode;
    net.diodeEvent[d] = diode.event;
    net.diodeShare[d] = diode.share;
  }
  return net;
}

/**
 * Half-wave (Cockcroft-Walton / Greinacher) chain of k cells: node N_i (i = 1..k) is the top of C_i,
 * C_i stands on N_{i−2}, diode D_i conducts from N_{i−1} to N_i. With k even, N_{−1} is the hot end and
 * N_0 ground (C1 oscillating); with k odd the ends swap so the top capacitor is still in the grounded
 * smoothing column (C1 is then a rectifier cell). D_i conducts at the drive extreme that pulls N_{i−1}
 * above N_i.
 */
function halfWave(capacitorsF: readonly number[]): LadderNetwork {
  const k = capacitorsF.length;
  const isEven = k % 2 === 0;
  // Node ids: 0 ground, 1 hot; ladder node N_i has id 1 + i.
  const nMinus1 = isEven ? 1 : 0;
  const n0 = isEven ? 0 : 1;
  const id = (i: number): number => (i === -1 ? nMinus1 : i === 0 ? n0 : 1 + i);
  const b: Builder = { caps: [], diodes: [] };
  for (let i = 1; i <= k; i += 1) {
    // s_i = N_i − N_{i−1} carries the drive with sign (−1)^i·σ, σ = −1 for even k; D_i conducts where s_i is least.
    const sigma = isEven ? -1 : 1;
    const driveSign = (i % 2 === 0 ? 1 : -1) * sigma;
    const event: DriveEvent = driveSign > 0 ? EVENT_L : EVENT_H;
    b.diodes.push({ anode: id(i - 1), cathode: id(i), event, share: 1 });
    const inSmoothing = (k - i) % 2 === 0;
    b.caps.push({
      top: id(i),
      bottom: id(i - 2),
      f: capacitorsF[i - 1] ?? 0,
      column: inSmoothing ? 'smoothing' : 'oscillating',
      stage: Math.ceil(i / 2),
      diode: i - 1,
    });
  }
  // Even k: each stage adds one drive peak-to-peak. Odd k: the rectifier cell adds the H peak only.
  const ideal: [number, number] = isEven ? [k / 2, k / 2] : [(k + 1) / 2, (k - 1) / 2];
  const nodeInfo: LadderNodeInfo[] = [
    { id: '0', label: 'ground', column: 'source', stage: 0, capacitorIndex: null },
    { id: 's', label: 'winding', column: 'source', stage: 0, capacitorIndex: null },
    ...b.caps.map((cap, c): LadderNodeInfo => ({
      id: c + 1 === k ? 'top' : `n${c + 1}`,
      label: c + 1 === k ? `N${c + 1} (ladder top)` : `N${c + 1}`,
      column: columnOfCapacitor(cap.column),
      stage: cap.stage,
      capacitorIndex: c + 1,
    })),
  ];
  return finish('half-wave', k, isEven ? k / 2 : k / 2, [0, 1], b, id(k), 0, ideal, nodeInfo);
}

/**
 * Full-wave (symmetrical) cascade of n stages on two antiphase winding ends A (+v) and B (−v). Per stage
 * j: a_j on column A, b_j on column B, s_j on the grounded smoothing column. Diodes s_{j−1}→a_j (at L),
 * a_j→s_j (at H), s_{j−1}→b_j (at H), b_j→s_j (at L); each passes half the ladder's charge per cycle.
 */
function fullWave(capacitorsF: readonly number[]): LadderNetwork {
  const n = capacitorsF.length / 3;
  const b: Builder = { caps: [], diodes: [] };
  // Node ids: 0 ground, 1 end A, 2 end B, then per stage a_j, b_j, s_j.
  const a = (j: number): number => (j === 0 ? 1 : 3 * j);
  const bb = (j: number): number => (j === 0 ? 2 : 3 * j + 1);
  const s = (j: number): number => (j === 0 ? 0 : 3 * j + 2);
  for (let j = 1; j <= n; j += 1) {
    const d = b.diodes.length;
    b.diodes.push({ anode: s(j - 1), cathode: a(j), event: EVENT_L, share: 0.5 });
    b.diodes.push({ anode: s(j - 1), cathode: bb(j), event: EVENT_H, share: 0.5 });
    b.diodes.push({ anode: a(j), cathode: s(j), event: EVENT_H, share: 0.5 });
    b.diodes.push({ anode: bb(j), cathode: s(j), event: EVENT_L, share: 0.5 });
    const base = 3 * (j - 1);
    b.caps.push({
      top: a(j),
      bottom: a(j - 1),
      f: capacitorsF[base] ?? 0,
      column: 'oscillating-a',
      stage: j,
      diode: d,
    });
    b.caps.push({
      top: bb(j),
      bottom: bb(j - 1),
      f: capacitorsF[base + 1] ?? 0,
      column: 'oscillating-b',
      stage: j,
      diode: d + 1,
    });
    b.caps.push({
      top: s(j),
      bottom: s(j - 1),
      f: capacitorsF[base + 2] ?? 0,
      column: 'smoothing',
      stage: j,
      diode: d + 2,
    });
  }
  const nodeInfo: LadderNodeInfo[] = [
    { id: '0', label: 'ground', column: 'source', stage: 0, capacitorIndex: null },
    { id: 'sa', label: 'winding A', column: 'source', stage: 0, capacitorIndex: null },
    { id: 'sb', label: 'winding B', column: 'source', stage: 0, capacitorIndex: null },
    ...b.caps.map((cap, c): LadderNodeInfo => {
      const letter = cap.column === 'oscillating-a' ? 'a' : cap.column === 'oscillating-b' ? 'b' : 'm';
      const isTop = letter === 'm' && cap.stage === n;
      return {
        id: isTop ? 'top' : `${letter}${cap.stage}`,
        label: `${letter === 'm' ? 'S' : letter.toUpperCase()}${cap.stage}${isTop ? ' (ladder top)' : ''}`,
        column: columnOfCapacitor(cap.column),
        stage: cap.stage,
        capacitorIndex: c + 1,
      };
    }),
  ];
  return finish('full-wave', n, n, [0, 1, -1], b, s(n), 0, [n, n], nodeInfo);
}

/**
 * Bridge (Delon) doubler: the winding runs from the midpoint M (ground, node 0) to A (node 1);
 * D1 A→T charges C1 (T over M) at H, D2 B→A charges C2 (B under M) at L; output T − B.
 */
function bridgeDoubler(capacitorsF: readonly number[]): LadderNetwork {
  const b: Builder = {
    caps: [
      { top: 2, bottom: 0, f: capacitorsF[0] ?? 0, column: 'bridge', stage: 1, diode: 0 },
      { top: 3, bottom: 0, f: capacitorsF[1] ?? 0, column: 'bridge', stage: 1, diode: 1 },
    ],
    diodes: [
      { anode: 1, cathode: 2, event: EVENT_H, share: 1 },
      { anode: 3, cathode: 1, event: EVENT_L, share: 1 },
    ],
  };
  // The circuit grounds B (C2 from the midpoint to ground), so B is the return node here.
  const nodeInfo: LadderNodeInfo[] = [
    { id: 'mid', label: 'midpoint', column: 'smoothing', stage: 1, capacitorIndex: 2 },
    { id: 'w', label: 'winding', column: 'source', stage: 0, capacitorIndex: null },
    { id: 'top', label: 'T (ladder top)', column: 'smoothing', stage: 1, capacitorIndex: 1 },
    { id: '0', label: 'ground', column: 'source', stage: 0, capacitorIndex: null },
  ];
  return finish('bridge-doubler', 2, 1, [0, 1], b, 2, 3, [1, 1], nodeInfo);
}

/**
 * Networks by topology and capacitor count, built once: all but the capacitor values depends on those two
 * alone, and the Sizer and the stage scan build thousands. Their arrays are shared and never written.
 */
const skeletons = new Map<string, LadderNetwork>();
const SKELETON_CACHE_SIZE = 512;

function skeletonOf(topology: Topology, capacitorsF: readonly number[]): LadderNetwork {
  const key = `${topology}:${capacitorsF.length}`;
  let net = skeletons.get(key);
  if (!net) {
    const units = new Array<number>(capacitorsF.length).fill(1);
    net =
      topology === 'half-wave' ? halfWave(units) : topology === 'full-wave' ? fullWave(units) : bridgeDoubler(units);
    if (skeletons.size >= SKELETON_CACHE_SIZE) skeletons.clear();
    skeletons.set(key, net);
  }
  return net;
}

/** Builds the network of a topology from capacitors in the MultiplierSpec order (capacitor c is `capF[c]`). */
export function buildLadderNetwork(topology: Topology, capacitorsF: readonly number[]): LadderNetwork {
  if (capacitorsF.length === 0)
    throw new DomainError('invalid_argument', 'a ladder needs at least one capacitor', 'capacitorsF');
  capacitorsF.forEach((value, i) => {
    if (!(value > 0) || !Number.isFinite(value)) {
      throw new DomainError('invalid_argument', 'capacitance must be positive', `capacitorsF[${i}]`);
    }
  });
  if (topology === 'full-wave' && capacitorsF.length % 3 !== 0) {
    throw new DomainError('invalid_argument', 'a full-wave cascade needs three capacitors per stage', 'capacitorsF');
  }
  if (topology === 'bridge-doubler' && capacitorsF.length !== 2)
    throw new DomainError('invalid_argument', 'a bridge doubler has two capacitors', 'capacitorsF');
  return { ...skeletonOf(topology, capacitorsF), capF: capacitorsF.slice() };
}
