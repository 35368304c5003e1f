import { Group, Paper, Text, ThemeIcon } from '@mantine/core';
import classes from './hv-caution.module.css';

/** The persistent high-voltage caution shown on every signed-in screen. */
export function HvCaution() {
  return (
    <Paper
      component="aside"
      role="note"
      aria-label="High-voltage caution"
      radius={0}
      px="md"
      py={6}
      className={classes.root}
    >
      <Group gap="sm" wrap="nowrap" align="center">
        <ThemeIcon color="ember" variant="filled" size="sm" radius="xl" aria-hidden="true">
          <BoltGlyph />
        </ThemeIcon>
        <Text size="xs" lh={1.4}>
          <Text span fw={700} inherit>
            High voltage can kill.
          </Text>{' '}
          Capacitors keep a dangerous charge after switch-off: discharge and measure before touching. These results
          support design work only; the applicable standard, local codes and licensed practice govern.
        </Text>
      </Group>
    </Paper>
  );
}

function BoltGlyph() {
  return (
    <svg width="12" height="12" viewBox="0 0 12 12" fill="currentColor" aria-hidden="true">
      <path d="M7 0L1.5 7H5.5L4.5 12L10.5 4.5H6.5L7 0Z" />
    </svg>
  );
}
