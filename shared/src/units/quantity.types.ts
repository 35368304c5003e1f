/** Units the engine parses and formats. `Ohm` is written Ω on output; SI base units inside. */
export type QuantityUnit = 'V' | 'A' | 'F' | 'Ohm' | 'Hz' | 'W' | 'J' | 'C' | 's' | 'H' | 'm';

/** A parsed value in SI base units with the unit the text carried (null when it carried none). */
export interface ParsedQuantity {
  valueSi: number;
  unit: QuantityUnit | null;
}

export interface ParseQuantityOptions {
  /** The unit the field expects; a different unit in the text is rejected. */
  unit?: QuantityUnit;
  /** Field path reported in the DomainError, e.g. `multiplier.capacitors[0].valueF`. */
  field?: string;
}
