/**
 * What the simulation takes for a transistor model field the design leaves out (SPICE names in the schema):
 * SPICE's own default for each, except the saturation current and junction capacitances, which SPICE leaves at
 * 1e-16 A and zero, set to a small switching NPN's (from memory). No Early voltage is the default (none).
 */
export const TRANSISTOR_MODEL_DEFAULTS = {
  saturationCurrentA: 1e-14,
  baseEmitterCapacitanceF: 10e-12,
  baseCollectorCapacitanceF: 5e-12,
  baseEmitterPotentialV: 0.75,
  baseEmitterGrading: 0.33,
  baseCollectorPotentialV: 0.75,
  baseCollectorGrading: 0.33,
  forwardTransitTimeS: 0,
  reverseTransitTimeS: 0,
  baseResistanceOhm: 0,
  collectorResistanceOhm: 0,
  emitterResistanceOhm: 0,
} as const;

/**
 * What the simulation takes for a diode junction field the design leaves out (the ladder's and the clamp's
 * diodes): SPICE's defaults, no depletion capacitance, VJ 1 V, M 0.5, IBV 1 mA; no breakdown voltage is the
 * default (none).
 */
export const DIODE_MODEL_DEFAULTS = {
  junctionCapacitanceF: 0,
  junctionPotentialV: 1,
  gradingCoefficient: 0.5,
  breakdownCurrentA: 1e-3,
} as const;

/**
 * An RCD clamp's resistor and capacitor when the design gives none: 10 kΩ and 10 nF, a small stage's clamp
 * (common practice, no source). The simulated circuit and the estimate both take them.
 */
export const RCD_CLAMP_DEFAULTS = { resistorOhm: 10e3, capacitorF: 10e-9 } as const;
