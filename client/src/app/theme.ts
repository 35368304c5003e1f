import { createTheme, type MantineColorsTuple } from '@mantine/core';

/** Blue-green of weathered copper: the primary colour of Ladderwright. Lightest to darkest. */
const verdigris: MantineColorsTuple = [
  '#e9f8f5',
  '#d3eee8',
  '#a6dcd1',
  '#75c9b8',
  '#4eb8a3',
  '#35ad96',
  '#24a18a',
  '#148c77',
  '#067c69',
  '#006a59',
];

/** Warm amber for cautions and marginal verdicts. */
const ember: MantineColorsTuple = [
  '#fff6e3',
  '#ffebcc',
  '#fdd59b',
  '#fbbd64',
  '#f9a938',
  '#f89c1c',
  '#f8950a',
  '#dd8100',
  '#c57200',
  '#ab6100',
];

/** Cool slate for the dark scheme surfaces (index 7 is the body, 6 and 5 raised surfaces). */
const ink: MantineColorsTuple = [
  '#c9d1d6',
  '#aab4bb',
  '#8a959d',
  '#65707a',
  '#3d4750',
  '#2c353d',
  '#232b32',
  '#1a2127',
  '#141a1f',
  '#0e1317',
];

const fontStack = 'Inter, system-ui, -apple-system, "Segoe UI", Roboto, sans-serif';

export const theme = createTheme({
  primaryColor: 'verdigris',
  primaryShade: { light: 8, dark: 5 },
  colors: { verdigris, ember, dark: ink },
  fontFamily: fontStack,
  headings: { fontFamily: fontStack, fontWeight: '600' },
  defaultRadius: 'sm',
  cursorType: 'pointer',
});
