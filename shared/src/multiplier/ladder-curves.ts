import { checkLadderInput, prepareLadder, terminalMeanAt, type PreparedLadder } from './analyze-ladder';
import { refreshCapacitors, type Workspace } from './charge-transfer-model';
import { driveTiming } from './drive-timing';
import { bracketedRoot } from './bracketed-root';
import type { CurvePoint, LadderCurves, LadderInput } from './ladder.types';
import type { MethodInfo } from '../methods';

const CURVES_METHOD: MethodInfo = {
  methodId: 'charge-transfer-sweeps-v2',
  summary:
    'Regulation curve: the steady-state model solved at external load currents from zero to short circuit (found by Brent’s method), bleeder connected. Output vs stages: the design load on ladders of 1 to N stages, every count to 10 then about 15 % apart, refined to the exact optimum, until the output is 2 % below its maximum.',
  assumptions: [
    'near short circuit the charge-transfer model leaves its range (diodes conduct for much of the cycle): the end of the curve is indicative',
    'extra stages repeat the top stage’s capacitors; fewer stages take the lowest ones',
    'output vs stages has one maximum (it rises near linearly, flattens and falls): stage counts between the plotted ones lie within 1 % of the straight line between them',
    'the stage scan stops at 60 stages: an optimum of 60 means it lies at or beyond 60 (light load)',
  ],
  source: 'steady-state method charge-transfer-v1',
};

/** Largest stage count the scan tries. */
const MAX_STAGES = 60;
/** Spacing of the scanned stage counts above 10, the first count it moves by more than one (the output is near linear in the count far from its maximum). */
const STAGE_RATIO = 1.15;
/** The scan ends this far below the maximum output: the maximum is then clearly passed. */
const PAST_OPTIMUM_FRACTION = 0.98;

/** Capacitors of the same ladder with `stages` stages (half-wave: 2 cells per stage; full-wave: 3 capacitors). */
export function resizeCapacitors(input: LadderInput, stages: number): number[] {
  const perStage = input.topology === 'full-wave' ? 3 : 2;
  const caps = input.capacitorsF;
  const evenCaps = input.topology === 'half-wave' && caps.length % 2 === 1 ? caps.slice(1) : [...caps];
  // A one-cell half-wave ladder has no whole stage: its single capacitor stands for both columns.
  const top = evenCaps.length > 0 ? evenCaps.slice(-perStage) : [];
  while (top.length < perStage) top.push(top[top.length - 1] ?? caps[caps.length - 1]!);
  const result = evenCaps.slice(0, stages * perStage);
  while (result.length < stages * perStage) result.push(...top);
  return result;
}

/** Short-circuit current (A) of a prepared ladder: bracket by doubling, then Brent to the resolution of 40 halvings. */
function shortCircuitCurrentOf(prepared: PreparedLadder): number {
  const outputAt = (currentA: number) => terminalMeanAt(prepared, currentA);
  let low = 0;
  let outputLow = outputAt(0);
  let high = 1e-9;
  let outputHigh = outputAt(high);
  for (let guard = 0; outputHigh > 0 && guard < 90; guard += 1) {
    low = high;
    outputLow = outputHigh;
    high *= 2;
    outputHigh = outputAt(high);
  }
  if (outputHigh > 0) return high;
  return bracketedRoot(outputAt, low, high, outputLow, outputHigh, high * 2 ** -40);
}

/**
 * The stage scan's networks of the last few ladders scanned, per stage count: a Workbench edit of anything but
 * the capacitors, topology, strays, temperature, polarity or drive kind scans the same networks again, so
 * their workspaces (structure, charge and stray deltas, flat-top rates) are kept and only the drive timing and
 * the diode (all a workspace takes from the rest of the input) are set anew. An edit of the capacitors takes
 * the least recently scanned ladder's networks when their key is the same and refreshes each one's capacitor
 * figures in place as the scan reaches it (a network of a stage count has the same structure whatever the
 * values), instead of building them anew.
 */
interface ScanNetworks {
  key: string;
  capacitorsF: readonly number[];
  byStages: Map<number, Workspace>;
  /** The stage counts whose networks hold these capacitors (the others were taken over and still hold the last). */
  isCurrent: Set<number>;
}

const SCAN_MEMORY = 8;
const scans: ScanNetworks[] = [];

function scanNetworksOf(input: LadderInput): ScanNetworks {
  const key = `${input.topology}:${input.drive.kind}:${input.polarity}:${input.strayCapacitanceF ?? 0}:${input.temperatureK ?? 300}`;
  const caps = input.capacitorsF;
  const found = scans.findIndex(
    (scan) =>
      scan.key === key && scan.capacitorsF.length === caps.length && scan.capacitorsF.every((f, i) => f === caps[i]),
  );
  let scan: ScanNetworks;
  if (found >= 0) scan = scans.splice(found, 1)[0] as ScanNetworks;
  else {
    const oldest = scans.length >= SCAN_MEMORY ? (scans.pop() as ScanNetworks) : null;
    const byStages = oldest?.key === key ? oldest.byStages : new Map<number, Workspace>();
    scan = { key, capacitorsF: [...caps], byStages, isCurrent: new Set() };
  }
  scans.unshift(scan);
  if (scans.length > SCAN_MEMORY) scans.pop();
  return scan;
}

