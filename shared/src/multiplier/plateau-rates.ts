import { createScratch, solveShorted, type Scratch } from './plateau-network';
import { EVENT_H, EVENT_L, type LadderNetwork } from './topologies';

/** Capacitor and node voltage rates per ampere of load through a flat-top phase (V/s per A). */
export interface PlateauRates {
  capRate: number[];
  nodeRate: number[];
  /** The part of `capRate` carried by the conducting diodes (capRate − the bare load rate). */
  diodeCapDelta: number[];
  /** The diodes that conduct through the phase (1), by diode index. */
  conducting: Uint8Array;
}

/** A conducting diode may carry this much reverse current per ampere of load (rounding) and still count as conducting. */
const CURRENT_TOLERANCE = 1e-9;
/** A diode out of the set may see this much forward voltage rate, relative to the largest node rate, and stay out. */
const RATE_TOLERANCE = 1e-9;
/**
 * A guard on the rounds, far past any ladder's need (the longest measured: a few, from any start; the method is
 * finite without it, but Murty's bound grows as 2^k with k diodes).
 */
const ROUND_LIMIT = 64;
/** Block rounds that may fail to lower the count of wrong diodes before single least-index flips take over. */
const BLOCK_STALLS = 3;

/**
 * Flat-top (pulse) drive: through a phase the source holds still and the diodes that conducted at its
 * start stay at their conduction boundary while the load draws current, so the load is shared through
 * them. For the rates the conducting diodes are short circuits and the winding ends fixed, which leaves
 * a capacitor network: nodal analysis over the nodes the diodes join (Laplacian of the capacitances,
 * the winding ends as the reference) gives the node rates, and Kirchhoff's current law, node by node
 * from the ends of each chain of conducting diodes, gives each diode's current (`solveShorted`).
 *
 * Which of the diodes that conducted at the event go on conducting is a linear complementarity problem: a
 * conducting diode carries forward current (≥ 0), a diode out of the set is not forward-biased (its voltage
 * rate ≤ 0), one of the two is zero for each. The network is passive (its matrix symmetric positive definite,
 * so a P-matrix), which makes the answer unique and the block principal pivoting method with Murty's
 * least-index rule as its safeguard finite: every round flips every diode that breaks its condition into or
 * out of the set; after BLOCK_STALLS rounds that do not lower the count of such diodes, one flip at a time,
 * the lowest-numbered, until the count falls below its least (Júdice & Pires, Comput. Oper. Res. 21 (1994)
 * 587–596; Murty, Opsearch 11 (1974) 123–130; from memory). Each round checks the whole answer, so the set
 * it ends on is the solution, the empty set included (no diode holds: the load rates alone). `start` is a
 * set to begin from (a nearby network's answer; every diode of the event when none): it changes the rounds
 * taken, never the answer. Null when a network is singular or a diode current is not determined (then the
 * phase is treated as instantaneous transfer).
 * Method: modified nodal analysis of a switched-capacitor network (Vlach & Singhal, Computer Methods for
 * Circuit Analysis and Design, 2nd ed., ch. 2, from memory); the banded LDLᵀ factorization of a symmetric
 * positive definite matrix (Golub & Van Loan, Matrix Computations, 4th ed., §4.3, from memory).
 */
export function plateauRates(
  net: LadderNetwork,
  loadRate: readonly number[],
  event: number,
  start?: Uint8Array,
): PlateauRates | null {
  const diodes = net.diodeEvent.length;
  const conducting = new Uint8Array(diodes);
  for (let d = 0; d < diodes; d += 1) {
    if (net.diodeEvent[d] === event) conducting[d] = start ? (start[d] ?? 1) : 1;
  }
  const scratch = createScratch(net);
  const isWrong = new Uint8Array(diodes);
  let fewestWrong = Infinity;
  let stalls = 0;
  for (let round = 0; round < ROUND_LIMIT; round += 1) {
    if (!solveShorted(net, conducting, scratch)) return null;
    const wrong = wrongDiodes(net, conducting, event, scratch, isWrong);
    if (wrong.count === 0) return ratesOf(net, loadRate, scratch, conducting);
    if (wrong.count < fewestWrong) {
      fewestWrong = wrong.count;
      stalls = 0;
    } else stalls += 1;
    if (stalls < BLOCK_STALLS) {
      for (let d = 0; d < diodes; d += 1) conducting[d] = (conducting[d] as number) ^ (isWrong[d] as number);
    } else conducting[wrong.first] = (conducting[wrong.first] as number) ^ 1;
  }
  return null;
}

