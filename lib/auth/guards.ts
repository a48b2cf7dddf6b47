import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import { redirect } from "next/navigation";
import type { NextRequest } from "next/server";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { currentRoles } from "../services/accounts";
import { safeCallbackPath, signInHref } from "./callback";
import { authOptions } from "./options";
import { can, type Permission, type Role } from "./roles";

/** The signed-in person as every guard sees it, roles fresh from the database. */
export type Viewer = { id: string; email: string; name: string; roles: Role[] };

type TokenLike = { uid?: string; sv?: number; email?: string | null; name?: string | null } | null;

/** The token's account with fresh roles, or null when it is gone, disabled or the session was revoked. */
async function viewerFromToken(token: TokenLike): Promise<Viewer | null> {
  if (!token?.uid) return null;
  const roles = await currentRoles(token.uid, token.sv ?? 0);
  if (!roles) return null;
  return { id: token.uid, email: token.email ?? "", name: token.name ?? "", roles };
}

/** Throws 401/403 in the error shape unless the viewer exists and holds the permission. */
export function assertCan(viewer: Viewer | null, permission?: Permission): Viewer {
  if (!viewer) throw new ApiError("unauthenticated", "Sign in first");
  if (permission && !can(viewer.roles, permission)) {
    throw new ApiError("forbidden", "Your account's roles do not allow this");
  }
  return viewer;
}

/** For route handlers: the viewer from the request's session cookie. */
export async function viewerFromRequest(req: NextRequest): Promise<Viewer | null> {
  const token = await getToken({ req, secret: env().NEXTAUTH_SECRET });
  return viewerFromToken(token as TokenLike);
}

/** For the socket.io handshake: the viewer (and the token's session version) from a raw Cookie header. */
export async function viewerFromCookieHeader(
  cookieHeader: string | undefined,
): Promise<(Viewer & { sessionVersion: number }) | null> {
  const cookies: Record<string, string> = {};
  for (const part of (cookieHeader ?? "").split(";")) {
    const i = part.indexOf("=");
    if (i > 0) cookies[part.slice(0, i).trim()] = decodeURIComponent(part.slice(i + 1).trim());
  }
  const req = { headers: { cookie: cookieHeader ?? "" }, cookies } as unknown as NextRequest;
  const token = (await getToken({ req, secret: env().NEXTAUTH_SECRET })) as TokenLike;
  const viewer = await viewerFromToken(token);
  return viewer ? { ...viewer, sessionVersion: token?.sv ?? 0 } : null;
}

/** For server components and server actions. */
export async function currentViewer(): Promise<Viewer | null> {
  const session = await getServerSession(authOptions());
  if (!session?.user?.id) return null;
  return viewerFromToken({
    uid: session.user.id,
    sv: session.user.sv,
    email: session.user.email,
    name: session.user.name,
  });
}

/** For server actions: the viewer holding the permission, or an ApiError. */
export async function requireActionViewer(permission?: Permission): Promise<Viewer> {
  return assertCan(await currentViewer(), permission);
}

/** The page being rendered, as the root proxy (proxy.ts) recorded it; null outside a page request. */
export async function requestedPath(): Promise<string | null> {
  try {
    // Loaded lazily: the custom server (socket handshake) imports this module outside Next's request scope.
    const { headers } = await import("next/headers");
    return safeCallbackPath((await headers()).get("x-getterline-path"));
  } catch {
    return null;
  }
}

/**
 * For layouts and pages: redirect to sign-in, or to /forbidden, instead of
 * rendering. Sign-in returns to the page asked for (query included), else to `from`.
 */
export async function requirePageViewer(permission?: Permission, from?: string): Promise<Viewer> {
  const viewer = await currentViewer();
  if (!viewer) redirect(signInHref((await requestedPath()) ?? from));
  if (permission && !can(viewer.roles, permission)) redirect("/forbidden");
  return viewer;
}
