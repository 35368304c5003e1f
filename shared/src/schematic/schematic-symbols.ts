import type { Point, SchematicStroke } from './schematic.types';

/** Two-terminal symbols drawn between two terminal points, body centred, leads to each terminal. */
export type TwoTerminalKind =
  | 'capacitor'
  | 'diode'
  | 'zener'
  | 'resistor'
  | 'coil'
  | 'battery'
  | 'switch'
  | 'sine-source'
  | 'pulse-source'
  | 'current-sink';

const n = (value: number) => Number(value.toFixed(2));
const at = (p: Point) => `${n(p.x)} ${n(p.y)}`;
const plus = (p: Point, u: Point, k: number, v: Point = { x: 0, y: 0 }, m = 0): Point => ({
  x: p.x + u.x * k + v.x * m,
  y: p.y + u.y * k + v.y * m,
});

/** Half the length of each body along its terminals' line. */
export const BODY_HALF_LENGTH: Readonly<Record<TwoTerminalKind, number>> = {
  capacitor: 3,
  diode: 6,
  zener: 6,
  resistor: 12,
  coil: 16,
  battery: 5,
  switch: 10,
  'sine-source': 11,
  'pulse-source': 11,
  'current-sink': 11,
};

export function wire(...points: Point[]): SchematicStroke {
  return { d: points.map((p, i) => `${i === 0 ? 'M' : 'L'}${at(p)}`).join(' '), style: 'wire' };
}

export function circlePath(c: Point, r: number): string {
  return `M${at({ x: c.x - r, y: c.y })} A${n(r)} ${n(r)} 0 1 0 ${at({ x: c.x + r, y: c.y })} A${n(r)} ${n(r)} 0 1 0 ${at({ x: c.x - r, y: c.y })} Z`;
}

/** A filled junction dot where three or more wires meet. */
export function junction(c: Point): SchematicStroke {
  return { d: circlePath(c, 2.5), style: 'fill' };
}

/** The 0 V return symbol hanging below `p` (three shortening bars). */
export function ground(p: Point): SchematicStroke[] {
  return [
    wire(p, { x: p.x, y: p.y + 8 }),
    { d: `M${at({ x: p.x - 9, y: p.y + 8 })} L${at({ x: p.x + 9, y: p.y + 8 })}`, style: 'plate' },
    { d: `M${at({ x: p.x - 6, y: p.y + 12 })} L${at({ x: p.x + 6, y: p.y + 12 })}`, style: 'part' },
    { d: `M${at({ x: p.x - 3, y: p.y + 16 })} L${at({ x: p.x + 3, y: p.y + 16 })}`, style: 'part' },
  ];
}

/**
 * A two-terminal part from `a` to `b` (a diode's anode at `a`, a source's + at `b`, a coil's dotted end at `a`
 * when `isDotted`): leads from each terminal to the body, the body at the midpoint along the line.
 */
