// GET /api/v1/search/similar: live fixes that look like a symptom being written up, so no duplicate is started.
/*
  Query: symptom (1–200 characters, required), machine (slug, required).
  200 → {
    machine: { slug: string, label: string, chassis: { slug: string, name: string } | null },
    items: [{
      slug: string,            // link as /fixes/<slug>
      title: string,
      symptoms: string[],
      machines: string[],      // "Maker MODEL (REGION)" labels the fix names
      sameMachine: boolean,    // false: it comes from the machine's chassis family
      likeness: number,        // 0..1, at least 0.5; best first
      benchScore: { score: number | null, reports: number }   // never show the score without reports
    }]                         // at most 5; empty when nothing looks the same
  }
  400 bad_request (with fields) for missing or bad parameters; 404 not_found for an unknown machine.
*/
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { slugSchema } from '@/lib/schemas/slug';
import { MAX_QUERY_LENGTH } from '@/lib/search/tokens';
import { apiError, json, parseSearchParams } from '@/server/http';
import { db } from '@/server/db';
import { findNamedMachine } from '@/server/search/context';
import { similarFixes } from '@/server/search/similar';

const querySchema = z.object({
  symptom: z.string({ error: 'Say what the fault looks like.' }).trim().min(1, 'Say what the fault looks like.').max(MAX_QUERY_LENGTH),
  machine: slugSchema,
});

export const GET: APIRoute = async ({ url }) => {
  const params = parseSearchParams(querySchema, url);
  if (!params.ok) return params.response;
  const machine = await findNamedMachine(db(), params.data.machine);
  if (!machine) return apiError('not_found', `No machine "${params.data.machine}" in the catalogue.`);
  const items = await similarFixes(db(), params.data.symptom, machine);
  return json({ machine: machine.named, items }, { cache: 'private' });
};
