import { useEffect, useRef, useState, type KeyboardEvent } from 'react';
import { TextInput, type TextInputProps } from '@mantine/core';
import classes from './number-field.module.css';

export interface NumberFieldProps extends Omit<
  TextInputProps,
  'value' | 'onChange' | 'rightSection' | 'rightSectionPointerEvents'
> {
  /** The number shown, or '' for an empty field. */
  value: number | '';
  /** The number typed, or the text itself while it is not a number ('' when emptied, '-' half-typed). */
  onChange: (value: number | string) => void;
  min?: number;
  max?: number;
  /** What the arrow keys and the up and down buttons add or take away. */
  step?: number;
  allowDecimal?: boolean;
  /** The most decimals that can be typed. */
  decimalScale?: number;
}

function textOf(value: number | ''): string {
  return value === '' || !Number.isFinite(value) ? '' : String(value);
}

function decimalsOf(value: number): number {
  const text = String(value);
  const point = text.indexOf('.');
  return point < 0 ? 0 : text.length - point - 1;
}

/** Keeps what a number can hold (digits, one leading minus, one point where decimals are allowed, up to the scale). */
function sanitize(text: string, allowDecimal: boolean, decimalScale: number | undefined): string {
  let out = '';
  let hasPoint = false;
  for (const char of text) {
    if (char >= '0' && char <= '9') out += char;
    else if (char === '-' && out === '') out += char;
    else if ((char === '.' || char === ',') && allowDecimal && !hasPoint) {
      out += '.';
      hasPoint = true;
    }
  }
  if (hasPoint && decimalScale !== undefined) {
    const point = out.indexOf('.');
    out = decimalScale === 0 ? out.slice(0, point) : out.slice(0, point + 1 + decimalScale);
  }
  return out;
}

function numberOf(text: string): number | null {
  if (!/^-?(\d+\.?\d*|\.\d+)$/.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

function clamp(value: number, min: number | undefined, max: number | undefined): number {
  return Math.min(max ?? Infinity, Math.max(min ?? -Infinity, value));
}

function Chevron({ isUp }: { isUp: boolean }) {
  return (
    <svg width={10} height={10} viewBox="0 0 10 10" aria-hidden>
      <path
        d={isUp ? 'M2 6.5 5 3.5 8 6.5' : 'M2 3.5 5 6.5 8 3.5'}
        fill="none"
        stroke="currentColor"
        strokeWidth={1.4}
      />
    </svg>
  );
}

/**
 * A plain number field (a count, a ratio, hours): digits only, the arrow keys and two small buttons step it, and a
 * number past `min` or `max` is brought back into range when the field is left. Light on purpose: it is on the
 * Workbench's first paint many times over.
 */
export function NumberField({
  value,
  onChange,
  min,
  max,
  step = 1,
  allowDecimal = true,
  decimalScale,
  disabled,
  readOnly,
  onBlur,
  onKeyDown,
  ...inputProps
}: NumberFieldProps) {
  const [text, setText] = useState(() => textOf(value));
  const lastEmitted = useRef<number | ''>(value);
  // A value set from outside (undo, a loaded revision) replaces the text.
  useEffect(() => {
    if (!Object.is(value, lastEmitted.current)) {
      lastEmitted.current = value;
      setText(textOf(value));
    }
  }, [value]);

  const emit = (next: string) => {
    setText(next);
    const parsed = numberOf(next);
    lastEmitted.current = parsed ?? (next === '' ? '' : lastEmitted.current);
    onChange(parsed ?? next);
  };
  const stepBy = (direction: 1 | -1) => {
    if (disabled || readOnly) return;
    const current = numberOf(text);
    const places = Math.min(decimalScale ?? 10, Math.max(decimalsOf(step), current === null ? 0 : decimalsOf(current)));
    const next = current === null ? clamp(0, min, max) : clamp(current + direction * step, min, max);
    emit(String(Number(next.toFixed(places))));
  };
  const handleKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    onKeyDown?.(event);
    if (event.key !== 'ArrowUp' && event.key !== 'ArrowDown') return;
    event.preventDefault();
    stepBy(event.key === 'ArrowUp' ? 1 : -1);
  };
  const isLocked = disabled === true || readOnly === true;
  const shown = numberOf(text);
  const isAtEnd = (direction: 1 | -1) =>
    shown !== null && (direction === 1 ? max !== undefined && shown >= max : min !== undefined && shown <= min);

  return (
    <TextInput
      {...inputProps}
      inputMode={allowDecimal ? 'decimal' : 'numeric'}
      autoComplete="off"
      spellCheck={false}
      disabled={disabled}
      readOnly={readOnly}
      value={text}
      onChange={(event) => emit(sanitize(event.currentTarget.value, allowDecimal, decimalScale))}
      onKeyDown={handleKeyDown}
      onBlur={(event) => {
        const parsed = numberOf(text);
        if (parsed !== null && clamp(parsed, min, max) !== parsed) emit(String(clamp(parsed, min, max)));
        onBlur?.(event);
      }}
      rightSectionWidth={24}
      rightSectionPointerEvents="auto"
      rightSection={
        <div className={classes.controls}>
          {([1, -1] as const).map((direction) => (
            <button
              key={direction}
              type="button"
              tabIndex={-1}
              aria-hidden
              className={classes.control}
              disabled={isLocked || isAtEnd(direction)}
              onMouseDown={(event) => event.preventDefault()}
              onClick={() => stepBy(direction)}
            >
              <Chevron isUp={direction === 1} />
            </button>
          ))}
        </div>
      }
    />
  );
}