/**
 * The workspace of the scan's ladder of `stages` stages at the input's capacitors, drive and diode (the input
 * gives its load and output network alone: a PreparedLadder of the two, the input's capacitors aside, is that
 * ladder, with no input object made per stage count).
 */
function scanWorkspace(scan: ScanNetworks, input: LadderInput, stages: number): Workspace {
  const known = scan.byStages.get(stages);
  if (!known) {
    const { workspace } = prepareLadder({ ...input, capacitorsF: resizeCapacitors(input, stages) });
    scan.byStages.set(stages, workspace);
    scan.isCurrent.add(stages);
    return workspace;
  }
  // The same checks of the drive and diode as a fresh preparation makes.
  checkLadderInput(input);
  if (!scan.isCurrent.has(stages)) {
    const resized = resizeCapacitors(input, stages);
    if (!resized.every((f, c) => f === known.net.capF[c])) {
      refreshCapacitors(known, resized, input.strayCapacitanceF ?? 0);
    }
    scan.isCurrent.add(stages);
  }
  known.timing = driveTiming(input.drive, input.polarity);
  known.diode = input.diode;
  return known;
}

/**
 * Output vs stage count at the design load: a walk over stage counts (every count to 10, then STAGE_RATIO
 * apart) until the output falls, an integer bracket search for the maximum between the last counts, then the
 * walk again until the output is PAST_OPTIMUM_FRACTION of its maximum.
 */
function outputVsStagesOf(
  input: LadderInput,
  minStages: number,
): Pick<LadderCurves, 'outputVsStages' | 'optimumStages' | 'optimumOutputV'> {
  const outputs = new Map<number, number>();
  const scan = scanNetworksOf(input);
  const outputAt = (stages: number): number => {
    let v = outputs.get(stages);
    if (v === undefined) {
      v = terminalMeanAt({ input, workspace: scanWorkspace(scan, input, stages) }, 0);
      outputs.set(stages, v);
    }
    return v;
  };
  const nextStages = (stages: number) => Math.min(MAX_STAGES, Math.max(stages + 1, Math.round(stages * STAGE_RATIO)));
  let low = 0;
  let best = 1;
  let high = best;
  while (best < MAX_STAGES) {
    high = nextStages(best);
    if (outputAt(high) < outputAt(best)) break;
    low = best;
    best = high;
  }
  // The maximum lies strictly between low and high; probe the wider side (the lower count wins a tie, as in a full scan).
  while (high - low > 2 && best < MAX_STAGES) {
    const probe = best - low > high - best ? Math.floor((low + best) / 2) : Math.ceil((best + high) / 2);
    const isBetter = probe < best ? outputAt(probe) >= outputAt(best) : outputAt(probe) > outputAt(best);
    if (isBetter) {
      if (probe < best) high = best;
      else low = best;
      best = probe;
    } else if (probe < best) low = probe;
    else high = probe;
  }
  const optimumOutputV = outputAt(best);
  let stages = Math.max(high, best);
  while (stages < MAX_STAGES && (stages < minStages || outputAt(stages) > PAST_OPTIMUM_FRACTION * optimumOutputV))
    stages = nextStages(stages);
  outputAt(stages);
  const outputVsStages = [...outputs.entries()].sort((a, b) => a[0] - b[0]).map(([x, y]) => ({ x, y }));
  return { outputVsStages, optimumStages: best, optimumOutputV };
}

/**
 * Regulation curve V(I) up to short circuit and output vs stage count, from the steady-state model.
 * Outputs in volts (unsigned magnitude of the ladder polarity), currents in amperes. Method: CURVES_METHOD.
 */
export function ladderCurves(input: LadderInput, points = 21): LadderCurves {
  // The regulation curve sweeps the external load from zero; the bleeder stays connected.
  const prepared = prepareLadder({ ...input, load: null });
  const shortCircuitCurrentA = shortCircuitCurrentOf(prepared);
  const regulation: CurvePoint[] = [];
  for (let i = 0; i < points; i += 1) {
    const current = (shortCircuitCurrentA * i) / (points - 1);
    regulation.push({ x: current, y: Math.max(0, terminalMeanAt(prepared, current)) });
  }
  if (input.topology === 'bridge-doubler') {
    const optimumOutputV = terminalMeanAt(prepareLadder(input), 0);
    return {
      regulation,
      shortCircuitCurrentA,
      outputVsStages: [{ x: 1, y: optimumOutputV }],
      optimumStages: 1,
      optimumOutputV,
      method: CURVES_METHOD,
    };
  }
  const baseStages =
    input.topology === 'half-wave'
      ? Math.max(1, Math.floor(input.capacitorsF.length / 2))
      : input.capacitorsF.length / 3;
  const stageScan = outputVsStagesOf(input, Math.max(2 * baseStages, baseStages + 6));
  return { regulation, shortCircuitCurrentA, ...stageScan, method: CURVES_METHOD };
}
