import { createHash, randomBytes } from "node:crypto";
import { Op, UniqueConstraintError } from "sequelize";
import { db, User } from "../../models";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import type { SignUpInput } from "../validation/account";
import { hashPassword } from "./accounts";

/** How long a confirmation link works [SUG]. */
export const CONFIRM_TTL_MS = 48 * 3600 * 1000;

/** What every valid sign-up answers, whether or not the address already had an account. */
export const SIGN_UP_ANSWER = {
  ok: true,
  message:
    "Check your e-mail. We have sent a link to confirm the address; the account opens when you follow it. If the address already has an account, its owner has been told instead.",
} as const;

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");

/**
 * Sign-up as consignor or dealer. Reveals nothing, by answer, by time or by what happens next: every sign-up
 * answers SIGN_UP_ANSWER and signs nobody in. A new address gets an account that waits for its owner to open
 * the link e-mailed to it; an address with a confirmed account gets a note that someone tried; an address whose
 * account is still unconfirmed gets a fresh link (its password stays the first one: the link proves the
 * mailbox, not the new password). The password is hashed either way, and mail goes after the answer.
 */
export async function signUp(input: SignUpInput): Promise<typeof SIGN_UP_ANSWER> {
  db();
  const passwordHash = await hashPassword(input.password);
  const link = newLink();
  try {
    const user = await User.create({
      email: input.email,
      displayName: input.displayName,
      passwordHash,
      roles: [input.role],
      emailConfirmedAt: null,
      confirmTokenHash: link.hash,
      confirmExpiresAt: link.expiresAt,
    });
    void confirmationMail(user, link.token).catch((err: Error) => console.error("[mail] confirmation failed", err));
  } catch (e) {
    if (!(e instanceof UniqueConstraintError)) throw e;
    const owner = await User.findOne({ where: { email: input.email.trim().toLowerCase() } });
    if (owner && !owner.disabledAt) void answerOwner(owner, link).catch((err: Error) => console.error("[mail]", err));
  }
  return SIGN_UP_ANSWER;
}

function newLink() {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: sha256(token), expiresAt: new Date(Date.now() + CONFIRM_TTL_MS) };
}

async function answerOwner(owner: User, link: ReturnType<typeof newLink>): Promise<void> {
  if (owner.emailConfirmedAt) return triedNotice(owner);
  await owner.update({ confirmTokenHash: link.hash, confirmExpiresAt: link.expiresAt });
  await confirmationMail(owner, link.token);
}

async function confirmationMail(user: User, token: string): Promise<void> {
  const link = `${env().NEXTAUTH_URL}/confirm-email?token=${token}`;
  await sendMail({
    to: user.email,
    subject: "Confirm your e-mail address for Getterline",
    text: `Hello ${user.displayName},\n\nSomeone (we hope you) opened a Getterline account with this address. To confirm it, open this link within 48 hours and press the button on the page:\n\n${link}\n\nThen sign in with the password chosen at sign-up. If you have forgotten it, reset it at ${env().NEXTAUTH_URL}/forgot-password.\nIf it was not you, ignore this message: the account stays closed.\n\nGetterline Exchange`,
  });
}

async function triedNotice(owner: User): Promise<void> {
  const base = env().NEXTAUTH_URL;
  await sendMail({
    to: owner.email,
    subject: "Someone tried to open a Getterline account with your address",
    text: `Hello ${owner.displayName},\n\nSomeone tried to sign up for Getterline with this e-mail address, which already has an account. Nothing was changed and no new account was opened.\n\nIf it was you, sign in at ${base}/sign-in, or reset your password at ${base}/forgot-password.\nIf it was not you, you need do nothing.\n\nGetterline Exchange`,
  });
}

/**
 * Confirm an address from its link. Idempotent: a link that confirmed its account already answers the same
 * again (a second click, a mail scanner's visit was a GET and changed nothing). An unknown or expired link is
 * 410, with the way to a new one.
 */
export async function confirmEmail(token: string): Promise<{ confirmed: true }> {
  db();
  const hash = sha256(token);
  const [count] = await User.update(
    { emailConfirmedAt: new Date() },
    { where: { confirmTokenHash: hash, emailConfirmedAt: null, confirmExpiresAt: { [Op.gt]: new Date() } } },
  );
  if (count) return { confirmed: true };
  const already = await User.count({ where: { confirmTokenHash: hash, emailConfirmedAt: { [Op.ne]: null } } });
  if (already) return { confirmed: true };
  throw new ApiError(
    "gone",
    "This confirmation link has expired or is not ours. Sign up again with the same address to get a new one.",
  );
}
