// Walks a list of pages as one reader (signed out, or signed in as `user`) in one browser context, and collects
// what a check finds on each: the 360 px overflow test and the touch-target test walk the same main pages this way.
import type { Browser, BrowserContextOptions, Page, Response } from 'playwright-core';
import { signedInContext } from './browser';

export interface Reader {
  email: string;
  password: string;
}

/** Opens each path in turn, waits for islands to render, and gathers the problems `check` names there. */
export async function walkPages(
  browser: Browser,
  base: string,
  reader: Reader | undefined,
  device: BrowserContextOptions,
  paths: string[],
  check: (page: Page, path: string, response: Response | null) => Promise<string[]>,
): Promise<string[]> {
  const context = reader ? await signedInContext(browser, base, reader.email, reader.password, device) : await browser.newContext(device);
  const page = await context.newPage();
  const found: string[] = [];
  for (const path of paths) {
    const response = await page.goto(`${base}${path}`);
    // Islands render after load, and the page's script shows controls such as "Keep for the bench" once it runs.
    await page.waitForLoadState('networkidle', { timeout: 5_000 }).catch(() => {});
    found.push(...(await check(page, path, response)));
  }
  await context.close();
  return found;
}
