import { DomainError } from '../errors';
import type { Design, DischargeRule, PulseDrive, SineDrive } from '../designs/design.types';
import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import type { MethodInfo } from '../driver/driver.types';
import { DISCHARGE_METHOD, dischargeCheck, trappedChargeCheck } from '../safety/discharge';
import { creepageChecks, stageSpacing } from '../safety/creepage';
import type { StageSpacing } from '../safety/creepage';
import { HV_CAUTION, upperLimitVerdict } from '../safety/hazard-limits';
import { STORED_ENERGY_METHOD, storedEnergy, storedEnergyChecks } from '../safety/stored-energy';
import type { StoredEnergySummary } from '../safety/stored-energy';
import type { CheckVerdict } from '../safety/check.types';
import { analyzeLadder } from './analyze-ladder';
import { ENGINE_VERSION } from './engine-version';
import { ladderCurves } from './ladder-curves';
import { bleederStressChecks, ladderStressChecks } from './ladder-stress';
import type { LadderAnalysis, LadderCurves, LadderInput } from './ladder.types';

/** Report of a bare ladder: figures (SI, signed by polarity), curves, stored energy, discharge and how each was computed. */
export interface LadderReport
  extends Pick<
    LadderAnalysis,
    'noLoadOutputV' | 'outputMeanV' | 'outputMinV' | 'outputMaxV' | 'ripplePeakToPeakV' | 'droopV' | 'outputImpedanceOhm'
  > {
  engineVersion: string;
  optimumStages: number;
  textbookRippleV: number | null;
  textbookDropV: number | null;
  storedEnergyJ: number;
  storedChargeC: number;
  /** Bleeder discharge from the operating voltage to the safe voltage; null without a bleeder or a safe voltage. */
  dischargeTimeS: number | null;
  analysis: LadderAnalysis;
  curves: LadderCurves;
  storedEnergy: StoredEnergySummary;
  checks: CheckVerdict[];
  methods: MethodInfo[];
  caution: string;
}

/** The full report of one design: the ladder report plus the design's targets, spacing and part checks. */
export interface DesignReport extends LadderReport {
  designName: string;
  /** The secondary the ladder sees (resolved from a driver stage when the design gives one). */
  resolvedDrive: SineDrive | PulseDrive;
  meetsTargets: { output: boolean; ripple: boolean };
  spacing: StageSpacing[];
}

export interface LadderReportOptions {
  safeVoltageV?: number;
  dischargeRule?: DischargeRule;
}

/**
 * Report of a bare ladder: steady-state analysis, curves, stored energy with its IEC checks and, with a
 * bleeder and a safe voltage, the discharge time and its check.
 */
export function analyzeLadderReport(input: LadderInput, options: LadderReportOptions = {}): LadderReport {
  const analysis = analyzeLadder(input);
  const curves = ladderCurves(input);
  const energy = storedEnergy(analysis.capacitors, analysis.ladderTopMeanV);
  const checks: CheckVerdict[] = [...storedEnergyChecks(energy, analysis.ladderTopMeanV)];
  let dischargeTime: number | null = null;
  if (options.safeVoltageV !== undefined) {
    const discharge = dischargeCheck({
      bleederOhm: input.bleederOhm,
      equivalentCapacitanceF: energy.outputEquivalentCapacitanceF,
      outputV: analysis.ladderTopMeanV,
      safeVoltageV: options.safeVoltageV,
      rule: options.dischargeRule ?? { voltageV: options.safeVoltageV, timeS: 60 },
      storedChargeC: energy.outputEquivalentChargeC,
    });
    dischargeTime = discharge.dischargeTimeS;
    checks.push(discharge.verdict);
  }
  return {
    engineVersion: ENGINE_VERSION,
    noLoadOutputV: analysis.noLoadOutputV,
    outputMeanV: analysis.outputMeanV,
    outputMinV: analysis.outputMinV,
    outputMaxV: analysis.outputMaxV,
    ripplePeakToPeakV: analysis.ripplePeakToPeakV,
    droopV: analysis.droopV,
    outputImpedanceOhm: analysis.outputImpedanceOhm,
    optimumStages: curves.optimumStages,
    textbookRippleV: analysis.textbook.rippleV,
    textbookDropV: analysis.textbook.dropV,
    storedEnergyJ: energy.totalEnergyJ,
    storedChargeC: energy.totalChargeC,
    dischargeTimeS: dischargeTime,
    analysis,
    curves,
    storedEnergy: energy,
    checks,
    methods: [
      analysis.method,
      analysis.textbook.method,
      curves.method,
      STORED_ENERGY_METHOD,
      ...(options.safeVoltageV !== undefined ? [DISCHARGE_METHOD] : []),
    ],
    caution: HV_CAUTION,
  };
}

const DRIVER_METHOD: MethodInfo = {
  methodId: 'driver-to-pulse-v1',
  summary: 'The driver stage’s closed-form estimate gives the secondary as rectangular pulses: forward peak for the on-time, flyback peak for the flyback time.',
  assumptions: [
    'the secondary is taken as a voltage source at the estimated peaks behind the secondary winding resistance',
    'the driver’s deliverable power is checked against what the ladder draws',
  ],
  source: 'shared/src/driver estimateBlockingOscillator (REFERENCES.md §3)',
};

