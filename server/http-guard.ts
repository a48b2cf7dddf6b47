import type http from "node:http";

/** Browser features the exchange never uses, turned off on every answer. */
export const PERMISSIONS_POLICY =
  "camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), hid=(), midi=(), " +
  "magnetometer=(), gyroscope=(), accelerometer=(), display-capture=(), browsing-topics=(), interest-cohort=()";

const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?next-auth\.session-token(?:\.\d+)?=/;

function sendError(res: http.ServerResponse, status: number, code: string, message: string): void {
  const body = JSON.stringify({ error: { code, message } });
  res.writeHead(status, {
    "content-type": "application/json",
    "content-length": Buffer.byteLength(body),
    "cache-control": "no-store",
  });
  res.end(body);
}

/** Every segment of the path decodes (a malformed %-escape is the framework's plain-text 500 otherwise). */
export function pathDecodes(url: string): boolean {
  const path = url.split(/[?#]/, 1)[0]!;
  try {
    for (const seg of path.split("/")) decodeURIComponent(seg);
    return true;
  } catch {
    return false;
  }
}

/**
 * What the custom server does to every request before Next sees it: answers a path that does not decode with
 * 400 in the API's error shape; sets Permissions-Policy on every answer and `Cache-Control: private, no-store`
 * on API answers to a signed-in browser (a route may still set its own); and turns the framework's empty-bodied
 * 405 for an unsupported method on an API route into the error shape. Returns false when it has answered.
 */
export function guardRequest(req: http.IncomingMessage, res: http.ServerResponse): boolean {
  res.setHeader("Permissions-Policy", PERMISSIONS_POLICY);
  const url = req.url ?? "/";
  if (!pathDecodes(url)) {
    sendError(res, 400, "bad_request", "The address is not valid");
    return false;
  }
  if (url.startsWith("/api/")) {
    if (SESSION_COOKIE.test(req.headers.cookie ?? "")) res.setHeader("Cache-Control", "private, no-store");
    shapeMethodNotAllowed(req, res);
  }
  return true;
}

/** Replace the body of an empty 405 with the error shape, keeping the framework's Allow header. */
function shapeMethodNotAllowed(req: http.IncomingMessage, res: http.ServerResponse): void {
  // The framework streams even an empty body and flushes the headers first: hold them back for a 405.
  const flush = res.flushHeaders.bind(res);
  res.flushHeaders = () => {
    if (res.statusCode !== 405) flush();
  };
  const write = res.write.bind(res) as (...a: unknown[]) => boolean;
  res.write = ((...args: unknown[]) => {
    const n = (args[0] as { length?: number } | undefined)?.length;
    if (res.statusCode === 405 && !res.headersSent && n === 0) return true;
    return write(...args);
  }) as typeof res.write;
  // Next's compression layer sends the headers itself (through writeHead) before it ends the body, so the
  // content type is set as the headers go out, and the body is added even when they have already gone.
  const writeHead = res.writeHead.bind(res) as (...a: unknown[]) => http.ServerResponse;
  res.writeHead = ((...args: unknown[]) => {
    if (args[0] === 405) res.setHeader("content-type", "application/json");
    return writeHead(...args);
  }) as typeof res.writeHead;
  const end = res.end.bind(res) as (...a: unknown[]) => http.ServerResponse;
  res.end = ((...args: unknown[]) => {
    const chunk = typeof args[0] === "function" ? undefined : args[0];
    const empty = chunk === undefined || chunk === null || (chunk as { length?: number }).length === 0;
    if (res.statusCode === 405 && empty) {
      const body = JSON.stringify({
        error: { code: "method_not_allowed", message: `${req.method ?? "This method"} is not supported here` },
      });
      if (!res.headersSent) {
        res.setHeader("content-type", "application/json");
        res.setHeader("content-length", Buffer.byteLength(body));
      }
      return end(body);
    }
    return end(...args);
  }) as typeof res.end;
}
