// One Lighthouse run against a page, in Debian's Chromium started by chrome-launcher: used by `npm run lighthouse`
// and by the test that the fix page passes every accessibility and SEO audit.
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { defaultChromiumPath } from '../lib/chromium.ts';

export const categoryIds = ['performance', 'accessibility', 'best-practices', 'seo'] as const;
export type CategoryId = (typeof categoryIds)[number];

export interface AuditFailure {
  id: string;
  title: string;
  /** What Lighthouse names as the failing element or item, e.g. a selector or a URL. */
  items: string[];
}

export interface LighthouseResult {
  url: string;
  /** 0 to 100 per category run. */
  scores: Partial<Record<CategoryId, number>>;
  /** Audits of each category that did not fully pass (scored below 1). */
  failures: Partial<Record<CategoryId, AuditFailure[]>>;
}

/** Debian's Chromium, headless, with nothing of its own going to the network. */
const chromeFlags = [
  '--headless=new',
  '--no-sandbox',
  '--disable-gpu',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export async function launchChrome(): Promise<chromeLauncher.LaunchedChrome> {
  return chromeLauncher.launch({ chromePath: process.env.CHROMIUM_PATH ?? defaultChromiumPath, chromeFlags, logLevel: 'silent' });
}

interface ItemDetails {
  items?: Record<string, unknown>[];
}

function itemText(item: Record<string, unknown>): string {
  const node = item.node as { selector?: string; snippet?: string } | undefined;
  return node?.selector ?? node?.snippet ?? (typeof item.url === 'string' ? item.url : JSON.stringify(item).slice(0, 120));
}

/** Runs Lighthouse's mobile profile (its default) for the given categories; `cookie` signs the page in. */
export async function runLighthouse(
  chrome: chromeLauncher.LaunchedChrome,
  url: string,
  options: { categories?: readonly CategoryId[]; cookie?: string } = {},
): Promise<LighthouseResult> {
  const categories = options.categories ?? categoryIds;
  const result = await lighthouse(url, {
    port: chrome.port,
    output: 'json',
    logLevel: 'error',
    onlyCategories: [...categories],
    ...(options.cookie ? { extraHeaders: { Cookie: options.cookie } } : {}),
  });
  if (!result) throw new Error(`Lighthouse gave no result for ${url}`);
  const { lhr } = result;
  if (lhr.runtimeError) throw new Error(`Lighthouse could not load ${url}: ${lhr.runtimeError.message}`);
  const scores: LighthouseResult['scores'] = {};
  const failures: LighthouseResult['failures'] = {};
  for (const id of categories) {
    const category = lhr.categories[id];
    if (!category) continue;
    scores[id] = Math.round((category.score ?? 0) * 100);
    failures[id] = category.auditRefs
      .filter((ref) => ref.weight > 0 || id !== 'performance')
      .map((ref) => lhr.audits[ref.id]!)
      .filter((audit) => audit.score !== null && audit.score < 1 && audit.scoreDisplayMode !== 'informative')
      .map((audit) => ({
        id: audit.id,
        // "First Contentful Paint 1.9 s": the figure beside the audit says how far from a full score it is.
        title: audit.displayValue ? `${audit.title} ${audit.displayValue}` : audit.title,
        items: ((audit.details as ItemDetails | undefined)?.items ?? []).slice(0, 5).map(itemText),
      }));
  }
  return { url, scores, failures };
}
