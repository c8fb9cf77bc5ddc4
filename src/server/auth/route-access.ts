// Every route and method with what it needs: 'public', an action for can(), or 'closed'. The middleware guard reads it.
/*
  Add a route here when you add a file under src/pages (tests/integration/authorization.test.ts fails
  and names the file otherwise). Keys are Astro's route patterns: the file path under src/pages without
  its extension, "index" dropped, e.g. src/pages/fixes/[slug]/index.astro → '/fixes/[slug]'.
  Methods not listed answer 405. HEAD follows GET. '*' covers every method.
  `token` says which methods a personal API token may call and with which scope (src/server/auth/api-tokens.ts
  holds the rule); a route without it never takes a token, whatever the method.
  The guard checks the role level only; a rule that depends on the resource (nobody proofs their own
  revision, job sheets are private) is checked again by the endpoint with can(user, action, resource).
*/
import type { Action } from '@/lib/permissions';
import type { TokenScope } from '@/lib/schemas/api-tokens';

export type Access = 'public' | 'closed' | Action;
export const routeMethods = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;
export type RouteMethod = (typeof routeMethods)[number];

export interface RouteRule {
  methods: Partial<Record<RouteMethod | '*', Access>>;
  /** Added by an integration or by Astro itself, not by a file under src/pages. */
  injected?: true;
  /** The same bytes for everyone (photos, image renditions): shared caches may keep them even for signed-in readers. */
  sharedCache?: true;
  /** Account pages: never stored by any cache, signed in or not. */
  noStore?: true;
  /**
   * Takes form posts from other sites. Only for a route whose own token is the authority (one-click
   * unsubscribe, RFC 8058: mail programs post from their own servers); every other route refuses them.
   */
  crossSitePosts?: true;
  /** The methods a personal API token may call, each with the scope it needs; absent: tokens are refused. */
  token?: Partial<Record<RouteMethod, TokenScope>>;
}

const read: RouteRule = { methods: { GET: 'public' } };
/** A public read that programs may also call with a token of the read scope. */
const apiRead: RouteRule = { methods: { GET: 'public' }, token: { GET: 'read' } };
/** A public account form and its answer, never cached. */
const accountForm: RouteRule = { methods: { GET: 'public', POST: 'public' }, noStore: true };
const accountRead: RouteRule = { methods: { GET: 'public' }, noStore: true };

