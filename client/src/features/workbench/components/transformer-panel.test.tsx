import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { TransformerDriverEffect } from '@ladderwright/shared/transformer';
import { renderWithApp } from '../../../testing/render';
import { DriverEffectNote } from './transformer-panel';

const fine: TransformerDriverEffect = {
  outputV: 3516,
  targetOutputV: 3000,
  givenOutputV: 3452,
  efficiency: 0.058,
  givenEfficiency: 0.059,
  turnsRatio: 60,
  givenTurnsRatio: 60,
  spoilsDriver: false,
  findings: [],
};

describe('the driver on the designed transformer', () => {
  it('states the figures beside the given numbers in one line when the section leaves the driver as it was', () => {
    renderWithApp(<DriverEffectNote effect={fine} />);
    expect(screen.getByText(/The driver on this transformer/)).toHaveTextContent(
      'output 3.52 kV (target 3 kV, given numbers 3.45 kV); driver efficiency 6 % (given numbers 6 %); turns ratio 1:60',
    );
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('says plainly that the section spoils the driver, with each finding', () => {
    const findings = ['The output is 2.31 kV, 23 % below the 3 kV target.', 'The turns ratio is 1:40.'];
    renderWithApp(
      <DriverEffectNote
        effect={{ ...fine, outputV: 2310, efficiency: 0.04, turnsRatio: 40, spoilsDriver: true, findings }}
      />,
    );
    expect(screen.getByRole('alert')).toHaveTextContent('This transformer spoils the driver');
    for (const finding of findings) expect(screen.getByText(finding)).toBeInTheDocument();
    expect(screen.getByText(/With this transformer: output 2.31 kV/)).toBeInTheDocument();
  });
});
