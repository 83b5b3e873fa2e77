/** What the use cases need from the outside world. */
import type { Logger } from "pino";
import type { DataSource } from "typeorm";
import type { Mailer } from "../mail/mailer";

export interface Services {
  dataSource: DataSource;
  mailer: Mailer;
  /** Base for links in e-mails, without a trailing slash, e.g. http://127.0.0.1:3000. */
  publicUrl: string;
  logger: Logger;
}

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;
