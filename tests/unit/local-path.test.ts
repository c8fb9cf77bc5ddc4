// The one redirect guard: only a path on this site passes, whatever a form or an address sends.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { isLocalPath, localPathOr, MAX_LOCAL_PATH } from '@/lib/local-path';
import { nextPathSchema } from '@/lib/schemas/account-fields';

describe('isLocalPath', () => {
  it.each([
    '/',
    '/fixes',
    '/fixes/tl2-tray-will-not-open-e21#report',
    '/write?draft=12',
    '/search?q=capstan+slows&machine=wavelite-r40',
    '/proofing?report=closed#reports',
    '/sign-in?next=%2Faccount',
    "/notes/new?fix=a-b&revision=3&shop=O'Dell",
  ])('passes the same-site path %s', (path) => {
    expect(isLocalPath(path)).toBe(true);
  });

  it.each([
    ['another host by a leading double slash', '//elsewhere.example/phish'],
    ['a double slash further on', '/fixes//elsewhere.example'],
    ['a backslash browsers read as a slash', '/\\elsewhere.example'],
    ['a backslash anywhere', '/fixes\\..\\admin'],
    ['an absolute address', 'https://elsewhere.example/'],
    ['a scheme with no slashes', 'javascript:alert(1)'],
    ['a relative path', 'fixes/abc'],
    ['an empty string', ''],
    ['a space', '/fixes/a b'],
    ['a tab', '/fixes\t/x'],
    ['a newline (header splitting)', '/fixes\r\nSet-Cookie: x=1'],
    ['a NUL character', '/fixes\u0000'],
    ['a DEL character', '/fixes\u007f'],
    ['a non-ASCII character', '/fixes/caf\u00e9'],
    ['a quote or angle bracket', '/fixes/"><script>'],
    ['a path one character too long', `/${'a'.repeat(MAX_LOCAL_PATH)}`],
  ])('refuses %s', (_what, value) => {
    expect(isLocalPath(value)).toBe(false);
  });

  it('takes a path of exactly the longest length', () => {
    expect(isLocalPath(`/${'a'.repeat(MAX_LOCAL_PATH - 1)}`)).toBe(true);
  });

  it('refuses anything that is not a string', () => {
    for (const value of [undefined, null, 42, ['/fixes'], { path: '/fixes' }]) expect(isLocalPath(value)).toBe(false);
  });
});

describe('localPathOr', () => {
  it('gives the path when it is ours and the fallback otherwise', () => {
    expect(localPathOr('/write/mine?x=1', '/')).toBe('/write/mine?x=1');
    expect(localPathOr('//elsewhere.example', '/write/mine')).toBe('/write/mine');
    expect(localPathOr(undefined, '/write/mine')).toBe('/write/mine');
  });
});

describe('nextPathSchema uses the same guard', () => {
  it('keeps a path on this site and falls back to / for anything else', () => {
    const schema = z.object({ next: nextPathSchema });
    expect(schema.parse({ next: '/fixes?page=2' }).next).toBe('/fixes?page=2');
    expect(schema.parse({ next: '/\\elsewhere.example' }).next).toBe('/');
    expect(schema.parse({ next: '/a\u0000b' }).next).toBe('/');
    expect(schema.parse({ next: `/${'a'.repeat(MAX_LOCAL_PATH)}` }).next).toBe('/');
  });
});
