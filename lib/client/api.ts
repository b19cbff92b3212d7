'use client';

export interface ApiError {
  status: number;
  code: string;
  message: string;
  fields?: Record<string, string>;
}

export type ApiResult<T> = { ok: true; data: T } | { ok: false; error: ApiError };

/**
 * Calls a route handler and returns data or the one error shape; a network failure becomes status 0. The body
 * goes as JSON, or `raw` as it is with its content type (e.g. a CSV import).
 */
export async function apiFetch<T>(path: string, init?: { method?: string; body?: unknown; raw?: { body: string; contentType: string } }): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(path, {
      method: init?.method ?? 'GET',
      headers: init?.raw ? { 'content-type': init.raw.contentType } : init?.body !== undefined ? { 'content-type': 'application/json' } : undefined,
      body: init?.raw ? init.raw.body : init?.body !== undefined ? JSON.stringify(init.body) : undefined,
      credentials: 'same-origin',
    });
  } catch {
    return { ok: false, error: { status: 0, code: 'offline', message: '' } };
  }
  if (res.status === 204) return { ok: true, data: undefined as T };
  const body = (await res.json().catch(() => null)) as unknown;
  if (res.ok) return { ok: true, data: body as T };
  const err = (body as { error?: Omit<ApiError, 'status'> } | null)?.error;
  return { ok: false, error: { status: res.status, code: err?.code ?? 'unknown', message: err?.message ?? res.statusText, fields: err?.fields } };
}
