import type { Design } from '../designs';
import type { DesignReport } from '../analysis';
import { buildLadderNetwork } from '../multiplier';
import { drawDriver, drawSource } from './drive-drawing';
import { placeLadder, type LadderPlacement, type LadderRows } from './ladder-placement';
import { partChecksOf } from './part-checks';
import { FULL_WAVE_PITCH, fq, HALF_WAVE_PITCH, MARGIN, ROW_GAP, Sheet } from './schematic-sheet';
import { ground, junction, twoTerminal, wire } from './schematic-symbols';
import type { PartCheck, Point, SchematicLayout } from './schematic.types';

/** What every step of the layout reads: the design, its report, the ladder's network and where its nodes sit. */
interface LayoutFrame {
  design: Design;
  report: DesignReport | null;
  sheet: Sheet;
  net: ReturnType<typeof buildLadderNetwork>;
  place: LadderPlacement;
  rows: LadderRows;
  xSecondary: number;
  isFullWave: boolean;
  isBridge: boolean;
}

/**
 * The whole circuit as one drawing: supply, switch and blocking oscillator (transistor, windings with their dots,
 * base and collector resistors, clamp) or the drive's source, the secondary, the ladder (capacitors in their
 * columns, diodes between them), the bleeder string, the series output resistor and the load; every node with its
 * mean voltage and every part with its value and its worst verdict from the report. The oscillating column hangs
 * on the secondary's hot end, never on the 0 V return. Pure: the same layout is drawn in the browser (SVG) and on
 * the spec sheet (PDF).
 */
export function layoutSchematic(design: Design, report: DesignReport | null): SchematicLayout {
  const checks = partChecksOf(report);
  const sheet = new Sheet(checks);
  const m = design.multiplier;
  const net = buildLadderNetwork(
    m.topology,
    m.capacitors.map((c) => c.valueF),
  );
  const isDriver = design.drive.kind === 'driver';
  const driveWidth = isDriver ? 490 : 190;
  const yTop = 70;
  const isFullWave = m.topology === 'full-wave';
  const isBridge = m.topology === 'bridge-doubler';
  const rows = isFullWave
    ? { top: yTop, mid: yTop + ROW_GAP, bottom: yTop + 2 * ROW_GAP }
    : { top: yTop, mid: yTop + ROW_GAP / 2, bottom: yTop + ROW_GAP };
  const xSecondary = MARGIN + driveWidth;
  const xLadder = xSecondary + (isFullWave ? FULL_WAVE_PITCH / 2 + 40 : HALF_WAVE_PITCH + 60);

  // Where each node of the network sits.
  const place = placeLadder(net, rows, xLadder, isBridge);
  const frame: LayoutFrame = { design, report, sheet, net, place, rows, xSecondary, isFullWave, isBridge };

  drawSecondary(frame);
  // The drive: the blocking oscillator, or the source the secondary stands for.
  if (design.drive.kind === 'driver') drawDriver(sheet, design.drive.driver, xSecondary, rows.top);
  else drawSource(sheet, design, xSecondary, rows);
  drawCapacitors(frame);
  drawDiodes(frame);
  drawNodeVoltages(frame);
  const { xOut, yBottomOfOutput } = drawOutputNetwork(frame, checks);

  // The drawing's extent: every label box and stroke end inside, with a margin.
  let maxX = xOut + 120;
  let maxY = yBottomOfOutput + 30;
  for (const label of sheet.labels) {
    maxX = Math.max(maxX, label.box.x + label.box.width);
    maxY = Math.max(maxY, label.box.y + label.box.height);
  }
  return {
    width: Math.ceil(maxX + MARGIN),
    height: Math.ceil(maxY + MARGIN),
    strokes: sheet.strokes,
    labels: sheet.labels,
    partChecks: [...checks.values()],
  };
}

