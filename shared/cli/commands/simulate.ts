import { readDesignFile } from '../design-file';
import { DomainError } from '../../src/errors';
import { ladderSpecFromDesign, type LadderCircuitSpec } from '../../src/circuits/build-ladder-circuit';
import { runLadder } from '../../src/runs/ladder-runs';
import { runDriverDesign } from '../../src/runs/driver-runs';
import { runDriverStartUp } from '../../src/runs/driver-start-up';
import type { Design } from '../../src/designs/design.types';
import { parseCommandArguments, type CommandSyntax, type ParsedArguments } from '../arguments';
import { LADDER_OPTIONS, ladderInputFromFlags, quantityFlag } from '../ladder-flags';

export const simulateSyntax: CommandSyntax = {
  command: 'simulate',
  options: {
    until: { type: 'string', value: 'steady', help: 'run until the output settles (the default)' },
    cycles: { type: 'string', value: 'N', help: 'run exactly N drive cycles instead' },
    'max-step-per-period': { type: 'string', value: 'N', help: 'at least N steps per drive period (default 200)' },
    discharge: { type: 'boolean', help: 'then switch off and time the discharge to the safe voltage' },
    cold: { type: 'boolean', help: 'driver design: push-button start from an empty ladder' },
    'window-ms': { type: 'string', value: 'N', help: 'driver design: simulate exactly N ms' },
    'max-start-ms': { type: 'string', value: 'N', help: 'driver design: longest start-up simulated (default 5000)' },
    ...LADDER_OPTIONS,
  },
  positionals: ['DESIGN.json'],
  positionalsOptional: true,
};
export const simulateSummary = 'time-domain run of a design or a bare ladder (simulator), as JSON';

function numberFlag(flags: Map<string, string | true>, name: string): number | undefined {
  const v = flags.get(name);
  if (v === undefined) return undefined;
  const n = Number(v);
  if (v === true || !Number.isFinite(n)) throw new DomainError('invalid_argument', `--${name} needs a number`, name);
  return n;
}

/** The simulator's ladder spec of the bare-ladder flags (cli/ladder-flags.ts, shared with `ladder`). */
export function ladderSpecFromFlags(flags: Map<string, string | true>): {
  spec: LadderCircuitSpec;
  safeVoltageV: number | undefined;
} {
  const { input, safeVoltageV } = ladderInputFromFlags(flags);
  const count = input.capacitorsF.length;
  const spec: LadderCircuitSpec = {
    topology: input.topology,
    cellCount: input.topology === 'full-wave' ? count / 3 : count,
    capacitorsF: input.capacitorsF,
    diode: input.diode,
    drive: input.drive,
    isNegative: input.polarity < 0,
    bleederOhm: input.bleederOhm,
    seriesOutputResistanceOhm: input.seriesOutputResistanceOhm,
    load: input.load,
  };
  return { spec, safeVoltageV };
}

/**
 * Refuses a design file together with options that shape a bare ladder: the file would win and the
 * options be lost (or the "file" is a stray value, as `nF` in `--cap 10 nF`).
 */
export function refuseDesignWithLadderOptions({ positional, flags }: ParsedArguments): void {
  if (!positional[0]) return;
  const shapeOption = [...flags.keys()].find((name) => name !== 'safe-voltage' && name in LADDER_OPTIONS);
  if (shapeOption !== undefined)
    throw new DomainError(
      'invalid_argument',
      `unexpected value "${positional[0]}": give DESIGN.json or ladder options (such as --${shapeOption}), not both`,
      positional[0],
    );
}

/** The design of `DESIGN.json` when its drive is a driver stage (simulated whole, transistor and transformer). */
export function driverDesignOf({ positional }: ParsedArguments): Design | null {
  if (!positional[0]) return null;
  const design = readDesignFile(positional[0]);
  return design.drive.kind === 'driver' ? design : null;
}

/** The ladder spec from `DESIGN.json` (first positional argument) or from bare-ladder flags, and the safe voltage. */
export function ladderFromArguments({ positional, flags }: ParsedArguments): {
  spec: LadderCircuitSpec;
  safeVoltageV: number;
  flags: Map<string, string | true>;
} {
  if (positional[0]) {
    const design = readDesignFile(positional[0]);
    return {
      spec: ladderSpecFromDesign(design),
      safeVoltageV: quantityFlag(flags, 'safe-voltage', 'V') ?? design.targets.safeVoltageV,
      flags,
    };
  }
  const { spec, safeVoltageV } = ladderSpecFromFlags(flags);
  return { spec, safeVoltageV: safeVoltageV ?? 50, flags };
}

/**
 * `ladderwright simulate DESIGN.json | <bare-ladder flags>` [--until steady | --cycles N]
 * [--max-step-per-period N] [--discharge] [--safe-voltage V]: JSON with the output's cycle mean, ripple,
 * time to 90 % of the final output and to within 1 % of it (with --until steady the start-up is followed by
 * envelope following over the cycle-to-cycle map, not cycle by cycle), periods simulated, method, whether it settled with the estimated remaining drift,
 * and with --discharge the time to the safe voltage.
 * A driver design starts warm (ladder at the engine's steady-state estimate) and runs until settled;
 * `--cold` is the push-button start from an empty ladder, `--window-ms N` simulates exactly N ms.
 */
