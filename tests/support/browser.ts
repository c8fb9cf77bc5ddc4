// Debian's Chromium through playwright-core, started with the flags this machine needs.
import { chromium, type Browser, type BrowserContext, type BrowserContextOptions } from 'playwright-core';
import { signIn } from './sign-in';
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

/**
 * A browser context of its own, signed in as `email` through the real sign-in form (the session cookie copied in).
 * `options` go to the new context (e.g. a phone's viewport instead of 1280 by 900).
 */
export async function signedInContext(
  browser: Browser,
  base: string,
  email: string,
  password: string,
  options: BrowserContextOptions = {},
): Promise<BrowserContext> {
  const cookie = await signIn(base, email, password);
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, ...options });
  await context.addCookies(
    cookie.split('; ').map((pair) => {
      const [name, ...value] = pair.split('=');
      return { name: name!, value: value.join('='), url: base };
    }),
  );
  return context;
}
