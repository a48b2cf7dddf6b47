import { createHash, randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { Op, UniqueConstraintError } from "sequelize";
import { db, PasswordResetToken, SignInAttempt, User } from "../../models";
import { ApiError } from "../api/errors";
import { throttleDecision, SIGN_IN_WINDOW_MS } from "../auth/rate-limit";
import type { Role } from "../auth/roles";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import type { ResetConfirmInput, SignInInput, SignUpInput } from "../validation/account";

const BCRYPT_ROUNDS = 11;
const RESET_TTL_MS = 60 * 60 * 1000;
let dummy: Promise<string> | undefined;
const dummyHash = () => (dummy ??= bcrypt.hash("no-such-account", BCRYPT_ROUNDS));

/** What the rest of the app may know about a person (never the hash). */
export type AccountView = { id: string; email: string; displayName: string; roles: Role[]; createdAt: string };

/** What sign-in puts in the JWT besides the account: the session version it was issued under. */
export type SignedInAccount = AccountView & { sessionVersion: number };

export function presentAccount(u: User): AccountView {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    roles: [...u.roles],
    createdAt: u.createdAt.toISOString(),
  };
}

export const hashPassword = (plain: string) => bcrypt.hash(plain, BCRYPT_ROUNDS);

/** What every valid sign-up answers, whether or not the address already had an account. */
export const SIGN_UP_ANSWER = {
  ok: true,
  message: "If the address was new, the account is open. If it already had one, its owner has been e-mailed.",
} as const;

/**
 * Sign-up as consignor or dealer. Reveals nothing: an address that already has an account gets the same
 * answer (and about the same time: the password is hashed either way), and its owner an e-mail saying someone
 * tried to sign up with it. The notice is sent after the answer, so a slow mail server does not tell either.
 */
export async function signUp(input: SignUpInput): Promise<typeof SIGN_UP_ANSWER> {
  db();
  const passwordHash = await hashPassword(input.password);
  try {
    await User.create({ email: input.email, displayName: input.displayName, passwordHash, roles: [input.role] });
  } catch (e) {
    if (!(e instanceof UniqueConstraintError)) throw e;
    const owner = await User.findOne({ where: { email: input.email.trim().toLowerCase() } });
    if (owner)
      void signUpNotice(owner).catch((err: Error) => console.error("[mail] sign-up notice failed", err.message));
  }
  return SIGN_UP_ANSWER;
}

async function signUpNotice(owner: User): Promise<void> {
  const base = env().NEXTAUTH_URL;
  await sendMail({
    to: owner.email,
    subject: "Someone tried to open a Getterline account with your address",
    text: `Hello ${owner.displayName},\n\nSomeone tried to sign up for Getterline with this e-mail address, which already has an account. Nothing was changed and no new account was opened.\n\nIf it was you, sign in at ${base}/sign-in, or reset your password at ${base}/forgot-password.\nIf it was not you, you need do nothing.\n\nGetterline Exchange`,
  });
}

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
  const succeeded = Boolean(user && ok && !user.disabledAt);
  await SignInAttempt.create({ email, ip, succeeded });
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
    await User.update(
      { passwordHash: await hashPassword(input.password) },
      { where: { id: row.userId }, transaction: t },
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
