import type { LadderInput, TextbookFigures } from './ladder.types';
import type { MethodInfo } from '../methods';

const TEXTBOOK_METHOD: MethodInfo = {
  methodId: 'textbook-closed-forms',
  summary:
    'Published closed forms for equal stage capacitors: ripple (q/C)·n(n+1)/2, drop ΔV0 = (q/C)(2n³/3 + n²/2 − n/6), regulation ΔV0/(2nVmax), n_opt = √(Vmax f C / I); doubler with C1, C2: ripple q/C2, drop q(1/C1 + 1/(2C2)); full-wave ripple I·n/(2fC).',
  assumptions: [
    'ideal diodes, zero source impedance, q = I/f with I the ladder current (load plus bleeder)',
    'Vmax is the peak of the secondary (half its peak-to-peak for a pulse drive)',
    'ripple is peak-to-peak; the half-wave ΔV0 is the drop of the peak output, the doubler drop is to the mean',
  ],
  source:
    'J. Lux, "Cockcroft Walton Voltage Multipliers" (read); FOSSEE Scilab companions (read); Kuffel, Zaengl & Kuffel §2.2.2 (from memory)',
};

function allEqual(values: readonly number[]): boolean {
  const first = values[0] ?? 0;
  return values.every((v) => Math.abs(v - first) <= 1e-12 * Math.abs(first));
}

/** Published closed forms where their stated conditions hold (REFERENCES.md §1–2). */
export function textbookFigures(input: LadderInput, ladderCurrentA: number): TextbookFigures {
  const caps = input.capacitorsF;
  const f = input.drive.frequencyHz;
  const vmax =
    input.drive.kind === 'sine' ? input.drive.peakV : (input.drive.forwardPeakV + input.drive.flybackPeakV) / 2;
  const q = ladderCurrentA / f;
  const none: TextbookFigures = {
    rippleV: null,
    dropV: null,
    regulation: null,
    optimumStages: null,
    method: TEXTBOOK_METHOD,
  };
  if (input.topology === 'half-wave' && caps.length % 2 === 0) {
    const n = caps.length / 2;
    if (n === 1 && !allEqual(caps)) {
      const c1 = caps[0] as number;
      const c2 = caps[1] as number;
      const dropV = q * (1 / c1 + 1 / (2 * c2));
      return { rippleV: q / c2, dropV, regulation: dropV / (2 * vmax), optimumStages: null, method: TEXTBOOK_METHOD };
    }
    if (!allEqual(caps)) return none;
    const c = caps[0] as number;
    const dropV = (q / c) * ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6);
    return {
      rippleV: ((q / c) * n * (n + 1)) / 2,
      dropV,
      regulation: dropV / (2 * n * vmax),
      optimumStages: ladderCurrentA > 0 ? Math.sqrt((vmax * f * c) / ladderCurrentA) : null,
      method: TEXTBOOK_METHOD,
    };
  }
  if (input.topology === 'full-wave' && allEqual(caps)) {
    const n = caps.length / 3;
    return { ...none, rippleV: (ladderCurrentA * n) / (2 * f * (caps[0] as number)) };
  }
  return none;
}
