import nodemailer, { type Transporter } from "nodemailer";
import { env } from "../config/env";

/**
 * Outgoing mail through nodemailer. In development, demo and tests the SMTP
 * server is our local mail catcher (server/mail-catcher.ts); production points
 * SMTP_HOST/SMTP_PORT at a real relay.
 */
const g = globalThis as unknown as { __getterlineMailer?: Transporter };

function transporter(): Transporter {
  if (!g.__getterlineMailer) {
    const e = env();
    g.__getterlineMailer = nodemailer.createTransport({
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: false,
      ignoreTLS: e.SMTP_HOST === "127.0.0.1",
      connectionTimeout: 5_000,
      greetingTimeout: 5_000,
      socketTimeout: 10_000,
    });
  }
  return g.__getterlineMailer;
}

export type Mail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer | string; contentType: string }[];
  /** Extra headers, e.g. List-Unsubscribe on digests. */
  headers?: Record<string, string>;
};

export async function sendMail(mail: Mail): Promise<void> {
  await transporter().sendMail({ from: env().MAIL_FROM, ...mail });
}
