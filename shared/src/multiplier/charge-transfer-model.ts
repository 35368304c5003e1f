import { driveTiming, type DriveTiming } from './drive-timing';
import { flatTopRates } from './plateau-rates';
import { EVENT_H } from './topologies';

/** The H event as a module constant: read in every solve's inner loops (no binding lookup per read). */
const H = EVENT_H;
import type { LadderNetwork } from './topologies';
import type { LadderInput } from './ladder.types';

/*
 * The charge-transfer (switched-capacitor) model of a ladder in periodic steady state: the work arrays of
 * one network and the one-pass solve up the ladder. The method is described in STEADY_STATE_METHOD.
 */

const boltzmannJPerK = 1.380649e-23;
const elementaryChargeC = 1.602176634e-19;

function zeros(length: number): number[] {
  return new Array<number>(length).fill(0);
}

/** Work arrays reused between solves of the same network (no allocation in the inner solve). */
export interface Workspace {
  net: LadderNetwork;
  timing: DriveTiming;
  deltaH: number[];
  deltaL: number[];
  chargeH: number[];
  chargeL: number[];
  loadRate: number[];
  /** Capacitor voltage change over the H→L swing per volt of drive peak-to-peak, from the node strays. */
  strayDelta: number[];
  nodeLoadRate: number[];
  /** Capacitor and node rates per ampere of load during the H and L phases (diodes held conducting on flat-top drives). */
  rateH: number[];
  rateL: number[];
  nodeRateH: number[];
  nodeRateL: number[];
  /** Capacitor change per A·s of L phase carried by the L diodes during the phase instead of at the event. */
  deltaLPlateau: number[];
  flow: number[];
  injection: number[];
  stateA: number[];
  stateB: number[];
  nodeA: number[];
  nodeB: number[];
  harmonicMeanF: number;
  thermalV: number;
  diode: LadderInput['diode'];
}

/** Charge flowing down each capacitor for injections at the nodes (each node is the top of one capacitor). */
function accumulateFlow(net: LadderNetwork, injection: number[], flow: number[], capDelta: number[]): void {
  const m = net.capF.length;
  // `flow` indexed by node: charge that node passes down to the capacitor below it.
  for (let n = 0; n < flow.length; n += 1) flow[n] = injection[n] ?? 0;
  for (let c = m - 1; c >= 0; c -= 1) {
    const top = net.capTop[c] as number;
    const bottom = net.capBottom[c] as number;
    const q = flow[top] as number;
    capDelta[c] = q / (net.capF[c] as number);
    flow[bottom] = (flow[bottom] as number) + q;
  }
}

export function createWorkspace(net: LadderNetwork, input: LadderInput): Workspace {
  const m = net.capF.length;
  const nodes = net.nodeCount;
  const timing = driveTiming(input.drive, input.polarity);
  const ws: Workspace = {
    net,
    timing,
    deltaH: zeros(m),
    deltaL: zeros(m),
    chargeH: zeros(net.anchorScale.length),
    chargeL: zeros(net.anchorScale.length),
    loadRate: zeros(m),
    strayDelta: zeros(m),
    nodeLoadRate: zeros(nodes),
    rateH: [],
    rateL: [],
    nodeRateH: [],
    nodeRateL: [],
    deltaLPlateau: zeros(m),
    flow: zeros(nodes),
    injection: zeros(nodes),
    stateA: zeros(m),
    stateB: zeros(m),
    nodeA: zeros(nodes),
    nodeB: zeros(nodes),
    harmonicMeanF: 0,
    thermalV: (boltzmannJPerK * (input.temperatureK ?? 300)) / elementaryChargeC,
    diode: input.diode,
  };
  fillCapacitorFigures(ws, input.strayCapacitanceF ?? 0);
  return ws;
}

/**
 * The same workspace for new values of its network's capacitors (as many as before), written in place: the
 * stage scan's networks as a design's capacitors are edited. Every figure that depends on the values is
 * recomputed exactly as `createWorkspace` computes it; the drive timing, diode, strays and temperature stay
 * (the caller keeps them the same or sets them). The values must be positive and finite (checked where the
 * ladder was first prepared).
 */
export function refreshCapacitors(ws: Workspace, capacitorsF: readonly number[], strayCapacitanceF: number): void {
  const capF = ws.net.capF;
  for (let c = 0; c < capF.length; c += 1) capF[c] = capacitorsF[c] as number;
  fillCapacitorFigures(ws, strayCapacitanceF);
}

