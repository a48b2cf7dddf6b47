// Every page request: remember the page asked for, so a guard that sends a signed-out visitor to sign in can return them to it.
import { NextResponse, type NextRequest } from "next/server";

export const PATH_HEADER = "x-getterline-path";

export function proxy(request: NextRequest) {
  const headers = new Headers(request.headers);
  headers.set(PATH_HEADER, `${request.nextUrl.pathname}${request.nextUrl.search}`.slice(0, 500));
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ["/((?!api/|_next/|socket\\.io|favicon\\.ico|fonts/).*)"],
};
