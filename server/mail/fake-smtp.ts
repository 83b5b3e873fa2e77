/**
 * A local SMTP server (smtp-server) for demo and test mode: every message it receives is
 * parsed with mailparser and stored in the mail_messages table, so it survives restarts and
 * admins can read it on the Mailbox page.
 */
import { simpleParser } from "mailparser";
import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import type { DataSource } from "typeorm";
import type { Logger } from "pino";
import { MailMessage } from "../data/entities/mail-message";
import { Team } from "../data/entities/team";
import { TEAM_HEADER } from "./mailer";

export interface FakeSmtp {
  /** smtp://127.0.0.1:<port>, for createMailer. */
  url: string;
  port: number;
  close(): Promise<void>;
}

export async function startFakeSmtp(dataSource: DataSource, logger: Logger): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    size: 5 * 1024 * 1024,
    logger: false,
    banner: "Spreadsight fake mailbox",
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const to = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          const teamHeader = parsed.headers.get(TEAM_HEADER.toLowerCase());
          const teamId = typeof teamHeader === "string" ? teamHeader : null;
          const teamExists =
            teamId !== null && (await dataSource.getRepository(Team).existsBy({ id: teamId }));
          await dataSource.getRepository(MailMessage).insert({
            id: randomUUID(),
            teamId: teamExists ? teamId : null,
            from: (
              parsed.from?.text ??
              (session.envelope.mailFrom ? session.envelope.mailFrom.address : "")
            ).slice(0, 320),
            to,
            subject: (parsed.subject ?? "").slice(0, 500),
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            receivedAt: new Date(),
          });
          logger.debug({ to, subject: parsed.subject }, "fake SMTP stored a message");
          callback();
        })
        .catch((error: Error) => {
          logger.error({ err: error }, "fake SMTP could not store a message");
          callback(error);
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      server.off("error", reject);
      resolve();
    });
  });
  server.on("error", (error) => logger.error({ err: error }, "fake SMTP error"));
  const { port } = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${port}`,
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