/** Everything in a workspace that depends on the capacitor values (see Workspace), from `ws.net.capF`. */
function fillCapacitorFigures(ws: Workspace, strayF: number): void {
  const { net, timing } = ws;
  const m = net.capF.length;
  const nodes = net.nodeCount;
  let inverseSum = 0;
  for (let c = 0; c < m; c += 1) inverseSum += 1 / (net.capF[c] as number);
  ws.harmonicMeanF = m / inverseSum;
  // Capacitor voltage change per coulomb of ladder charge at each event, and the charge through each anchor.
  for (const [event, delta, charge] of [
    [0, ws.deltaH, ws.chargeH],
    [1, ws.deltaL, ws.chargeL],
  ] as const) {
    ws.injection.fill(0);
    for (let d = 0; d < net.diodeShare.length; d += 1) {
      if (net.diodeEvent[d] !== event) continue;
      const share = net.diodeShare[d] as number;
      const cathode = net.diodeCathode[d] as number;
      const anode = net.diodeAnode[d] as number;
      ws.injection[cathode] = (ws.injection[cathode] as number) + share;
      ws.injection[anode] = (ws.injection[anode] as number) - share;
    }
    accumulateFlow(net, ws.injection, ws.flow, delta);
    for (let a = 0; a < charge.length; a += 1) charge[a] = Math.abs(ws.flow[a] as number);
  }
  // Strays: over H→L a node standing on a driven anchor of scale s moves by −s·Vpp, so its stray returns
  // +Cs·s per volt of Vpp into the node (Everhart & Lorrain, Rev. Sci. Instrum. 24, 221 (1953), abstract read).
  if (strayF > 0) {
    ws.injection.fill(0);
    for (let n = net.anchorScale.length; n < nodes; n += 1)
      ws.injection[n] = strayF * (net.anchorScale[net.nodeRoot[n] as number] as number);
    accumulateFlow(net, ws.injection, ws.flow, ws.strayDelta);
  }
  // Load: one ampere out of the output node into the return node.
  ws.injection.fill(0);
  ws.injection[net.outNode] = -1;
  ws.injection[net.returnNode] = (ws.injection[net.returnNode] as number) + 1;
  accumulateFlow(net, ws.injection, ws.flow, ws.loadRate);
  ws.nodeLoadRate.fill(0);
  for (let c = 0; c < m; c += 1) {
    ws.nodeLoadRate[net.capTop[c] as number] =
      (ws.nodeLoadRate[net.capBottom[c] as number] as number) + (ws.loadRate[c] as number);
  }
  ws.rateH = ws.loadRate;
  ws.rateL = ws.loadRate;
  ws.nodeRateH = ws.nodeLoadRate;
  ws.nodeRateL = ws.nodeLoadRate;
  // The flat-top rates are shared with flatTopRates's memory: referenced, never written.
  const rates = timing.isSine ? null : flatTopRates(net, ws.loadRate);
  if (rates) {
    const { h, l } = rates;
    ws.rateH = h.capRate;
    ws.nodeRateH = h.nodeRate;
    ws.rateL = l.capRate;
    ws.nodeRateL = l.nodeRate;
    ws.deltaLPlateau = l.diodeCapDelta;
  } else if (ws.deltaLPlateau.some((delta) => delta !== 0)) {
    // Instantaneous transfer: none carried through the phase (a refreshed workspace may hold the last values' deltas).
    ws.deltaLPlateau = zeros(m);
  }
}

/** x^(2/3) for x ≥ 0 as ∛(x²): the same to a rounding, and several times faster than a general power in V8. */
function cubeRootOfSquare(x: number): number {
  return Math.cbrt(x * x);
}

/** One event's source loss (as the share of the peak left) and diode drop at a ladder current. */
export interface EventLoss {
  lossScale: number;
  forwardDropV: number;
  conductionCurrentA: number;
}

