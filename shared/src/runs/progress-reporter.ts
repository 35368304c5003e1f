/** Smallest rise of the fraction that is reported (bounds the rate of `onProgress` calls). */
const PROGRESS_STEP = 0.01;

/** Wraps `onProgress`: clamps to 0..1, never goes back, reports a rise of at least PROGRESS_STEP (or a forced one). */
export function progressReporter(
  onProgress: ((fraction: number) => void) | undefined,
): (fraction: number, isForced?: boolean) => void {
  let reported = -Infinity;
  return (fraction, isForced = false) => {
    if (!onProgress) return;
    const f = Math.min(1, Math.max(reported, fraction, 0));
    if (f >= reported + PROGRESS_STEP || (isForced && f > reported)) {
      reported = f;
      onProgress(f);
    }
  };
}
