/**
 * The notification e-mail outbox. `enqueueMail` writes one row per e-mail with the caller's
 * EntityManager, inside the transaction that writes the inbox rows, so a request that is refused
 * sends nothing and a committed one never loses its e-mail. After the commit, `sendOutbox`
 * hands the rows to SMTP; a sweep on every app server (`startOutboxSweeper`) sends whatever a
 * server that stopped, or an SMTP failure, left behind, with backoff.
 *
 * Several app servers may share the database: a server first claims a row with one conditional
 * UPDATE (only one claim succeeds), sends it, then marks it sent. A server that dies while
 * sending leaves a claim that expires after `CLAIM_MS`; the row is then sent again, so a crash
 * at exactly that moment can send an e-mail twice but never zero times (at-least-once).
 */
import { randomUUID } from "node:crypto";
import type { Logger } from "pino";
import { In, type DataSource, type EntityManager } from "typeorm";
import { MailOutboxRow } from "../data/entities/mail-outbox";
import type { Mailer, OutgoingMail } from "./mailer";

/** How long a claim holds before another server may send the row, ms. */
export const CLAIM_MS = 2 * 60 * 1000;
/** Failed sends after which a row is left alone (its lastError stays for the admin). */
export const MAX_ATTEMPTS = 8;
/** How often each app server sweeps the outbox, ms. */
export const SWEEP_MS = 30 * 1000;
/** How long sent rows stay in the outbox, ms. */
export const KEEP_SENT_MS = 7 * 24 * 60 * 60 * 1000;
/** Rows one sweep sends at most. */
const SWEEP_BATCH = 50;

/** Wait before the next try after `attempts` failures: 1, 2, 4 … minutes, at most an hour. */
export function retryDelayMs(attempts: number): number {
  return Math.min(60 * 60 * 1000, 60 * 1000 * 2 ** Math.max(0, attempts - 1));
}

/** An e-mail to queue, with the member it is for (logs only). */
export interface QueuedMail extends OutgoingMail {
  userId?: string | null;
}

/** Writes the e-mails to the outbox with `manager` (the caller's transaction); returns their ids. */
export async function enqueueMail(
  manager: EntityManager,
  mails: readonly QueuedMail[],
  now = Date.now(),
): Promise<string[]> {
  if (mails.length === 0) return [];
  const rows = mails.map((mail) => ({
    id: randomUUID(),
    teamId: mail.teamId ?? null,
    userId: mail.userId ?? null,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html ?? null,
    createdAt: new Date(now),
    attempts: 0,
    nextAttemptAt: now,
    claimedUntil: null,
    sentAt: null,
    lastError: null,
  }));
  await manager.getRepository(MailOutboxRow).insert(rows);
  return rows.map((r) => r.id);
}

/** What sending needs: the database, the SMTP side and a logger. */
export interface OutboxDeps {
  dataSource: DataSource;
  mailer: Mailer;
  logger: Logger;
}

/** Claims one row for this server; true when the claim is ours (nobody else holds or sent it). */
async function claim(dataSource: DataSource, id: string, now: number): Promise<boolean> {
  const result = await dataSource
    .createQueryBuilder()
    .update(MailOutboxRow)
    .set({ claimedUntil: now + CLAIM_MS })
    .where(`"id" = :id AND "sentAt" IS NULL AND "attempts" < :max`, { id, max: MAX_ATTEMPTS })
    .andWhere(`("claimedUntil" IS NULL OR "claimedUntil" < :now)`, { now })
    .execute();
  return (result.affected ?? 0) === 1;
}

/** Sends one claimed row and records the outcome. */
async function sendRow(deps: OutboxDeps, row: MailOutboxRow): Promise<boolean> {
  const repo = deps.dataSource.getRepository(MailOutboxRow);
  try {
    await deps.mailer.send({
      to: row.to,
      subject: row.subject,
      text: row.text,
      html: row.html ?? undefined,
      teamId: row.teamId,
    });
    await repo.update({ id: row.id }, { sentAt: Date.now(), claimedUntil: null, lastError: null });
    return true;
  } catch (error) {
    const attempts = row.attempts + 1;
    const message = error instanceof Error ? error.message : String(error);
    await repo.update(
      { id: row.id },
      {
        attempts,
        nextAttemptAt: Date.now() + retryDelayMs(attempts),
        claimedUntil: null,
        lastError: message.slice(0, 500),
      },
    );
    deps.logger.warn(
      { err: error, userId: row.userId, subject: row.subject, attempts },
      attempts >= MAX_ATTEMPTS
        ? "notification e-mail failed; giving up after the last attempt"
        : "notification e-mail failed; will retry",
    );
    return false;
  }
}

/**
 * Sends the given rows (after their transaction committed), or, without ids, every row that is
 * due. Rows claimed by another server, already sent or given up are skipped. Never throws;
 * resolves with the number sent.
 */
export async function sendOutbox(deps: OutboxDeps, ids?: readonly string[]): Promise<number> {
  try {
    const repo = deps.dataSource.getRepository(MailOutboxRow);
    const now = Date.now();
    const candidates =
      ids === undefined
        ? await repo
            .createQueryBuilder("m")
            .where(`m."sentAt" IS NULL AND m."attempts" < :max`, { max: MAX_ATTEMPTS })
            .andWhere(`m."nextAttemptAt" <= :now`, { now })
            .andWhere(`(m."claimedUntil" IS NULL OR m."claimedUntil" < :now)`, { now })
            .orderBy(`m."nextAttemptAt"`, "ASC")
            .limit(SWEEP_BATCH)
            .getMany()
        : ids.length === 0
          ? []
          : await repo.findBy({ id: In([...ids]) });
    let sent = 0;
    if (ids === undefined) {
      // Sent rows are kept a week (for support), then removed.
      await repo
        .createQueryBuilder()
        .delete()
        .where(`"sentAt" IS NOT NULL AND "sentAt" < :old`, { old: now - KEEP_SENT_MS })
        .execute();
    }
    for (const row of candidates) {
      if (!(await claim(deps.dataSource, row.id, now))) continue;
      if (await sendRow(deps, row)) sent++;
    }
    return sent;
  } catch (error) {
    deps.logger.warn({ err: error }, "outbox send failed");
    return 0;
  }
}

/**
 * Sweeps the outbox now and every `SWEEP_MS` (timer unref'd). `stop` ends the timer and waits
 * for a sweep in progress.
 */
export function startOutboxSweeper(
  deps: OutboxDeps,
  intervalMs = SWEEP_MS,
): { stop(): Promise<void>; sweep(): Promise<number> } {
  let running: Promise<number> | null = null;
  const sweep = () => {
    running ??= sendOutbox(deps).finally(() => {
      running = null;
    });
    return running;
  };
  void sweep();
  const timer = setInterval(() => void sweep(), intervalMs);
  timer.unref();
  return {
    sweep,
    async stop() {
      clearInterval(timer);
      if (running) await running;
    },
  };
}
