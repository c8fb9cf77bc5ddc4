// The small pages the route guard answers with: not allowed, not served here.
import type { SessionUser } from '@/lib/permissions';
import { escapeHtml } from '../render/escape';

function page(title: string, paragraphs: string[], links: Array<[string, string]>): string {
  return [
    '<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${escapeHtml(title)} · Benchlore</title><meta name="robots" content="noindex">`,
    '<style>body{margin:0;padding:3rem 1rem;background:#f6f1e7;color:#1c2726;font:1.1rem/1.6 Georgia,serif}main{max-width:36rem;margin:0 auto}h1{color:#0f4c4a}a{color:#0f4c4a}</style>',
    `</head><body><main><h1>${escapeHtml(title)}</h1>`,
    ...paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<ul>${links.map(([href, label]) => `<li><a href="${escapeHtml(href)}">${escapeHtml(label)}</a></li>`).join('')}</ul>`,
    '</main></body></html>',
  ].join('');
}

export function forbiddenPage(user: SessionUser): string {
  if (!user.verified) {
    return page(
      'Confirm your e-mail address first',
      [
        'Your account can read everything on Benchlore, but writing starts once you have confirmed your e-mail address.',
        'Your account page can send the confirmation mail again.',
      ],
      [
        ['/account', 'Go to your account'],
        ['/', 'Back to the front page'],
      ],
    );
  }
  return page(
    'This page is not open to your account',
    ['You are signed in, but this page needs a role your account does not have. If you think it should, ask an admin.'],
    [['/', 'Back to the front page']],
  );
}

export function notServedPage(): string {
  return page('Not served here', ['This address does not answer that kind of request.'], [['/', 'Back to the front page']]);
}

/** Fails closed: a route missing from src/server/auth/route-access.ts is refused until someone lists it. */
export function unlistedPage(): string {
  return page(
    'Not open yet',
    ['This page has not been given an access rule yet, so it is closed for now.'],
    [['/', 'Back to the front page']],
  );
}
