/** Sign-in and password reset. Sessions themselves are lucia's (see server/http/session.ts). */
import { randomUUID } from "node:crypto";
import { IsNull, type DataSource, type EntityManager } from "typeorm";
import { Membership } from "../data/entities/membership";
import { PasswordReset } from "../data/entities/password-reset";
import { Session } from "../data/entities/session";
import { User } from "../data/entities/user";
import { inTransaction } from "../data/transaction";
import type { Actor } from "./actor";
import { recordAudit } from "./audit";
import { passwordResetMail } from "./emails";
import { AppError } from "./errors";
import { loadActor } from "./me";
import {
  assertStrongPassword,
  decoyPasswordHash,
  generateToken,
  hashPassword,
  hashToken,
  verifyPassword,
} from "./secrets";
import { PASSWORD_RESET_TTL_MS, type Services } from "./services";

export const invalidCredentials = () =>
  new AppError(401, "invalid_credentials", "e-mail address or password is wrong");

/**
 * Checks the password and returns the member. Unknown address, wrong password and an account
 * without a team all give the same 401 after the same amount of hashing work.
 */
export async function verifyCredentials(
  dataSource: DataSource,
  email: string,
  password: string,
): Promise<Actor> {
  const user = await dataSource.getRepository(User).findOneBy({ email });
  const ok = await verifyPassword(user?.passwordHash ?? (await decoyPasswordHash()), password);
  if (!user || !ok) throw invalidCredentials();
  const actor = await loadActor(dataSource, user.id);
  if (!actor) throw invalidCredentials();
  return actor;
}

export async function recordSignIn(dataSource: DataSource, actor: Actor, ip: string | undefined) {
  await inTransaction(dataSource, (manager) =>
    recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "auth.sign_in",
      targetType: "user",
      targetId: actor.userId,
      detail: ip ? { ip } : {},
    }),
  );
}

/**
 * Starts a password reset. Always resolves the same way whether or not the address has an
 * account (the route answers 202 either way); the e-mail is sent in the background so the
 * response time does not tell either. Returns the send promise for tests and logs.
 */
export async function requestPasswordReset(
  services: Services,
  email: string,
): Promise<{ sent: Promise<void> }> {
  const { dataSource } = services;
  const user = await dataSource.getRepository(User).findOneBy({ email });
  const membership = user
    ? await dataSource.getRepository(Membership).findOneBy({ userId: user.id })
    : null;
  if (!user || !membership) return { sent: Promise.resolve() };

  const token = generateToken();
  const now = new Date();
  await inTransaction(dataSource, async (manager) => {
    const resets = manager.getRepository(PasswordReset);
    // Only the newest link works.
    await resets.update({ userId: user.id, usedAt: IsNull() }, { usedAt: now });
    await resets.insert({
      id: randomUUID(),
      userId: user.id,
      tokenHash: hashToken(token),
      createdAt: now,
      expiresAt: new Date(now.getTime() + PASSWORD_RESET_TTL_MS),
      usedAt: null,
    });
  });
  const sent = services.mailer
    .send(
      passwordResetMail({
        to: user.email,
        teamId: membership.teamId,
        name: user.name,
        link: `${services.publicUrl}/reset/${token}`,
      }),
    )
    .catch((error: unknown) => {
      services.logger.error({ err: error }, "password-reset e-mail failed");
    });
  return { sent };
}

async function usableReset(manager: EntityManager, token: string): Promise<PasswordReset> {
  const reset = await manager
    .getRepository(PasswordReset)
    .findOneBy({ tokenHash: hashToken(token) });
  if (!reset) throw new AppError(404, "reset_not_found", "this reset link is not valid");
  if (reset.usedAt) throw new AppError(410, "reset_used", "this reset link has already been used");
  if (reset.expiresAt.getTime() <= Date.now()) {
    throw new AppError(410, "reset_expired", "this reset link has expired; ask for a new one");
  }
  return reset;
}

/** Sets the new password, uses up the link and signs the user out everywhere. */
export async function completePasswordReset(
  dataSource: DataSource,
  token: string,
  password: string,
): Promise<void> {
  const pending = await usableReset(dataSource.manager, token);
  const owner = await dataSource.getRepository(User).findOneBy({ id: pending.userId });
  await assertStrongPassword(password, owner ? [owner.email, owner.name] : []);
  const passwordHash = await hashPassword(password);
  await inTransaction(dataSource, async (manager) => {
    const reset = await usableReset(manager, token);
    const now = new Date();
    await manager.getRepository(PasswordReset).update({ id: reset.id }, { usedAt: now });
    await manager
      .getRepository(User)
      .update({ id: reset.userId }, { passwordHash, updatedAt: now });
    await manager.getRepository(Session).delete({ userId: reset.userId });
    const membership = await manager.getRepository(Membership).findOneBy({ userId: reset.userId });
    if (membership) {
      await recordAudit(manager, {
        teamId: membership.teamId,
        actorId: reset.userId,
        action: "auth.password_reset",
        targetType: "user",
        targetId: reset.userId,
      });
    }
  });
}
