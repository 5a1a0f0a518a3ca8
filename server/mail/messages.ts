import type { Role } from '@shared/api/roles';
import type { OutgoingMail } from './mailer';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);
}

/** "2 December 2026, 17:45 UTC": mails go to people in any zone, so the zone is said. */
export function mailInstant(at: Date): string {
  const date = at.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
  const time = at.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', hour12: false, timeZone: 'UTC' });
  return `${date}, ${time} UTC`;
}

/** Paragraphs and one link, as text and as the same words in HTML. */
function compose(to: string, subject: string, before: string[], link: string, after: string[]): OutgoingMail {
  const text = [...before, link, ...after, '— Isallo'].join('\n\n');
  const paragraphs = (lines: string[]) => lines.map((line) => `<p>${escapeHtml(line)}</p>`).join('\n');
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">',
    paragraphs(before),
    `<p><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`,
    paragraphs(after),
    '<p>— Isallo</p>',
    '</body></html>',
  ].join('\n');
  return { to, subject, text, html };
}

export function invitationMail(input: { to: string; roles: Role[]; invitedByName: string | null; link: string; expiresAt: Date }): OutgoingMail {
  const who = input.invitedByName ? `${input.invitedByName} has` : 'An admin has';
  return compose(
    input.to,
    'You are invited to Isallo',
    [
      `${who} invited you to Isallo, where paper barograph records are catalogued, traced and studied.`,
      `Your roles: ${input.roles.join(', ') || 'none yet'}.`,
      'Open this link to choose your name and password:',
    ],
    input.link,
    [`The link works once and until ${mailInstant(input.expiresAt)}.`, 'If you did not expect this, you can let it lapse.'],
  );
}

export function passwordResetMail(input: { to: string; link: string; expiresAt: Date }): OutgoingMail {
  return compose(
    input.to,
    'Set a new Isallo password',
    ['Someone asked for a new password for your Isallo account. Open this link to set one:'],
    input.link,
    [
      `The link works once and until ${mailInstant(input.expiresAt)}. Setting a password signs you out everywhere else.`,
      'If you did not ask, ignore this mail: your password stays as it is.',
    ],
  );
}
