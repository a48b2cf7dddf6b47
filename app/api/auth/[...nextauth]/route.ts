// /api/auth/* — next-auth (sign-in, sign-out, session, CSRF), with sign-in throttling in front.
import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { errorResponse } from "@/lib/api/route";
import { ApiError } from "@/lib/api/errors";
import { clientIp } from "@/lib/auth/client-ip";
import { authOptions } from "@/lib/auth/options";
import { SIGN_IN_WINDOW_MS, throttleDecision } from "@/lib/auth/rate-limit";
import { db, SignInAttempt } from "@/models";

type Ctx = { params: Promise<{ nextauth: string[] }> };

const handler = (req: NextRequest, ctx: Ctx) => NextAuth(req as never, ctx as never, authOptions());

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  if (req.nextUrl.pathname.endsWith("/callback/credentials")) {
    try {
      const form = await req.clone().formData();
      const email = String(form.get("email") ?? "").trim().toLowerCase().slice(0, 254);
      db();
      const since = new Date(Date.now() - SIGN_IN_WINDOW_MS);
      const d = throttleDecision(await SignInAttempt.recentFailures(email, clientIp(req.headers), since));
      if (!d.allowed) {
        throw new ApiError(
          "rate_limited",
          `Too many failed sign-in attempts for this ${d.scope}. Wait about ${Math.ceil(d.retryAfterSeconds / 60)} minutes, or reset your password.`,
          undefined,
          { "Retry-After": String(d.retryAfterSeconds) },
        );
      }
    } catch (e) {
      return errorResponse(e);
    }
  }
  return handler(req, ctx);
}