/** The secondary winding(s), the hot end wired to the oscillating column, the return grounded; and its label. */
function drawSecondary({ design, sheet, place, rows, xSecondary, isFullWave, isBridge }: LayoutFrame): void {
  const { nodeAt } = place;
  const secondaryPartId = design.drive.kind === 'driver' ? 'T1' : 'source';
  if (isFullWave) {
    const a = nodeAt[1] as Point;
    const b = nodeAt[2] as Point;
    const centre = nodeAt[0] as Point;
    sheet.add(
      twoTerminal('coil', { x: xSecondary, y: rows.top }, { x: xSecondary, y: rows.mid }, secondaryPartId, true),
    );
    sheet.add(
      twoTerminal('coil', { x: xSecondary, y: rows.mid }, { x: xSecondary, y: rows.bottom }, secondaryPartId, true),
    );
    sheet.add(wire({ x: xSecondary, y: rows.top }, a));
    sheet.add(wire({ x: xSecondary, y: rows.bottom }, b));
    sheet.add(wire({ x: xSecondary, y: rows.mid }, centre));
    sheet.add(junction({ x: xSecondary, y: rows.mid }));
    sheet.add(wire({ x: xSecondary, y: rows.mid }, { x: xSecondary - 30, y: rows.mid }));
    sheet.add(ground({ x: xSecondary - 30, y: rows.mid }));
  } else if (isBridge) {
    const hot = nodeAt[1] as Point;
    const mid = nodeAt[0] as Point;
    sheet.add(
      twoTerminal('coil', { x: xSecondary, y: hot.y }, { x: xSecondary, y: mid.y + 40 }, secondaryPartId, true),
    );
    sheet.add(wire({ x: xSecondary, y: hot.y }, hot));
    sheet.add(
      wire({ x: xSecondary, y: mid.y + 40 }, { x: mid.x - 30, y: mid.y + 40 }, { x: mid.x - 30, y: mid.y }, mid),
    );
  } else {
    const hot = nodeAt[1] as Point;
    const returnNode = nodeAt[0] as Point;
    sheet.add(
      twoTerminal('coil', { x: xSecondary, y: rows.top }, { x: xSecondary, y: rows.bottom }, secondaryPartId, true),
    );
    sheet.add(wire({ x: xSecondary, y: rows.top }, hot));
    sheet.add(wire({ x: xSecondary, y: rows.bottom }, returnNode));
    sheet.add(ground({ x: xSecondary, y: rows.bottom }));
  }
  const ySecondaryLabel = (isFullWave ? rows.mid : rows.top + ROW_GAP / 2) - 8;
  if (design.drive.kind === 'driver')
    sheet.block(
      'T1',
      ['T1 S', `${design.drive.driver.transformer.secondaryTurns} t`],
      xSecondary + 14,
      ySecondaryLabel,
      'start',
      1,
    );
  else sheet.block('secondary', ['secondary'], xSecondary + 14, ySecondaryLabel, 'start', 1);
}

/** Capacitors between their nodes, each labelled with its value and peak voltage beside it. */
function drawCapacitors({ design, report, sheet, net, place }: LayoutFrame): void {
  const { nodeAt } = place;
  const m = design.multiplier;
  const capStress = new Map((report?.analysis.capacitors ?? []).map((c) => [c.index, c]));
  for (let c = 0; c < net.capTop.length; c += 1) {
    const index = c + 1;
    const partId = `C${index}`;
    const top = nodeAt[net.capTop[c] as number] as Point;
    const bottom = nodeAt[net.capBottom[c] as number] as Point;
    sheet.add(twoTerminal('capacitor', bottom, top, partId));
    const part = m.capacitors[c];
    const stress = capStress.get(index);
    const lines = [
      `${partId} ${part ? fq(part.valueF, 'F') : ''}`.trim(),
      ...(stress ? [`${fq(stress.maxVoltageV, 'V')} peak`] : []),
    ];
    const middle = { x: (top.x + bottom.x) / 2, y: (top.y + bottom.y) / 2 };
    if (top.y === bottom.y) {
      const row = place.rowOf[net.capTop[c] as number];
      if (row === 'top') sheet.block(partId, lines, middle.x, middle.y - 16, 'middle', -1);
      else if (row === 'bottom') sheet.block(partId, lines, middle.x, middle.y + 24, 'middle', 1);
      else sheet.block(partId, lines, middle.x, middle.y - 18, 'middle', -1);
    } else {
      sheet.block(partId, lines, middle.x + 16, middle.y - 4, 'start', 1);
    }
  }
}

