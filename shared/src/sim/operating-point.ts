import { DomainError } from '../errors';
import type { SimulationTolerances } from './circuit.types';
import type { MnaSystem } from './mna-system';
import { solveNewton } from './newton';

/**
 * DC operating point: Newton at t = 0 with capacitors open and windings shorted through their resistance;
 * on failure, gmin stepping (a shunt from every node to ground, 1e-2 S down by decades to none).
 */
export function solveOperatingPoint(system: MnaSystem, timeS: number, tolerances: SimulationTolerances): void {
  system.hist.fill(0);
  system.prepareLinearMatrix(0, timeS);
  system.prepareStepRhs(timeS);
  system.shuntConductanceS = 0;
  if (solveNewton(system, 0, tolerances, 100) > 0) return;
  system.x.fill(0);
  for (let exponent = -2; exponent >= -13; exponent--) {
    system.shuntConductanceS = exponent === -13 ? 0 : 10 ** exponent;
    if (solveNewton(system, 0, tolerances, 100) < 0) {
      system.shuntConductanceS = 0;
      throw new DomainError('not_converged', 'no DC operating point (gmin stepping failed)', null, [
        { path: 'operatingPoint', message: `gmin ${10 ** exponent} S` },
      ]);
    }
  }
  system.shuntConductanceS = 0;
}
