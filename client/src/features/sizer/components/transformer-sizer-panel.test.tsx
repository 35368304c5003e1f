import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithApp } from '../../../testing/render';
import { shelfPart } from '../../../testing/shelf-part';
import { TransformerSizerPanel, type SizerDesign } from './transformer-sizer-panel';

const ferrite = {
  saturationFluxDensity25T: 0.42,
  saturationFluxDensity100T: 0.32,
  steinmetzK: 3,
  steinmetzAlpha: 1.4,
  steinmetzBeta: 2.5,
};

const shelf = [
  shelfPart({
    code: 'NF-KE20-M2',
    kind: 'core',
    valueSi: 4.5e-6,
    coreAreaM2: 32e-6,
    corePathLengthM: 42.8e-3,
    coreVolumeM3: 1340e-9,
    windowAreaM2: 48e-6,
    bobbinBreadthM: 11e-3,
    bobbinHeightM: 4e-3,
    meanTurnLengthM: 38e-3,
    ...ferrite,
  }),
  shelfPart({
    code: 'NF-W020-G2',
    kind: 'wire',
    copperDiameterM: 0.2e-3,
    overallDiameterM: 0.23e-3,
    enamelGrade: 2,
    breakdownVoltageV: 1700,
  }),
  shelfPart({
    code: 'NF-W008-G2',
    kind: 'wire',
    copperDiameterM: 0.08e-3,
    overallDiameterM: 0.099e-3,
    enamelGrade: 2,
    breakdownVoltageV: 800,
  }),
  shelfPart({ code: 'NF-T025-PE', kind: 'tape', thicknessM: 25e-6, dielectricStrengthVPerM: 1e8 }),
];

/** A wider E25 core beside the E20. */
const widerCore = shelfPart({
  code: 'NF-KE25-M1',
  kind: 'core',
  valueSi: 2e-6,
  coreAreaM2: 52e-6,
  corePathLengthM: 57.5e-3,
  coreVolumeM3: 2990e-9,
  windowAreaM2: 39e-6,
  bobbinBreadthM: 14.2e-3,
  bobbinHeightM: 2.75e-3,
  meanTurnLengthM: 50e-3,
  ...ferrite,
});

/** A small tester's driver: 0.25 mH, 1 : 0.4 : 60, 80 mA peak, 0.9 kV. */
const testerDesign: SizerDesign = {
  name: 'Tester',
  figures: {
    primaryInductanceH: 0.25e-3,
    primaryPeakCurrentA: 0.08,
    turnsRatio: 60,
    feedbackRatio: 0.4,
    frequencyHz: 35e3,
    dutyOnFraction: 0.9,
    secondaryPeakV: 900,
  },
  spacing: { pollutionDegree: 1, materialGroup: 'IIIa', pcb: true },
  secondaryWireCode: 'NF-W008-G2',
};

