import type { Circuit, DiodeModel, NpnModel, SourceWaveform } from './circuit.types';
import { inductanceMatrix } from './devices/coupled-inductors';
import { coreFluxCorrectionSpice } from './devices/saturable-core';

export interface SpiceExportOptions {
  /** Adds `.tran` with this step and stop time (and `uic` when starting from element initial conditions). */
  transient?: { stopTimeS: number; maxStepS: number; startFrom?: 'element-initial-conditions' | 'operating-point' };
  /** Extra lines placed before `.end`, e.g. `.options` or a `.control` block. */
  extraLines?: ReadonlyArray<string>;
}

/** Number in SPICE notation with 12 significant digits (no unit suffixes, so no 'M'/'MEG' ambiguity). */
export function spiceNumber(value: number): string {
  if (value === 0) return '0';
  return Number(value.toPrecision(12)).toExponential().replace('e+', 'e');
}

const safe = (name: string): string => name.replace(/[^A-Za-z0-9_]/g, '_');
const node = (name: string): string => (name === '0' ? '0' : safe(name));
/** Element name with its SPICE type letter, not doubled when the name already starts with it. */
const element = (letter: string, name: string): string =>
  safe(name).toUpperCase().startsWith(letter) ? safe(name) : `${letter}${safe(name)}`;

function waveformText(w: SourceWaveform): string {
  const n = spiceNumber;
  switch (w.kind) {
    case 'dc':
      return `DC ${n(w.value)}`;
    case 'sine':
      return `SIN(${n(w.offset)} ${n(w.amplitude)} ${n(w.frequencyHz)} ${n(w.delayS ?? 0)} 0 ${n(w.phaseDeg ?? 0)})`;
    case 'pulse':
      return `PULSE(${n(w.initial)} ${n(w.pulsed)} ${n(w.delayS)} ${n(w.riseS)} ${n(w.fallS)} ${n(w.widthS)} ${n(w.periodS)})`;
    case 'pwl':
      return `PWL(${w.points.map((p) => `${n(p.timeS)} ${n(p.value)}`).join(' ')})`;
  }
}

/** The SPICE .model parameter of each DiodeModel field (Berkeley SPICE D model). */
export const DIODE_SPICE_PARAMETERS = {
  saturationCurrentA: 'IS',
  emissionCoefficient: 'N',
  seriesResistanceOhm: 'RS',
  breakdownVoltageV: 'BV',
  breakdownCurrentA: 'IBV',
  junctionCapacitanceF: 'CJO',
  junctionPotentialV: 'VJ',
  gradingCoefficient: 'M',
  transitTimeS: 'TT',
} as const satisfies Record<keyof DiodeModel, string>;

/** The SPICE .model parameter of each NpnModel field (Berkeley SPICE Gummel–Poon NPN model). */
export const NPN_SPICE_PARAMETERS = {
  saturationCurrentA: 'IS',
  forwardBeta: 'BF',
  reverseBeta: 'BR',
  baseEmitterCapacitanceF: 'CJE',
  baseEmitterPotentialV: 'VJE',
  baseEmitterGrading: 'MJE',
  baseCollectorCapacitanceF: 'CJC',
  baseCollectorPotentialV: 'VJC',
  baseCollectorGrading: 'MJC',
  earlyVoltageV: 'VAF',
  forwardTransitTimeS: 'TF',
  reverseTransitTimeS: 'TR',
  baseResistanceOhm: 'RB',
  collectorResistanceOhm: 'RC',
  emitterResistanceOhm: 'RE',
} as const satisfies Record<keyof NpnModel, string>;

/** Parameters every .model card states, even at zero (RS = 0); any other is left out at zero, SPICE's default. */
const REQUIRED_PARAMETERS = new Set(['IS', 'N', 'RS', 'BF', 'BR']);

/**
 * Parameters of a .model card: every field the model gives, under its SPICE name, in the table's order, and
 * the fields a present one needs (`companions`: VJ and M beside CJO, IBV beside BV) at their defaults.
 */
