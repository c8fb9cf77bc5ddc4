// The guard every journey runs under: each page of the journey is watched for console errors, page errors, 5xx
// answers, missing assets and navigations nobody asked for, and after each step every open page must fit 360 px.
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, BrowserContext, Locator, Page, Request, Response } from 'playwright-core';
import { signedInContext } from '../../support/browser';
import { describeOverflow, horizontalOverflow } from '../../support/overflow';
import { JOURNEYS_PORT } from '../../support/test-env';

export const base = `http://127.0.0.1:${JOURNEYS_PORT}`;
export const PHONE_WIDTH = 360;
// JOURNEYS_SURVEY=1 goes on after a failed step and fails the journey at its end with every failed step listed.
const survey = process.env.JOURNEYS_SURVEY === '1';

// Assets a page loads on its own; a 4xx for one of them is a broken page. A 4xx for fetch is the API refusing input.
const assetTypes = new Set(['document', 'stylesheet', 'script', 'image', 'font']);
// Chromium logs every 4xx/5xx answer as "Failed to load resource"; those answers are judged by the response listener.
const networkLog = /^Failed to load resource: the server responded with a status of \d{3}/;

export interface ContextOptions {
  /** Sign in as this account (through the real sign-in form) before the first page opens. */
  as?: { email: string; password: string };
  javaScriptEnabled?: boolean;
  /** The width the person works at; every step is also checked at 360 px. Default 1280. */
  width?: number;
}

export class Journey {
  private readonly problems: string[] = [];
  private readonly contexts: BrowserContext[] = [];
  /** Navigations the journey has announced and not yet seen start. */
  private expectedNavigations = 0;
  private currentStep = 'opening';
  private readonly failedSteps: string[] = [];

  constructor(private readonly browser: Browser) {}

  /** A browser context whose every page is watched. */
  async context(options: ContextOptions = {}): Promise<BrowserContext> {
    const contextOptions = {
      viewport: { width: options.width ?? 1280, height: 900 },
      javaScriptEnabled: options.javaScriptEnabled ?? true,
    };
    const context = options.as
      ? await signedInContext(this.browser, base, options.as.email, options.as.password, contextOptions)
      : await this.browser.newContext(contextOptions);
    // A person notices within seconds; a long wait only slows down the report of what they saw.
    context.setDefaultTimeout(10_000);
    context.on('page', (page) => this.watch(page));
    this.contexts.push(context);
    return context;
  }

  /** A watched page in a new context. */
  async page(options: ContextOptions = {}): Promise<Page> {
    return (await this.context(options)).newPage();
  }

  private watch(page: Page): void {
    page.on('console', (message) => {
      if (message.type() !== 'error') return;
      if (networkLog.test(message.text())) return;
      this.problems.push(`console error on ${page.url()}: ${message.text()}`);
    });
    page.on('pageerror', (error) => this.problems.push(`page error on ${page.url()}: ${error.message}`));
    page.on('response', (response: Response) => {
      const status = response.status();
      const type = response.request().resourceType();
      if (status >= 500) this.problems.push(`${status} answer to ${response.request().method()} ${response.url()}`);
      else if (status >= 400 && assetTypes.has(type) && type !== 'document')
        this.problems.push(`${status} for the ${type} ${response.url()}`);
    });
    page.on('request', (request: Request) => {
      if (!request.isNavigationRequest() || request.frame() !== page.mainFrame() || request.redirectedFrom()) return;
      if (this.expectedNavigations > 0) this.expectedNavigations -= 1;
      else this.problems.push(`a navigation nobody asked for: ${request.method()} ${request.url()} (from ${page.url()})`);
    });
  }

  /** Opens a path of the site as a person would type or follow it. */
  async goto(page: Page, path: string): Promise<Response | null> {
    this.expectedNavigations += 1;
    try {
      return await page.goto(path.startsWith('http') ? path : `${base}${path}`);
    } finally {
      this.expectedNavigations = 0;
    }
  }

