import { DomainError } from '../errors';
import { buildLadderNetwork, EVENT_H } from './topologies';
import { createWorkspace, outputLoad, solveCycle, solveOperatingPoint } from './charge-transfer-model';
import type { CurrentWarmStart, Workspace } from './charge-transfer-model';
import { ladderNodeVoltages, NODE_VOLTAGE_METHOD } from './ladder-nodes';
import { textbookFigures } from './textbook-formulas';
import type { CapacitorStress, DiodeStress, LadderAnalysis, LadderInput } from './ladder.types';
import type { MethodInfo } from '../methods';

export const STEADY_STATE_METHOD: MethodInfo = {
  methodId: 'charge-transfer-v1',
  summary:
    'Periodic steady state of the switched-capacitor (charge-transfer) model: each diode passes a fixed charge per cycle at its drive extreme, capacitor voltages follow from charge balance and the end-of-conduction condition of each diode, solved in one pass up the ladder.',
  assumptions: [
    'diodes conduct only at the drive extremes and each passes its share of q = I/f per cycle (all of it in a half-wave chain, half in a full-wave cascade)',
    'constant load current between conductions; the output falls linearly between charge transfers',
    'diode forward drop: Shockley n·Vt·ln(1 + I/Is) + I·Rs at the mean conduction current, Vt at 300 K unless given',
    'sine drive: source-resistance loss from the peak-rectifier conduction angle, ΔV = (3·Q·ω·R·√Vpk / (4√2))^(2/3) per conduction',
    'pulse drive: flat tops, so the diodes that conduct at the start of a phase stay conducting through it and share the load, but for those that would need reverse current, which stop (an active-set solve per phase); source loss Q·R / phase time',
    'full-wave: the two antiphase paths share the charge equally (exact for a symmetric drive and equal columns)',
    'stray capacitance of each node to ground, first order: oscillating-column nodes swing by the drive peak-to-peak and their strays move that charge through the column below (a capacitive divider, a loss even at no load and independent of frequency); the smoothing column’s ripple swing is neglected; diode junction capacitance is not modelled (see the simulator)',
    'reported output is at the load terminal, after the series output resistor; the bleeder sits at the ladder top',
  ],
  source:
    'Charge-balance analysis of the Greinacher/Cockcroft-Walton cascade as in Kuffel, Zaengl & Kuffel, High Voltage Engineering Fundamentals, 2nd ed., §2.2.2 (from memory), solved exactly for any capacitor values; Shockley diode equation',
};

/** The checks of a ladder input's drive, diode and bleeder that every preparation makes (the capacitors are the network's). */
export function checkLadderInput(input: LadderInput): void {
  const drive = input.drive;
  if (!(drive.frequencyHz > 0))
    throw new DomainError('invalid_argument', 'drive frequency must be positive', 'drive.frequencyHz');
  if (drive.kind === 'sine' && !(drive.peakV > 0))
    throw new DomainError('invalid_argument', 'drive peak must be positive', 'drive.peakV');
  if (drive.kind === 'pulse' && !(drive.dutyCycle > 0 && drive.dutyCycle < 1)) {
    throw new DomainError('invalid_argument', 'duty cycle must lie in (0, 1)', 'drive.dutyCycle');
  }
  if (!(input.diode.saturationCurrentA > 0))
    throw new DomainError('invalid_argument', 'diode saturation current must be positive', 'diode.saturationCurrentA');
  if (input.bleederOhm !== null && !(input.bleederOhm > 0))
    throw new DomainError('invalid_argument', 'bleeder resistance must be positive', 'bleederOhm');
}

/** Prepared ladder: the network and work arrays, for repeated solves (sizing, tolerance spread, curves). */
export interface PreparedLadder {
  input: LadderInput;
  workspace: Workspace;
}

export function prepareLadder(input: LadderInput): PreparedLadder {
  checkLadderInput(input);
  const net = buildLadderNetwork(input.topology, input.capacitorsF);
  return { input, workspace: createWorkspace(net, input) };
}

/** The same prepared network with another diode model (the work arrays are shared: use one at a time). */
export function withDiode(prepared: PreparedLadder, diode: LadderInput['diode']): PreparedLadder {
  prepared.workspace.diode = diode;
  return { input: { ...prepared.input, diode }, workspace: prepared.workspace };
}

/** Mean load-terminal output (unsigned) at an extra external load current, for the curves. */
export function terminalMeanAt(prepared: PreparedLadder, extraLoadA: number): number {
  return terminalMeanNear(prepared, extraLoadA, null).outputV;
}

