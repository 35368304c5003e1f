import type { MethodInfo } from '../methods';
import type { TapeKind, WireKind } from './transformer.types';

export const LAYER_VOLTAGE_METHOD: MethodInfo = {
  methodId: 'transformer.layer-voltage',
  summary:
    'Volts per turn = peak winding voltage / turns; a layer spans turns-per-layer × volts per turn end to end; adjacent layers of a winding wound back and forth stand twice that at the ends where they do not meet.',
  assumptions: [
    'voltage shared evenly by the turns (no resonance along the winding)',
    'layer insulation = the enamel of both wires (the wire’s breakdown voltage, measured across two films) plus the layer tape',
  ],
  source: 'common practice, no source',
};

/** Voltages within one winding of `turns` turns laid `turnsPerLayer` to a layer in `layers` layers. */
export function layerVoltages(peakV: number, turns: number, turnsPerLayer: number, layers: number) {
  const turnToTurnV = Math.abs(peakV) / turns;
  const layerEndToEndV = turnToTurnV * Math.min(turns, turnsPerLayer);
  return { turnToTurnV, layerEndToEndV, layerToLayerV: layers > 1 ? 2 * layerEndToEndV : 0 };
}

/** Breakdown voltage (V) of `wraps` wraps of a tape. */
export function tapeBreakdownV(tape: TapeKind | undefined, wraps: number): number {
  return tape ? wraps * tape.thicknessM * tape.dielectricStrengthVPerM : 0;
}

/** Breakdown voltage (V) between adjacent layers: both enamels (the wire's figure) plus the layer tape. */
export function layerInsulationV(wire: WireKind, tape: TapeKind | undefined, wraps: number): number {
  return wire.breakdownVoltageV + tapeBreakdownV(tape, wraps);
}
