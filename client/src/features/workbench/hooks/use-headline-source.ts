import { useEffect, useMemo, useState } from 'react';
import {
  estimateHeadline,
  type DesignReport,
  type HeadlineSource,
  type SimulatedFigures,
} from '@ladderwright/shared/analysis';
import type { DesignTargets } from '@ladderwright/shared/designs';

type CompareFigures = (typeof import('../headline-source'))['headlineSource'];

/**
 * The headline of a saved revision (null for none): its stored simulation's figures where there is one
 * (`headlineSource`, loaded with the first simulation it has to read), else its estimate.
 */
export function useHeadlineSource(
  report: DesignReport | null,
  simulation: SimulatedFigures | null,
  targets: DesignTargets,
): HeadlineSource | null {
  const [compare, setCompare] = useState<{ figures: CompareFigures } | null>(null);
  const isNeeded = simulation !== null && compare === null;
  useEffect(() => {
    if (!isNeeded) return;
    let isCurrent = true;
    void import('../headline-source').then((module) => {
      if (isCurrent) setCompare({ figures: module.headlineSource });
    });
    return () => {
      isCurrent = false;
    };
  }, [isNeeded]);
  return useMemo(() => {
    if (report === null) return null;
    if (simulation === null || compare === null) return estimateHeadline(report);
    return compare.figures(report, simulation, targets);
  }, [report, simulation, targets, compare]);
}
