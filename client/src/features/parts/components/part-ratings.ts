import type { Part } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';

/** The ratings of a part as one short line, in engineering notation. */
export function describeRatings(part: Part): string {
  const items: string[] = [];
  if (part.valueSi !== null) {
    const unit = part.kind === 'capacitor' ? 'F' : part.kind === 'resistor' ? 'Ohm' : 'H';
    items.push(`${formatQuantity(part.valueSi, unit)}${part.kind === 'core' ? '/turn²' : ''}`);
  }
  if (part.tolerance !== null) items.push(`±${(part.tolerance * 100).toFixed(0)} %`);
  if (part.ratedVoltageV !== null) items.push(formatQuantity(part.ratedVoltageV, 'V'));
  if (part.ratedCurrentA !== null) items.push(formatQuantity(part.ratedCurrentA, 'A'));
  if (part.ratedSurgeCurrentA !== null) items.push(`surge ${formatQuantity(part.ratedSurgeCurrentA, 'A')}`);
  if (part.ratedPowerW !== null) items.push(formatQuantity(part.ratedPowerW, 'W'));
  return items.join(' · ');
}
