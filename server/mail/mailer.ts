/**
 * Sending e-mail: nodemailer over SMTP to PHASELOOM_SMTP_HOST:PHASELOOM_SMTP_PORT, from
 * PHASELOOM_MAIL_FROM. In development and tests that is the local mail catcher (no TLS, no login);
 * in production the SMTP settings come from the environment (PHASELOOM_SMTP_SECURE for implicit TLS,
 * PHASELOOM_SMTP_USER / PHASELOOM_SMTP_PASSWORD to log in; STARTTLS is used whenever offered).
 */
import nodemailer from 'nodemailer';
import type { Env } from '../config/env';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
}

export function createSmtpMailer(env: Env): Mailer {
  const production = env.NODE_ENV === 'production';
  const transport = nodemailer.createTransport({
    host: env.PHASELOOM_SMTP_HOST,
    port: env.PHASELOOM_SMTP_PORT,
    secure: env.PHASELOOM_SMTP_SECURE,
    // the local catcher speaks plain SMTP; a real relay gets STARTTLS when it offers it
    ignoreTLS: !production && !env.PHASELOOM_SMTP_SECURE,
    auth: env.PHASELOOM_SMTP_USER ? { user: env.PHASELOOM_SMTP_USER, pass: env.PHASELOOM_SMTP_PASSWORD ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    async send(message) {
      await transport.sendMail({ from: env.PHASELOOM_MAIL_FROM, to: message.to, subject: message.subject, text: message.text });
    },
  };
}

/** The site's address for links in e-mail: PHASELOOM_PUBLIC_URL, else http://HOST:PORT (never the request's Host header). */
export function publicBaseUrl(env: Env): string {
  return (env.PHASELOOM_PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`).replace(/\/+$/, '');
}
