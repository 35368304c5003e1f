import { useEffect, useId, useRef, useState } from 'react';
import { TextInput, VisuallyHidden, type TextInputProps } from '@mantine/core';
import { formatQuantity, parseQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { isDomainError } from '@ladderwright/shared/errors';

export interface QuantityInputProps extends Omit<TextInputProps, 'value' | 'onChange' | 'error' | 'description'> {
  label: string;
  /** The unit the field holds; the value is in SI base units of it. */
  unit: QuantityUnit;
  value: number;
  onChange: (valueSi: number) => void;
  /** A validation message for the parsed value (e.g. from validateDesign), shown when the text itself parses. */
  issue?: string | null;
  /** Significant figures of the normalized value shown under the field. */
  significantFigures?: number;
  /** Keeps the label for assistive technology only (e.g. in a table whose column header says it). */
  isLabelHidden?: boolean;
  /** For an optional field: called when the text is emptied (the field then takes its default). */
  onClear?: () => void;
}

function textOf(value: number, unit: QuantityUnit, significantFigures: number): string {
  return Number.isFinite(value) ? formatQuantity(value, unit, significantFigures) : '';
}

/** The part of the engine's parse message that names the problem (the rest lists accepted forms). */
function shortParseMessage(error: unknown): string {
  if (!isDomainError(error)) return 'not a quantity';
  return error.message.split(';')[0] ?? error.message;
}

/**
 * A text field for a physical quantity as engineers type it ("4n7", "10 nF", "2k2", "1.5 kV"): the shared
 * parseQuantity reads it, the normalized value is shown under the field and a parse error beside it.
 */
export function QuantityInput({
  label,
  unit,
  value,
  onChange,
  issue = null,
  significantFigures = 4,
  isLabelHidden = false,
  onClear,
  ...inputProps
}: QuantityInputProps) {
  const [text, setText] = useState(() => textOf(value, unit, significantFigures));
  const [parseError, setParseError] = useState<string | null>(null);
  const lastEmitted = useRef(value);
  const descriptionId = useId();

  // A value set from outside (fill-down, grading, a loaded revision) replaces the text.
  useEffect(() => {
    if (!Object.is(value, lastEmitted.current)) {
      lastEmitted.current = value;
      setText(textOf(value, unit, significantFigures));
      setParseError(null);
    }
  }, [value, unit, significantFigures]);

  const handleChange = (next: string) => {
    setText(next);
    if (onClear && next.trim() === '') {
      setParseError(null);
      lastEmitted.current = Number.NaN;
      onClear();
      return;
    }
    try {
      const parsed = parseQuantity(next, { unit });
      setParseError(null);
      lastEmitted.current = parsed;
      onChange(parsed);
    } catch (error) {
      setParseError(shortParseMessage(error));
    }
  };

  const error = parseError ?? issue;
  return (
    <TextInput
      {...inputProps}
      label={isLabelHidden ? <VisuallyHidden>{label}</VisuallyHidden> : label}
      value={text}
      onChange={(event) => handleChange(event.currentTarget.value)}
      onBlur={() => {
        if (!parseError) setText(textOf(value, unit, significantFigures));
      }}
      description={parseError || !Number.isFinite(value) ? undefined : `= ${textOf(value, unit, significantFigures)}`}
      descriptionProps={{ id: descriptionId, 'aria-live': 'polite' } as Record<string, string>}
      error={error ?? undefined}
      inputWrapperOrder={['label', 'input', 'description', 'error']}
      spellCheck={false}
      autoComplete="off"
    />
  );
}
