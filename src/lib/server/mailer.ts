import nodemailer, { type Transporter } from 'nodemailer';
import { readEnvironment, usesMailCatcher } from '../../environment';
import { catcherPort } from './mail-catcher';

let transporter: Transporter | undefined;

function getTransporter(): Transporter {
  if (transporter) return transporter;
  const env = readEnvironment();
  const catcher = usesMailCatcher(env);
  transporter = nodemailer.createTransport({
    host: catcher ? '127.0.0.1' : env.SMTP_HOST,
    port: (catcher ? catcherPort() : undefined) ?? env.SMTP_PORT,
    secure: env.SMTP_SECURE === 'true',
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
    // The local catcher speaks plain SMTP on loopback; a real server negotiates STARTTLS as it offers.
    ignoreTLS: catcher,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return transporter;
}

/** Sends one plain-text message over SMTP; throws when the server refuses or cannot be reached. */
export async function sendMail(message: {
  to: string;
  subject: string;
  text: string;
  messageId?: string;
}): Promise<void> {
  const env = readEnvironment();
  await getTransporter().sendMail({ from: env.MAIL_FROM, ...message });
}
