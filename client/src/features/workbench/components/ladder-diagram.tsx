import { useMemo, useState } from 'react';
import { Group, SegmentedControl, Text } from '@mantine/core';
import type { Design } from '@ladderwright/shared/designs';
import type { DesignReport } from '@ladderwright/shared/analysis';
import { layoutSchematic } from '@ladderwright/shared/schematic';
import { formatQuantity } from '@ladderwright/shared/units';
import { ChartFrame } from '../../../components/chart-frame';
import { SchematicDrawing } from '../../../components/schematic-drawing';
import { MethodNote } from './method-note';

/** Fitted to the width of the results column (the default), or at the drawing's own size, scrolling sideways. */
type SchematicScale = 'fit' | 'full';

export interface LadderDiagramProps {
  report: DesignReport;
  /** The document the report is of: the drive, parts and output network drawn. */
  design: Design;
}

/**
 * The whole circuit as one schematic (shared layout, also on the spec sheet): drive, secondary, ladder, bleeder and
 * load, every node's mean voltage, every part's value and worst verdict.
 */
export function LadderDiagram({ report, design }: LadderDiagramProps) {
  const layout = useMemo(() => layoutSchematic(design, report), [design, report]);
  const [scale, setScale] = useState<SchematicScale>('fit');
  const { analysis } = report;
  return (
    <ChartFrame
      label="Circuit schematic"
      title={`Schematic (${analysis.topology}, ${analysis.cellCount} cells, ${analysis.stageCount} stages)`}
      actions={
        <Group gap={6} wrap="nowrap">
          <MethodNote subject="each node voltage" method={analysis.nodeMethod ?? null} />
          <SegmentedControl
            size="xs"
            aria-label="Schematic size"
            value={scale}
            onChange={(value) => setScale(value === 'full' ? 'full' : 'fit')}
            data={[
              { value: 'fit', label: 'Fit width' },
              { value: 'full', label: 'Full size' },
            ]}
          />
        </Group>
      }
      footer={
        <Text size="xs" c="dimmed" mt={4}>
          Node voltages are cycle means to the 0 V return; ✓ pass, ! marginal, ✗ fail is each part’s worst check with
          its margin. Output {formatQuantity(report.outputMeanV, 'V')}.
        </Text>
      }
    >
      {/* The fitted drawing opens at full size on a click too (the switch above is the keyboard's way). */}
      <div
        style={scale === 'full' ? { overflowX: 'auto' } : { overflowX: 'hidden', cursor: 'zoom-in' }}
        onClick={scale === 'fit' ? () => setScale('full') : undefined}
      >
        <SchematicDrawing
          isFitted={scale === 'fit'}
          layout={layout}
          label={`Schematic of ${analysis.capacitors.length} capacitors; output ${formatQuantity(report.outputMeanV, 'V')}`}
        />
      </div>
    </ChartFrame>
  );
}
