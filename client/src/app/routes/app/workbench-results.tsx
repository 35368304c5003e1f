import { lazy, memo, Suspense, useDeferredValue, useMemo, type ReactNode } from 'react';
import { Loader, Tabs, Text } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import type { Part, RevisionDetail, RevisionSummary } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import type { DesignReport, HeadlineSource } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { OtherFigures } from '../../../features/workbench/components/other-figures';
import { formatDateTime } from '../../../lib/format-date';
import classes from './workbench.module.css';

export interface WorkbenchResultsProps {
  projectId: string;
  revision: RevisionDetail;
  revisions: readonly RevisionSummary[];
  draft: Design;
  isDirty: boolean;
  report: DesignReport;
  /** False in an archived project: no simulation job can be started. */
  canSimulate: boolean;
  /** The saved revision's figures with their source (a current stored simulation or the estimate); null for a draft. */
  headline?: HeadlineSource | null;
  /** The project's Parts shelf, for the transformer Sizer. */
  shelf?: readonly Part[];
  /** Replaces the draft as one undoable edit (absent when the design is read-only: no Apply). */
  onDraftChange?: (next: Design) => void;
}

// Result tabs other than the first load with their tab (keepMounted is off), not with the page.
const RevisionHistory = lazy(() =>
  import('../../../features/designs/components/revision-history').then((module) => ({
    default: module.RevisionHistory,
  })),
);
const BomCost = lazy(() =>
  import('../../../features/parts/components/bom-cost').then((module) => ({ default: module.BomCost })),
);
const WaveformsPanel = lazy(() =>
  import('../../../features/simulations/components/waveforms-panel').then((module) => ({
    default: module.WaveformsPanel,
  })),
);
const ChecksTable = lazy(() =>
  import('../../../features/workbench/components/checks-table').then((module) => ({ default: module.ChecksTable })),
);
const DriverPanel = lazy(() =>
  import('../../../features/workbench/components/driver-panel').then((module) => ({ default: module.DriverPanel })),
);
// The core Sizer reads the driver's figures with the driver engine: that code loads with the Transformer tab.
const DesignTransformerSizer = lazy(() =>
  import('../../../features/sizer/components/design-transformer-sizer').then((module) => ({
    default: module.DesignTransformerSizer,
  })),
);
const TransformerPanel = lazy(() =>
  import('../../../features/workbench/components/transformer-panel').then((module) => ({
    default: module.TransformerPanel,
  })),
);
// The first tab's charts too: the figures beside them show while the chart code arrives.
const LadderCharts = lazy(() =>
  import('../../../features/workbench/components/ladder-charts').then((module) => ({ default: module.LadderCharts })),
);
const LadderDiagram = lazy(() =>
  import('../../../features/workbench/components/ladder-diagram').then((module) => ({ default: module.LadderDiagram })),
);

/** How long the report must stay unchanged (ms) before the result tabs draw it: about one pause in typing. */
const RESULT_TABS_SETTLE_MS = 250;

/** The plots change only with the report, not with every keystroke that has not reached the engine yet. */
const PlotsPanel = memo(function PlotsPanel({ report }: { report: DesignReport }) {
  return (
    <>
      <OtherFigures report={report} />
      <Suspense fallback={<Loader size="sm" aria-label="Loading the charts" />}>
        <LadderCharts report={report} />
      </Suspense>
    </>
  );
});

/**
 * One result tab's panel. Its code loads when the tab is first opened: the panel waits for it alone, so the row of
 * tabs stays in place instead of giving way to the loader.
 */
function ResultPanel({ value, children }: { value: string; children: ReactNode }) {
  return (
    <Tabs.Panel value={value} pt="sm">
      <Suspense fallback={<Loader size="sm" aria-label="Loading the tab" />}>{children}</Suspense>
    </Tabs.Panel>
  );
}

