import { describe, expect, it } from "vitest";
import { ApiError } from "../../lib/api/errors";
import { ACCOUNT_MAX_FAILURES } from "../../lib/auth/rate-limit";
import { authenticate, confirmPasswordReset, requestPasswordReset, setRoles } from "../../lib/services/accounts";
import { makeUser, waitForMail } from "../support/factories";

const code = async (p: Promise<unknown>) => {
  try {
    await p;
    return "ok";
  } catch (e) {
    return e instanceof ApiError ? e.code : String(e);
  }
};

describe("accounts service (real PostgreSQL)", () => {
  it("rejects a wrong password and then throttles the account on the tenth attempt", async () => {
    const u = await makeUser(["dealer"]);
    expect(await code(authenticate({ email: u.email, password: "wrong" }, "10.0.0.1"))).toBe("invalid_credentials");
    for (let i = 1; i < ACCOUNT_MAX_FAILURES; i++)
      await code(authenticate({ email: u.email, password: "wrong" }, `10.0.1.${i}`));
    // Tenth attempt, even with the right password and from another address: refused.
    expect(await code(authenticate({ email: u.email, password: "correct-horse-battery" }, "10.0.2.1"))).toBe(
      "rate_limited",
    );
  });

  it("accepts the right password", async () => {
    const u = await makeUser(["consignor"]);
    const a = await authenticate({ email: u.email.toUpperCase(), password: "correct-horse-battery" }, "10.0.3.1");
    expect(a.id).toBe(u.id);
  });

  it("e-mails a single-use reset link through the mail catcher", async () => {
    const u = await makeUser(["dealer"]);
    await requestPasswordReset(u.email);
    const mail = await waitForMail(u.email);
    expect(mail.subject).toMatch(/Reset your Getterline password/);
    const token = mail.text.match(/token=([\w-]+)/)![1]!;
    await confirmPasswordReset({ token, password: "a-brand-new-password", confirm: "a-brand-new-password" });
    await expect(authenticate({ email: u.email, password: "a-brand-new-password" }, "10.0.4.1")).resolves.toMatchObject(
      { id: u.id },
    );
    expect(await code(confirmPasswordReset({ token, password: "another-password", confirm: "another-password" }))).toBe(
      "gone",
    );
  });

  it("says nothing about addresses without an account", async () => {
    await expect(requestPasswordReset("nobody-here@example.test")).resolves.toBeUndefined();
  });

  it("lets the house grant roles but not remove its own", async () => {
    const admin = await makeUser(["admin"]);
    const dealer = await makeUser(["dealer"]);
    const after = await setRoles(admin.id, dealer.id, ["dealer", "mediator"]);
    expect(after.roles.sort()).toEqual(["dealer", "mediator"]);
    expect(await code(setRoles(admin.id, admin.id, ["dealer"]))).toBe("conflict");
  });
});
