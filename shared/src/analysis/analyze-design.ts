import type { Design, DischargeRule, PulseDrive, SineDrive } from '../designs/design.types';
import type { DriverReport } from '../driver/driver-report';
import type { MethodInfo } from '../methods';
import { isFlybackFed } from '../driver/operating-point';
import { pulseDriveOf } from '../driver/ladder-load-line';
import { DISCHARGE_METHOD, dischargeCheck, trappedChargeCheck } from '../safety/discharge';
import { creepageChecks, stageSpacing } from '../safety/creepage';
import type { StageSpacing } from '../safety/creepage';
import { HV_CAUTION, upperLimitVerdict } from '../safety/hazard-limits';
import { STORED_ENERGY_METHOD, storedEnergy, storedEnergyChecks } from '../safety/stored-energy';
import type { StoredEnergySummary } from '../safety/stored-energy';
import type { CheckVerdict } from '../safety/check.types';
import { analyzeLadder, operatingFigures, prepareLadder } from '../multiplier/analyze-ladder';
import { ENGINE_VERSION } from '../multiplier/engine-version';
import { ladderCurves } from '../multiplier/ladder-curves';
import { bleederStressChecks, ladderStressChecks } from '../multiplier/ladder-stress';
import type { LadderAnalysis, LadderCurves, LadderInput } from '../multiplier/ladder.types';
import type { TransformerReport } from '../transformer/transformer.types';
import { driverAtRatedLoad, ratedPoint, underDrive } from './design-drive';
import { transformerDriverEffect } from './transformer-effect';
import { designedTransformerReport, withGivenTransformer } from './transformer-report';
import { ladderDischargePhases } from './ladder-discharge';

export { ladderInputOf, ratedPoint, resolveDrive } from './design-drive';
export type { RatedPoint } from './design-drive';

/** Report of a bare ladder: figures (SI, signed by polarity), curves, stored energy, discharge and how each was computed. */
export interface LadderReport extends Pick<
  LadderAnalysis,
  'noLoadOutputV' | 'outputMeanV' | 'outputMinV' | 'outputMaxV' | 'ripplePeakToPeakV' | 'droopV' | 'outputImpedanceOhm'
