// eslint-disable-next-line @typescript-eslint/triple-slash-reference -- Astro's generated types are only reachable this way
/// <reference path="../.astro/types.d.ts" />

// What the middleware puts on Astro.locals for every request.
declare namespace App {
  interface Locals {
    /** The signed-in, active account (read from the database on this request), or null. */
    user: import('./lib/permissions').SessionUser | null;
    /** Unread notifications of the signed-in member, counted for page views; undefined otherwise. */
    unreadNews?: number;
    /** The personal API token the request was made with (Authorization: Bearer), when it was. */
    apiToken?: import('./server/auth/api-tokens').RequestToken;
  }
}
