import { useEffect, useRef, useState, type ClipboardEvent } from 'react';
import {
  ActionIcon,
  Alert,
  Button,
  Group,
  Popover,
  Stack,
  Table,
  Text,
  TextInput,
  Tooltip,
  VisuallyHidden,
} from '@mantine/core';
import type { Part } from '@ladderwright/shared/api';
import type { CapacitorPart, Topology } from '@ladderwright/shared/designs';
import { QuantityInput } from '../../../components/quantity-input';
import { capacitorPlacesOf, fillDown, gradeCapacitors, placeLabel } from '../ladder-edits';
import { isCellBlock, pasteIntoCapacitors, type CapacitorColumnKey } from '../paste-cells';
import classes from './capacitor-table.module.css';
import { PartCodeInput } from './part-code-input';

export interface CapacitorTableProps {
  topology: Topology;
  capacitors: CapacitorPart[];
  /** The new list; `key` names the one field changed (its document path) when a single cell was edited. */
  onChange: (capacitors: CapacitorPart[], key?: string) => void;
  /** Validation messages by document path, e.g. `multiplier.capacitors[2].valueF`. */
  issues: Readonly<Record<string, string>>;
  /** The project's Parts shelf, offered in each part-code field. */
  parts?: readonly Part[];
  /** A shelf part picked for capacitor `index` (its value and ratings go with it). */
  onPickPart?: (index: number, part: Part) => void;
}

/**
 * One row per ladder capacitor, from the source upward, with fill-down and a grading helper. A column or block of
 * cells pasted from a spreadsheet fills the cells from the one pasted into, right and down.
 */
