// URL checks shared by the editor nodes, the link configuration and the body sanitiser.

/** Control characters, whitespace, backslashes, double quotes, angle brackets and backticks: browsers strip or reinterpret them. */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const UNSAFE_URL_CHARACTERS = /[\u0000-\u0020\u007f-\u009f\u2028\u2029\\"<>`]/u;

const LINK_SCHEMES = ['http:', 'https:', 'mailto:'] as const;

function parses(url: string): URL | null {
  try {
    return new URL(url);
  } catch {
    return null;
  }
}

/** True for an absolute http, https or mailto link; everything else (javascript:, data:, relative) is refused. */
export function isSafeLinkHref(href: unknown): href is string {
  if (typeof href !== 'string' || href.length === 0 || href.length > 2000) return false;
  if (UNSAFE_URL_CHARACTERS.test(href)) return false;
  // Check the raw prefix as well as the parsed scheme, so parser quirks cannot smuggle another scheme in.
  if (!/^(?:https?:\/\/|mailto:)/i.test(href)) return false;
  const parsed = parses(href);
  return parsed !== null && (LINK_SCHEMES as readonly string[]).includes(parsed.protocol);
}

/** True for our own media paths (/media/...) and absolute https URLs: the only image sources a body may use. */
export function isSafeImageSrc(src: unknown): src is string {
  if (typeof src !== 'string' || src.length === 0 || src.length > 2000) return false;
  if (UNSAFE_URL_CHARACTERS.test(src)) return false;
  if (src.startsWith('/media/')) {
    // No climbing out of the media folder, no protocol-relative tricks.
    return !src.split(/[/?#]/).some((segment) => segment === '..' || segment === '.') && !src.includes('//');
  }
  if (src.startsWith('https://')) {
    const parsed = parses(src);
    return parsed !== null && parsed.protocol === 'https:' && parsed.hostname.length > 0;
  }
  return false;
}
