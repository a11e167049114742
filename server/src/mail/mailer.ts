// nodemailer transport to the configured SMTP server (the local sink in the demo and tests).
import nodemailer from 'nodemailer';
import type { Config } from '../config/env.js';

export interface OutgoingEmail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: Array<{ filename: string; contentBase64: string; contentType: string }>;
}

export function createMailer(config: Config) {
  const transport = nodemailer.createTransport({
    host: config.mail.host,
    port: config.mail.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
  return {
    async send(email: OutgoingEmail) {
      await transport.sendMail({
        from: config.mail.from,
        to: email.to,
        subject: email.subject,
        text: email.text,
        html: email.html,
        attachments: email.attachments?.map((a) => ({
          filename: a.filename,
          content: Buffer.from(a.contentBase64, 'base64'),
          contentType: a.contentType,
        })),
      });
    },
    close: () => transport.close(),
  };
}

export type Mailer = ReturnType<typeof createMailer>;