export function CapacitorTable({
  topology,
  capacitors,
  onChange,
  issues,
  parts = [],
  onPickPart,
}: CapacitorTableProps) {
  const places = capacitorPlacesOf(topology, capacitors);
  const [pasteMessage, setPasteMessage] = useState<{ isError: boolean; text: string } | null>(null);
  const setCapacitor = (index: number, patch: Partial<CapacitorPart>) => {
    const [field = ''] = Object.keys(patch);
    onChange(
      capacitors.map((c, i) => (i === index ? { ...c, ...patch } : c)),
      `multiplier.capacitors[${index}].${field}`,
    );
  };
  const at = (i: number, key: string) => issues[`multiplier.capacitors[${i}].${key}`] ?? null;
  /** Paste handler of one cell: a block fills the table, a single value is left to the field. */
  const pasteAt = (row: number, column: CapacitorColumnKey) => (event: ClipboardEvent<HTMLElement>) => {
    const text = event.clipboardData.getData('text/plain');
    if (!isCellBlock(text)) return;
    event.preventDefault();
    const result = pasteIntoCapacitors(capacitors, text, row, column);
    if (result.ok) {
      onChange(result.capacitors);
      setPasteMessage({ isError: false, text: `Pasted ${result.cellCount} cells from C${row + 1}.` });
    } else {
      setPasteMessage({ isError: true, text: `Nothing pasted: ${result.message}` });
    }
  };

  return (
    <Stack gap="xs">
      <Group justify="space-between">
        <Text size="sm" c="dimmed">
          From the source upward: C1 is charged through D1. Paste a column or block of cells from a spreadsheet.
        </Text>
        <GradingHelper
          initialTopStageF={capacitors[capacitors.length - 1]?.valueF ?? 10e-9}
          isDisabled={places === null}
          onApply={(topStageF) => onChange(gradeCapacitors(topology, capacitors, topStageF))}
        />
      </Group>
      {pasteMessage && (
        <Alert
          color={pasteMessage.isError ? 'red' : 'verdigris'}
          variant="light"
          p="xs"
          role={pasteMessage.isError ? 'alert' : 'status'}
          withCloseButton
          closeButtonLabel="Dismiss"
          onClose={() => setPasteMessage(null)}
        >
          <Text size="sm">{pasteMessage.text}</Text>
        </Alert>
      )}
      <Table.ScrollContainer minWidth={500}>
        <Table verticalSpacing={4} horizontalSpacing={6} aria-label="Ladder capacitors">
          <Table.Thead>
            <Table.Tr>
              <Table.Th className={classes.sticky}>Capacitor</Table.Th>
              <Table.Th>Capacitance</Table.Th>
              <Table.Th>Tol. ±</Table.Th>
              <Table.Th>Rated voltage</Table.Th>
              <Table.Th>Part code</Table.Th>
              <Table.Th>
                <VisuallyHidden>Actions</VisuallyHidden>
              </Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {capacitors.map((capacitor, i) => {
              const name = `C${i + 1}`;
              const place = places?.[i];
              return (
                <Table.Tr key={i}>
                  <Table.Td className={classes.sticky}>
                    <Text size="sm" fw={600} lh={1.2}>
                      {name}
                    </Text>
                    <Text size="xs" c="dimmed" lh={1.2}>
                      {placeLabel(place)}
                    </Text>
                  </Table.Td>
                  <Table.Td miw={100} onPasteCapture={pasteAt(i, 'valueF')}>
                    <QuantityInput
                      label={`${name} capacitance`}
                      isLabelHidden
                      unit="F"
                      value={capacitor.valueF}
                      onChange={(valueF) => setCapacitor(i, { valueF })}
                      issue={at(i, 'valueF')}
                      size="xs"
                    />
                  </Table.Td>
                  <Table.Td miw={70} onPasteCapture={pasteAt(i, 'tolerance')}>
                    <PercentInput
                      label={`${name} tolerance`}
                      fraction={capacitor.tolerance}
                      onChange={(tolerance) => setCapacitor(i, { tolerance })}
                      issue={at(i, 'tolerance')}
                    />
                  </Table.Td>
                  <Table.Td miw={96} onPasteCapture={pasteAt(i, 'ratedVoltageV')}>
                    <QuantityInput
                      label={`${name} rated voltage`}
                      isLabelHidden
                      unit="V"
                      value={capacitor.ratedVoltageV}
                      onChange={(ratedVoltageV) => setCapacitor(i, { ratedVoltageV })}
                      issue={at(i, 'ratedVoltageV')}
                      size="xs"
                    />
                  </Table.Td>
                  <Table.Td miw={110} onPasteCapture={pasteAt(i, 'partCode')}>
                    <PartCodeInput
                      label={`${name} part code`}
                      kind="capacitor"
                      parts={parts}
                      value={capacitor.partCode}
                      onCodeChange={(partCode) => setCapacitor(i, { partCode })}
                      onPick={(part) => onPickPart?.(i, part)}
                      issue={at(i, 'partCode')}
                    />
                  </Table.Td>
                  <Table.Td>
                    <Tooltip label={`Copy ${name} to every capacitor above it`}>
                      <ActionIcon
                        variant="subtle"
                        aria-label={`Fill down from ${name}`}
                        disabled={i === capacitors.length - 1}
                        onClick={() => onChange(fillDown(capacitors, i))}
                      >
                        <FillDownGlyph />
                      </ActionIcon>
                    </Tooltip>
                  </Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
    </Stack>
  );
}

function percentText(fraction: number): string {
  return String(Number((fraction * 100).toPrecision(6)));
}

function PercentInput({
  label,
  fraction,
  onChange,
  issue,
}: {
  label: string;
  fraction: number;
  onChange: (fraction: number) => void;
  issue: string | null;
}) {
  const [text, setText] = useState(() => percentText(fraction));
  const lastEmitted = useRef(fraction);
  // A value set from outside (paste, fill-down, undo, a shelf pick) replaces the text.
  useEffect(() => {
    if (!Object.is(fraction, lastEmitted.current)) {
      lastEmitted.current = fraction;
      setText(percentText(fraction));
    }
  }, [fraction]);
  const number = Number(text);
  const isBad = text.trim() === '' || !Number.isFinite(number);
  return (
    <TextInput
      aria-label={`${label} in percent`}
      value={text}
      rightSection={<Text size="xs">%</Text>}
      onChange={(e) => {
        const next = e.currentTarget.value;
        setText(next);
        const value = Number(next);
        if (next.trim() !== '' && Number.isFinite(value)) {
          lastEmitted.current = value / 100;
          onChange(value / 100);
        }
      }}
      error={isBad ? 'enter a percentage' : (issue ?? undefined)}
      size="xs"
    />
  );
}

function GradingHelper({
  initialTopStageF,
  isDisabled,
  onApply,
}: {
  initialTopStageF: number;
  isDisabled: boolean;
  onApply: (topStageF: number) => void;
}) {
  const [isOpen, setIsOpen] = useState(false);
  const [topStageF, setTopStageF] = useState(initialTopStageF);
  return (
    <Popover opened={isOpen} onChange={setIsOpen} position="bottom-end" withArrow trapFocus>
      <Popover.Target>
        <Button size="xs" variant="light" disabled={isDisabled} onClick={() => setIsOpen((open) => !open)}>
          Grade capacitors…
        </Button>
      </Popover.Target>
      <Popover.Dropdown>
        <Stack gap="xs" w={260}>
          <Text size="xs">Larger at the bottom: with n stages, stage k gets (n − k + 1) × the top-stage value.</Text>
          <QuantityInput label="Top-stage capacitance" unit="F" value={topStageF} onChange={setTopStageF} size="xs" />
          <Button
            size="xs"
            onClick={() => {
              onApply(topStageF);
              setIsOpen(false);
            }}
          >
            Apply grading
          </Button>
        </Stack>
      </Popover.Dropdown>
    </Popover>
  );
}

function FillDownGlyph() {
  return (
    <svg
      width="16"
      height="16"
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth="1.8"
      aria-hidden="true"
    >
      <path d="M12 4v13M6 11l6 6 6-6M5 21h14" />
    </svg>
  );
}
