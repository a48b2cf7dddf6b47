import { describe, expect, it } from "vitest";
import { GET as adminUsers } from "../../app/api/admin/users/route";
import { PATCH as patchUser } from "../../app/api/admin/users/[id]/route";
import { GET as health } from "../../app/api/health/route";
import { POST as signUpRoute } from "../../app/api/account/sign-up/route";
import { makeUser, noParams, request, sessionCookie } from "../support/factories";

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

function expectErrorShape(body: unknown): asserts body is ErrorBody {
  const b = body as ErrorBody;
  expect(typeof b.error.code).toBe("string");
  expect(typeof b.error.message).toBe("string");
}

describe("API routes: one error shape, role checks, cross-site refusal", () => {
  it("opens an account (202) and answers bad input with 400 and field messages", async () => {
    const ok = await signUpRoute(
      request("/api/account/sign-up", {
        json: { displayName: "Northbank Test", email: "nb@example.test", password: "long-enough-pw", role: "dealer" },
      }),
      noParams,
    );
    expect(ok.status).toBe(202);
    const bad = await signUpRoute(
      request("/api/account/sign-up", { json: { email: "not-mail", role: "admin" } }),
      noParams,
    );
    expect(bad.status).toBe(400);
    const body = await bad.json();
    expectErrorShape(body);
    expect(body.error.code).toBe("validation_failed");
    expect(Object.keys(body.error.fields!)).toEqual(
      expect.arrayContaining(["email", "role", "password", "displayName"]),
    );
  });

  it("answers a sign-up for a known address exactly as for a new one [SUG]", async () => {
    const json = { displayName: "Echo Test", email: "echo@example.test", password: "long-enough-pw", role: "dealer" };
    const first = await signUpRoute(request("/api/account/sign-up", { json }), noParams);
    const second = await signUpRoute(
      request("/api/account/sign-up", { json: { ...json, displayName: "Someone Else", password: "other-long-pw" } }),
      noParams,
    );
    expect(second.status).toBe(first.status);
    expect(await second.text()).toBe(await first.text());
  });

  it("refuses a self-granted house role at sign-up", async () => {
    const r = await signUpRoute(
      request("/api/account/sign-up", {
        json: { displayName: "Sneaky", email: "sneaky@example.test", password: "long-enough-pw", role: "admin" },
      }),
      noParams,
    );
    expect(r.status).toBe(400);
  });

  it("answers malformed JSON with 400, a wrong content type with 415 and a huge body with 413", async () => {
    const broken = await signUpRoute(
      request("/api/account/sign-up", { body: "{not json", headers: { "content-type": "application/json" } }),
      noParams,
    );
    expect(broken.status).toBe(400);
    const wrongType = await signUpRoute(
      request("/api/account/sign-up", { body: "a=b", headers: { "content-type": "text/plain" } }),
      noParams,
    );
    expect(wrongType.status).toBe(415);
    const huge = await signUpRoute(
      request("/api/account/sign-up", { json: { displayName: "x".repeat(100_000) } }),
      noParams,
    );
    expect(huge.status).toBe(413);
    expectErrorShape(await huge.json());
  });

  it("401 without a session, 403 for another role's route, 200 for the house", async () => {
    const anon = await adminUsers(request("/api/admin/users"), noParams);
    expect(anon.status).toBe(401);
    expectErrorShape(await anon.json());

    const dealer = await makeUser(["dealer"]);
    const forbidden = await adminUsers(
      request("/api/admin/users", { headers: { cookie: await sessionCookie(dealer) } }),
      noParams,
    );
    expect(forbidden.status).toBe(403);
    const fb = await forbidden.json();
    expectErrorShape(fb);
    expect(fb.error.code).toBe("forbidden");

    const admin = await makeUser(["admin"]);
    const ok = await adminUsers(
      request("/api/admin/users", { headers: { cookie: await sessionCookie(admin) } }),
      noParams,
    );
    expect(ok.status).toBe(200);
    const list = (await ok.json()) as { accounts: { email: string; passwordHash?: string }[] };
    expect(list.accounts.some((a) => a.email === dealer.email)).toBe(true);
    expect(list.accounts.every((a) => a.passwordHash === undefined)).toBe(true);
  });

  it("re-reads roles from the database: a revoked house role stops working at once", async () => {
    const admin = await makeUser(["admin"]);
    const cookie = await sessionCookie(admin);
    await admin.update({ roles: ["dealer"] });
    const r = await adminUsers(request("/api/admin/users", { headers: { cookie } }), noParams);
    expect(r.status).toBe(403);
  });

  it("refuses a cross-site write even with a valid house session", async () => {
    const admin = await makeUser(["admin"]);
    const target = await makeUser(["dealer"]);
    const r = await patchUser(
      request(`/api/admin/users/${target.id}`, {
        method: "PATCH",
        json: { roles: ["dealer", "admin"] },
        headers: { cookie: await sessionCookie(admin), origin: "https://elsewhere.example" },
      }),
      { params: Promise.resolve({ id: target.id }) },
    );
    expect(r.status).toBe(403);
    expect(((await r.json()) as ErrorBody).error.code).toBe("cross_site");
    await target.reload();
    expect(target.roles).toEqual(["dealer"]);
  });

  it("health says ok while the database answers", async () => {
    const r = await health();
    expect(r.status).toBe(200);
    expect(await r.json()).toEqual({ status: "ok", db: "up" });
  });
});