/**
 * `terminalMeanAt` with the operating-point solve started from a nearby one (`warm`, see solveOperatingPoint),
 * giving this one's current and slope to start the next.
 */
export function terminalMeanNear(
  prepared: PreparedLadder,
  extraLoadA: number,
  warm: CurrentWarmStart | null,
): { outputV: number; near: CurrentWarmStart } {
  const { conductanceS, constantA, seriesOhm } = outputLoad(prepared.input);
  const { currentA, cycle, slope } = solveOperatingPoint(
    prepared.workspace,
    conductanceS,
    constantA + extraLoadA,
    warm,
  );
  const bleederA = prepared.input.bleederOhm ? Math.max(cycle.meanV, 0) / prepared.input.bleederOhm : 0;
  return { outputV: cycle.meanV - (currentA - bleederA) * seriesOhm, near: { currentA, slope } };
}

/**
 * Mean output (signed by polarity) and ripple (peak to peak) at the operating point: the same figures as
 * `analyzePrepared`, without the stress and node figures, for screening many candidates (the Sizer).
 */
export function operatingFigures(prepared: PreparedLadder): { outputMeanV: number; ripplePeakToPeakV: number } {
  const { input, workspace: ws } = prepared;
  const { conductanceS, constantA, seriesOhm } = outputLoad(input);
  const { currentA, cycle } = solveOperatingPoint(ws, conductanceS, constantA);
  const bleederA = input.bleederOhm ? Math.max(cycle.meanV, 0) / input.bleederOhm : 0;
  const loadA = Math.max(currentA - bleederA, 0);
  return {
    outputMeanV: input.polarity * (cycle.meanV - loadA * seriesOhm),
    ripplePeakToPeakV: cycle.maxV - cycle.minV,
  };
}

/**
 * Steady-state analysis of a voltage-multiplier ladder of any cell count and capacitor values (SI in,
 * SI out, signed by polarity). Method: STEADY_STATE_METHOD (charge-transfer model, one pass up the
 * ladder); published closed forms reported beside it where they apply.
 */
export function analyzeLadder(input: LadderInput): LadderAnalysis {
  return analyzePrepared(prepareLadder(input));
}

/**
 * Analysis of a prepared ladder. `operatingPointOnly` skips the no-load solve and the output-impedance
 * derivative (both then reported as NaN) and the node voltages (an empty list): the Sizer needs only the
 * operating point and the component stress.
 */
