import { NumberInput, SegmentedControl, Select, SimpleGrid, Stack, Text } from '@mantine/core';
import type {
  CellChemistry,
  DriverClamp,
  DriverStage,
  DriverTransformer,
  DriverTransistor,
} from '@ladderwright/shared/driver';
import { driverExamples } from '@ladderwright/shared/driver';
import type { QuantityUnit } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';
import { binder } from '../document-path';

export interface DriverFieldsProps {
  driver: DriverStage;
  /** Applies one change to a copy of the driver stage and hands the document on. */
  onDriver: (mutate: (driver: DriverStage) => void) => void;
  /** The form's issue lookup by document path. */
  issue: (path: string) => string | null;
}

/** Document path of the driver stage; engine and validateDesign issues come back under it. */
const p = 'drive.driver';

const chemistries: Array<{ value: Exclude<CellChemistry, 'custom'>; label: string }> = [
  { value: 'alkaline', label: 'alkaline' },
  { value: 'nimh', label: 'NiMH' },
  { value: 'li-ion', label: 'lithium-ion' },
];

type ClampKind = 'none' | DriverClamp['kind'];

/** The clamp a kind starts with: the present clamp voltage kept, the demo stage's otherwise. */
function clampOf(kind: ClampKind, present: DriverClamp | undefined): DriverClamp | undefined {
  const clampVoltageV = present?.clampVoltageV ?? driverExamples.surfaceChargeTester.clamp?.clampVoltageV ?? 30;
  if (kind === 'zener') return { kind: 'zener', clampVoltageV };
  if (kind === 'rcd') return { kind: 'rcd', clampVoltageV, resistorOhm: 10e3, capacitorF: 10e-9 };
  return undefined;
}

/** A quantity field on one driver path. */
function DriverQuantity({
  label,
  unit,
  value,
  path,
  issue,
  onValue,
}: {
  label: string;
  unit: QuantityUnit;
  value: number;
  path: string;
  issue: DriverFieldsProps['issue'];
  onValue: (value: number) => void;
}) {
  return <QuantityInput label={label} unit={unit} value={value} onChange={onValue} issue={issue(`${p}.${path}`)} />;
}

/** A plain number (counts, ratios) on one driver path; an empty field reads as 0 and is refused by the engine. */
function DriverNumber({
  label,
  value,
  path,
  issue,
  onValue,
  isInteger = false,
  step = 1,
}: {
  label: string;
  value: number;
  path: string;
  issue: DriverFieldsProps['issue'];
  onValue: (value: number) => void;
  isInteger?: boolean;
  step?: number;
}) {
  return (
    <NumberInput
      label={label}
      value={value}
      min={0}
      step={step}
      allowDecimal={!isInteger}
      decimalScale={isInteger ? 0 : 4}
      error={issue(`${p}.${path}`)}
      onChange={(v) => onValue(Number(v))}
    />
  );
}

/** One field of a data-driven grid: a quantity with its unit, or a plain number (turns, ratios) when `unit` is null. */
interface FieldSpec<K extends string> {
  key: K;
  label: string;
  unit: QuantityUnit | null;
  isInteger?: boolean;
  step?: number;
}

type NumberKeys<T> = { [K in keyof T]-?: T[K] extends number ? K : never }[keyof T] & string;

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

const transistorFields: FieldSpec<NumberKeys<DriverTransistor>>[] = [
  { key: 'forwardBeta', label: 'Forward β', unit: null },
  { key: 'reverseBeta', label: 'Reverse β', unit: null, step: 0.5 },
  { key: 'vbeOnV', label: 'Vbe (on)', unit: 'V' },
  { key: 'vceSatV', label: 'Vce (sat)', unit: 'V' },
  { key: 'vceoMaxV', label: 'Vceo max', unit: 'V' },
  { key: 'icMaxA', label: 'Ic max', unit: 'A' },
];

function PlainField<K extends string>({
  field,
  value,
  path,
  issue,
  onValue,
}: {
  field: FieldSpec<K>;
  value: number;
  path: string;
  issue: DriverFieldsProps['issue'];
  onValue: (value: number) => void;
}) {
  const { label, unit, isInteger = false, step = 1 } = field;
  return unit === null ? (
    <DriverNumber
      label={label}
      value={value}
      path={path}
      isInteger={isInteger}
      step={step}
      issue={issue}
      onValue={onValue}
    />
  ) : (
    <DriverQuantity label={label} unit={unit} value={value} path={path} issue={issue} onValue={onValue} />
  );
}

function SubHeading({ children }: { children: string }) {
  return (
    <Text size="sm" fw={600} mt="xs">
      {children}
    </Text>
  );
}

/**
 * The blocking-oscillator stage as fields: supply (cells or a DC supply), three-winding transformer,
 * switching transistor, base resistor, collector clamp and the battery-life target.
 */