  /**
   * An action the person takes expecting a new page (a link, a submit button): waits for the new page to load, even
   * when it has the address of the old one, and checks it arrived at `url`.
   */
  async navigates(page: Page, url: RegExp | string, action: () => Promise<unknown>): Promise<void> {
    this.expectedNavigations += 1;
    try {
      const committed = page.waitForEvent('framenavigated', { predicate: (frame) => frame === page.mainFrame() });
      // When the action itself fails (no such link), that is the failure to report, not the wait.
      committed.catch(() => undefined);
      await action();
      await committed;
      await page.waitForLoadState('load');
      await page.waitForURL(url);
    } finally {
      this.expectedNavigations = 0;
    }
  }

  /** Reloads the page, as a person coming back to it would. */
  async reload(page: Page): Promise<void> {
    this.expectedNavigations += 1;
    try {
      await page.reload();
    } finally {
      this.expectedNavigations = 0;
    }
  }

  /**
   * One step of the journey. It fails with the step's name when the action fails, when anything went wrong on a page
   * meanwhile, or when an open page of the journey scrolls sideways at 360 px.
   */
  async step(name: string, action: () => Promise<void>): Promise<void> {
    this.currentStep = name;
    let failure: unknown = null;
    try {
      await action();
    } catch (error) {
      failure = error;
    }
    const problems = [...this.problems.splice(0), ...(await this.overflows())];
    if (failure === null && problems.length === 0) return;
    // What the page did meanwhile (a navigation nobody asked for, a console error) often explains a failed check.
    const seen = problems.length > 0 ? `\n  went wrong for the person:\n  ${problems.join('\n  ')}` : '';
    const error = failure instanceof Error ? failure : new Error(failure === null ? 'the step itself passed' : String(failure));
    error.message = `[${name}] ${error.message}${seen}${await this.screenshots(name)}`;
    if (!survey) throw error;
    this.failedSteps.push(error.message.split('\n').slice(0, 4).join('\n    '));
  }

  /** What the person had in front of them when a step failed, as screenshots in the temporary folder. */
  private async screenshots(step: string): Promise<string> {
    const pages = this.openPages();
    const files: string[] = [];
    for (const [i, page] of pages.entries()) {
      const file = join(tmpdir(), `journeys-failed-${step.replace(/[^a-z0-9]+/gi, '-').slice(0, 60)}-${i + 1}.png`);
      if (await page.screenshot({ path: file, fullPage: true }).catch(() => null)) files.push(file);
    }
    return files.length > 0 ? `\n  screenshots: ${files.join(', ')}` : '';
  }

  private openPages(): Page[] {
    return this.contexts.flatMap((c) => c.pages()).filter((page) => !page.isClosed() && page.url() !== 'about:blank');
  }

  private async overflows(): Promise<string[]> {
    const found: string[] = [];
    for (const page of this.openPages()) {
      const viewport = page.viewportSize();
      const narrow = viewport && viewport.width !== PHONE_WIDTH;
      if (narrow) await page.setViewportSize({ width: PHONE_WIDTH, height: viewport.height });
      const overflow = await horizontalOverflow(page);
      if (narrow) await page.setViewportSize(viewport);
      if (overflow) found.push(describeOverflow(`${page.url()} at ${PHONE_WIDTH} px`, overflow));
    }
    return found;
  }

  /** Closes every context; a problem seen after the last step (or, in a survey, any failed step) fails the journey. */
  async close(): Promise<void> {
    const left = this.problems.splice(0);
    await Promise.all(this.contexts.splice(0).map((c) => c.close()));
    if (left.length > 0) this.failedSteps.push(`[after ${this.currentStep}] went wrong for the person:\n  ${left.join('\n  ')}`);
    if (this.failedSteps.length > 0) throw new Error(`${this.failedSteps.length} steps failed:\n  ${this.failedSteps.join('\n  ')}`);
  }
}

/** The person sees it: the element is on screen within a few seconds (the failure names what was looked for). */
export async function sees(locator: Locator): Promise<void> {
  await locator.first().waitFor({ state: 'visible', timeout: 5_000 });
}
