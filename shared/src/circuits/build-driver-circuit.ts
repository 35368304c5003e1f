import { DomainError } from '../errors';
import { buildLadderCircuit, type LadderCircuitSpec } from './build-ladder-circuit';
import type { Circuit, CircuitElement } from '../sim/circuit.types';
import { diodeModelOf, npnModelOf } from './device-models';
import { supplyThevenin } from '../driver/battery';
import { rcdClampPartsOf } from '../driver/rcd-clamp';
import type { DriverStage } from '../designs/driver-stage.types';

/** Node names of the driver circuit a caller probes. */
export const DRIVER_NODES = { supply: 'vcc', collector: 'col', base: 'base', secondary: 's' } as const;

/**
 * Inductance of the saturated core as a fraction of the primary inductance: about the air-core value, 1/μe
 * of a gapped ferrite core of effective permeability 100 or more (common practice, no source).
 */
export const SATURATED_INDUCTANCE_FRACTION = 0.01;

/** Supply bypass capacitor when the design gives none: 100 µF across the cells (common practice, no source). */
export const DEFAULT_SUPPLY_BYPASS_F = 100e-6;
/** Collector stray capacitance when the design gives none: 100 pF, winding and wiring (common practice, no source). */
export const DEFAULT_COLLECTOR_STRAY_F = 100e-12;

/** The Shockley part of a clamp's diode or zener: a small silicon junction with 0.5 Ω (common practice, no source). */
const CLAMP_DIODE = { saturationCurrentA: 1e-12, emissionCoefficient: 1, seriesResistanceOhm: 0.5 };

/** Name of the supply source, for 'I(Vbat)' probes. */
export const DRIVER_SUPPLY_SOURCE = 'Vbat';

export interface DriverCircuitOptions {
  /** Ladder fed by the secondary (half-wave only); its drive is replaced by the secondary winding. */
  ladder?: Omit<LadderCircuitSpec, 'drive'>;
  /** Rise time of the push-button switch-on (s). Default 1 µs. */
  switchOnRiseS?: number;
  /** Resistance across an otherwise open secondary (Ω), so the node has a DC path. Default 100 MΩ. */
  openSecondaryOhm?: number;
  /** State of charge of a cells supply. Default 1. */
  chargeFraction?: number;
}

/**
 * Circuit of the blocking oscillator, its three-winding transformer and (optionally) a half-wave ladder:
 * supply (Thevenin of the cells or DC source) switched on at t = 0, bypass capacitor, primary from the
 * supply to the collector, feedback winding from the supply through R_B to the base (self-starting),
 * secondary from ground to node 's' with its dot at ground (flyback-fed, the default) or at 's'
 * (forward-fed), collector stray capacitance and RC snubber to ground. Zener clamp from the collector to
 * ground, or RCD clamp to the supply. Each element is a field of the design (defaults named above).
 */
