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

/**
 * What a call may send: a JSON value (`json`), or a body of its own (`body`): FormData (the browser sets the
 * multipart boundary), a Blob, or text with its `contentType` (text/plain unless given).
 */
export type ApiFetchInit = {
  method?: string;
  json?: unknown;
  body?: FormData | Blob | string;
  contentType?: string;
  signal?: AbortSignal;
};

/** Build fetch's init from ours: the method defaults to POST whenever something is sent. */
export function requestInit(init: ApiFetchInit): RequestInit {
  const sending = init.json !== undefined || init.body !== undefined;
  const headers: Record<string, string> = {};
  let body: BodyInit | undefined;
  if (init.json !== undefined) {
    headers["content-type"] = "application/json";
    body = JSON.stringify(init.json);
  } else if (typeof init.body === "string") {
    headers["content-type"] = init.contentType ?? "text/plain";
    body = init.body;
  } else if (init.body !== undefined) {
    if (init.contentType) headers["content-type"] = init.contentType;
    body = init.body;
  }
  return {
    method: init.method ?? (sending ? "POST" : "GET"),
    headers: Object.keys(headers).length ? headers : undefined,
    body,
    credentials: "same-origin",
    signal: init.signal,
  };
}

/** Call one of our API routes; a failure is thrown as ApiClientError with the route's code, message and fields. */
export async function apiFetch<T>(path: string, init: ApiFetchInit = {}): Promise<T> {
  const res = await fetch(path, requestInit(init));
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
