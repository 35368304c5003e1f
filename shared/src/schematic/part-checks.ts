import type { DesignReport } from '../analysis';
import type { PartCheck } from './schematic.types';

/** The drawn part each check id speaks of: a capacitor, a diode, a bleeder resistor, the transistor, transformer or cells. */
function partOfCheck(id: string): string | null {
  const capacitor = /^cap-voltage-c(\d+)$/.exec(id);
  if (capacitor) return `C${capacitor[1]}`;
  const diode = /^diode-[a-z]+-d(\d+)$/.exec(id);
  if (diode) return `D${diode[1]}`;
  const bleeder = /^bleeder-[a-z]+-r(\d+)$/.exec(id);
  if (bleeder) return `R${bleeder[1]}`;
  // Engines from 1.2.0 check the bleeder string as a whole; the drawing marks it on its first resistor.
  if (id === 'bleeder-voltage' || id === 'bleeder-power') return 'R1';
  if (id === 'driver.collector-voltage' || id === 'driver.collector-current' || id === 'driver.base-drive') return 'Q1';
  if (id === 'driver.winding-insulation') return 'T1';
  if (id === 'driver.cell-current' || id === 'driver.battery-life') return 'B1';
  return null;
}

const rank = { pass: 0, marginal: 1, fail: 2 } as const;

/** A verdict in words and a bounded number: "pass 42 %", "marginal 8 %", "fail 35 % over", "fail 2.1× limit". */
export function verdictText(verdict: PartCheck['verdict'], marginPct: number): string {
  if (verdict !== 'fail') return `${verdict} ${Math.round(marginPct)} %`;
  return marginPct >= -100
    ? `fail ${Math.round(-marginPct)} % beyond`
    : `fail ${(1 - marginPct / 100).toFixed(1)}× limit`;
}

/** The worst verdict of every part a check names (fail over marginal over pass; the smaller margin among equals). */
export function partChecksOf(report: DesignReport | null): Map<string, PartCheck> {
  const worst = new Map<string, { verdict: PartCheck['verdict']; marginPct: number }>();
  const checks = [...(report?.checks ?? []), ...(report?.driver?.checks ?? [])];
  for (const check of checks) {
    const partId = partOfCheck(check.id);
    if (!partId) continue;
    const held = worst.get(partId);
    if (
      !held ||
      rank[check.verdict] > rank[held.verdict] ||
      (rank[check.verdict] === rank[held.verdict] && check.marginPct < held.marginPct)
    )
      worst.set(partId, { verdict: check.verdict, marginPct: check.marginPct });
  }
  return new Map(
    [...worst].map(([partId, held]) => [
      partId,
      { partId, verdict: held.verdict, text: verdictText(held.verdict, held.marginPct) },
    ]),
  );
}
