/** Thermal voltage kT/q at 27 °C (300.15 K), the SPICE nominal temperature. CODATA 2018 constants. */
export const THERMAL_VOLTAGE_V = (1.380649e-23 * 300.15) / 1.602176634e-19;

/** Conductance SPICE places across every junction so that a reverse-biased junction is never open. */
export const JUNCTION_GMIN_S = 1e-12;

/** Critical voltage of a junction, where the exponential's curvature is largest: n·Vt·ln(n·Vt/(√2·Is)). */
export function criticalVoltageV(saturationCurrentA: number, emissionVoltageV: number): number {
  return emissionVoltageV * Math.log(emissionVoltageV / (Math.SQRT2 * saturationCurrentA));
}

let limited = false;

/** True when the last call to limitJunctionVoltage changed its input. */
export function wasLimited(): boolean {
  return limited;
}

/**
 * Limits a Newton update of a junction voltage so that the exponential cannot overflow: above the
 * critical voltage, a step larger than 2·n·Vt is replaced by a logarithmic one (the pnjlim rule of
 * SPICE2, L. W. Nagel, "SPICE2", UCB ERL-M520, 1975).
 */
export function limitJunctionVoltage(newV: number, oldV: number, emissionVoltageV: number, criticalV: number): number {
  limited = false;
  if (newV > criticalV && Math.abs(newV - oldV) > 2 * emissionVoltageV) {
    limited = true;
    let v: number;
    if (oldV > 0) {
      const arg = 1 + (newV - oldV) / emissionVoltageV;
      v = arg > 0 ? oldV + emissionVoltageV * Math.log(arg) : criticalV;
    } else v = emissionVoltageV * Math.log(newV / emissionVoltageV);
    // From a junction below its critical voltage (nearly off), go at least to the critical voltage: the
    // logarithmic rule alone creeps up by a few n·Vt per iteration through a junction that is turning on,
    // costing tens of Newton iterations per diode turn-on in a ladder.
    return oldV < criticalV ? Math.max(v, criticalV) : v;
  }
  return newV;
}

/** Depletion charge and capacitance, with the linear extension above fc·Vj (fc = 0.5) as in SPICE. */
export function depletionCharge(
  voltageV: number,
  zeroBiasCapacitanceF: number,
  potentialV: number,
  grading: number,
  out: { chargeC: number; capacitanceF: number },
): void {
  const fc = 0.5;
  if (zeroBiasCapacitanceF <= 0) {
    out.chargeC = 0;
    out.capacitanceF = 0;
    return;
  }
  if (voltageV < fc * potentialV) {
    const arg = 1 - voltageV / potentialV;
    const sarg = Math.exp(-grading * Math.log(arg));
    out.chargeC = (potentialV * zeroBiasCapacitanceF * (1 - arg * sarg)) / (1 - grading);
    out.capacitanceF = zeroBiasCapacitanceF * sarg;
  } else {
    const f1 = (potentialV * (1 - Math.pow(1 - fc, 1 - grading))) / (1 - grading);
    const f2 = Math.pow(1 - fc, 1 + grading);
    const f3 = 1 - fc * (1 + grading);
    const vf = fc * potentialV;
    const czof2 = zeroBiasCapacitanceF / f2;
    out.chargeC =
      zeroBiasCapacitanceF * f1 +
      czof2 * (f3 * (voltageV - vf) + (grading / (2 * potentialV)) * (voltageV * voltageV - vf * vf));
    out.capacitanceF = czof2 * (f3 + (grading * voltageV) / potentialV);
  }
}
