import type { SimulationTolerances } from './circuit.types';
import type { MnaSystem } from './mna-system';

/**
 * Newton–Raphson at the present integration coefficients until the update is within tolerance and no
 * junction voltage was limited. x holds the initial guess and receives the solution. Returns the number
 * of iterations, or −1 when it did not converge. With `acceptOnDeviceTest`, a solve whose junctions all
 * pass the device test is accepted without the node-voltage test (see below); the shooting method,
 * which differentiates the period map, keeps the full test.
 */
export function solveNewton(
  system: MnaSystem,
  a0: number,
  tolerances: SimulationTolerances,
  maxIterations: number,
  acceptOnDeviceTest = false,
): number {
  const x = system.x;
  const n = system.size;
  let isVoltage: Uint8Array | null = null;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const limited = system.load(a0);
    const next = system.solveLoaded();
    // Node voltages of a ladder are kilovolts, so reltol on them alone lets a junction move by a volt;
    // SPICE's device test on each junction's current closes that gap (L. W. Nagel, SPICE2, 1975).
    let converged = !limited && system.devicesConverged(next, tolerances.relative, tolerances.currentAbsoluteA);
    if (converged && acceptOnDeviceTest && !system.hasNonlinearCharges) {
      // Every nonlinearity is a junction current and each passed its test, so the linear system just
      // solved is the circuit's own to within the current tolerances: the increment of the linear
      // unknowns (capacitor nodes, branch currents) says nothing more. SPICE's node test would only make
      // an exact linear step, from a predictor that was off, wait one more solve.
      for (let i = 0; i < n; i++) {
        const xn = next[i]!;
        if (!Number.isFinite(xn)) return -1;
        x[i] = xn;
      }
      return iteration;
    }
    // A junction's or core's charge is evaluated where the iteration linearized it, so a solve accepted at
    // the first iteration would leave those charges at the predictor, off by up to the node tolerance; the
    // truncation-error test then reads that scatter as a fast change and collapses the step (a ladder at
    // ~10 kV on a 12 V oscillator). SPICE3 never accepts the first iteration (niiter.c), nor do we here.
    if (iteration === 1 && system.hasNonlinearCharges) converged = false;
    isVoltage ??= nodeMask(system);
    for (let i = 0; i < n; i++) {
      const xn = next[i]!;
      if (!Number.isFinite(xn)) return -1;
      if (converged) {
        const xo = x[i]!;
        const tol =
          tolerances.relative * Math.max(Math.abs(xn), Math.abs(xo)) +
          (isVoltage[i] ? tolerances.voltageAbsoluteV : tolerances.currentAbsoluteA * 1e3);
        if (Math.abs(xn - xo) > tol) converged = false;
      }
      x[i] = xn;
    }
    if (converged) return iteration;
  }
  return -1;
}

const masks = new WeakMap<MnaSystem, Uint8Array>();
function nodeMask(system: MnaSystem): Uint8Array {
  let m = masks.get(system);
  if (!m) {
    m = new Uint8Array(system.size).fill(1);
    for (const b of system.branchIndex.values()) m[b] = 0;
    masks.set(system, m);
  }
  return m;
}
