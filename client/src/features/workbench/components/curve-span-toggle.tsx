import { useState } from 'react';
import { Button } from '@mantine/core';

/**
 * Which load-current range an output-vs-load plot shows: near the operating load first (when `nearRange` says the
 * whole curve would press the load against the y-axis), the whole curve on request.
 */
export function useCurveSpan(nearRange: readonly [number, number] | undefined, wholeRange?: readonly [number, number]) {
  const [isWholeCurve, setWholeCurve] = useState(false);
  const isNearLoad = nearRange !== undefined && !isWholeCurve;
  const toggle =
    nearRange === undefined ? null : (
      <Button size="compact-xs" variant="subtle" flex="none" onClick={() => setWholeCurve(!isWholeCurve)}>
        {isWholeCurve ? 'Near the load' : 'Whole curve'}
      </Button>
    );
  return { range: isNearLoad ? nearRange : wholeRange, toggle };
}
