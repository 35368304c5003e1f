import type { Circuit, CircuitElement } from './circuit.types';
import { emptyNpnOperatingPoint, evaluateNpn } from './devices/bjt';
import { npnInternalNodeName } from './devices/npn-instance';
import { inductanceMatrix } from './devices/coupled-inductors';
import { coreCorrectionEnergyJ } from './devices/saturable-core';
import { evaluateDiode, seriesDiodeCurrentA, type DiodeOperatingPoint } from './devices/diode';
import type { MnaSystem } from './mna-system';
import { waveformValue } from './source-waveforms';

export interface EnergyAccount {
  /** Energy delivered by the voltage sources (J); current sources count as loads. */
  suppliedJ: number;
  /** Energy taken by each element: resistors, winding resistances, switches, diodes, transistors, current-source loads (J). */
  dissipatedJ: Record<string, number>;
  /** Stored energy (capacitors ½CV², windings ½iᵀLi) at the end minus at the start, J. */
  storedChangeJ: number;
}

/**
 * Energy bookkeeping of a transient run from the node voltages and branch currents of each accepted step
 * (trapezoidal integration of every element's power): what the sources deliver, what each element
 * dissipates (i²R, i·v of each junction from its DC characteristic), and the change of stored energy. By
 * Tellegen's theorem the supplied energy equals the dissipated energy plus the stored change; the gap
 * measures the simulation's error in charge and energy (junction depletion charge is left out: its
 * stored energy is negligible next to the capacitors').
 */
export class EnergyMeter {
  private readonly system: MnaSystem;
  private readonly elements: ReadonlyArray<CircuitElement>;
  private readonly dissipated: Float64Array;
  private readonly lastPower: Float64Array;
  private readonly scratch: Float64Array;
  private supplied = 0;
  private lastSupplied = 0;
  private lastTimeS = NaN;
  private storedAtStartJ = NaN;
  private readonly diodeOut: DiodeOperatingPoint = { currentA: 0, conductanceS: 0 };
  private readonly npnOut = emptyNpnOperatingPoint();
  private readonly inductances = new Map<string, Float64Array>();

  constructor(circuit: Circuit, system: MnaSystem) {
    this.system = system;
    this.elements = circuit.elements;
    this.dissipated = new Float64Array(this.elements.length);
    this.lastPower = new Float64Array(this.elements.length);
    this.scratch = new Float64Array(this.elements.length);
    for (const e of this.elements) {
      if (e.kind === 'coupled-inductors') this.inductances.set(e.name, inductanceMatrix(e, e.name));
    }
  }

  private v(node: string): number {
    const i = node === '0' ? this.system.size : this.system.nodeIndex.get(node);
    return i === undefined ? 0 : this.system.x[i]!;
  }

  private branch(name: string): number {
    return this.system.x[this.system.branchIndex.get(name)!]!;
  }

  private storedJ(): number {
    let sum = 0;
    for (const e of this.elements) {
      if (e.kind === 'capacitor') sum += 0.5 * e.capacitanceF * (this.v(e.nodeA) - this.v(e.nodeB)) ** 2;
      else if (e.kind === 'inductor') sum += 0.5 * e.inductanceH * this.branch(e.name) ** 2;
      else if (e.kind === 'coupled-inductors') {
        const m = this.inductances.get(e.name)!;
        const n = e.windings.length;
        const i = e.windings.map((w) => this.branch(`${e.name}.${w.name}`));
        for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) sum += 0.5 * m[a * n + b]! * i[a]! * i[b]!;
        if (e.core) {
          const l1 = e.windings[0]!.inductanceH;
          const im = e.windings.reduce((acc, w, k) => acc + Math.sqrt(w.inductanceH / l1) * i[k]!, 0);
          sum += coreCorrectionEnergyJ(e.core, im);
        }
      }
    }
    return sum;
  }

  /** Powers at the present solution: fills lastPower per element, returns the supplied power. */
  private powers(timeS: number, into: Float64Array): number {
    let supplied = 0;
    this.elements.forEach((e, k) => {
      let p = 0;
      switch (e.kind) {
        case 'resistor':
          p = (this.v(e.nodeA) - this.v(e.nodeB)) ** 2 / e.resistanceOhm;
          break;
        case 'inductor':
          p = this.branch(e.name) ** 2 * (e.resistanceOhm ?? 0);
          break;
        case 'coupled-inductors':
          for (const w of e.windings) p += this.branch(`${e.name}.${w.name}`) ** 2 * w.resistanceOhm;
          break;
        case 'voltage-source':
          // The branch current flows from + through the source to −: delivered power is −V·I.
          supplied -= waveformValue(e.waveform, timeS) * this.branch(e.name);
          break;
        case 'current-source':
          // A current source is taken as a load: its absorbed power (current from + through it to −).
          p = (this.v(e.nodePlus) - this.v(e.nodeMinus)) * waveformValue(e.waveform, timeS);
          break;
        case 'switch': {
          let closed = e.isInitiallyClosed;
          for (const ev of e.events) if (ev.timeS < timeS) closed = ev.isClosed;
          p = (this.v(e.nodeA) - this.v(e.nodeB)) ** 2 / (closed ? e.onResistanceOhm : e.offResistanceOhm);
          break;
        }
        case 'diode': {
          const internal = this.system.internalIndex.get(e.name);
          const terminalV = this.v(e.anode) - this.v(e.cathode);
          // With an internal node the junction voltage is an unknown; otherwise the series resistance is folded in.
          if (internal !== undefined)
            evaluateDiode(e.model, this.system.x[internal]! - this.v(e.cathode), this.diodeOut);
          else seriesDiodeCurrentA(e.model, terminalV, this.diodeOut);
          p = this.diodeOut.currentA * terminalV;
          break;
        }
        case 'npn': {
          // Junction currents at the internal nodes; power at the terminals, so the terminal resistances'
          // i²R counts as the transistor's.
          const [c, b, em] = [e.collector, e.base, e.emitter].map((terminal, k) => {
            const internal = this.system.internalIndex.get(npnInternalNodeName(e.name, k));
            return internal === undefined ? this.v(terminal) : this.system.x[internal]!;
          });
          evaluateNpn(e.model, b! - em!, b! - c!, this.npnOut);
          const ve = this.v(e.emitter);
          p = this.npnOut.collectorA * (this.v(e.collector) - ve) + this.npnOut.baseA * (this.v(e.base) - ve);
          break;
        }
        case 'capacitor':
          break;
      }
      into[k] = p;
    });
    return supplied;
  }

  /** Call after each accepted step (and once at the start). */
  record(timeS: number): void {
    const now = this.scratch;
    const supplied = this.powers(timeS, now);
    if (Number.isNaN(this.lastTimeS)) {
      this.storedAtStartJ = this.storedJ();
    } else {
      const dt = timeS - this.lastTimeS;
      this.supplied += 0.5 * (supplied + this.lastSupplied) * dt;
      for (let k = 0; k < now.length; k++) this.dissipated[k]! += 0.5 * (now[k]! + this.lastPower[k]!) * dt;
    }
    this.lastPower.set(now);
    this.lastSupplied = supplied;
    this.lastTimeS = timeS;
  }

  account(): EnergyAccount {
    const dissipatedJ: Record<string, number> = {};
    this.elements.forEach((e, k) => {
      if (e.kind !== 'capacitor' && e.kind !== 'voltage-source') dissipatedJ[e.name] = this.dissipated[k]!;
    });
    return { suppliedJ: this.supplied, dissipatedJ, storedChangeJ: this.storedJ() - this.storedAtStartJ };
  }
}
