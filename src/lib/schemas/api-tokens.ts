// Personal API tokens: what a member may name and grant when creating one. One schema for the form and the server.
import { z } from 'zod';

/** What a token may be used for; moderation and account changes are never among them. */
export const tokenScopes = ['read', 'bench_work', 'order_list'] as const;
export type TokenScope = (typeof tokenScopes)[number];

export const tokenScopeLabels: Record<TokenScope, string> = {
  read: 'Read the catalogue and fixes',
  bench_work: 'Job sheets and hand-over notes',
  order_list: 'Order list',
};

export const tokenScopeSchema = z.enum(tokenScopes, { error: 'Choose scopes from the list: read, bench_work or order_list.' });

const scopesExample = 'Tick at least one scope, e.g. "Job sheets and hand-over notes".';

export const apiTokenCreateSchema = z.object(
  {
    name: z
      .string({ error: 'Name the token after the program that uses it, e.g. "Front desk invoicing".' })
      .trim()
      .min(1, 'Name the token after the program that uses it, e.g. "Front desk invoicing".')
      .max(60, 'Keep the name under 60 characters, e.g. "Front desk invoicing".'),
    scopes: z
      .array(tokenScopeSchema, { error: scopesExample })
      .min(1, scopesExample)
      .transform((scopes) => [...new Set(scopes)].sort()),
  },
  { error: 'Send a name and the scopes, e.g. name "Front desk invoicing" with the scope bench_work.' },
);
export type ApiTokenCreate = z.output<typeof apiTokenCreateSchema>;

/** Every token starts with this, so a leaked one is easy to recognise in logs and code. */
export const TOKEN_PREFIX = 'blt_';

export interface ApiTokenView {
  id: number;
  name: string;
  scopes: TokenScope[];
  /** The token's first characters, to tell tokens apart: never enough to use it. */
  hint: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}