/** Resolves the drive of a design into the waveform the ladder model takes. */
export function resolveDrive(design: Design): { drive: SineDrive | PulseDrive; deliverablePowerW: number | null; currentLimitA: number | null } {
  const drive = design.drive;
  if (drive.kind !== 'driver') return { drive, deliverablePowerW: null, currentLimitA: null };
  let estimate: ReturnType<typeof estimateBlockingOscillator>;
  try {
    estimate = estimateBlockingOscillator(drive.driver);
  } catch (error) {
    // The driver names its fields from the driver stage; in a design they sit under `drive.`.
    if (error instanceof DomainError && error.field?.startsWith('driver')) {
      throw new DomainError(error.code, error.message, `drive.${error.field}`);
    }
    throw error;
  }
  const onS = estimate.onTimeS.value;
  const flybackS = estimate.flybackTimeS.value;
  return {
    drive: {
      kind: 'pulse',
      forwardPeakV: estimate.forwardSecondaryPeakV.value,
      flybackPeakV: estimate.flybackSecondaryPeakV.value,
      frequencyHz: estimate.frequencyHz.value,
      dutyCycle: onS / (onS + flybackS),
      sourceResistanceOhm: drive.driver.transformer.secondaryResistanceOhm,
    },
    deliverablePowerW: estimate.deliverablePowerW.value,
    // The flyback current the secondary can carry is the collector peak reflected through the turns ratio.
    currentLimitA: (estimate.collectorPeakCurrentA.value * drive.driver.transformer.primaryTurns) / drive.driver.transformer.secondaryTurns,
  };
}

/** The bare-ladder input of a design. */
export function ladderInputOf(design: Design, drive: SineDrive | PulseDrive, currentLimitA: number | null = null): LadderInput {
  const bleeder = design.outputNetwork.bleeder;
  return {
    ...(currentLimitA !== null ? { sourceCurrentLimitA: currentLimitA } : {}),
    ...(design.multiplier.strayCapacitanceF ? { strayCapacitanceF: design.multiplier.strayCapacitanceF } : {}),
    topology: design.multiplier.topology,
    capacitorsF: design.multiplier.capacitors.map((c) => c.valueF),
    drive,
    diode: design.multiplier.diode,
    polarity: design.targets.outputV < 0 ? -1 : 1,
    load: design.load,
    bleederOhm: bleeder ? bleeder.count * bleeder.valueOhm : null,
    seriesOutputResistanceOhm: design.outputNetwork.seriesOutputResistanceOhm,
  };
}

/** Working voltage per stage: the largest capacitor or diode voltage within the stage. */
function stageWorkingVoltages(analysis: LadderAnalysis): number[] {
  const byStage = new Map<number, number>();
  for (const c of analysis.capacitors) byStage.set(c.stage, Math.max(byStage.get(c.stage) ?? 0, c.maxVoltageV));
  return [...byStage.entries()].sort((a, b) => a[0] - b[0]).map(([, v]) => v);
}

/**
 * Full report of a validated design: steady-state analysis, curves, stored energy, discharge, spacing and
 * every check verdict, with method notes. Safety verdicts carry HV_CAUTION.
 */
export function analyzeDesign(design: Design): DesignReport {
  if (design.multiplier.strayCapacitanceF !== undefined && !(design.multiplier.strayCapacitanceF >= 0)) {
    throw new DomainError('invalid_design', 'stray capacitance must not be negative', 'multiplier.strayCapacitanceF');
  }
  const { drive, deliverablePowerW, currentLimitA } = resolveDrive(design);
  const input = ladderInputOf(design, drive, currentLimitA);
  const targets = design.targets;
  const base = analyzeLadderReport(input, { safeVoltageV: targets.safeVoltageV, dischargeRule: targets.dischargeRule });
  const { analysis } = base;

  const checks: CheckVerdict[] = [...ladderStressChecks(analysis, design.multiplier)];
  const peakTopV = Math.max(Math.abs(analysis.outputMaxV), Math.abs(analysis.outputMinV)) + analysis.loadCurrentA * input.seriesOutputResistanceOhm;
  checks.push(...bleederStressChecks(design.outputNetwork.bleeder, analysis.ladderTopMeanV, peakTopV));
  checks.push(...base.checks);
  const windingEnd = analysis.capacitors.find((c) => c.column.startsWith('oscillating') && c.stage === 1 && (c.index === 1 || analysis.cellCount % 2 === 1));
  const trapped = trappedChargeCheck({
    windingEndCapacitorV: windingEnd ? windingEnd.maxVoltageV : null,
    windingEndCapacitorF: windingEnd?.valueF ?? 0,
    safeVoltageV: targets.safeVoltageV,
  });
  if (trapped) checks.push(trapped);
  const spacing = stageSpacing(stageWorkingVoltages(analysis), targets.spacing);
  checks.push(...creepageChecks(spacing, targets.spacing));
  if (deliverablePowerW !== null) {
    const drawnW = Math.abs(analysis.ladderTopMeanV) * analysis.ladderCurrentA;
    checks.push(
      upperLimitVerdict({
        id: 'driver-power',
        subject: 'driver stage',
        rule: 'power the ladder draws (output plus bleeder) against the driver’s deliverable power estimate; marginal within 20 %',
        value: drawnW,
        limit: deliverablePowerW,
        unit: 'W',
      }),
    );
  }
  const rippleOk = analysis.ripplePeakToPeakV <= targets.rippleMaxV;
  const outputOk = Math.sign(analysis.outputMeanV) === Math.sign(targets.outputV) && Math.abs(analysis.outputMeanV) >= Math.abs(targets.outputV);
  return {
    ...base,
    designName: design.name,
    resolvedDrive: drive,
    meetsTargets: { output: outputOk, ripple: rippleOk },
    spacing,
    checks,
    methods: deliverablePowerW !== null ? [...base.methods, DRIVER_METHOD] : base.methods,
  };
}

/** Convenience for callers that want the verdicts only. */
export function evaluateChecks(design: Design): CheckVerdict[] {
  return analyzeDesign(design).checks;
}
