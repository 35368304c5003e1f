import { useState } from 'react';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import type { DriverStage } from '@ladderwright/shared/driver';
import { demoCoreKinds } from '@ladderwright/shared/transformer';
import { renderWithApp } from '../../../../testing/render';
import type { Edit } from '../../document-path';
import { driverEdit } from './driver-edit';
import { TransformerSection } from './transformer-section';

/** The section on the live demo tester with an empty shelf (the engine's demo kinds stand in). */
function Harness({ onStage }: { onStage: (stage: DriverStage) => void }) {
  const [design, setDesign] = useState<Design>(designExamples.surfaceChargeTester);
  const edit: Edit<Design> = (mutate) => {
    const next = structuredClone(design);
    mutate(next);
    setDesign(next);
    if (next.drive.kind === 'driver') onStage(next.drive.driver);
  };
  if (design.drive.kind !== 'driver') return null;
  return (
    <TransformerSection
      driver={design.drive.driver}
      issue={() => null}
      parts={[]}
      edit={driverEdit(edit)}
      editDesign={edit}
      spacing={design.targets.spacing}
    />
  );
}

describe('TransformerSection', () => {
  it('starts a designed transformer on the core the Sizer ranks first, keeping the given inductance and ratios, and says why', async () => {
    let stage: DriverStage | undefined;
    renderWithApp(<Harness onStage={(next) => (stage = next)} />);
    fireEvent.click(screen.getByText('Designed from a core'));
    // The section's engine code loads on the first switch; the edit follows it.
    await waitFor(() => expect(stage?.transformerChoice).toBe('designed'), { timeout: 10_000 });
    const design = stage?.transformerDesign;
    expect(design?.gap).toEqual({ kind: 'primary-inductance', primaryInductanceH: 1e-3 });
    // Not the first demo core (the small E13 cannot hold the turns): the E25, the only one that fits.
    expect(design?.core.code).not.toBe(demoCoreKinds[0]?.code);
    expect(design?.core.code).toBe('Core E25 ferrite grade A');
    const [primary, feedback, secondary] = design?.windings.map((w) => w.turns) ?? [];
    // The given 20 : 8 : 1200 ratios, in the turns the core's flux margin and shortest gap allow.
    expect((secondary ?? 0) / (primary ?? 1)).toBeCloseTo(60, 1);
    expect((feedback ?? 0) / (primary ?? 1)).toBeCloseTo(0.4, 1);
    const note = await screen.findByRole('status', { name: 'Starting core' });
    expect(note).toHaveTextContent(/^Starting core.*Core E25 ferrite grade A is the only core of 5 that fits/);
    expect(note).toHaveTextContent(`${primary} : ${feedback} : ${secondary} turns`);
    // The thicker wire on the primary, the thinnest on the secondary.
    const [p, , s] = design?.windings ?? [];
    expect(p?.wire.copperDiameterM).toBeGreaterThan(s?.wire.copperDiameterM ?? Infinity);

    fireEvent.change(await screen.findByLabelText('Secondary turns'), { target: { value: '1500' } });
    expect(stage?.transformerDesign?.windings[2]?.turns).toBe(1500);

    fireEvent.click(screen.getByRole('button', { name: 'Wind the secondary earlier' }));
    expect(stage?.transformerDesign?.windings.map((w) => w.role)).toEqual(['primary', 'secondary', 'feedback']);
    expect(within(screen.getByLabelText('Secondary winding')).getByText('2. Secondary')).toBeInTheDocument();

    fireEvent.click(screen.getByText('Given numbers'));
    expect(stage?.transformerChoice).toBe('given');
    expect(screen.queryByRole('status', { name: 'Starting core' })).toBeNull();
    expect(stage?.transformerDesign?.windings[1]?.turns).toBe(1500);
  });
});
