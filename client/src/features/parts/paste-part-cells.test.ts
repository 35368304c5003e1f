import { describe, expect, it } from 'vitest';
import { MAX_PASTED_PART_ROWS, pasteIntoPartForm } from './paste-part-cells';

// The capacitor fields of the Add-a-part form, in its order.
const fields = [
  { name: 'code', label: 'Code' },
  { name: 'description', label: 'Description' },
  { name: 'valueSi', label: 'Capacitance' },
  { name: 'tolerance', label: 'Tolerance' },
  { name: 'ratedVoltageV', label: 'Rated voltage' },
  { name: 'unitCost', label: 'Unit cost' },
  { name: 'sizeMm', label: 'Size (mm)' },
];

describe('pasteIntoPartForm', () => {
  it('fills the form from the field pasted into, left to right, from one row; an empty cell keeps the field', () => {
    const pasted = pasteIntoPartForm(
      { kind: 'capacitor', description: 'kept', unitCost: '0.30' },
      fields,
      'code',
      'NF-C472-3K\t\t4n7\t10%\t3 kV\n',
    );
    expect(pasted).toEqual({
      kind: 'fill',
      draft: {
        kind: 'capacitor',
        code: 'NF-C472-3K',
        description: 'kept',
        valueSi: '4n7',
        tolerance: '10%',
        ratedVoltageV: '3 kV',
        unitCost: '0.30',
      },
    });
  });

  it('turns a column of several rows into a shelf CSV, each row taking the form’s other fields', () => {
    const pasted = pasteIntoPartForm(
      { kind: 'capacitor', valueSi: '10n', ratedVoltageV: '3 kV', unitCost: '0.35' },
      fields,
      'code',
      'NF-C103-3K\r\nNF-C103-3KB\r\n',
    );
    expect(pasted.kind).toBe('rows');
    if (pasted.kind !== 'rows') return;
    expect(pasted.rowCount).toBe(2);
    // RFC 4180: header row of field names (PART_FIELDS names, any order the importer accepts), CRLF line ends.
    expect(pasted.csv).toBe(
      'kind,valueSi,ratedVoltageV,unitCost,code\r\n' +
        'capacitor,10n,3 kV,0.35,NF-C103-3K\r\n' +
        'capacitor,10n,3 kV,0.35,NF-C103-3KB\r\n',
    );
  });

  it('keeps the required columns when the form leaves them empty, and quotes a cell with a comma', () => {
    const pasted = pasteIntoPartForm({ kind: 'capacitor' }, fields, 'description', 'disc, 3 kV\ndisc, 6 kV');
    expect(pasted.kind).toBe('rows');
    if (pasted.kind !== 'rows') return;
    expect(pasted.csv.split('\r\n')[0]).toBe('kind,code,unitCost,description');
    expect(pasted.csv.split('\r\n')[1]).toBe('capacitor,,,"disc, 3 kV"');
  });

  it('refuses a block wider than the fields from where it lands, naming them, and changes nothing', () => {
    const pasted = pasteIntoPartForm({ kind: 'capacitor' }, fields, 'unitCost', '0.3\t10x5\textra');
    expect(pasted).toEqual({
      kind: 'refused',
      message: '3 columns pasted from Unit cost, but the form has 2 from there (Unit cost, Size (mm)).',
    });
  });

  it('refuses more rows than one paste takes', () => {
    const text = Array.from({ length: MAX_PASTED_PART_ROWS + 1 }, (_, i) => `NF-C${i}-3K`).join('\n');
    const pasted = pasteIntoPartForm({ kind: 'capacitor' }, fields, 'code', text);
    expect(pasted.kind).toBe('refused');
  });
});
