/**
 * Test harness for the API: a fresh database per test context (SQLite, or PostgreSQL in the
 * `server-pg` project: see ./database.ts), the fake SMTP server, the Express app for supertest,
 * and two invented teams with one member per role each.
 */
import { randomUUID } from "node:crypto";
import type { Express } from "express";
import request from "supertest";
import type { DataSource } from "typeorm";
import { ROLES, type Role } from "@/contracts/common";
import { openDatabase, type DatabaseOptions } from "../data/data-source";
import { Membership } from "../data/entities/membership";
import { Site } from "../data/entities/site";
import { Team } from "../data/entities/team";
import { User } from "../data/entities/user";
import { hashPassword } from "../domain/secrets";
import { createApp, type AppLocals } from "../http/app";
import type { RateLimitConfig } from "../http/rate-limit";
import { createLogger } from "../logger";
import { startFakeSmtp } from "../mail/fake-smtp";
import { createMailer } from "../mail/mailer";
import { s3FileStore, useFileStore } from "../data/file-store";
import { createTestDatabase, testObjectStore, type TestDatabase } from "./database";

/** The public URL the test app believes it has; also the Origin tests send. */
export const PUBLIC_URL = "http://spreadsight.test";
export const TEST_PASSWORD = "test-password-1";

export interface TestTeam {
  id: string;
  name: string;
  users: Record<Role, { id: string; email: string; name: string }>;
  /** An active site and an archived one. */
  sites: { active: string; archived: string };
}

export interface TestContext {
  app: Express;
  dataSource: DataSource;
  /** The database this context uses (SQLite file or PostgreSQL URL). */
  database: DatabaseOptions;
  mailbox: NonNullable<AppLocals["mailbox"]>;
  locals: AppLocals;
  close(): Promise<void>;
}

export async function createTestContext(
  options: { rateLimits?: Partial<RateLimitConfig>; database?: TestDatabase } = {},
): Promise<TestContext> {
  const database = options.database ?? (await createTestDatabase());
  const dataSource = await openDatabase(database.options);
  const objectStore = await testObjectStore();
  if (objectStore) useFileStore(dataSource, s3FileStore(objectStore));
  const logger = createLogger("silent");
  const smtp = await startFakeSmtp(dataSource, logger);
  const mailer = createMailer({
    smtpUrl: smtp.url,
    from: "Spreadsight <no-reply@spreadsight.test>",
  });
  const app = createApp({
    dataSource,
    mailer,
    logger,
    publicUrl: PUBLIC_URL,
    mailboxEnabled: true,
    rateLimits: options.rateLimits,
  });
  const locals = app.locals.spreadsight as AppLocals;
  return {
    app,
    dataSource,
    database: database.options,
    mailbox: locals.mailbox!,
    locals,
    async close() {
      mailer.close();
      await smtp.close();
      await dataSource.destroy();
      await database.drop();
    },
  };
}

let sharedHash: Promise<string> | null = null;
/** One argon2id hash of TEST_PASSWORD reused for every seeded user (hashing is slow on purpose). */
export function testPasswordHash(): Promise<string> {
  sharedHash ??= hashPassword(TEST_PASSWORD);
  return sharedHash;
}

/** Inserts a team with one member per role (e-mails `<role>@<slug>.test`) and two sites. */
export async function seedTeam(
  dataSource: DataSource,
  name: string,
  slug: string,
): Promise<TestTeam> {
  const passwordHash = await testPasswordHash();
  const now = new Date();
  const teamId = randomUUID();
  await dataSource.getRepository(Team).insert({ id: teamId, name, createdAt: now });
  const users = {} as TestTeam["users"];
  for (const role of ROLES) {
    const user = { id: randomUUID(), email: `${role}@${slug}.test`, name: `${slug} ${role}` };
    users[role] = user;
    await dataSource
      .getRepository(User)
      .insert({ ...user, passwordHash, createdAt: now, updatedAt: now });
    await dataSource
      .getRepository(Membership)
      .insert({ id: randomUUID(), teamId, userId: user.id, role, createdAt: now });
  }
  const site = (siteName: string, archived: boolean) => ({
    id: randomUUID(),
    teamId,
    name: siteName,
    description: `${siteName}: invented ground conditions for tests`,
    archivedAt: archived ? now : null,
    createdById: users.lead.id,
    createdAt: now,
    updatedAt: now,
  });
  const active = site(`${slug} quarry floor`, false);
  const archived = site(`${slug} old embankment`, true);
  await dataSource.getRepository(Site).insert([active, archived]);
  return { id: teamId, name, users, sites: { active: active.id, archived: archived.id } };
}

type Method = "get" | "post" | "put" | "patch" | "delete";

/** A tiny client over supertest: sends our Origin and, when given, the session cookie. */
export function client(app: Express, cookie?: string) {
  const make = (method: Method) => (url: string) => {
    const test = request(app)[method](url).set("Origin", PUBLIC_URL);
    return cookie ? test.set("Cookie", cookie) : test;
  };
  return {
    get: make("get"),
    post: make("post"),
    put: make("put"),
    patch: make("patch"),
    delete: make("delete"),
  };
}

/** Signs in and returns the `name=value` of the session cookie. */
export async function signIn(
  app: Express,
  email: string,
  password = TEST_PASSWORD,
): Promise<string> {
  const response = await client(app).post("/api/auth/sign-in").send({ email, password });
  if (response.status !== 200) {
    throw new Error(
      `sign-in as ${email} failed: ${response.status} ${JSON.stringify(response.body)}`,
    );
  }
  return sessionCookie(response.headers["set-cookie"]);
}

/** The `name=value` part of the session cookie in a Set-Cookie header list. */
export function sessionCookie(setCookie: string | string[] | undefined): string {
  const list = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const found = list.find((c) => c.startsWith("spreadsight_session="));
  if (!found) throw new Error("no session cookie in the response");
  return found.split(";")[0];
}

/** Row counts of every table, to prove a rejected request wrote nothing. */
export async function countRows(dataSource: DataSource): Promise<Record<string, number>> {
  const tables = [
    "teams",
    "users",
    "memberships",
    "sessions",
    "sites",
    "audit_events",
    "invitations",
    "password_resets",
    "mail_messages",
    "user_preferences",
  ];
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const [row] = (await dataSource.query(`SELECT COUNT(*) AS n FROM "${table}"`)) as {
      n: number;
    }[];
    counts[table] = row.n;
  }
  return counts;
}

/** The one-time token at the end of `${PUBLIC_URL}/<kind>/<token>` in an e-mail's text. */
export function linkToken(text: string, kind: "invite" | "reset"): string {
  const match = new RegExp(`${PUBLIC_URL.replace(/\./g, "\\.")}/${kind}/([a-z2-7]{32})`).exec(text);
  if (!match) throw new Error(`no ${kind} link in: ${text}`);
  return match[1];
}