export const routeAccess: Record<string, RouteRule> = {
  // Reading: open to everyone.
  '/': read,
  '/404': { methods: { '*': 'public' } },
  '/machines': read,
  '/machines/[slug]': read,
  '/makers': read,
  '/makers/[slug]': read,
  '/chassis/[slug]': read,
  // POST: the page's form Actions (bench report, report a fix), which check who may send them.
  '/fixes/[slug]': { methods: { GET: 'public', POST: 'public' } },
  // Its moderation panel posts to the fixFlag Action.
  '/fixes/[slug]/history': { methods: { GET: 'public', POST: 'lock_fix' } },
  '/fixes/[slug]/r/[number]': read,
  '/help': read,
  '/help/content-licence': read,
  '/help/house-rules': read,
  '/help/privacy': read,
  '/help/working-safely': read,
  '/help/writing-a-good-fix': read,
  '/media/[...key]': { methods: { GET: 'public' }, sharedCache: true },
  // Found and shared: the same bytes for everyone.
  '/robots.txt': { methods: { GET: 'public' }, sharedCache: true },
  '/sitemap.xml': { methods: { GET: 'public' }, sharedCache: true },
  '/sitemaps/[file].xml': { methods: { GET: 'public' }, sharedCache: true },

  // Built once and stored by the service worker: the offline page and the list of fixes kept on this device.
  // Prerendered files, answered by the server entry before our middleware runs (src/server/http/static-files.ts):
  // read with GET or HEAD by anyone; any other method gets 405 with Allow.
  '/offline': read,
  '/kept': read,
  '/api/v1/machines': apiRead,
  '/api/v1/machines/[slug]': apiRead,
  '/api/v1/chassis/[slug]': apiRead,
  '/api/v1/fixes': apiRead,
  '/api/v1/fixes/[slug]': apiRead,

  // Search: open to everyone; the wanted-fixes list and word families are for editors and above.
  '/search': read,
  '/api/v1/search': apiRead,
  '/api/v1/search/similar': apiRead,
  '/admin/word-families': { methods: { GET: 'manage_word_families', POST: 'manage_word_families' } },
  '/admin/wanted-fixes': { methods: { GET: 'curate_catalogue' } },

  // Bench tools and their API: open to everyone. The order list is kept in the browser for readers and on
  // the server for members; /order-list/add decides which per request, /api/v1/order-list is members' only.
  '/tools': read,
  '/tools/value-decoder': read,
  '/tools/preferred-values': read,
  '/tools/substitute-check': read,
  '/tools/esr': read,
  '/tools/life-estimate': read,
  '/tools/bleed-down': read,
  '/order-list': read,
  '/order-list/add': { methods: { POST: 'public' } },
  '/api/v1/tools/decode': { methods: { GET: 'public', POST: 'public' }, token: { GET: 'read', POST: 'read' } },
  '/api/v1/tools/substitute': { methods: { POST: 'public' }, token: { POST: 'read' } },
  '/api/v1/tools/order-list': { methods: { POST: 'public' }, token: { POST: 'read' } },
  '/api/v1/order-list': { methods: { GET: 'own_order_lists', PUT: 'own_order_lists' }, token: { GET: 'order_list', PUT: 'order_list' } },

  // The API's own description and reference page, and the weekly export of the proofed knowledge.
  '/api': read,
  '/api/v1/openapi.json': apiRead,
  '/export': read,
  '/export/fixes.jsonl': read,
  '/export/manifest.json': read,

  // Signing up and in: public forms, rate-limited by their handlers.
  '/sign-in': accountForm,
  '/sign-in/link': accountRead,
  '/sign-in/link-sent': accountRead,
  '/sign-in/problem': accountRead,
  '/sign-up': accountForm,
  '/sign-up/check-email': accountRead,
  '/verify': accountRead,
  '/reset': accountForm,
  '/reset/password': accountForm,

  // The account.
  '/account': { methods: { GET: 'manage_account', POST: 'manage_account' }, noStore: true },
  '/account/sign-out': { methods: { POST: 'public' }, noStore: true },
  '/account/deleted': accountRead,
  // The link mailed to a new address: the token is the authority, signed in or not.
  '/account/email': accountForm,
  // Personal API tokens: created, listed and revoked in the browser only.
  '/account/api-tokens': { methods: { GET: 'manage_account', POST: 'manage_account' }, noStore: true },
  '/api/v1/account': { methods: { GET: 'manage_account', PATCH: 'manage_account' }, noStore: true },
  // Following and news: personal; the unsubscribe link's signed token is its own authority (no sign-in).
  '/account/notifications': { methods: { GET: 'follow', POST: 'follow' }, noStore: true },
  '/following': { methods: { GET: 'follow', POST: 'follow' }, noStore: true },
  '/notifications': { methods: { GET: 'follow', POST: 'follow' }, noStore: true },
  '/unsubscribe/[token]': { methods: { GET: 'public', POST: 'public' }, noStore: true, crossSitePosts: true },

  // Members and roles: moderators suspend; only admins change roles (checked again per form).
  '/admin/users': { methods: { GET: 'suspend_user', POST: 'suspend_user' }, noStore: true },

  // Writing and proofing: verified members write and report; moderators proof (never their own, checked per revision).
  '/write': { methods: { GET: 'write_fix' } },
  '/write/mine': { methods: { GET: 'write_fix', POST: 'write_fix' } },
  '/fixes/[slug]/edit': { methods: { GET: 'write_fix' } },
  '/fixes/[slug]/compare': read,
  '/proofing': { methods: { GET: 'proof', POST: 'proof' } },
  // The decision form posts to its own page, which shows a refusal with the note as typed.
  '/proofing/[id]': { methods: { GET: 'proof', POST: 'proof' }, noStore: true },
  '/api/v1/catalogue-lookup': apiRead,
  '/api/v1/drafts': { methods: { POST: 'write_fix' } },
  '/api/v1/drafts/[id]': { methods: { GET: 'write_fix', PUT: 'write_fix', DELETE: 'write_fix' } },
  '/api/v1/drafts/[id]/submit': { methods: { POST: 'write_fix' } },
  '/api/v1/drafts/[id]/discard': { methods: { POST: 'write_fix' } },
  '/api/v1/revisions/[id]/amend': { methods: { POST: 'write_fix' } },
  '/api/v1/revisions/[id]/withdraw': { methods: { POST: 'write_fix' } },
  '/api/v1/photos': { methods: { POST: 'upload_photo' } },
  '/api/v1/photos/[id]': { methods: { GET: 'upload_photo', PATCH: 'upload_photo' } },
  '/api/v1/proofing/[id]/proof': { methods: { POST: 'proof' } },
  '/api/v1/proofing/[id]/return': { methods: { POST: 'proof' } },
  '/api/v1/proofing/reports/[id]': { methods: { POST: 'moderate' } },
  '/api/v1/proofing/fixes/[slug]': { methods: { POST: 'lock_fix' } },
  '/api/v1/fixes/[slug]/reports': { methods: { POST: 'report_fix' } },

  // Bench work. Job sheets and a member's notes are private: the handlers check the owner again and
  // answer 404 for anyone else's. The customer's note page and its JSON are public (misses rate-limited).
  '/n/[code]': read,
  '/notes': { methods: { GET: 'write_handover_note' } },
  '/notes/new': { methods: { GET: 'write_handover_note', POST: 'write_handover_note' } },
  '/notes/[code]': { methods: { GET: 'write_handover_note', POST: 'write_handover_note' } },
  '/jobs': { methods: { GET: 'own_job_sheets' } },
  '/jobs/new': { methods: { GET: 'own_job_sheets', POST: 'own_job_sheets' } },
  '/jobs/[id]': { methods: { GET: 'own_job_sheets', POST: 'own_job_sheets' } },
  '/api/v1/bench-reports': { methods: { GET: 'bench_report', POST: 'bench_report' } },
  '/api/v1/fixes/[slug]/bench-reports': apiRead,
  '/api/v1/handover-notes': {
    methods: { GET: 'write_handover_note', POST: 'write_handover_note' },
    token: { GET: 'bench_work', POST: 'bench_work' },
  },
  '/api/v1/handover-notes/[code]': {
    methods: { GET: 'public', PATCH: 'write_handover_note', DELETE: 'write_handover_note', POST: 'write_handover_note' },
    // GET with a token: the owner's own view of the note (with its version for If-Match), not the customer's page.
    token: { GET: 'bench_work', PATCH: 'bench_work', DELETE: 'bench_work' },
  },
  '/api/v1/handover-notes/[code]/qr.svg': { methods: { GET: 'write_handover_note' }, token: { GET: 'bench_work' } },
  '/api/v1/handover-notes/[code]/qr.png': { methods: { GET: 'write_handover_note' }, token: { GET: 'bench_work' } },
  '/api/v1/job-sheets': { methods: { GET: 'own_job_sheets', POST: 'own_job_sheets' }, token: { GET: 'bench_work', POST: 'bench_work' } },
  // Deleting a job sheet stays in the browser: a program creates, reads and updates.
  '/api/v1/job-sheets/[id]': {
    methods: { GET: 'own_job_sheets', PATCH: 'own_job_sheets', DELETE: 'own_job_sheets' },
    token: { GET: 'bench_work', PATCH: 'bench_work' },
  },
  '/api/v1/job-sheets/[id]/fixes': {
    methods: { POST: 'own_job_sheets', DELETE: 'own_job_sheets' },
    token: { POST: 'bench_work', DELETE: 'bench_work' },
  },
  '/api/v1/job-sheets/[id]/invoice-lines.csv': { methods: { GET: 'own_job_sheets' }, token: { GET: 'bench_work' } },
  '/api/v1/job-sheets/[id]/invoice-lines.json': { methods: { GET: 'own_job_sheets' }, token: { GET: 'bench_work' } },

  // The local mail sink's pages (they answer 404 in production).
  '/dev/mail': { methods: { GET: 'view_dev_mail' }, noStore: true },
  '/dev/mail/[id]': { methods: { GET: 'view_dev_mail' }, noStore: true },

  // Auth.js (auth-astro's injected route). Our own pages call it in-process; from outside only its GET
  // endpoints are open (the e-mailed link's callback, csrf, session), so nothing skips our rate limits.
  '/api/auth/[...auth]': { methods: { GET: 'public', POST: 'closed' }, injected: true },
  // Astro's own routes, present depending on the build.
  '/_image': { methods: { GET: 'public' }, injected: true, sharedCache: true },
  '/_server-islands/[name]': { methods: { GET: 'public', POST: 'public' }, injected: true },
  '/_actions/[...path]': { methods: { POST: 'public' }, injected: true },
};

export type RouteDecision =
  { kind: 'unlisted' } | { kind: 'method_not_allowed'; allow: string[] } | { kind: 'access'; access: Access; rule: RouteRule };

function methodKey(method: string): RouteMethod | null {
  const upper = method.toUpperCase();
  if (upper === 'HEAD') return 'GET';
  return (routeMethods as readonly string[]).includes(upper) ? (upper as RouteMethod) : null;
}

/** What the table says for one request; OPTIONS and other methods we do not serve count as not allowed. */
export function decideRoute(pattern: string, method: string): RouteDecision {
  const rule = routeAccess[pattern];
  if (!rule) return { kind: 'unlisted' };
  const key = methodKey(method);
  const access = (key && rule.methods[key]) ?? rule.methods['*'];
  if (access) return { kind: 'access', access, rule };
  const allow = Object.keys(rule.methods).flatMap((m) => (m === 'GET' ? ['GET', 'HEAD'] : [m]));
  return { kind: 'method_not_allowed', allow };
}
