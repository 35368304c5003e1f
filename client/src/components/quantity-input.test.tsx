import { useState } from 'react';
import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithApp } from '../testing/render';
import { QuantityInput } from './quantity-input';

function Harness({ onValue, initial = 2.2e-9 }: { onValue: (v: number) => void; initial?: number }) {
  const [value, setValue] = useState(initial);
  return (
    <>
      <QuantityInput
        label="C1"
        unit="F"
        value={value}
        onChange={(next) => {
          setValue(next);
          onValue(next);
        }}
      />
      <button type="button" onClick={() => setValue(10e-9)}>
        set from outside
      </button>
    </>
  );
}

describe('QuantityInput', () => {
  it('reads "4n7" as 4.7 nF and shows the normalized value beside the field', () => {
    const onValue = vi.fn();
    renderWithApp(<Harness onValue={onValue} />);
    const input = screen.getByLabelText('C1');

    fireEvent.change(input, { target: { value: '4n7' } });

    expect(onValue).toHaveBeenLastCalledWith(4.7e-9);
    expect(screen.getByText('= 4.7 nF')).toBeInTheDocument();
    expect(input).not.toHaveAttribute('aria-invalid', 'true');
  });

  it('shows the parse error for nonsense and keeps the last good value', () => {
    const onValue = vi.fn();
    renderWithApp(<Harness onValue={onValue} />);
    const input = screen.getByLabelText('C1');

    fireEvent.change(input, { target: { value: 'lots' } });

    expect(onValue).not.toHaveBeenCalled();
    expect(screen.getByText(/"lots": no number found/)).toBeInTheDocument();
    expect(input).toHaveAttribute('aria-invalid', 'true');
    expect(input).toHaveValue('lots');
  });

  it('refuses a value in another unit', () => {
    const onValue = vi.fn();
    renderWithApp(<Harness onValue={onValue} />);

    fireEvent.change(screen.getByLabelText('C1'), { target: { value: '5 kV' } });

    expect(onValue).not.toHaveBeenCalled();
    expect(screen.getByText(/unit V given where F is expected/)).toBeInTheDocument();
  });

  it('takes a value set from outside into its text', () => {
    renderWithApp(<Harness onValue={vi.fn()} />);
    expect(screen.getByLabelText('C1')).toHaveValue('2.2 nF');

    fireEvent.click(screen.getByRole('button', { name: 'set from outside' }));

    expect(screen.getByLabelText('C1')).toHaveValue('10 nF');
  });
});