describe('TransformerSizerPanel', () => {
  it('ranks the shelf cores with the fewest primary turns that keep a 20 % flux margin', () => {
    renderWithApp(<TransformerSizerPanel shelf={shelf} />);
    fireEvent.click(screen.getByRole('button', { name: 'Rank 1 shelf cores' }));
    const row = within(screen.getByRole('table', { name: 'Ranked cores' })).getAllByRole('row')[1];
    if (!row) throw new Error('one ranked core');
    // Np = L·Ipk / (Bmax·Ae) (flyback primary turns; McLyman, Transformer and Inductor Design Handbook, from
    // memory) with Bmax = 0.8 × 0.32 T: 1 mH × 0.5 A / (0.256 T × 32 mm²) = 61.04, so 62 turns; 62 × 0.4 = 24.8
    // → 25 feedback and 62 × 60 = 3720 secondary turns.
    expect(within(row).getByText('62 : 25 : 3720')).toBeInTheDocument();
    expect(within(row).getByText('NF-KE20-M2')).toBeInTheDocument();
  });

  it('says what the shelf lacks instead of ranking nothing', () => {
    renderWithApp(<TransformerSizerPanel shelf={shelf.slice(1)} />);
    expect(screen.getByText(/needs at least one core, one wire and one tape/)).toBeInTheDocument();
  });

  it('starts from the open design’s driver figures and applies a fitting core’s section to it', () => {
    const onApply = vi.fn();
    renderWithApp(<TransformerSizerPanel shelf={shelf} design={testerDesign} onApply={onApply} />);
    expect(screen.getByText('From the driver of Tester, at the rated load')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Rank 1 shelf cores' }));
    const row = within(screen.getByRole('table', { name: 'Ranked cores' })).getAllByRole('row')[1]!;
    // The shortest gap that can be made, 0.051 mm (Power Integrations AN-18, Transformer Gapping), bounds the
    // turns. McLyman's gapped AL (Transformer and Inductor Design Handbook, 3rd ed., ch. 8, from memory), by hand:
    // le/µr = µ0·32 mm² / 4.5 µH = 8.936 µm, F = 1 + (0.051/√32)·ln(22/0.051) = 1.0547,
    // AL = F·µ0·Ae/(51 µm + 8.936 µm) = 0.708 µH; √(0.25 mH / 0.708 µH) = 18.8, so 19; 0.4 × 19 = 7.6 → 8 feedback, 60 × 19 = 1140 secondary.
    expect(within(row).getByText('19 : 8 : 1140')).toBeInTheDocument();
    fireEvent.click(within(row).getByRole('button', { name: 'Apply NF-KE20-M2 to the design' }));
    expect(onApply).toHaveBeenCalledTimes(1);
    const [section, code] = onApply.mock.calls[0] as [{ windings: { role: string; turns: number }[] }, string];
    expect(code).toBe('NF-KE20-M2');
    expect(section.windings.map((w) => [w.role, w.turns])).toEqual([
      ['primary', 19],
      ['feedback', 8],
      ['secondary', 1140],
    ]);
    expect(screen.getByRole('status')).toHaveTextContent('NF-KE20-M2 applied to the draft');
  });

  it('says what each fitting core does to the design’s other Checks, and ranks one that fails them last', () => {
    const assess = vi.fn((section: { core: { code: string } }) =>
      section.core.code === 'NF-KE20-M2'
        ? [{ id: 'driver-power', subject: 'driver stage', verdict: 'fail' as const, givenVerdict: 'pass' as const }]
        : [],
    );
    renderWithApp(<TransformerSizerPanel shelf={[widerCore, ...shelf]} design={testerDesign} assess={assess} />);
    fireEvent.click(screen.getByRole('button', { name: 'Rank 2 shelf cores' }));
    const rows = within(screen.getByRole('table', { name: 'Ranked cores' })).getAllByRole('row');
    expect(screen.getByRole('columnheader', { name: 'On the design' })).toBeInTheDocument();
    expect(rows[1]).toHaveTextContent('NF-KE25-M1');
    expect(rows[1]).toHaveTextContent('no Check worse than on the given numbers');
    expect(rows[2]).toHaveTextContent('NF-KE20-M2');
    expect(rows[2]).toHaveTextContent('fails driver power');
    expect(assess).toHaveBeenCalledTimes(2);
  });

  it('keeps the engine’s order (loss, then size) among cores that leave the design’s Checks as they were', () => {
    renderWithApp(<TransformerSizerPanel shelf={[widerCore, ...shelf]} design={testerDesign} assess={() => []} />);
    fireEvent.click(screen.getByRole('button', { name: 'Rank 2 shelf cores' }));
    const rows = within(screen.getByRole('table', { name: 'Ranked cores' })).getAllByRole('row');
    // The smaller E20 loses less than the E25 here, so it leads when neither harms the design.
    expect(rows[1]).toHaveTextContent('NF-KE20-M2');
    expect(rows[2]).toHaveTextContent('NF-KE25-M1');
  });

  it('offers no Apply without a design to apply to', () => {
    renderWithApp(<TransformerSizerPanel shelf={shelf} />);
    fireEvent.click(screen.getByRole('button', { name: 'Rank 1 shelf cores' }));
    expect(screen.queryByRole('button', { name: /^Apply / })).toBeNull();
  });
});
