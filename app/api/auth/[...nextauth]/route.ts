// /api/auth/* — next-auth (sign-in, sign-out, session, CSRF), with sign-in throttling in front.
import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { ApiError } from "@/lib/api/errors";
import { errorResponse } from "@/lib/api/route";
import { clientIp } from "@/lib/auth/client-ip";
import { credentialsForm } from "@/lib/auth/credentials-body";
import { authOptions } from "@/lib/auth/options";
import { assertNotThrottled } from "@/lib/services/accounts";

type Ctx = { params: Promise<{ nextauth: string[] }> };

const handler = (req: NextRequest, ctx: Ctx) => NextAuth(req as never, ctx as never, authOptions());

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  try {
    if (req.nextUrl.pathname.endsWith("/callback/credentials")) {
      const form = credentialsForm(req.headers.get("content-type"), await req.clone().text());
      await assertNotThrottled(form.email, clientIp(req.headers));
    } else if ((req.headers.get("content-type") ?? "").includes("application/json")) {
      // next-auth parses a JSON body unguarded: a malformed one would be a 500.
      await req
        .clone()
        .json()
        .catch(() => {
          throw new ApiError("bad_request", "The body is not valid JSON");
        });
    }
  } catch (e) {
    return errorResponse(e);
  }
  return handler(req, ctx);
}
