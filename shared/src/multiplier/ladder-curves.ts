import { prepareLadder, terminalMeanAt } from './analyze-ladder';
import type { CurvePoint, LadderCurves, LadderInput, MethodInfo } from './ladder.types';

const CURVES_METHOD: MethodInfo = {
  methodId: 'charge-transfer-sweeps-v1',
  summary: 'Regulation curve: the steady-state model solved at external load currents from zero to short circuit (bisection), bleeder connected. Output vs stages: the design load on ladders of 1 to N stages.',
  assumptions: [
    'near short circuit the charge-transfer model leaves its range (diodes conduct for much of the cycle): the end of the curve is indicative',
    'extra stages repeat the top stage’s capacitors; fewer stages take the lowest ones',
    'the stage scan stops at 60 stages: an optimum of 60 means it lies at or beyond 60 (light load)',
  ],
  source: 'steady-state method charge-transfer-v1',
};

/** Capacitors of the same ladder with `stages` stages (half-wave: 2 cells per stage; full-wave: 3 capacitors). */
function resizeCapacitors(input: LadderInput, stages: number): number[] {
  const perStage = input.topology === 'full-wave' ? 3 : 2;
  const caps = input.capacitorsF;
  const evenCaps = input.topology === 'half-wave' && caps.length % 2 === 1 ? caps.slice(1) : [...caps];
  const top = evenCaps.slice(-perStage);
  const result = evenCaps.slice(0, stages * perStage);
  while (result.length < stages * perStage) result.push(...top);
  return result;
}

/**
 * Regulation curve V(I) up to short circuit and output vs stage count, from the steady-state model.
 * Outputs in volts (unsigned magnitude of the ladder polarity), currents in amperes.
 */
export function ladderCurves(input: LadderInput, points = 21): LadderCurves {
  // The regulation curve sweeps the external load from zero; the bleeder stays connected.
  const prepared = prepareLadder({ ...input, load: null });
  const v0 = terminalMeanAt(prepared, 0);
  // Bracket the short-circuit current, then bisect.
  let high = 1e-9;
  let guard = 0;
  while (terminalMeanAt(prepared, high) > 0 && guard < 90) {
    high *= 2;
    guard += 1;
  }
  let low = 0;
  for (let i = 0; i < 40; i += 1) {
    const mid = (low + high) / 2;
    if (terminalMeanAt(prepared, mid) > 0) low = mid;
    else high = mid;
  }
  const shortCircuitCurrentA = (low + high) / 2;
  const regulation: CurvePoint[] = [];
  for (let i = 0; i < points; i += 1) {
    const current = (shortCircuitCurrentA * i) / (points - 1);
    regulation.push({ x: current, y: Math.max(0, terminalMeanAt(prepared, current)) });
  }

  const baseStages = input.topology === 'half-wave' ? Math.max(1, Math.floor(input.capacitorsF.length / 2)) : input.topology === 'full-wave' ? input.capacitorsF.length / 3 : 1;
  const outputVsStages: CurvePoint[] = [];
  let optimumStages = baseStages;
  let optimumOutputV = -Infinity;
  if (input.topology !== 'bridge-doubler') {
    // Scan until the output has clearly passed its maximum (10 % below it), at most 60 stages.
    const minStages = Math.max(2 * baseStages, baseStages + 6);
    for (let stages = 1; stages <= 60; stages += 1) {
      const v = terminalMeanAt(prepareLadder({ ...input, capacitorsF: resizeCapacitors(input, stages) }), 0);
      outputVsStages.push({ x: stages, y: v });
      if (v > optimumOutputV) {
        optimumOutputV = v;
        optimumStages = stages;
      }
      if (stages >= minStages && v < 0.9 * optimumOutputV) break;
    }
  } else {
    optimumOutputV = terminalMeanAt(prepareLadder(input), 0);
    outputVsStages.push({ x: 1, y: optimumOutputV });
  }
  return { regulation, shortCircuitCurrentA, outputVsStages, optimumStages, optimumOutputV, method: CURVES_METHOD };
}
