import type { Design } from '../designs';
import type { DriverStage } from '../driver';
import type { DesignReport } from '../analysis';
import { buildLadderNetwork } from '../multiplier';
import { formatQuantity } from '../units';
import { partChecksOf } from './part-checks';
import { ground, junction, npn, twoTerminal, wire } from './schematic-symbols';
import type { Box, PartCheck, Point, SchematicLabel, SchematicLayout, SchematicStroke } from './schematic.types';

/** Label type size (px) and the advance width an Inter glyph takes at most on average, as a fraction of it. */
export const LABEL_SIZE_PX = 10;
const ADVANCE_EM = 0.62;
const BOLD_ADVANCE_EM = 0.66;
const LINE_PX = 13;
/** Horizontal pitch between neighbouring ladder nodes; rows of a ladder and their spacing. */
const HALF_WAVE_PITCH = 120;
const FULL_WAVE_PITCH = 300;
const ROW_GAP = 150;
const MARGIN = 16;

/** The box a line of text takes: Inter's advance widths estimated from above, the ascent and descent of its size. */
export function labelBox(
  text: string,
  x: number,
  y: number,
  anchor: SchematicLabel['anchor'],
  sizePx: number,
  isBold = false,
): Box {
  const width = [...text].length * sizePx * (isBold ? BOLD_ADVANCE_EM : ADVANCE_EM);
  const left = anchor === 'start' ? x : anchor === 'middle' ? x - width / 2 : x - width;
  // Inter's ascent and descent (0.97 and 0.24 em): what a browser's getBBox gives for a line of it.
  return { x: left, y: y - sizePx * 0.97, width, height: sizePx * 1.21 };
}

class Sheet {
  readonly strokes: SchematicStroke[] = [];
  readonly labels: SchematicLabel[] = [];
  constructor(readonly checks: Map<string, PartCheck>) {}

  add(strokes: SchematicStroke | SchematicStroke[]): void {
    this.strokes.push(...(Array.isArray(strokes) ? strokes : [strokes]));
  }

  text(
    text: string,
    x: number,
    y: number,
    anchor: SchematicLabel['anchor'],
    role: SchematicLabel['role'],
    partId?: string,
    verdict?: PartCheck['verdict'],
  ): void {
    const isBold = role === 'part' || role === 'title';
    this.labels.push({
      text,
      x,
      y,
      anchor,
      sizePx: LABEL_SIZE_PX,
      isBold,
      role,
      ...(partId ? { partId } : {}),
      ...(verdict ? { verdict } : {}),
      box: labelBox(text, x, y, anchor, LABEL_SIZE_PX, isBold),
    });
  }

  /**
   * A part's label block: its name (and value), further lines, then its worst verdict, `LINE_PX` apart; the first
   * baseline at `y` (`direction` 1, below a part) or the last one at `y` (−1, above a part).
   */
  block(
    partId: string,
    lines: string[],
    x: number,
    y: number,
    anchor: SchematicLabel['anchor'],
    direction: 1 | -1 = 1,
  ): void {
    const check = this.checks.get(partId);
    const all: { text: string; role: SchematicLabel['role'] }[] = [
      { text: lines[0] ?? partId, role: 'part' },
      ...lines.slice(1).map((text) => ({ text, role: 'value' as const })),
      ...(check ? [{ text: `${verdictGlyph[check.verdict]} ${check.text}`, role: 'verdict' as const }] : []),
    ];
    // Read from the top: the first line at `y` going down, or the last line at `y` going up.
    const firstY = direction === 1 ? y : y - (all.length - 1) * LINE_PX;
    all.forEach((line, i) => {
      const verdict = line.role === 'verdict' ? check?.verdict : undefined;
      this.text(line.text, x, firstY + i * LINE_PX, anchor, line.role, partId, verdict);
    });
  }
}

const verdictGlyph = { pass: '✓', marginal: '!', fail: '✗' } as const;

const fq = (value: number, unit: Parameters<typeof formatQuantity>[1]) => formatQuantity(value, unit, 3);

interface LadderPlacement {
  /** Where each network node sits. */
  nodeAt: Point[];
  /** Which row each node is on: its labels go above a top row and below a bottom one. */
  rowOf: ('top' | 'mid' | 'bottom')[];
  /** The hot end(s) of the secondary and the grounded node(s) the ladder stands on. */
  right: number;
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
  const nodeVoltage = new Map((report?.analysis.nodes ?? []).map((node) => [node.id, node.meanV]));
  const capStress = new Map((report?.analysis.capacitors ?? []).map((c) => [c.index, c]));
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
  const { nodeAt } = place;

