import { Group, Paper, Text } from '@mantine/core';
import type { DesignReport } from '@ladderwright/shared/analysis';
import type { CapacitorStress, LadderNodeVoltage } from '@ladderwright/shared/multiplier';
import { formatQuantity } from '@ladderwright/shared/units';
import { MethodNote } from './method-note';

export interface LadderDiagramProps {
  report: DesignReport;
}

const columnOrder = ['oscillating', 'oscillating-a', 'oscillating-b', 'bridge', 'smoothing'];
const columnWidth = 150;
const rowHeight = 78;
const padding = { top: 44, left: 40, bottom: 40 };

interface Placed {
  capacitor: CapacitorStress;
  x: number;
  /** The capacitor's top plate; its bottom wire ends one row lower. */
  topY: number;
  /** The ladder node on the top plate (the engine's node voltages), when the report has it. */
  node: LadderNodeVoltage | undefined;
}

/**
 * The ladder as the engine built it: one column per capacitor column, stages from the bottom up, each
 * capacitor with its value and peak voltage, each node with its cycle-mean voltage to ground, the diodes in
 * conduction order and the output node's mean voltage.
 */
export function LadderDiagram({ report }: LadderDiagramProps) {
  const { capacitors, stageCount } = report.analysis;
  const columns = columnOrder.filter((column) => capacitors.some((c) => c.column === column));
  const rows = Math.max(1, ...capacitors.map((c) => c.stage));
  const width = padding.left + columns.length * columnWidth + 60;
  const height = padding.top + rows * rowHeight + padding.bottom;
  const yOfStageTop = (stage: number) => padding.top + (rows - stage) * rowHeight;
  const placed: Placed[] = capacitors.map((capacitor) => ({
    capacitor,
    x: padding.left + columns.indexOf(capacitor.column) * columnWidth + 40,
    topY: yOfStageTop(capacitor.stage) + 18,
    node: report.analysis.nodes?.find((n) => n.capacitorIndex === capacitor.index),
  }));
  const groundY = height - padding.bottom + 8;
  const top = placed.filter((p) => p.capacitor.column === 'smoothing' || p.capacitor.column === 'bridge').at(-1);

  return (
    <Paper withBorder p="sm" role="figure" aria-label="Ladder diagram">
      <Group justify="space-between" mb={4} wrap="nowrap">
        <Text size="sm" fw={600}>
          Ladder ({report.analysis.topology}, {report.analysis.cellCount} cells, {stageCount} stages)
        </Text>
        {/* A report stored before node voltages were computed has no node method. */}
        <MethodNote subject="each node voltage" method={report.analysis.nodeMethod ?? null} />
      </Group>
      <div style={{ overflowX: 'auto' }}>
        <svg
          width={width}
          height={height}
          viewBox={`0 0 ${width} ${height}`}
          role="img"
          aria-label={`Ladder of ${capacitors.length} capacitors; output ${formatQuantity(report.outputMeanV, 'V')}`}
          fontFamily="inherit"
          fontSize={10}
        >
          <line
            x1={padding.left - 20}
            x2={width - 20}
            y1={groundY}
            y2={groundY}
            stroke="currentColor"
            strokeWidth={1.5}
          />
          <text x={padding.left - 20} y={groundY + 14} fill="currentColor">
            0 V (return)
          </text>
          {columns.map((column, i) => (
            <text
              key={column}
              x={padding.left + i * columnWidth + 40}
              y={16}
              textAnchor="middle"
              fill="currentColor"
              fontWeight={600}
            >
              {column} column
            </text>
          ))}
          {placed.map((p, i) => {
            const previous = placed[i - 1];
            const fromX = previous ? previous.x : padding.left - 20;
            const fromY = previous ? previous.topY : groundY;
            return (
              <DiodeSymbol key={`d${i}`} x1={fromX} y1={fromY} x2={p.x} y2={p.topY} label={`D${p.capacitor.index}`} />
            );
          })}
          {placed.map((p) => (
            <CapacitorSymbol key={p.capacitor.index} placed={p} bottomY={Math.min(groundY, p.topY + rowHeight)} />
          ))}
          {top && (
            <g>
              <circle cx={top.x} cy={top.topY} r={4} fill="var(--mantine-color-ember-6)" />
              <text x={top.x + 10} y={top.topY - 10} fill="currentColor" fontWeight={700} fontSize={11}>
                top {formatQuantity(report.analysis.ladderTopMeanV, 'V')} · output{' '}
                {formatQuantity(report.outputMeanV, 'V')}
              </text>
            </g>
          )}
        </svg>
      </div>
    </Paper>
  );
}

function CapacitorSymbol({ placed, bottomY }: { placed: Placed; bottomY: number }) {
  const { capacitor, x, topY, node } = placed;
  const midY = (topY + bottomY) / 2;
  return (
    <g aria-label={`C${capacitor.index}`}>
      <line x1={x} x2={x} y1={topY} y2={midY - 4} stroke="currentColor" strokeWidth={1.5} />
      <line
        x1={x - 12}
        x2={x + 12}
        y1={midY - 4}
        y2={midY - 4}
        stroke="var(--mantine-primary-color-filled)"
        strokeWidth={3}
      />
      <line
        x1={x - 12}
        x2={x + 12}
        y1={midY + 4}
        y2={midY + 4}
        stroke="var(--mantine-primary-color-filled)"
        strokeWidth={3}
      />
      <line x1={x} x2={x} y1={midY + 4} y2={bottomY} stroke="currentColor" strokeWidth={1.5} />
      <circle cx={x} cy={topY} r={2.5} fill="currentColor" />
      {node && (
        <text x={x - 6} y={topY - 5} textAnchor="end" fill="currentColor" aria-label={`node ${node.label} mean`}>
          {formatQuantity(node.meanV, 'V', 3)}
        </text>
      )}
      <text x={x + 16} y={midY - 6} fill="currentColor" fontWeight={600}>
        C{capacitor.index} {formatQuantity(capacitor.valueF, 'F', 3)}
      </text>
      <text x={x + 16} y={midY + 8} fill="currentColor">
        peak {formatQuantity(capacitor.maxVoltageV, 'V', 3)}
      </text>
    </g>
  );
}

function DiodeSymbol({ x1, y1, x2, y2, label }: { x1: number; y1: number; x2: number; y2: number; label: string }) {
  const mx = (x1 + x2) / 2;
  const my = (y1 + y2) / 2;
  const angle = (Math.atan2(y2 - y1, x2 - x1) * 180) / Math.PI;
  return (
    <g>
      <line x1={x1} y1={y1} x2={x2} y2={y2} stroke="currentColor" strokeWidth={1} strokeDasharray="1 0" opacity={0.7} />
      <g transform={`translate(${mx} ${my}) rotate(${angle})`}>
        <path d="M-6 -6 L6 0 L-6 6 Z" fill="var(--mantine-color-body)" stroke="currentColor" strokeWidth={1.3} />
        <line x1={6} x2={6} y1={-6} y2={6} stroke="currentColor" strokeWidth={1.6} />
      </g>
      <text x={mx + 8} y={my + 14} fill="currentColor" opacity={0.8}>
        {label}
      </text>
    </g>
  );
}
