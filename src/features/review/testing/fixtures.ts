/** Invented plans, comments and members for the Review feature's component tests. */
import type { Plan } from "@engine";
import type { CommentView, PlanDetail } from "@/contracts/plans";
import type { MemberSummary } from "@/contracts/team";

export const PLAN_ID = "5a1e0000-0000-4000-8000-000000000001";
export const SITE_ID = "5a1e0000-0000-4000-8000-0000000000f0";

export const leadId = "00000000-0000-4000-8000-000000000001";
export const reviewerId = "00000000-0000-4000-8000-000000000002";

/** An invented three-layer plan: thin colluvium, a slower clay lens, sandstone. */
export const planDocument: Plan = {
  format: "spreadsight-plan/1",
  name: "Tollbar cutting, line A",
  models: [
    {
      name: "Lens present",
      layers: [
        { name: "sandy colluvium", velocity: 450, thickness: 2 },
        { name: "clay lens", velocity: 1300, thickness: 1.5 },
        { name: "weathered sandstone", velocity: 2200 },
      ],
    },
  ],
  spread: {
    spacing: 2,
    channels: 24,
    firstGeophone: 0,
    shots: [{ position: -1, label: "west end" }, { position: 47 }],
  },
  criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
};

type Permissions = PlanDetail["permissions"];
export const noPermissions: Permissions = {
  edit: false,
  submit: false,
  decide: false,
  comment: false,
  reopen: false,
  archive: false,
  duplicate: false,
};

export function planDetail(overrides: Partial<PlanDetail> = {}): PlanDetail {
  return {
    id: PLAN_ID,
    siteId: SITE_ID,
    siteName: "Tollbar road cutting",
    name: "Tollbar cutting, line A",
    status: "in-review",
    sandbox: false,
    author: { id: leadId, name: "Tamsin Orchard" },
    revision: 2,
    worstVerdict: "under-sampled",
    updatedAt: "2026-11-20T09:30:00.000Z",
    createdAt: "2026-11-18T08:00:00.000Z",
    document: planDocument,
    permissions: { ...noPermissions, comment: true },
    statusBeforeArchive: null,
    ...overrides,
  };
}

export const members: MemberSummary[] = [
  {
    userId: leadId,
    name: "Tamsin Orchard",
    email: "tamsin@example.test",
    role: "lead",
    joinedAt: "2026-10-01T00:00:00Z",
  },
  {
    userId: reviewerId,
    name: "Oskar Bellweather",
    email: "oskar@example.test",
    role: "reviewer",
    joinedAt: "2026-10-01T00:00:00Z",
  },
  {
    userId: "00000000-0000-4000-8000-000000000003",
    name: "Olwen Castellan",
    email: "olwen@example.test",
    role: "trainee",
    joinedAt: "2026-10-01T00:00:00Z",
  },
];

let seq = 0;
export function comment(overrides: Partial<CommentView> = {}): CommentView {
  seq += 1;
  return {
    id: `c0000000-0000-4000-8000-${String(seq).padStart(12, "0")}`,
    parentId: null,
    revision: 2,
    author: { id: reviewerId, name: "Oskar Bellweather", role: "reviewer" },
    body: "A comment.",
    anchor: null,
    resolved: false,
    mentions: [],
    resolvedBy: null,
    resolvedAt: null,
    createdAt: `2026-11-20T10:${String(seq % 60).padStart(2, "0")}:00.000Z`,
    ...overrides,
  };
}