function modelParameters<M extends object>(
  m: M,
  names: Record<keyof M, string>,
  companions: ReadonlyArray<{ when: keyof M; then: ReadonlyArray<[keyof M, number]> }>,
): string {
  const value = (key: keyof M): number | undefined => {
    const v = m[key];
    return typeof v === 'number' && (v !== 0 || REQUIRED_PARAMETERS.has(names[key])) ? v : undefined;
  };
  const fallback = new Map<keyof M, number>();
  for (const { when, then } of companions) if (value(when) !== undefined) for (const [k, v] of then) fallback.set(k, v);
  const parts: string[] = [];
  for (const key of Object.keys(names) as Array<keyof M>) {
    const v = value(key) ?? fallback.get(key);
    if (v !== undefined) parts.push(`${names[key]}=${spiceNumber(v)}`);
  }
  return parts.join(' ');
}

function diodeModelText(name: string, m: DiodeModel): string {
  const parameters = modelParameters(m, DIODE_SPICE_PARAMETERS, [
    { when: 'breakdownVoltageV', then: [['breakdownCurrentA', 1e-3]] },
    {
      when: 'junctionCapacitanceF',
      then: [
        ['junctionPotentialV', 1],
        ['gradingCoefficient', 0.5],
      ],
    },
  ]);
  return `.model ${name} D(${parameters})`;
}

function npnModelText(name: string, m: NpnModel): string {
  const parameters = modelParameters(m, NPN_SPICE_PARAMETERS, [
    {
      when: 'baseEmitterCapacitanceF',
      then: [
        ['baseEmitterPotentialV', 0.75],
        ['baseEmitterGrading', 0.33],
      ],
    },
    {
      when: 'baseCollectorCapacitanceF',
      then: [
        ['baseCollectorPotentialV', 0.75],
        ['baseCollectorGrading', 0.33],
      ],
    },
  ]);
  return `.model ${name} NPN(${parameters})`;
}

/**
 * SPICE netlist (.cir text) of a Circuit, in the common Berkeley SPICE syntax: R, C (with IC=), L (IC=),
 * K for each winding pair, V and I with DC/SIN/PULSE/PWL, a time-controlled switch as an S element driven
 * by a PWL control source, D and Q with one .model per element. Winding and inductor resistances become
 * series resistors on an internal node. Node names keep letters, digits and '_' only.
 */
