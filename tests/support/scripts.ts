// Pages that must ship no client script may still carry two things: one JSON-LD block (data for search engines
// that never runs) and the service worker's registration, which every page carries (BaseLayout). Pages that must
// ship no other script check that `scriptsBesideRegistration` is empty.
export function withoutJsonLd(html: string): string {
  return html.replace(/<script type="application\/ld\+json">[^<]*<\/script>/g, '');
}

const registration = /^<script type="module" src="\/_astro\/BaseLayout\.astro_astro_type_script_index_0_lang\.[\w-]+\.js">$/;

export function scriptsBesideRegistration(html: string): string[] {
  return (withoutJsonLd(html).match(/<script\b[^>]*>/gi) ?? []).filter((tag) => !registration.test(tag));
}

export function hasRegistration(html: string): boolean {
  return (html.match(/<script\b[^>]*>/gi) ?? []).some((tag) => registration.test(tag));
}
