import { readFileSync } from 'node:fs';
import { validateDesign } from '../../src/designs/validate-design';
import { DomainError } from '../../src/errors';
import { ladderSpecFromDesign, type LadderCircuitSpec } from '../../src/sim/build-circuit';
import { runLadder } from '../../src/sim/design-runs';

/** Reads `--name value` pairs and bare `--flag`s. */
function readFlags(argv: ReadonlyArray<string>): { positional: string[]; flags: Map<string, string | true> } {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (!a.startsWith('--')) {
      positional.push(a);
      continue;
    }
    const next = argv[i + 1];
    if (next !== undefined && !next.startsWith('--')) {
      flags.set(a.slice(2), next);
      i++;
    } else flags.set(a.slice(2), true);
  }
  return { positional, flags };
}

function numberFlag(flags: Map<string, string | true>, name: string): number | undefined {
  const v = flags.get(name);
  if (v === undefined) return undefined;
  const n = Number(v);
  if (v === true || !Number.isFinite(n)) throw new DomainError('invalid_argument', `--${name} needs a number`, name);
  return n;
}

/**
 * Bare-ladder flags, the same set as `ladderwright ladder` (to be replaced by the shared parser in
 * cli/ladder-flags.ts once it exists): --topology --stages|--cells --peak --freq --cap|--caps [--rs]
 * [--load-current|--load-r] [--diode-is --diode-n --diode-rs] [--bleeder].
 */
export function ladderSpecFromFlags(flags: Map<string, string | true>): LadderCircuitSpec {
  const topologyFlag = String(flags.get('topology') ?? 'half-wave');
  const topology = topologyFlag === 'bridge' ? 'bridge-doubler' : topologyFlag;
  if (topology !== 'half-wave' && topology !== 'full-wave' && topology !== 'bridge-doubler') {
    throw new DomainError('invalid_argument', 'topology is half-wave, full-wave or bridge', 'topology');
  }
  const stages = numberFlag(flags, 'stages');
  const cellCount = topology === 'bridge-doubler' ? 2 : (numberFlag(flags, 'cells') ?? (stages !== undefined ? (topology === 'full-wave' ? stages : 2 * stages) : 2));
  const capCount = topology === 'full-wave' ? 3 * cellCount : topology === 'bridge-doubler' ? 2 : cellCount;
  const capsText = flags.get('caps');
  const capacitorsF =
    typeof capsText === 'string' ? capsText.split(',').map(Number) : Array<number>(capCount).fill(numberFlag(flags, 'cap') ?? 10e-9);
  const peakV = numberFlag(flags, 'peak');
  const frequencyHz = numberFlag(flags, 'freq');
  if (peakV === undefined || frequencyHz === undefined) throw new DomainError('invalid_argument', '--peak and --freq are required', 'peak');
  const loadCurrent = numberFlag(flags, 'load-current');
  const loadR = numberFlag(flags, 'load-r');
  return {
    topology,
    cellCount,
    capacitorsF,
    diode: {
      saturationCurrentA: numberFlag(flags, 'diode-is') ?? 1e-9,
      emissionCoefficient: numberFlag(flags, 'diode-n') ?? 1.8,
      seriesResistanceOhm: numberFlag(flags, 'diode-rs') ?? 1,
    },
    drive: { kind: 'sine', peakV, frequencyHz, sourceResistanceOhm: numberFlag(flags, 'rs') ?? 0 },
    bleederOhm: numberFlag(flags, 'bleeder') ?? null,
    load: loadCurrent !== undefined ? { kind: 'current', currentA: loadCurrent } : loadR !== undefined ? { kind: 'resistance', resistanceOhm: loadR } : null,
  };
}

/** The ladder spec from `DESIGN.json` (first positional argument) or from bare-ladder flags, and the safe voltage. */
export function ladderFromArguments(argv: ReadonlyArray<string>): { spec: LadderCircuitSpec; safeVoltageV: number; flags: Map<string, string | true> } {
  const { positional, flags } = readFlags(argv);
  if (positional[0]) {
    const design = validateDesign(JSON.parse(readFileSync(positional[0], 'utf8')));
    return { spec: ladderSpecFromDesign(design), safeVoltageV: numberFlag(flags, 'safe-voltage') ?? design.targets.safeVoltageV, flags };
  }
  return { spec: ladderSpecFromFlags(flags), safeVoltageV: numberFlag(flags, 'safe-voltage') ?? 50, flags };
}

/**
 * `ladderwright simulate DESIGN.json | <bare-ladder flags>` [--until steady | --cycles N]
 * [--max-step-per-period N] [--discharge] [--safe-voltage V]: JSON with the output's cycle mean, ripple,
 * time to steady state, cycles simulated, method, and with --discharge the time to the safe voltage.
 */
export function simulateCommand(argv: ReadonlyArray<string>): string {
  const { spec, safeVoltageV, flags } = ladderFromArguments(argv);
  const cycles = numberFlag(flags, 'cycles');
  const result = runLadder(spec, {
    until: cycles !== undefined ? { cycles } : 'steady',
    maxStepPerPeriod: numberFlag(flags, 'max-step-per-period') ?? 200,
    ...(flags.has('discharge') ? { dischargeToV: safeVoltageV } : {}),
  });
  const summary = {
    outputMeanV: result.outputMeanV,
    ripplePeakToPeakV: result.ripplePeakToPeakV,
    timeToSteadyStateS: result.timeToSteadyStateS,
    ...(result.discharge ? { dischargeTimeS: result.discharge.dischargeTimeS, trappedChargeC: result.discharge.trappedChargeC } : {}),
    cyclesSimulated: result.cyclesSimulated,
    method: result.method,
    periodicSteadyState: result.periodicSteadyState,
  };
  return JSON.stringify(summary, null, 2);
}
