import { documentFieldLabel } from '@ladderwright/shared/designs';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import type { OptionalBinding } from '../../document-path';

/** One optional model field: its binding and what the simulation takes when it is empty (null: none). */
export interface ModelDetail {
  binding: OptionalBinding;
  fallback: number | null;
}

const QUANTITY_UNITS: ReadonlySet<string> = new Set<QuantityUnit>(['V', 'A', 'F', 'Ohm', 's']);

/** The fields of an opened model-details group, labelled from the document's field labels. */
export function ModelDetailFields({ details }: { details: readonly ModelDetail[] }) {
  return (
    <FieldGrid>
      {details.map(({ binding, fallback }) => {
        const { label, display } = documentFieldLabel(binding.path);
        const unit = QUANTITY_UNITS.has(display) ? (display as QuantityUnit) : null;
        const shown = fallback === null ? 'none' : unit ? formatQuantity(fallback, unit) : String(fallback);
        return (
          <BoundField
            key={binding.path}
            label={label}
            unit={unit}
            step={0.05}
            decimalScale={3}
            placeholder={`${shown} (default)`}
            {...binding}
          />
        );
      })}
    </FieldGrid>
  );
}
