// Pages that must ship no client script may still carry one JSON-LD block: data for search engines that never runs.
export function withoutJsonLd(html: string): string {
  return html.replace(/<script type="application\/ld\+json">[^<]*<\/script>/g, '');
}
