/**
 * The one error shape of every API route:
 *   { "error": { "code": "...", "message": "...", "fields"?: { name: message } } }
 * Routes and services throw ApiError; the route wrapper turns it into a response.
 */
export const ERROR_STATUS = {
  bad_request: 400,
  validation_failed: 400,
  unauthenticated: 401,
  invalid_credentials: 401,
  forbidden: 403,
  cross_site: 403,
  not_found: 404,
  method_not_allowed: 405,
  conflict: 409,
  gone: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

/** `details` carries machine-readable extras, e.g. { candidates: [...] } on a 404 for an unknown type. */
export type ErrorBody = {
  error: { code: ErrorCode; message: string; fields?: Record<string, string>; details?: Record<string, unknown> };
};

export class ApiError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "ApiError";
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }

  toBody(): ErrorBody {
    return {
      error: {
        code: this.code,
        message: this.message,
        ...(this.fields ? { fields: this.fields } : {}),
        ...(this.details ? { details: this.details } : {}),
      },
    };
  }
}

/** Turn a zod error's issues into { "field.path": "message" } (first message per field). */
export function fieldsFromIssues(
  issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }>,
): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const i of issues) {
    const key = i.path.map(String).join(".") || "_";
    if (!(key in fields)) fields[key] = i.message;
  }
  return fields;
}
