/**
 * JSON Schema (draft 2020-12) of the design document, schemaVersion 1. Units are SI base units and are
 * named in each property. The server serves this constant; validateDesign applies the same rules plus
 * the cross-field ones a schema cannot say (capacitor count per topology and cell count).
 */
const finite = { type: 'number' } as const;
const positive = { type: 'number', exclusiveMinimum: 0 } as const;
const nonNegative = { type: 'number', minimum: 0 } as const;

export const designDocumentSchema = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  $id: 'urn:ladderwright:schema:design:1',
  title: 'Ladderwright design document',
  type: 'object',
  required: ['schemaVersion', 'name', 'notes', 'drive', 'multiplier', 'outputNetwork', 'load', 'targets'],
  additionalProperties: false,
  properties: {
    schemaVersion: { const: 1 },
    name: { type: 'string' },
    notes: { type: 'string' },
    drive: { oneOf: [{ $ref: '#/$defs/sineDrive' }, { $ref: '#/$defs/pulseDrive' }, { $ref: '#/$defs/driverDrive' }] },
    multiplier: { $ref: '#/$defs/multiplier' },
    outputNetwork: {
      type: 'object',
      required: ['bleeder', 'seriesOutputResistanceOhm'],
      properties: {
        bleeder: { oneOf: [{ type: 'null' }, { $ref: '#/$defs/bleeder' }] },
        seriesOutputResistanceOhm: nonNegative,
      },
    },
    load: {
      oneOf: [
        {
          type: 'object',
          required: ['kind', 'currentA'],
          properties: { kind: { const: 'current' }, currentA: nonNegative },
        },
        {
          type: 'object',
          required: ['kind', 'resistanceOhm'],
          properties: { kind: { const: 'resistance' }, resistanceOhm: positive },
        },
      ],
    },
    targets: { $ref: '#/$defs/targets' },
  },
  $defs: {
    sineDrive: {
      type: 'object',
      description: 'Sinusoidal secondary; peakV is the peak, not rms.',
      required: ['kind', 'peakV', 'frequencyHz', 'sourceResistanceOhm'],
      properties: { kind: { const: 'sine' }, peakV: positive, frequencyHz: positive, sourceResistanceOhm: nonNegative },
    },
    pulseDrive: {
      type: 'object',
      description:
        'Rectangular pulses: forward peak for dutyCycle of the period, flyback peak (opposite sign) for the rest.',
      required: ['kind', 'forwardPeakV', 'flybackPeakV', 'frequencyHz', 'dutyCycle', 'sourceResistanceOhm'],
      properties: {
        kind: { const: 'pulse' },
        forwardPeakV: nonNegative,
        flybackPeakV: nonNegative,
        frequencyHz: positive,
        dutyCycle: { type: 'number', exclusiveMinimum: 0, exclusiveMaximum: 1 },
        sourceResistanceOhm: nonNegative,
      },
    },
    driverDrive: {
      type: 'object',
      description: 'Secondary derived from a blocking-oscillator driver stage (see the driver types).',
      required: ['kind', 'driver'],
      properties: {
        kind: { const: 'driver' },
        driver: { type: 'object', required: ['supply', 'transformer', 'transistor', 'baseResistorOhm'] },
      },
    },
    capacitor: {
      type: 'object',
      required: ['valueF', 'tolerance', 'ratedVoltageV'],
      properties: {
        valueF: positive,
        tolerance: { type: 'number', minimum: 0, exclusiveMaximum: 1 },
        ratedVoltageV: positive,
        partCode: { type: 'string' },
      },
    },
    diode: {
      type: 'object',
      required: [
        'saturationCurrentA',
        'emissionCoefficient',
        'seriesResistanceOhm',
        'ratedPivV',
        'ratedAverageCurrentA',
        'ratedSurgeCurrentA',
      ],
      properties: {
        saturationCurrentA: positive,
        emissionCoefficient: positive,
        seriesResistanceOhm: nonNegative,
        ratedPivV: positive,
        ratedAverageCurrentA: positive,
        ratedSurgeCurrentA: positive,
        junctionCapacitanceF: nonNegative,
        partCode: { type: 'string' },
      },
    },
    multiplier: {
      type: 'object',
      description:
        'Capacitors from the source upward in conduction order. Half-wave even cellCount: C1 oscillating stage 1, C2 smoothing stage 1, ...; odd cellCount starts with a rectifier cell (C1 smoothing). Full-wave: three per stage (oscillating A, oscillating B, smoothing), 3 x cellCount. Bridge doubler: cellCount 2.',
      required: ['topology', 'cellCount', 'capacitors', 'diode'],
      properties: {
        topology: { enum: ['half-wave', 'full-wave', 'bridge-doubler'] },
        cellCount: { type: 'integer', minimum: 1 },
        capacitors: { type: 'array', minItems: 1, items: { $ref: '#/$defs/capacitor' } },
        diode: { $ref: '#/$defs/diode' },
        strayCapacitanceF: nonNegative,
      },
    },
    bleeder: {
      type: 'object',
      required: ['count', 'valueOhm', 'ratedPowerW', 'limitingVoltageV'],
      properties: {
        count: { type: 'integer', minimum: 1 },
        valueOhm: positive,
        ratedPowerW: positive,
        limitingVoltageV: positive,
        partCode: { type: 'string' },
      },
    },
    targets: {
      type: 'object',
      required: ['outputV', 'rippleMaxV', 'loadCurrentA', 'safeVoltageV', 'dischargeRule', 'spacing'],
      properties: {
        outputV: {
          ...finite,
          not: { const: 0 },
          description: 'Signed output voltage; negative for a negative ladder.',
        },
        rippleMaxV: positive,
        loadCurrentA: nonNegative,
        safeVoltageV: positive,
        dischargeRule: {
          oneOf: [
            { enum: ['50V-1min', '50V-5min', '60V-5s'] },
            { type: 'object', required: ['voltageV', 'timeS'], properties: { voltageV: positive, timeS: positive } },
          ],
        },
        spacing: {
          type: 'object',
          required: ['pollutionDegree', 'materialGroup', 'pcb'],
          properties: {
            pollutionDegree: { enum: [1, 2, 3] },
            materialGroup: { enum: ['I', 'II', 'IIIa', 'IIIb'] },
            pcb: { type: 'boolean' },
            altitudeM: nonNegative,
            providedCreepageMm: positive,
          },
        },
      },
    },
  },
} as const;
