import { ApiError } from "../api/errors";

/**
 * The sign-in form's body as next-auth reads it (URL-encoded; next-auth v4 ignores multipart and a JSON body is
 * not what our form sends). Anything else, an empty body or one without the e-mail, password and CSRF fields is
 * a 400 in our error shape before next-auth sees it: it would otherwise throw and answer 500.
 */
export function credentialsForm(contentType: string | null, body: string): { email: string } {
  const type = (contentType ?? "").split(";")[0]!.trim().toLowerCase();
  if (type !== "application/x-www-form-urlencoded")
    throw new ApiError("bad_request", "Send the sign-in form as application/x-www-form-urlencoded");
  if (body.length > 8_192) throw new ApiError("payload_too_large", "The sign-in form is too large");
  const form = new URLSearchParams(body);
  const email = form.get("email");
  if (!email || !form.get("password") || !form.get("csrfToken"))
    throw new ApiError("bad_request", "The sign-in form needs the e-mail, the password and the form token");
  return { email };
}
