import { lazy, Suspense, useState } from 'react';
import { Alert, Group, Loader, SegmentedControl, Stack } from '@mantine/core';
import type { Part } from '@ladderwright/shared/api';
import type { Design, SpacingEnvironment } from '@ladderwright/shared/designs';
import type { DriverStage, DriverTransformer } from '@ladderwright/shared/driver';
import type { QuantityUnit } from '@ladderwright/shared/units';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import { binder, type Edit } from '../../document-path';
import { DRIVER_PATH } from './driver-edit';
import type { SectionProps } from './form-section.types';

// A section designed from a core takes the transformer engine and the driver estimate (for its first end
// margins): that code loads when a design uses it, not with every Workbench.
const DesignedTransformerFields = lazy(() =>
  import('./designed-transformer-fields').then((module) => ({ default: module.DesignedTransformerFields })),
);

/** The keys of T that hold numbers. */
export type NumberKeys<T> = { [K in keyof T]-?: T[K] extends number ? K : never }[keyof T] & string;

/** One field of a data-driven grid: a quantity with its unit, or a plain number (turns, ratios) when `unit` is null. */
export interface FieldSpec<K extends string> {
  key: K;
  label: string;
  unit: QuantityUnit | null;
  isInteger?: boolean;
  step?: number;
}

const transformerFields: FieldSpec<NumberKeys<DriverTransformer>>[] = [
  { key: 'primaryTurns', label: 'Primary turns', unit: null, isInteger: true },
  { key: 'feedbackTurns', label: 'Feedback turns', unit: null, isInteger: true },
  { key: 'secondaryTurns', label: 'Secondary turns', unit: null, isInteger: true },
  { key: 'primaryInductanceH', label: 'Primary inductance', unit: 'H' },
  { key: 'couplingCoefficient', label: 'Coupling coefficient k', unit: null, step: 0.01 },
  { key: 'saturationCurrentA', label: 'Core saturation current', unit: 'A' },
  { key: 'primaryResistanceOhm', label: 'Primary resistance', unit: 'Ohm' },
  { key: 'feedbackResistanceOhm', label: 'Feedback resistance', unit: 'Ohm' },
  { key: 'secondaryResistanceOhm', label: 'Secondary resistance', unit: 'Ohm' },
];

export interface DriverSectionProps {
  driver: DriverStage;
  edit: Edit<DriverStage>;
  issue: SectionProps['issue'];
}

/**
 * The blocking oscillator's transformer: its numbers as given (the default), or designed from a core, a gap
 * and windings on the project's Parts shelf, from which the engine derives the same numbers. The first switch to
 * a designed transformer starts on the core the transformer Sizer ranks first for the driver (with `editDesign`,
 * the whole document's edit: the choice reads the design's driver and targets) and says which and why.
 */
export function TransformerSection({
  driver,
  edit,
  editDesign,
  issue,
  parts,
  spacing,
}: DriverSectionProps & { editDesign?: Edit<Design>; parts: readonly Part[]; spacing?: SpacingEnvironment }) {
  const choice = driver.transformerChoice ?? 'given';
  const [isStarting, setIsStarting] = useState(false);
  const [startNote, setStartNote] = useState<string | null>(null);
  const path = `${DRIVER_PATH}.transformerChoice`;
  const startDesigned = async () => {
    setIsStarting(true);
    const [{ startDesignedTransformer }, { startingSection }] = await Promise.all([
      import('../../designed-start'),
      import('../../transformer-start'),
    ]);
    let note: string | null = null;
    if (editDesign) {
      editDesign((design) => {
        if (design.drive.kind !== 'driver') return;
        const dr = design.drive.driver;
        if (!dr.transformerDesign) {
          const start = startDesignedTransformer(design, parts);
          if (start) [dr.transformerDesign, note] = [start.section, start.note];
        }
        dr.transformerChoice = 'designed';
      }, path);
    } else {
      edit((dr) => {
        dr.transformerDesign ??= startingSection(dr, parts, spacing);
        dr.transformerChoice = 'designed';
      }, path);
    }
    setStartNote(note);
    setIsStarting(false);
  };
  return (
    <Stack gap="sm">
      <Group gap="sm">
        <SegmentedControl
          aria-label="Transformer from"
          value={choice}
          w="fit-content"
          data={[
            { value: 'given', label: 'Given numbers' },
            { value: 'designed', label: 'Designed from a core' },
          ]}
          onChange={(value) => {
            if (value !== 'designed') {
              edit((dr) => void (dr.transformerChoice = 'given'), path);
              setStartNote(null);
              return;
            }
            void startDesigned();
          }}
        />
        {isStarting && <Loader size="xs" aria-label="Choosing a core for this driver" />}
      </Group>
      {choice === 'designed' && startNote && (
        <Alert
          variant="light"
          title="Starting core"
          role="status"
          aria-label="Starting core"
          withCloseButton
          closeButtonLabel="Dismiss"
          onClose={() => setStartNote(null)}
        >
          {startNote}
        </Alert>
      )}
      {choice === 'designed' && driver.transformerDesign ? (
        <Suspense fallback={<Loader size="sm" aria-label="Loading the transformer fields" />}>
          <DesignedTransformerFields section={driver.transformerDesign} edit={edit} issue={issue} parts={parts} />
        </Suspense>
      ) : (
        <GivenTransformerFields driver={driver} edit={edit} issue={issue} />
      )}
    </Stack>
  );
}

/** The transformer as stated numbers: turns, inductance, coupling, resistances, saturation, insulation. */
function GivenTransformerFields({ driver, edit, issue }: DriverSectionProps) {
  const bind = binder(driver, edit, issue, DRIVER_PATH);
  return (
    <FieldGrid>
      {transformerFields.map(({ key, ...field }) => (
        <BoundField key={key} {...field} {...bind(`transformer.${key}`)} />
      ))}
      <BoundField
        label="Secondary insulation rating"
        unit="V"
        value={driver.transformer.insulation?.ratedVoltageV ?? Number.NaN}
        path={`${DRIVER_PATH}.transformer.insulation.ratedVoltageV`}
        issue={issue(`${DRIVER_PATH}.transformer.insulation.ratedVoltageV`)}
        onValue={(v) =>
          edit(
            (dr) => void (dr.transformer.insulation = { ratedVoltageV: v }),
            `${DRIVER_PATH}.transformer.insulation.ratedVoltageV`,
          )
        }
      />
    </FieldGrid>
  );
}
