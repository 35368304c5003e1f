import { EmptyState } from '@mantine/core';

/** Shown on a project's Designs page until the project holds a design. */
export function DesignsEmpty() {
  return (
    <EmptyState
      withIndicatorBackground
      icon={<LadderGlyph />}
      title="No designs in this project yet"
      description="Designs of this project will be listed here, each with its revisions and their Sign-off state."
    />
  );
}

/** A small drawing of a diode-capacitor ladder, used as the empty-state mark. */
function LadderGlyph() {
  return (
    <svg
      width="28"
      height="28"
      viewBox="0 0 28 28"
      fill="none"
      stroke="currentColor"
      strokeWidth="1.6"
      aria-hidden="true"
    >
      <path d="M6 3v22M22 3v22" />
      <path d="M6 8h4m2 0h10M10 5.5v5M12 5.5v5" />
      <path d="M6 20h4m2 0h10M10 17.5v5M12 17.5v5" />
      <path d="M6 14l16 0M13 11.5l3 2.5-3 2.5z" />
    </svg>
  );
}
