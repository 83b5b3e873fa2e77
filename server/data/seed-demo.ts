/**
 * Demo data: one invented team with a member per role and two invented sites. Inserted once;
 * a second run finds the admin account and changes nothing. Everything here is invented.
 */
import { randomUUID } from "node:crypto";
import type { DataSource } from "typeorm";
import type { Role } from "@/contracts/common";
import { recordAudit } from "../domain/audit";
import { hashPassword } from "../domain/secrets";
import { Membership } from "./entities/membership";
import { Site } from "./entities/site";
import { Team } from "./entities/team";
import { User } from "./entities/user";
import { seedDemoPlans } from "./seed-demo-plans";
import { inTransaction } from "./transaction";

export const DEMO_PASSWORD = "spreadsight-demo";
export const DEMO_TEAM_NAME = "Bracken Hollow Geotechnical";

export const DEMO_ACCOUNTS: readonly { role: Role; email: string; name: string }[] = [
  { role: "admin", email: "admin@spreadsight.test", name: "Morwenna Hale" },
  { role: "lead", email: "lead@spreadsight.test", name: "Tobias Renshaw" },
  { role: "reviewer", email: "reviewer@spreadsight.test", name: "Ines Varga-Lind" },
  { role: "trainee", email: "trainee@spreadsight.test", name: "Pip Galloway" },
];

export const DEMO_SITES: readonly { name: string; description: string }[] = [
  {
    name: "Scarrowfield road cutting",
    description:
      "A planned cutting up to 9 m deep for a road realignment through weathered sandstone. " +
      "Trial pits found 1–2 m of sandy colluvium over the rock; one borehole logged a soft " +
      "clay lens near 4 m that may pinch out along the line. The rippability of the " +
      "sandstone decides the excavation method.",
  },
  {
    name: "Mellbrook landfill extension",
    description:
      "An extension cell over glacial till resting on chalk. The till is expected to be " +
      "3–12 m thick and may hold water-bearing sand lenses beneath a stiff, over-consolidated " +
      "upper part. Depth to the chalk surface sets the liner base and the monitoring wells.",
  },
];

/** Inserts the demo team unless its admin account exists. Returns whether anything was added. */
export async function seedDemo(dataSource: DataSource): Promise<{ created: boolean }> {
  const users = dataSource.getRepository(User);
  const existing = await users.findOneBy({ email: DEMO_ACCOUNTS[0].email });
  if (existing) {
    // A demo database from before plans existed gets its demo plans once.
    const membership = await dataSource.getRepository(Membership).findOneBy({ userId: existing.id });
    if (membership) await seedDemoPlans(dataSource, { teamId: membership.teamId });
    return { created: false };
  }
  const hashes = await Promise.all(DEMO_ACCOUNTS.map(() => hashPassword(DEMO_PASSWORD)));

  const result = await inTransaction(dataSource, async (manager) => {
    if (await manager.getRepository(User).existsBy({ email: DEMO_ACCOUNTS[0].email })) {
      return { created: false, teamId: null };
    }
    const now = new Date();
    const teamId = randomUUID();
    // The demo team records on a 48-channel seismograph (team setting; the demo plans use 48).
    await manager
      .getRepository(Team)
      .insert({ id: teamId, name: DEMO_TEAM_NAME, createdAt: now, seismographChannels: 48 });
    const ids = new Map<Role, string>();
    for (const [i, account] of DEMO_ACCOUNTS.entries()) {
      const id = randomUUID();
      ids.set(account.role, id);
      await manager.getRepository(User).insert({
        id,
        email: account.email,
        name: account.name,
        passwordHash: hashes[i],
        createdAt: now,
        updatedAt: now,
      });
      await manager
        .getRepository(Membership)
        .insert({ id: randomUUID(), teamId, userId: id, role: account.role, createdAt: now });
    }
    const leadId = ids.get("lead")!;
    for (const site of DEMO_SITES) {
      const id = randomUUID();
      await manager.getRepository(Site).insert({
        id,
        teamId,
        name: site.name,
        description: site.description,
        archivedAt: null,
        createdById: leadId,
        createdAt: now,
        updatedAt: now,
      });
      await recordAudit(manager, {
        teamId,
        actorId: leadId,
        action: "site.create",
        targetType: "site",
        targetId: id,
        detail: { name: site.name },
      });
    }
    return { created: true, teamId };
  });
  if (result.teamId) await seedDemoPlans(dataSource, { teamId: result.teamId });
  return { created: result.created };
}
