/**
 * Upper bounds on everything a design document can carry, from the domain: what a small high-voltage DC
 * supply (a blocking oscillator or a sine or pulse secondary feeding a diode-capacitor ladder) can
 * plausibly need, with room to spare. They keep any one request's memory and engine time bounded;
 * the design schema (design.schema.ts) states them, so the published JSON Schema says them too.
 * Standing: common practice, no source.
 */
export const designLimits = {
  /**
   * Cells of one ladder. Droop grows with the cube of the stage count, so ladders past a few dozen
   * stages are impractical; 400 cells (200 half-wave stages) leaves room for studies.
   */
  maxCellCount: 400,
  /** Capacitors of one ladder: three per stage in a full-wave cascade. */
  maxCapacitorCount: 3 * 400,
  /** Equal resistors of one bleeder string (a 1 MV string of 1 kV parts). */
  maxBleederCount: 1000,
  /** Points of one per-cell discharge curve. */
  maxCurvePoints: 64,
  /** Cells in series in one battery. */
  maxCellsInSeries: 64,
  /** Turns of one transformer winding. */
  maxTurns: 1e6,
  /** Any voltage in the document (1 MV). */
  maxVoltageV: 1e6,
  /** Any current in the document. */
  maxCurrentA: 1e3,
  /** Any resistance in the document (1 PΩ). */
  maxResistanceOhm: 1e15,
  /** Any capacitance in the document. */
  maxCapacitanceF: 10,
  /** Any inductance in the document. */
  maxInductanceH: 1e3,
  /** Drive frequency: from slow bench transformers to fast switching secondaries. */
  minFrequencyHz: 0.1,
  maxFrequencyHz: 1e8,
  /** Any duration in the document (one day). */
  maxTimeS: 86_400,
  /** Altitude above sea level (IEC 60664-1 corrects clearances up to 20 km). */
  maxAltitudeM: 20_000,
  /** Creepage a layout provides between adjacent ladder nodes. */
  maxCreepageMm: 10_000,
  /** Transistor current gain. */
  maxBeta: 10_000,
  /**
   * Forward Early voltage of a transistor (SPICE VAF): tens to hundreds of volts in practice. Below about 2 V
   * the Gummel–Poon base charge 1/(1 − Vbc/VAF) of a saturated transistor (Vbc up to ~0.8 V) loses its meaning.
   */
  minEarlyVoltageV: 2,
  maxEarlyVoltageV: 10_000,
  /** Transit time of a junction (SPICE TF, TR): picoseconds to the microseconds of slow power parts. */
  maxTransitTimeS: 1e-3,
  /** Terminal resistance of a transistor (SPICE RB, RC, RE): ohms to a few hundred ohms in practice. */
  maxTerminalResistanceOhm: 1e4,
  /** Built-in potential of a junction (SPICE VJ, VJE, VJC): 0.3–1 V for silicon and Schottky junctions. */
  minJunctionPotentialV: 0.1,
  maxJunctionPotentialV: 2,
  /** Grading coefficient of a junction (SPICE M, MJE, MJC): 1/3 graded to 1/2 abrupt; the model needs it below 1. */
  maxGradingCoefficient: 0.9,
  /**
   * Diode emission coefficient: a stacked high-voltage diode is many junctions in series, each adding about
   * one to two (common practice, no source), so a stack of up to about fifty junctions.
   */
  maxEmissionCoefficient: 100,
  /** Any power in the document (a hand-held or bench supply's parts and losses). */
  maxPowerW: 1e4,
  /** Temperatures in °C: from arctic storage to the hottest silicon junction ratings. */
  minTemperatureC: -60,
  maxTemperatureC: 250,
  /** Thermal resistance junction to ambient (°C/W): from a heat-sunk power device to the smallest package. */
  maxThermalResistanceCPerW: 2000,
  /** Peukert exponent of a cell (1: no rate dependence). */
  maxPeukertExponent: 2,
  /** Battery life target (ten years). */
  maxBatteryLifeH: 87_600,
  /** Core cross-section or window area (100 cm², a large ferrite E core is a few cm²). */
  maxCoreAreaM2: 1e-2,
  /** Core path length, bobbin breadth and height, turn length, margins (1 m). */
  maxCoreLengthM: 1,
  /** Core volume (1 litre). */
  maxCoreVolumeM3: 1e-3,
  /** Flux density: no soft magnetic material saturates above about 2.5 T (common practice, no source). */
  maxFluxDensityT: 3,
  /** Steinmetz k in W/m³ (f in Hz, B in T); fitted values span many decades. */
  maxSteinmetzK: 1e6,
  /** Winding wire diameter (5 mm, past any wire a small transformer uses). */
  maxWireDiameterM: 5e-3,
  /** One wrap of insulating tape (1 mm). */
  maxTapeThicknessM: 1e-3,
  /** Dielectric strength of an insulating film (1000 kV/mm, past any polymer film). */
  maxDielectricStrengthVPerM: 1e9,
  /** Air gap in the magnetic path (10 mm). */
  maxGapM: 1e-2,
  /**
   * Shortest air gap that is made to a tolerance, a ground centre-leg gap or a spacer (0.051 mm). Read: Power
   * Integrations, application note AN-18 (7/96), p. 12, "Transformer Gapping, Primary Inductance Tolerance": gaps
   * smaller than 0.051 mm (0.002 in) should be avoided, their tolerance being hard to hold. The published figure
   * is kept, not rounded to 0.05 mm, so that no gap the note advises against passes. A shorter gap than this is
   * left to the mating faces' own residual gap.
   */
  minManufacturableGapM: 5.1e-5,
  /** Layers of one winding. */
  maxWindingLayers: 1000,
  /** Wraps of tape between two layers or windings. */
  maxTapeWraps: 20,
  /** Pins of one bobbin. */
  maxPins: 64,
  /** Text lengths, in UTF-16 code units. */
  maxNameLength: 200,
  maxNotesLength: 20_000,
  maxPartCodeLength: 64,
  /** Depth of objects and lists in one document (the design itself needs 6). */
  maxDepth: 12,
  /** Size of one document as JSON text. */
  maxDocumentBytes: 512 * 1024,
} as const;
