import { eventLosses, type EventLoss, type Workspace } from './charge-transfer-model';
import { EVENT_H } from './topologies';

const H = EVENT_H;
const lossAtH: EventLoss = { lossScale: 0, forwardDropV: 0, conductionCurrentA: 0 };
const lossAtL: EventLoss = { lossScale: 0, forwardDropV: 0, conductionCurrentA: 0 };

/** The mean output of the solve's pass up the ladder with anchors at the unit peaks given, no drops, no load. */
function meanSlope(ws: Workspace, highV: number, lowV: number, swingV: number): number {
  const timing = ws.timing;
  const { net, nodeA, nodeB } = ws;
  for (let a = 0; a < net.anchorScale.length; a += 1) {
    const scale = net.anchorScale[a] as number;
    nodeA[a] = scale * highV;
    nodeB[a] = -scale * lowV;
  }
  const { capDiode, capTop, capBottom, diodeAnode, diodeCathode, diodeEvent } = net;
  const strayDelta = ws.strayDelta;
  for (let c = 0; c < net.capF.length; c += 1) {
    const d = capDiode[c] as number;
    const top = capTop[c] as number;
    const bottom = capBottom[c] as number;
    const source = top === diodeCathode[d] ? (diodeAnode[d] as number) : (diodeCathode[d] as number);
    const delta = swingV * (strayDelta[c] as number);
    let a: number;
    let b: number;
    if (diodeEvent[d] === H) {
      a = (nodeA[source] as number) - (nodeA[bottom] as number);
      b = a + delta;
    } else {
      b = (nodeB[source] as number) - (nodeB[bottom] as number);
      a = b - delta;
    }
    nodeA[top] = (nodeA[bottom] as number) + a;
    nodeB[top] = (nodeB[bottom] as number) + b;
  }
  const afterHV = (nodeA[net.outNode] as number) - (nodeA[net.returnNode] as number);
  const afterLV = (nodeB[net.outNode] as number) - (nodeB[net.returnNode] as number);
  return (timing.afterHS * afterHV + timing.afterLS * afterLV) / timing.periodS;
}

/**
 * The mean ladder-top output's slopes (V per V) in the flat-top drive's H and L peaks at a fixed ladder
 * current (A): ∂V̄/∂V_H and ∂V̄/∂V_L of `solveCycle`, exactly. At a fixed current a flat-top solve is affine
 * in the peaks (the source loss Q·R/t_phase and the diode drops depend on the current alone, the strays'
 * charge on the peak-to-peak), so its slopes are the same pass up the ladder with a unit peak, no drops and
 * no load; an event whose source loss takes its whole peak passes on none of it. Null for a sine drive, whose
 * source loss grows with √V_pk.
 */
export function peakSlopes(ws: Workspace, currentA: number): { high: number; low: number } | null {
  const timing = ws.timing;
  if (timing.isSine) return null;
  const isHighLive = eventLosses(ws, currentA, 0, lossAtH).lossScale > 0;
  const isLowLive = eventLosses(ws, currentA, 1, lossAtL).lossScale > 0;
  return { high: meanSlope(ws, isHighLive ? 1 : 0, 0, 1), low: meanSlope(ws, 0, isLowLive ? 1 : 0, 1) };
}
