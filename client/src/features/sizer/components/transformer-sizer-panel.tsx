import { useMemo, useState } from 'react';
import { Alert, Button, Fieldset, Group, NumberInput, Select, SimpleGrid, Stack, Table, Text } from '@mantine/core';
import type { DriverSizerFigures, WorsenedCheck } from '@ladderwright/shared/analysis';
import type { Part } from '@ladderwright/shared/api';
import type { SpacingEnvironment } from '@ladderwright/shared/designs';
import { isDomainError } from '@ladderwright/shared/errors';
import { shelfMagnetics } from '@ladderwright/shared/parts';
import {
  sizeTransformer,
  type TransformerSection,
  type TransformerSizerCandidate,
} from '@ladderwright/shared/transformer';
import { formatQuantity } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';

/** The open design the Sizer starts from and applies to. */
export interface SizerDesign {
  /** The design's name, as the panel says where its figures come from. */
  name: string;
  /** The driver's figures at the rated load (`driverSizerFigures`). */
  figures: DriverSizerFigures;
  spacing: SpacingEnvironment;
  /** Wire codes of the design's section, if designed: the Sizer starts with them. */
  primaryWireCode?: string;
  secondaryWireCode?: string;
}

export interface TransformerSizerPanelProps {
  shelf: readonly Part[];
  /** Start from this design's driver figures and spacing instead of typed ones. */
  design?: SizerDesign;
  /** Apply a fitting core's section to the design (absent: no Apply buttons). */
  onApply?: (section: TransformerSection, core: string) => void;
  /**
   * The design's Checks a fitting core's section leaves worse than the given numbers (`sectionAssessor`): shown
   * beside each fitting core, and cores that leave a Check failing rank after those that do not.
   */
  assess?: (section: TransformerSection) => WorsenedCheck[];
}

/** A ranked core with what its section does to the rest of the design (null: not assessed). */
interface RankedRow {
  candidate: TransformerSizerCandidate;
  worsened: WorsenedCheck[] | null;
}

/** A design Check id in words: "driver.base-drive" -> "base drive", "driver-power" -> "driver power". */
const checkWords = (id: string) => id.replace(/^driver\./, '').replace(/[-.]/g, ' ');

/** What a fitting core's section does to the design's other Checks, in a few words. */
function onDesignWords(worsened: readonly WorsenedCheck[]): string {
  if (worsened.length === 0) return 'no Check worse than on the given numbers';
  const of = (verdict: WorsenedCheck['verdict']) =>
    worsened.filter((w) => w.verdict === verdict).map((w) => checkWords(w.id));
  const fails = of('fail');
  const marginal = of('marginal');
  return [fails.length > 0 && `fails ${fails.join(', ')}`, marginal.length > 0 && `marginal ${marginal.join(', ')}`]
    .filter(Boolean)
    .join('; ');
}

/** 0 fits and keeps the design's Checks, 1 fits but leaves a Check failing, 2 refused. */
const rowGroup = (row: RankedRow) =>
  row.candidate.refusal !== null ? 2 : row.worsened?.some((w) => w.verdict === 'fail') ? 1 : 0;

/** Pollution degree 2, material group IIIa: the spacing the demo designs state (common practice for indoor kit). */
const SPACING: SpacingEnvironment = { pollutionDegree: 2, materialGroup: 'IIIa', pcb: false };

type Inputs = DriverSizerFigures;

/** Figures shown to four significant digits, as a person would type them. */
const rounded = (figures: DriverSizerFigures): Inputs => ({
  primaryInductanceH: Number(figures.primaryInductanceH.toPrecision(4)),
  primaryPeakCurrentA: Number(figures.primaryPeakCurrentA.toPrecision(4)),
  turnsRatio: Number(figures.turnsRatio.toPrecision(4)),
  feedbackRatio: Number(figures.feedbackRatio.toPrecision(4)),
  frequencyHz: Number(figures.frequencyHz.toPrecision(4)),
  dutyOnFraction: Number(figures.dutyOnFraction.toPrecision(3)),
  secondaryPeakV: Number(figures.secondaryPeakV.toPrecision(4)),
});

/** The demo handheld tester's driver: 1 mH, 20 : 8 : 1200 turns, about 0.5 A peak. */
const DEFAULT_INPUTS: Inputs = {
  primaryInductanceH: 1e-3,
  primaryPeakCurrentA: 0.5,
  turnsRatio: 60,
  feedbackRatio: 0.4,
  frequencyHz: 20e3,
  dutyOnFraction: 0.3,
  secondaryPeakV: 900,
};

/** The engine's refusal with its Check ids in words: "fails transformer.window-fill" -> "fails window fill". */
function refusalWords(refusal: string): string {
  return refusal.replace(
    /transformer\.([a-z-]+)(?:\.([a-z]+))?/g,
    (_, id: string, role?: string) => `${id.replace(/-/g, ' ')}${role ? ` (${role})` : ''}`,
  );
}

