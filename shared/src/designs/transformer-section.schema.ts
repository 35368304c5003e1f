import { Type } from '@sinclair/typebox';
import { designLimits as L } from './design-limits';
import { between, closedObject, count, fraction, nonNegative, positive, text } from './schema-builders';

/**
 * The transformer section of a driver stage: core, gap, windings and insulation, from which the engine
 * (shared/src/transformer) computes the numbers the "given transformer" states directly. SI base units
 * throughout (m, m², m³, H, T, V, V/m). The core, wire and tape kinds are carried whole (with the Parts
 * shelf code they came from), so the document computes without the shelf, as capacitors carry their values.
 */

/** A Parts shelf code of a core, wire or tape kind. */
const kindCode = text(L.maxPartCodeLength, 'Parts shelf code.');

export const coreKindSchema = closedObject(
  {
    code: kindCode,
    effectiveAreaM2: positive(L.maxCoreAreaM2, 'Effective cross-section Ae.'),
    pathLengthM: positive(L.maxCoreLengthM, 'Effective magnetic path length le.'),
    volumeM3: positive(L.maxCoreVolumeM3, 'Effective volume Ve.'),
    windowAreaM2: positive(L.maxCoreAreaM2, 'Winding window area of the core (Wa).'),
    bobbinBreadthM: positive(L.maxCoreLengthM, 'Winding breadth of the bobbin between its flanges.'),
    bobbinHeightM: positive(L.maxCoreLengthM, 'Winding height (build) the bobbin allows.'),
    meanTurnLengthM: positive(L.maxCoreLengthM, 'Mean length of one turn on the bobbin (MLT).'),
    ungappedAlHPerTurn2: positive(L.maxInductanceH, 'Inductance factor AL of the ungapped core pair (H per turn²).'),
    saturationFluxDensity25T: positive(L.maxFluxDensityT, 'Saturation flux density of the material at 25 °C.'),
    saturationFluxDensity100T: positive(L.maxFluxDensityT, 'Saturation flux density of the material at 100 °C.'),
    steinmetzK: positive(L.maxSteinmetzK, 'Steinmetz k: loss density in W/m³ = k·f^α·B^β with f in Hz, B (peak) in T.'),
    steinmetzAlpha: between(1, 3, 'Steinmetz frequency exponent α.'),
    steinmetzBeta: between(1, 4, 'Steinmetz flux exponent β.'),
    surfaceAreaM2: Type.Optional(
      positive(L.maxCoreAreaM2, 'Outer surface area of the wound core; estimated from the volume if absent.'),
    ),
  },
  { description: 'A core pair with its bobbin, as the Parts shelf holds it.' },
);

export const wireKindSchema = closedObject(
  {
    code: kindCode,
    copperDiameterM: positive(L.maxWireDiameterM, 'Diameter over the copper.'),
    overallDiameterM: positive(L.maxWireDiameterM, 'Diameter over the enamel.'),
    grade: count(1, 3, 'Enamel grade 1, 2 or 3 (IEC 60317), thicker with the number.'),
    breakdownVoltageV: positive(L.maxVoltageV, 'Breakdown voltage of the enamel between two touching wires.'),
  },
  { description: 'An enamelled round copper wire.' },
);

export const tapeKindSchema = closedObject(
  {
    code: kindCode,
    thicknessM: positive(L.maxTapeThicknessM, 'Thickness of one wrap.'),
    dielectricStrengthVPerM: positive(L.maxDielectricStrengthVPerM, 'Dielectric strength of the film.'),
  },
  { description: 'An insulating tape wound between layers or windings.' },
);

export const windingRoleSchema = Type.Union(
  [Type.Literal('primary'), Type.Literal('feedback'), Type.Literal('secondary')],
  { description: 'Which winding of the blocking oscillator this is.' },
);

export const transformerWindingSchema = closedObject(
  {
    role: windingRoleSchema,
    name: Type.Optional(text(L.maxNameLength, 'Name on the winding schedule; the role if absent.')),
    turns: count(1, L.maxTurns),
    wire: wireKindSchema,
    layers: Type.Optional(count(1, L.maxWindingLayers, 'Layers to wind; the fewest that hold the turns if absent.')),
    layerTapeWraps: Type.Optional(
      count(0, L.maxTapeWraps, 'Wraps of the layer tape between adjacent layers of this winding; 0 if absent.'),
    ),
    startPin: count(1, L.maxPins, 'Pin of the winding start (the dotted end).'),
    endPin: count(1, L.maxPins, 'Pin of the winding finish.'),
  },
  { description: 'One winding; the windings list runs from the core outward in winding order.' },
);

export const transformerGapSchema = Type.Union(
  [
    closedObject(
      { kind: Type.Literal('gap'), gapM: nonNegative(L.maxGapM, 'Total air gap in the magnetic path; 0 ungapped.') },
      { description: 'A given gap; the inductance factor follows.' },
    ),
    closedObject(
      { kind: Type.Literal('al'), alHPerTurn2: positive(L.maxInductanceH, 'Target inductance factor AL.') },
      { description: 'A target AL; the gap follows.' },
    ),
    closedObject(
      { kind: Type.Literal('primary-inductance'), primaryInductanceH: positive(L.maxInductanceH) },
      { description: 'A target primary inductance; AL and the gap follow.' },
    ),
  ],
  { description: 'How the gap is set: a length, a target AL, or a target primary inductance.' },
);

export const transformerSectionSchema = closedObject(
  {
    core: coreKindSchema,
    gap: transformerGapSchema,
    windings: Type.Array(transformerWindingSchema, {
      minItems: 3,
      maxItems: 3,
      description: 'Primary, feedback and secondary (each once), from the core outward in winding order.',
    }),
    layerTape: Type.Optional(tapeKindSchema),
    windingTape: tapeKindSchema,
    windingTapeWraps: count(1, L.maxTapeWraps, 'Wraps of the winding tape between adjacent windings.'),
    endMarginM: Type.Optional(
      nonNegative(L.maxCoreLengthM, 'Margin tape width at each end of every winding; 0 if absent.'),
    ),
    flangeCreepageM: Type.Optional(
      positive(
        L.maxCoreLengthM,
        'Creepage along the bobbin flange between the secondary and the other windings; twice the end margin if absent.',
      ),
    ),
    inductanceTolerance: Type.Optional(
      fraction(true, true, 'Tolerance to ask for on the inductances, e.g. 0.1 for ±10 %; 0.1 if absent.'),
    ),
  },
  { description: 'The transformer designed from a core, a gap and its windings.' },
);

export const transformerChoiceSchema = Type.Union([Type.Literal('given'), Type.Literal('designed')], {
  description:
    "'given' (default): the transformer's numbers as stated in `transformer`; 'designed': derived from `transformerDesign`.",
});
