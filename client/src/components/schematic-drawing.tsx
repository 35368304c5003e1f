import type { PartVerdict, SchematicLayout } from '@ladderwright/shared/schematic';

const strokeWidth = { wire: 1.2, part: 1.4, plate: 2.4, fill: 0 } as const;
const verdictColor: Readonly<Record<PartVerdict, string>> = {
  pass: 'var(--mantine-color-verdigris-7)',
  marginal: 'var(--mantine-color-ember-6)',
  fail: 'var(--mantine-color-red-7)',
};

/**
 * An SVG of a schematic layout: strokes as laid out, labels on a halo of the page colour so a wire behind a label
 * never strikes through it; verdict lines in their colour (they carry their word and number too). Fitted, a drawing
 * wider than its box is scaled down to the box's width (never up); its width and height attributes stay the full
 * size, which is what an export writes.
 */
export function SchematicDrawing({
  layout,
  label,
  isFitted = false,
}: {
  layout: SchematicLayout;
  label: string;
  isFitted?: boolean;
}) {
  return (
    <svg
      width={layout.width}
      height={layout.height}
      viewBox={`0 0 ${layout.width} ${layout.height}`}
      style={isFitted ? { display: 'block', maxWidth: '100%', height: 'auto' } : { display: 'block' }}
      data-fitted={isFitted ? 'true' : 'false'}
      role="img"
      aria-label={label}
      fontFamily="Inter, sans-serif"
      data-schematic=""
    >
      <g fill="none" stroke="currentColor" strokeLinecap="round" strokeLinejoin="round">
        {layout.strokes.map((stroke, i) => (
          <path
            key={i}
            d={stroke.d}
            strokeWidth={strokeWidth[stroke.style]}
            fill={stroke.style === 'fill' ? 'currentColor' : undefined}
            stroke={stroke.style === 'fill' ? 'none' : undefined}
          />
        ))}
      </g>
      <g>
        {layout.labels.map((text, i) => (
          <text
            key={i}
            x={text.x}
            y={text.y}
            textAnchor={text.anchor}
            fontSize={text.sizePx}
            fontWeight={text.isBold ? 600 : 400}
            fill={text.verdict ? verdictColor[text.verdict] : 'currentColor'}
            stroke="var(--mantine-color-body)"
            strokeWidth={3}
            paintOrder="stroke"
            data-label-role={text.role}
          >
            {text.text}
          </text>
        ))}
      </g>
    </svg>
  );
}
