import { Type } from '@sinclair/typebox';
import { designLimits as L } from './design-limits';
import { NAMED_DISCHARGE_RULES } from './discharge-rules';
import { driverStageSchema, partCodeSchema } from './driver-stage.schema';
import { coreKindSchema, tapeKindSchema, transformerSectionSchema, wireKindSchema } from './transformer-section.schema';
import {
  closedObject,
  count,
  diodeJunctionFields,
  fraction,
  nonNegative,
  positive,
  text,
  withDefinitions,
} from './schema-builders';

/**
 * The design document, schemaVersion 1: its one definition. The TypeScript types (design.types.ts), the
 * published JSON Schema (`designDocumentSchema`) and the validator (validate-design.ts) all derive from
 * these schemas. Units are SI base units, named in each property; every size and range has a limit from
 * the domain (design-limits.ts). Every object refuses keys it does not name.
 * To add a field, see DEVELOPERS.md "Adding a field to the design document".
 */

export const DESIGN_SCHEMA_VERSION = 1;

export const sineDriveSchema = closedObject(
  {
    kind: Type.Literal('sine'),
    peakV: positive(L.maxVoltageV, 'PEAK (not rms) of the secondary voltage.'),
    frequencyHz: Type.Number({ minimum: L.minFrequencyHz, maximum: L.maxFrequencyHz }),
    sourceResistanceOhm: nonNegative(
      L.maxResistanceOhm,
      'Resistance in series with each driven end of the secondary (winding resistance plus any limiter).',
    ),
  },
  { description: 'Sinusoidal secondary; peakV is the peak, not rms.' },
);

export const pulseDriveSchema = closedObject(
  {
    kind: Type.Literal('pulse'),
    forwardPeakV: nonNegative(L.maxVoltageV, 'Magnitude of the forward pulse.'),
    flybackPeakV: nonNegative(L.maxVoltageV, 'Magnitude of the flyback (opposite sign).'),
    frequencyHz: Type.Number({ minimum: L.minFrequencyHz, maximum: L.maxFrequencyHz }),
    dutyCycle: fraction(true, true, 'Fraction of the period at the forward peak.'),
    sourceResistanceOhm: nonNegative(L.maxResistanceOhm),
  },
  {
    description:
      'Rectangular pulses: forward peak for dutyCycle of the period, flyback peak (opposite sign) for the rest.',
  },
);

export const driverDriveSchema = closedObject(
  { kind: Type.Literal('driver'), driver: driverStageSchema },
  { description: 'Secondary derived from a blocking-oscillator driver stage through its closed-form estimate.' },
);

export const driveSchema = Type.Union([sineDriveSchema, pulseDriveSchema, driverDriveSchema]);

export const topologySchema = Type.Union([
  Type.Literal('half-wave'),
  Type.Literal('full-wave'),
  Type.Literal('bridge-doubler'),
]);

export const capacitorPartSchema = closedObject({
  valueF: positive(L.maxCapacitanceF),
  tolerance: fraction(false, true, 'Fractional tolerance, e.g. 0.1 for ±10 %.'),
  ratedVoltageV: positive(L.maxVoltageV),
  partCode: Type.Optional(partCodeSchema),
});

export const diodePartSchema = closedObject(
  {
    saturationCurrentA: positive(1),
    emissionCoefficient: positive(L.maxEmissionCoefficient),
    seriesResistanceOhm: nonNegative(L.maxResistanceOhm),
    ratedPivV: positive(L.maxVoltageV),
    ratedAverageCurrentA: positive(L.maxCurrentA),
    ratedSurgeCurrentA: positive(L.maxCurrentA),
    ...diodeJunctionFields(),
    breakdownVoltageV: Type.Optional(
      positive(L.maxVoltageV, 'Reverse breakdown voltage of the model (SPICE BV); no breakdown if absent.'),
    ),
    partCode: Type.Optional(partCodeSchema),
  },
  {
    description:
      'Shockley diode with series resistance, depletion charge and breakdown (SPICE D model), plus the ratings the Checks compare against.',
  },
);