export function DriverFields({ driver, onDriver, issue }: DriverFieldsProps) {
  const { supply, transformer: tx, clamp } = driver;
  const supplyIssue = issue(`${p}.supply`);
  const bind = binder(driver, onDriver);
  return (
    <Stack gap="sm">
      <SubHeading>Supply</SubHeading>
      <SegmentedControl
        aria-label="Supply kind"
        value={supply.kind}
        w="fit-content"
        data={[
          { value: 'cells', label: 'Cells' },
          { value: 'dc', label: 'DC supply' },
        ]}
        onChange={(kind) =>
          onDriver((dr) => {
            if (kind === dr.supply.kind) return;
            dr.supply =
              kind === 'cells'
                ? structuredClone(driverExamples.surfaceChargeTester.supply)
                : { kind: 'dc', voltageV: 3, sourceResistanceOhm: 0.1 };
          })
        }
      />
      {supplyIssue && (
        <Text size="sm" c="red" role="alert">
          {supplyIssue}
        </Text>
      )}
      {supply.kind === 'cells' ? (
        <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
          <Select
            label="Cell chemistry"
            value={supply.chemistry}
            allowDeselect={false}
            data={chemistries}
            error={issue(`${p}.supply.chemistry`)}
            onChange={(v) =>
              onDriver((dr) => {
                if (dr.supply.kind === 'cells' && v) dr.supply.chemistry = v;
              })
            }
          />
          <DriverNumber label="Cells in series" isInteger issue={issue} {...bind('supply.cellsInSeries')} />
          <DriverNumber label="Cell capacity (Ah)" step={0.1} issue={issue} {...bind('supply.capacityAh')} />
          <DriverQuantity
            label="Internal resistance per cell"
            unit="Ohm"
            issue={issue}
            {...bind('supply.internalResistanceOhm')}
          />
          <DriverQuantity label="End voltage per cell" unit="V" issue={issue} {...bind('supply.endVoltagePerCellV')} />
          <NumberInput
            label="Battery-life target (h)"
            placeholder="no target"
            value={driver.batteryLifeTargetH ?? ''}
            min={0}
            step={1}
            decimalScale={2}
            error={issue(`${p}.batteryLifeTargetH`)}
            onChange={(v) =>
              onDriver((dr) => {
                if (v === '' || v === null) delete dr.batteryLifeTargetH;
                else dr.batteryLifeTargetH = Number(v);
              })
            }
          />
        </SimpleGrid>
      ) : (
        <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
          <DriverQuantity label="Supply voltage" unit="V" issue={issue} {...bind('supply.voltageV')} />
          <DriverQuantity
            label="Supply source resistance"
            unit="Ohm"
            issue={issue}
            {...bind('supply.sourceResistanceOhm')}
          />
        </SimpleGrid>
      )}

      <SubHeading>Transformer</SubHeading>
      <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
        {transformerFields.map((field) => (
          <PlainField key={field.key} field={field} issue={issue} {...bind(`transformer.${field.key}`)} />
        ))}
        <DriverQuantity
          label="Secondary insulation rating"
          unit="V"
          value={tx.insulation?.ratedVoltageV ?? Number.NaN}
          path="transformer.insulation.ratedVoltageV"
          issue={issue}
          onValue={(v) => onDriver((dr) => void (dr.transformer.insulation = { ratedVoltageV: v }))}
        />
      </SimpleGrid>

      <SubHeading>Transistor</SubHeading>
      <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
        {transistorFields.map((field) => (
          <PlainField key={field.key} field={field} issue={issue} {...bind(`transistor.${field.key}`)} />
        ))}
      </SimpleGrid>

      <SubHeading>Base resistor and collector clamp</SubHeading>
      <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
        <DriverQuantity label="Base resistor" unit="Ohm" issue={issue} {...bind('baseResistorOhm')} />
        <Select
          label="Clamp"
          value={clamp?.kind ?? 'none'}
          allowDeselect={false}
          data={[
            { value: 'none', label: 'none (transistor breakdown)' },
            { value: 'zener', label: 'zener' },
            { value: 'rcd', label: 'RCD' },
          ]}
          error={issue(`${p}.clamp`)}
          onChange={(v) =>
            onDriver((dr) => {
              const next = clampOf(v ?? 'none', dr.clamp);
              if (next) dr.clamp = next;
              else delete dr.clamp;
            })
          }
        />
        {clamp && <DriverQuantity label="Clamp voltage" unit="V" issue={issue} {...bind('clamp.clampVoltageV')} />}
        {clamp?.kind === 'rcd' && (
          <>
            <DriverQuantity label="Clamp resistor" unit="Ohm" issue={issue} {...bind('clamp.resistorOhm')} />
            <DriverQuantity label="Clamp capacitor" unit="F" issue={issue} {...bind('clamp.capacitorF')} />
          </>
        )}
      </SimpleGrid>
    </Stack>
  );
}
