import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';

/**
 * The SMTP transport. In development and tests SMTP_HOST/SMTP_PORT point at the local fake
 * (scripts/fakes/mail.ts), which speaks plain SMTP on loopback: hence no TLS.
 * Short timeouts: a send that hangs would hold up the whole outbox.
 */
export function createMailTransport(port = Number(process.env.SMTP_PORT ?? 2525)): Transporter {
  return nodemailer.createTransport({
    host: process.env.SMTP_HOST ?? '127.0.0.1',
    port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 15_000,
  });
}

export const mailFrom = () => process.env.MAIL_FROM ?? 'Outturn <no-reply@outturn.local>';
