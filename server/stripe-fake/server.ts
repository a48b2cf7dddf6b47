// The HTTP side of the local Stripe fake: API-key check, form decoding, Idempotency-Key replay, the route
// tables, atomic saves after every change, and webhook dispatch once the answer has gone out.
import { createHash, randomUUID, timingSafeEqual } from "node:crypto";
import http from "node:http";
import path from "node:path";
import { redactCardParams } from "./cards";
import type { Ctx, Route } from "./context";
import { FakeError, invalid, unrecognized } from "./errors";
import { API_VERSION, recordEvent } from "./events";
import { fromJson, parseForm, type ParamHash, type ParamValue } from "./form";
import { newId } from "./ids";
import { expand } from "./lists";
import { expandPaths } from "./params";
import { listenOn } from "./ports";
import { ROUTES } from "./routes";
import { Store, type State } from "./store";
import { TEST_ROUTES, type TestReply } from "./test-endpoints";
import { Dispatcher } from "./webhooks";

/** Options of startStripeFake. */
export type StripeFakeOptions = {
  /** Port on 127.0.0.1 (default 12111; 0 = any free port). */
  port?: number;
  /** Instead of `port`: the first free port of this range. */
  portRange?: [number, number];
  /** Where state.json lives (created when missing). */
  dataDir: string;
  /** Where events are POSTed (loopback only); null or "" records events without delivering them. */
  webhookUrl?: string | null;
  /** The whsec_… secret events are signed with. */
  webhookSecret: string;
  /** The only API key accepted; without it any sk_test_… key is. */
  apiKey?: string;
  /** Webhook retry schedule (defaults: 1 s doubling, at most 1 h apart, 8 attempts, 10 s timeout). */
  webhookRetry?: { baseMs?: number; maxMs?: number; maxAttempts?: number; timeoutMs?: number };
  /** One line per request and per delivery; silent by default. */
  log?: (line: string) => void;
};

/** A running fake. */
export type StripeFake = { url: string; port: number; close(): Promise<void> };

const MAX_BODY = 1024 * 1024;
const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
/** Keys the SDK makes up for its own retry of one request are kept 10 minutes, so the state file stays small. */
const SDK_KEY_PREFIX = "stripe-node-retry-";
const SDK_KEY_TTL_MS = 10 * 60 * 1000;
const LOOPBACK = new Set(["127.0.0.1", "localhost", "[::1]"]);

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on("data", (c: Buffer) => {
      size += c.length;
      if (size > MAX_BODY) {
        reject(new FakeError(413, { type: "invalid_request_error", message: "Request body too large." }));
        req.destroy();
        return;
      }
      chunks.push(c);
    });
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

function apiKeyOf(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value = ""] = header.trim().split(/\s+/, 2);
  if (/^bearer$/i.test(scheme)) return value || null;
  if (/^basic$/i.test(scheme)) return Buffer.from(value, "base64").toString("utf8").split(":")[0] || null;
  return null;
}

/** The key as Stripe echoes it: prefix and, for long keys only, the last four characters. */
function mask(key: string): string {
  const prefix = /^[a-z]{2}_(test|live)_/.exec(key)?.[0] ?? "";
  const tail = key.length >= 24 ? key.slice(-4) : "";
  return `${prefix}${"*".repeat(Math.max(4, key.length - prefix.length - tail.length))}${tail}`;
}

