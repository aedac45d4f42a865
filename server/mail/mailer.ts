import nodemailer from 'nodemailer';
import type { Config } from '../config.js';

/** A rendered e-mail: every message has a plain-text and an HTML part. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(to: string, content: MailContent): Promise<void>;
  close(): void;
}

/** Sends through the SMTP server named in the configuration (the local fake in development). */
export function createMailer(smtp: Config['smtp']): Mailer {
  const transport = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    async send(to, content) {
      await transport.sendMail({ from: smtp.from, to, subject: content.subject, text: content.text, html: content.html });
    },
    close() {
      transport.close();
    },
  };
}

/** Escapes text for an HTML body. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}
