// Cleans a received message's HTML before the dev mail page shows it inside our own page.
import sanitizeHtml from 'sanitize-html';

/** Text formatting and links only: no scripts, styles, forms, images or frames from a message. */
export function sanitiseMailHtml(html: string): string {
  return sanitizeHtml(html, {
    allowedTags: [
      'p',
      'br',
      'a',
      'strong',
      'b',
      'em',
      'i',
      'ul',
      'ol',
      'li',
      'h1',
      'h2',
      'h3',
      'blockquote',
      'code',
      'pre',
      'div',
      'span',
      'table',
      'tr',
      'td',
      'th',
      'tbody',
      'thead',
    ],
    allowedAttributes: { a: ['href', 'rel'] },
    allowedSchemes: ['http', 'https', 'mailto'],
    transformTags: { a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer' }) },
    disallowedTagsMode: 'discard',
  });
}
