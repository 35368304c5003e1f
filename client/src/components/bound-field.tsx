import type { QuantityUnit } from '@ladderwright/shared/units';
import { NumberField } from './number-field';
import { QuantityInput } from './quantity-input';

export interface BoundFieldProps {
  label: string;
  /** The quantity the field holds (SI value, typed with prefixes); null for a plain count or ratio. */
  unit: QuantityUnit | null;
  value: number;
  onValue: (value: number) => void;
  /** The validation message for this field, if any. */
  issue?: string | null;
  /** The document path the field edits, kept on the element as `data-path`. */
  path?: string;
  /** Plain numbers only: whole numbers, step, bounds and decimals. */
  isInteger?: boolean;
  step?: number;
  min?: number;
  max?: number;
  decimalScale?: number;
  placeholder?: string;
  /** For an optional field: called when the field is emptied (it then takes its default, shown as the placeholder). */
  onClear?: () => void;
}

/**
 * One numeric field bound to one place in a document: a quantity field (typed as "4n7", "2k2") when it has a
 * unit, a number field otherwise. An empty number field reads as NaN, which validation refuses by name.
 */
export function BoundField({
  label,
  unit,
  value,
  onValue,
  issue = null,
  path,
  isInteger = false,
  step = 1,
  min = 0,
  max,
  decimalScale,
  placeholder,
  onClear,
}: BoundFieldProps) {
  if (unit !== null)
    return (
      <QuantityInput
        label={label}
        unit={unit}
        value={value}
        onChange={onValue}
        issue={issue}
        data-path={path}
        placeholder={placeholder}
        onClear={onClear}
      />
    );
  return (
    <NumberField
      label={label}
      value={Number.isFinite(value) ? value : ''}
      min={min}
      max={max}
      step={step}
      allowDecimal={!isInteger}
      decimalScale={decimalScale ?? (isInteger ? 0 : 4)}
      placeholder={placeholder}
      error={issue}
      data-path={path}
      onChange={(v) => (v === '' && onClear ? onClear() : onValue(v === '' ? Number.NaN : Number(v)))}
    />
  );
}
