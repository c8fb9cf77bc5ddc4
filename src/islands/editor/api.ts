// The island's calls to /api/v1: JSON in and out, the one error shape read back, network failures told apart.
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import type { EditorRevisionData } from '../../lib/writing/editor-data';

export interface ApiFailure {
  status: number;
  code: string;
  message: string;
  fields: Record<string, string[]>;
  /** Everything else the server sent beside `error` (a 409 on submit carries both versions). */
  extra: Record<string, unknown>;
}

export type ApiResult<T> = { ok: true; data: T } | { ok: false; failure: ApiFailure };

const offline: ApiFailure = { status: 0, code: 'network', message: 'the server could not be reached (offline?)', fields: {}, extra: {} };

export async function callApi<T>(path: string, init: { method: string; body?: unknown; signal?: AbortSignal }): Promise<ApiResult<T>> {
  let response: Response;
  try {
    response = await fetch(path, {
      method: init.method,
      headers:
        init.body === undefined ? { Accept: 'application/json' } : { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
      ...(init.signal ? { signal: init.signal } : {}),
    });
  } catch {
    return { ok: false, failure: offline };
  }
  let data: unknown = null;
  try {
    data = await response.json();
  } catch {
    // A proxy's HTML error page, or an empty body.
  }
  if (response.ok) return { ok: true, data: data as T };
  const { error, ...extra } = (data ?? {}) as { error?: { code?: string; message?: string; fields?: Record<string, string[]> } };
  return {
    ok: false,
    failure: {
      status: response.status,
      code: error?.code ?? 'internal',
      message: error?.message ?? `the server answered ${response.status}`,
      fields: error?.fields ?? {},
      extra,
    },
  };
}

export interface SavedDraft {
  revision: EditorRevisionData;
  baseIsStale: boolean;
}

export function createDraftRequest(fixSlug: string | null, values: FixDraftInput): Promise<ApiResult<SavedDraft>> {
  return callApi('/api/v1/drafts', { method: 'POST', body: { fixSlug, values } });
}

export function saveDraftRequest(draftId: number, values: FixDraftInput, baseRevisionId?: number | null): Promise<ApiResult<SavedDraft>> {
  return callApi(`/api/v1/drafts/${draftId}`, {
    method: 'PUT',
    body: baseRevisionId === undefined ? { values } : { values, baseRevisionId },
  });
}

export function submitDraftRequest(draftId: number, values: FixDraftInput): Promise<ApiResult<{ revision: EditorRevisionData }>> {
  return callApi(`/api/v1/drafts/${draftId}/submit`, { method: 'POST', body: { values } });
}

/** Failures worth retrying by themselves: the network, the server's own errors, a rate limit. */
export function isTransient(failure: ApiFailure): boolean {
  return failure.status === 0 || failure.status >= 500 || failure.status === 429;
}
