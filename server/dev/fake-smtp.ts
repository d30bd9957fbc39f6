/**
 * A local stand-in for a mail server: accepts every message on loopback and keeps it on disk
 * (`<id>.eml` plus `index.json`) instead of delivering it. `npm start` and the tests run it so
 * that invitations and password-reset links can be followed without a real mail server.
 * Never exposed beyond 127.0.0.1.
 */
import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { findLinks, MAILBOX_INDEX, readMailbox, type MailboxEntry } from './mailbox';

export interface FakeSmtp {
  /** `smtp://127.0.0.1:<port>`, ready for SMTP_URL. */
  url: string;
  port: number;
  dir: string;
  stop(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

export async function startFakeSmtp({ dir, port = 0 }: { dir: string; port?: number }): Promise<FakeSmtp> {
  mkdirSync(dir, { recursive: true });
  // One write at a time, so two messages arriving together cannot lose each other's index entry.
  let writing: Promise<void> = Promise.resolve();

  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    banner: 'Speedwright fake mailbox (nothing is delivered)',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', callback);
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        const envelopeTo = session.envelope.rcptTo.map((rcpt) => rcpt.address.toLowerCase());
        const stored = writing.then(() => store(dir, raw, envelopeTo));
        writing = stored.catch(() => undefined);
        stored.then(() => callback(), (error: Error) => callback(error));
      });
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  server.on('error', () => undefined);
  const actualPort = (server.server.address() as AddressInfo).port;
  return {
    url: `smtp://127.0.0.1:${actualPort}`,
    port: actualPort,
    dir,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

async function store(dir: string, raw: Buffer, envelopeTo: string[]): Promise<void> {
  const parsed = await simpleParser(raw);
  const id = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}`;
  const file = `${id}.eml`;
  writeFileSync(join(dir, file), raw);
  const text = parsed.text ?? '';
  const entry: MailboxEntry = {
    id,
    file,
    from: addressText(parsed.from),
    to: envelopeTo,
    subject: parsed.subject ?? '',
    receivedAt: new Date().toISOString(),
    text,
    links: findLinks(text),
  };
  const entries = [...readMailbox(dir), entry];
  const temporary = join(dir, `${MAILBOX_INDEX}.${process.pid}.tmp`);
  writeFileSync(temporary, JSON.stringify(entries, null, 2));
  renameSync(temporary, join(dir, MAILBOX_INDEX));
}

function addressText(address: AddressObject | AddressObject[] | undefined): string {
  if (!address) return '';
  return (Array.isArray(address) ? address : [address]).map((a) => a.text).join(', ');
}
