/** Sends a claim's letters and notices; failures are logged, never thrown (the money has already moved). */
import { sendMail } from "../../mail/mailer";
import { User } from "../../../models";
import { notify } from "../notices";
import type { Letter } from "./templates";

/** E-mails a letter to a user, with greeting and signature. */
export async function mail(userId: string, letter: Letter): Promise<void> {
  const u = await User.findByPk(userId, { attributes: ["email", "displayName"] });
  if (!u) return;
  await sendMail({
    to: u.email,
    subject: letter.subject,
    text: `Hello ${u.displayName},\n\n${letter.body}\n\nGetterline Exchange`,
  }).catch((e: Error) => console.error("[mail]", e.message));
}

/** An in-app notice; a failure to record it does not undo the step that caused it. */
export async function notice(userId: string, text: string, path: string): Promise<void> {
  await notify(userId, text, path).catch(() => undefined);
}
