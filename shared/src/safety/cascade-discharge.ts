import { DomainError } from '../errors';

/**
 * A ladder with its drive stopped, as the bleeder sees it: capacitors between nodes, diodes between nodes, the
 * winding ends and the return held together at 0 V (a winding is a short at DC), and the bleeder from the output
 * node to the return node. Node voltages at switch-off are of the ladder's own polarity made positive (the output
 * above the return), V.
 */
export interface CascadeDischargeInput {
  nodeCount: number;
  /** The nodes at 0 V once the drive stops: the winding ends and the node the capacitor columns stand on. */
  anchorNodes: readonly number[];
  capacitors: readonly { top: number; bottom: number; valueF: number }[];
  /** Ideal diodes: conducting (a short) while their anode would rise above their cathode. */
  diodes: readonly { anode: number; cathode: number }[];
  outNode: number;
  returnNode: number;
  /** Node voltages at switch-off (anchors 0), V. */
  nodeVoltagesV: readonly number[];
}

/** One interval of the discharge: from its start the output decays as startV·e^(−t/(R·capacitanceF)). */
export interface DischargePhase {
  /** Output at the start of the interval, V. */
  startV: number;
  /** The capacitance the bleeder sees through the diodes conducting in this interval, F. */
  capacitanceF: number;
}

/** Work arrays of one discharge, reused by every solve of its intervals. */
interface FallWork {
  parent: Int32Array;
  unknownOf: Int32Array;
  index: Int32Array;
  band: Float64Array;
  rhs: Float64Array;
  x: Float64Array;
}

function fallWorkOf(nodeCount: number): FallWork {
  return {
    parent: new Int32Array(nodeCount),
    unknownOf: new Int32Array(nodeCount),
    index: new Int32Array(nodeCount),
    band: new Float64Array(0),
    rhs: new Float64Array(nodeCount),
    x: new Float64Array(nodeCount),
  };
}

/**
 * Solves the symmetric positive definite system `a`·x = b in place (banded elimination without pivoting): `a` holds
 * row i's entries from column i − width to i + width at i·(2·width + 1) + (j − i + width); the solution goes to `x`.
 */
