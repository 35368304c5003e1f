import type { MethodInfo } from '../methods';
import type { TransformerSection, TransformerWinding } from './transformer.types';

export const LAYOUT_METHOD: MethodInfo = {
  methodId: 'transformer.winding-layout',
  summary:
    'Turns per layer = usable breadth / wire diameter over enamel; layers to hold the turns; build = layers·diameter + layer tape; each winding’s turn length grows by 2π per metre of radius from the bobbin’s mean turn.',
  assumptions: [
    'orthocyclic packing not assumed: layers stack by the full diameter over enamel',
    'usable breadth = bobbin breadth − 2 × end margin',
    'one wrap of winding tape over the outer winding',
  ],
  source: 'common practice, no source',
};

/** Window utilization factor Ku, copper area over window area, of a wound transformer. */
export const WINDOW_UTILIZATION_LIMIT = 0.4;

/** Layout of one winding on the bobbin. */
export interface WindingLayout {
  winding: TransformerWinding;
  turnsPerLayer: number;
  layers: number;
  buildM: number;
  /** Distance from the bobbin surface to the winding's inner face (m). */
  innerRadiusOffsetM: number;
  meanTurnLengthM: number;
  /** Turns that fit in one layer of the usable breadth (may be fewer than turnsPerLayer when forced). */
  layerCapacity: number;
}

export interface SectionLayout {
  windings: WindingLayout[];
  usableBreadthM: number;
  /** Radial build of all windings and tapes (m). */
  totalBuildM: number;
  buildFill: number;
  /** Copper area of all windings over the window area. */
  windowFill: number;
  /** Insulation between adjacent windings: wraps × thickness (m). */
  windingTapeM: number;
}

/** Thickness of the tape between the layers of a winding (m). */
export function layerTapeM(section: TransformerSection, winding: TransformerWinding): number {
  return (winding.layerTapeWraps ?? 0) * (section.layerTape?.thicknessM ?? 0);
}

/** Lays the windings out from the core outward: turns per layer, layers, build, mean turn length, fills. */
export function layoutSection(section: TransformerSection): SectionLayout {
  const core = section.core;
  const usableBreadthM = Math.max(0, core.bobbinBreadthM - 2 * (section.endMarginM ?? 0));
  const windingTapeM = section.windingTapeWraps * section.windingTape.thicknessM;
  let offsetM = 0;
  let copperAreaM2 = 0;
  const windings = section.windings.map((winding, i) => {
    const layerCapacity = Math.max(1, Math.floor(usableBreadthM / winding.wire.overallDiameterM));
    const layers = winding.layers ?? Math.ceil(winding.turns / layerCapacity);
    const turnsPerLayer = Math.ceil(winding.turns / layers);
    const buildM = layers * winding.wire.overallDiameterM + (layers - 1) * layerTapeM(section, winding);
    const innerRadiusOffsetM = offsetM + (i > 0 ? windingTapeM : 0);
    const centreM = innerRadiusOffsetM + buildM / 2;
    const meanTurnLengthM = Math.max(
      core.meanTurnLengthM / 4,
      core.meanTurnLengthM + 2 * Math.PI * (centreM - core.bobbinHeightM / 2),
    );
    offsetM = innerRadiusOffsetM + buildM;
    copperAreaM2 += (winding.turns * Math.PI * winding.wire.copperDiameterM ** 2) / 4;
    return { winding, turnsPerLayer, layers, buildM, innerRadiusOffsetM, meanTurnLengthM, layerCapacity };
  });
  const totalBuildM = offsetM + section.windingTape.thicknessM;
  return {
    windings,
    usableBreadthM,
    totalBuildM,
    buildFill: totalBuildM / core.bobbinHeightM,
    windowFill: copperAreaM2 / core.windowAreaM2,
    windingTapeM,
  };
}
