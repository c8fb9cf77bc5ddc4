// The one redirect guard: where a form or sign-in may send the browser next. Pure, so zod schemas and islands use it too.

/** Long enough for any page of ours with its query; a longer "path" is not one we made. */
export const MAX_LOCAL_PATH = 2000;

/**
 * A path on this site: starts with one `/`, never `//` anywhere (a second slash at the start names another host,
 * and no path of ours has an empty segment), no backslash (browsers read `/\host` as `//host`), and only the
 * printable ASCII characters a URL may carry unescaped: no whitespace, no control characters, none of `"<>^`{|}`.
 */
export function isLocalPath(value: unknown): value is string {
  if (typeof value !== 'string' || value.length === 0 || value.length > MAX_LOCAL_PATH) return false;
  if (!value.startsWith('/') || value.includes('//') || value.includes('\\')) return false;
  return /^[A-Za-z0-9\-._~!$&'()*+,;=:@/?#%[\]]*$/.test(value);
}

/** The value when it is a path on this site, otherwise the fallback. */
export function localPathOr(value: unknown, fallback: string): string {
  return isLocalPath(value) ? value : fallback;
}