function solveBanded(a: Float64Array, b: Float64Array, x: Float64Array, n: number, width: number): void {
  // Row i's entry in column j sits at i·stride + (j − i + width), so row i's column j is rowI + j.
  const stride = 2 * width + 1;
  for (let k = 0; k < n; k++) {
    const rowK = k * stride + width - k;
    const pivot = a[rowK + k]!;
    const last = Math.min(n - 1, k + width);
    for (let i = k + 1; i <= last; i++) {
      const rowI = i * stride + width - i;
      const factor = a[rowI + k]! / pivot;
      if (factor === 0) continue;
      for (let j = k; j <= last; j++) a[rowI + j]! -= factor * a[rowK + j]!;
      b[i]! -= factor * b[k]!;
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    const rowI = i * stride + width - i;
    let sum = b[i]!;
    const last = Math.min(n - 1, i + width);
    for (let j = i + 1; j <= last; j++) sum -= a[rowI + j]! * x[j]!;
    x[i] = sum / a[rowI + i]!;
  }
}

/**
 * Fall of every node voltage per coulomb the bleeder draws (out → return), with the conducting diodes as shorts:
 * the nodal capacitance equations with the anchors at 0 V, solved for a unit charge taken from the output node and
 * given to the return node. Nodes joined by conducting diodes form one unknown, numbered by their lowest node so
 * the matrix stays banded along the ladder.
 */
function fallPerCoulomb(input: CascadeDischargeInput, isConducting: readonly boolean[], work: FallWork): number[] {
  const { parent, unknownOf } = work;
  for (let i = 0; i < input.nodeCount; i++) parent[i] = i;
  const [firstAnchor = 0] = input.anchorNodes;
  for (const anchor of input.anchorNodes) join(parent, anchor, firstAnchor);
  for (let d = 0; d < input.diodes.length; d++) {
    if (isConducting[d]) join(parent, input.diodes[d]!.anode, input.diodes[d]!.cathode);
  }
  const ground = find(parent, firstAnchor);
  unknownOf.fill(-1);
  let n = 0;
  for (let i = 0; i < input.nodeCount; i++) {
    const root = find(parent, i);
    if (root !== ground && unknownOf[root] === -1) unknownOf[root] = n++;
  }
  // Each node's unknown (−1 at the anchors).
  const index = work.index;
  for (let i = 0; i < input.nodeCount; i++) index[i] = unknownOf[find(parent, i)]!;
  let width = 0;
  for (const c of input.capacitors) {
    const top = index[c.top]!;
    const bottom = index[c.bottom]!;
    if (top >= 0 && bottom >= 0 && top !== bottom) width = Math.max(width, Math.abs(top - bottom));
  }
  const stride = 2 * width + 1;
  if (work.band.length < n * stride) work.band = new Float64Array(n * stride);
  const a = work.band;
  a.fill(0, 0, n * stride);
  for (const c of input.capacitors) {
    const top = index[c.top]!;
    const bottom = index[c.bottom]!;
    if (top === bottom) continue;
    if (top >= 0) a[top * stride + width]! += c.valueF;
    if (bottom >= 0) a[bottom * stride + width]! += c.valueF;
    if (top >= 0 && bottom >= 0) {
      a[top * stride + (bottom - top + width)]! -= c.valueF;
      a[bottom * stride + (top - bottom + width)]! -= c.valueF;
    }
  }
  const b = work.rhs;
  b.fill(0, 0, n);
  const out = index[input.outNode]!;
  const ret = index[input.returnNode]!;
  if (out >= 0) b[out]! += 1;
  if (ret >= 0) b[ret]! -= 1;
  const x = work.x;
  if (n > 0) solveBanded(a, b, x, n, width);
  const fall = new Array<number>(input.nodeCount);
  for (let node = 0; node < input.nodeCount; node++) {
    const k = index[node]!;
    fall[node] = k >= 0 ? x[k]! : 0;
  }
  return fall;
}

function find(parent: Int32Array, i: number): number {
  while (parent[i] !== i) i = parent[i] = parent[parent[i]!]!;
  return i;
}

function join(parent: Int32Array, a: number, b: number): void {
  const ra = find(parent, a);
  const rb = find(parent, b);
  if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
}

/**
 * Bleeder discharge of a cascade with ideal diodes, interval by interval. While a set of diodes conducts, the
 * ladder is a capacitor network with one resistor, so the output decays exponentially with the capacitance the
 * bleeder sees through that set, and every node falls in proportion to the charge drawn; an interval ends when a
 * further diode's anode reaches its cathode, which then conducts. On a tripler, for instance, the bleeder first
 * drains the two capacitors in series on its path, then the smoothing capacitor joins through the top diode, then
 * the first diode clamps the bottom of the path: three intervals, each an RC decay (the stages of a hand
 * calculation). A diode that conducts is taken to go on conducting as every charge falls. Seconds and volts.
 */
export function cascadeDischargePhases(input: CascadeDischargeInput): DischargePhase[] {
  const v = [...input.nodeVoltagesV];
  const outputV = () => v[input.outNode]! - v[input.returnNode]!;
  const isConducting = input.diodes.map(() => false);
  const gap = (d: number) => v[input.diodes[d]!.anode]! - v[input.diodes[d]!.cathode]!;
  const phases: DischargePhase[] = [];
  const work = fallWorkOf(input.nodeCount);
  const scaleV = Math.max(1e-9, Math.abs(outputV()));
  const edgeV = 1e-9 * scaleV;
  for (let round = 0; round <= input.diodes.length; round++) {
    let fall = fallPerCoulomb(input, isConducting, work);
    // Diodes at their edge that the next charge drawn would bias forward start to conduct (one at a time: each
    // changes how the others move).
    for (let added = true; added;) {
      added = false;
      for (let d = 0; d < input.diodes.length; d++) {
        const diode = input.diodes[d]!;
        if (isConducting[d] || gap(d) < -edgeV || fall[diode.anode]! >= fall[diode.cathode]!) continue;
        isConducting[d] = true;
        fall = fallPerCoulomb(input, isConducting, work);
        added = true;
      }
    }
    const outFall = fall[input.outNode]! - fall[input.returnNode]!;
    if (!(outFall > 0)) {
      // The diodes have joined the output to the return: the ladder is empty.
      if (phases.length > 0) break;
      throw new DomainError('invalid_argument', 'the bleeder sees no capacitance to discharge', 'capacitors');
    }
    const capacitanceF = 1 / outFall;
    phases.push({ startV: outputV(), capacitanceF });
    // The charge drawn until the next diode reaches its edge (none: the decay runs to 0 V).
    let chargeC = Infinity;
    input.diodes.forEach((diode, d) => {
      const closing = fall[diode.cathode]! - fall[diode.anode]!;
      if (!isConducting[d] && closing > 0) chargeC = Math.min(chargeC, -gap(d) / closing);
    });
    // Events at the very end of the decay (the last diodes reaching their edge as everything nears 0 V) end it.
    if (!Number.isFinite(chargeC) || chargeC >= outputV() * capacitanceF * (1 - 1e-9)) break;
    for (let i = 0; i < input.nodeCount; i++) v[i]! -= fall[i]! * chargeC;
  }
  return phases;
}

/**
 * Time for the output to fall from its switch-off value to `levelV` through `bleederOhm`, over the phases of
 * `cascadeDischargePhases`: in each, t = R·C·ln(V_start/V_end) (REFERENCES.md §4). 0 when already below. Seconds.
 */
export function cascadeDischargeTimeS(phases: readonly DischargePhase[], bleederOhm: number, levelV: number): number {
  if (!(bleederOhm > 0) || !(levelV > 0)) {
    throw new DomainError('invalid_argument', 'discharge needs positive resistance and end voltage', 'bleeder');
  }
  let timeS = 0;
  for (let p = 0; p < phases.length; p++) {
    const phase = phases[p]!;
    const endV = phases[p + 1]?.startV ?? 0;
    if (phase.startV <= levelV) return timeS;
    const rcS = bleederOhm * phase.capacitanceF;
    if (endV < levelV) return timeS + rcS * Math.log(phase.startV / levelV);
    timeS += rcS * Math.log(phase.startV / endV);
  }
  return timeS;
}