export function buildDriverCircuit(driver: DriverStage, options: DriverCircuitOptions = {}): Circuit {
  const { transformer: tx, transistor: q } = driver;
  const { openCircuitV, resistanceOhm } = supplyThevenin(driver.supply, options.chargeFraction ?? 1);
  const n = DRIVER_NODES;
  const el: CircuitElement[] = [];
  const riseS = options.switchOnRiseS ?? 1e-6;
  el.push({
    kind: 'voltage-source',
    name: DRIVER_SUPPLY_SOURCE,
    nodePlus: 'emf',
    nodeMinus: '0',
    waveform: {
      kind: 'pwl',
      points: [
        { timeS: 0, value: 0 },
        { timeS: riseS, value: openCircuitV },
      ],
    },
  });
  el.push({
    kind: 'resistor',
    name: 'Rsrc',
    nodeA: 'emf',
    nodeB: n.supply,
    resistanceOhm: Math.max(resistanceOhm, 1e-3),
  });
  const bypassF = driver.supplyBypassCapacitanceF ?? DEFAULT_SUPPLY_BYPASS_F;
  if (bypassF > 0) el.push({ kind: 'capacitor', name: 'Cbyp', nodeA: n.supply, nodeB: '0', capacitanceF: bypassF });
  const collectorEnd = driver.collectorResistorOhm ? 'pcol' : n.collector;
  if (driver.collectorResistorOhm)
    el.push({
      kind: 'resistor',
      name: 'Rcol',
      nodeA: 'pcol',
      nodeB: n.collector,
      resistanceOhm: driver.collectorResistorOhm,
    });
  const isFlybackFed = (tx.secondaryPhasing ?? 'flyback') === 'flyback';
  const pairs = tx.windingCouplings ?? {};
  const couplings = [
    { windingA: 'Lp', windingB: 'Lfb', coefficient: pairs.primaryFeedback },
    { windingA: 'Lp', windingB: 'Ls', coefficient: pairs.primarySecondary },
    { windingA: 'Lfb', windingB: 'Ls', coefficient: pairs.feedbackSecondary },
  ].flatMap((c) => (c.coefficient === undefined ? [] : [{ ...c, coefficient: c.coefficient }]));
  const ratioFb = tx.feedbackTurns / tx.primaryTurns;
  const ratioSec = tx.secondaryTurns / tx.primaryTurns;
  el.push({
    kind: 'coupled-inductors',
    name: 'T1',
    couplingCoefficient: tx.couplingCoefficient,
    ...(couplings.length > 0 ? { couplings } : {}),
    // The core saturates at the transformer's saturation current (primary current, the smooth-knee law of
    // sim/devices/saturable-core.ts); its magnetizing inductance is the linear model's k·Lp.
    core: {
      magnetizingInductanceH: tx.couplingCoefficient * tx.primaryInductanceH,
      saturationCurrentA: tx.saturationCurrentA,
      saturatedInductanceH: tx.saturatedInductanceH ?? SATURATED_INDUCTANCE_FRACTION * tx.primaryInductanceH,
    },
    windings: [
      {
        name: 'Lp',
        nodeA: n.supply,
        nodeB: collectorEnd,
        inductanceH: tx.primaryInductanceH,
        resistanceOhm: tx.primaryResistanceOhm,
      },
      {
        name: 'Lfb',
        nodeA: 'fb',
        nodeB: n.supply,
        inductanceH: tx.primaryInductanceH * ratioFb ** 2,
        resistanceOhm: tx.feedbackResistanceOhm,
      },
      // Flyback phasing: the dot at ground, so node 's' swings positive while the primary's flux collapses.
      {
        name: 'Ls',
        nodeA: isFlybackFed ? '0' : n.secondary,
        nodeB: isFlybackFed ? n.secondary : '0',
        inductanceH: tx.primaryInductanceH * ratioSec ** 2,
        resistanceOhm: tx.secondaryResistanceOhm,
      },
    ],
  });
  if (tx.secondaryCapacitanceF)
    el.push({
      kind: 'capacitor',
      name: 'Cself',
      nodeA: n.secondary,
      nodeB: '0',
      capacitanceF: tx.secondaryCapacitanceF,
    });
  el.push({ kind: 'resistor', name: 'Rb', nodeA: 'fb', nodeB: n.base, resistanceOhm: driver.baseResistorOhm });
  el.push({ kind: 'npn', name: 'Q1', collector: n.collector, base: n.base, emitter: '0', model: npnModelOf(q) });
  const strayF = driver.collectorStrayCapacitanceF ?? DEFAULT_COLLECTOR_STRAY_F;
  if (strayF > 0) el.push({ kind: 'capacitor', name: 'Ccol', nodeA: n.collector, nodeB: '0', capacitanceF: strayF });
  if (driver.snubber) {
    el.push({
      kind: 'capacitor',
      name: 'Csn',
      nodeA: n.collector,
      nodeB: 'snb',
      capacitanceF: driver.snubber.capacitorF,
    });
    el.push({ kind: 'resistor', name: 'Rsn', nodeA: 'snb', nodeB: '0', resistanceOhm: driver.snubber.resistorOhm });
  }
  const clamp = driver.clamp;
  if (clamp?.kind === 'zener') {
    el.push({
      kind: 'diode',
      name: 'Dz',
      anode: '0',
      cathode: n.collector,
      model: diodeModelOf(CLAMP_DIODE, { ...clamp, breakdownVoltageV: clamp.clampVoltageV }),
    });
  } else if (clamp?.kind === 'rcd') {
    const rcd = rcdClampPartsOf(clamp);
    el.push({
      kind: 'diode',
      name: 'Dc',
      anode: n.collector,
      cathode: 'clp',
      model: diodeModelOf(CLAMP_DIODE, clamp),
    });
    el.push({
      kind: 'capacitor',
      name: 'Cclp',
      nodeA: 'clp',
      nodeB: n.supply,
      capacitanceF: rcd.capacitorF,
    });
    el.push({
      kind: 'resistor',
      name: 'Rclp',
      nodeA: 'clp',
      nodeB: n.supply,
      resistanceOhm: rcd.resistorOhm,
    });
  }
  if (driver.indicatorLamp) {
    el.push({
      kind: 'current-source',
      name: 'Ilamp',
      nodePlus: n.supply,
      nodeMinus: '0',
      waveform: { kind: 'dc', value: driver.indicatorLamp.currentA },
    });
  }
  if (!options.ladder) {
    el.push({
      kind: 'resistor',
      name: 'Rsec',
      nodeA: n.secondary,
      nodeB: '0',
      resistanceOhm: options.openSecondaryOhm ?? 100e6,
    });
    return { title: 'blocking oscillator driver', elements: el };
  }
  if (options.ladder.topology !== 'half-wave') {
    throw new DomainError('invalid_argument', 'the driver circuit feeds half-wave ladders only', 'multiplier.topology');
  }
  // The ladder builder drives node 's' from a source 'Vsrc' when the source resistance is zero: replace
  // that source by the secondary winding.
  const ladder = buildLadderCircuit({
    ...options.ladder,
    drive: { kind: 'pulse', forwardPeakV: 1, flybackPeakV: 1, frequencyHz: 1, dutyCycle: 0.5, sourceResistanceOhm: 0 },
  });
  const source = ladder.elements.find((e) => e.kind === 'voltage-source' && e.name === 'Vsrc');
  if (!source || source.kind !== 'voltage-source' || source.nodePlus !== n.secondary || source.nodeMinus !== '0') {
    throw new DomainError('invalid_argument', 'unexpected ladder drive layout');
  }
  return {
    title: `blocking oscillator driver with ${ladder.title}`,
    elements: [...el, ...ladder.elements.filter((e) => e !== source)],
  };
}
