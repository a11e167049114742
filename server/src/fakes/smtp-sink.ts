// Local stand-in for a hosted e-mail service: an SMTP server that accepts every message
// and keeps it, plus a small HTTP API (GET/DELETE /messages) the admin page and tests read.
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import express from 'express';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface SunkMessage {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: Array<{ filename: string; contentType: string; size: number }>;
  receivedAt: string;
}

export interface SmtpSink {
  smtpPort: number;
  httpPort: number;
  messages: SunkMessage[];
  /** Stops accepting SMTP (to simulate an outage); messages are kept. */
  stopSmtp(): Promise<void>;
  /** Starts SMTP again on the same port. */
  startSmtp(): Promise<void>;
  stop(): Promise<void>;
}

function listen(server: { listen: (port: number, host: string, cb: () => void) => unknown; once?: unknown }, port: number) {
  return new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
}

export async function startSmtpSink(options: { smtpPort?: number; httpPort?: number } = {}): Promise<SmtpSink> {
  const messages: SunkMessage[] = [];
  let nextId = 1;

  const makeSmtp = () =>
    new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, _session, callback) {
        simpleParser(stream)
          .then((mail) => {
            const to = [mail.to].flat().flatMap((a) => (a ? a.value.map((v) => v.address ?? '') : []));
            messages.push({
              id: nextId++,
              from: mail.from?.text ?? '',
              to,
              subject: mail.subject ?? '',
              text: mail.text ?? '',
              html: typeof mail.html === 'string' ? mail.html : null,
              attachments: mail.attachments.map((a) => ({ filename: a.filename ?? '', contentType: a.contentType, size: a.size })),
              receivedAt: new Date().toISOString(),
            });
            callback();
          })
          .catch(callback);
      },
    });

  let smtp = makeSmtp();
  await listen(smtp.server, options.smtpPort ?? 0);
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const app = express();
  app.get('/messages', (_req, res) => res.json({ messages }));
  app.delete('/messages', (_req, res) => {
    messages.length = 0;
    res.json({ ok: true });
  });
  const http: Server = createServer(app);
  await listen(http, options.httpPort ?? 0);
  const httpPort = (http.address() as AddressInfo).port;

  let smtpRunning = true;
  return {
    smtpPort,
    httpPort,
    messages,
    async stopSmtp() {
      if (!smtpRunning) return;
      smtpRunning = false;
      await new Promise<void>((r) => smtp.close(() => r()));
    },
    async startSmtp() {
      if (smtpRunning) return;
      smtp = makeSmtp();
      await listen(smtp.server, smtpPort);
      smtpRunning = true;
    },
    async stop() {
      if (smtpRunning) await new Promise<void>((r) => smtp.close(() => r()));
      smtpRunning = false;
      http.closeAllConnections();
      await new Promise<void>((r) => http.close(() => r()));
    },
  };
}
