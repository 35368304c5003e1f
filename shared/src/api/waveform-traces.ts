/**
 * Names of the traces of a simulation result (`WaveformTrace.name`), in the simulator's SPICE notation:
 * the worker names them, the Waveforms panel reads and labels them.
 */
export const TRACE_NAMES = {
  /** Ladder top, the output before the series output resistor. */
  output: 'V(top)',
  /** Load terminal, after the series output resistor. */
  loadTerminal: 'V(out)',
  /** Driver designs: collector to ground (steady state). */
  collector: 'V(col)',
  /** Driver designs: the secondary's driven end to ground (steady state). */
  secondary: 'V(s)',
  /** Driver designs: primary winding current (steady state). */
  primaryCurrent: 'I(Lp)',
} as const;

/** The trace of one capacitor's own voltage: 'V(C3)' for capacitor C3. */
export function capacitorTraceName(capacitor: string): string {
  return `V(${capacitor})`;
}

/** The capacitor whose voltage a trace is ('C3' for 'V(C3)'), or null for any other trace. */
export function capacitorOfTrace(name: string): string | null {
  return /^V\((C\d+)\)$/.exec(name)?.[1] ?? null;
}