/** Per-event source loss and diode drop at a ladder current, from conduction time and charge (into `out`, no allocation). */
export function eventLosses(ws: Workspace, currentA: number, event: 0 | 1, out: EventLoss): EventLoss {
  const t = ws.timing;
  const q = currentA * t.periodS;
  const isH = event === H;
  const peakV = isH ? t.highV : t.lowV;
  const phaseS = isH ? t.afterHS : t.afterLS;
  const charges = isH ? ws.chargeH : ws.chargeL;
  let sourceCharge = 0;
  for (let a = 1; a < charges.length; a += 1) sourceCharge = Math.max(sourceCharge, (charges[a] as number) * q);
  let lossV: number;
  let conductionS: number;
  const r = t.sourceResistanceOhm;
  if (t.isSine) {
    const omega = 2 * Math.PI * t.frequencyHz;
    lossV =
      r > 0 && q > 0
        ? Math.min(peakV, cubeRootOfSquare((3 * sourceCharge * omega * r * Math.sqrt(peakV)) / (4 * Math.SQRT2)))
        : 0;
    const swingV = lossV + ((ws.net.diodeShare[0] as number) * q) / ws.harmonicMeanF;
    const angle = Math.min(Math.PI / 2, Math.sqrt((2 * swingV) / Math.max(peakV, 1e-30)));
    conductionS = Math.max((2 * angle) / omega, 1e-12);
  } else {
    lossV = Math.min(peakV, (sourceCharge * r) / phaseS);
    conductionS = phaseS;
  }
  const diodeCharge = (ws.net.diodeShare[0] as number) * q;
  const conductionCurrentA = diodeCharge / conductionS;
  const d = ws.diode;
  const forwardDropV =
    d.emissionCoefficient * ws.thermalV * Math.log1p(conductionCurrentA / d.saturationCurrentA) +
    conductionCurrentA * d.seriesResistanceOhm;
  out.lossScale = peakV > 0 ? (peakV - lossV) / peakV : 0;
  out.forwardDropV = forwardDropV;
  out.conductionCurrentA = conductionCurrentA;
  return out;
}

const lossAtH: EventLoss = { lossScale: 0, forwardDropV: 0, conductionCurrentA: 0 };
const lossAtL: EventLoss = { lossScale: 0, forwardDropV: 0, conductionCurrentA: 0 };

export interface SolvedCycle {
  /** Ladder-top output just after H, and just after L. */
  afterHV: number;
  afterLV: number;
  meanV: number;
  minV: number;
  maxV: number;
  forwardDropHV: number;
  forwardDropLV: number;
  conductionHA: number;
  conductionLA: number;
}

/** One steady-state solve at ladder current `currentA` (fills ws.stateA/stateB and the node voltages). */
export function solveCycle(ws: Workspace, currentA: number): SolvedCycle {
  const { net, timing } = ws;
  const lossH = eventLosses(ws, currentA, 0, lossAtH);
  const lossL = eventLosses(ws, currentA, 1, lossAtL);
  const q = currentA * timing.periodS;
  const anchors = net.anchorScale.length;
  for (let a = 0; a < anchors; a += 1) {
    const scale = net.anchorScale[a] as number;
    ws.nodeA[a] = scale * timing.highV * lossH.lossScale;
    ws.nodeB[a] = -scale * timing.lowV * lossL.lossScale;
  }
  const m = net.capF.length;
  // The arrays and per-solve factors in locals: this loop is the engine's innermost.
  const { capDiode, capTop, capBottom, diodeAnode, diodeCathode, diodeEvent } = net;
  const { rateH, deltaL, deltaLPlateau, strayDelta, nodeA, nodeB, stateA, stateB } = ws;
  const fallPerRateH = currentA * timing.afterHS;
  const plateauPerDeltaL = currentA * timing.afterLS;
  const swingV = timing.highV + timing.lowV;
  const dropH = lossH.forwardDropV;
  const dropL = lossL.forwardDropV;
  for (let c = 0; c < m; c += 1) {
    const d = capDiode[c] as number;
    const top = capTop[c] as number;
    const bottom = capBottom[c] as number;
    const anode = diodeAnode[d] as number;
    const cathode = diodeCathode[d] as number;
    // b − a over the H→L interval: load discharge plus the L charge transfer.
    const delta =
      fallPerRateH * (rateH[c] as number) +
      q * (deltaL[c] as number) -
      plateauPerDeltaL * (deltaLPlateau[c] as number) +
      swingV * (strayDelta[c] as number);
    let a: number;
    let b: number;
    if (diodeEvent[d] === H) {
      const topV = top === cathode ? (nodeA[anode] as number) - dropH : (nodeA[cathode] as number) + dropH;
      a = topV - (nodeA[bottom] as number);
      b = a + delta;
    } else {
      const topV = top === cathode ? (nodeB[anode] as number) - dropL : (nodeB[cathode] as number) + dropL;
      b = topV - (nodeB[bottom] as number);
      a = b - delta;
    }
    stateA[c] = a;
    stateB[c] = b;
    nodeA[top] = (nodeA[bottom] as number) + a;
    nodeB[top] = (nodeB[bottom] as number) + b;
  }
  const afterHV = (ws.nodeA[net.outNode] as number) - (ws.nodeA[net.returnNode] as number);
  const afterLV = (ws.nodeB[net.outNode] as number) - (ws.nodeB[net.returnNode] as number);
  const slopeH = (ws.nodeRateH[net.outNode] as number) - (ws.nodeRateH[net.returnNode] as number);
  const slopeL = (ws.nodeRateL[net.outNode] as number) - (ws.nodeRateL[net.returnNode] as number);
  const fallH = currentA * timing.afterHS * slopeH;
  const fallL = currentA * timing.afterLS * slopeL;
  const meanV = (timing.afterHS * (afterHV + fallH / 2) + timing.afterLS * (afterLV + fallL / 2)) / timing.periodS;
  return {
    afterHV,
    afterLV,
    meanV,
    minV: Math.min(afterHV + fallH, afterLV + fallL),
    maxV: Math.max(afterHV, afterLV),
    forwardDropHV: lossH.forwardDropV,
    forwardDropLV: lossL.forwardDropV,
    conductionHA: lossH.conductionCurrentA,
    conductionLA: lossL.conductionCurrentA,
  };
}

