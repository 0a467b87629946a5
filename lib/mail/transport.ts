/**
 * Outgoing mail over SMTP (nodemailer). Locally the server is maildev, which
 * offers no AUTH and no STARTTLS, so the transport sends neither.
 */
import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

let transporter: Transporter | undefined;

export function smtpServerOptions() {
  return { host: env.SMTP_HOST, port: env.SMTP_PORT, secure: false, ignoreTLS: true } as const;
}

export function getTransport(): Transporter {
  transporter ??= nodemailer.createTransport(smtpServerOptions());
  return transporter;
}

export type Mail = { to: string; subject: string; text: string; html: string };

/** Sends one message from MAIL_FROM; throws when the SMTP server refuses it. */
export async function sendMail(mail: Mail): Promise<void> {
  const info = await getTransport().sendMail({ from: env.MAIL_FROM, ...mail });
  if (info.rejected.length > 0) throw new Error(`mail to ${mail.to} was rejected`);
}
