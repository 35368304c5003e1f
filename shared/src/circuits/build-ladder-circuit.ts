import type { Design, PulseDrive, SineDrive, Topology } from '../designs/design.types';
import { DomainError } from '../errors';
import type { Circuit, CircuitElement, DiodeModel, SourceWaveform } from '../sim/circuit.types';
import { diodeModelOf } from './device-models';

/** Everything the simulator needs to know about a ladder, flattened from a design or from flags. */
export interface LadderCircuitSpec {
  topology: Topology;
  cellCount: number;
  /** In the design document's order (see designs/design.types.ts MultiplierSpec). */
  capacitorsF: ReadonlyArray<number>;
  diode: DiodeModel;
  /** The secondary's open-circuit waveform (volts) and its source resistance. */
  drive: SineDrive | PulseDrive;
  /** Negative ladders reverse every diode. */
  isNegative?: boolean;
  bleederOhm?: number | null;
  seriesOutputResistanceOhm?: number;
  load?: { kind: 'current'; currentA: number } | { kind: 'resistance'; resistanceOhm: number } | null;
  strayCapacitanceF?: number;
  /** Switch the drive off (secondary shorted through its source resistance) at this time. */
  driveOffAtS?: number;
  /** Initial voltage of each capacitor, same order as capacitorsF (for a discharge from a known state). */
  initialCapacitorVoltagesV?: ReadonlyArray<number>;
}

/** Names the built circuit gives to the nodes a caller needs. */
export const LADDER_NODES = { ladderTop: 'top', loadTerminal: 'out' } as const;

/** Capacitor element names in the design's order: C1, C2, … */
export function capacitorName(index: number): string {
  return `C${index + 1}`;
}

function driveWaveform(drive: SineDrive | PulseDrive, sign: 1 | -1): SourceWaveform {
  if (drive.kind === 'sine')
    return { kind: 'sine', offset: 0, amplitude: sign * drive.peakV, frequencyHz: drive.frequencyHz };
  const periodS = 1 / drive.frequencyHz;
  const edgeS = periodS * 1e-3;
  return {
    kind: 'pulse',
    initial: -sign * drive.flybackPeakV,
    pulsed: sign * drive.forwardPeakV,
    delayS: 0,
    riseS: edgeS,
    fallS: edgeS,
    widthS: Math.max(drive.dutyCycle * periodS - edgeS, edgeS),
    periodS,
  };
}

/**
 * Circuit of a voltage multiplier with its drive, output network and load. Node names: 'top' the ladder
 * output (bleeder there), 'out' the load terminal. Half-wave ladders follow one diode chain n0 … nK with
 * diode i from n(i−1) to n(i) and capacitor i from n(i) to n(i−2); the chain starts at ground (even cell
 * count, first capacitor oscillating) or at the source (odd count, first capacitor smoothing), which is the
 * Greinacher / Cockcroft–Walton cascade (REFERENCES.md §1). Full-wave: two antiphase windings and three
 * capacitors per stage; bridge doubler: the secondary floats between the two stacked halves (§2).
 */
