import { memo, useEffect, useLayoutEffect, useMemo, useRef, useState, type ClipboardEvent } from 'react';
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
import { isCellBlock } from '../../../lib/spreadsheet-cells';
import type { CapacitorColumnKey } from '../paste-cells';
import classes from './capacitor-table.module.css';
import { PartCodeInput } from './part-code-input';

const noParts: readonly Part[] = [];

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

/** What a row asks of the table; the same functions from render to render, so unchanged rows skip rendering. */
interface RowActions {
  setCell: (index: number, patch: Partial<CapacitorPart>) => void;
  /** Paste handler of one cell: a block fills the table, a single value is left to the field. */
  paste: (row: number, column: CapacitorColumnKey, event: ClipboardEvent<HTMLElement>) => void;
  fillDown: (index: number) => void;
  pick: (index: number, part: Part) => void;
  /** Grades the capacitors from a top-stage value (the grading helper). */
  grade: (topStageF: number) => void;
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
  parts = noParts,
  onPickPart,
}: CapacitorTableProps) {
  const places = capacitorPlacesOf(topology, capacitors);
  const [pasteMessage, setPasteMessage] = useState<{ isError: boolean; text: string } | null>(null);
  // The rows' actions read the latest props through a ref: a keystroke in one cell renders that row alone.
  const latest = useRef({ topology, capacitors, onChange, onPickPart });
  useLayoutEffect(() => {
    latest.current = { topology, capacitors, onChange, onPickPart };
  });
  const actions = useMemo<RowActions>(
    () => ({
      setCell: (index, patch) => {
        const [field = ''] = Object.keys(patch);
        const { capacitors: current, onChange: change } = latest.current;
        change(
          current.map((c, i) => (i === index ? { ...c, ...patch } : c)),
          `multiplier.capacitors[${index}].${field}`,
        );
      },
      paste: (row, column, event) => {
        const text = event.clipboardData.getData('text/plain');
        if (!isCellBlock(text)) return;
        event.preventDefault();
        // The block's parser loads with the first paste.
        void import('../paste-cells').then(({ pasteIntoCapacitors }) => {
          const result = pasteIntoCapacitors(latest.current.capacitors, text, row, column);
          if (result.ok) {
            latest.current.onChange(result.capacitors);
            setPasteMessage({ isError: false, text: `Pasted ${result.cellCount} cells from C${row + 1}.` });
          } else {
            setPasteMessage({ isError: true, text: `Nothing pasted: ${result.message}` });
          }
        });
      },
      fillDown: (index) => latest.current.onChange(fillDown(latest.current.capacitors, index)),
      pick: (index, part) => latest.current.onPickPart?.(index, part),
      grade: (topStageF) => {
        const { topology: shape, capacitors: current, onChange: change } = latest.current;
        change(gradeCapacitors(shape, current, topStageF));
      },
    }),
    [],
  );
  const at = (i: number, key: string) => issues[`multiplier.capacitors[${i}].${key}`] ?? null;

  return (
    <Stack gap="xs">
      <Group justify="space-between">
        <Text size="sm" c="dimmed">
          From the source upward: C1 is charged through D1. Paste a column or block of cells from a spreadsheet.
        </Text>
        <GradingHelper
          initialTopStageF={capacitors[capacitors.length - 1]?.valueF ?? 10e-9}
          isDisabled={places === null}
          onApply={actions.grade}
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
      <Table.ScrollContainer minWidth={500} type="native">
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
            {capacitors.map((capacitor, i) => (
              <CapacitorRow
                key={i}
                index={i}
                capacitor={capacitor}
                placeText={placeLabel(places?.[i])}
                isLast={i === capacitors.length - 1}
                valueIssue={at(i, 'valueF')}
                toleranceIssue={at(i, 'tolerance')}
                ratedVoltageIssue={at(i, 'ratedVoltageV')}
                partCodeIssue={at(i, 'partCode')}
                parts={parts}
                actions={actions}
              />
            ))}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
    </Stack>
  );
}

interface CapacitorRowProps {
  index: number;
  capacitor: CapacitorPart;
  /** Where the capacitor sits in the ladder, in words. */
  placeText: string;
  isLast: boolean;
  valueIssue: string | null;
  toleranceIssue: string | null;
  ratedVoltageIssue: string | null;
  partCodeIssue: string | null;
  parts: readonly Part[];
  actions: RowActions;
}

const CapacitorRow = memo(function CapacitorRow({
  index,
  capacitor,
  placeText,
  isLast,
  valueIssue,
  toleranceIssue,
  ratedVoltageIssue,
  partCodeIssue,
  parts,
  actions,
}: CapacitorRowProps) {
  const name = `C${index + 1}`;
  return (
    <Table.Tr>
      <Table.Td className={classes.sticky}>
        <Text size="sm" fw={600} lh={1.2}>
          {name}
        </Text>
        <Text size="xs" c="dimmed" lh={1.2}>
          {placeText}
        </Text>
      </Table.Td>
      <Table.Td miw={100} onPasteCapture={(event) => actions.paste(index, 'valueF', event)}>
        <QuantityInput
          label={`${name} capacitance`}
          isLabelHidden
          unit="F"
          value={capacitor.valueF}
          onChange={(valueF) => actions.setCell(index, { valueF })}
          issue={valueIssue}
          size="xs"
        />
      </Table.Td>
      <Table.Td miw={70} onPasteCapture={(event) => actions.paste(index, 'tolerance', event)}>
        <PercentInput
          label={`${name} tolerance`}
          fraction={capacitor.tolerance}
          onChange={(tolerance) => actions.setCell(index, { tolerance })}
          issue={toleranceIssue}
        />
      </Table.Td>
      <Table.Td miw={96} onPasteCapture={(event) => actions.paste(index, 'ratedVoltageV', event)}>
        <QuantityInput
          label={`${name} rated voltage`}
          isLabelHidden
          unit="V"
          value={capacitor.ratedVoltageV}
          onChange={(ratedVoltageV) => actions.setCell(index, { ratedVoltageV })}
          issue={ratedVoltageIssue}
          size="xs"
        />
      </Table.Td>
      <Table.Td miw={110} onPasteCapture={(event) => actions.paste(index, 'partCode', event)}>
        <PartCodeInput
          label={`${name} part code`}
          kind="capacitor"
          parts={parts}
          value={capacitor.partCode}
          onCodeChange={(partCode) => actions.setCell(index, { partCode })}
          onPick={(part) => actions.pick(index, part)}
          issue={partCodeIssue}
        />
      </Table.Td>
      <Table.Td>
        <Tooltip label={`Copy ${name} to every capacitor above it`}>
          <ActionIcon
            variant="subtle"
            aria-label={`Fill down from ${name}`}
            disabled={isLast}
            onClick={() => actions.fillDown(index)}
          >
            <FillDownGlyph />
          </ActionIcon>
        </Tooltip>
      </Table.Td>
    </Table.Tr>
  );
});

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

const GradingHelper = memo(function GradingHelper({
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
});

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
