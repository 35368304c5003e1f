import { useEffect, useRef } from 'react';
import { Group, Paper, Text, ThemeIcon } from '@mantine/core';
import classes from './hv-caution.module.css';

/** The CSS variable holding the caution's height, so sticky areas below it never cover it. */
export const HV_CAUTION_HEIGHT_VAR = '--lw-hv-caution-height';

/** The persistent high-voltage caution shown on every signed-in screen. */
export function HvCaution() {
  const ref = useRef<HTMLElement>(null);
  useEffect(() => {
    const element = ref.current;
    if (!element || typeof ResizeObserver === 'undefined') return;
    // Its box, padding and border included, is what the sticky areas below it must clear.
    const observer = new ResizeObserver(() => {
      const height = element.getBoundingClientRect().height;
      if (height > 0) document.documentElement.style.setProperty(HV_CAUTION_HEIGHT_VAR, `${Math.ceil(height)}px`);
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return (
    <Paper
      ref={ref}
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
