import type { Part } from '../api/parts.types';
import type { CoreKind, TapeKind, WireKind } from '../transformer/transformer.types';

/** A shelf part as the transformer section carries it; null unless the part is a complete core. */
export function coreKindOf(part: Part): CoreKind | null {
  const {
    coreAreaM2,
    corePathLengthM,
    coreVolumeM3,
    windowAreaM2,
    bobbinBreadthM,
    bobbinHeightM,
    meanTurnLengthM,
    saturationFluxDensity25T,
    saturationFluxDensity100T,
    steinmetzK,
    steinmetzAlpha,
    steinmetzBeta,
    valueSi,
  } = part;
  if (
    part.kind !== 'core' ||
    valueSi === null ||
    coreAreaM2 === null ||
    corePathLengthM === null ||
    coreVolumeM3 === null ||
    windowAreaM2 === null ||
    bobbinBreadthM === null ||
    bobbinHeightM === null ||
    meanTurnLengthM === null ||
    saturationFluxDensity25T === null ||
    saturationFluxDensity100T === null ||
    steinmetzK === null ||
    steinmetzAlpha === null ||
    steinmetzBeta === null
  ) {
    return null;
  }
  return {
    code: part.code,
    effectiveAreaM2: coreAreaM2,
    pathLengthM: corePathLengthM,
    volumeM3: coreVolumeM3,
    windowAreaM2,
    bobbinBreadthM,
    bobbinHeightM,
    meanTurnLengthM,
    ungappedAlHPerTurn2: valueSi,
    saturationFluxDensity25T,
    saturationFluxDensity100T,
    steinmetzK,
    steinmetzAlpha,
    steinmetzBeta,
  };
}

/** A shelf part as a winding's wire; null unless the part is a complete wire. */
export function wireKindOf(part: Part): WireKind | null {
  const { copperDiameterM, overallDiameterM, enamelGrade, breakdownVoltageV } = part;
  if (
    part.kind !== 'wire' ||
    copperDiameterM === null ||
    overallDiameterM === null ||
    enamelGrade === null ||
    breakdownVoltageV === null
  ) {
    return null;
  }
  return { code: part.code, copperDiameterM, overallDiameterM, grade: enamelGrade, breakdownVoltageV };
}

/** A shelf part as an insulation tape; null unless the part is a complete tape. */
export function tapeKindOf(part: Part): TapeKind | null {
  const { thicknessM, dielectricStrengthVPerM } = part;
  if (part.kind !== 'tape' || thicknessM === null || dielectricStrengthVPerM === null) return null;
  return { code: part.code, thicknessM, dielectricStrengthVPerM };
}

/** The cores, wires and tapes of a shelf, complete ones only, in shelf order. */
export function shelfMagnetics(parts: readonly Part[]): { cores: CoreKind[]; wires: WireKind[]; tapes: TapeKind[] } {
  const present = <T>(value: T | null): value is T => value !== null;
  return {
    cores: parts.map(coreKindOf).filter(present),
    wires: parts.map(wireKindOf).filter(present),
    tapes: parts.map(tapeKindOf).filter(present),
  };
}
