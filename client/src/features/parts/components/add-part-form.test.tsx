import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithApp } from '../../../testing/render';
import { AddPartForm } from './add-part-form';

function paste(input: HTMLElement, text: string): void {
  fireEvent.paste(input, { clipboardData: { getData: (type: string) => (type === 'text/plain' ? text : '') } });
}

describe('AddPartForm paste from a spreadsheet', () => {
  it('fills the fields from the one pasted into, left to right', () => {
    renderWithApp(<AddPartForm projectId="p1" />);
    paste(screen.getByLabelText('Code'), 'NF-C472-3K\tHV disc\t4n7\t10%\t3 kV\n');
    expect(screen.getByLabelText('Code')).toHaveValue('NF-C472-3K');
    expect(screen.getByLabelText('Description')).toHaveValue('HV disc');
    expect(screen.getByLabelText('Capacitance')).toHaveValue('4n7');
    expect(screen.getByLabelText('Tolerance')).toHaveValue('10%');
    expect(screen.getByLabelText('Rated voltage')).toHaveValue('3 kV');
  });

  it('hands several rows on as a shelf CSV and says where to check them', async () => {
    const onPasteRows = vi.fn();
    renderWithApp(<AddPartForm projectId="p1" onPasteRows={onPasteRows} />);
    paste(screen.getByLabelText('Code'), 'NF-C103-3K\nNF-C222-3K\n');
    expect(onPasteRows).toHaveBeenCalledTimes(1);
    const [file, rowCount] = onPasteRows.mock.calls[0] as [File, number];
    expect(rowCount).toBe(2);
    expect(await file.text()).toBe('kind,unitCost,code\r\ncapacitor,,NF-C103-3K\r\ncapacitor,,NF-C222-3K\r\n');
    expect(screen.getByRole('status')).toHaveTextContent('2 rows pasted as 2 parts');
  });

  it('refuses a block wider than the form from there, naming the fields, and keeps the form as it was', () => {
    renderWithApp(<AddPartForm projectId="p1" />);
    const size = screen.getByLabelText('Size (mm)');
    paste(size, '10x5\t7\n');
    expect(size).toHaveValue('');
    expect(screen.getByRole('status')).toHaveTextContent(
      'Nothing pasted: 2 columns pasted from Size (mm), but the form has 1 from there (Size (mm)).',
    );
  });
});