  // The secondary winding(s), the hot end wired to the oscillating column, the return grounded.
  const secondaryPartId = isDriver ? 'T1' : 'source';
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

  // The drive: the blocking oscillator, or the source the secondary stands for.
  if (design.drive.kind === 'driver') drawDriver(sheet, design.drive.driver, xSecondary, rows.top);
  else drawSource(sheet, design, xSecondary, rows);

  // Capacitors between their nodes, diodes from anode to cathode.
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

  // Node voltages beside each node.
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

  // Output network: bleeder string down to the return, series output resistor, load.
  const top = nodeAt[net.outNode] as Point;
  const xBleeder = place.right + 50;
  const yBottomOfOutput = Math.max(rows.bottom, top.y) + 110;
  sheet.add(wire(top, { x: xBleeder, y: top.y }));
  sheet.add(junction({ x: xBleeder, y: top.y }));
  const bleeder = design.outputNetwork.bleeder;
  if (bleeder) {
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

function worstOf(checks: ReadonlyMap<string, PartCheck>, partIds: string[]): PartCheck | undefined {
  const rank = { fail: 2, marginal: 1, pass: 0 } as const;
  let worst: PartCheck | undefined;
  for (const id of partIds) {
    const check = checks.get(id);
    if (check && (!worst || rank[check.verdict] > rank[worst.verdict])) worst = check;
  }
  return worst;
}

/**
 * Node positions of a ladder drawn left to right: half-wave nodes alternate between the oscillating (top) and
 * smoothing (bottom) rows one pitch apart; a full-wave cascade has its two oscillating columns above and below
 * the smoothing one; the bridge doubler stacks its two capacitors on the midpoint.
 */
function placeLadder(
  net: ReturnType<typeof buildLadderNetwork>,
  rows: { top: number; mid: number; bottom: number },
  x0: number,
  isBridge: boolean,
): LadderPlacement {
  const nodeAt: Point[] = [];
  const rowOf: LadderPlacement['rowOf'] = [];
  const set = (i: number, p: Point, row: LadderPlacement['rowOf'][number]) => {
    nodeAt[i] = p;
    rowOf[i] = row;
  };
  if (isBridge) {
    // mid (0), winding end (1), top T (2), return B (3).
    const xWinding = x0 + 60;
    const x = xWinding + 120;
    set(0, { x, y: rows.mid }, 'mid');
    set(1, { x: xWinding, y: rows.top - 30 }, 'top');
    set(2, { x, y: rows.top - 30 }, 'top');
    set(3, { x, y: rows.bottom + 30 }, 'bottom');
    return { nodeAt, rowOf, right: x + 150 };
  }
  if (net.topology === 'full-wave') {
    const s = FULL_WAVE_PITCH;
    set(0, { x: x0, y: rows.mid }, 'mid');
    set(1, { x: x0 - s / 2, y: rows.top }, 'top');
    set(2, { x: x0 - s / 2, y: rows.bottom }, 'bottom');
    for (let j = 1; j <= net.stageCount; j += 1) {
      set(3 * j, { x: x0 + (j - 0.5) * s, y: rows.top }, 'top');
      set(3 * j + 1, { x: x0 + (j - 0.5) * s, y: rows.bottom }, 'bottom');
      set(3 * j + 2, { x: x0 + j * s, y: rows.mid }, 'mid');
    }
    return { nodeAt, rowOf, right: x0 + net.stageCount * s };
  }
  // Half-wave: node N_i at x0 + i·pitch on its column's row; the hot end and the return are N_−1 and N_0.
  const p = HALF_WAVE_PITCH;
  const k = net.capTop.length;
  const isEven = k % 2 === 0;
  set(isEven ? 1 : 0, { x: x0 - p, y: isEven ? rows.top : rows.bottom }, isEven ? 'top' : 'bottom');
  set(isEven ? 0 : 1, { x: x0, y: isEven ? rows.bottom : rows.top }, isEven ? 'bottom' : 'top');
  for (let c = 0; c < k; c += 1) {
    const column = net.capColumn[c];
    const isTop = column === 'oscillating';
    set(net.capTop[c] as number, { x: x0 + (c + 1) * p, y: isTop ? rows.top : rows.bottom }, isTop ? 'top' : 'bottom');
  }
  return { nodeAt, rowOf, right: x0 + k * p };
}

/** The drive's source in place of a driver: a sine or pulse generator with its source resistance, across the secondary. */
function drawSource(
  sheet: Sheet,
  design: Design,
  xSecondary: number,
  rows: { top: number; mid: number; bottom: number },
): void {
  const drive = design.drive;
  if (drive.kind === 'driver') return;
  const x = xSecondary - 120;
  const top = rows.top;
  const bottom = design.multiplier.topology === 'full-wave' ? rows.bottom : rows.bottom;
  sheet.add(
    twoTerminal(drive.kind === 'sine' ? 'sine-source' : 'pulse-source', { x, y: bottom }, { x, y: top + 40 }, 'source'),
  );
  sheet.add(twoTerminal('resistor', { x, y: top + 40 }, { x, y: top }, 'RS'));
  sheet.add(wire({ x, y: top }, { x: xSecondary - 30, y: top }));
  sheet.add(wire({ x, y: bottom }, { x: xSecondary - 30, y: bottom }));
  // The source stands for the primary side: drawn as a winding coupled to the secondary.
  sheet.add(twoTerminal('coil', { x: xSecondary - 30, y: top }, { x: xSecondary - 30, y: bottom }, 'source', true));
  sheet.add({
    d: `M${xSecondary - 17} ${top + 10} L${xSecondary - 17} ${bottom - 10} M${xSecondary - 13} ${top + 10} L${xSecondary - 13} ${bottom - 10}`,
    style: 'part',
  });
  const peak =
    drive.kind === 'sine'
      ? `${fq(drive.peakV, 'V')} peak`
      : `${fq(drive.forwardPeakV, 'V')} / ${fq(drive.flybackPeakV, 'V')}`;
  sheet.block(
    'source',
    [drive.kind === 'sine' ? 'sine drive' : 'pulse drive', peak, fq(drive.frequencyHz, 'Hz')],
    x - 16,
    (top + bottom) / 2 + 14,
    'end',
    1,
  );
  sheet.block('RS', [`RS ${fq(drive.sourceResistanceOhm, 'Ohm')}`], x - 16, top + 24, 'end', 1);
}

/**
 * The blocking oscillator left of the secondary: supply B1 (or a DC source) and push switch S1 on the + rail,
 * primary P from the rail to the collector (collector resistor RC below it), the clamp across the primary,
 * base resistor RB and feedback winding F from the rail to the base, Q1's emitter on the return. Dots mark the
 * windings' like ends (the rail end of P, the base end of F, the hot end of the secondary).
 */
function drawDriver(sheet: Sheet, driver: DriverStage, xSecondary: number, yTop: number): void {
  const yRail = yTop - 30;
  const xCore = xSecondary - 18;
  const xP = xCore - 16;
  const xQ = xP - 110;
  const xF = xQ - 80;
  const xB = xF - 110;
  const xSwitchEnd = xB + 60;
  const yCollector = yRail + 100;
  const yBase = yRail + 190;
  const yReturn = yBase + 60;
  // Core: two lines between the primary side and the secondary.
  sheet.add({
    d: `M${xCore - 2} ${yRail + 10} L${xCore - 2} ${yTop + ROW_GAP - 10} M${xCore + 2} ${yRail + 10} L${xCore + 2} ${yTop + ROW_GAP - 10}`,
    style: 'part',
    partId: 'T1',
  });
  // Supply and switch.
  const supply = driver.supply;
  sheet.add(twoTerminal('battery', { x: xB, y: yReturn }, { x: xB, y: yRail }, 'B1'));
  sheet.add(ground({ x: xB, y: yReturn }));
  sheet.add(twoTerminal('switch', { x: xB, y: yRail }, { x: xSwitchEnd, y: yRail }, 'S1'));
  sheet.add(wire({ x: xSwitchEnd, y: yRail }, { x: xP, y: yRail }));
  const supplyLines =
    supply.kind === 'cells'
      ? [`B1 ${supply.cellsInSeries} × ${supply.chemistry}`, `${Number(supply.capacityAh.toPrecision(3))} Ah per cell`]
      : [`B1 ${fq(supply.voltageV, 'V')} DC`, `${fq(supply.sourceResistanceOhm, 'Ohm')} source`];
  sheet.block('B1', supplyLines, xB - 16, yRail + 80, 'end', 1);
  sheet.block('S1', ['S1 push'], (xB + xSwitchEnd) / 2, yRail - 18, 'middle', -1);
  // Primary from the rail (dotted end) down to the collector line.
  sheet.add(twoTerminal('coil', { x: xP, y: yRail }, { x: xP, y: yCollector }, 'T1', true));
  sheet.block(
    'T1 P',
    ['T1 P', `${driver.transformer.primaryTurns} t`, fq(driver.transformer.primaryInductanceH, 'H')],
    xP - 14,
    yRail + 40,
    'end',
    1,
  );
  sheet.add(junction({ x: xP, y: yRail }));
  // Collector resistor (or a wire) from the primary to the collector.
  const collector = { x: xQ, y: yBase - 22 };
  sheet.add(wire({ x: xP, y: yCollector }, { x: xP, y: yCollector + 20 }, { x: xQ + 50, y: yCollector + 20 }));
  if (driver.collectorResistorOhm) {
    sheet.add(twoTerminal('resistor', { x: xQ + 50, y: yCollector + 20 }, { x: xQ, y: yCollector + 20 }, 'RC'));
    sheet.block('RC', [`RC ${fq(driver.collectorResistorOhm, 'Ohm')}`], xQ + 25, yCollector + 8, 'middle', -1);
  } else sheet.add(wire({ x: xQ + 50, y: yCollector + 20 }, { x: xQ, y: yCollector + 20 }));
  sheet.add(wire({ x: xQ, y: yCollector + 20 }, collector));
  // Clamp across the primary: from the collector line up to the rail.
  const clamp = driver.clamp;
  if (clamp) {
    const xK = xQ + 50;
    const yK = yRail + 50;
    sheet.add(junction({ x: xK, y: yCollector + 20 }));
    sheet.add(twoTerminal('diode', { x: xK, y: yCollector + 20 }, { x: xK, y: yK }, 'DCL'));
    if (clamp.kind === 'zener') {
      sheet.add(twoTerminal('zener', { x: xK, y: yRail }, { x: xK, y: yK }, 'DZ'));
      sheet.block('DZ', ['DZ', fq(clamp.clampVoltageV, 'V')], xK - 14, yRail + 22, 'end', 1);
    } else {
      sheet.add(twoTerminal('resistor', { x: xK, y: yK }, { x: xK, y: yRail }, 'RCL'));
      sheet.add(junction({ x: xK, y: yRail }));
      sheet.block('RCL', ['RCD clamp', `${fq(clamp.clampVoltageV, 'V')}`], xK - 14, yRail + 22, 'end', 1);
    }
    sheet.add(junction({ x: xK, y: yRail }));
    sheet.block('DCL', ['DCL'], xK - 12, yK + 30, 'end', 1);
  }
  // Base: rail → RB → feedback winding F (dotted at the base end) → base.
  sheet.add(junction({ x: xF, y: yRail }));
  sheet.add(twoTerminal('resistor', { x: xF, y: yRail }, { x: xF, y: yRail + 80 }, 'RB'));
  sheet.block('RB', [`RB ${fq(driver.baseResistorOhm, 'Ohm')}`], xF - 12, yRail + 36, 'end', 1);
  sheet.add(twoTerminal('coil', { x: xF, y: yBase }, { x: xF, y: yRail + 80 }, 'T1', true));
  sheet.block('T1 F', ['T1 F', `${driver.transformer.feedbackTurns} t`], xF - 12, yRail + 132, 'end', 1);
  const q = npn({ x: xQ - 26, y: yBase }, collector, { x: xQ, y: yBase + 22 }, 'Q1');
  sheet.add(q);
  sheet.add(wire({ x: xF, y: yBase }, { x: xQ - 26, y: yBase }));
  sheet.add(wire({ x: xQ, y: yBase + 22 }, { x: xQ, y: yReturn }));
  sheet.add(ground({ x: xQ, y: yReturn }));
  sheet.block('Q1', ['Q1 NPN', `${fq(driver.transistor.vceoMaxV, 'V')} Vceo`], xQ + 14, yBase + 6, 'start', 1);
}
