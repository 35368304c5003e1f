import { Type } from '@sinclair/typebox';
import { designLimits as L } from './design-limits';
import {
  between,
  closedObject,
  count,
  diodeJunctionFields,
  fraction,
  gradingCoefficient,
  junctionPotential,
  nonNegative,
  positive,
  text,
} from './schema-builders';
import { transformerChoiceSchema, transformerSectionSchema } from './transformer-section.schema';

/**
 * The driver stage inside a design document: a battery- or DC-fed blocking oscillator with a feedback
 * winding, driving the primary of a step-up transformer whose secondary feeds the ladder. SI base units
 * (V, A, Ω, H, s; Ah for cell capacity and h for battery life as the trade states them). The types in
 * driver-stage.types.ts are derived from these schemas.
 */

export const cellChemistrySchema = Type.Union(
  [Type.Literal('alkaline'), Type.Literal('nimh'), Type.Literal('li-ion'), Type.Literal('custom')],
  { description: 'Cell chemistry; "custom" needs its own curve and continuous-current figure.' },
);

export const cellCurvePointSchema = closedObject(
  {
    chargeFraction: fraction(false, false, 'State of charge: 1 full, 0 empty.'),
    voltageV: positive(L.maxVoltageV, 'Per-cell open-circuit voltage at that state of charge.'),
  },
  { description: 'One point of a per-cell open-circuit voltage curve.' },
);

export const cellsSupplySchema = closedObject(
  {
    kind: Type.Literal('cells'),
    chemistry: cellChemistrySchema,
    cellsInSeries: count(1, L.maxCellsInSeries),
    capacityAh: positive(1e6, 'Rated capacity of one cell at a light drain.'),
    internalResistanceOhm: nonNegative(L.maxResistanceOhm, 'Internal resistance of one cell.'),
    endVoltagePerCellV: positive(
      L.maxVoltageV,
      'Per-cell loaded terminal voltage at which the equipment is taken as dead.',
    ),
    curve: Type.Optional(
      Type.Array(cellCurvePointSchema, {
        maxItems: L.maxCurvePoints,
        description: "Per-cell open-circuit voltage vs state of charge; defaults to the chemistry's built-in curve.",
      }),
    ),
    maxContinuousCurrentA: Type.Optional(
      positive(L.maxCurrentA, "Continuous drain one cell tolerates; defaults to the chemistry's figure."),
    ),
    peukertExponent: Type.Optional(
      between(1, L.maxPeukertExponent, "Peukert exponent k of the cell; defaults to the chemistry's figure."),
    ),
    ratedDischargeH: Type.Optional(
      positive(L.maxBatteryLifeH, "Discharge time at which capacityAh is rated; defaults to the chemistry's figure."),
    ),
  },
  { description: 'A string of identical cells in series.' },
);

export const dcSupplySchema = closedObject(
  {
    kind: Type.Literal('dc'),
    voltageV: positive(L.maxVoltageV),
    sourceResistanceOhm: nonNegative(L.maxResistanceOhm),
  },
  { description: 'A bench or mains-derived DC supply with a series source resistance.' },
);

export const driverSupplySchema = Type.Union([cellsSupplySchema, dcSupplySchema]);

