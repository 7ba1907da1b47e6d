import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

export type ApiError = { status: number; error: string; message: string; fieldErrors?: Record<string, string[]> };
export type ApiResult<T> = { ok: true; data: T } | { ok: false; error: ApiError };

/** Sends a JSON body (POST, PATCH or DELETE) to one of our route handlers and returns its error body instead of throwing. */
export async function sendJson<T = unknown>(url: string, method: 'POST' | 'PATCH' | 'DELETE', body?: unknown, headers?: Record<string, string>): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers: body === undefined ? headers : { 'content-type': 'application/json', ...headers },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    return { ok: false, error: { status: 0, error: 'network', message: 'Could not reach Scribeline. Check your connection and try again.' } };
  }
  if (res.status === 204) return { ok: true, data: undefined as T };
  const json = await res.json().catch(() => null);
  if (!res.ok) {
    return { ok: false, error: { status: res.status, error: json?.error ?? 'unknown', message: json?.message ?? `The server answered ${res.status}.`, fieldErrors: json?.fieldErrors } };
  }
  return { ok: true, data: json as T };
}

/** For TanStack Query: throws the API's message so the UI can show it. */
export async function getJson<T>(url: string): Promise<T> {
  const res = await fetch(url, { headers: { accept: 'application/json' } });
  const json = await res.json().catch(() => null);
  if (!res.ok) throw new Error(json?.message ?? `The server answered ${res.status}.`);
  return json as T;
}

/** Puts the server's per-field messages beside the matching fields. */
export function applyServerErrors<T extends FieldValues>(error: ApiError, setError: UseFormSetError<T>): void {
  for (const [field, messages] of Object.entries(error.fieldErrors ?? {})) {
    if (field !== '_' && messages[0]) setError(field as Path<T>, { type: 'server', message: messages[0] });
  }
}
