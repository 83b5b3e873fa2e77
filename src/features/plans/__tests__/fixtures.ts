/** Invented plans for the plans feature's tests (SI units). */
import type { PlanDetail, PlanSummary } from "@/contracts/plans";
import type { Plan } from "../lib/engine";

export const SITE_ID = "11111111-1111-4111-8111-111111111111";
export const PLAN_ID = "22222222-2222-4222-8222-222222222222";

/** Three layers, all resolved by 24 geophones at 5 m with end shots. */
export const threeLayerPlan = (): Plan => ({
  format: "spreadsight-plan/1",
  name: "Culvert crossing, line 2",
  models: [
    {
      name: "Expected ground",
      layers: [
        { name: "made ground", velocity: 450, thickness: 3 },
        { name: "stiff clay", velocity: 1600, thickness: 6 },
        { name: "mudstone", velocity: 3000 },
      ],
    },
  ],
  spread: {
    spacing: 5,
    channels: 24,
    firstGeophone: 0,
    shots: [
      { position: -2.5, label: "end, start" },
      { position: 117.5, label: "end, far" },
    ],
  },
  criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
});

/**
 * A thin intermediate layer under slow cover: its head wave exists (1200 > 500 m/s) but the
 * faster refractor below overtakes it before it can come first (a blind layer, design.md).
 */
export const blindLayerPlan = (): Plan => ({
  ...threeLayerPlan(),
  name: "Blind lens",
  models: [
    {
      name: "Thin lens",
      layers: [
        { name: "dry sand", velocity: 500, thickness: 4 },
        { name: "silty lens", velocity: 1200, thickness: 0.5 },
        { name: "limestone", velocity: 4000 },
      ],
    },
  ],
});

/** A slow layer under a faster one: a velocity inversion (design.md). */
export const inversionPlan = (): Plan => ({
  ...threeLayerPlan(),
  name: "Inversion",
  models: [
    {
      name: "Crust over sand",
      layers: [
        { name: "cemented crust", velocity: 1500, thickness: 2 },
        { name: "loose sand", velocity: 800, thickness: 5 },
        { name: "sandstone", velocity: 3500 },
      ],
    },
  ],
});

const summaryBase = {
  siteId: SITE_ID,
  status: "draft" as const,
  sandbox: false,
  author: { id: "00000000-0000-4000-8000-000000000001", name: "Test Lead" },
  revision: 3,
  worstVerdict: "resolved" as const,
  updatedAt: "2026-11-03T09:30:00.000Z",
  createdAt: "2026-11-01T09:30:00.000Z",
};

export const planSummary = (overrides: Partial<PlanSummary> = {}): PlanSummary => ({
  id: PLAN_ID,
  name: "Culvert crossing, line 2",
  ...summaryBase,
  ...overrides,
});

export const planDetail = (overrides: Partial<PlanDetail> = {}): PlanDetail => ({
  ...planSummary(),
  siteName: "Harrow Beck culvert",
  document: threeLayerPlan(),
  permissions: {
    edit: true,
    submit: true,
    decide: false,
    comment: true,
    reopen: false,
    archive: true,
    duplicate: true,
  },
  statusBeforeArchive: null,
  ...overrides,
});