/** Conductance and constant current the output network draws from the ladder top. */
export function outputLoad(input: LadderInput): { conductanceS: number; constantA: number; seriesOhm: number } {
  const bleederS = input.bleederOhm ? 1 / input.bleederOhm : 0;
  const load = input.load;
  if (!load) return { conductanceS: bleederS, constantA: 0, seriesOhm: input.seriesOutputResistanceOhm };
  if (load.kind === 'current')
    return { conductanceS: bleederS, constantA: load.currentA, seriesOhm: input.seriesOutputResistanceOhm };
  return {
    conductanceS: bleederS + 1 / (load.resistanceOhm + input.seriesOutputResistanceOhm),
    constantA: 0,
    seriesOhm: input.seriesOutputResistanceOhm,
  };
}

/** A nearby operating point's ladder current (A) and the residual's slope there (dimensionless), to start the next. */
export interface CurrentWarmStart {
  currentA: number;
  slope: number;
}

/**
 * Solves the operating point: the ladder current is the constant load plus what the resistive part of
 * the output network draws at the mean ladder-top voltage. Secant iteration on the current; `warm`, a nearby
 * solve's current and slope, starts it there with a Newton step (the same answer to the 1e-10 tolerance).
 */
export function solveOperatingPoint(
  ws: Workspace,
  conductanceS: number,
  constantA: number,
  warm?: CurrentWarmStart | null,
): { currentA: number; cycle: SolvedCycle; slope: number } {
  const isWarm = warm !== undefined && warm !== null && warm.currentA >= 0 && warm.slope > 0 && conductanceS > 0;
  let currentA = isWarm ? warm.currentA : constantA;
  let cycle = solveCycle(ws, currentA);
  if (conductanceS === 0) return { currentA, cycle, slope: 1 };
  let previousI = currentA;
  let previousResidual = isWarm
    ? currentA - constantA - conductanceS * Math.max(cycle.meanV, 0)
    : currentA - constantA - conductanceS * cycle.meanV;
  if (isWarm && Math.abs(previousResidual) <= 1e-10 * Math.max(currentA, 1e-15)) {
    return { currentA, cycle, slope: warm.slope };
  }
  currentA = isWarm
    ? Math.max(0, currentA - previousResidual / warm.slope)
    : constantA + conductanceS * Math.max(cycle.meanV, 0);
  let slope = isWarm ? warm.slope : NaN;
  // The mean output is nearly affine in the current, so the secant step converges in two or three steps.
  for (let iteration = 0; iteration < 12; iteration += 1) {
    cycle = solveCycle(ws, currentA);
    const residual = currentA - constantA - conductanceS * Math.max(cycle.meanV, 0);
    if (currentA !== previousI) slope = (residual - previousResidual) / (currentA - previousI);
    if (Math.abs(residual) <= 1e-10 * Math.max(currentA, 1e-15) || residual === previousResidual) {
      return { currentA, cycle, slope };
    }
    const next = currentA - (residual * (currentA - previousI)) / (residual - previousResidual);
    previousI = currentA;
    previousResidual = residual;
    currentA = Math.max(0, next);
  }
  return { currentA, cycle: solveCycle(ws, currentA), slope };
}
