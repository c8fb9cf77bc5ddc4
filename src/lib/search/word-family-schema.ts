// What an editor may send to add, change, retire or restore a word family: one zod schema per form.
import { z } from 'zod';

export const MAX_FAMILY_TERMS = 20;
const MAX_TERM_LENGTH = 60;

/** Terms arrive one per line (or comma-separated); trimmed, spaces folded, repeats dropped. */
export function splitTerms(raw: string): string[] {
  const seen = new Set<string>();
  const terms: string[] = [];
  for (const piece of raw.split(/[\n,;]+/)) {
    // JavaScript's \s counts U+FEFF (zero-width no-break space) as a space: fold only visible spacing, keep the rest as typed.
    const term = piece.replace(/[^\S\uFEFF]+/g, ' ').trim();
    const key = term.toLowerCase();
    if (term && !seen.has(key)) {
      seen.add(key);
      terms.push(term);
    }
  }
  return terms;
}

const termsField = z
  .string({ error: 'List the terms, one per line.' })
  .transform(splitTerms)
  .pipe(
    z
      .array(z.string().max(MAX_TERM_LENGTH, `Keep each term under ${MAX_TERM_LENGTH} characters.`))
      .min(2, 'A family needs at least two terms: the words that mean the same thing.')
      .max(MAX_FAMILY_TERMS, `A family holds at most ${MAX_FAMILY_TERMS} terms; split it into two.`),
  );

const nameField = z
  .string({ error: 'Give the family a name.' })
  .trim()
  .min(1, 'Give the family a name.')
  .max(60, 'Keep the name under 60 characters.');

const idField = z.coerce.number({ error: 'Pick a family.' }).int().positive('Pick a family.');

export const wordFamilyFormSchema = z.discriminatedUnion('intent', [
  z.object({ intent: z.literal('create'), name: nameField, terms: termsField }),
  z.object({ intent: z.literal('update'), id: idField, name: nameField, terms: termsField }),
  z.object({ intent: z.literal('retire'), id: idField }),
  z.object({ intent: z.literal('restore'), id: idField }),
]);
export type WordFamilyForm = z.infer<typeof wordFamilyFormSchema>;