/**
 * Diodes of the event that break their condition in the solved network (marked in `isWrong`): conducting
 * with reverse current, or out of the set and forward-biased. Their count and the lowest-numbered one.
 */
function wrongDiodes(
  net: LadderNetwork,
  conducting: Uint8Array,
  event: number,
  s: Scratch,
  isWrong: Uint8Array,
): { count: number; first: number } {
  const nodeRate = s.nodeRate;
  let largestRate = 0;
  for (let n = 0; n < net.nodeCount; n += 1) largestRate = Math.max(largestRate, Math.abs(nodeRate[n] as number));
  const rateTolerance = RATE_TOLERANCE * largestRate;
  let count = 0;
  let first = -1;
  for (let d = 0; d < conducting.length; d += 1) {
    isWrong[d] = 0;
    if (net.diodeEvent[d] !== event) continue;
    const wrong = conducting[d]
      ? (s.current[d] as number) < -CURRENT_TOLERANCE
      : (nodeRate[net.diodeAnode[d] as number] as number) - (nodeRate[net.diodeCathode[d] as number] as number) >
        rateTolerance;
    if (!wrong) continue;
    isWrong[d] = 1;
    count += 1;
    if (first < 0) first = d;
  }
  return { count, first };
}

function ratesOf(net: LadderNetwork, loadRate: readonly number[], s: Scratch, conducting: Uint8Array): PlateauRates {
  const m = net.capF.length;
  const capRate = new Array<number>(m);
  const diodeCapDelta = new Array<number>(m);
  for (let c = 0; c < m; c += 1) {
    capRate[c] = s.capRate[c] as number;
    diodeCapDelta[c] = (s.capRate[c] as number) - (loadRate[c] as number);
  }
  // A plain copy loop: Array.from over a typed subarray cost more than the whole round's solve.
  const nodeRate = new Array<number>(net.nodeCount);
  for (let n = 0; n < net.nodeCount; n += 1) nodeRate[n] = s.nodeRate[n] as number;
  return { capRate, nodeRate, diodeCapDelta, conducting };
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
    conducting: rates.conducting,
  };
}

/**
 * The last set of conducting diodes found per topology, capacitor count and event: a network edited from one
 * met before (a capacitor changed) most often ends on the same set, so its active-set method starts there and
 * takes one round instead of one per diode that drops out.
 */
const lastSets = new Map<string, Uint8Array>();
const LAST_SET_MEMORY = 256;

function phaseRates(net: LadderNetwork, loadRate: readonly number[], event: number): PlateauRates | null {
  const key = `${net.topology}:${net.capF.length}:${event}`;
  const rates = plateauRates(net, loadRate, event, lastSets.get(key));
  if (rates) {
    lastSets.delete(key);
    lastSets.set(key, rates.conducting);
    if (lastSets.size > LAST_SET_MEMORY) lastSets.delete(lastSets.keys().next().value as string);
  }
  return rates;
}

/**
 * `plateauRates` of the H and L phases together, as the charge-transfer model takes them: both or none.
 * The L phase first, since without its rates the H phase's are not used. The rates depend only on the
 * topology and the capacitor values (per ampere of load), so the last FLAT_TOP_CACHE_SIZE networks are
 * remembered. They are free of scale: with every capacitor k times larger every rate is k times smaller and
 * every diode current (per ampere) the same, so the same active set drops out; a network is remembered by
 * its capacitors over the first one, and a ladder of the same ratios (a uniform ladder edited to another
 * value) takes the remembered rates scaled. Each phase's active set starts from the last one found for the same
 * topology and capacitor count. The arrays returned are shared and must not be written.
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
  const l = phaseRates(net, loadRate, EVENT_L);
  const h = l ? phaseRates(net, loadRate, EVENT_H) : null;
  const rates = h && l ? { h, l } : null;
  flatTopCache.delete(key);
  flatTopCache.set(key, { ratios, scaleF, rates });
  if (flatTopCache.size > FLAT_TOP_CACHE_SIZE) flatTopCache.delete(flatTopCache.keys().next().value as string);
  return rates;
}
