import { useRef } from 'react';
import { Autocomplete, type ComboboxItem } from '@mantine/core';
import type { Part, PartKind } from '@ladderwright/shared/api';

export interface PartCodeInputProps {
  /** Accessible name, e.g. `C1 part code`. */
  label: string;
  /** Shown as a visible label; table cells keep it hidden. */
  isLabelHidden?: boolean;
  kind: PartKind;
  /** The project's Parts shelf; only parts of `kind` are offered. */
  parts: readonly Part[];
  value: string | undefined;
  /** A code typed by hand (not necessarily on the shelf); undefined when cleared. */
  onCodeChange: (code: string | undefined) => void;
  /** A shelf part picked from the list (mouse, or arrow keys and Enter). */
  onPick: (part: Part) => void;
  issue?: string | null;
}

function optionLabel(part: Part): string {
  return part.description ? `${part.code} · ${part.description}` : part.code;
}

/** A part-code field with the shelf's parts of one kind as suggestions; picking one fills the part in. */
export function PartCodeInput({
  label,
  isLabelHidden = true,
  kind,
  parts,
  value,
  onCodeChange,
  onPick,
  issue,
}: PartCodeInputProps) {
  const options = parts.filter((part) => part.kind === kind);
  const data: ComboboxItem[] = options.map((part) => ({ value: part.code, label: optionLabel(part) }));
  // Autocomplete reports a pick twice: onOptionSubmit, then onChange with the option's label. The pick
  // already wrote the whole part, so that echo is dropped rather than applied over it.
  const pickedLabel = useRef<string | null>(null);
  return (
    <Autocomplete
      {...(isLabelHidden ? { 'aria-label': label } : { label })}
      placeholder={options.length > 0 ? 'pick from the shelf' : undefined}
      data={data}
      value={value ?? ''}
      onChange={(text) => {
        if (text === pickedLabel.current) {
          pickedLabel.current = null;
          return;
        }
        const code = text.trim();
        onCodeChange(code === '' ? undefined : code);
      }}
      onOptionSubmit={(code) => {
        const part = options.find((candidate) => candidate.code === code);
        if (!part) return;
        pickedLabel.current = optionLabel(part);
        onPick(part);
      }}
      error={issue ?? undefined}
      comboboxProps={{ withinPortal: true }}
      size="xs"
    />
  );
}