> {
  engineVersion: string;
  /** Best whole number of stages at the design load (the model's output-vs-stages scan). */
  optimumStages: number;
  /** The published closed form n_opt = √(Vmax·f·C/I) as a continuous value (J. Lux; FOSSEE companions, read); null where it does not apply. */
  optimumStagesClosedForm: number | null;
  textbookRippleV: number | null;
  textbookDropV: number | null;
  storedEnergyJ: number;
  storedChargeC: number;
  /** Bleeder discharge from the operating voltage to the safe voltage; null without a bleeder or a safe voltage. */
  dischargeTimeS: number | null;
  /** The same to the discharge rule's voltage (what its check judges and a simulation runs to); absent in older reports. */
  dischargeTimeToRuleS?: number | null;
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
  /** The driver stage joined to the ladder; null unless the design's drive is a driver stage. */
  driver: DriverReport | null;
  /** The designed transformer at the driver's rated load; absent with a given transformer. */
  transformer?: TransformerReport;
  /** Output with no external load and no bleeder (V, signed); a driver's flyback then rises to its clamp limit. */
  openCircuitOutputV: number;
  /** |open-circuit − loaded output| (V): the droop of the load and the bleeder together (`droopV` keeps the bleeder in both). */
  droopWithBleederV: number;
  /** Power the bleeder takes at the operating point (W). */
  bleederPowerW: number;
  /** Power the ladder delivers at its top: the load, the series output resistor and the bleeder (W). */
  ladderOutputPowerW: number;
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
  let discharge: ReturnType<typeof dischargeCheck> | null = null;
  if (options.safeVoltageV !== undefined) {
    discharge = dischargeCheck({
      bleederOhm: input.bleederOhm,
      phases: ladderDischargePhases(analysis, energy),
      safeVoltageV: options.safeVoltageV,
      rule: options.dischargeRule ?? { voltageV: options.safeVoltageV, timeS: 60 },
      storedChargeC: energy.outputEquivalentChargeC,
    });
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
    optimumStagesClosedForm: analysis.textbook.optimumStages ?? null,
    textbookRippleV: analysis.textbook.rippleV,
    textbookDropV: analysis.textbook.dropV,
    storedEnergyJ: energy.totalEnergyJ,
    storedChargeC: energy.totalChargeC,
    dischargeTimeS: discharge?.dischargeTimeS ?? null,
    dischargeTimeToRuleS: discharge?.dischargeTimeToRuleS ?? null,
    analysis,
    curves,
    storedEnergy: energy,
    checks,
    methods: [
      analysis.method,
      analysis.nodeMethod,
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
  summary:
    'The driver stage’s closed-form estimate gives the secondary as rectangular pulses: forward peak for the on-time, flyback peak for the flyback time.',
  assumptions: [
    'the secondary is taken as a voltage source at the estimated peaks behind the secondary winding resistance',
    'the driver’s deliverable power is checked against what the ladder draws',
  ],
  source:
    'closed-form blocking-oscillator estimate: i = (Vin − Vce,sat)·t/Lp, E = ½·Lp·Ipk² (Wikipedia "Blocking oscillator", read; Pressman, from memory)',
};

const DRIVER_OPERATING_METHOD: MethodInfo = {
  methodId: 'driver-headline-at-operating-point-v1',
  summary:
    'For a driver design the headline output, ripple and curves are the ladder at the operating point’s drive (flyback held where the driver’s power meets the ladder); no-load output from the operating curve at zero load; component stress at the clamp-limited flyback, the worst case.',
  assumptions: ['the secondary is rectangular pulses at the estimated peaks behind the secondary winding resistance'],
  source: 'driver-ladder.power-balance-v2 with charge-transfer-v1',
};

/** Working voltage per stage: the largest capacitor or diode voltage within the stage. */
function stageWorkingVoltages(analysis: LadderAnalysis): number[] {
  const byStage = new Map<number, number>();
  for (const c of analysis.capacitors) byStage.set(c.stage, Math.max(byStage.get(c.stage) ?? 0, c.maxVoltageV));
  return [...byStage.entries()].sort((a, b) => a[0] - b[0]).map(([, v]) => v);
}

/**
 * Full report of a validated design: steady-state analysis, curves, stored energy, discharge, spacing and
 * every check verdict, with method notes, and HV_CAUTION once for all of them (`caution`).
 */
export function analyzeDesign(givenDesign: Design): DesignReport {
  const { design, limitInput, deliverablePowerW, drive, driver, input } = ratedPoint(givenDesign);
  const targets = design.targets;
  const base = analyzeLadderReport(input, { safeVoltageV: targets.safeVoltageV, dischargeRule: targets.dischargeRule });
  const { analysis } = base;
  // Components are stressed most at the lightest load the design runs at: no external load, the bleeder
  // still drawing. A power-limited driver's flyback rises towards its clamp there, but only as far as the
  // operating point at that load (the bleeder's current holds it), not to the open-circuit limit.
  const lightest = driver?.operatingPoint.curve[0];
  const stressAnalysis =
    design.drive.kind === 'driver' && lightest
      ? analyzeLadder({
          ...limitInput,
          drive: pulseDriveOf(
            {
              forwardPeakV: lightest.forwardSecondaryPeakV,
              flybackPeakV: lightest.flybackSecondaryPeakV,
              frequencyHz: lightest.frequencyHz,
              dutyCycle: lightest.dutyCycle,
              isFlybackFed: isFlybackFed(design.drive.driver),
            },
            design.drive.driver.transformer.secondaryResistanceOhm,
          ),
          load: null,
        })
      : analysis;

  const checks: CheckVerdict[] = [...ladderStressChecks(stressAnalysis, design.multiplier)];
  const peakTopV =
    Math.max(Math.abs(stressAnalysis.outputMaxV), Math.abs(stressAnalysis.outputMinV)) +
    stressAnalysis.loadCurrentA * input.seriesOutputResistanceOhm;
  checks.push(...bleederStressChecks(design.outputNetwork.bleeder, stressAnalysis.ladderTopMeanV, peakTopV));
  checks.push(...base.checks);
  const windingEnd = stressAnalysis.capacitors.find(
    (c) => c.column.startsWith('oscillating') && c.stage === 1 && (c.index === 1 || stressAnalysis.cellCount % 2 === 1),
  );
  const trapped = trappedChargeCheck({
    windingEndCapacitorV: windingEnd ? windingEnd.maxVoltageV : null,
    windingEndCapacitorF: windingEnd?.valueF ?? 0,
    safeVoltageV: targets.safeVoltageV,
  });
  if (trapped) checks.push(trapped);
  const spacing = stageSpacing(stageWorkingVoltages(stressAnalysis), targets.spacing);
  checks.push(...creepageChecks(spacing, targets.spacing));
  if (deliverablePowerW !== null) {
    const drawnW = Math.abs(analysis.ladderTopMeanV) * analysis.ladderCurrentA;
    checks.push(
      upperLimitVerdict({
        id: 'driver-power',
        subject: 'driver stage',
        rule: 'power the ladder draws (output plus bleeder) against the driver’s deliverable power estimate; marginal within 20 % (common practice, no source)',
        value: drawnW,
        limit: deliverablePowerW,
        unit: 'W',
      }),
    );
  }
  if (driver) checks.push(...driver.checks);
  const designedTransformer = underDrive(() => designedTransformerReport(design, driver));
  const transformer = designedTransformer && {
    ...designedTransformer,
    driverEffect: transformerDriverEffect(
      givenDesign,
      { outputMeanV: analysis.outputMeanV, driver },
      driverAtRatedLoad(withGivenTransformer(givenDesign)),
    ),
  };
  if (transformer) checks.push(...transformer.checks);
  const rippleOk = analysis.ripplePeakToPeakV <= targets.rippleMaxV;
  const outputOk =
    Math.sign(analysis.outputMeanV) === Math.sign(targets.outputV) &&
    Math.abs(analysis.outputMeanV) >= Math.abs(targets.outputV);
  const noLoadOutputV = driver
    ? Math.sign(analysis.outputMeanV || 1) * (driver.operatingPoint.curve[0]?.outputV ?? 0)
    : base.noLoadOutputV;
  const openCircuitOutputV = operatingFigures(
    prepareLadder({ ...limitInput, load: null, bleederOhm: null }),
  ).outputMeanV;
  const bleederPowerW = Math.abs(analysis.ladderTopMeanV) * analysis.bleederCurrentA;
  // Field by field in the ladder report's order (a spread of it and the fields added after cost more than the
  // rest of this function); the transformer last, where the design has one.
  const report: DesignReport = {
    engineVersion: base.engineVersion,
    noLoadOutputV,
    outputMeanV: base.outputMeanV,
    outputMinV: base.outputMinV,
    outputMaxV: base.outputMaxV,
    ripplePeakToPeakV: base.ripplePeakToPeakV,
    droopV: driver ? Math.abs(noLoadOutputV - analysis.outputMeanV) : base.droopV,
    outputImpedanceOhm: base.outputImpedanceOhm,
    optimumStages: base.optimumStages,
    optimumStagesClosedForm: base.optimumStagesClosedForm,
    textbookRippleV: base.textbookRippleV,
    textbookDropV: base.textbookDropV,
    storedEnergyJ: base.storedEnergyJ,
    storedChargeC: base.storedChargeC,
    dischargeTimeS: base.dischargeTimeS,
    dischargeTimeToRuleS: base.dischargeTimeToRuleS,
    analysis,
    curves: base.curves,
    storedEnergy: base.storedEnergy,
    checks,
    methods: driver
      ? [...base.methods, DRIVER_METHOD, driver.operatingPoint.method, DRIVER_OPERATING_METHOD]
      : base.methods,
    caution: base.caution,
    openCircuitOutputV,
    droopWithBleederV: Math.abs(openCircuitOutputV - analysis.outputMeanV),
    bleederPowerW,
    ladderOutputPowerW: Math.abs(analysis.ladderTopMeanV) * analysis.ladderCurrentA,
    designName: design.name,
    resolvedDrive: drive,
    meetsTargets: { output: outputOk, ripple: rippleOk },
    spacing,
    driver,
  };
  if (transformer) report.transformer = transformer;
  return report;
}

/** Convenience for callers that want the verdicts only. */
export function evaluateChecks(design: Design): CheckVerdict[] {
  return analyzeDesign(design).checks;
}