export function toSpiceNetlist(circuit: Circuit, options: SpiceExportOptions = {}): string {
  const n = spiceNumber;
  const lines: string[] = [`* ${circuit.title}`];
  const models: string[] = [];
  for (const e of circuit.elements) {
    const id = safe(e.name);
    switch (e.kind) {
      case 'resistor':
        lines.push(`${element('R', e.name)} ${node(e.nodeA)} ${node(e.nodeB)} ${n(e.resistanceOhm)}`);
        break;
      case 'capacitor':
        lines.push(
          `${element('C', e.name)} ${node(e.nodeA)} ${node(e.nodeB)} ${n(e.capacitanceF)} IC=${n(e.initialVoltageV ?? 0)}`,
        );
        break;
      case 'inductor': {
        const r = e.resistanceOhm ?? 0;
        const mid = r > 0 ? `${id}_r` : node(e.nodeB);
        lines.push(
          `${element('L', e.name)} ${node(e.nodeA)} ${mid} ${n(e.inductanceH)} IC=${n(e.initialCurrentA ?? 0)}`,
        );
        if (r > 0) lines.push(`RL${id} ${mid} ${node(e.nodeB)} ${n(r)}`);
        break;
      }
      case 'coupled-inductors': {
        const names = e.windings.map((w) => `L${id}_${safe(w.name)}`);
        const core = e.core;
        const l1 = e.windings[0]!.inductanceH;
        const turns = e.windings.map((w) => Math.sqrt(w.inductanceH / l1));
        e.windings.forEach((w, i) => {
          const wid = `${id}_${safe(w.name)}`;
          let at = w.resistanceOhm > 0 || core ? `${wid}_r` : node(w.nodeB);
          lines.push(`${names[i]} ${node(w.nodeA)} ${at} ${n(w.inductanceH)} IC=${n(w.initialCurrentA ?? 0)}`);
          if (core) {
            // The core's nonlinear flux n_i·Φc(i_m): a behavioural source n_i·dΦc/dt in series, and a 0 V
            // source that senses the winding current for i_m (see the flux node below).
            const next = w.resistanceOhm > 0 ? `${wid}_s` : node(w.nodeB);
            lines.push(`B${wid}_core ${at} ${wid}_c V=${n(turns[i]!)}*V(${id}_phi)`);
            lines.push(`V${wid}_sense ${wid}_c ${next} DC 0`);
            at = next;
          }
          if (w.resistanceOhm > 0) lines.push(`RW${wid} ${at} ${node(w.nodeB)} ${n(w.resistanceOhm)}`);
        });
        const m = inductanceMatrix(e, e.name);
        const count = names.length;
        for (let i = 0; i < count; i++) {
          for (let j = i + 1; j < count; j++) {
            const k = m[i * count + j]! / Math.sqrt(e.windings[i]!.inductanceH * e.windings[j]!.inductanceH);
            lines.push(`K${id}_${i}_${j} ${names[i]} ${names[j]} ${n(k)}`);
          }
        }
        if (core) {
          // Flux formulation: a behavioural current Φc(i_m) through a 1 H inductor, whose voltage is dΦc/dt.
          const im = e.windings.map((w, i) => `${n(turns[i]!)}*i(V${id}_${safe(w.name)}_sense)`).join('+');
          lines.push(`B${id}_phi 0 ${id}_phi I=${coreFluxCorrectionSpice(core, im, n)}`);
          lines.push(`L${id}_phi ${id}_phi 0 1 IC=0`);
        }
        break;
      }
      case 'voltage-source':
        lines.push(`${element('V', e.name)} ${node(e.nodePlus)} ${node(e.nodeMinus)} ${waveformText(e.waveform)}`);
        break;
      case 'current-source':
        lines.push(`${element('I', e.name)} ${node(e.nodePlus)} ${node(e.nodeMinus)} ${waveformText(e.waveform)}`);
        break;
      case 'switch': {
        // The control source goes from 0 V (open) to 1 V (closed) over a nanosecond after each event.
        const points: string[] = [`0 ${e.isInitiallyClosed ? 1 : 0}`];
        let closed = e.isInitiallyClosed;
        for (const ev of [...e.events].sort((a, b) => a.timeS - b.timeS)) {
          points.push(`${n(ev.timeS)} ${closed ? 1 : 0}`, `${n(ev.timeS + 1e-9)} ${ev.isClosed ? 1 : 0}`);
          closed = ev.isClosed;
        }
        lines.push(`VS${id} ${id}_ctl 0 PWL(${points.join(' ')})`);
        lines.push(`S${id} ${node(e.nodeA)} ${node(e.nodeB)} ${id}_ctl 0 SW_${id}`);
        models.push(`.model SW_${id} SW(VT=0.5 VH=0 RON=${n(e.onResistanceOhm)} ROFF=${n(e.offResistanceOhm)})`);
        break;
      }
      case 'diode':
        lines.push(`${element('D', e.name)} ${node(e.anode)} ${node(e.cathode)} DM_${id}`);
        models.push(diodeModelText(`DM_${id}`, e.model));
        break;
      case 'npn':
        lines.push(`${element('Q', e.name)} ${node(e.collector)} ${node(e.base)} ${node(e.emitter)} QM_${id}`);
        models.push(npnModelText(`QM_${id}`, e.model));
        break;
    }
  }
  lines.push(...models);
  const tran = options.transient;
  if (tran) {
    const uic = (tran.startFrom ?? 'element-initial-conditions') === 'element-initial-conditions' ? ' uic' : '';
    lines.push(`.tran ${n(tran.maxStepS)} ${n(tran.stopTimeS)} 0 ${n(tran.maxStepS)}${uic}`);
  }
  lines.push(...(options.extraLines ?? []), '.end', '');
  return lines.join('\n');
}

/** The netlist name of a circuit node, as toSpiceNetlist writes it. */
export function spiceNodeName(name: string): string {
  return node(name);
}
