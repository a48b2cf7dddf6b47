/**
 * Cross-site request refusal for cookie-authenticated writes. A browser sends
 * Origin on every cross-origin POST and Sec-Fetch-Site on modern engines;
 * either naming another site is refused. Requests with neither (curl, server
 * to server) carry no ambient browser cookies worth forging, and pass.
 */
export function isCrossSite(
  method: string,
  headers: { get(name: string): string | null },
  allowedOrigins: readonly string[],
): boolean {
  if (["GET", "HEAD", "OPTIONS"].includes(method.toUpperCase())) return false;
  const origin = headers.get("origin");
  if (origin && origin !== "null") return !allowedOrigins.includes(origin);
  if (origin === "null") return true;
  const site = headers.get("sec-fetch-site");
  return site === "cross-site";
}

/** Origins a request may come from: its own host plus the configured ones. */
export function allowedOriginsFor(host: string | null, configured: string[], proto = "http"): string[] {
  const list = new Set(configured.filter(Boolean).map((o) => o.replace(/\/$/, "")));
  if (host) {
    list.add(`${proto}://${host}`);
    list.add(`https://${host}`);
  }
  return [...list];
}

/**
 * The socket.io handshake's rule, the same as for cookie-authenticated writes: a browser always sends Origin on
 * a WebSocket or cross-origin request, so another site's (or an opaque "null") origin is refused; a client with
 * no Origin at all (a server, a test) carries no ambient browser cookie and passes.
 */
export function handshakeOriginAllowed(
  origin: string | undefined,
  host: string | undefined,
  configured: string[],
): boolean {
  if (origin === undefined || origin === "") return true;
  if (origin === "null") return false;
  return allowedOriginsFor(host ?? null, configured).includes(origin);
}
