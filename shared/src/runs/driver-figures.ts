import type { Circuit, CircuitElement } from '../sim/circuit.types';
import type { EnergyAccount } from '../sim/energy-meter';
import { oscillationFigures } from '../sim/oscillation-measures';
import { windowExtremes } from '../sim/waveform-measures';
import type { DriverFigures, DriverLossKind } from './driver-run.types';

/** Samples of a driver run at each time step (V, and A for the primary): output, collector, secondary, primary, supply. */
export interface DriverWaveSamples {
  out: number[];
  col: number[];
  sec: number[];
  pri: number[];
  vcc: number[];
}

/** Loss kind of a driver circuit element by its name (build-driver-circuit.ts, build-circuit.ts); null for the load. */
export function lossKindOf(element: CircuitElement): DriverLossKind | null {
  const name = element.name;
  if (name === 'Rload' || name === 'Iload') return null;
  if (element.kind === 'npn') return 'transistor';
  if (element.kind === 'coupled-inductors' || element.kind === 'inductor') return 'windingCopper';
  if (name === 'Dz' || name === 'Dc' || name === 'Rclp') return 'clamp';
  if (name === 'Rsn') return 'snubber';
  if (name === 'Rb') return 'baseResistor';
  if (name === 'Rcol') return 'collectorResistor';
  if (name === 'Rsrc') return 'supplyResistance';
  if (name === 'Rbleed') return 'bleeder';
  if (name === 'Rout') return 'outputResistor';
  if (name === 'Ilamp') return 'indicatorLamp';
  if (element.kind === 'diode') return 'ladderDiodes';
  return 'other';
}

/** Bench figures of whole cycles (oscillation-measures.ts) with the power account of the same span. */
export function driverFigures(
  circuit: Circuit,
  timeS: ReadonlyArray<number>,
  wave: DriverWaveSamples,
  energy: EnergyAccount,
  spanS: number,
): DriverFigures | null {
  const osc = oscillationFigures(
    timeS,
    wave.pri,
    wave.col.map((v, i) => v - wave.vcc[i]!),
    wave.out,
  );
  if (!osc || !(spanS > 0)) return null;
  const col = windowExtremes(timeS, wave.col, osc.fromS, osc.toS);
  const sec = windowExtremes(timeS, wave.sec, osc.fromS, osc.toS);
  return {
    cycles: osc.cycles,
    oscillationFrequencyHz: osc.frequencyHz,
    measuredFromS: osc.fromS,
    measuredToS: osc.toS,
    isIrregular: osc.isIrregular,
    dutyOnFraction: osc.dutyOnFraction,
    primaryCurrentPeakA: osc.primaryCurrentPeakA,
    collectorVoltagePeakV: col.max,
    secondaryVoltagePeakPositiveV: sec.max,
    secondaryVoltagePeakNegativeV: sec.min,
    ...driverPowers(circuit, energy, spanS),
  };
}

/** Input and output power, efficiency and losses by kind (W) of an energy account over `spanS` seconds. */
export function driverPowers(
  circuit: Circuit,
  energy: EnergyAccount,
  spanS: number,
): Pick<DriverFigures, 'inputPowerW' | 'outputPowerW' | 'efficiency' | 'lossesW'> {
  const lossesW: Partial<Record<DriverLossKind, number>> = {};
  let outputJ = 0;
  for (const e of circuit.elements) {
    const j = energy.dissipatedJ[e.name];
    if (j === undefined) continue;
    const kind = lossKindOf(e);
    if (kind === null) outputJ += j;
    else lossesW[kind] = (lossesW[kind] ?? 0) + j / spanS;
  }
  const inputPowerW = energy.suppliedJ / spanS;
  const outputPowerW = outputJ / spanS;
  return { inputPowerW, outputPowerW, efficiency: inputPowerW > 0 ? outputPowerW / inputPowerW : 0, lossesW };
}