/** Diodes from anode to cathode (reversed for a negative output), each labelled beside its leg. */
function drawDiodes({ design, sheet, net, place, rows, isFullWave, isBridge }: LayoutFrame): void {
  const { nodeAt } = place;
  for (let d = 0; d < net.diodeAnode.length; d += 1) {
    const partId = `D${d + 1}`;
    const sign = design.targets.outputV < 0 ? -1 : 1;
    const anode = nodeAt[(sign > 0 ? net.diodeAnode[d] : net.diodeCathode[d]) as number] as Point;
    const cathode = nodeAt[(sign > 0 ? net.diodeCathode[d] : net.diodeAnode[d]) as number] as Point;
    sheet.add(twoTerminal('diode', anode, cathode, partId));
    const middle = { x: (anode.x + cathode.x) / 2, y: (anode.y + cathode.y) / 2 };
    if (isBridge) {
      if (anode.y === cathode.y) sheet.block(partId, [partId], middle.x, middle.y + 18, 'middle', 1);
      else sheet.block(partId, [partId], middle.x - 14, middle.y + 4, 'end', 1);
    } else if (isFullWave) {
      // Beside its leg, in the gap between two Λ (above the smoothing row) or two V (below it): a leg rising to
      // the right labelled on its left halfway along, a leg falling to the right labelled on its right near the
      // outer row, so two labels in one gap sit at different heights.
      const outer = Math.abs(anode.y - rows.mid) > Math.abs(cathode.y - rows.mid) ? anode : cathode;
      const inner = outer === anode ? cathode : anode;
      const isLeftLeg = outer.x > inner.x;
      const t = isLeftLeg ? 0.45 : 0.8;
      const p = { x: inner.x + (outer.x - inner.x) * t, y: inner.y + (outer.y - inner.y) * t };
      const isAbove = outer.y < inner.y;
      const y = isAbove ? p.y - 2 : p.y + 8;
      if (isLeftLeg) sheet.block(partId, [partId], p.x - 16, y, 'end', 1);
      else sheet.block(partId, [partId], p.x + 16, y, 'start', 1);
    } else sheet.block(partId, [partId], middle.x + 14, middle.y - 2, 'start', 1);
  }
}

/** A junction at every node and its mean voltage beside it. */
function drawNodeVoltages({ report, sheet, net, place, isBridge }: LayoutFrame): void {
  const { nodeAt } = place;
  const nodeVoltage = new Map((report?.analysis.nodes ?? []).map((node) => [node.id, node.meanV]));
  net.nodeInfo.forEach((info, i) => {
    const at = nodeAt[i] as Point;
    sheet.add(junction(at));
    const meanV = nodeVoltage.get(info.id);
    if (meanV === undefined || info.id === '0') return;
    const row = place.rowOf[i];
    const text = fq(meanV, 'V');
    if (isBridge) sheet.text(text, at.x + 8, at.y - 6, 'start', 'node-voltage');
    else if (row === 'top') sheet.text(text, at.x, at.y - 8, 'middle', 'node-voltage');
    else if (row === 'bottom') sheet.text(text, at.x, at.y + 16, 'middle', 'node-voltage');
    else sheet.text(text, at.x, at.y + 18, 'middle', 'node-voltage');
  });
}

/**
 * Output network: bleeder string down to the return, series output resistor, load, and the output's mean
 * voltage. Returns the load's column and the bottom of the output network.
 */
