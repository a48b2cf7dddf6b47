/**
 * The Content-Security-Policy of every page, with a fresh nonce per request (Next reads the nonce from this
 * header on the request and puts it on its own scripts). Scripts: only ours, with the nonce, and what they load
 * ('strict-dynamic'). Styles allow inline attributes (React's style props). Sockets, fetches, images and fonts
 * stay on our own origin; no plugins, no framing, forms post only to us. Development adds 'unsafe-eval' for
 * React's debugging tools.
 */
export function contentSecurityPolicy(nonce: string, dev = false): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}
