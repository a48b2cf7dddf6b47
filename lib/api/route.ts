import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { viewerFromRequest, assertCan, type Viewer } from "../auth/guards";
import { allowedOriginsFor, isCrossSite } from "../auth/origin";
import type { Permission } from "../auth/roles";
import { env } from "../config/env";
import { ApiError, fieldsFromIssues } from "./errors";

/** What a handler receives: a guarded route always has its viewer; a public one may have none. */
type Ctx<P, V extends Viewer | null> = { req: NextRequest; params: P; viewer: V };
type GuardedOptions = {
  /** Required permission; omitted = any signed-in person. */
  permission?: Permission;
  public?: false;
};
type PublicOptions = {
  /** No sign-in needed; the viewer is given when someone is signed in. */
  public: true;
  permission?: undefined;
};
type RouteOptions = GuardedOptions | PublicOptions;
type Handler<P> = (req: NextRequest, context: { params: Promise<P> }) => Promise<Response>;

/** Build the error response of the one error shape. Unknown errors leak nothing. */
export function errorResponse(e: unknown): NextResponse {
  if (e instanceof ApiError) return NextResponse.json(e.toBody(), { status: e.status, headers: e.headers });
  console.error("[api] unexpected error", e);
  return NextResponse.json(
    { error: { code: "internal", message: "Something went wrong on our side" } },
    { status: 500 },
  );
}

/**
 * Wrap a route handler: cross-site refusal for writes, sign-in and role check
 * through the one guard module, and the one error shape for anything thrown.
 */
export function route<P = Record<string, string>>(
  opts: PublicOptions,
  handler: (ctx: Ctx<P, Viewer | null>) => Promise<Response | unknown>,
): Handler<P>;
export function route<P = Record<string, string>>(
  opts: GuardedOptions,
  handler: (ctx: Ctx<P, Viewer>) => Promise<Response | unknown>,
): Handler<P>;
export function route<P = Record<string, string>>(
  opts: RouteOptions,
  handler: (ctx: Ctx<P, Viewer>) => Promise<Response | unknown>,
): Handler<P> {
  return async (req, context) => {
    try {
      const configured = env()
        .TRUSTED_ORIGINS.split(",")
        .map((s) => s.trim());
      configured.push(new URL(env().NEXTAUTH_URL).origin);
      if (isCrossSite(req.method, req.headers, allowedOriginsFor(req.headers.get("host"), configured))) {
        throw new ApiError("cross_site", "Cross-site requests are refused");
      }
      const viewer = opts.public
        ? await viewerFromRequest(req).catch(() => null)
        : assertCan(await viewerFromRequest(req), opts.permission);
      const params = (await context?.params) ?? ({} as P);
      // The overloads tie a null viewer to `public: true` only; the implementation sees both.
      const out = await (handler as (ctx: Ctx<P, Viewer | null>) => Promise<unknown>)({ req, params, viewer });
      return out instanceof Response ? out : NextResponse.json(out);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

/**
 * Read a body of one of the given media types: 415 for any other type, 413 over `maxBytes` (checked on the
 * declared length before reading, and on the bytes read).
 */
async function readBody(req: NextRequest, types: readonly string[], what: string, maxBytes: number): Promise<string> {
  const type = (req.headers.get("content-type") ?? "").toLowerCase();
  if (!types.some((t) => type.startsWith(t))) throw new ApiError("unsupported_media_type", `Send the body as ${what}`);
  const tooLarge = () => new ApiError("payload_too_large", `The body is larger than ${maxBytes} bytes`);
  if (Number(req.headers.get("content-length") ?? "0") > maxBytes) throw tooLarge();
  const text = await req.text();
  if (Buffer.byteLength(text) > maxBytes) throw tooLarge();
  return text;
}

/** Read and validate a JSON body: 415 for the wrong type, 413 over `maxBytes`, 400 otherwise. */
export async function readJson<S extends z.ZodType>(
  req: NextRequest,
  schema: S,
  maxBytes = 64 * 1024,
): Promise<z.infer<S>> {
  const text = await readBody(req, ["application/json"], "application/json", maxBytes);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new ApiError("bad_request", "The body is not valid JSON");
  }
  return parseWith(schema, raw);
}

/**
 * Read a text body (a CSV file, say): 415 unless its type is one of `types` (text/plain by default), 413 over
 * `maxBytes`. What the text means is checked by its own reader.
 */
export async function readText(
  req: NextRequest,
  opts: { types?: readonly string[]; maxBytes?: number } = {},
): Promise<string> {
  const types = opts.types ?? ["text/plain"];
  return readBody(req, types, types.join(" or "), opts.maxBytes ?? 64 * 1024);
}

/** Validate route params; anything malformed is answered as "not found". */
export function parseParams<S extends z.ZodType>(schema: S, raw: unknown): z.infer<S> {
  const r = schema.safeParse(raw);
  if (!r.success) throw new ApiError("not_found", "Not found");
  return r.data;
}

/** Validate any input with its schema; 400 with per-field messages on failure. */
export function parseWith<S extends z.ZodType>(schema: S, raw: unknown): z.infer<S> {
  const r = schema.safeParse(raw);
  if (!r.success)
    throw new ApiError("validation_failed", "Some fields need attention", fieldsFromIssues(r.error.issues));
  return r.data;
}