export function buildLadderCircuit(spec: LadderCircuitSpec): Circuit {
  const el: CircuitElement[] = [];
  const k = spec.cellCount;
  const caps = spec.capacitorsF;
  const expected = spec.topology === 'full-wave' ? 3 * k : spec.topology === 'bridge-doubler' ? 2 : k;
  if (!Number.isInteger(k) || k < 1)
    throw new DomainError('invalid_argument', 'cell count must be a positive integer', 'multiplier.cellCount');
  if (spec.topology === 'bridge-doubler' && k !== 2)
    throw new DomainError('invalid_argument', 'a bridge doubler has 2 cells', 'multiplier.cellCount');
  if (caps.length !== expected) {
    throw new DomainError(
      'invalid_argument',
      `expected ${expected} capacitors, got ${caps.length}`,
      'multiplier.capacitors',
    );
  }
  const ic = spec.initialCapacitorVoltagesV;
  const sign: 1 | -1 = spec.isNegative ? -1 : 1;
  let diodeCount = 0;
  const diode = (from: string, to: string): void => {
    diodeCount++;
    const [anode, cathode] = sign > 0 ? [from, to] : [to, from];
    el.push({ kind: 'diode', name: `D${diodeCount}`, anode, cathode, model: spec.diode });
  };
  const capacitor = (index: number, a: string, b: string): void => {
    el.push({
      kind: 'capacitor',
      name: capacitorName(index),
      nodeA: a,
      nodeB: b,
      capacitanceF: caps[index]!,
      initialVoltageV: ic?.[index] ?? 0,
    });
  };
  const rs = spec.drive.sourceResistanceOhm;
  const winding = (name: string, plus: string, minus: string, phase: 1 | -1): void => {
    const emf = `${name}_emf`;
    const base = driveWaveform(spec.drive, phase);
    el.push({
      kind: 'voltage-source',
      name: `V${name}`,
      nodePlus: rs > 0 || spec.driveOffAtS !== undefined ? emf : plus,
      nodeMinus: minus,
      waveform: base,
    });
    let at = rs > 0 || spec.driveOffAtS !== undefined ? emf : plus;
    if (spec.driveOffAtS !== undefined) {
      // Drive off: the winding opens from the source and is shorted through the same source resistance.
      const mid = `${name}_sw`;
      el.push({
        kind: 'switch',
        name: `S${name}`,
        nodeA: at,
        nodeB: mid,
        onResistanceOhm: 1e-3,
        offResistanceOhm: 1e12,
        isInitiallyClosed: true,
        events: [{ timeS: spec.driveOffAtS, isClosed: false }],
      });
      el.push({
        kind: 'switch',
        name: `S${name}_short`,
        nodeA: mid,
        nodeB: minus,
        onResistanceOhm: 1e-3,
        offResistanceOhm: 1e12,
        isInitiallyClosed: false,
        events: [{ timeS: spec.driveOffAtS, isClosed: true }],
      });
      at = mid;
    }
    if (rs > 0) el.push({ kind: 'resistor', name: `R${name}`, nodeA: at, nodeB: plus, resistanceOhm: rs });
    else if (at !== plus) el.push({ kind: 'resistor', name: `R${name}`, nodeA: at, nodeB: plus, resistanceOhm: 1e-3 });
  };
  const top = LADDER_NODES.ladderTop;
  const ladderNodes: string[] = [];
  if (spec.topology === 'half-wave') {
    winding('src', 's', '0', 1);
    const chain = (i: number): string => {
      if (i === k) return top;
      if (i >= 1) return `n${i}`;
      const even = k % 2 === 0;
      if (i === 0) return even ? '0' : 's';
      return even ? 's' : '0';
    };
    for (let i = 1; i <= k; i++) {
      diode(chain(i - 1), chain(i));
      capacitor(i - 1, chain(i), chain(i - 2));
      ladderNodes.push(chain(i));
    }
  } else if (spec.topology === 'full-wave') {
    winding('srcA', 'sa', '0', 1);
    winding('srcB', 'sb', '0', -1);
    for (let j = 1; j <= k; j++) {
      const prev = (col: string): string => (j === 1 ? (col === 'm' ? '0' : `s${col}`) : `${col}${j - 1}`);
      const cur = (col: string): string => (col === 'm' && j === k ? top : `${col}${j}`);
      capacitor(3 * (j - 1), cur('a'), prev('a'));
      capacitor(3 * (j - 1) + 1, cur('b'), prev('b'));
      capacitor(3 * (j - 1) + 2, cur('m'), prev('m'));
      diode(prev('m'), cur('a'));
      diode(prev('m'), cur('b'));
      diode(cur('a'), cur('m'));
      diode(cur('b'), cur('m'));
      ladderNodes.push(cur('a'), cur('b'), cur('m'));
    }
  } else {
    // Bridge doubler: winding between 'w' and the midpoint 'mid'; C1 top–mid, C2 mid–ground.
    winding('src', 'w', 'mid', 1);
    diode('w', top);
    diode('0', 'w');
    capacitor(0, top, 'mid');
    capacitor(1, 'mid', '0');
    ladderNodes.push(top, 'mid', 'w');
  }
  const stray = spec.strayCapacitanceF ?? 0;
  if (stray > 0) {
    ladderNodes.forEach((n, i) =>
      el.push({ kind: 'capacitor', name: `Cstray${i + 1}`, nodeA: n, nodeB: '0', capacitanceF: stray }),
    );
  }
  if (spec.bleederOhm)
    el.push({ kind: 'resistor', name: 'Rbleed', nodeA: top, nodeB: '0', resistanceOhm: spec.bleederOhm });
  const rOut = spec.seriesOutputResistanceOhm ?? 0;
  const out = LADDER_NODES.loadTerminal;
  el.push({ kind: 'resistor', name: 'Rout', nodeA: top, nodeB: out, resistanceOhm: rOut > 0 ? rOut : 1e-3 });
  const load = spec.load;
  if (load?.kind === 'current' && load.currentA !== 0) {
    el.push({
      kind: 'current-source',
      name: 'Iload',
      nodePlus: sign > 0 ? out : '0',
      nodeMinus: sign > 0 ? '0' : out,
      waveform: { kind: 'dc', value: load.currentA },
    });
  } else if (load?.kind === 'resistance') {
    el.push({ kind: 'resistor', name: 'Rload', nodeA: out, nodeB: '0', resistanceOhm: load.resistanceOhm });
  } else {
    // An open output terminal still needs a DC path for the matrix: 1 TΩ, far below any leakage of note.
    el.push({ kind: 'resistor', name: 'Ropen', nodeA: out, nodeB: '0', resistanceOhm: 1e12 });
  }
  return { title: `${spec.topology} ladder, ${k} cells`, elements: el };
}

