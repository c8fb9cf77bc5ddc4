// Debian's Chromium through playwright-core, started with the flags this machine needs.
import { chromium, type Browser } from 'playwright-core';
import { defaultChromiumPath } from '../../scripts/lib/chromium.ts';

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? defaultChromiumPath,
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
}
