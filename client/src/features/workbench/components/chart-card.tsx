import type { ReactElement, ReactNode } from 'react';
import { Group, Paper, Text } from '@mantine/core';
import { ResponsiveContainer } from 'recharts';
import { MethodNote, type MethodNoteProps } from './method-note';

export interface ChartCardProps {
  /** Accessible name of the figure. */
  label: string;
  title: string;
  method: Pick<MethodNoteProps, 'subject' | 'method'>;
  heightPx: number;
  /** One recharts chart, sized by the card. */
  children: ReactElement;
  footer?: ReactNode;
}

/** The frame every Workbench result chart shares: title, method note, a sized chart and a line under it. */
export function ChartCard({ label, title, method, heightPx, children, footer }: ChartCardProps) {
  return (
    <Paper withBorder p="sm" role="figure" aria-label={label}>
      <Group justify="space-between" mb={4}>
        <Text size="sm" fw={600}>
          {title}
        </Text>
        <MethodNote subject={method.subject} method={method.method} />
      </Group>
      <div style={{ width: '100%', height: heightPx }}>
        <ResponsiveContainer>{children}</ResponsiveContainer>
      </div>
      {footer}
    </Paper>
  );
}
