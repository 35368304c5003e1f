import type { PartKind } from '@ladderwright/shared/api';

/** The shelf's kinds as the filter lists them (plural) and the add form offers them (singular). */
export const PART_KIND_OPTIONS: readonly { value: PartKind; label: string; single: string }[] = [
  { value: 'capacitor', label: 'Capacitors', single: 'Capacitor' },
  { value: 'diode', label: 'Diodes', single: 'Diode' },
  { value: 'resistor', label: 'Resistors', single: 'Resistor' },
  { value: 'transistor', label: 'Transistors', single: 'Transistor' },
  { value: 'core', label: 'Transformer cores', single: 'Transformer core' },
  { value: 'wire', label: 'Magnet wire', single: 'Magnet wire' },
  { value: 'tape', label: 'Insulation tape', single: 'Insulation tape' },
];
