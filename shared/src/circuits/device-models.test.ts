import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import type { DriverStage } from '../designs/driver-stage.types';
import { DIODE_SPICE_PARAMETERS, NPN_SPICE_PARAMETERS, toSpiceNetlist } from '../sim/to-spice-netlist';
import { buildDriverCircuit } from './build-driver-circuit';
import { ladderPartFromDesign } from './build-ladder-circuit';

/** The parameters of one `.model NAME TYPE(...)` card of a netlist, by SPICE name. */
function modelCard(netlist: string, name: string): Record<string, number> {
  const line = netlist.split('\n').find((l) => l.startsWith(`.model ${name} `));
  if (!line) throw new Error(`no .model ${name}`);
  const inside = /\((.*)\)/.exec(line)![1]!;
  return Object.fromEntries(inside.split(' ').map((p) => [p.split('=')[0]!, Number(p.split('=')[1])]));
}

/** Reads a card back into fields through a field → SPICE name table. */
function fieldsOf(card: Record<string, number>, names: Readonly<Record<string, string>>): Record<string, number> {
  return Object.fromEntries(
    Object.entries(names).flatMap(([field, spice]) => (spice in card ? [[field, card[spice]!]] : [])),
  );
}

function testerDriver(): { driver: DriverStage; design: typeof designExamples.surfaceChargeTester } {
  const design = structuredClone(designExamples.surfaceChargeTester);
  if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
  return { driver: design.drive.driver, design };
}

const transistorFields = {
  saturationCurrentA: 2e-14,
  baseEmitterCapacitanceF: 12e-12,
  baseCollectorCapacitanceF: 4e-12,
  baseEmitterPotentialV: 0.8,
  baseEmitterGrading: 0.4,
  baseCollectorPotentialV: 0.6,
  baseCollectorGrading: 0.3,
  earlyVoltageV: 80,
  forwardTransitTimeS: 1.5e-9,
  reverseTransitTimeS: 2e-7,
  baseResistanceOhm: 10,
  collectorResistanceOhm: 0.5,
  emitterResistanceOhm: 0.2,
};

describe('device fields of a design in the exported netlist', () => {
  it('writes each transistor field under its SPICE name and reads it back unchanged', () => {
    const { driver } = testerDriver();
    Object.assign(driver.transistor, transistorFields);
    const card = modelCard(toSpiceNetlist(buildDriverCircuit(driver)), 'QM_Q1');
    const { forwardBeta, reverseBeta } = driver.transistor;
    expect(fieldsOf(card, NPN_SPICE_PARAMETERS)).toEqual({ ...transistorFields, forwardBeta, reverseBeta });
  });

  it("keeps today's transistor when the design leaves the new fields out: SPICE defaults, CJE 10 pF, CJC 5 pF", () => {
    const { driver } = testerDriver();
    const card = modelCard(toSpiceNetlist(buildDriverCircuit(driver)), 'QM_Q1');
    // VJE = VJC = 0.75 V and MJE = MJC = 0.33 are SPICE's defaults (the ngspice manual's BJT table).
    expect(card).toEqual({
      IS: 1e-14,
      BF: 100,
      BR: 2,
      CJE: 10e-12,
      VJE: 0.75,
      MJE: 0.33,
      CJC: 5e-12,
      VJC: 0.75,
      MJC: 0.33,
    });
  });

  it('writes the ladder diodes’ CJO, VJ, M, BV and IBV and reads them back unchanged', () => {
    const { driver, design } = testerDriver();
    const junction = {
      junctionCapacitanceF: 8e-12,
      junctionPotentialV: 0.6,
      gradingCoefficient: 0.4,
      breakdownVoltageV: 4000,
      breakdownCurrentA: 1e-6,
    };
    Object.assign(design.multiplier.diode, junction);
    const netlist = toSpiceNetlist(buildDriverCircuit(driver, { ladder: ladderPartFromDesign(design) }));
    const { saturationCurrentA, emissionCoefficient, seriesResistanceOhm } = design.multiplier.diode;
    const expected = { saturationCurrentA, emissionCoefficient, seriesResistanceOhm, ...junction };
    for (const name of ['DM_D1', 'DM_D4'])
      expect(fieldsOf(modelCard(netlist, name), DIODE_SPICE_PARAMETERS)).toEqual(expected);
  });

  it('writes the clamp diodes’ junction fields: the zener’s breakdown is its clamp voltage', () => {
    const { driver } = testerDriver();
    driver.clamp = { kind: 'zener', clampVoltageV: 45, junctionCapacitanceF: 200e-12, breakdownCurrentA: 5e-3 };
    const zener = modelCard(toSpiceNetlist(buildDriverCircuit(driver)), 'DM_Dz');
    expect(zener).toMatchObject({ BV: 45, IBV: 5e-3, CJO: 200e-12, VJ: 1, M: 0.5 });
    driver.clamp = {
      kind: 'rcd',
      junctionCapacitanceF: 30e-12,
      gradingCoefficient: 0.45,
      breakdownVoltageV: 200,
    };
    const rcd = modelCard(toSpiceNetlist(buildDriverCircuit(driver)), 'DM_Dc');
    expect(rcd).toMatchObject({ CJO: 30e-12, VJ: 1, M: 0.45, BV: 200, IBV: 1e-3 });
  });
});
