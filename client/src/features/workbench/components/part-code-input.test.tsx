import { useState } from 'react';
import { fireEvent, screen, waitFor } from '@testing-library/react';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Part } from '@ladderwright/shared/api';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { renderWithApp } from '../../../testing/render';
import { shelfPart } from '../../../testing/shelf-part';
import { withShelfPart } from '../shelf-picks';
import { CapacitorTable } from './capacitor-table';
import { PartCodeInput } from './part-code-input';

const shelf: Part[] = [
  shelfPart({
    code: 'NF-C103-3K',
    kind: 'capacitor',
    description: 'HV ceramic 10 nF',
    valueSi: 10e-9,
    tolerance: 0.05,
    ratedVoltageV: 3000,
  }),
  shelfPart({
    code: 'NF-C222-2K',
    kind: 'capacitor',
    description: 'HV ceramic 2.2 nF',
    valueSi: 2.2e-9,
    tolerance: 0.1,
    ratedVoltageV: 2000,
  }),
  shelfPart({
    code: 'NF-D4K-50M',
    kind: 'diode',
    description: 'HV diode 4 kV',
    ratedVoltageV: 4000,
    ratedCurrentA: 0.05,
    ratedSurgeCurrentA: 5,
  }),
  shelfPart({
    code: 'NF-R47M-HV',
    kind: 'resistor',
    description: 'HV film 47 MΩ',
    valueSi: 47e6,
    ratedVoltageV: 1600,
    ratedPowerW: 0.5,
  }),
];

/** The input itself (the suggestion list is labelled by the same name). */
function field(name: string): HTMLInputElement {
  const input = screen.getAllByLabelText(name).find((element) => element instanceof HTMLInputElement);
  if (!input) throw new Error(`no input named ${name}`);
  return input as HTMLInputElement;
}

let latest: Design = designExamples.surfaceChargeTester;

// Wired as LadderForm wires them (LadderForm itself needs a browser for its autosizing notes field).
function Harness() {
  const [document, setDocument] = useState<Design>(designExamples.surfaceChargeTester);
  const change = (next: Design) => {
    latest = next;
    setDocument(next);
  };
  const { multiplier, outputNetwork } = document;
  return (
    <>
      <CapacitorTable
        topology={multiplier.topology}
        capacitors={multiplier.capacitors}
        issues={{}}
        parts={shelf}
        onPickPart={(index, picked) => change(withShelfPart(document, { kind: 'capacitor', index }, picked, shelf))}
        onChange={(capacitors) => change({ ...document, multiplier: { ...multiplier, capacitors } })}
      />
      <PartCodeInput
        label="Diode part code"
        kind="diode"
        parts={shelf}
        value={multiplier.diode.partCode}
        onCodeChange={(partCode) =>
          change({ ...document, multiplier: { ...multiplier, diode: { ...multiplier.diode, partCode } } })
        }
        onPick={(picked) => change(withShelfPart(document, { kind: 'diode' }, picked, shelf))}
      />
      <PartCodeInput
        label="Bleeder resistor part code"
        kind="resistor"
        parts={shelf}
        value={outputNetwork.bleeder?.partCode}
        onCodeChange={(partCode) =>
          outputNetwork.bleeder &&
          change({ ...document, outputNetwork: { ...outputNetwork, bleeder: { ...outputNetwork.bleeder, partCode } } })
        }
        onPick={(picked) => change(withShelfPart(document, { kind: 'bleeder' }, picked, shelf))}
      />
    </>
  );
}

// Typing and picking through Mantine inputs takes a few seconds per case when the machine is shared.
describe('part-code pickers', { timeout: 20_000 }, () => {
  beforeAll(() => {
    // jsdom has no scrollIntoView; the combobox scrolls the highlighted option into view.
    Element.prototype.scrollIntoView = () => undefined;
  });

  it('offers only shelf capacitors for C1 and, picked with the keyboard, sets code, value and ratings', async () => {
    renderWithApp(<Harness />);
    const c1 = field('C1 part code');
    fireEvent.focus(c1);
    fireEvent.change(c1, { target: { value: 'NF-C' } });
    const options = await screen.findAllByRole('option');
    expect(options.map((option) => option.textContent)).toEqual([
      'NF-C103-3K · HV ceramic 10 nF',
      'NF-C222-2K · HV ceramic 2.2 nF',
    ]);
    fireEvent.keyDown(c1, { key: 'ArrowDown', code: 'ArrowDown' });
    fireEvent.keyDown(c1, { key: 'Enter', code: 'Enter' });

    await waitFor(() => expect(latest.multiplier.capacitors[0]?.partCode).toBe('NF-C103-3K'));
    expect(latest.multiplier.capacitors[0]).toMatchObject({ valueF: 10e-9, tolerance: 0.05, ratedVoltageV: 3000 });
    // The other capacitors keep what they had.
    expect(latest.multiplier.capacitors[1]).toEqual(designExamples.surfaceChargeTester.multiplier.capacitors[1]);
    expect(c1).toHaveValue('NF-C103-3K');
    expect(screen.getByLabelText('C1 capacitance')).toHaveValue('10 nF');
  });

  it('fills the diode ratings from a picked shelf diode', async () => {
    renderWithApp(<Harness />);
    const diode = field('Diode part code');
    fireEvent.focus(diode);
    fireEvent.change(diode, { target: { value: 'D4K' } });
    fireEvent.click(await screen.findByRole('option', { name: 'NF-D4K-50M · HV diode 4 kV' }));
    await waitFor(() =>
      expect(latest.multiplier.diode).toMatchObject({
        partCode: 'NF-D4K-50M',
        ratedPivV: 4000,
        ratedAverageCurrentA: 0.05,
        ratedSurgeCurrentA: 5,
      }),
    );
  });

  it('fills the bleeder value and ratings from a picked shelf resistor', async () => {
    renderWithApp(<Harness />);
    const bleeder = field('Bleeder resistor part code');
    fireEvent.focus(bleeder);
    fireEvent.change(bleeder, { target: { value: 'NF-R' } });
    fireEvent.click(await screen.findByRole('option', { name: 'NF-R47M-HV · HV film 47 MΩ' }));
    await waitFor(() =>
      expect(latest.outputNetwork.bleeder).toMatchObject({
        partCode: 'NF-R47M-HV',
        valueOhm: 47e6,
        ratedPowerW: 0.5,
        limitingVoltageV: 1600,
      }),
    );
  });

  it('keeps a code typed by hand that is not on the shelf, and clears it when emptied', () => {
    renderWithApp(<Harness />);
    const c2 = field('C2 part code');
    fireEvent.change(c2, { target: { value: 'XX-OTHER-1' } });
    expect(latest.multiplier.capacitors[1]?.partCode).toBe('XX-OTHER-1');
    expect(latest.multiplier.capacitors[1]?.ratedVoltageV).toBe(3000);
    fireEvent.change(c2, { target: { value: '' } });
    expect(latest.multiplier.capacitors[1]?.partCode).toBeUndefined();
  });
});
