import type { CapturedMail } from '@shared/api/mail';
import { listCapturedMails } from '../../server/mail/captured-mails';
import { pollUntil } from './poll-until';

function captureDir(): string {
  const dir = process.env['MAIL_CAPTURE_DIR'];
  if (!dir) throw new Error('MAIL_CAPTURE_DIR is not set; run the tests through scripts/test.ts, which starts the local SMTP fake');
  return dir;
}

/** Every mail the local SMTP fake captured for an address, newest first. */
export async function mailsTo(address: string): Promise<CapturedMail[]> {
  const { items } = await listCapturedMails(captureDir(), { page: 0, pageSize: 10_000 });
  return items.filter((mail) => mail.to.some((to) => to.toLowerCase() === address.toLowerCase()));
}

/**
 * Waits until the fake has captured `count` mails for the address (a reset mail goes after the answer),
 * checking every 100 ms; fails after `timeoutMs`.
 */
export async function waitForMailsTo(address: string, count = 1, timeoutMs = 10_000): Promise<CapturedMail[]> {
  return pollUntil(
    () => mailsTo(address),
    (mails) => mails.length >= count,
    { timeoutMs, intervalMs: 100, describe: (mails) => `${mails.length} of ${count} mails to ${address}` },
  );
}

/** The secret at the end of the first link to `pagePrefix` (e.g. /invitation/) in the mail's text. */
export function linkToken(mail: CapturedMail, pagePrefix: string): string {
  const match = new RegExp(`https?://\\S+${pagePrefix.replace(/\//g, '\\/')}([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!match) throw new Error(`no ${pagePrefix} link in the mail "${mail.subject}"`);
  return match[1] as string;
}
