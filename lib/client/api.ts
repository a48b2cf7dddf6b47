/**
 * Browser-side calls to our API routes. Failures arrive in the one error
 * shape and are thrown as ApiClientError, so forms can show field messages.
 */
export class ApiClientError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export async function apiFetch<T>(
  path: string,
  init: { method?: string; json?: unknown; signal?: AbortSignal } = {},
): Promise<T> {
  const res = await fetch(path, {
    method: init.method ?? (init.json === undefined ? "GET" : "POST"),
    headers: init.json === undefined ? undefined : { "content-type": "application/json" },
    body: init.json === undefined ? undefined : JSON.stringify(init.json),
    credentials: "same-origin",
    signal: init.signal,
  });
  const body = await res.json().catch(() => null);
  if (!res.ok) {
    const err = body?.error;
    throw new ApiClientError(
      res.status,
      err?.code ?? "unknown",
      err?.message ?? `Request failed (${res.status})`,
      err?.fields,
      err?.details,
    );
  }
  return body as T;
}
