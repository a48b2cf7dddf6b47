// Every page request: remember the page asked for (so a guard that sends a signed-out visitor to sign in can
// return them to it), and set the page's Content-Security-Policy with a fresh nonce, as Next documents.
import { NextResponse, type NextRequest } from "next/server";
import { contentSecurityPolicy } from "./lib/auth/csp";

export const PATH_HEADER = "x-getterline-path";

export function proxy(request: NextRequest) {
  const nonce = Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = contentSecurityPolicy(nonce, process.env.NODE_ENV !== "production");
  const headers = new Headers(request.headers);
  headers.set(PATH_HEADER, `${request.nextUrl.pathname}${request.nextUrl.search}`.slice(0, 500));
  headers.set("x-nonce", nonce);
  headers.set("Content-Security-Policy", csp);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", csp);
  return response;
}

export const config = {
  matcher: ["/((?!api/|_next/|socket\\.io|favicon\\.ico|fonts/).*)"],
};
