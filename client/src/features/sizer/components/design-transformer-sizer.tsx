import { useMemo } from 'react';
import { Paper, Title } from '@mantine/core';
import type { Part } from '@ladderwright/shared/api';
import {
  driverSizerFigures,
  sectionAssessor,
  withTransformerSection,
  type DesignReport,
} from '@ladderwright/shared/analysis';
import type { Design } from '@ladderwright/shared/designs';
import type { TransformerSection } from '@ladderwright/shared/transformer';
import { TransformerSizerPanel } from './transformer-sizer-panel';

interface Props {
  /** The design the result tabs show (it may lag a pause behind the typing). */
  draft: Design;
  /** The latest draft: a chosen core is applied to it, so no keystroke typed since is lost. */
  latestDraft: Design;
  report: DesignReport;
  shelf: readonly Part[];
  /** Replaces the draft as one undoable edit (absent when the design is read-only: no Apply). */
  onDraftChange?: (next: Design) => void;
}

/**
 * The transformer Sizer on the open design: its driver's figures in, a chosen core applied to the draft. It
 * loads with the Transformer tab, since reading the driver's figures takes the driver engine.
 */
export function DesignTransformerSizer({ draft, latestDraft, report, shelf, onDraftChange }: Props) {
  // With a designed transformer this analyses the design once more on its given numbers: once per report.
  const figures = useMemo(() => driverSizerFigures(draft, report), [draft, report]);
  // What each ranked core does to the rest of this design: one engine run per fitting core, on Rank.
  const assess = useMemo(() => sectionAssessor(draft), [draft]);
  if (!figures) return null;
  const section = draft.drive.kind === 'driver' ? draft.drive.driver.transformerDesign : undefined;
  const wireOf = (role: 'primary' | 'secondary') => section?.windings.find((w) => w.role === role)?.wire.code;
  const primaryWireCode = wireOf('primary');
  const secondaryWireCode = wireOf('secondary');
  const onApply = onDraftChange
    ? (chosen: TransformerSection) => onDraftChange(withTransformerSection(latestDraft, chosen))
    : undefined;
  return (
    <Paper component="section" withBorder p="sm" mt="md" aria-label="Transformer cores for this driver">
      <Title order={4} mb="xs">
        Transformer cores for this driver
      </Title>
      <TransformerSizerPanel
        shelf={shelf}
        design={{
          name: draft.name,
          figures,
          spacing: draft.targets.spacing,
          ...(primaryWireCode ? { primaryWireCode } : {}),
          ...(secondaryWireCode ? { secondaryWireCode } : {}),
        }}
        {...(onApply ? { onApply } : {})}
        assess={assess}
      />
    </Paper>
  );
}
