/**
 * Invitations: the only way to create an account. An admin invites an address with a role;
 * the e-mail carries a one-time link; the invitee sets a name and password and is signed in.
 */
import { randomUUID } from "node:crypto";
import { IsNull, MoreThan, type DataSource, type EntityManager } from "typeorm";
import type { InvitationPreview, InvitationSummary } from "@/contracts/auth";
import type { Role } from "@/contracts/common";
import { Invitation } from "../data/entities/invitation";
import { Membership } from "../data/entities/membership";
import { User } from "../data/entities/user";
import { inTransaction } from "../data/transaction";
import type { Actor } from "./actor";
import { requirePermission } from "./actor";
import { recordAudit } from "./audit";
import { invitationMail } from "./emails";
import { AppError, notFound } from "./errors";
import { assertStrongPassword, generateToken, hashPassword, hashToken } from "./secrets";
import { INVITATION_TTL_MS, type Services } from "./services";

function toSummary(invitation: Invitation): InvitationSummary {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    invitedBy: invitation.invitedBy?.name ?? "",
    createdAt: invitation.createdAt.toISOString(),
    expiresAt: invitation.expiresAt.toISOString(),
  };
}

async function isTeamMember(manager: EntityManager, teamId: string, email: string) {
  const user = await manager.getRepository(User).findOneBy({ email });
  if (!user) return false;
  return manager.getRepository(Membership).existsBy({ userId: user.id, teamId });
}

const alreadyMember = () =>
  new AppError(409, "already_member", "this address already belongs to a member of your team", {
    email: ["already a member of your team"],
  });

/**
 * Creates an invitation and e-mails its link. The e-mail is sent first and the row written
 * after, so a failed send leaves nothing behind (502 `mail_failed`). Any earlier pending
 * invitation of the same address to the same team is revoked: only the newest link works.
 */
export async function createInvitation(
  services: Services,
  actor: Actor,
  input: { email: string; role: Role },
): Promise<InvitationSummary> {
  requirePermission(actor, "manageTeam");
  const { dataSource } = services;
  if (await isTeamMember(dataSource.manager, actor.teamId, input.email)) throw alreadyMember();

  const token = generateToken();
  const now = new Date();
  const expiresAt = new Date(now.getTime() + INVITATION_TTL_MS);
  try {
    await services.mailer.send(
      invitationMail({
        to: input.email,
        teamId: actor.teamId,
        teamName: actor.teamName,
        inviterName: actor.name,
        role: input.role,
        link: `${services.publicUrl}/invite/${token}`,
        expiresAt,
      }),
    );
  } catch (error) {
    services.logger.error({ err: error }, "invitation e-mail failed");
    throw new AppError(
      502,
      "mail_failed",
      "the invitation e-mail could not be sent; nothing was saved",
    );
  }

  const id = randomUUID();
  await inTransaction(dataSource, async (manager) => {
    if (await isTeamMember(manager, actor.teamId, input.email)) throw alreadyMember();
    const repo = manager.getRepository(Invitation);
    await repo.update(
      { teamId: actor.teamId, email: input.email, acceptedAt: IsNull(), revokedAt: IsNull() },
      { revokedAt: now },
    );
    await repo.insert({
      id,
      teamId: actor.teamId,
      email: input.email,
      role: input.role,
      tokenHash: hashToken(token),
      invitedById: actor.userId,
      createdAt: now,
      expiresAt,
      acceptedAt: null,
      revokedAt: null,
    });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "invitation.create",
      targetType: "invitation",
      targetId: id,
      detail: { email: input.email, role: input.role },
    });
  });
  const saved = await dataSource
    .getRepository(Invitation)
    .findOneOrFail({ where: { id }, relations: { invitedBy: true } });
  return toSummary(saved);
}

/** Pending invitations of the actor's team (not accepted, not revoked, not expired), newest first. */
export async function listPendingInvitations(
  dataSource: DataSource,
  actor: Actor,
): Promise<InvitationSummary[]> {
  requirePermission(actor, "manageTeam");
  const rows = await dataSource.getRepository(Invitation).find({
    where: {
      teamId: actor.teamId,
      acceptedAt: IsNull(),
      revokedAt: IsNull(),
      expiresAt: MoreThan(new Date()),
    },
    relations: { invitedBy: true },
    order: { createdAt: "DESC", id: "ASC" },
  });
  return rows.map(toSummary);
}

