import { useMemo, useState } from 'react';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { designExamples, validateDesign, type Design } from '@ladderwright/shared/designs';
import { isDomainError } from '@ladderwright/shared/errors';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { renderWithApp } from '../../../testing/render';
import { LadderForm } from './ladder-form';

/** The engine's field issues on a document, by path, as the Workbench hands them to the form. */
function engineIssues(document: Design): Record<string, string> {
  try {
    analyzeDesign(validateDesign(document));
    return {};
  } catch (error) {
    const issues: Record<string, string> = {};
    if (isDomainError(error)) for (const issue of error.issues) issues[issue.path] ??= issue.message;
    return issues;
  }
}

/** The form on a live document, with the engine's issues recomputed on every change. */
function Harness({ onDocument }: { onDocument: (document: Design) => void }) {
  const [document, setDocument] = useState<Design>(designExamples.surfaceChargeTester);
  const issues = useMemo(() => engineIssues(document), [document]);
  return (
    <LadderForm
      document={document}
      issues={issues}
      onChange={(next) => {
        setDocument(next);
        onDocument(next);
      }}
    />
  );
}

function driverOf(document: Design | undefined) {
  if (document?.drive.kind !== 'driver') throw new Error('not a driver design');
  return document.drive.driver;
}

// Every change re-runs the full driver analysis in the harness (about 0.1–0.2 s each on a loaded 2-core machine).
const timeoutMs = 60_000;

describe('LadderForm driver fields', () => {
  it(
    'writes a typed transistor Vce(sat) and a feedback-winding resistance to their driver paths',
    () => {
      const seen: Design[] = [];
      renderWithApp(<Harness onDocument={(d) => seen.push(d)} />);
      fireEvent.change(screen.getByLabelText('Vce (sat)'), { target: { value: '350 mV' } });
      expect(driverOf(seen.at(-1)).transistor.vceSatV).toBeCloseTo(0.35, 12);
      fireEvent.change(screen.getByLabelText('Feedback resistance'), { target: { value: '0.4' } });
      const driver = driverOf(seen.at(-1));
      expect(driver.transformer.feedbackResistanceOhm).toBeCloseTo(0.4, 12);
      // The earlier edit survives the later one.
      expect(driver.transistor.vceSatV).toBeCloseTo(0.35, 12);
    },
    timeoutMs,
  );

  it(
    'shows the validator’s message beside the primary inductance when it is set to zero',
    () => {
      renderWithApp(<Harness onDocument={() => undefined} />);
      const field = screen.getByLabelText('Primary inductance');
      fireEvent.change(field, { target: { value: '0 H' } });
      expect(screen.getByText('must be greater than zero')).toBeTruthy();
      expect(field.getAttribute('aria-invalid')).toBe('true');
    },
    timeoutMs,
  );

  it(
    'switches the supply to a DC supply and offers its voltage and source resistance',
    () => {
      const seen: Design[] = [];
      renderWithApp(<Harness onDocument={(d) => seen.push(d)} />);
      fireEvent.click(screen.getByRole('radio', { name: 'DC supply' }));
      expect(driverOf(seen.at(-1)).supply.kind).toBe('dc');
      fireEvent.change(screen.getByLabelText('Supply source resistance'), { target: { value: '2.2' } });
      expect(driverOf(seen.at(-1)).supply).toMatchObject({ kind: 'dc', sourceResistanceOhm: 2.2 });
    },
    timeoutMs,
  );

  it(
    'offers the RCD clamp’s resistor and capacitor only once RCD is chosen, and sets the battery-life target',
    () => {
      const seen: Design[] = [];
      renderWithApp(<Harness onDocument={(d) => seen.push(d)} />);
      expect(screen.queryByLabelText('Clamp resistor')).toBeNull();
      fireEvent.click(screen.getByLabelText('Clamp', { selector: 'input' }));
      fireEvent.click(screen.getByRole('option', { name: 'RCD' }));
      // An RCD clamp states no voltage: its resistor and capacitor set its level (the simulated circuit's defaults).
      expect(driverOf(seen.at(-1)).clamp).toEqual({ kind: 'rcd', resistorOhm: 10e3, capacitorF: 10e-9 });
      expect(screen.queryByLabelText('Zener voltage')).toBeNull();
      fireEvent.change(screen.getByLabelText('Clamp resistor'), { target: { value: '22k' } });
      expect(driverOf(seen.at(-1)).clamp).toMatchObject({ kind: 'rcd', resistorOhm: 22e3 });
      fireEvent.change(screen.getByLabelText('Battery-life target (h)'), { target: { value: '40' } });
      expect(driverOf(seen.at(-1)).batteryLifeTargetH).toBe(40);
    },
    timeoutMs,
  );
});

describe('LadderForm change of shape', () => {
  it(
    'asks before an odd cell count moves capacitors to the other column, then keeps the values at their places',
    async () => {
      const seen: Design[] = [];
      renderWithApp(<Harness onDocument={(d) => seen.push(d)} />);
      fireEvent.change(screen.getByRole('textbox', { name: 'Cells' }), { target: { value: '3' } });
      // Nothing changes until the question is answered (the dialog's code loads when it opens).
      expect(seen).toHaveLength(0);
      const dialog = await screen.findByRole('dialog', { name: 'Capacitors change places' }, { timeout: 10_000 });
      expect(within(dialog).getByRole('list', { name: 'Capacitors that move' })).toBeTruthy();
      fireEvent.click(within(dialog).getByRole('button', { name: 'Keep values at their places' }));
      const multiplier = seen.at(-1)?.multiplier;
      expect(multiplier?.cellCount).toBe(3);
      expect(multiplier?.capacitors).toHaveLength(3);
      await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    },
    timeoutMs,
  );
});