export function simulateCommand(argv: ReadonlyArray<string>): string {
  const parsed = parseCommandArguments(argv, simulateSyntax);
  const until = parsed.flags.get('until');
  if (until !== undefined && until !== 'steady')
    throw new DomainError(
      'invalid_argument',
      `--until takes "steady", not "${String(until)}" (or give --cycles N)`,
      'until',
    );
  refuseDesignWithLadderOptions(parsed);
  const driverDesign = driverDesignOf(parsed);
  if (driverDesign) return JSON.stringify(simulateDriverDesign(driverDesign, parsed.flags), null, 2);
  const { spec, safeVoltageV, flags } = ladderFromArguments(parsed);
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
    timeTo1PercentS: result.timeTo1PercentS,
    ...(result.discharge
      ? { dischargeTimeS: result.discharge.dischargeTimeS, trappedChargeC: result.discharge.trappedChargeC }
      : {}),
    cyclesSimulated: result.cyclesSimulated,
    method: result.method,
    startUpMethod: result.startUpMethod,
    isSettled: result.isSettled,
    remainingDriftV: result.remainingDriftV,
    periodicSteadyState: result.periodicSteadyState,
  };
  return JSON.stringify(summary, null, 2);
}

/** Outputs of a warm and a cold steady state that differ by more than this fraction are two modes. */
const MODE_SPLIT_FRACTION = 0.05;

/**
 * A driver design: the steady state (warm start from the engine's estimate, cold when that fails, or
 * `--cold`; `--window-ms N` simulates exactly N ms) with its bench figures over whole cycles, and the cold
 * push-button start-up (time to 90 % and to within 1 % of the settled output, or the time within which it
 * did not settle; `--max-start-ms N` bounds it, default 5000). When the warm steady state and the cold
 * start settle on outputs more than 5 % apart, both are reported as two stable modes.
 */
function simulateDriverDesign(design: Design, flags: Map<string, string | true>): Record<string, unknown> {
  const windowMs = numberFlag(flags, 'window-ms');
  const maxStartMs = numberFlag(flags, 'max-start-ms') ?? 5000;
  const result = runDriverDesign(design, {
    start: flags.has('cold') ? 'cold' : 'warm',
    ...(windowMs !== undefined ? { windowS: windowMs * 1e-3 } : {}),
    ...(flags.has('discharge')
      ? { dischargeToV: quantityFlag(flags, 'safe-voltage', 'V') ?? design.targets.safeVoltageV }
      : {}),
  });
  const startUp = runDriverStartUp(design, { maxTimeS: maxStartMs * 1e-3 });
  const f = result.figures;
  const coldV = startUp.finalOutputV;
  const hasTwoModes =
    result.start === 'warm' &&
    result.isSettled &&
    coldV !== null &&
    Math.abs(result.outputMeanV - coldV) >
      MODE_SPLIT_FRACTION * Math.max(Math.abs(coldV), Math.abs(result.outputMeanV));
  const dissipatedJ = Object.values(result.energy.dissipatedJ).reduce((a, b) => a + b, 0);
  return {
    outputMeanV: result.outputMeanV,
    ripplePeakToPeakV: result.ripplePeakToPeakV,
    oscillationFrequencyHz: f?.oscillationFrequencyHz ?? null,
    /** The cycles' periods spread (bursts): the frequency above is their mean. */
    isOscillationIrregular: f?.isIrregular ?? null,
    /** Whole cycles the frequency was measured over (irregular cycles are counted until their mean holds still). */
    oscillationCyclesMeasured: f?.cycles ?? null,
    dutyOnFraction: f?.dutyOnFraction ?? null,
    primaryCurrentPeakA: f?.primaryCurrentPeakA ?? null,
    collectorVoltagePeakV: f?.collectorVoltagePeakV ?? null,
    secondaryVoltagePeakPositiveV: f?.secondaryVoltagePeakPositiveV ?? null,
    secondaryVoltagePeakNegativeV: f?.secondaryVoltagePeakNegativeV ?? null,
    inputPowerW: f?.inputPowerW ?? null,
    outputPowerW: f?.outputPowerW ?? null,
    efficiency: f?.efficiency ?? null,
    losses: f?.lossesW ?? null,
    timeTo90PercentS: startUp.timeTo90PercentS,
    timeTo1PercentS: startUp.timeTo1PercentS,
    isSettled: result.isSettled,
    startUpSettled: startUp.isSettled,
    ...(startUp.isSettled
      ? {}
      : { startUpNote: `not settled within ${(startUp.notSettledWithinS! * 1e3).toPrecision(3)} ms` }),
    startUpFinalOutputV: startUp.finalOutputV,
    ...(hasTwoModes
      ? {
          twoStableModes: {
            warm: { outputMeanV: result.outputMeanV, oscillationFrequencyHz: f?.oscillationFrequencyHz ?? null },
            cold: { outputMeanV: coldV, oscillationFrequencyHz: startUp.frequencyHz },
          },
        }
      : {}),
    start: result.start,
    ...(result.warmStartFallback ? { warmStartFallback: result.warmStartFallback } : {}),
    method: result.method,
    cyclesSimulated: result.cyclesSimulated + startUp.cyclesSimulated,
    extrapolations: result.extrapolations,
    ...(result.discharge
      ? { dischargeTimeS: result.discharge.dischargeTimeS, trappedChargeC: result.discharge.trappedChargeC }
      : {}),
    energy: { suppliedJ: result.energy.suppliedJ, dissipatedJ, storedChangeJ: result.energy.storedChangeJ },
  };
}
