import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

let transporter: Transporter | undefined;

/** A real SMTP server when SMTP_URL is set; otherwise the project's local fake one. */
export function mailTransport(): Transporter {
  if (!transporter) {
    const e = env();
    transporter = e.SMTP_URL
      ? nodemailer.createTransport(e.SMTP_URL)
      : nodemailer.createTransport({
          host: '127.0.0.1',
          port: e.MAIL_CATCHER_PORT,
          secure: false,
          ignoreTLS: true,
        });
  }
  return transporter;
}

export type MailMessage = { to: string; subject: string; text: string; html: string };

export async function sendMail(msg: MailMessage): Promise<void> {
  await mailTransport().sendMail({ from: env().MAIL_FROM, ...msg });
}
