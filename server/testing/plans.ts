/**
 * Test helpers for the plan and review routes: sign in a whole team, create plans through the
 * API, move them through the workflow, and count the rows of the plan tables.
 */
import type { Express } from "express";
import type { DataSource } from "typeorm";
import { ROLES, type Role } from "@/contracts/common";
import type { PlanDetail } from "@/contracts/plans";
import type { PlanInput } from "@engine";
import { notificationMailSettled } from "../domain/notifications";
import { client, signIn, type TestTeam } from "./harness";

export type Api = ReturnType<typeof client>;
export type TeamApis = Record<Role, Api>;

/** Signs every member of the team in and returns a client per role. */
export async function signInTeam(app: Express, team: TestTeam): Promise<TeamApis> {
  const apis = {} as TeamApis;
  for (const role of ROLES) {
    apis[role] = client(app, await signIn(app, team.users[role].email));
  }
  return apis;
}

/** Creates a plan through the API (201 expected) and returns it. */
export async function createPlan(
  api: Api,
  siteId: string,
  name: string,
  document?: PlanInput,
): Promise<PlanDetail> {
  const response = await api
    .post(`/api/sites/${siteId}/plans`)
    .send(document ? { name, document } : { name });
  if (response.status !== 201) {
    throw new Error(`create plan failed: ${response.status} ${JSON.stringify(response.body)}`);
  }
  return response.body as PlanDetail;
}

/** Saves a document on top of the plan's current revision (200 expected). */
export async function saveDocument(
  api: Api,
  plan: PlanDetail,
  document: PlanInput,
  message?: string,
): Promise<PlanDetail> {
  const response = await api
    .put(`/api/plans/${plan.id}`)
    .send({ baseRevision: plan.revision, document, ...(message ? { message } : {}) });
  if (response.status !== 200) {
    throw new Error(`save failed: ${response.status} ${JSON.stringify(response.body)}`);
  }
  return response.body as PlanDetail;
}

/** A valid three-layer document with a thin middle layer (invented numbers). */
export function thinLayerDocument(middleThickness = 1.2): PlanInput {
  return {
    name: "thin layer",
    models: [
      {
        name: "Clay lens",
        layers: [
          { name: "topsoil", velocity: 450, thickness: 2.5 },
          { name: "stiff clay", velocity: 1300, thickness: middleThickness },
          { name: "sandstone", velocity: 3200 },
        ],
      },
    ],
    spread: {
      spacing: 4,
      channels: 24,
      firstGeophone: 0,
      shots: [
        { position: -2, label: "end A" },
        { position: 94, label: "end B" },
      ],
    },
  };
}

const PLAN_TABLES = [
  "plans",
  "plan_revisions",
  "comments",
  "notifications",
  "notification_settings",
];

/**
 * Row counts of the plan tables plus audit_events and mail_messages (one query), after every
 * notification e-mail already started has arrived.
 */
export async function countPlanRows(dataSource: DataSource): Promise<Record<string, number>> {
  await notificationMailSettled(dataSource);
  const tables = [...PLAN_TABLES, "audit_events", "mail_messages"];
  const select = tables.map((t) => `(SELECT COUNT(*) FROM "${t}") AS "${t}"`).join(", ");
  const [row] = (await dataSource.query(`SELECT ${select}`)) as Record<string, number>[];
  return { ...row };
}
