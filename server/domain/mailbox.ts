/** The fake mailbox (demo/test mode): messages caught by the local SMTP server. */
import type { DataSource } from "typeorm";
import type { MailboxMessage } from "@/contracts/mailbox";
import { MailMessage } from "../data/entities/mail-message";
import type { Actor } from "./actor";
import { requirePermission } from "./actor";
import { notFound } from "./errors";

export function toMailboxMessage(row: MailMessage): MailboxMessage {
  return {
    id: row.id,
    to: row.to,
    from: row.from,
    subject: row.subject,
    text: row.text,
    html: row.html,
    receivedAt: row.receivedAt.toISOString(),
  };
}

/** The actor's team's messages, newest first (an admin never sees another team's mail). */
export async function listMailbox(dataSource: DataSource, actor: Actor): Promise<MailboxMessage[]> {
  requirePermission(actor, "readMailbox");
  const rows = await dataSource.getRepository(MailMessage).find({
    where: { teamId: actor.teamId },
    order: { receivedAt: "DESC", id: "ASC" },
    take: 200,
  });
  return rows.map(toMailboxMessage);
}

export async function getMailboxMessage(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<MailboxMessage> {
  requirePermission(actor, "readMailbox");
  const row = await dataSource.getRepository(MailMessage).findOneBy({ id, teamId: actor.teamId });
  if (!row) throw notFound("message");
  return toMailboxMessage(row);
}

/** Every caught message, newest first, regardless of team: for tests and the command line. */
export async function allMail(dataSource: DataSource): Promise<MailboxMessage[]> {
  const rows = await dataSource
    .getRepository(MailMessage)
    .find({ order: { receivedAt: "DESC", id: "ASC" } });
  return rows.map(toMailboxMessage);
}
