/** Messages caught by the demo/test fake SMTP server. */
export interface MailboxMessage {
  id: string;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}
