import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { CapturedMail } from '../../shared/api/mail';

/** Largest mail the fake takes; Isallo's mails are a few kilobytes. */
const MAX_MAIL_BYTES = 1024 * 1024;

export interface RunningMailFake {
  /** smtp://127.0.0.1:<port>, for SMTP_URL. */
  url: string;
  stop(): Promise<void>;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = field === undefined ? [] : Array.isArray(field) ? field : [field];
  return list.flatMap((group) => group.value.map((address) => address.address ?? '')).filter((address) => address !== '');
}

/**
 * A local SMTP server on loopback that accepts every mail and writes it, parsed, as one JSON file per mail
 * into `captureDir` (written to a temporary name and renamed, so a reader never sees half a mail). The app's
 * captured-mails page and the API tests read that folder. No TLS and no authentication: loopback only.
 */
export async function startMailFake(captureDir: string, port = 0): Promise<RunningMailFake> {
  mkdirSync(captureDir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MAIL_BYTES,
    banner: 'Isallo local mail fake',
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const mail: CapturedMail = {
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: addresses(parsed.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
          };
          const name = `${mail.receivedAt.replace(/[:.]/g, '-')}-${mail.id}.json`;
          const temp = join(captureDir, `.${name}.tmp`);
          writeFileSync(temp, JSON.stringify(mail));
          renameSync(temp, join(captureDir, name));
          callback();
        })
        .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const { port: boundPort } = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${boundPort}`,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
