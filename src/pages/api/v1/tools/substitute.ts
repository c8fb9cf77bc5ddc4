// POST /api/v1/tools/substitute: can a candidate electrolytic replace the original? Each check with its reason.
import type { APIRoute } from 'astro';
import { checkSubstitute, substituteInputSchema } from '@/lib/bench/substitute';
import { json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { respond, inputRefusal, schemaRefusal } from '@/server/http/result';

const EXAMPLE =
  '{ "original": { "capacitanceF": 0.00047, "ratedVoltageV": 16, "temperatureC": 85 }, "candidate": { "capacitanceF": 0.00047, "ratedVoltageV": 25, "temperatureC": 105 }, "workingVoltageV": 12 }';

export const POST: APIRoute = async ({ request }) => {
  const read = await readBody(request, { json: 'tools' });
  if (!read.ok) return respond(read);
  const body = read.value;
  const parsed = substituteInputSchema.safeParse(body.data);
  if (!parsed.success) return respond(schemaRefusal(parsed.error, EXAMPLE));
  const result = checkSubstitute(parsed.data);
  if (!result.ok) return respond(inputRefusal('_', result.error));
  return json(result.value, { cache: 'private' });
};
