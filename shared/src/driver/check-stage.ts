import { DomainError } from '../errors';
import type { DriverStage } from '../designs/driver-stage.types';

/** Refuses a stage whose inductance, turns, coupling or base resistance cannot oscillate. */
export function checkStage(driver: DriverStage): void {
  const tx = driver.transformer;
  if (!(tx.primaryInductanceH > 0))
    throw new DomainError(
      'invalid_design',
      'primary inductance must be positive',
      'driver.transformer.primaryInductanceH',
    );
  if (!(tx.primaryTurns > 0 && tx.secondaryTurns > 0 && tx.feedbackTurns > 0)) {
    throw new DomainError('invalid_design', 'turns must be positive', 'driver.transformer.primaryTurns');
  }
  if (!(tx.couplingCoefficient > 0 && tx.couplingCoefficient <= 1)) {
    throw new DomainError(
      'invalid_design',
      'coupling coefficient must be in (0, 1]',
      'driver.transformer.couplingCoefficient',
    );
  }
  if (!(driver.baseResistorOhm + tx.feedbackResistanceOhm > 0)) {
    throw new DomainError('invalid_design', 'base resistor must be positive', 'driver.baseResistorOhm');
  }
}