export function analyzePrepared(
  prepared: PreparedLadder,
  options: { operatingPointOnly?: boolean } = {},
): LadderAnalysis {
  const { input, workspace: ws } = prepared;
  const { net, timing } = ws;
  const sign = input.polarity;
  const { conductanceS, constantA, seriesOhm } = outputLoad(input);
  const full = !options.operatingPointOnly;

  const noLoadV = full ? solveOperatingPoint(ws, input.bleederOhm ? 1 / input.bleederOhm : 0, 0).cycle.meanV : NaN;
  const op = solveOperatingPoint(ws, conductanceS, constantA);
  const cycle = op.cycle;
  const ladderCurrentA = op.currentA;
  const bleederA = input.bleederOhm ? Math.max(cycle.meanV, 0) / input.bleederOhm : 0;
  const loadA = Math.max(ladderCurrentA - bleederA, 0);
  const seriesDropV = loadA * seriesOhm;

  // Output impedance of the ladder alone (central difference in ladder current), plus the series resistor.
  const capacitors: CapacitorStress[] = [];
  const m = net.capF.length;
  for (let c = 0; c < m; c += 1) {
    const a = ws.stateA[c] as number;
    const b = ws.stateB[c] as number;
    const beforeL = a + ladderCurrentA * (ws.rateH[c] as number) * timing.afterHS;
    const beforeH = b + ladderCurrentA * (ws.rateL[c] as number) * timing.afterLS;
    const high = Math.max(a, b, beforeL, beforeH);
    const low = Math.min(a, b, beforeL, beforeH);
    capacitors.push({
      index: c + 1,
      column: net.capColumn[c] ?? 'smoothing',
      stage: net.capStage[c] as number,
      valueF: net.capF[c] as number,
      maxVoltageV: Math.max(Math.abs(high), Math.abs(low)),
      swingV: high - low,
    });
  }

  // Diode reverse voltage at the four instants of the cycle, with the drive at its nominal extremes.
  const surgeA = Math.min(
    Math.max(timing.highV, timing.lowV) / (timing.sourceResistanceOhm + input.diode.seriesResistanceOhm || 1e-3),
    input.sourceCurrentLimitA ?? Infinity,
  );
  const { nodeA, nodeB, nodeRateH, nodeRateL } = ws;
  const fallH = ladderCurrentA * timing.afterHS;
  const fallL = ladderCurrentA * timing.afterLS;
  const isHEvent = EVENT_H;
  const diodes: DiodeStress[] = [];
  for (let d = 0; d < net.diodeShare.length; d += 1) {
    const anode = net.diodeAnode[d] as number;
    const cathode = net.diodeCathode[d] as number;
    const rootK = net.nodeRoot[cathode] as number;
    const rootA = net.nodeRoot[anode] as number;
    const scaleK = net.anchorScale[rootK] as number;
    const scaleA = net.anchorScale[rootA] as number;
    // Cathode minus anode at each instant: (state a, no fall, +highV), (a, fallH, −lowV), (b, 0, −lowV), (b, fallL, +highV).
    const aK = (nodeA[cathode] as number) - (nodeA[rootK] as number);
    const aA = (nodeA[anode] as number) - (nodeA[rootA] as number);
    const bK = (nodeB[cathode] as number) - (nodeB[rootK] as number);
    const bA = (nodeB[anode] as number) - (nodeB[rootA] as number);
    const rateK = (nodeRateH[cathode] as number) - (nodeRateH[anode] as number);
    const rateKL = (nodeRateL[cathode] as number) - (nodeRateL[anode] as number);
    const driveScale = scaleK - scaleA;
    const piv = Math.max(
      0,
      aK - aA + driveScale * timing.highV,
      aK - aA + fallH * rateK - driveScale * timing.lowV,
      bK - bA - driveScale * timing.lowV,
      bK - bA + fallL * rateKL + driveScale * timing.highV,
    );
    const isH = net.diodeEvent[d] === isHEvent;
    diodes.push({
      index: d + 1,
      peakInverseV: piv,
      averageCurrentA: (net.diodeShare[d] as number) * ladderCurrentA,
      conductionCurrentA: isH ? cycle.conductionHA : cycle.conductionLA,
      surgeCurrentA: surgeA,
      forwardDropV: isH ? cycle.forwardDropHV : cycle.forwardDropLV,
    });
  }

  const terminalMeanV = cycle.meanV - seriesDropV;
  const outputMinV = sign * (sign > 0 ? cycle.minV - seriesDropV : cycle.maxV - seriesDropV);
  const outputMaxV = sign * (sign > 0 ? cycle.maxV - seriesDropV : cycle.minV - seriesDropV);
  const nodes = full
    ? ladderNodeVoltages(ws, ladderCurrentA, sign, { meanV: sign * terminalMeanV, minV: outputMinV, maxV: outputMaxV })
    : [];

  // After the stress figures and node voltages: these solves overwrite the operating-point state.
  let ladderImpedance = NaN;
  if (full) {
    const stepA = Math.max(ladderCurrentA * 1e-3, 1e-9);
    const lowI = Math.max(ladderCurrentA - stepA, 0);
    const highI = ladderCurrentA + stepA;
    ladderImpedance = (solveCycle(ws, lowI).meanV - solveCycle(ws, highI).meanV) / (highI - lowI);
  }

  const noLoadTerminalV = noLoadV;
  return {
    topology: input.topology,
    cellCount: net.cellCount,
    stageCount: net.stageCount,
    noLoadOutputV: sign * noLoadTerminalV,
    outputMeanV: sign * terminalMeanV,
    outputMinV,
    outputMaxV,
    ripplePeakToPeakV: cycle.maxV - cycle.minV,
    droopV: Math.abs(noLoadTerminalV - terminalMeanV),
    outputImpedanceOhm: ladderImpedance + seriesOhm,
    ladderTopMeanV: sign * cycle.meanV,
    loadCurrentA: loadA,
    bleederCurrentA: bleederA,
    ladderCurrentA,
    outputPowerW: terminalMeanV * loadA,
    idealNoLoadV: sign * (net.idealCoefficientH * timing.highV + net.idealCoefficientL * timing.lowV),
    capacitors,
    diodes,
    nodes,
    nodeMethod: NODE_VOLTAGE_METHOD,
    textbook: textbookFigures(input, ladderCurrentA),
    method: STEADY_STATE_METHOD,
  };
}
