import { Group, Paper, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import type { DriverReport } from '@ladderwright/shared/driver';
import type { QuantityUnit } from '@ladderwright/shared/units';
import { formatQuantity } from '@ladderwright/shared/units';
import { DriverOperatingCurve } from './driver-operating-curve';
import { MethodNote } from './method-note';

export interface DriverPanelProps {
  driver: DriverReport;
}

const rows: { key: keyof DriverReport['figures']; label: string; unit: QuantityUnit | '' }[] = [
  { key: 'onTimeS', label: 'On-time', unit: 's' },
  { key: 'peakPrimaryCurrentA', label: 'Peak primary current', unit: 'A' },
  { key: 'flybackTimeS', label: 'Flyback time', unit: 's' },
  { key: 'frequencyHz', label: 'Frequency', unit: 'Hz' },
  { key: 'energyPerCycleJ', label: 'Energy per cycle', unit: 'J' },
  { key: 'deliverablePowerW', label: 'Deliverable power', unit: 'W' },
  { key: 'forwardSecondaryPeakV', label: 'Forward secondary peak', unit: 'V' },
  { key: 'flybackSecondaryPeakV', label: 'Flyback secondary peak', unit: 'V' },
  { key: 'collectorPeakV', label: 'Collector peak voltage', unit: 'V' },
  { key: 'baseCurrentA', label: 'Base current', unit: 'A' },
  { key: 'inputCurrentA', label: 'Input current', unit: 'A' },
  { key: 'efficiency', label: 'Efficiency', unit: '' },
];

/** The driver section of a report: the operating point and its curve, the stage's figures with their method notes, battery life. */
export function DriverPanel({ driver }: DriverPanelProps) {
  const { figures, operatingPoint: op, batteryLife } = driver;
  return (
    <Paper withBorder p="sm" aria-label="Driver stage">
      <Stack gap="xs">
        <Title order={4}>Driver stage</Title>
        <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="xs">
          <Text size="sm" data-driver="limited-by">
            {op.limitedBy === 'power'
              ? 'power-limited: the driver sets the output'
              : 'ladder-limited: flyback at its clamp'}
          </Text>
          <Group gap={4}>
            <Text size="sm">output at the rated load {formatQuantity(op.ratedLoad.outputV, 'V')}</Text>
            <MethodNote subject="operating point" method={op.method} />
          </Group>
          <Text size="sm">power limit above {formatQuantity(op.powerLimitOnsetA, 'A')}</Text>
        </SimpleGrid>
        <DriverOperatingCurve operatingPoint={op} />
        <Table fz="sm" verticalSpacing={2} aria-label="Driver figures">
          <Table.Tbody>
            {rows.map((row) => {
              const figure = figures[row.key];
              if (typeof figure === 'string') return null;
              const value =
                row.unit === '' ? `${(figure.value * 100).toFixed(1)} %` : formatQuantity(figure.value, row.unit);
              return (
                <Table.Tr key={row.key}>
                  <Table.Td>
                    {row.label}
                    {row.key === 'peakPrimaryCurrentA' && ` (${figures.onTimeLimit}-limited)`}
                  </Table.Td>
                  <Table.Td>{value}</Table.Td>
                  <Table.Td>
                    <MethodNote subject={row.label.toLowerCase()} method={figure.method} />
                  </Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
        <Group gap={6}>
          <Text size="sm">hipot to ask of the supplier {formatQuantity(driver.hipotTestVoltageV.value, 'V')}</Text>
          <MethodNote subject="hipot test voltage" method={driver.hipotTestVoltageV.method} />
        </Group>
        {batteryLife && (
          <Group gap={6}>
            <Text size="sm" data-driver="battery-life">
              battery life to {formatQuantity(batteryLife.endVoltagePerCellV, 'V')} per cell:{' '}
              {(batteryLife.lifeS.value / 3600).toFixed(1)} h
              {batteryLife.targetS !== null && ` (target ${(batteryLife.targetS / 3600).toFixed(1)} h)`}, mean drain{' '}
              {formatQuantity(batteryLife.meanCurrentA, 'A')}
            </Text>
            <MethodNote subject="battery life" method={batteryLife.lifeS.method} />
          </Group>
        )}
      </Stack>
    </Paper>
  );
}