export const driverTransformerSchema = closedObject(
  {
    primaryTurns: positive(L.maxTurns),
    feedbackTurns: positive(L.maxTurns),
    secondaryTurns: positive(L.maxTurns),
    primaryInductanceH: positive(L.maxInductanceH, 'Magnetizing inductance seen at the primary.'),
    couplingCoefficient: fraction(true, false, 'Coupling k between the primary and the other windings.'),
    primaryResistanceOhm: nonNegative(L.maxResistanceOhm),
    feedbackResistanceOhm: nonNegative(L.maxResistanceOhm),
    secondaryResistanceOhm: nonNegative(L.maxResistanceOhm),
    saturationCurrentA: positive(
      L.maxCurrentA,
      'Primary current at which the core saturates (its incremental inductance down by 30 %).',
    ),
    saturatedInductanceH: Type.Optional(
      positive(L.maxInductanceH, 'Primary inductance in deep saturation; default 1 % of the primary inductance.'),
    ),
    secondaryCapacitanceF: Type.Optional(
      nonNegative(L.maxCapacitanceF, 'Self-capacitance of the secondary winding, across it; 0 if absent.'),
    ),
    windingCouplings: Type.Optional(
      closedObject(
        {
          primaryFeedback: Type.Optional(fraction(true, false)),
          primarySecondary: Type.Optional(fraction(true, false)),
          feedbackSecondary: Type.Optional(fraction(true, false)),
        },
        { description: 'Coupling k of a pair of windings; a pair not given takes couplingCoefficient.' },
      ),
    ),
    secondaryPhasing: Type.Optional(
      Type.Union([Type.Literal('flyback'), Type.Literal('forward')], {
        description:
          "Which pulse of the secondary feeds the ladder: 'flyback' (default, the usual arrangement) or 'forward' (the pulse while the transistor conducts).",
      }),
    ),
    coreLossW: Type.Optional(
      nonNegative(L.maxPowerW, 'Core loss at the operating point, from the core maker’s loss data; zero if absent.'),
    ),
    insulation: Type.Optional(
      closedObject(
        { ratedVoltageV: positive(L.maxVoltageV) },
        { description: 'Insulation between secondary and the low-voltage windings, as rated by its supplier.' },
      ),
    ),
  },
  { description: 'Three-winding transformer: primary (collector), feedback (base), secondary (to the ladder).' },
);

export const driverTransistorSchema = closedObject(
  {
    forwardBeta: positive(L.maxBeta),
    reverseBeta: positive(L.maxBeta),
    vbeOnV: positive(L.maxVoltageV),
    vceSatV: nonNegative(L.maxVoltageV),
    vceoMaxV: positive(L.maxVoltageV),
    icMaxA: positive(L.maxCurrentA),
    saturationCurrentA: Type.Optional(
      positive(1, 'Ebers-Moll saturation current for the full simulation; a small-signal default if absent.'),
    ),
    baseEmitterCapacitanceF: Type.Optional(
      nonNegative(L.maxCapacitanceF, 'Zero-bias base-emitter junction capacitance (SPICE CJE); default 10 pF.'),
    ),
    baseCollectorCapacitanceF: Type.Optional(
      nonNegative(L.maxCapacitanceF, 'Zero-bias base-collector junction capacitance (SPICE CJC); default 5 pF.'),
    ),
    baseEmitterPotentialV: Type.Optional(
      junctionPotential('Base-emitter junction potential (SPICE VJE); 0.75 V if absent.'),
    ),
    baseEmitterGrading: Type.Optional(
      gradingCoefficient('Base-emitter grading coefficient (SPICE MJE); 0.33 if absent.'),
    ),
    baseCollectorPotentialV: Type.Optional(
      junctionPotential('Base-collector junction potential (SPICE VJC); 0.75 V if absent.'),
    ),
    baseCollectorGrading: Type.Optional(
      gradingCoefficient('Base-collector grading coefficient (SPICE MJC); 0.33 if absent.'),
    ),
    earlyVoltageV: Type.Optional(
      between(L.minEarlyVoltageV, L.maxEarlyVoltageV, 'Forward Early voltage (SPICE VAF); no Early effect if absent.'),
    ),
    forwardTransitTimeS: Type.Optional(nonNegative(L.maxTransitTimeS, 'Forward transit time (SPICE TF); 0 if absent.')),
    reverseTransitTimeS: Type.Optional(nonNegative(L.maxTransitTimeS, 'Reverse transit time (SPICE TR); 0 if absent.')),
    baseResistanceOhm: Type.Optional(
      nonNegative(L.maxTerminalResistanceOhm, 'Base spreading resistance (SPICE RB); 0 if absent.'),
    ),
    collectorResistanceOhm: Type.Optional(
      nonNegative(L.maxTerminalResistanceOhm, 'Collector series resistance (SPICE RC); 0 if absent.'),
    ),
    emitterResistanceOhm: Type.Optional(
      nonNegative(L.maxTerminalResistanceOhm, 'Emitter series resistance (SPICE RE); 0 if absent.'),
    ),
    thermalResistanceCPerW: Type.Optional(
      positive(
        L.maxThermalResistanceCPerW,
        'Junction to ambient (°C/W); 200 °C/W, a small leaded part in free air, if absent.',
      ),
    ),
    maxJunctionTemperatureC: Type.Optional(
      between(0, L.maxTemperatureC, 'Rated junction temperature (°C); 150 °C if absent.'),
    ),
  },
  { description: 'The switching BJT (NPN, common emitter).' },
);

