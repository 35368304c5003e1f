import { Alert, Group, List, Paper, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import { formatFieldValue, resultFieldLabel } from '@ladderwright/shared/designs';
import type { TransformerDriverEffect, TransformerReport } from '@ladderwright/shared/transformer';
import { formatQuantity } from '@ladderwright/shared/units';
import { ChecksTable } from './checks-table';
import { MethodNote } from './method-note';

export interface TransformerPanelProps {
  transformer: TransformerReport;
}

/** Figure keys of the report in reading order, grouped, each with the method that computed it. */
const GROUPS: { title: string; rows: { key: string; method?: string }[] }[] = [
  {
    title: 'Core and gap',
    rows: [
      { key: 'gap.gapM', method: 'gap' },
      { key: 'gap.alHPerTurn2', method: 'gap' },
      { key: 'primaryInductanceH', method: 'gap' },
      { key: 'peakFluxDensityT', method: 'peakFluxDensity' },
      { key: 'saturationFluxDensityT' },
      { key: 'saturationMarginPct', method: 'peakFluxDensity' },
      { key: 'saturationCurrentA', method: 'peakFluxDensity' },
    ],
  },
  {
    title: 'Losses and temperature',
    rows: [
      { key: 'coreLossW', method: 'coreLoss' },
      { key: 'copperLossW', method: 'copperLoss' },
      { key: 'temperatureRiseC', method: 'temperatureRise' },
      { key: 'windowFill', method: 'layout' },
      { key: 'buildFill', method: 'layout' },
    ],
  },
  {
    title: 'Coupling and insulation',
    rows: [
      { key: 'leakagePrimarySecondaryH', method: 'leakage' },
      { key: 'couplings.primarySecondary', method: 'leakage' },
      { key: 'secondaryCapacitanceF', method: 'secondaryCapacitance' },
      { key: 'hipotTestVoltageV', method: 'hipot' },
      { key: 'windingInsulationV', method: 'layerVoltage' },
      { key: 'flangeCreepageM' },
      { key: 'requiredCreepageM' },
    ],
  },
];

function valueAt(report: TransformerReport, key: string): unknown {
  let node: unknown = report;
  for (const part of key.split('.'))
    node = typeof node === 'object' && node !== null ? (node as Record<string, unknown>)[part] : undefined;
  return node;
}

const percent = (fraction: number) => `${Math.round(fraction * 100)} %`;

/**
 * The driver on this transformer beside the stage's given numbers: a plain warning with its findings when the
 * section spoils the driver (output short of the target, efficiency collapse), else one line of the figures.
 */
export function DriverEffectNote({ effect }: { effect: TransformerDriverEffect }) {
  const figures = `output ${formatQuantity(effect.outputV, 'V')} (target ${formatQuantity(effect.targetOutputV, 'V')}, given numbers ${formatQuantity(effect.givenOutputV, 'V')}); driver efficiency ${percent(effect.efficiency)} (given numbers ${percent(effect.givenEfficiency)}); turns ratio 1:${effect.turnsRatio.toFixed(0)} (given numbers 1:${effect.givenTurnsRatio.toFixed(0)}).`;
  if (!effect.spoilsDriver && effect.findings.length === 0) {
    return (
      <Text size="sm" data-driver-effect="fine">
        The driver on this transformer: {figures}
      </Text>
    );
  }
  return (
    <Alert
      color={effect.spoilsDriver ? 'red' : 'yellow'}
      title={effect.spoilsDriver ? 'This transformer spoils the driver' : 'The driver falls short on this transformer'}
      data-driver-effect={effect.spoilsDriver ? 'spoils' : 'short'}
    >
      <Stack gap={4}>
        <List size="sm" spacing={2}>
          {effect.findings.map((finding) => (
            <List.Item key={finding}>{finding}</List.Item>
          ))}
        </List>
        <Text size="xs" c="dimmed">
          With this transformer: {figures}
        </Text>
      </Stack>
    </Alert>
  );
}

/**
 * The designed transformer's figures at the driver's rated-load operating point: gap and inductances, flux and
 * its margin to saturation at 100 °C, losses and temperature rise, fills, each winding's layers, resistances and
 * layer voltages against their insulation, leakage, self-capacitance, hipot and creepage, with its Checks.
 */
export function TransformerPanel({ transformer }: TransformerPanelProps) {
  return (
    <Paper withBorder p="sm" aria-label="Transformer">
      <Stack gap="xs">
        <Title order={4}>Transformer, as designed, at the rated load</Title>
        {transformer.driverEffect && <DriverEffectNote effect={transformer.driverEffect} />}
        <SimpleGrid cols={{ base: 1, sm: 2 }} spacing="md">
          {GROUPS.map((group) => (
            <Stack key={group.title} gap={2}>
              <Text size="sm" fw={600}>
                {group.title}
              </Text>
              <Table fz="sm" verticalSpacing={2} aria-label={group.title}>
                <Table.Tbody>
                  {group.rows.map(({ key, method }) => {
                    const { label, display } = resultFieldLabel(`transformer.${key}`);
                    const raw = valueAt(transformer, key);
                    // Three figures: the methods behind these estimates do not tell a fourth.
                    const value = typeof raw === 'number' ? Number(raw.toPrecision(3)) : raw;
                    const text =
                      key === 'gap.gapM' && value === 0 ? 'none (ungapped)' : formatFieldValue(value, display);
                    return (
                      <Table.Tr key={key}>
                        <Table.Td>{label}</Table.Td>
                        <Table.Td data-transformer={key} style={{ whiteSpace: 'nowrap' }}>
                          {text}
                        </Table.Td>
                        <Table.Td w={28}>
                          {method && <MethodNote subject={label.toLowerCase()} method={transformer.methods[method]} />}
                        </Table.Td>
                      </Table.Tr>
                    );
                  })}
                </Table.Tbody>
              </Table>
            </Stack>
          ))}
        </SimpleGrid>
        <Group gap={6}>
          <Text size="sm" fw={600}>
            Windings
          </Text>
          <MethodNote subject="layer voltages" method={transformer.methods.layerVoltage} />
        </Group>
        <div style={{ overflowX: 'auto' }}>
          <Table fz="sm" verticalSpacing={2} aria-label="Winding figures" miw={640}>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Winding</Table.Th>
                <Table.Th>Turns</Table.Th>
                <Table.Th>Layers × turns</Table.Th>
                <Table.Th>Inductance</Table.Th>
                <Table.Th>DC resistance</Table.Th>
                <Table.Th>AC factor</Table.Th>
                <Table.Th>Copper loss</Table.Th>
                <Table.Th>Layer to layer</Table.Th>
                <Table.Th>Layer insulation</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {transformer.windings.map((winding) => (
                <Table.Tr key={winding.role}>
                  <Table.Td>{winding.name}</Table.Td>
                  <Table.Td>{winding.turns}</Table.Td>
                  <Table.Td>
                    {winding.layers} × {winding.turnsPerLayer}
                  </Table.Td>
                  <Table.Td>{formatQuantity(winding.inductanceH, 'H')}</Table.Td>
                  <Table.Td>{formatQuantity(winding.dcResistanceOhm, 'Ohm')}</Table.Td>
                  <Table.Td>{winding.acResistanceFactor.toFixed(2)}</Table.Td>
                  <Table.Td>{formatQuantity(winding.copperLossW, 'W')}</Table.Td>
                  <Table.Td>{formatQuantity(winding.layerToLayerV, 'V')}</Table.Td>
                  <Table.Td>{formatQuantity(winding.layerInsulationV, 'V')}</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </div>
        <Text size="sm" fw={600}>
          Transformer checks
        </Text>
        <ChecksTable checks={transformer.checks} />
      </Stack>
    </Paper>
  );
}
