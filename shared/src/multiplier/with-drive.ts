import type { PulseDrive, SineDrive } from '../designs/design.types';
import { prepareLadder, type PreparedLadder } from './analyze-ladder';
import { driveTiming } from './drive-timing';

/**
 * The same prepared ladder driven by another waveform of the same kind, for sweeps over the drive (the
 * driver's operating point). A workspace depends on the drive only through its timing and, for flat-top
 * drives, on the kind alone (the plateau rates are per ampere of load), so only the timing is replaced;
 * another kind or a drive outside the model's range is prepared afresh (which reports the range error).
 * The work arrays are shared: use one at a time.
 */
export function withDrive(prepared: PreparedLadder, drive: SineDrive | PulseDrive): PreparedLadder {
  const redriven = withDriveTiming(prepared, drive);
  return redriven === prepared ? { input: { ...prepared.input, drive }, workspace: prepared.workspace } : redriven;
}

/**
 * `withDrive` for callers that read only the solved output (`terminalMeanAt`), thousands of times in the
 * driver's operating point: the same object back with the workspace's timing replaced, its `input` still
 * naming the drive it was prepared with. Another kind or a drive out of range is prepared afresh, as there.
 */
export function withDriveTiming(prepared: PreparedLadder, drive: SineDrive | PulseDrive): PreparedLadder {
  const isSameKind = (drive.kind === 'sine') === prepared.workspace.timing.isSine;
  const isInRange =
    drive.frequencyHz > 0 && (drive.kind === 'sine' ? drive.peakV > 0 : drive.dutyCycle > 0 && drive.dutyCycle < 1);
  if (!isSameKind || !isInRange) return prepareLadder({ ...prepared.input, drive });
  prepared.workspace.timing = driveTiming(drive, prepared.input.polarity);
  return prepared;
}
