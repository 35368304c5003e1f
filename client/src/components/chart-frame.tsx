import { useRef, useState, type ReactNode } from 'react';
import { Button, Group, Menu, Paper, Text } from '@mantine/core';
import { chartCsv, chartFileName, downloadFile, standaloneSvg, svgToPng, type CsvColumn } from '../lib/chart-export';

export interface ChartFrameData {
  columns: readonly CsvColumn[];
  rows: readonly Readonly<Record<string, unknown>>[];
}

export interface ChartFrameProps {
  /** Accessible name of the figure. */
  label: string;
  title: string;
  /** Beside the title, e.g. a method note. */
  actions?: ReactNode;
  /** What the CSV export writes; without it the frame offers only the drawing. */
  data?: ChartFrameData;
  /** The drawing; its first `svg` is what PNG and SVG export write. */
  children: ReactNode;
  footer?: ReactNode;
}

/**
 * The frame every chart and drawing shares: title, actions, an Export menu (PNG, SVG of what is drawn; CSV of
 * the data in SI units) and a line under it.
 */
export function ChartFrame({ label, title, actions, data, children, footer }: ChartFrameProps) {
  const bodyRef = useRef<HTMLDivElement>(null);
  const [exportError, setExportError] = useState<string | null>(null);
  const fileName = chartFileName(title);

  const drawn = () => {
    const svg = bodyRef.current?.querySelector('svg');
    if (!svg) throw new Error('nothing is drawn yet');
    // A drawing scaled to fit its box is written at its own size (its attributes); a chart's attributes are its size.
    const box = svg.getBoundingClientRect();
    const widthPx = Number(svg.getAttribute('width')) || Math.round(box.width) || 600;
    const heightPx = Number(svg.getAttribute('height')) || Math.round(box.height) || 300;
    return { markup: standaloneSvg(svg, widthPx, heightPx), widthPx, heightPx };
  };
  const run = (task: () => Promise<void> | void) => {
    setExportError(null);
    Promise.resolve()
      .then(task)
      .catch((error: unknown) => setExportError(error instanceof Error ? error.message : String(error)));
  };

  return (
    <Paper withBorder p="sm" role="figure" aria-label={label}>
      <Group justify="space-between" mb={4} wrap="nowrap" gap="xs">
        <Group gap={6} wrap="nowrap">
          <Text size="sm" fw={600}>
            {title}
          </Text>
          {actions}
        </Group>
        <Menu position="bottom-end" withinPortal>
          <Menu.Target>
            <Button size="compact-xs" variant="subtle" aria-label={`Export ${title}`}>
              Export
            </Button>
          </Menu.Target>
          <Menu.Dropdown>
            <Menu.Item
              onClick={() =>
                run(async () => {
                  const { markup, widthPx, heightPx } = drawn();
                  downloadFile(await svgToPng(markup, widthPx, heightPx), `${fileName}.png`, 'image/png');
                })
              }
            >
              PNG image
            </Menu.Item>
            <Menu.Item onClick={() => run(() => downloadFile(drawn().markup, `${fileName}.svg`, 'image/svg+xml'))}>
              SVG drawing
            </Menu.Item>
            {data && (
              <Menu.Item
                onClick={() =>
                  run(() => downloadFile(chartCsv(data.columns, data.rows), `${fileName}.csv`, 'text/csv'))
                }
              >
                CSV data
              </Menu.Item>
            )}
          </Menu.Dropdown>
        </Menu>
      </Group>
      <div ref={bodyRef}>{children}</div>
      {exportError && (
        <Text size="xs" c="red" role="alert">
          Not exported: {exportError}
        </Text>
      )}
      {footer}
    </Paper>
  );
}
