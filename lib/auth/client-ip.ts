/**
 * The caller's address for throttling. X-Forwarded-For is trusted only when
 * TRUST_PROXY=1 (behind our own load balancer); otherwise the socket address
 * the custom server stamps into x-getterline-peer is used.
 */
export function clientIp(headers: { get(name: string): string | null }): string {
  if (process.env.TRUST_PROXY === "1") {
    const fwd = headers.get("x-forwarded-for");
    if (fwd) return fwd.split(",")[0]!.trim().slice(0, 64);
  }
  return (headers.get("x-getterline-peer") ?? "unknown").slice(0, 64);
}
