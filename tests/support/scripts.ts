// The script tags of a page beside the service worker's registration, which every page carries (BaseLayout): pages
// that must ship no other script check that this list is empty.
const registration = /^<script type="module" src="\/_astro\/BaseLayout\.astro_astro_type_script_index_0_lang\.[\w-]+\.js">$/;

export function scriptsBesideRegistration(html: string): string[] {
  return (html.match(/<script\b[^>]*>/gi) ?? []).filter((tag) => !registration.test(tag));
}

export function hasRegistration(html: string): boolean {
  return (html.match(/<script\b[^>]*>/gi) ?? []).some((tag) => registration.test(tag));
}
