import pino from "pino";
import type { DataSource } from "typeorm";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { openDatabase } from "../data/data-source";
import { MailOutboxRow } from "../data/entities/mail-outbox";
import { createTestDatabase, type TestDatabase } from "../testing/database";
import type { Mailer, OutgoingMail } from "./mailer";
import { MAX_ATTEMPTS, enqueueMail, retryDelayMs, sendOutbox } from "./outbox";

const logger = pino({ level: "silent" });

/** A mailer that records what it sends, or fails while `failing` is set. */
function recordingMailer() {
  const sent: OutgoingMail[] = [];
  let failing = false;
  const mailer: Mailer & { sent: OutgoingMail[]; fail(on: boolean): void } = {
    sent,
    fail(on) {
      failing = on;
    },
    async send(mail) {
      await new Promise((resolve) => setTimeout(resolve, 5));
      if (failing) throw new Error("421 service not available");
      sent.push(mail);
    },
    close() {},
  };
  return mailer;
}

const mail = (to: string): OutgoingMail => ({
  to,
  subject: `Review requested: Plan for ${to}`,
  text: "A plan was submitted.",
  teamId: null,
});

let database: TestDatabase;
let dataSource: DataSource;

beforeEach(async () => {
  database = await createTestDatabase();
  dataSource = await openDatabase(database.options);
});

afterEach(async () => {
  await dataSource.destroy();
  await database.drop();
});

describe("notification e-mail outbox", () => {
  it("sends nothing for a transaction that rolled back", async () => {
    const mailer = recordingMailer();
    await expect(
      dataSource.transaction(async (manager) => {
        await enqueueMail(manager, [mail("a@example.test")]);
        throw new Error("refused");
      }),
    ).rejects.toThrow("refused");
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(0);
    expect(mailer.sent).toEqual([]);
  });

  it("a committed e-mail that no one sent (server stopped) goes out on the next sweep, once", async () => {
    const mailer = recordingMailer();
    await dataSource.transaction((manager) =>
      enqueueMail(manager, [mail("a@example.test"), mail("b@example.test")]),
    );
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(2);
    expect(mailer.sent.map((m) => m.to).sort()).toEqual(["a@example.test", "b@example.test"]);
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(0);
    expect(mailer.sent).toHaveLength(2);
  });

  it("two servers sending the same rows at once send each e-mail once", async () => {
    const mailer = recordingMailer();
    const ids = await dataSource.transaction((manager) =>
      enqueueMail(manager, [
        mail("a@example.test"),
        mail("b@example.test"),
        mail("c@example.test"),
      ]),
    );
    const counts = await Promise.all([
      sendOutbox({ dataSource, mailer, logger }, ids),
      sendOutbox({ dataSource, mailer, logger }),
      sendOutbox({ dataSource, mailer, logger }, ids),
    ]);
    expect(counts.reduce((a, b) => a + b, 0)).toBe(3);
    expect(mailer.sent.map((m) => m.to).sort()).toEqual([
      "a@example.test",
      "b@example.test",
      "c@example.test",
    ]);
  });

  it("an SMTP failure is kept with its error and retried after the backoff, not at once", async () => {
    const mailer = recordingMailer();
    const [id] = await dataSource.transaction((manager) =>
      enqueueMail(manager, [mail("a@example.test")]),
    );
    mailer.fail(true);
    expect(await sendOutbox({ dataSource, mailer, logger }, [id])).toBe(0);
    const repo = dataSource.getRepository(MailOutboxRow);
    const failed = await repo.findOneByOrFail({ id });
    expect(failed.attempts).toBe(1);
    expect(failed.lastError).toContain("421");
    expect(failed.sentAt).toBeNull();
    expect(failed.nextAttemptAt).toBeGreaterThan(Date.now() + retryDelayMs(1) - 5000);

    mailer.fail(false);
    // Not due yet: the sweep leaves it.
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(0);
    await repo.update({ id }, { nextAttemptAt: Date.now() - 1 });
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(1);
    const sent = await repo.findOneByOrFail({ id });
    expect(sent.sentAt).not.toBeNull();
    expect(sent.lastError).toBeNull();
  });

  it("gives up after the last attempt", async () => {
    const mailer = recordingMailer();
    const [id] = await dataSource.transaction((manager) =>
      enqueueMail(manager, [mail("a@example.test")]),
    );
    const repo = dataSource.getRepository(MailOutboxRow);
    await repo.update({ id }, { attempts: MAX_ATTEMPTS });
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(0);
    expect(mailer.sent).toEqual([]);
  });

  it("a claim held by another server is respected until it expires", async () => {
    const mailer = recordingMailer();
    const [id] = await dataSource.transaction((manager) =>
      enqueueMail(manager, [mail("a@example.test")]),
    );
    const repo = dataSource.getRepository(MailOutboxRow);
    await repo.update({ id }, { claimedUntil: Date.now() + 60_000 });
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(0);
    await repo.update({ id }, { claimedUntil: Date.now() - 1 });
    expect(await sendOutbox({ dataSource, mailer, logger })).toBe(1);
  });

  it("backs off 1, 2, 4 … minutes and never more than an hour", () => {
    expect(retryDelayMs(1)).toBe(60_000);
    expect(retryDelayMs(2)).toBe(120_000);
    expect(retryDelayMs(3)).toBe(240_000);
    expect(retryDelayMs(20)).toBe(3_600_000);
  });
});
