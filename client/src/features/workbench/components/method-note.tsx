import { ActionIcon, List, Popover, Stack, Text } from '@mantine/core';
import type { MethodInfo } from '@ladderwright/shared/methods';

export interface MethodNoteProps {
  /** What the figure is, for the button's accessible name. */
  subject: string;
  method: MethodInfo | null | undefined;
  /** A method given only as text by the engine (e.g. a simulation summary). */
  methodText?: string;
  /** A line under the method, e.g. the estimate set against the simulation in words. */
  note?: string;
}

/** A small "how was this computed" popover showing the engine's method note for one figure. */
export function MethodNote({ subject, method, methodText, note }: MethodNoteProps) {
  if (!method && !methodText) return null;
  return (
    <Popover width={340} position="bottom-start" withArrow shadow="md">
      <Popover.Target>
        <ActionIcon variant="subtle" size="sm" radius="xl" aria-label={`How ${subject} is computed`}>
          <InfoGlyph />
        </ActionIcon>
      </Popover.Target>
      <Popover.Dropdown>
        {method ? (
          <Stack gap={6}>
            <Text size="xs" fw={600}>
              {method.summary}
            </Text>
            {method.assumptions.length > 0 && (
              <List size="xs" spacing={2}>
                {method.assumptions.map((assumption) => (
                  <List.Item key={assumption}>{assumption}</List.Item>
                ))}
              </List>
            )}
            <Text size="xs" c="dimmed">
              Source: {method.source}
            </Text>
            {note && <Text size="xs">{note}</Text>}
            {/* The engine's name for the method, as reports and exports cite it: last, for tracing, not reading. */}
            <Text size="xs" c="dimmed">
              Method id{' '}
              <Text span inherit ff="monospace">
                {method.methodId}
              </Text>
            </Text>
          </Stack>
        ) : (
          <Text size="xs">{methodText}</Text>
        )}
      </Popover.Dropdown>
    </Popover>
  );
}

function InfoGlyph() {
  return (
    <svg
      width="14"
      height="14"
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth="2"
      aria-hidden="true"
    >
      <circle cx="12" cy="12" r="9" />
      <path d="M12 11v6M12 7.5v.5" strokeLinecap="round" />
    </svg>
  );
}
