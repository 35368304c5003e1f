import type { Design } from '../designs';
import { rcdClampPartsOf, type DriverStage } from '../driver';
import type { LadderRows } from './ladder-placement';
import { fq, ROW_GAP, type Sheet } from './schematic-sheet';
import { ground, junction, npn, twoTerminal, wire } from './schematic-symbols';

/** The drive's source in place of a driver: a sine or pulse generator with its source resistance, across the secondary. */
export function drawSource(sheet: Sheet, design: Design, xSecondary: number, rows: LadderRows): void {
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
export function drawDriver(sheet: Sheet, driver: DriverStage, xSecondary: number, yTop: number): void {
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
      const parts = rcdClampPartsOf(clamp);
      sheet.block(
        'RCL',
        ['RCD clamp', `${fq(parts.resistorOhm, 'Ohm')} ${fq(parts.capacitorF, 'F')}`],
        xK - 14,
        yRail + 22,
        'end',
        1,
      );
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
