// POST /api/v1/tools/substitute: can a candidate electrolytic replace the original? Each check with its reason.
import type { APIRoute } from 'astro';
import { checkSubstitute, substituteInputSchema } from '@/lib/bench/substitute';
import { json } from '@/server/http/responses';
import { schemaError, toolInputError } from '@/server/tools/api-errors';
import { readJsonBody } from '@/server/http/body';

const EXAMPLE =
  '{ "original": { "capacitanceF": 0.00047, "ratedVoltageV": 16, "temperatureC": 85 }, "candidate": { "capacitanceF": 0.00047, "ratedVoltageV": 25, "temperatureC": 105 }, "workingVoltageV": 12 }';

export const POST: APIRoute = async ({ request }) => {
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const parsed = substituteInputSchema.safeParse(body.value);
  if (!parsed.success) return schemaError(parsed.error, EXAMPLE);
  const result = checkSubstitute(parsed.data);
  if (!result.ok) return toolInputError('_', result.error);
  return json(result.value, { cache: 'private' });
};
