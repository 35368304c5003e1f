import type { DriverStage } from './driver-stage.types';

/**
 * Demo drivers of the invented Northfold Instruments scenario (NAMING.md). Values are invented, chosen to
 * be plausible for the product line; no vendor parts.
 */
export const driverExamples: Readonly<Record<'surfaceChargeTester', DriverStage>> = {
  /** Handheld surface-charge tester: two alkaline cells, blocking oscillator with a feedback winding. */
  surfaceChargeTester: {
    supply: {
      kind: 'cells',
      chemistry: 'alkaline',
      cellsInSeries: 2,
      capacityAh: 2.5,
      internalResistanceOhm: 0.15,
      endVoltagePerCellV: 0.9,
    },
    transformer: {
      primaryTurns: 20,
      feedbackTurns: 8,
      secondaryTurns: 1200,
      primaryInductanceH: 1e-3,
      couplingCoefficient: 0.98,
      primaryResistanceOhm: 0.1,
      feedbackResistanceOhm: 0.1,
      secondaryResistanceOhm: 60,
      saturationCurrentA: 0.6,
      // Forward-fed, as every design stored before the phasing was a field.
      secondaryPhasing: 'forward',
      insulation: { ratedVoltageV: 3000 },
    },
    transistor: {
      forwardBeta: 100,
      reverseBeta: 2,
      vbeOnV: 0.7,
      vceSatV: 0.2,
      vceoMaxV: 40,
      icMaxA: 1,
    },
    baseResistorOhm: 4700,
    clamp: { kind: 'zener', clampVoltageV: 30 },
    switchOnTimeS: 0.05,
  },
};
