import { useState } from 'react';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { driverExamples, type DriverStage } from '@ladderwright/shared/driver';
import { renderWithApp } from '../../../../testing/render';
import { TransformerSection } from './transformer-section';

/** The section on a live driver stage with an empty shelf (the engine's demo kinds stand in). */
function Harness({ onStage }: { onStage: (stage: DriverStage) => void }) {
  const [stage, setStage] = useState<DriverStage>(driverExamples.surfaceChargeTester);
  return (
    <TransformerSection
      driver={stage}
      issue={() => null}
      parts={[]}
      edit={(mutate) => {
        const next = structuredClone(stage);
        mutate(next);
        setStage(next);
        onStage(next);
      }}
    />
  );
}

describe('TransformerSection', () => {
  it('starts a designed transformer from the given turns and inductance, keeping them when switched back', async () => {
    let stage: DriverStage | undefined;
    renderWithApp(<Harness onStage={(next) => (stage = next)} />);
    fireEvent.click(screen.getByText('Designed from a core'));
    // The section's engine code loads on the first switch; the edit follows it.
    await waitFor(() => expect(stage?.transformerChoice).toBe('designed'));
    const design = stage?.transformerDesign;
    expect(design?.gap).toEqual({ kind: 'primary-inductance', primaryInductanceH: 1e-3 });
    expect(design?.windings.map((w) => [w.role, w.turns])).toEqual([
      ['primary', 20],
      ['feedback', 8],
      ['secondary', 1200],
    ]);
    // The thickest wire on the primary, the thinnest on the secondary.
    const [primary, , secondary] = design?.windings ?? [];
    expect(primary?.wire.copperDiameterM).toBeGreaterThan(secondary?.wire.copperDiameterM ?? Infinity);

    fireEvent.change(await screen.findByLabelText('Secondary turns'), { target: { value: '1500' } });
    expect(stage?.transformerDesign?.windings[2]?.turns).toBe(1500);

    fireEvent.click(screen.getByRole('button', { name: 'Wind the secondary earlier' }));
    expect(stage?.transformerDesign?.windings.map((w) => w.role)).toEqual(['primary', 'secondary', 'feedback']);
    expect(within(screen.getByLabelText('Secondary winding')).getByText('2. Secondary')).toBeInTheDocument();

    fireEvent.click(screen.getByText('Given numbers'));
    expect(stage?.transformerChoice).toBe('given');
    expect(stage?.transformerDesign?.windings[1]?.turns).toBe(1500);
  });
});