/** The ladder of a design document without its drive: capacitors, diodes, output network and load. */
export function ladderPartFromDesign(design: Design): Omit<LadderCircuitSpec, 'drive'> {
  const m = design.multiplier;
  const bleeder = design.outputNetwork.bleeder;
  return {
    topology: m.topology,
    cellCount: m.cellCount,
    capacitorsF: m.capacitors.map((c) => c.valueF),
    diode: diodeModelOf(m.diode, m.diode),
    isNegative: design.targets.outputV < 0,
    bleederOhm: bleeder ? bleeder.count * bleeder.valueOhm : null,
    seriesOutputResistanceOhm: design.outputNetwork.seriesOutputResistanceOhm,
    load: design.load,
    ...(m.strayCapacitanceF ? { strayCapacitanceF: m.strayCapacitanceF } : {}),
  };
}

/** The ladder spec of a design document with a sine or pulse drive (a driver drive: see design-circuit.ts). */
export function ladderSpecFromDesign(design: Design): LadderCircuitSpec {
  const d = design.drive;
  if (d.kind === 'driver') {
    throw new DomainError(
      'invalid_design',
      'a driver drive is simulated with its transistor stage (buildCircuit in design-circuit.ts)',
      'drive.kind',
    );
  }
  return { ...ladderPartFromDesign(design), drive: d };
}

/**
 * Ideal no-load capacitor voltages of a ladder (REFERENCES.md §1: the first capacitor charges to the peak
 * Vmax, every other to 2·Vmax; full-wave: both first oscillating capacitors Vmax; bridge: Vmax each).
 * Used as the starting state for start-up-free runs and as the first guess of the periodic steady state.
 */
export function idealCapacitorVoltagesV(spec: LadderCircuitSpec): number[] {
  const d = spec.drive;
  const swing = d.kind === 'sine' ? d.peakV : (d.forwardPeakV + d.flybackPeakV) / 2;
  const sign = spec.isNegative ? -1 : 1;
  return spec.capacitorsF.map((_, i) => {
    if (spec.topology === 'bridge-doubler') return sign * swing;
    if (spec.topology === 'full-wave') return sign * (i < 2 ? swing : 2 * swing);
    return sign * (i === 0 ? swing : 2 * swing);
  });
}
