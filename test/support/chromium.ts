// Debian's chromium (installed by test/setup.sh), started by playwright-core for the page tests:
// no browser is downloaded, and the browser's own background traffic is switched off so that
// every request a test sees comes from the page.
import { chromium, type Browser } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';

export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}
