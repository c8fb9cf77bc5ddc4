// The catalogue look-up the editor's machine picker and other tools query: part of a name, and what kind to find.
import { z } from 'zod';

export const lookupQuerySchema = z.object(
  {
    q: z
      .string({ error: 'Type part of a model number, maker or chassis name.' })
      .trim()
      .min(1, 'Type part of a model number, maker or chassis name.')
      .max(60, 'Type at most 60 characters.'),
    kind: z.enum(['machine', 'chassis', 'all'], { error: 'Look up a machine, a chassis or all.' }).default('all'),
  },
  { error: 'Send what to look up, e.g. q=dr410.' },
);
export type LookupQueryInput = z.input<typeof lookupQuerySchema>;
export type LookupQuery = z.output<typeof lookupQuerySchema>;
