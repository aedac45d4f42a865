import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { OutboxMessage } from '../../shared/schemas/outbox.js';

/**
 * A local SMTP server for development and tests: it accepts every message, keeps it in memory
 * and lists it over HTTP (`GET /messages`, `DELETE /messages`). Nothing is delivered anywhere.
 */
export type CapturedMessage = OutboxMessage;

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  url: string;
  messages(): CapturedMessage[];
  clear(): void;
  /** Resolves with the first captured message matching `predicate`, polling until `timeoutMs`. */
  waitFor(predicate: (m: CapturedMessage) => boolean, timeoutMs?: number): Promise<CapturedMessage>;
  stop(): Promise<void>;
}

export interface MailFakeOptions {
  smtpPort?: number;
  httpPort?: number;
  host?: string;
}

const MAX_MESSAGES = 500;
const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  if (!a) return [];
  return (Array.isArray(a) ? a : [a]).flatMap((o) => o.value.map((v) => v.address ?? '').filter(Boolean));
}

export async function startMailFake({ smtpPort = 0, httpPort = 0, host = '127.0.0.1' }: MailFakeOptions = {}): Promise<MailFake> {
  const store: CapturedMessage[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          store.push({
            id: nextId++,
            to: envelopeTo.length > 0 ? envelopeTo : addresses(parsed.to),
            from: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            date: (parsed.date ?? new Date()).toISOString(),
          });
          if (store.length > MAX_MESSAGES) store.splice(0, store.length - MAX_MESSAGES);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  const web = http.createServer((req, res) => {
    const path = (req.url ?? '/').split('?')[0];
    if (path === '/messages' && req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json', 'cache-control': 'no-store' });
      res.end(JSON.stringify({ messages: [...store].reverse() }));
    } else if (path === '/messages' && req.method === 'DELETE') {
      store.length = 0;
      res.writeHead(204).end();
    } else {
      res.writeHead(404, { 'content-type': 'application/json' }).end(JSON.stringify({ error: 'not found' }));
    }
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    web.once('error', reject);
    web.listen(httpPort, host, () => resolve());
  });
  smtp.on('error', (err) => console.error(JSON.stringify({ level: 'error', event: 'mail_fake.smtp_error', error: String(err) })));

  const smtpAddress = smtp.server.address() as AddressInfo;
  const httpAddress = web.address() as AddressInfo;

  return {
    smtpPort: smtpAddress.port,
    httpPort: httpAddress.port,
    url: `http://${host}:${httpAddress.port}`,
    messages: () => [...store],
    clear: () => {
      store.length = 0;
    },
    async waitFor(predicate, timeoutMs = 5_000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const found = store.find(predicate);
        if (found) return found;
        if (Date.now() > deadline) throw new Error('mail fake: no matching message arrived in time');
        await new Promise((r) => setTimeout(r, 25));
      }
    },
    async stop() {
      web.closeAllConnections();
      await Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        new Promise<void>((resolve) => web.close(() => resolve())),
      ]);
    },
  };
}

// CLI: `tsx --tsconfig server/tsconfig.json server/mail/fake-smtp.ts`
// (The typeof guard keeps this file importable where `require` does not exist, e.g. vitest.)
if (typeof require !== 'undefined' && typeof module !== 'undefined' && require.main === module) {
  const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
  const httpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526);
  startMailFake({ smtpPort, httpPort, host: '127.0.0.1' })
    .then((fake) => {
      console.log(`mail fake: SMTP on 127.0.0.1:${fake.smtpPort}, messages at ${fake.url}/messages`);
      console.log(`set MAIL_FAKE_URL=${fake.url} for the server's dev outbox`);
      const stop = () => void fake.stop().then(() => process.exit(0));
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    })
    .catch((err: unknown) => {
      console.error(`mail fake failed to start: ${String(err)}`);
      process.exit(1);
    });
}
