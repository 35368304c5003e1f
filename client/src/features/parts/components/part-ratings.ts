import type { Part } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';

const mm = (valueM: number) => `${Number((valueM * 1e3).toPrecision(3))} mm`;
const mm2 = (valueM2: number) => `${Number((valueM2 * 1e6).toPrecision(3))} mm²`;

/** A core's, wire's or tape's own figures, in the units their datasheets use. */
function magneticsRatings(part: Part): string[] {
  const items: string[] = [];
  if (part.coreAreaM2 !== null) items.push(`Ae ${mm2(part.coreAreaM2)}`);
  if (part.corePathLengthM !== null) items.push(`le ${mm(part.corePathLengthM)}`);
  if (part.windowAreaM2 !== null) items.push(`winding area ${mm2(part.windowAreaM2)}`);
  if (part.saturationFluxDensity100T !== null) {
    items.push(`Bsat ${Number((part.saturationFluxDensity100T * 1e3).toPrecision(3))} mT at 100 °C`);
  }
  if (part.copperDiameterM !== null) items.push(`Ø ${mm(part.copperDiameterM)} copper`);
  if (part.overallDiameterM !== null) items.push(`${mm(part.overallDiameterM)} over enamel`);
  if (part.enamelGrade !== null) items.push(`grade ${part.enamelGrade}`);
  if (part.breakdownVoltageV !== null) items.push(`breakdown ${formatQuantity(part.breakdownVoltageV, 'V')}`);
  if (part.thicknessM !== null) items.push(`${Number((part.thicknessM * 1e6).toPrecision(3))} µm`);
  if (part.dielectricStrengthVPerM !== null) {
    items.push(`${Number((part.dielectricStrengthVPerM / 1e6).toPrecision(3))} kV/mm`);
  }
  return items;
}

/** The ratings of a part as one short line, in engineering notation. */
export function describeRatings(part: Part): string {
  const items: string[] = [];
  if (part.valueSi !== null) {
    const unit = part.kind === 'capacitor' ? 'F' : part.kind === 'resistor' ? 'Ohm' : 'H';
    items.push(
      `${part.kind === 'core' ? 'AL ' : ''}${formatQuantity(part.valueSi, unit)}${part.kind === 'core' ? '/turn²' : ''}`,
    );
  }
  if (part.tolerance !== null) items.push(`±${(part.tolerance * 100).toFixed(0)} %`);
  if (part.ratedVoltageV !== null) items.push(formatQuantity(part.ratedVoltageV, 'V'));
  if (part.ratedCurrentA !== null) items.push(formatQuantity(part.ratedCurrentA, 'A'));
  if (part.ratedSurgeCurrentA !== null) items.push(`surge ${formatQuantity(part.ratedSurgeCurrentA, 'A')}`);
  if (part.ratedPowerW !== null) items.push(formatQuantity(part.ratedPowerW, 'W'));
  items.push(...magneticsRatings(part));
  return items.join(' · ');
}

/**
 * A shelf part's unit cost in the team's currency: two decimals, or two significant figures where that would read
 * 0.00 (a metre of fine wire); wire and tape are priced per metre.
 */
export function describeUnitCost(part: Pick<Part, 'kind' | 'unitCost'>): string {
  const cost = part.unitCost;
  const amount = cost !== 0 && Math.abs(cost) < 0.1 ? String(Number(cost.toPrecision(2))) : cost.toFixed(2);
  return part.kind === 'wire' || part.kind === 'tape' ? `${amount} per m` : amount;
}