export const multiplierSpecSchema = closedObject(
  {
    topology: topologySchema,
    cellCount: count(1, L.maxCellCount),
    capacitors: Type.Array(capacitorPartSchema, { minItems: 1, maxItems: L.maxCapacitorCount }),
    diode: diodePartSchema,
    strayCapacitanceF: Type.Optional(
      nonNegative(L.maxCapacitanceF, 'Stray capacitance of each ladder node to ground.'),
    ),
  },
  {
    description:
      'Capacitors from the source upward in conduction order. Half-wave even cellCount: C1 oscillating stage 1, C2 smoothing stage 1, ...; odd cellCount starts with a rectifier cell (C1 smoothing). Full-wave: three per stage (oscillating A, oscillating B, smoothing), 3 x cellCount. Bridge doubler: cellCount 2.',
  },
);

export const bleederStringSchema = closedObject(
  {
    count: count(1, L.maxBleederCount),
    valueOhm: positive(L.maxResistanceOhm),
    ratedPowerW: positive(1e6),
    limitingVoltageV: positive(L.maxVoltageV, 'Limiting element voltage of one resistor (IEC 60115-1 term).'),
    partCode: Type.Optional(partCodeSchema),
  },
  { description: 'A bleeder string of `count` equal resistors across the ladder output.' },
);

export const outputNetworkSchema = closedObject({
  bleeder: Type.Union([Type.Null(), bleederStringSchema]),
  seriesOutputResistanceOhm: nonNegative(
    L.maxResistanceOhm,
    'Resistor between the ladder top (where the bleeder sits) and the load terminal.',
  ),
});

export const loadSchema = Type.Union([
  closedObject({ kind: Type.Literal('current'), currentA: nonNegative(L.maxCurrentA) }),
  closedObject({ kind: Type.Literal('resistance'), resistanceOhm: positive(L.maxResistanceOhm) }),
]);

/** A discharge rule: one known by name, or a voltage and a time. */
export const dischargeRuleSchema = Type.Union([
  ...NAMED_DISCHARGE_RULES.map((rule) => Type.Literal(rule)),
  closedObject({ voltageV: positive(L.maxVoltageV), timeS: positive(L.maxTimeS) }),
]);

export const spacingEnvironmentSchema = closedObject({
  pollutionDegree: Type.Union([Type.Literal(1), Type.Literal(2), Type.Literal(3)]),
  materialGroup: Type.Union([Type.Literal('I'), Type.Literal('II'), Type.Literal('IIIa'), Type.Literal('IIIb')]),
  pcb: Type.Boolean(),
  altitudeM: Type.Optional(nonNegative(L.maxAltitudeM)),
  providedCreepageMm: Type.Optional(
    positive(
      L.maxCreepageMm,
      'Creepage the layout provides between adjacent ladder nodes; enables the per-stage creepage verdicts.',
    ),
  ),
});

export const designTargetsSchema = closedObject({
  outputV: Type.Number({
    minimum: -L.maxVoltageV,
    maximum: L.maxVoltageV,
    not: { const: 0 },
    description: 'Signed output voltage; negative for a negative ladder (diodes reversed). Not zero.',
  }),
  rippleMaxV: positive(L.maxVoltageV),
  loadCurrentA: nonNegative(L.maxCurrentA),
  safeVoltageV: positive(L.maxVoltageV),
  dischargeRule: dischargeRuleSchema,
  spacing: spacingEnvironmentSchema,
});

export const designSchema = closedObject({
  schemaVersion: Type.Literal(DESIGN_SCHEMA_VERSION),
  name: text(L.maxNameLength),
  notes: text(L.maxNotesLength),
  drive: driveSchema,
  multiplier: multiplierSpecSchema,
  outputNetwork: outputNetworkSchema,
  load: loadSchema,
  targets: designTargetsSchema,
});

/**
 * JSON Schema (draft 2020-12) of the design document, as the server publishes it, its named parts under
 * `$defs`. validateDesign applies it plus the cross-field rules a schema cannot say (capacitor count per
 * topology and cell count, a non-zero target voltage, forward and flyback peaks not both zero) and the
 * document size and depth.
 */
export const designDocumentSchema = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  $id: 'urn:ladderwright:schema:design:1',
  title: 'Ladderwright design document',
  ...withDefinitions(designSchema, {
    sineDrive: sineDriveSchema,
    pulseDrive: pulseDriveSchema,
    driverDrive: driverDriveSchema,
    driverStage: driverStageSchema,
    transformerSection: transformerSectionSchema,
    coreKind: coreKindSchema,
    wireKind: wireKindSchema,
    tapeKind: tapeKindSchema,
    capacitor: capacitorPartSchema,
    diode: diodePartSchema,
    multiplier: multiplierSpecSchema,
    bleeder: bleederStringSchema,
    targets: designTargetsSchema,
  }),
} as const;
