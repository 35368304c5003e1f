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

/** Solves the symmetric positive definite system `a`·x = b in place (banded elimination without pivoting). */
function solveBanded(a: number[][], b: number[]): number[] {
  const n = b.length;
  let width = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (a[i]![j] !== 0) width = Math.max(width, Math.abs(i - j));
  for (let k = 0; k < n; k++) {
    const pivot = a[k]![k]!;
    for (let i = k + 1; i <= Math.min(n - 1, k + width); i++) {
      const factor = a[i]![k]! / pivot;
      if (factor === 0) continue;
      for (let j = k; j <= Math.min(n - 1, k + width); j++) a[i]![j]! -= factor * a[k]![j]!;
      b[i]! -= factor * b[k]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let sum = b[i]!;
    for (let j = i + 1; j <= Math.min(n - 1, i + width); j++) sum -= a[i]![j]! * x[j]!;
    x[i] = sum / a[i]![i]!;
  }
  return x;
}

/**
 * Fall of every node voltage per coulomb the bleeder draws (out → return), with the conducting diodes as shorts:
 * the nodal capacitance equations with the anchors at 0 V, solved for a unit charge taken from the output node and
 * given to the return node. Nodes joined by conducting diodes form one unknown, numbered by their lowest node so
 * the matrix stays banded along the ladder.
 */
function fallPerCoulomb(input: CascadeDischargeInput, isConducting: readonly boolean[]): number[] {
  const parent = Array.from({ length: input.nodeCount }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]!]!;
    return i;
  };
  const join = (a: number, b: number) => {
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
  };
  const [firstAnchor = 0] = input.anchorNodes;
  for (const anchor of input.anchorNodes) join(anchor, firstAnchor);
  input.diodes.forEach((diode, d) => {
    if (isConducting[d]) join(diode.anode, diode.cathode);
  });
  const ground = find(firstAnchor);
  const unknownOf = new Map<number, number>();
  for (let i = 0; i < input.nodeCount; i++) {
    const root = find(i);
    if (root !== ground && !unknownOf.has(root)) unknownOf.set(root, unknownOf.size);
  }
  const n = unknownOf.size;
  const index = (node: number): number => unknownOf.get(find(node)) ?? -1;
  const a = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (const c of input.capacitors) {
    const top = index(c.top);
    const bottom = index(c.bottom);
    if (top === bottom) continue;
    if (top >= 0) a[top]![top]! += c.valueF;
    if (bottom >= 0) a[bottom]![bottom]! += c.valueF;
    if (top >= 0 && bottom >= 0) {
      a[top]![bottom]! -= c.valueF;
      a[bottom]![top]! -= c.valueF;
    }
  }
  const b = new Array<number>(n).fill(0);
  const out = index(input.outNode);
  const ret = index(input.returnNode);
  if (out >= 0) b[out]! += 1;
  if (ret >= 0) b[ret]! -= 1;
  const x = n > 0 ? solveBanded(a, b) : [];
  return Array.from({ length: input.nodeCount }, (_, node) => {
    const k = index(node);
    return k >= 0 ? x[k]! : 0;
  });
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
  const scaleV = Math.max(1e-9, Math.abs(outputV()));
  const edgeV = 1e-9 * scaleV;
  for (let round = 0; round <= input.diodes.length; round++) {
    let fall = fallPerCoulomb(input, isConducting);
    // Diodes at their edge that the next charge drawn would bias forward start to conduct (one at a time: each
    // changes how the others move).
    for (let added = true; added;) {
      added = false;
      for (let d = 0; d < input.diodes.length; d++) {
        const diode = input.diodes[d]!;
        if (isConducting[d] || gap(d) < -edgeV || fall[diode.anode]! >= fall[diode.cathode]!) continue;
        isConducting[d] = true;
        fall = fallPerCoulomb(input, isConducting);
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
