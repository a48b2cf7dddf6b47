import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import { decode } from "next-auth/jwt";
import { POST as authPost } from "../../app/api/auth/[...nextauth]/route";
import { authOptions } from "../../lib/auth/options";
import { viewerFromCookieHeader } from "../../lib/auth/guards";
import { confirmPasswordReset, requestPasswordReset } from "../../lib/services/accounts";
import { User } from "../../models";
import { makeUser, sessionCookie, waitForMail } from "../support/factories";

const ctx = (...parts: string[]) => ({ params: Promise.resolve({ nextauth: parts }) });
const BASE = "http://localhost:3000";

const post = (path: string, init: { body?: string; type?: string; cookie?: string } = {}) =>
  authPost(
    new NextRequest(`${BASE}/api/auth/${path}`, {
      method: "POST",
      body: init.body,
      headers: {
        host: "localhost:3000",
        ...(init.type ? { "content-type": init.type } : {}),
        ...(init.cookie ? { cookie: init.cookie } : {}),
      },
    }),
    ctx(...path.split("/")),
  );

describe("sessions can be revoked [SUG]", () => {
  it("a copied session token stops working once its owner signs out", async () => {
    const u = await makeUser(["dealer"]);
    const copied = await sessionCookie(u);
    expect((await viewerFromCookieHeader(copied))?.id).toBe(u.id);
    // What next-auth runs when the owner signs out (its route needs Next's request scope; the e2e sign-out
    // spec drives it for real): the token's account gets a new session version.
    const token = await decode({ token: copied.split("=")[1]!, secret: process.env.NEXTAUTH_SECRET! });
    await authOptions().events!.signOut!({ token: token!, session: undefined as never });
    expect(await viewerFromCookieHeader(copied)).toBeNull();
    // Signing in again issues a token under the new version, which works.
    await u.reload();
    expect(u.sessionVersion).toBe(1);
    expect((await viewerFromCookieHeader(await sessionCookie(u)))?.id).toBe(u.id);
  });

  it("a copied session token stops working after a password change", async () => {
    const u = await makeUser(["consignor"]);
    const copied = await sessionCookie(u);
    expect((await viewerFromCookieHeader(copied))?.id).toBe(u.id);
    await requestPasswordReset(u.email);
    const token = (await waitForMail(u.email)).text.match(/token=([\w-]+)/)![1]!;
    await confirmPasswordReset({ token, password: "a-fresh-long-password", confirm: "a-fresh-long-password" });
    expect(await viewerFromCookieHeader(copied)).toBeNull();
    expect((await User.findByPk(u.id))!.sessionVersion).toBe(1);
  });
});

describe("the credentials sign-in answers 400, not 500, to a body it cannot read", () => {
  const bad = async (r: Response) => {
    expect(r.status).toBe(400);
    const body = (await r.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("bad_request");
    expect(typeof body.error.message).toBe("string");
  };

  it("refuses a JSON body, a malformed multipart body and no body", async () => {
    await bad(await post("callback/credentials", { type: "application/json", body: '{"email":"a@b.test"}' }));
    await bad(
      await post("callback/credentials", {
        type: "multipart/form-data; boundary=----x",
        body: '------x\r\nContent-Disposition: form-data; name="email"\r\n\r\nbroken',
      }),
    );
    await bad(await post("callback/credentials"));
    await bad(await post("callback/credentials", { type: "application/x-www-form-urlencoded", body: "" }));
    await bad(await post("signout", { type: "application/json", body: "{not json" }));
  });
});
