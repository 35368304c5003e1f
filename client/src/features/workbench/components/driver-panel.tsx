import { Group, Paper, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import type { DriverEnergy, DriverReport, LossKind } from '@ladderwright/shared/driver';
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

const lossLabels: Record<LossKind, string> = {
  transistorConduction: 'transistor conduction',
  transistorSwitching: 'transistor switching',
  baseEmitter: 'base-emitter junction',
  baseResistor: 'base resistor and feedback winding',
  primaryCopper: 'primary copper',
  collectorResistor: 'collector resistor',
  secondaryCopper: 'secondary copper',
  clamp: 'clamp (leakage and unused flyback)',
  core: 'core',
  diodes: 'ladder diodes',
  bleeder: 'bleeder',
  seriesOutputResistor: 'series output resistor',
  lamp: 'indicator lamp',
  supplyResistance: 'supply internal resistance',
};

/** Input, output and where the rest goes at the rated load, with the transistor's junction temperature. */
function PowerBalance({ energy }: { energy: DriverEnergy }) {
  const shown = (Object.entries(energy.losses) as [LossKind, number][]).filter(
    ([, w]) => Math.abs(w) > 1e-6 * energy.inputPowerW,
  );
  return (
    <Stack gap={2} aria-label="Power balance">
      <Group gap={6}>
        <Text size="sm" fw={500} data-driver="power-balance">
          at the rated load: in {formatQuantity(energy.inputPowerW, 'W')}, out{' '}
          {formatQuantity(energy.outputPowerW, 'W')}, efficiency {(energy.efficiency * 100).toFixed(1)} %
        </Text>
        <MethodNote subject="power balance" method={energy.method} />
      </Group>
      <Table fz="xs" verticalSpacing={1} aria-label="Losses">
        <Table.Tbody>
          {shown.map(([kind, w]) => (
            <Table.Tr key={kind}>
              <Table.Td>{lossLabels[kind]}</Table.Td>
              <Table.Td>{formatQuantity(w, 'W')}</Table.Td>
              <Table.Td>{((w / energy.inputPowerW) * 100).toFixed(1)} %</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      <Text size="xs">
        transistor {formatQuantity(energy.transistor.dissipationW, 'W')}, junction about{' '}
        {energy.transistor.junctionTemperatureC.toFixed(0)} °C at {energy.transistor.thermalResistanceCPerW} °C/W
        {energy.transistor.isDefaultThermal && ' (assumed)'}; clamp {formatQuantity(energy.clamp.dissipationW, 'W')}
        {energy.clamp.ratedPowerW !== null && ` of ${formatQuantity(energy.clamp.ratedPowerW, 'W')} rated`}
      </Text>
    </Stack>
  );
}

/** The driver section of a report: the operating point and its curve, the stage's figures with their method notes, battery life. */
export function DriverPanel({ driver }: DriverPanelProps) {
  const { figures, operatingPoint: op, batteryLife } = driver;
  return (
    <Paper withBorder p="sm" aria-label="Driver stage">
      <Stack gap="xs">
        <Title order={4}>Driver stage</Title>
        {driver.loadCapacity?.isLoadBeyond && (
          <Text size="sm" c="red.8" fw={600} data-driver="load-beyond">
            Load beyond what the supply can deliver: it holds its output up to{' '}
            {formatQuantity(driver.loadCapacity.maxLoadCurrentA, 'A')}, the design asks{' '}
            {formatQuantity(driver.loadCapacity.loadCurrentA, 'A')}. The figures below are at the largest load it holds.
          </Text>
        )}
        {!driver.validity.isWithinValidity && (
          <Text size="sm" c="orange.8" data-driver="validity">
            Instant estimate outside its validity ({driver.validity.reasons.join('; ')}): run a simulation for these
            figures.
          </Text>
        )}
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
          <Text size="sm">power-limited above a load of {formatQuantity(op.powerLimitOnsetA, 'A')}</Text>
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
        <PowerBalance energy={driver.energy} />
        {batteryLife && (
          <Group gap={6}>
            <Text size="sm" data-driver="battery-life">
              battery life to {formatQuantity(batteryLife.endVoltagePerCellV, 'V')} per cell:{' '}
              {(batteryLife.lifeS.value / 3600).toFixed(1)} h
              {batteryLife.targetS !== null && ` (target ${(batteryLife.targetS / 3600).toFixed(1)} h)`}, mean drain{' '}
              {formatQuantity(batteryLife.meanCurrentA, 'A')}, delivering {batteryLife.deliveredAh.toFixed(2)} Ah at
              that drain
            </Text>
            <MethodNote subject="battery life" method={batteryLife.lifeS.method} />
          </Group>
        )}
      </Stack>
    </Paper>
  );
}
