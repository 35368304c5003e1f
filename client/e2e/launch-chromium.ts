import { chromium, type Browser } from 'playwright-core';

/** Flags for Debian chromium running as root in a container; Playwright gives each launch a fresh temporary profile. */
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/** Launches Debian's /usr/bin/chromium (Playwright never downloads a browser here). */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
}