export const driverClampSchema = Type.Union(
  [
    closedObject({
      kind: Type.Literal('rcd'),
      resistorOhm: Type.Optional(
        positive(
          L.maxResistanceOhm,
          'Clamp resistor across the clamp capacitor; with it the flyback energy sets the clamp level; 10 kΩ if absent.',
        ),
      ),
      capacitorF: Type.Optional(
        positive(L.maxCapacitanceF, 'Clamp capacitor from the clamp diode to the supply; 10 nF if absent.'),
      ),
      ratedPowerW: Type.Optional(positive(L.maxPowerW, 'Power rating of the clamp resistor; 0.25 W if absent.')),
      ...diodeJunctionFields(),
      breakdownVoltageV: Type.Optional(
        positive(L.maxVoltageV, 'Reverse breakdown voltage of the clamp diode (SPICE BV); none if absent.'),
      ),
    }),
    closedObject({
      kind: Type.Literal('zener'),
      clampVoltageV: positive(L.maxVoltageV, 'Zener voltage, the breakdown voltage of its model (SPICE BV).'),
      ratedPowerW: Type.Optional(positive(L.maxPowerW, 'Power rating of the zener; 0.5 W if absent.')),
      ...diodeJunctionFields(),
    }),
  ],
  {
    description:
      'Collector clamp that limits the flyback voltage; the junction fields are its diode’s (SPICE D model names).',
  },
);

export const driverStageSchema = closedObject({
  supply: driverSupplySchema,
  transformer: driverTransformerSchema,
  transformerChoice: Type.Optional(transformerChoiceSchema),
  transformerDesign: Type.Optional(transformerSectionSchema),
  transistor: driverTransistorSchema,
  baseResistorOhm: positive(L.maxResistanceOhm),
  collectorResistorOhm: Type.Optional(
    nonNegative(L.maxResistanceOhm, 'Series resistor in the collector (current sensing or limiting).'),
  ),
  clamp: Type.Optional(driverClampSchema),
  snubber: Type.Optional(
    closedObject(
      { resistorOhm: positive(L.maxResistanceOhm), capacitorF: positive(L.maxCapacitanceF) },
      { description: 'RC snubber from the collector to ground (across the transistor).' },
    ),
  ),
  supplyBypassCapacitanceF: Type.Optional(
    nonNegative(L.maxCapacitanceF, 'Capacitor across the supply at the stage; 0 for none; default 100 µF.'),
  ),
  collectorStrayCapacitanceF: Type.Optional(
    nonNegative(
      L.maxCapacitanceF,
      'Stray capacitance from the collector to ground (winding and wiring); 0 for none; default 100 pF.',
    ),
  ),
  indicatorLamp: Type.Optional(
    closedObject(
      { currentA: nonNegative(L.maxCurrentA) },
      { description: 'A neon or LED power indicator drawing a steady current from the supply.' },
    ),
  ),
  switchOnTimeS: Type.Optional(
    between(0, L.maxTimeS, 'Time the push-button is held for a cold start (start-up simulation).'),
  ),
  ambientTemperatureC: Type.Optional(
    between(L.minTemperatureC, L.maxTemperatureC, 'Air temperature around the stage (°C); 25 °C if absent.'),
  ),
  batteryLifeTargetH: Type.Optional(
    positive(L.maxBatteryLifeH, 'Battery life the equipment must reach on a cells supply (checked when given).'),
  ),
});

/** Text of a part code on the Parts shelf. */
export const partCodeSchema = text(L.maxPartCodeLength, 'Parts shelf code.');