/** Revokes an invitation of the actor's team: its link stops working (410). */
export async function revokeInvitation(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<void> {
  requirePermission(actor, "manageTeam");
  await inTransaction(dataSource, async (manager) => {
    const repo = manager.getRepository(Invitation);
    const invitation = await repo.findOneBy({ id, teamId: actor.teamId });
    if (!invitation) throw notFound("invitation");
    if (invitation.acceptedAt) {
      throw new AppError(409, "invitation_used", "this invitation has already been accepted");
    }
    if (invitation.revokedAt) return;
    await repo.update({ id }, { revokedAt: new Date() });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "invitation.revoke",
      targetType: "invitation",
      targetId: id,
      detail: { email: invitation.email, role: invitation.role },
    });
  });
}

/** The invitation behind a token if it can still be used; 404 unknown, 410 used/revoked/expired. */
async function usableInvitation(manager: EntityManager, token: string): Promise<Invitation> {
  const invitation = await manager
    .getRepository(Invitation)
    .findOne({ where: { tokenHash: hashToken(token) }, relations: { team: true } });
  if (!invitation)
    throw new AppError(404, "invitation_not_found", "this invitation link is not valid");
  if (invitation.acceptedAt) {
    throw new AppError(410, "invitation_used", "this invitation has already been used");
  }
  if (invitation.revokedAt) {
    throw new AppError(410, "invitation_revoked", "this invitation has been withdrawn");
  }
  if (invitation.expiresAt.getTime() <= Date.now()) {
    throw new AppError(410, "invitation_expired", "this invitation has expired; ask for a new one");
  }
  return invitation;
}

export async function previewInvitation(
  dataSource: DataSource,
  token: string,
): Promise<InvitationPreview> {
  const invitation = await usableInvitation(dataSource.manager, token);
  return {
    email: invitation.email,
    role: invitation.role,
    teamName: invitation.team?.name ?? "",
    expiresAt: invitation.expiresAt.toISOString(),
  };
}

/**
 * Accepts an invitation: creates the account (or revives one whose membership was removed),
 * adds the membership and uses up the token, all in one transaction. Returns the user id.
 * 409 `account_exists` when the address already belongs to a member of any team.
 */
export async function acceptInvitation(
  dataSource: DataSource,
  token: string,
  input: { name: string; password: string },
): Promise<string> {
  // Fail fast on a bad link before spending time on the hash.
  const pending = await usableInvitation(dataSource.manager, token);
  await assertStrongPassword(input.password, [pending.email, input.name]);
  const passwordHash = await hashPassword(input.password);
  return inTransaction(dataSource, async (manager) => {
    const invitation = await usableInvitation(manager, token);
    const users = manager.getRepository(User);
    const now = new Date();
    let user = await users.findOneBy({ email: invitation.email });
    if (user) {
      if (await manager.getRepository(Membership).existsBy({ userId: user.id })) {
        throw new AppError(
          409,
          "account_exists",
          "an account with this address already exists; sign in instead",
        );
      }
      await users.update({ id: user.id }, { name: input.name, passwordHash, updatedAt: now });
    } else {
      user = {
        id: randomUUID(),
        email: invitation.email,
        name: input.name,
        passwordHash,
        createdAt: now,
        updatedAt: now,
      };
      await users.insert(user);
    }
    await manager.getRepository(Membership).insert({
      id: randomUUID(),
      teamId: invitation.teamId,
      userId: user.id,
      role: invitation.role,
      createdAt: now,
    });
    await manager.getRepository(Invitation).update({ id: invitation.id }, { acceptedAt: now });
    await recordAudit(manager, {
      teamId: invitation.teamId,
      actorId: user.id,
      action: "invitation.accept",
      targetType: "user",
      targetId: user.id,
      detail: { email: invitation.email, role: invitation.role, name: input.name },
    });
    return user.id;
  });
}