function sameKey(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

function canonical(v: ParamValue): unknown {
  if (Array.isArray(v)) return v.map(canonical);
  if (typeof v === "object") {
    return Object.fromEntries(
      Object.keys(v)
        .sort()
        .map((k) => [k, canonical(v[k])]),
    );
  }
  return v;
}

function fingerprint(params: ParamHash): string {
  return createHash("sha256")
    .update(JSON.stringify(canonical(redactCardParams(params))))
    .digest("hex");
}

function header(req: http.IncomingMessage, name: string): string | null {
  const v = req.headers[name];
  return (Array.isArray(v) ? v[0] : v) ?? null;
}

function paramsOf(req: http.IncomingMessage, url: URL, body: string, allowJson: boolean): ParamHash {
  if (req.method !== "POST") return parseForm(url.search.slice(1));
  const type = header(req, "content-type") ?? "";
  if (/^application\/json/i.test(type)) {
    if (!allowJson)
      throw invalid("This endpoint takes application/x-www-form-urlencoded bodies, as Stripe's v1 API does.");
    try {
      return body ? fromJson(JSON.parse(body)) : {};
    } catch (e) {
      if (e instanceof FakeError) throw e;
      throw invalid("Invalid JSON body.");
    }
  }
  return parseForm(body);
}

/** Starts the fake; resolves once it listens. */
export async function startStripeFake(opts: StripeFakeOptions): Promise<StripeFake> {
  if (!opts.webhookSecret || !opts.webhookSecret.trim()) throw new Error("stripe-fake: webhookSecret is required");
  const webhookUrl = opts.webhookUrl ? opts.webhookUrl : null;
  if (webhookUrl) {
    const u = new URL(webhookUrl);
    if (!LOOPBACK.has(u.hostname))
      throw new Error(`stripe-fake: the webhook URL must point at this machine (127.0.0.1), not ${u.hostname}`);
  }
  const log = opts.log ?? (() => {});
  const store = new Store(path.resolve(opts.dataDir));
  const retry = opts.webhookRetry ?? {};
  const webhooks = new Dispatcher(
    store,
    {
      url: webhookUrl,
      secret: opts.webhookSecret,
      retryBaseMs: retry.baseMs ?? 1000,
      retryMaxMs: retry.maxMs ?? 60 * 60 * 1000,
      maxAttempts: retry.maxAttempts ?? 8,
      timeoutMs: retry.timeoutMs ?? 10_000,
    },
    log,
  );
  let baseUrl = "";

  function makeCtx(
    params: ParamHash,
    requestId: string | null,
    idempotencyKey: string | null,
    stripeAccount: string | null,
  ): Ctx {
    const ctx: Ctx = {
      state: store.state,
      now: Math.floor(Date.now() / 1000),
      params,
      baseUrl,
      requestId,
      idempotencyKey,
      stripeAccount,
      emit: (type, object) => {
        recordEvent(ctx.state, {
          type,
          object,
          created: ctx.now,
          requestId,
          idempotencyKey,
          deliver: webhooks.enabled,
        });
      },
    };
    return ctx;
  }

  /** Runs `work` against the state; on an error that is not kept, puts the state back as it was. */
  function transact<T>(writes: boolean, work: () => T): T {
    if (!writes) return work();
    const before: State = structuredClone(store.state);
    try {
      const out = work();
      store.save();
      return out;
    } catch (e) {
      store.state = before;
      throw e;
    }
  }

  function send(res: http.ServerResponse, status: number, json: string, extra: Record<string, string> = {}): void {
    res.writeHead(status, { "content-type": "application/json", "cache-control": "no-cache, no-store", ...extra });
    res.end(json);
  }

  function v1(req: http.IncomingMessage, res: http.ServerResponse, url: URL, body: string, requestId: string): number {
    const method = req.method ?? "GET";
    const key = apiKeyOf(header(req, "authorization") ?? undefined);
    if (!key) {
      throw new FakeError(401, {
        type: "invalid_request_error",
        message:
          "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
      });
    }
    if (opts.apiKey ? !sameKey(key, opts.apiKey) : !key.startsWith("sk_test_")) {
      throw new FakeError(401, { type: "invalid_request_error", message: `Invalid API Key provided: ${mask(key)}` });
    }
    let route: Route | undefined;
    let ids: string[] = [];
    for (const r of ROUTES) {
      const m = r.method === method ? r.pattern.exec(url.pathname) : null;
      if (m) {
        route = r;
        ids = m.slice(1);
        break;
      }
    }
    if (!route) throw unrecognized(method, url.pathname);
    const params = paramsOf(req, url, body, false);
    const stripeAccount = header(req, "stripe-account");
    if (stripeAccount && !route.account)
      throw invalid("This local fake honours the Stripe-Account header only on GET /v1/balance.");
    const writes = method === "POST";
    const idemKey = writes ? header(req, "idempotency-key") : null;
    const base = {
      "request-id": requestId,
      "stripe-version": API_VERSION,
      ...(idemKey ? { "idempotency-key": idemKey } : {}),
    };
    let fp = "";
    if (idemKey) {
      if (idemKey.length > 255)
        throw invalid("Idempotency keys can be at most 255 characters long.", "Idempotency-Key");
      fp = fingerprint(params);
      const stored = store.state.idempotency[idemKey];
      const ttl = idemKey.startsWith(SDK_KEY_PREFIX) ? SDK_KEY_TTL_MS : IDEMPOTENCY_TTL_MS;
      const seen = stored && Date.now() - stored.created <= ttl ? stored : undefined;
      if (seen) {
        const retry = `Try using a key other than '${idemKey}' if you meant to execute a different request.`;
        if (seen.method !== method || seen.path !== url.pathname) {
          throw new FakeError(400, {
            type: "idempotency_error",
            message: `Keys for idempotent requests can only be used for the same endpoint they were first used for ('${seen.method} ${seen.path}' vs '${method} ${url.pathname}'). ${retry}`,
          });
        }
        if (seen.fingerprint !== fp) {
          throw new FakeError(400, {
            type: "idempotency_error",
            message: `Keys for idempotent requests can only be used with the same parameters they were first used with. ${retry}`,
          });
        }
        send(res, seen.status, seen.body, { ...base, "idempotent-replayed": "true" });
        return seen.status;
      }
    }
    const ctx = makeCtx(params, requestId, idemKey, stripeAccount);
    const paths = expandPaths(params);
    const answer = transact(writes, () => {
      let status = 200;
      let json: string;
      try {
        const copy = structuredClone(route.handler(ctx, ...ids)) as Record<string, unknown>;
        expand(ctx.state, copy, paths);
        json = JSON.stringify(copy, null, 2);
      } catch (e) {
        if (!(e instanceof FakeError) || !e.keepChanges) throw e;
        status = e.status; // the work was done (a decline): keep it, answer the error, remember it for replays
        json = JSON.stringify({ error: e.body }, null, 2);
      }
      if (idemKey) {
        const now = Date.now();
        for (const [k, rec] of Object.entries(ctx.state.idempotency)) {
          const ttl = k.startsWith(SDK_KEY_PREFIX) ? SDK_KEY_TTL_MS : IDEMPOTENCY_TTL_MS;
          if (now - rec.created > ttl) delete ctx.state.idempotency[k];
        }
        ctx.state.idempotency[idemKey] = {
          method,
          path: url.pathname,
          fingerprint: fp,
          status,
          body: json,
          created: now,
        };
      }
      return { status, json };
    });
    send(res, answer.status, answer.json, base);
    return answer.status;
  }

  function testEndpoint(req: http.IncomingMessage, res: http.ServerResponse, url: URL, body: string): number {
    const method = req.method ?? "GET";
    for (const r of TEST_ROUTES) {
      const m = r.method === method ? r.pattern.exec(url.pathname) : null;
      if (!m) continue;
      const params = paramsOf(req, url, body, true);
      const ctx = makeCtx(params, null, null, null);
      const reply: TestReply = transact(r.writes, () => r.handler(ctx, webhooks, ...m.slice(1)));
      if (reply.location) {
        res.writeHead(reply.status, { location: reply.location, "cache-control": "no-store" });
        res.end();
      } else if (reply.html !== undefined) {
        res.writeHead(reply.status, { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" });
        res.end(reply.html);
      } else {
        send(res, reply.status, JSON.stringify(reply.json, null, 2));
      }
      return reply.status;
    }
    throw unrecognized(method, url.pathname);
  }

  async function handle(req: http.IncomingMessage, res: http.ServerResponse): Promise<void> {
    const requestId = newId("req").slice(0, 18);
    const method = req.method ?? "GET";
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    let status = 500;
    if (method === "POST") res.on("finish", () => webhooks.kick());
    try {
      const body = await readBody(req);
      if (url.pathname.startsWith("/_fake/")) status = testEndpoint(req, res, url, body);
      else if (url.pathname.startsWith("/v1/")) status = v1(req, res, url, body, requestId);
      else throw unrecognized(method, url.pathname);
    } catch (e) {
      if (e instanceof FakeError) {
        status = e.status;
        if (!res.headersSent)
          send(res, e.status, JSON.stringify({ error: e.body }, null, 2), {
            "request-id": requestId,
            "stripe-version": API_VERSION,
          });
      } else {
        const ref = randomUUID();
        log(`error ${ref} on ${method} ${url.pathname}: ${(e as Error).stack ?? e}`);
        if (!res.headersSent) {
          send(
            res,
            500,
            JSON.stringify({
              error: { type: "api_error", message: `The local Stripe fake failed (${ref}); see its log.` },
            }),
            {
              "request-id": requestId,
            },
          );
        }
      }
    }
    log(`${method} ${url.pathname} ${status}`);
  }

  const server = http.createServer((req, res) => void handle(req, res));
  server.keepAliveTimeout = 65_000; // longer than the SDK's idle keep-alive, so sockets are rarely cut under it
  let port: number;
  try {
    port = await listenOn(server, "127.0.0.1", opts.portRange ?? opts.port ?? 12111);
  } catch (e) {
    store.unlock();
    throw e;
  }
  baseUrl = `http://127.0.0.1:${port}`;
  webhooks.kick();
  let closing: Promise<void> | null = null;
  return {
    url: baseUrl,
    port,
    close() {
      closing ??= (async () => {
        await webhooks.close();
        await new Promise<void>((resolve) => {
          server.close(() => resolve());
          server.closeAllConnections();
        });
        store.unlock();
      })();
      return closing;
    },
  };
}
