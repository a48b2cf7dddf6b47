// /api/auth/* — next-auth (sign-in, sign-out, session, CSRF), with sign-in throttling in front.
import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { errorResponse } from "@/lib/api/route";
import { clientIp } from "@/lib/auth/client-ip";
import { authOptions } from "@/lib/auth/options";
import { assertNotThrottled } from "@/lib/services/accounts";

type Ctx = { params: Promise<{ nextauth: string[] }> };

const handler = (req: NextRequest, ctx: Ctx) => NextAuth(req as never, ctx as never, authOptions());

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  if (req.nextUrl.pathname.endsWith("/callback/credentials")) {
    try {
      const form = await req.clone().formData();
      await assertNotThrottled(String(form.get("email") ?? ""), clientIp(req.headers));
    } catch (e) {
      return errorResponse(e);
    }
  }
  return handler(req, ctx);
}
