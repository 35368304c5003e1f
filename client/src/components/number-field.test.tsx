import { useState } from 'react';
import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithApp } from '../testing/render';
import { NumberField } from './number-field';

function Harness({ onValue, ...props }: { onValue: (value: number | string) => void; allowDecimal?: boolean }) {
  const [value, setValue] = useState<number | ''>(3);
  return (
    <NumberField
      label="Cells"
      value={value}
      min={1}
      max={20}
      decimalScale={2}
      {...props}
      onChange={(next) => {
        onValue(next);
        setValue(typeof next === 'number' ? next : '');
      }}
    />
  );
}

describe('NumberField', () => {
  it('passes numbers on, keeps letters out and the decimals within the scale', () => {
    const values: (number | string)[] = [];
    renderWithApp(<Harness onValue={(v) => values.push(v)} />);
    const field = screen.getByRole('textbox', { name: 'Cells' });
    fireEvent.change(field, { target: { value: '12' } });
    expect(values.at(-1)).toBe(12);
    fireEvent.change(field, { target: { value: '4x' } });
    expect(field).toHaveValue('4');
    expect(values.at(-1)).toBe(4);
    fireEvent.change(field, { target: { value: '2.345' } });
    expect(field).toHaveValue('2.34');
    expect(values.at(-1)).toBe(2.34);
    fireEvent.change(field, { target: { value: '' } });
    expect(values.at(-1)).toBe('');
  });

  it('refuses a decimal point where only whole numbers are allowed', () => {
    const values: (number | string)[] = [];
    renderWithApp(<Harness onValue={(v) => values.push(v)} allowDecimal={false} />);
    const field = screen.getByRole('textbox', { name: 'Cells' });
    fireEvent.change(field, { target: { value: '2.5' } });
    expect(field).toHaveValue('25');
    expect(values.at(-1)).toBe(25);
  });

  it('steps with the arrow keys within its range and brings a typed number into range on leaving', () => {
    const values: (number | string)[] = [];
    renderWithApp(<Harness onValue={(v) => values.push(v)} />);
    const field = screen.getByRole('textbox', { name: 'Cells' });
    fireEvent.keyDown(field, { key: 'ArrowUp' });
    expect(values.at(-1)).toBe(4);
    fireEvent.keyDown(field, { key: 'ArrowDown' });
    fireEvent.keyDown(field, { key: 'ArrowDown' });
    fireEvent.keyDown(field, { key: 'ArrowDown' });
    fireEvent.keyDown(field, { key: 'ArrowDown' });
    expect(values.at(-1)).toBe(1);
    fireEvent.change(field, { target: { value: '35' } });
    expect(values.at(-1)).toBe(35);
    fireEvent.blur(field);
    expect(values.at(-1)).toBe(20);
    expect(field).toHaveValue('20');
  });
});