function drawOutputNetwork(
  { design, report, sheet, net, place, rows }: LayoutFrame,
  checks: Map<string, PartCheck>,
): { xOut: number; yBottomOfOutput: number } {
  const top = place.nodeAt[net.outNode] as Point;
  const xBleeder = place.right + 50;
  const yBottomOfOutput = Math.max(rows.bottom, top.y) + 110;
  sheet.add(wire(top, { x: xBleeder, y: top.y }));
  sheet.add(junction({ x: xBleeder, y: top.y }));
  const bleeder = design.outputNetwork.bleeder;
  if (bleeder) drawBleeder(sheet, checks, bleeder, { x: xBleeder, y: top.y }, yBottomOfOutput);
  const xOut = xBleeder + 150;
  if (design.outputNetwork.seriesOutputResistanceOhm > 0) {
    sheet.add(twoTerminal('resistor', { x: xBleeder, y: top.y }, { x: xOut, y: top.y }, 'RO'));
    sheet.block(
      'RO',
      [`RO ${fq(design.outputNetwork.seriesOutputResistanceOhm, 'Ohm')}`],
      (xBleeder + xOut) / 2,
      top.y - 14,
      'middle',
      -1,
    );
  } else sheet.add(wire({ x: xBleeder, y: top.y }, { x: xOut, y: top.y }));
  const load = design.load;
  sheet.add(
    twoTerminal(
      load.kind === 'current' ? 'current-sink' : 'resistor',
      { x: xOut, y: top.y },
      { x: xOut, y: yBottomOfOutput },
      'load',
    ),
  );
  sheet.add(ground({ x: xOut, y: yBottomOfOutput }));
  sheet.add(junction({ x: xOut, y: top.y }));
  sheet.block(
    'load',
    ['load', load.kind === 'current' ? fq(load.currentA, 'A') : fq(load.resistanceOhm, 'Ohm')],
    xOut + 16,
    top.y + 50,
    'start',
    1,
  );
  if (report) {
    sheet.text(`out ${fq(report.outputMeanV, 'V')}`, xOut + 8, top.y - 8, 'start', 'node-voltage');
  }
  return { xOut, yBottomOfOutput };
}

/**
 * The bleeder string from `top` down to the return at `yBottomOfOutput`: at most two resistors drawn, a dotted gap for
 * the rest; its label shows the worst verdict of its resistors (set on R1 in `checks`).
 */
function drawBleeder(
  sheet: Sheet,
  checks: Map<string, PartCheck>,
  bleeder: NonNullable<Design['outputNetwork']['bleeder']>,
  top: Point,
  yBottomOfOutput: number,
): void {
  const xBleeder = top.x;
  const shown = Math.min(bleeder.count, 2);
  const span = yBottomOfOutput - top.y;
  const step = span / (shown + (bleeder.count > shown ? 1 : 0));
  let y = top.y;
  for (let k = 0; k < shown; k += 1) {
    sheet.add(twoTerminal('resistor', { x: xBleeder, y }, { x: xBleeder, y: y + step }, 'R1'));
    y += step;
    if (k === 0 && bleeder.count > shown) {
      sheet.add({ d: `M${xBleeder} ${y} L${xBleeder} ${y + step}`, style: 'wire' });
      for (const dy of [0.35, 0.5, 0.65])
        sheet.add({ d: `M${xBleeder - 1.5} ${y + step * dy} L${xBleeder + 1.5} ${y + step * dy}`, style: 'plate' });
      y += step;
    }
  }
  sheet.add(ground({ x: xBleeder, y: yBottomOfOutput }));
  const name = bleeder.count === 1 ? 'R1' : `R1…R${bleeder.count}`;
  const worst = worstOf(
    checks,
    Array.from({ length: bleeder.count }, (_, k) => `R${k + 1}`),
  );
  if (worst) checks.set('R1', worst);
  sheet.block(
    'R1',
    [name, `${bleeder.count} × ${fq(bleeder.valueOhm, 'Ohm')}`, 'bleeder'],
    xBleeder + 10,
    top.y + 36,
    'start',
    1,
  );
}

function worstOf(checks: ReadonlyMap<string, PartCheck>, partIds: string[]): PartCheck | undefined {
  const rank = { fail: 2, marginal: 1, pass: 0 } as const;
  let worst: PartCheck | undefined;
  for (const id of partIds) {
    const check = checks.get(id);
    if (check && (!worst || rank[check.verdict] > rank[worst.verdict])) worst = check;
  }
  return worst;
}
