import { createHash, randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { Op } from "sequelize";
import { db, PasswordResetToken, SignInAttempt, User } from "../../models";
import { ApiError } from "../api/errors";
import { throttleDecision, SIGN_IN_WINDOW_MS } from "../auth/rate-limit";
import type { Role } from "../auth/roles";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { UNCONFIRMED_MESSAGE, type ResetConfirmInput, type SignInInput } from "../validation/account";

const BCRYPT_ROUNDS = 11;
const RESET_TTL_MS = 60 * 60 * 1000;
let dummy: Promise<string> | undefined;
const dummyHash = () => (dummy ??= bcrypt.hash("no-such-account", BCRYPT_ROUNDS));

/** What the rest of the app may know about a person (never the hash). */
export type AccountView = {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
  createdAt: string;
  /** False while a self-service account waits for its owner to follow the sign-up link. */
  addressConfirmed: boolean;
};

/** What sign-in puts in the JWT besides the account: the session version it was issued under. */
export type SignedInAccount = AccountView & { sessionVersion: number };

export function presentAccount(u: User): AccountView {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    roles: [...u.roles],
    createdAt: u.createdAt.toISOString(),
    addressConfirmed: Boolean(u.emailConfirmedAt),
  };
}

export const hashPassword = (plain: string) => bcrypt.hash(plain, BCRYPT_ROUNDS);

/**
 * Refuse (429, with Retry-After) while an account or an address is over its
 * failed sign-in limit. Used before next-auth sees the request and again
 * inside the password check, so both paths answer the same.
 */
export async function assertNotThrottled(emailRaw: string, ip: string): Promise<void> {
  db();
  const email = emailRaw.trim().toLowerCase().slice(0, 254);
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MS);
  const decision = throttleDecision(await SignInAttempt.recentFailures(email, ip, since));
  if (!decision.allowed) {
    throw new ApiError(
      "rate_limited",
      `Too many failed sign-in attempts for this ${decision.scope === "account" ? "account" : "address"}. Try again in about ${Math.ceil(decision.retryAfterSeconds / 60)} minutes, or reset your password.`,
      undefined,
      { "Retry-After": String(decision.retryAfterSeconds) },
    );
  }
}

/**
 * Check a password, throttled per account and per address. Throws
 * rate_limited (429) before looking at the password when either is over its
 * limit, invalid_credentials (401) on a wrong e-mail or password.
 */
export async function authenticate(input: SignInInput, ip: string): Promise<SignedInAccount> {
  db();
  const email = input.email.trim().toLowerCase();
  await assertNotThrottled(email, ip);
  const user = await User.findOne({ where: { email } });
  // Compare against a dummy hash when the account is missing so timing does not reveal it.
  const ok = await bcrypt.compare(input.password, user?.passwordHash ?? (await dummyHash()));
  const succeeded = Boolean(user && ok && !user.disabledAt && user.emailConfirmedAt);
  await SignInAttempt.create({ email, ip, succeeded });
  // Only someone who knows the password learns that the account waits for its address to be confirmed.
  if (user && ok && !user.disabledAt && !user.emailConfirmedAt)
    throw new ApiError("forbidden", UNCONFIRMED_MESSAGE, undefined, undefined, { reason: "unconfirmed" });
  if (!succeeded || !user)
    throw new ApiError("invalid_credentials", "That e-mail and password do not match an account");
  return { ...presentAccount(user), sessionVersion: user.sessionVersion };
}

/**
 * Current roles from the database (JWT roles can be stale), or null when the account is gone, disabled, or the
 * token's session version is older than the account's (signed out, or the password changed since).
 * A token without a version (made before versions existed) counts as version 0.
 */
export async function currentRoles(userId: string, sessionVersion?: number): Promise<Role[] | null> {
  db();
  const u = await User.findByPk(userId, { attributes: ["id", "roles", "disabledAt", "sessionVersion"] });
  if (!u || u.disabledAt) return null;
  if (sessionVersion !== undefined && (sessionVersion ?? 0) !== u.sessionVersion) return null;
  return [...u.roles];
}

/** End every session of the account: sign-out and password change call it. */
export async function revokeSessions(userId: string): Promise<void> {
  db();
  await User.increment("sessionVersion", { by: 1, where: { id: userId } });
}

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");

/**
 * E-mail a single-use reset link. Answers the same whether or not the address
 * has an account, so the form cannot be used to probe for members.
 */
export async function requestPasswordReset(emailRaw: string): Promise<void> {
  db();
  const email = emailRaw.trim().toLowerCase();
  const user = await User.findOne({ where: { email } });
  if (!user || user.disabledAt) return;
  const token = randomBytes(32).toString("base64url");
  await PasswordResetToken.create({
    userId: user.id,
    tokenHash: sha256(token),
    expiresAt: new Date(Date.now() + RESET_TTL_MS),
  });
  const link = `${env().NEXTAUTH_URL}/reset-password?token=${token}`;
  await sendMail({
    to: user.email,
    subject: "Reset your Getterline password",
    text: `Hello ${user.displayName},\n\nSomeone asked to reset the password of your Getterline account. If it was you, open this link within an hour:\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n\nGetterline Exchange`,
  });
}

/** Set a new password from a reset link; the link works once and within its hour. */
export async function confirmPasswordReset(input: ResetConfirmInput): Promise<void> {
  const s = db();
  await s.transaction(async (t) => {
    const row = await PasswordResetToken.findOne({
      where: { tokenHash: sha256(input.token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!row) throw new ApiError("gone", "This reset link has expired or was already used. Ask for a new one.");
    // A new password ends every session: a copied token from before stops working.
    // The link came to the account's mailbox, so following it confirms the address too.
    const user = await User.findByPk(row.userId, { transaction: t, lock: t.LOCK.UPDATE });
    await user!.update(
      { passwordHash: await hashPassword(input.password), emailConfirmedAt: user!.emailConfirmedAt ?? new Date() },
      { transaction: t },
    );
    await User.increment("sessionVersion", { by: 1, where: { id: row.userId }, transaction: t });
    await row.update({ usedAt: new Date() }, { transaction: t });
  });
}

/** The house's list of accounts, newest first. */
export async function listAccounts(): Promise<AccountView[]> {
  db();
  const users = await User.findAll({ order: [["createdAt", "DESC"]], limit: 1000 });
  return users.map(presentAccount);
}

/** The house grants or removes roles; an admin cannot remove their own admin role. */
export async function setRoles(actorId: string, userId: string, roles: Role[]): Promise<AccountView> {
  db();
  const user = await User.findByPk(userId);
  if (!user) throw new ApiError("not_found", "No such account");
  const unique = [...new Set(roles)];
  if (actorId === userId && !unique.includes("admin")) {
    throw new ApiError("conflict", "You cannot remove your own house role", {
      roles: "Keep the house role on your own account",
    });
  }
  await user.update({ roles: unique });
  return presentAccount(user);
}
