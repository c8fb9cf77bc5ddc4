// isSafeLinkHref and isSafeImageSrc: the URL rules behind links, images and figures.
import { describe, expect, it } from 'vitest';
import { isSafeImageSrc, isSafeLinkHref } from '@/lib/tiptap/allowlist';

describe('isSafeLinkHref', () => {
  it.each(['http://example.org', 'https://example.org/a?b=1&c=2#d', 'HTTPS://EXAMPLE.ORG/', 'mailto:desk@example.org'])(
    'accepts %j',
    (href) => {
      expect(isSafeLinkHref(href)).toBe(true);
    },
  );

  it.each([
    'javascript:alert(1)',
    'JAVASCRIPT:alert(1)',
    '\u0001javascript:alert(1)',
    ' https://example.org',
    'https://exa mple.org',
    'data:text/html,x',
    'vbscript:x',
    'ftp://example.org',
    'tel:+100',
    '//example.org',
    '/fixes/tray',
    'https:\\\\example.org',
    'https://example.org/"onmouseover="x',
    '',
    42,
    null,
  ])('refuses %j', (href) => {
    expect(isSafeLinkHref(href)).toBe(false);
  });
});

describe('isSafeImageSrc', () => {
  it.each(['/media/a.jpg', '/media/2024/06/belt-1280.webp?v=2', 'https://img.example.org/a.jpg'])('accepts %j', (src) => {
    expect(isSafeImageSrc(src)).toBe(true);
  });

  it.each([
    'http://img.example.org/a.jpg',
    'data:image/png;base64,AA==',
    'javascript:alert(1)',
    '/media/../secrets',
    '/media/./a.jpg',
    '/media//example.org/a.jpg',
    '/mediafile.jpg',
    'media/a.jpg',
    '//img.example.org/a.jpg',
    'HTTPS://img.example.org/a.jpg',
    '/media/a b.jpg',
    '',
    undefined,
  ])('refuses %j', (src) => {
    expect(isSafeImageSrc(src)).toBe(false);
  });
});
