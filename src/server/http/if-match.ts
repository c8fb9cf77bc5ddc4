// Versions as ETags, and If-Match read from a request: how a program's update never overwrites an edit made meanwhile.
import { refuse, succeed, type Outcome } from './result';

/** The strong ETag of a record's version: "v7". */
export function versionTag(version: number): string {
  return `"v${version}"`;
}

/**
 * The version a request's If-Match names: undefined when it has none (or `*`). Comparison is strong (RFC 9110
 * §13.1.1): a weak W/"v7" never matches. A required If-Match that is missing answers 428.
 */
export function ifMatchVersion(request: Request, options: { required: boolean }): Outcome<number | undefined> {
  const header = request.headers.get('if-match')?.trim();
  if (!header) {
    return options.required
      ? refuse(
          'precondition_required',
          'Send the version you last read in an If-Match header, e.g. If-Match: "v3" (the ETag of your GET), so an edit made meanwhile is never overwritten.',
        )
      : succeed(undefined);
  }
  if (header === '*') return succeed(undefined);
  const match = /^"v(\d{1,9})"$/.exec(header);
  if (!match)
    return refuse('bad_request', 'If-Match takes the ETag of your last GET exactly as sent, e.g. If-Match: "v3".', {
      'If-Match': ['Use the ETag as sent, in double quotes, e.g. "v3".'],
    });
  return succeed(Number(match[1]));
}
