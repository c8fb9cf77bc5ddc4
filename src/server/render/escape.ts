// HTML escaping for the renderer's own mappings: text content and double-quoted attribute values.

const replacements: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Escapes a value for use as element text or inside a double-quoted attribute. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (character) => replacements[character] ?? character);
}

/** Serialises attributes whose names are our own literals; values are escaped, empty ones left out. */
export function attributesHtml(attributes: Record<string, string | number | undefined>): string {
  return Object.entries(attributes)
    .filter((entry): entry is [string, string | number] => entry[1] !== undefined && entry[1] !== '')
    .map(([name, value]) => ` ${name}="${escapeHtml(String(value))}"`)
    .join('');
}
