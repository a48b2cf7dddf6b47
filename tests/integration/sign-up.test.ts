// Sign-up that reveals nothing: every sign-up gets the same answer and signs nobody in; the account opens from
// a link e-mailed to the address. Enumeration by sign-up is a known weakness: OWASP Authentication Cheat Sheet,
// "Authentication and Error Messages" / account creation [OWASP-AUTH] (wording from memory); the 48-hour link is [SUG].
import { describe, expect, it } from "vitest";
import { ApiError } from "../../lib/api/errors";
import { authenticate, confirmPasswordReset, requestPasswordReset } from "../../lib/services/accounts";
import { confirmEmail, signUp, SIGN_UP_ANSWER } from "../../lib/services/sign-up";
import { User } from "../../models";
import { inbox, waitForSubject } from "../support/factories";
import { until } from "../support/wait";

const fail = async (p: Promise<unknown>) => {
  try {
    await p;
    return { code: "ok" };
  } catch (e) {
    return e instanceof ApiError
      ? { code: e.code, reason: e.details?.reason, message: e.message }
      : { code: String(e) };
  }
};

const CONFIRM = /Confirm your e-mail address/;
const tokenIn = (text: string) => text.match(/\/confirm-email\?token=([\w-]+)/)![1]!;
const confirmations = async (to: string) => (await inbox(to)).filter((m) => CONFIRM.test(m.subject));

describe("sign-up with a confirmed address (real PostgreSQL and mail catcher)", () => {
  it("opens a waiting account, mails its link, and refuses sign-in until the link is followed", async () => {
    const email = `wren-${Date.now()}@example.test`;
    const answer = await signUp({
      displayName: "Wren Test",
      email: email.toUpperCase(),
      password: "long-enough-pw",
      role: "dealer",
    });
    expect(answer).toEqual(SIGN_UP_ANSWER);
    const row = await User.findOne({ where: { email } });
    expect(row!.roles).toEqual(["dealer"]);
    expect(row!.passwordHash).toMatch(/^\$2[aby]\$11\$/);
    expect(row!.emailConfirmedAt).toBeNull();
    expect(row!.confirmTokenHash).toMatch(/^[0-9a-f]{64}$/); // only the hash is stored

    const mail = await waitForSubject(email, CONFIRM);
    const token = tokenIn(mail.text);
    expect(row!.confirmTokenHash).not.toContain(token);

    // The right password learns that the address waits; a wrong one learns nothing more than ever.
    expect(await fail(authenticate({ email, password: "long-enough-pw" }, "10.9.0.1"))).toMatchObject({
      code: "forbidden",
      reason: "unconfirmed",
    });
    expect(await fail(authenticate({ email, password: "wrong-password" }, "10.9.0.1"))).toMatchObject({
      code: "invalid_credentials",
    });

    expect(await confirmEmail(token)).toEqual({ confirmed: true });
    expect(await confirmEmail(token)).toEqual({ confirmed: true }); // a second click changes nothing
    expect((await fail(authenticate({ email, password: "long-enough-pw" }, "10.9.0.2"))).code).toBe("ok");
  });

  it("answers a known address exactly as a new one: a confirmed owner is told, an unconfirmed one gets a new link", async () => {
    const email = `marsh-${Date.now()}@example.test`;
    const first = await signUp({ displayName: "Marsh Test", email, password: "first-long-pw", role: "consignor" });
    const firstToken = tokenIn((await waitForSubject(email, CONFIRM)).text);
    const hashBefore = (await User.findOne({ where: { email } }))!.passwordHash;

    // Again while unconfirmed: the same answer, a fresh link, the first password kept, the old link dead.
    const second = await signUp({ displayName: "Someone Else", email, password: "other-long-pw", role: "dealer" });
    expect(second).toEqual(first);
    const both = await until(
      () => confirmations(email),
      (m) => m.length === 2,
      8000,
    );
    const secondToken = tokenIn(both.find((m) => !m.text.includes(firstToken))!.text);
    expect(await fail(confirmEmail(firstToken))).toMatchObject({ code: "gone" });
    await confirmEmail(secondToken);
    const row = (await User.findOne({ where: { email } }))!;
    expect(row.passwordHash).toBe(hashBefore);
    expect(row.displayName).toBe("Marsh Test");
    expect(row.roles).toEqual(["consignor"]);

    // Again once confirmed: the same answer, a note to the owner, nothing changed, no new link.
    const third = await signUp({ displayName: "Third Try", email, password: "third-long-pw", role: "dealer" });
    expect(third).toEqual(first);
    const notice = await waitForSubject(email, /Someone tried to open a Getterline account/);
    expect(notice.text).toContain("already has an account");
    expect((await confirmations(email)).length).toBe(2);
    expect((await User.findOne({ where: { email } }))!.passwordHash).toBe(hashBefore);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it("refuses an expired or unknown link with 410 and the way to a new one", async () => {
    const email = `late-${Date.now()}@example.test`;
    await signUp({ displayName: "Late Test", email, password: "long-enough-pw", role: "dealer" });
    const token = tokenIn((await waitForSubject(email, CONFIRM)).text);
    await User.update({ confirmExpiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const expired = await fail(confirmEmail(token));
    expect(expired).toMatchObject({ code: "gone" });
    expect(expired.message).toContain("Sign up again with the same address");
    expect(await fail(confirmEmail("x".repeat(43)))).toMatchObject({ code: "gone" });
    expect((await User.findOne({ where: { email } }))!.emailConfirmedAt).toBeNull();
  });

  it("a password reset through the e-mailed link confirms the address as well", async () => {
    const email = `reset-${Date.now()}@example.test`;
    await signUp({ displayName: "Reset Test", email, password: "forgotten-pw-1", role: "dealer" });
    await waitForSubject(email, CONFIRM);
    await requestPasswordReset(email);
    const reset = await waitForSubject(email, /Reset your Getterline password/);
    const token = reset.text.match(/reset-password\?token=([\w-]+)/)![1]!;
    await confirmPasswordReset({ token, password: "remembered-pw-2", confirm: "remembered-pw-2" });
    expect((await User.findOne({ where: { email } }))!.emailConfirmedAt).not.toBeNull();
    expect((await fail(authenticate({ email, password: "remembered-pw-2" }, "10.9.0.3"))).code).toBe("ok");
  });
});
