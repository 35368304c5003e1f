import type { StoredEnergySummary } from '../safety/stored-energy';
import { cascadeDischargePhases, type DischargePhase } from '../safety/cascade-discharge';
import { buildLadderNetwork } from '../multiplier/topologies';
import type { LadderAnalysis } from '../multiplier/ladder.types';

/**
 * The bleeder discharge of an analysed ladder, interval by interval (`cascadeDischargePhases`): its network with the
 * drive stopped (the winding ends at 0 V) from the mean node voltages of the steady state, made positive. A ladder
 * whose node voltages are not all in the analysis is taken as one RC with the energy-equivalent capacitance.
 */
export function ladderDischargePhases(analysis: LadderAnalysis, energy: StoredEnergySummary): DischargePhase[] {
  const network = buildLadderNetwork(
    analysis.topology,
    analysis.capacitors.map((capacitor) => capacitor.valueF),
  );
  // The circuit's ground ('0') is the reference of the mean node voltages.
  const meanOf = new Map([['0', 0], ...analysis.nodes.map((node): [string, number] => [node.id, node.meanV])]);
  const anchorCount = network.anchorScale.length;
  const sign = analysis.ladderTopMeanV < 0 ? -1 : 1;
  const referenceV = meanOf.get(network.nodeInfo[0]?.id ?? '') ?? 0;
  const means = network.nodeInfo.map((info, i) => (i < anchorCount ? 0 : meanOf.get(info.id)));
  if (means.some((meanV) => meanV === undefined)) {
    return [{ startV: Math.abs(analysis.ladderTopMeanV), capacitanceF: energy.outputEquivalentCapacitanceF }];
  }
  return cascadeDischargePhases({
    nodeCount: network.nodeCount,
    anchorNodes: Array.from({ length: anchorCount }, (_, i) => i),
    capacitors: network.capTop.map((top, c) => ({
      top,
      bottom: network.capBottom[c]!,
      valueF: network.capF[c]!,
    })),
    diodes: network.diodeAnode.map((anode, d) => ({ anode, cathode: network.diodeCathode[d]! })),
    outNode: network.outNode,
    returnNode: network.returnNode,
    nodeVoltagesV: means.map((meanV, i) => (i < anchorCount ? 0 : sign * (meanV! - referenceV))),
  });
}