/** The Workbench result tabs: Plots, Driver, Transformer (with a driver: the section's figures and the core Sizer), Ladder, Checks, BOM cost, Waveforms, History. */
export function WorkbenchResults({
  projectId,
  revision,
  revisions,
  draft: latestDraft,
  isDirty,
  report: latestReport,
  canSimulate,
  headline = null,
  shelf = [],
  onDraftChange,
}: WorkbenchResultsProps) {
  // The tabs draw charts and the schematic, which costs far more than the Verdict strip: they follow the report
  // once typing pauses (a burst of keystrokes redraws them once, not per key) and then at low priority, so a newer
  // keystroke interrupts their render instead of waiting for it.
  const latest = useMemo(() => ({ report: latestReport, draft: latestDraft }), [latestReport, latestDraft]);
  const [settled] = useDebouncedValue(latest, RESULT_TABS_SETTLE_MS);
  const { report, draft } = useDeferredValue(settled);
  return (
    <Tabs defaultValue="plots" keepMounted={false} classNames={{ list: classes.resultTabList, tab: classes.resultTab }}>
      <Tabs.List>
        <Tabs.Tab value="plots">Plots</Tabs.Tab>
        {report.driver && <Tabs.Tab value="driver">Driver</Tabs.Tab>}
        {report.driver && <Tabs.Tab value="transformer">Transformer</Tabs.Tab>}
        <Tabs.Tab value="ladder">Ladder</Tabs.Tab>
        <Tabs.Tab value="checks">Checks</Tabs.Tab>
        <Tabs.Tab value="bom">BOM cost</Tabs.Tab>
        <Tabs.Tab value="waveforms">Waveforms</Tabs.Tab>
        <Tabs.Tab value="history">History</Tabs.Tab>
      </Tabs.List>
      <ResultPanel value="plots">
        <PlotsPanel report={report} />
      </ResultPanel>
      {report.driver && (
        <ResultPanel value="driver">
          <DriverPanel driver={report.driver} />
        </ResultPanel>
      )}
      {report.driver && (
        <ResultPanel value="transformer">
          {report.transformer ? (
            <TransformerPanel transformer={report.transformer} />
          ) : (
            <Text size="sm" mb="xs">
              The driver runs on given transformer numbers. Rank the shelf’s cores for it below, and apply one to design
              the transformer from a core.
            </Text>
          )}
          <Suspense fallback={<Loader size="sm" aria-label="Loading the core Sizer" />}>
            <DesignTransformerSizer
              key={`${revision.designId}.${revision.number}`}
              draft={draft}
              latestDraft={latestDraft}
              report={report}
              shelf={shelf}
              {...(onDraftChange ? { onDraftChange } : {})}
            />
          </Suspense>
        </ResultPanel>
      )}
      <ResultPanel value="ladder">
        <LadderDiagram report={report} design={draft} />
      </ResultPanel>
      <ResultPanel value="checks">
        <Text size="xs" c="dimmed" mb="xs">
          {report.caution}
        </Text>
        <Text size="xs" mb="xs" data-checks-source>
          {headline?.source === 'simulation'
            ? headline.simulatedKeys.includes('discharge')
              ? 'The discharge-time check rests on the stored simulation of this revision; the others on the estimate.'
              : 'Every check rests on the estimate; the stored simulation gives no figure a check tests.'
            : 'Every check rests on the estimate.'}
        </Text>
        <ChecksTable checks={report.checks} />
      </ResultPanel>
      <ResultPanel value="bom">
        <BomCost projectId={projectId} design={draft} />
      </ResultPanel>
      <ResultPanel value="waveforms">
        {headline?.source === 'simulation' && headline.simulatedAt && (
          <Text size="sm" mb="xs" data-current-simulation>
            The headline figures come from the full simulation of r{revision.number} that finished{' '}
            {formatDateTime(headline.simulatedAt)}
            {headline.notSettledWithinS !== null &&
              ` (it had not settled within ${formatQuantity(headline.notSettledWithinS, 's')} of simulated time)`}
            ; start a run to see its waveforms again.
          </Text>
        )}
        <WaveformsPanel
          projectId={projectId}
          source={isDirty ? { document: draft } : { designId: revision.designId, revisionNumber: revision.number }}
          frequencyHz={report.resolvedDrive.frequencyHz}
          safeVoltageV={draft.targets.safeVoltageV}
          isDriverDesign={draft.drive.kind === 'driver'}
          canStart={canSimulate}
          hasStoredRun={!isDirty && headline?.source === 'simulation'}
        />
      </ResultPanel>
      <ResultPanel value="history">
        <RevisionHistory
          projectId={projectId}
          designId={revision.designId}
          revisions={revisions}
          openRevisionNumber={revision.number}
        />
      </ResultPanel>
    </Tabs>
  );
}
