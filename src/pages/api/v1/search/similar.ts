// GET /api/v1/search/similar: live fixes that look like a symptom being written up, so no duplicate is started.
/*
  Query: symptom (1–200 characters, required), and exactly one of machine (slug) or chassis (slug of a
  chassis family, for a fix written for the whole family).
  200 → {
    machine: { slug: string, label: string, chassis: { slug: string, name: string } | null } | null,
    chassis: { slug: string, name: string } | null,   // the family asked about (null when a machine was)
    items: [{
      slug: string,            // link as /fixes/<slug>
      title: string,
      symptoms: string[],
      machines: string[],      // "Maker MODEL (REGION)" labels the fix names
      sameMachine: boolean,    // false: it comes from the machine's chassis family (always false for chassis)
      likeness: number,        // 0..1, at least 0.5; best first
      benchScore: { score: number | null, reports: number }   // never show the score without reports
    }]                         // at most 5; empty when nothing looks the same
  }
  400 bad_request (with fields) for missing or bad parameters; 404 not_found for an unknown machine or family.
*/
import type { APIRoute } from 'astro';
import { similarQuerySchema as querySchema } from '@/server/openapi/inputs';
import { parseSearchParams, respond } from '@/server/http/result';
import { apiError, json } from '@/server/http/responses';
import { db } from '@/server/core/db';
import { findNamedChassis, findNamedMachine } from '@/server/search/context';
import { similarFixes } from '@/server/search/similar';

export const GET: APIRoute = async ({ url }) => {
  const params = parseSearchParams(querySchema, url);
  if (!params.ok) return respond(params);
  const { symptom, machine: machineSlug, chassis: chassisSlug } = params.value;
  if (machineSlug !== undefined) {
    const machine = await findNamedMachine(db(), machineSlug);
    if (!machine) return apiError('not_found', `No machine "${machineSlug}" in the catalogue.`);
    return json({ machine: machine.named, chassis: null, items: await similarFixes(db(), symptom, machine) }, { cache: 'private' });
  }
  const family = chassisSlug === undefined ? null : await findNamedChassis(db(), chassisSlug);
  if (!family) return apiError('not_found', `No chassis family "${chassisSlug}" in the catalogue.`);
  return json({ machine: null, chassis: family.family, items: await similarFixes(db(), symptom, family) }, { cache: 'private' });
};
