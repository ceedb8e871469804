import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  replyTo?: string;
  messageId?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

const globalForMail = globalThis as unknown as { darnwellMail?: Transporter };

function transport(): Transporter {
  if (!globalForMail.darnwellMail) {
    const url = new URL(env.SMTP_URL);
    const local = Boolean(env.LOCAL_MAIL_API);
    globalForMail.darnwellMail = nodemailer.createTransport({
      host: url.hostname,
      port: Number(url.port || (url.protocol === "smtps:" ? 465 : 587)),
      secure: url.protocol === "smtps:",
      // The local mail service offers no TLS; real providers must.
      ignoreTLS: local,
      requireTLS: !local && url.protocol !== "smtps:",
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      // Well inside the outbox lease (120 s): a send still hanging when the lease ends would let
      // another instance's worker take the row and send it a second time.
      socketTimeout: 60_000,
    });
  }
  return globalForMail.darnwellMail;
}

export async function sendMail(message: MailMessage): Promise<void> {
  await transport().sendMail({ from: env.MAIL_FROM, ...message });
}
