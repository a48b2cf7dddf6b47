/**
 * Where to go after signing in: a same-origin path only (an absolute URL, a
 * protocol-relative "//host" or a backslash trick is refused), never the
 * sign-in pages themselves. Pure, shared by the proxy, the page and the form.
 */
export function safeCallbackPath(raw: string | null | undefined): string | null {
  if (!raw || raw.length > 500) return null;
  const path = raw;
  if (!path.startsWith("/") || path.startsWith("//") || path.includes("\\") || /[\u0000-\u001f]/.test(path))
    return null;
  if (/^\/(sign-in|sign-up|forgot-password|reset-password|confirm-email|api\/)/.test(path)) return null;
  return path;
}

/** The sign-in address that returns to `path` afterwards. */
export function signInHref(path: string | null | undefined): string {
  const safe = safeCallbackPath(path);
  return safe ? `/sign-in?callbackUrl=${encodeURIComponent(safe)}` : "/sign-in";
}
