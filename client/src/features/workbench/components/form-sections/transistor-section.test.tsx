import { useState } from 'react';
import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { driverExamples, type DriverStage } from '@ladderwright/shared/driver';
import { renderWithApp } from '../../../../testing/render';
import { TransistorSection } from './transistor-section';

/** The section on a live driver stage; `issueAt` names the one path that has an issue, if any. */
function Harness({ onStage, issueAt }: { onStage: (stage: DriverStage) => void; issueAt?: string }) {
  const [stage, setStage] = useState<DriverStage>(driverExamples.surfaceChargeTester);
  return (
    <TransistorSection
      driver={stage}
      issue={(path) => (path === issueAt ? 'must be at least 2' : null)}
      edit={(mutate) => {
        const next = structuredClone(stage);
        mutate(next);
        setStage(next);
        onStage(next);
      }}
    />
  );
}

describe('TransistorSection model details', () => {
  it('keeps the model fields folded, sets one typed with its prefix and removes it when emptied', async () => {
    let stage: DriverStage | undefined;
    renderWithApp(<Harness onStage={(next) => (stage = next)} />);
    const toggle = screen.getByRole('button', { name: /Transistor model details/ });
    expect(toggle).toHaveAttribute('aria-expanded', 'false');
    expect(screen.queryByLabelText('Early voltage (VAF)')).toBeNull();
    fireEvent.click(toggle);
    expect(toggle).toHaveAttribute('aria-expanded', 'true');
    const early = await screen.findByLabelText('Early voltage (VAF)');
    expect(early).toHaveAttribute('placeholder', 'none (default)');
    expect(screen.getByLabelText('B–E junction capacitance (CJE)')).toHaveAttribute('placeholder', '10 pF (default)');
    fireEvent.change(early, { target: { value: '80 V' } });
    expect(stage?.transistor.earlyVoltageV).toBe(80);
    fireEvent.change(screen.getByLabelText('Forward transit time (TF)'), { target: { value: '1.5n' } });
    expect(stage?.transistor.forwardTransitTimeS).toBeCloseTo(1.5e-9, 20);
    expect(toggle).toHaveTextContent('2 set');
    fireEvent.change(early, { target: { value: '' } });
    expect(stage && 'earlyVoltageV' in stage.transistor).toBe(false);
  });

  it('opens by itself when one of its fields has an issue', async () => {
    renderWithApp(<Harness onStage={() => {}} issueAt="drive.driver.transistor.earlyVoltageV" />);
    expect(screen.getByRole('button', { name: /Transistor model details/ })).toHaveAttribute('aria-expanded', 'true');
    expect(await screen.findByText('must be at least 2')).toBeInTheDocument();
  });
});
