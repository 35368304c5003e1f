import { readFileSync } from 'node:fs';
import { validateDesign } from '../../src/designs/validate-design';
import { DomainError } from '../../src/errors';
import { ladderSpecFromDesign, type LadderCircuitSpec } from '../../src/circuits/build-ladder-circuit';
import { runLadder } from '../../src/runs/ladder-runs';
import { runDriverDesign } from '../../src/runs/driver-runs';
import type { Design } from '../../src/designs/design.types';
import { ladderInputFromFlags, parseArguments, quantityFlag } from '../ladder-flags';

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

/** The design of `DESIGN.json` when its drive is a driver stage (simulated whole, transistor and transformer). */
function driverDesignOf(argv: ReadonlyArray<string>): Design | null {
  const { positional } = parseArguments(argv);
  if (!positional[0]) return null;
  const design = validateDesign(JSON.parse(readFileSync(positional[0], 'utf8')));
  return design.drive.kind === 'driver' ? design : null;
}

/** The ladder spec from `DESIGN.json` (first positional argument) or from bare-ladder flags, and the safe voltage. */
export function ladderFromArguments(argv: ReadonlyArray<string>): {
  spec: LadderCircuitSpec;
  safeVoltageV: number;
  flags: Map<string, string | true>;
} {
  const { positional, flags } = parseArguments(argv);
  if (positional[0]) {
    const design = validateDesign(JSON.parse(readFileSync(positional[0], 'utf8')));
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
 * time to steady state, cycles simulated, method, and with --discharge the time to the safe voltage.
 * A driver design starts warm (ladder at the engine's steady-state estimate) and runs until settled;
 * `--cold` is the push-button start from an empty ladder, `--window-ms N` simulates exactly N ms.
 */
export function simulateCommand(argv: ReadonlyArray<string>): string {
  const driverDesign = driverDesignOf(argv);
  if (driverDesign) {
    const { flags } = parseArguments(argv);
    const windowMs = numberFlag(flags, 'window-ms');
    const result = runDriverDesign(driverDesign, {
      start: flags.has('cold') ? 'cold' : 'warm',
      ...(windowMs !== undefined ? { windowS: windowMs * 1e-3 } : {}),
      ...(flags.has('discharge')
        ? { dischargeToV: quantityFlag(flags, 'safe-voltage', 'V') ?? driverDesign.targets.safeVoltageV }
        : {}),
    });
    const dissipatedJ = Object.values(result.energy.dissipatedJ).reduce((a, b) => a + b, 0);
    return JSON.stringify(
      {
        outputMeanV: result.outputMeanV,
        ripplePeakToPeakV: result.ripplePeakToPeakV,
        timeToSteadyStateS: result.timeToSteadyStateS,
        cyclesSimulated: result.cyclesSimulated,
        method: result.method,
        start: result.start,
        isSettled: result.isSettled,
        extrapolations: result.extrapolations,
        ...(result.discharge
          ? { dischargeTimeS: result.discharge.dischargeTimeS, trappedChargeC: result.discharge.trappedChargeC }
          : {}),
        oscillationFrequencyHz: result.oscillationFrequencyHz,
        energy: { suppliedJ: result.energy.suppliedJ, dissipatedJ, storedChangeJ: result.energy.storedChangeJ },
      },
      null,
      2,
    );
  }
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
    ...(result.discharge
      ? { dischargeTimeS: result.discharge.dischargeTimeS, trappedChargeC: result.discharge.trappedChargeC }
      : {}),
    cyclesSimulated: result.cyclesSimulated,
    method: result.method,
    periodicSteadyState: result.periodicSteadyState,
  };
  return JSON.stringify(summary, null, 2);
}
