/** A mail the local SMTP fake captured (development and tests only), as the captured-mails page shows it. */
export interface CapturedMail {
  id: string;
  /** ISO 8601 UTC instant the fake received it. */
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  /** The HTML part, or '' when the mail had none. */
  html: string;
}