export function twoTerminal(
  kind: TwoTerminalKind,
  a: Point,
  b: Point,
  partId: string,
  isDotted = false,
): SchematicStroke[] {
  const length = Math.hypot(b.x - a.x, b.y - a.y) || 1;
  const u = { x: (b.x - a.x) / length, y: (b.y - a.y) / length };
  const v = { x: -u.y, y: u.x };
  const m = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
  const h = BODY_HALF_LENGTH[kind];
  const strokes: SchematicStroke[] = [
    { ...wire(a, plus(m, u, -h)), partId },
    { ...wire(plus(m, u, h), b), partId },
  ];
  const path = (d: string, style: SchematicStroke['style'] = 'part') => strokes.push({ d, style, partId });
  const segment = (p: Point, q: Point) => `M${at(p)} L${at(q)}`;
  switch (kind) {
    case 'capacitor':
      path(segment(plus(m, u, -3, v, 11), plus(m, u, -3, v, -11)), 'plate');
      path(segment(plus(m, u, 3, v, 11), plus(m, u, 3, v, -11)), 'plate');
      break;
    case 'diode':
    case 'zener': {
      path(`M${at(plus(m, u, -6, v, 7))} L${at(plus(m, u, 6))} L${at(plus(m, u, -6, v, -7))} Z`);
      path(segment(plus(m, u, 6, v, 7), plus(m, u, 6, v, -7)), 'plate');
      if (kind === 'zener') {
        path(segment(plus(m, u, 6, v, 7), plus(m, u, 3, v, 9)), 'plate');
        path(segment(plus(m, u, 6, v, -7), plus(m, u, 9, v, -9)), 'plate');
      }
      break;
    }
    case 'resistor':
      path(
        `M${at(plus(m, u, -12, v, 4))} L${at(plus(m, u, 12, v, 4))} L${at(plus(m, u, 12, v, -4))} L${at(plus(m, u, -12, v, -4))} Z`,
      );
      break;
    case 'coil': {
      // Four turns as half circles on the `v` side.
      let d = `M${at(plus(m, u, -16))}`;
      for (let k = 0; k < 4; k += 1) d += ` A4 4 0 0 1 ${at(plus(m, u, -16 + 8 * (k + 1)))}`;
      path(d);
      if (isDotted) strokes.push({ d: circlePath(plus(m, u, -16, v, -7), 2), style: 'fill', partId });
      break;
    }
    case 'battery':
      // Two cells: long plate (+) towards b.
      path(segment(plus(m, u, 5, v, 11), plus(m, u, 5, v, -11)), 'part');
      path(segment(plus(m, u, 1.5, v, 5), plus(m, u, 1.5, v, -5)), 'plate');
      path(segment(plus(m, u, -1.5, v, 11), plus(m, u, -1.5, v, -11)), 'part');
      path(segment(plus(m, u, -5, v, 5), plus(m, u, -5, v, -5)), 'plate');
      break;
    case 'switch':
      // A normally open push button: two contacts and the bar held off them.
      strokes.push({ d: circlePath(plus(m, u, -8), 2), style: 'part', partId });
      strokes.push({ d: circlePath(plus(m, u, 8), 2), style: 'part', partId });
      path(segment(plus(m, u, -11, v, -7), plus(m, u, 11, v, -7)), 'plate');
      path(segment(plus(m, v, -7), plus(m, v, -12)));
      break;
    case 'sine-source':
    case 'pulse-source':
      strokes.push({ d: circlePath(m, 11), style: 'part', partId });
      path(
        kind === 'sine-source'
          ? `M${at(plus(m, v, -6))} A3 3 0 0 1 ${at(m)} A3 3 0 0 0 ${at(plus(m, v, 6))}`
          : `M${at(plus(m, v, -6, u, 3))} L${at(plus(m, v, -2, u, 3))} L${at(plus(m, v, -2, u, -3))} L${at(plus(m, v, 2, u, -3))} L${at(plus(m, v, 2, u, 3))} L${at(plus(m, v, 6, u, 3))}`,
      );
      break;
    case 'current-sink':
      strokes.push({ d: circlePath(m, 11), style: 'part', partId });
      path(segment(plus(m, u, -6), plus(m, u, 5)));
      path(`M${at(plus(m, u, 6))} L${at(plus(m, u, 1, v, 3))} L${at(plus(m, u, 1, v, -3))} Z`, 'fill');
      break;
  }
  return strokes;
}

/**
 * An NPN transistor with its base terminal at `base`, collector terminal `collector` above-right and emitter
 * terminal `emitter` below-right (common emitter, upright).
 */
export function npn(base: Point, collector: Point, emitter: Point, partId: string): SchematicStroke[] {
  const barX = base.x + 14;
  const bodyX = barX + 12;
  return [
    { d: circlePath({ x: barX + 6, y: base.y }, 15), style: 'part', partId },
    { ...wire(base, { x: barX, y: base.y }), partId },
    { d: `M${at({ x: barX, y: base.y - 9 })} L${at({ x: barX, y: base.y + 9 })}`, style: 'plate', partId },
    {
      ...wire({ x: barX, y: base.y - 4 }, { x: bodyX, y: base.y - 11 }, { x: collector.x, y: base.y - 11 }, collector),
      partId,
    },
    {
      ...wire({ x: barX, y: base.y + 4 }, { x: bodyX, y: base.y + 11 }, { x: emitter.x, y: base.y + 11 }, emitter),
      partId,
    },
    {
      d: `M${at({ x: bodyX, y: base.y + 11 })} L${at({ x: bodyX - 6, y: base.y + 11 })} L${at({ x: bodyX - 3, y: base.y + 6 })} Z`,
      style: 'fill',
      partId,
    },
  ];
}