const mT = (valueT: number) => `${Number((valueT * 1e3).toPrecision(3))} mT`;

/**
 * The transformer Sizer (shared sizeTransformer): for the driver's primary inductance, peak current and turns
 * ratios, every core on the Parts shelf with the fewest primary turns that keep the flux margin at 100 °C, ranked
 * by loss and then size; cores that do not fit follow with the reason.
 */
export function TransformerSizerPanel({ shelf, design, onApply, assess }: TransformerSizerPanelProps) {
  const { cores, wires, tapes } = useMemo(() => shelfMagnetics(shelf), [shelf]);
  const [inputs, setInputs] = useState<Inputs>(() => (design ? rounded(design.figures) : DEFAULT_INPUTS));
  const [codes, setCodes] = useState<{ primary?: string; secondary?: string; tape?: string }>(() => ({
    ...(design?.primaryWireCode ? { primary: design.primaryWireCode } : {}),
    ...(design?.secondaryWireCode ? { secondary: design.secondaryWireCode } : {}),
  }));
  const [applied, setApplied] = useState<string | null>(null);
  const spacing = design?.spacing ?? SPACING;
  const [ranked, setRanked] = useState<RankedRow[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const byDiameter = [...wires].sort((a, b) => a.copperDiameterM - b.copperDiameterM);
  const primaryWire = wires.find((w) => w.code === codes.primary) ?? byDiameter[byDiameter.length - 1];
  const secondaryWire = wires.find((w) => w.code === codes.secondary) ?? byDiameter[0];
  const tape = tapes.find((t) => t.code === codes.tape) ?? tapes[0];
  const set = (key: keyof Inputs) => (value: number | string) =>
    setInputs((current) => ({ ...current, [key]: typeof value === 'number' ? value : Number.NaN }));

  const rank = () => {
    setError(null);
    if (!primaryWire || !secondaryWire || !tape) return;
    try {
      const candidates = sizeTransformer(
        cores,
        {
          ...inputs,
          primaryWire,
          feedbackWire: primaryWire,
          secondaryWire,
          windingTape: tape,
          windingTapeWraps: 3,
          layerTape: tape,
        },
        spacing,
      );
      const assessed = (candidate: TransformerSizerCandidate): WorsenedCheck[] | null => {
        if (!assess || candidate.refusal !== null || !candidate.section) return null;
        try {
          return assess(candidate.section);
        } catch {
          // A design the engine refuses on this section: the row says nothing rather than the ranking failing.
          return null;
        }
      };
      const rows = candidates.map((candidate): RankedRow => ({ candidate, worsened: assessed(candidate) }));
      // Stable: within each group the engine's order (loss, then core volume) stands.
      setRanked(rows.sort((a, b) => rowGroup(a) - rowGroup(b)));
    } catch (caught) {
      setRanked(null);
      setError(isDomainError(caught) ? caught.message : 'The Sizer could not rank these cores');
    }
  };

  if (cores.length === 0 || !primaryWire || !secondaryWire || !tape) {
    return (
      <Text size="sm" c="dimmed">
        The Parts shelf needs at least one core, one wire and one tape with their figures to rank cores.
      </Text>
    );
  }
  const wireData = wires.map((w) => ({ value: w.code, label: w.code }));
  return (
    <Stack gap="sm">
      <Fieldset legend={design ? `From the driver of ${design.name}, at the rated load` : 'From the driver'}>
        {design && (
          <Group gap="xs" mb="xs">
            <Text size="xs" c="dimmed">
              The driver on its given transformer numbers, the ones a section is to realise; the peak current is the
              core’s magnetizing peak (the collector peak and its turn-off slew); the creepage follows the design’s
              spacing.
            </Text>
            <Button
              size="compact-xs"
              variant="subtle"
              onClick={() => {
                setInputs(rounded(design.figures));
                setRanked(null);
              }}
            >
              Take the design’s figures again
            </Button>
          </Group>
        )}
        {/* Columns by the panel's own width (a results column or a page), so no label wraps beside its neighbour. */}
        <SimpleGrid type="container" cols={{ base: 1, '380px': 2, '820px': 4 }} spacing="sm">
          <QuantityInput
            label="Primary inductance"
            unit="H"
            value={inputs.primaryInductanceH}
            onChange={set('primaryInductanceH')}
          />
          <QuantityInput
            label="Peak primary current"
            unit="A"
            value={inputs.primaryPeakCurrentA}
            onChange={set('primaryPeakCurrentA')}
          />
          <NumberInput
            label="Turns ratio secondary / primary"
            value={inputs.turnsRatio}
            min={1}
            onChange={set('turnsRatio')}
          />
          <NumberInput
            label="Turns ratio feedback / primary"
            value={inputs.feedbackRatio}
            min={0.05}
            step={0.05}
            decimalScale={3}
            onChange={set('feedbackRatio')}
          />
          <QuantityInput label="Frequency" unit="Hz" value={inputs.frequencyHz} onChange={set('frequencyHz')} />
          <NumberInput
            label="On-time fraction"
            value={inputs.dutyOnFraction}
            min={0.01}
            max={0.99}
            step={0.05}
            decimalScale={3}
            onChange={set('dutyOnFraction')}
          />
          <QuantityInput
            label="Secondary peak"
            unit="V"
            value={inputs.secondaryPeakV}
            onChange={set('secondaryPeakV')}
          />
        </SimpleGrid>
      </Fieldset>
      <SimpleGrid type="container" cols={{ base: 1, '380px': 2, '820px': 3 }} spacing="sm">
        <Select
          label="Primary and feedback wire"
          data={wireData}
          value={primaryWire.code}
          allowDeselect={false}
          onChange={(code) => setCodes((c) => ({ ...c, primary: code ?? undefined }))}
        />
        <Select
          label="Secondary wire"
          data={wireData}
          value={secondaryWire.code}
          allowDeselect={false}
          onChange={(code) => setCodes((c) => ({ ...c, secondary: code ?? undefined }))}
        />
        <Select
          label="Tape (layers, and 3 wraps between windings)"
          data={tapes.map((t) => ({ value: t.code, label: t.code }))}
          value={tape.code}
          allowDeselect={false}
          onChange={(code) => setCodes((c) => ({ ...c, tape: code ?? undefined }))}
        />
      </SimpleGrid>
      <Button w="fit-content" onClick={rank}>
        Rank {cores.length} shelf cores
      </Button>
      {applied && (
        <Text size="sm" role="status">
          {applied} applied to the draft with its turns, wires and margins: undo with Ctrl+Z, or save it as a new
          revision with a change note.
        </Text>
      )}
      {error && (
        <Alert color="red" title="Not ranked">
          {error}
        </Alert>
      )}
      {ranked && (
        <div style={{ overflowX: 'auto' }}>
          <Table aria-label="Ranked cores" fz="sm" miw={900} striped style={{ whiteSpace: 'nowrap' }}>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Rank</Table.Th>
                <Table.Th>Core</Table.Th>
                {onApply && <Table.Th>Design</Table.Th>}
                <Table.Th>Verdict</Table.Th>
                {assess && <Table.Th>On the design</Table.Th>}
                <Table.Th>Turns P : F : S</Table.Th>
                <Table.Th>Gap</Table.Th>
                <Table.Th>Peak flux</Table.Th>
                <Table.Th>Margin at 100 °C</Table.Th>
                <Table.Th>Loss (core + copper)</Table.Th>
                <Table.Th>Window fill</Table.Th>
                <Table.Th>Core volume</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {ranked.map(({ candidate, worsened }, index) => (
                <Table.Tr key={candidate.core.code}>
                  <Table.Td>{index + 1}</Table.Td>
                  <Table.Td ff="monospace">{candidate.core.code}</Table.Td>
                  {onApply && (
                    <Table.Td>
                      {candidate.refusal === null && candidate.section && (
                        <Button
                          size="compact-xs"
                          variant="light"
                          aria-label={`Apply ${candidate.core.code} to the design`}
                          onClick={() => {
                            if (!candidate.section) return;
                            onApply(candidate.section, candidate.core.code);
                            setApplied(candidate.core.code);
                          }}
                        >
                          Apply
                        </Button>
                      )}
                    </Table.Td>
                  )}
                  <Table.Td style={{ whiteSpace: 'normal', minWidth: '14rem' }}>
                    {candidate.refusal === null ? 'fits' : `refused: ${refusalWords(candidate.refusal)}`}
                  </Table.Td>
                  {assess && (
                    <Table.Td style={{ whiteSpace: 'normal', minWidth: '14rem' }}>
                      {worsened ? onDesignWords(worsened) : '—'}
                    </Table.Td>
                  )}
                  <Table.Td>
                    {candidate.primaryTurns} : {candidate.feedbackTurns} : {candidate.secondaryTurns}
                  </Table.Td>
                  <Table.Td>{candidate.refusal === null ? formatQuantity(candidate.gap.gapM, 'm', 3) : '—'}</Table.Td>
                  <Table.Td>{candidate.refusal === null ? mT(candidate.peakFluxDensityT) : '—'}</Table.Td>
                  <Table.Td>
                    {candidate.refusal === null ? `${Number(candidate.saturationMarginPct.toPrecision(3))} %` : '—'}
                  </Table.Td>
                  <Table.Td>
                    {candidate.refusal === null
                      ? formatQuantity(candidate.coreLossW + candidate.copperLossW, 'W', 3)
                      : '—'}
                  </Table.Td>
                  <Table.Td>
                    {candidate.refusal === null ? `${Number((candidate.windowFill * 100).toPrecision(3))} %` : '—'}
                  </Table.Td>
                  <Table.Td>{Number((candidate.core.volumeM3 * 1e9).toPrecision(4))} mm³</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </div>
      )}
    </Stack>
  );
}
