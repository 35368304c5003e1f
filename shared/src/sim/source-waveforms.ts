import type { SourceWaveform } from './circuit.types';

/** Value of a source waveform at timeS, with the SPICE meaning of SIN, PULSE and PWL. */
export function waveformValue(w: SourceWaveform, timeS: number): number {
  switch (w.kind) {
    case 'dc':
      return w.value;
    case 'sine': {
      const phase = ((w.phaseDeg ?? 0) * Math.PI) / 180;
      const t = timeS - (w.delayS ?? 0);
      return w.offset + w.amplitude * Math.sin(t > 0 ? 2 * Math.PI * w.frequencyHz * t + phase : phase);
    }
    case 'pulse': {
      if (timeS <= w.delayS) return w.initial;
      let t = timeS - w.delayS;
      if (w.periodS > 0) t -= Math.floor(t / w.periodS) * w.periodS;
      if (t < w.riseS) return w.initial + ((w.pulsed - w.initial) * t) / w.riseS;
      if (t <= w.riseS + w.widthS) return w.pulsed;
      if (t < w.riseS + w.widthS + w.fallS)
        return w.pulsed + ((w.initial - w.pulsed) * (t - w.riseS - w.widthS)) / w.fallS;
      return w.initial;
    }
    case 'pwl': {
      const p = w.points;
      if (p.length === 0) return 0;
      if (timeS <= p[0]!.timeS) return p[0]!.value;
      for (let i = 1; i < p.length; i++) {
        const b = p[i]!;
        if (timeS <= b.timeS) {
          const a = p[i - 1]!;
          return b.timeS === a.timeS
            ? b.value
            : a.value + ((b.value - a.value) * (timeS - a.timeS)) / (b.timeS - a.timeS);
        }
      }
      return p[p.length - 1]!.value;
    }
  }
}

/** First corner of the waveform strictly after afterS (Infinity when none): the stepper lands on it. */
export function nextWaveformBreakpoint(w: SourceWaveform, afterS: number): number {
  const eps = 1e-15 + Math.abs(afterS) * 1e-12;
  switch (w.kind) {
    case 'dc':
      return Infinity;
    case 'sine': {
      const d = w.delayS ?? 0;
      return d > afterS + eps ? d : Infinity;
    }
    case 'pulse': {
      const corners = [0, w.riseS, w.riseS + w.widthS, w.riseS + w.widthS + w.fallS];
      if (afterS + eps < w.delayS) return w.delayS;
      const per = w.periodS > 0 ? w.periodS : Infinity;
      const k0 = Number.isFinite(per) ? Math.floor((afterS - w.delayS) / per) : 0;
      for (let k = k0; k <= k0 + 1; k++) {
        for (const c of corners) {
          const t = w.delayS + (Number.isFinite(per) ? k * per : 0) + c;
          if (t > afterS + eps) return t;
        }
        if (!Number.isFinite(per)) break;
      }
      return Infinity;
    }
    case 'pwl': {
      for (const pt of w.points) if (pt.timeS > afterS + eps) return pt.timeS;
      return Infinity;
    }
  }
}

/**
 * The period every time-varying waveform repeats with (sine 1/f, pulse its period), or NaN when there is
 * none, a waveform does not repeat (piecewise-linear) or two repeat differently.
 */
export function commonPeriodS(waveforms: ReadonlyArray<SourceWaveform>): number {
  let period = NaN;
  for (const w of waveforms) {
    let p: number;
    if (w.kind === 'dc') continue;
    else if (w.kind === 'sine') p = w.frequencyHz > 0 ? 1 / w.frequencyHz : NaN;
    else if (w.kind === 'pulse') p = w.periodS > 0 ? w.periodS : NaN;
    else return NaN;
    if (!(p > 0)) return NaN;
    if (Number.isNaN(period)) period = p;
    else if (Math.abs(p - period) > 1e-12 * period) return NaN;
  }
  return period;
}
