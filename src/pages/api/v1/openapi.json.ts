// GET /api/v1/openapi.json: the OpenAPI 3.1 document of this API, built from the schemas the endpoints parse with.
import type { APIRoute } from 'astro';
import { json } from '@/server/http/responses';
import { openApiDocument } from '@/server/openapi/document';

export const GET: APIRoute = () => json(openApiDocument(), { cache: 'public' });
