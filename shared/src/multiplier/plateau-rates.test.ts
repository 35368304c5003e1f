import { lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { Topology } from '../designs/design.types';
import { createWorkspace } from './charge-transfer-model';
import type { LadderInput } from './ladder.types';
import { flatTopRates, plateauRates } from './plateau-rates';
import { buildLadderNetwork, type LadderNetwork } from './topologies';

/** Capacitor changes for unit charge injected at the nodes, each node's charge running down its column. */
function treeFlow(net: LadderNetwork, injection: number[]): number[] {
  const flow = [...injection];
  const capDelta = new Array<number>(net.capF.length).fill(0);
  for (let c = net.capF.length - 1; c >= 0; c -= 1) {
    const q = flow[net.capTop[c]!]!;
    capDelta[c] = q / net.capF[c]!;
    flow[net.capBottom[c]!] = flow[net.capBottom[c]!]! + q;
  }
  return capDelta;
}

function nodeRatesOf(net: LadderNetwork, capDelta: number[]): number[] {
  const rate = new Array<number>(net.nodeCount).fill(0);
  for (let c = 0; c < capDelta.length; c += 1) rate[net.capTop[c]!] = rate[net.capBottom[c]!]! + capDelta[c]!;
  return rate;
}

/**
 * The same flat-top rates by another route: unknown diode currents x with one equation per conducting
 * diode (its voltage holds), Σ_d x_d·ΔV_e(d) = −ΔV_e(load), each column a unit diode current run down the
 * capacitor tree, solved densely by mathjs's LU. Which diodes conduct is found by trying every subset of the
 * event's diodes, largest first, for the one the definition of the linear complementarity problem accepts:
 * every conducting diode carries forward current and no diode left out is forward-biased (Cottle, Pang &
 * Stone, The Linear Complementarity Problem, ch. 1, from memory; unique for a passive network).
 */
function referenceRates(net: LadderNetwork, loadRate: number[], event: number): number[] | null {
  const nodeLoad = nodeRatesOf(net, loadRate);
  const across = (rates: number[], e: number) => rates[net.diodeAnode[e]!]! - rates[net.diodeCathode[e]!]!;
  const candidates = net.diodeEvent.flatMap((ev, d) => (ev === event ? [d] : []));
  const unit = new Map(
    candidates.map((d) => {
      const injection = new Array<number>(net.nodeCount).fill(0);
      injection[net.diodeCathode[d]!] = 1;
      injection[net.diodeAnode[d]!] = -1;
      return [d, treeFlow(net, injection)] as const;
    }),
  );
  const unitNode = new Map([...unit].map(([d, capDelta]) => [d, nodeRatesOf(net, capDelta)] as const));
  const largestRate = Math.max(...nodeLoad.map(Math.abs));
  for (let mask = 2 ** candidates.length - 1; mask >= 0; mask -= 1) {
    const set = candidates.filter((_, j) => mask & (1 << j));
    const matrix = set.map((e) => set.map((d) => across(unitNode.get(d)!, e)));
    const rhs = set.map((e) => [-across(nodeLoad, e)]);
    const x = set.length > 0 ? (lusolve(matrix, rhs) as number[][]).map((row) => row[0]!) : [];
    if (x.some((current) => current < -1e-9)) continue;
    const capRate = loadRate.map((rate, c) => rate + set.reduce((s, d, j) => s + x[j]! * unit.get(d)![c]!, 0));
    const nodeRate = nodeRatesOf(net, capRate);
    const isForwardBiased = (d: number) => !set.includes(d) && across(nodeRate, d) > 1e-9 * largestRate;
    if (!candidates.some(isForwardBiased)) return capRate;
  }
  return null;
}

const input = {
  drive: {
    kind: 'pulse',
    forwardPeakV: 100,
    flybackPeakV: 30,
    frequencyHz: 1e4,
    dutyCycle: 0.3,
    sourceResistanceOhm: 1,
  },
  polarity: 1,
  diode: { saturationCurrentA: 1e-9, emissionCoefficient: 2, seriesResistanceOhm: 1 },
} as unknown as LadderInput;

describe('plateauRates', () => {
  const cases: [Topology, number][] = [
    ['bridge-doubler', 2],
    ...[1, 2, 3, 4, 5, 6, 9, 16].map((n): [Topology, number] => ['half-wave', n]),
    ...[1, 2, 3, 5].map((n): [Topology, number] => ['full-wave', n]),
  ];
  it.each(cases)('agrees with a dense solve of the diode currents: %s, %i cells', (topology, cells) => {
    // Unequal capacitors so that no symmetry hides a wrong index (values between 0.5 and 1.5 nF).
    const count = topology === 'full-wave' ? 3 * cells : cells;
    const capsF = Array.from({ length: count }, (_, i) => 1e-9 * (0.5 + ((i * 0.618) % 1)));
    const net = buildLadderNetwork(topology, capsF);
    const ws = createWorkspace(net, input);
    for (const event of [0, 1]) {
      const reference = referenceRates(net, ws.loadRate, event);
      const rates = plateauRates(net, ws.loadRate, event);
      // Every ladder has an answer, however many diodes drop out (none conducting included).
      expect(reference).not.toBeNull();
      expect(rates).not.toBeNull();
      if (!rates || !reference) continue;
      const scale = Math.max(1, ...reference.map(Math.abs));
      // Both are exact up to rounding: agreement to 1e-9 of the largest rate.
      rates.capRate.forEach((rate, c) => expect(Math.abs(rate - reference[c]!)).toBeLessThan(1e-9 * scale));
      const accumulated = nodeRatesOf(net, rates.capRate);
      rates.nodeRate.forEach((rate, n) => expect(Math.abs(rate - accumulated[n]!)).toBeLessThan(1e-9 * scale));
    }
  });
});

describe('flatTopRates', () => {
  const capsF = Array.from({ length: 6 }, (_, i) => 1e-9 * (0.5 + ((i * 0.618) % 1)));

  it('gives both phases’ plateau rates, or none when either phase has none', () => {
    for (const caps of [capsF, Array<number>(40).fill(4.7e-9)]) {
      const net = buildLadderNetwork('half-wave', caps);
      const ws = createWorkspace(net, input);
      const h = plateauRates(net, ws.loadRate, 0);
      const l = plateauRates(net, ws.loadRate, 1);
      const both = flatTopRates(net, ws.loadRate);
      expect(both).toEqual(h && l ? { h, l } : null);
    }
  });

  it('answers a network met before from memory and a changed capacitor afresh', () => {
    // A four-cell ladder keeps diodes conducting through both phases (both rates exist).
    const fourF = [4.7e-9, 4.7e-9, 4.7e-9, 4.7e-9];
    const net = buildLadderNetwork('half-wave', fourF);
    const ws = createWorkspace(net, input);
    const first = flatTopRates(net, ws.loadRate);
    expect(first).not.toBeNull();
    expect(flatTopRates(buildLadderNetwork('half-wave', [...fourF]), ws.loadRate)).toBe(first);
    const changed = buildLadderNetwork(
      'half-wave',
      fourF.map((f, i) => (i === 3 ? f * 2 : f)),
    );
    const again = flatTopRates(changed, createWorkspace(changed, input).loadRate);
    expect(again).not.toBeNull();
    expect(again).not.toBe(first);
    expect(again?.h.capRate).not.toEqual(first?.h.capRate);
  });

  it('answers a ladder of the same capacitor ratios from memory, scaled, as a fresh solve would', () => {
    // Rates are per ampere of load and inversely proportional to a common capacitor scale (C·dV/dt = I).
    for (const [topology, caps] of [
      ['half-wave', [4.7e-9, 4.7e-9, 4.7e-9, 4.7e-9]],
      ['half-wave', capsF],
      ['full-wave', capsF],
      ['half-wave', Array<number>(12).fill(2.2e-9)],
    ] as const) {
      const net = buildLadderNetwork(topology, caps);
      flatTopRates(net, createWorkspace(net, input).loadRate);
      for (const factor of [1 + 3e-9, 0.37, 2.9]) {
        const edited = buildLadderNetwork(
          topology,
          caps.map((f) => f * factor),
        );
        const loadRate = createWorkspace(edited, input).loadRate;
        const remembered = flatTopRates(edited, loadRate);
        const l = plateauRates(edited, loadRate, 1);
        const h = l ? plateauRates(edited, loadRate, 0) : null;
        expect(remembered === null).toBe(h === null);
        if (!remembered || !h || !l) continue;
        for (const [got, fresh] of [
          [remembered.h, h],
          [remembered.l, l],
        ] as const) {
          // To 1e-12 of the largest rate (a phase whose diodes all carry nothing has its diode part at rounding).
          const largest = Math.max(...fresh.capRate.map(Math.abs));
          for (const key of ['capRate', 'nodeRate', 'diodeCapDelta'] as const) {
            got[key].forEach((v, i) => expect(Math.abs(v - fresh[key][i]!)).toBeLessThanOrEqual(1e-12 * largest));
          }
        }
      }
    }
  });
});
