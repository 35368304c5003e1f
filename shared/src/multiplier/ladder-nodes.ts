import type { Workspace } from './charge-transfer-model';
import type { LadderNodeVoltage } from './ladder.types';
import type { MethodInfo } from '../methods';

export const NODE_VOLTAGE_METHOD: MethodInfo = {
  methodId: 'charge-transfer-nodes-v1',
  summary:
    'Node voltages to ground from the same charge-transfer solution as the output: each node is its winding end plus the capacitors below it, whose voltages jump at the charge transfers and ramp linearly with the load between them.',
  assumptions: [
    'a node’s cycle mean is the mean of its capacitor sum plus the mean of its winding end: zero for a sine secondary (the drop across the source resistance is neglected), the time-weighted flat tops for a pulse secondary',
    'minimum and maximum are taken at the four instants of the cycle: just after and just before each charge transfer, with the winding end at the drive extreme of that instant',
    'voltages are to the circuit ground: for the bridge doubler that is the foot of the lower capacitor, not the winding midpoint',
    'the load terminal is the ladder top less the drop across the series output resistor',
  ],
  source:
    'Charge-balance analysis of the cascade (Kuffel, Zaengl & Kuffel, High Voltage Engineering Fundamentals, 2nd ed., §2.2.2, from memory), node by node',
};

/** The load terminal's figures, already signed, as analyzeLadder reports them. */
export interface TerminalFigures {
  meanV: number;
  minV: number;
  maxV: number;
}

/** Cycle mean of a node: its capacitor sum's mean plus its winding end's (zero for a sine, the time-weighted flat tops for a pulse). */
function meanOf(
  timing: Workspace['timing'],
  anchorA: number,
  anchorB: number,
  sumA: number,
  sumB: number,
  fallH: number,
  fallL: number,
): number {
  const sumMean = (timing.afterHS * (sumA + fallH / 2) + timing.afterLS * (sumB + fallL / 2)) / timing.periodS;
  const anchorMean = timing.isSine ? 0 : (timing.afterHS * anchorA + timing.afterLS * anchorB) / timing.periodS;
  return sumMean + anchorMean;
}

/** A node's parts at the solved state: winding end after H and after L, capacitor sums, and load falls (one scratch object). */
const parts = { anchorA: 0, anchorB: 0, sumA: 0, sumB: 0, fallH: 0, fallL: 0 };

function nodeParts(ws: Workspace, n: number, fallHS: number, fallLS: number): typeof parts {
  const root = ws.net.nodeRoot[n] as number;
  parts.anchorA = ws.nodeA[root] as number;
  parts.anchorB = ws.nodeB[root] as number;
  parts.sumA = (ws.nodeA[n] as number) - parts.anchorA;
  parts.sumB = (ws.nodeB[n] as number) - parts.anchorB;
  parts.fallH = fallHS * (ws.nodeRateH[n] as number);
  parts.fallL = fallLS * (ws.nodeRateL[n] as number);
  return parts;
}

/**
 * Voltage of every ladder node to ground over the steady-state cycle (V, signed by polarity), from the
 * workspace state the operating-point solve left (call before any other solve). Method: NODE_VOLTAGE_METHOD.
 */
export function ladderNodeVoltages(
  ws: Workspace,
  currentA: number,
  polarity: 1 | -1,
  terminal: TerminalFigures,
): LadderNodeVoltage[] {
  const { net, timing } = ws;
  // The four instants of the cycle, per node, relative to the return node; no array or object per instant.
  const fallHS = currentA * timing.afterHS;
  const fallLS = currentA * timing.afterLS;
  const ret = net.returnNode;
  const r = nodeParts(ws, ret, fallHS, fallLS);
  const groundMeanV = meanOf(timing, r.anchorA, r.anchorB, r.sumA, r.sumB, r.fallH, r.fallL);
  // A sine winding end moves to the opposite extreme between transfers; a flat top holds until its edge.
  const retAfterH = r.sumA + r.anchorA;
  const retBeforeL = r.sumA + r.fallH + (timing.isSine ? r.anchorB : r.anchorA);
  const retAfterL = r.sumB + r.anchorB;
  const retBeforeH = r.sumB + r.fallL + (timing.isSine ? r.anchorA : r.anchorB);
  const nodes: LadderNodeVoltage[] = [];
  // Winding ends first, then the ladder from the bottom up (node order within each); the load terminal last.
  for (let pass = 0; pass < 2; pass += 1) {
    for (let n = 0; n < net.nodeCount; n += 1) {
      if (n === ret) continue;
      const info = net.nodeInfo[n];
      if (!info || (info.column === 'source') !== (pass === 0)) continue;
      const { anchorA, anchorB, sumA, sumB, fallH, fallL } = nodeParts(ws, n, fallHS, fallLS);
      const v0 = sumA + anchorA - retAfterH;
      const v1 = sumA + fallH + (timing.isSine ? anchorB : anchorA) - retBeforeL;
      const v2 = sumB + anchorB - retAfterL;
      const v3 = sumB + fallL + (timing.isSine ? anchorA : anchorB) - retBeforeH;
      const low = Math.min(v0, v1, v2, v3);
      const high = Math.max(v0, v1, v2, v3);
      nodes.push({
        id: info.id,
        label: info.label,
        column: info.column,
        stage: info.stage,
        capacitorIndex: info.capacitorIndex,
        meanV: polarity * (meanOf(timing, anchorA, anchorB, sumA, sumB, fallH, fallL) - groundMeanV),
        minV: polarity > 0 ? low : -high,
        maxV: polarity > 0 ? high : -low,
      });
    }
  }
  nodes.push({
    id: 'out',
    label: 'load terminal',
    column: 'output',
    stage: Math.ceil(net.stageCount),
    capacitorIndex: null,
    meanV: terminal.meanV,
    minV: terminal.minV,
    maxV: terminal.maxV,
  });
  return nodes;
}
