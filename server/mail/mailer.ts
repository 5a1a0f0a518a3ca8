import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';
import { AppError, HTTP } from '../errors/app-error';

/** One plain mail with a text part and an HTML part of the same words. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** A mailer over SMTP (SMTP_URL); without one, sending answers 503 so the admin learns why no mail went. */
export function createMailer(config: Pick<Config, 'smtpUrl' | 'mailFrom'>): Mailer {
  let transport: Transporter | undefined;
  return {
    async send(mail) {
      if (config.smtpUrl === '') {
        throw new AppError(HTTP.serviceUnavailable, 'mail_unavailable', 'No mail server is set up (SMTP_URL), so no mail can be sent.');
      }
      transport ??= nodemailer.createTransport(config.smtpUrl);
      try {
        await transport.sendMail({ from: config.mailFrom, ...mail });
      } catch (error) {
        throw new AppError(HTTP.serviceUnavailable, 'mail_unavailable', `The mail server did not take the mail: ${(error as Error).message}`);
      }
    },
  };
}
