/**
 * Validation at the public entry: the zod plan schema plus the geometric checks the
 * schema cannot express (interfaces must not reach the surface or cross each other within
 * the extent of the spread and shots).
 */
import { layoutExtent, type Layout } from "./branches";
import { describeInterfaceProblem, earthFromModel, findInterfaceProblem } from "./geometry";
import { describePlanIssues, planSchema, type Plan, type Spread } from "./plan-schema";
import { sectionSpreadIssues } from "./section-geometry";
import { wholeLine } from "./roll-along";

/** Result of parsing a plan: the plan with defaults applied, or one message per problem. */
export type ParsePlanResult = { ok: true; plan: Plan } | { ok: false; issues: string[] };

/** The numeric layout of a spread (shot positions as an array of numbers). */
export function layoutOf(spread: Spread): Layout {
  return {
    spacing: spread.spacing,
    channels: spread.channels,
    firstGeophone: spread.firstGeophone,
    shots: spread.shots.map((s) => s.position),
  };
}

/** Geometry problems of a schema-valid plan, one line each naming the field. */
export function geometryIssues(plan: Plan): string[] {
  // A roll-along line is checked over every spread and shot of the line (roll-along.ts).
  const line = wholeLine(plan.spread);
  const extent = layoutExtent(layoutOf(line));
  const issues: string[] = [];
  plan.models.forEach((model, i) => {
    if (model.kind === "section") {
      issues.push(...sectionSpreadIssues(model, line, i));
      return;
    }
    const problem = findInterfaceProblem(earthFromModel(model), extent.from, extent.to);
    if (problem) {
      issues.push(
        `models[${i}].layers[${problem.layer}].dip: ${describeInterfaceProblem(problem, extent.from, extent.to)}`,
      );
    }
  });
  return issues;
}

/**
 * Parse and validate an untrusted plan (e.g. parsed JSON or a form's values). Applies the
 * schema defaults. Never throws: problems come back as messages naming each bad field,
 * e.g. `models[0].layers[2].velocity: velocity must be > 0`.
 */
export function parsePlan(input: unknown): ParsePlanResult {
  const parsed = planSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: describePlanIssues(parsed.error) };
  const issues = geometryIssues(parsed.data);
  if (issues.length > 0) return { ok: false, issues };
  return { ok: true, plan: parsed.data };
}
