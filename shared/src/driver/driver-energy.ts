import type { DriverStage } from '../designs/driver-stage.types';
import type { MethodInfo } from '../methods';
import type { StageLosses } from './blocking-oscillator.types';
import type { LoadPoint } from './operating-point';

/** Where the supply's power goes besides the output, by element kind. */
export type LossKind =
  | 'transistorConduction'
  | 'transistorSwitching'
  | 'baseEmitter'
  | 'baseResistor'
  | 'primaryCopper'
  | 'collectorResistor'
  | 'secondaryCopper'
  | 'clamp'
  | 'core'
  | 'diodes'
  | 'bleeder'
  | 'seriesOutputResistor'
  | 'lamp'
  | 'supplyResistance';

/** The thermal path of the switching transistor. */
export interface TransistorThermal {
  /** Junction to ambient (°C/W). */
  thermalResistanceCPerW: number;
  maxJunctionTemperatureC: number;
  ambientTemperatureC: number;
}

/**
 * Defaults when the design gives no thermal figures (transistor.thermalResistanceCPerW,
 * transistor.maxJunctionTemperatureC, ambientTemperatureC): a small leaded transistor in free air, about 200 °C/W
 * junction to ambient, silicon junction limit 150 °C, 25 °C ambient (common practice, no source).
 */
export const DEFAULT_TRANSISTOR_THERMAL: TransistorThermal = {
  thermalResistanceCPerW: 200,
  maxJunctionTemperatureC: 150,
  ambientTemperatureC: 25,
};

/**
 * Clamp power ratings when the design gives none: a 0.5 W glass zener; for an RCD clamp a 0.25 W resistor,
 * which takes nearly all of the clamp's power (common practice, no source).
 */
export const DEFAULT_CLAMP_RATED_POWER_W = { zener: 0.5, rcd: 0.25 } as const;

/** Energy at the operating point (W unless stated). */
export interface DriverEnergy {
  /** Power from the supply's EMF. */
  inputPowerW: number;
  /** Power into the external load. */
  outputPowerW: number;
  /** outputPowerW / inputPowerW. */
  efficiency: number;
  losses: Record<LossKind, number>;
  transistor: TransistorThermal & {
    /** Collector conduction, switching and base-emitter junction power. */
    dissipationW: number;
    junctionTemperatureC: number;
    /** (Tj,max − T_ambient)/Rθ. */
    maxDissipationW: number;
    isDefaultThermal: boolean;
  };
  clamp: { kind: 'zener' | 'rcd' | 'none'; dissipationW: number; ratedPowerW: number | null; isDefaultRating: boolean };
  method: MethodInfo;
}

export const DRIVER_ENERGY_METHOD: MethodInfo = {
  methodId: 'driver-energy.operating-point-v1',
  summary:
    'Power balance at the operating point: supply EMF power = output + every loss. Stage: Kirchhoff along the primary loop per cycle (V·Q = Vce,sat·Q + R·∫i²dt + ½·Lp·Ipk²), base drive ∫V_B·I_B dt, turn-on discharge ½·C·Vin² of the collector node, leakage ½·(1 − k²)·Lp·Ipk² and the flyback the ladder does not take into the clamp, secondary copper of the triangular flyback current; ladder: what it takes from the secondary less the output, bleeder and series-resistor powers is the diodes’ share. Junction temperature Tj = T_ambient + P·Rθ.',
  assumptions: [
    'core loss: the design’s figure, taken from the stored energy (zero when none is given)',
    'the diodes’ share includes the secondary resistance’s loss in the ladder’s charging pulses',
    'junction temperature at the mean dissipation (pulses far shorter than the thermal time constant)',
  ],
  source:
    'energy conservation (Tellegen’s theorem); E = ½·Lp·Ipk² (common practice; Pressman, Switching Power Supply Design, from memory); Tj = Ta + P·Rθ (common practice, no source)',
};

/**
 * Where the power goes at one load point of the driver with its ladder (W): `stage` the stage's losses at
 * that point and the flyback power it offers. The ladder side needs the bleeder (Ω, null without) and the
 * series output resistor (Ω). Method: DRIVER_ENERGY_METHOD.
 */
export function driverEnergy(
  driver: DriverStage,
  point: LoadPoint,
  stage: { losses: StageLosses; deliverableW: number },
  network: { bleederOhm: number | null; seriesOutputResistanceOhm: number },
): DriverEnergy {
  const q = driver.transistor;
  const thermal: TransistorThermal = {
    thermalResistanceCPerW: q.thermalResistanceCPerW ?? DEFAULT_TRANSISTOR_THERMAL.thermalResistanceCPerW,
    maxJunctionTemperatureC: q.maxJunctionTemperatureC ?? DEFAULT_TRANSISTOR_THERMAL.maxJunctionTemperatureC,
    ambientTemperatureC: driver.ambientTemperatureC ?? DEFAULT_TRANSISTOR_THERMAL.ambientTemperatureC,
  };
  const isDefaultThermal = q.thermalResistanceCPerW === undefined;
  const s = stage.losses;
  const loadA = point.loadCurrentA;
  const topV = point.outputV + loadA * network.seriesOutputResistanceOhm;
  const bleederW = network.bleederOhm ? (topV * topV) / network.bleederOhm : 0;
  const seriesW = loadA * loadA * network.seriesOutputResistanceOhm;
  const takenW = point.ladderTakesW.forward + point.ladderTakesW.flyback;
  const clampW = s.leakageW + Math.max(0, stage.deliverableW - point.ladderTakesW.flyback);
  const losses: Record<LossKind, number> = {
    transistorConduction: s.transistorConductionW,
    transistorSwitching: s.transistorSwitchingW,
    baseEmitter: s.baseEmitterW,
    baseResistor: s.baseResistorW,
    primaryCopper: s.primaryCopperW,
    collectorResistor: s.collectorResistorW,
    secondaryCopper: s.secondaryCopperW,
    clamp: clampW,
    core: s.coreW,
    diodes: takenW - point.outputPowerW - bleederW - seriesW,
    bleeder: bleederW,
    seriesOutputResistor: seriesW,
    lamp: s.lampW,
    supplyResistance: s.supplyResistanceW,
  };
  const dissipationW = s.transistorConductionW + s.transistorSwitchingW + s.baseEmitterW;
  const clamp = driver.clamp;
  const ratedPowerW = clamp ? (clamp.ratedPowerW ?? DEFAULT_CLAMP_RATED_POWER_W[clamp.kind]) : null;
  return {
    inputPowerW: point.inputPowerW,
    outputPowerW: point.outputPowerW,
    efficiency: point.efficiency,
    losses,
    transistor: {
      ...thermal,
      dissipationW,
      junctionTemperatureC: thermal.ambientTemperatureC + dissipationW * thermal.thermalResistanceCPerW,
      maxDissipationW: (thermal.maxJunctionTemperatureC - thermal.ambientTemperatureC) / thermal.thermalResistanceCPerW,
      isDefaultThermal,
    },
    clamp: {
      kind: clamp?.kind ?? 'none',
      dissipationW: clampW,
      ratedPowerW,
      isDefaultRating: clamp !== undefined && clamp.ratedPowerW === undefined,
    },
    method: DRIVER_ENERGY_METHOD,
  };
}
