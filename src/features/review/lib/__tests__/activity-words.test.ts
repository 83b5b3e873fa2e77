import { describe, expect, it } from "vitest";
import {
  activityKind,
  describeAction,
  describeDetail,
  foldSignIns,
  latestDecisionNote,
} from "../activity-words";

describe("activity words", () => {
  it("reads known actions as phrases and unknown ones as their words", () => {
    expect(describeAction("plan.request_changes")).toBe("returned the plan to the lead with notes");
    expect(describeAction("plan.frobnicate_all")).toBe("plan: frobnicate all");
    expect(describeAction("odd")).toBe("odd");
  });

  it("keeps the useful, printable parts of a detail", () => {
    expect(describeDetail({ revision: 3, note: "tighter spacing", nested: { x: 1 } })).toBe(
      "revision: 3 · note: tighter spacing",
    );
    expect(describeDetail(null)).toBe("");
  });

  it("keeps the message a revision was saved with (what the reviewer wants to know)", () => {
    expect(describeDetail({ revision: 2, message: "tighter spacing", worstVerdict: "blind" })).toBe(
      "revision: 2 · message: tighter spacing",
    );
  });

  it("reads workflow statuses in our own words", () => {
    expect(
      describeDetail({
        from: "in-review",
        to: "changes-requested",
        revision: 2,
        note: "more shots",
      }),
    ).toBe("In review → Returned with notes · revision: 2 · note: more shots");
    expect(describeDetail({ from: "Old name", to: "New name" })).toBe("Old name → New name");
  });

  it("reads the interpretation choice on the Field check in words, with its method", () => {
    expect(describeAction("picks.choose_interpretation")).toBe(
      "chose how the picks are interpreted under the line",
    );
    expect(describeDetail({ method: "grm", assignments: 4 })).toBe(
      "method: generalized reciprocal method",
    );
  });

  it("reads roles by their labels, not the stored keys", () => {
    expect(describeDetail({ name: "Pip Galloway", from: "reviewer", to: "trainee" })).toBe(
      "Reviewer → Trainee · name: Pip Galloway",
    );
    expect(describeDetail({ email: "new@example.test", role: "lead" })).toBe(
      "email: new@example.test · role: Survey lead",
    );
  });

  it("finds the newest workflow step whatever the order, with its note when it has one", () => {
    const events = [
      {
        action: "plan.submit",
        actorName: "A",
        detail: { note: "first" },
        createdAt: "2026-01-01T00:00:00Z",
      },
      {
        action: "plan.request_changes",
        actorName: "B",
        detail: { note: "fix" },
        createdAt: "2026-01-03T00:00:00Z",
      },
      {
        action: "comment.create",
        actorName: "C",
        detail: { note: "not a decision" },
        createdAt: "2026-01-04T00:00:00Z",
      },
    ];
    expect(latestDecisionNote(events)).toEqual({
      kind: "changes-requested",
      actorName: "B",
      note: "fix",
      createdAt: "2026-01-03T00:00:00Z",
    });
    // An approval without a note is still the latest decision: never credit it to the submitter.
    const approved = [
      { action: "plan.approve", actorName: "D", detail: null, createdAt: "2026-01-05T00:00:00Z" },
      ...events,
    ];
    expect(latestDecisionNote(approved)).toEqual({
      kind: "approved",
      actorName: "D",
      note: null,
      createdAt: "2026-01-05T00:00:00Z",
    });
    // A new revision after the approval leaves no current decision to show.
    expect(
      latestDecisionNote([
        ...approved,
        { action: "plan.reopen", actorName: "A", detail: {}, createdAt: "2026-01-06T00:00:00Z" },
      ]),
    ).toBeNull();
    expect(latestDecisionNote([])).toBeNull();
  });
});

describe("team trail helpers", () => {
  const at = (minute: number) => `2026-11-20T10:${String(minute).padStart(2, "0")}:00Z`;
  const ev = (id: string, action: string, actorId: string, minute: number) => ({
    id,
    action,
    actor: { id: actorId, name: actorId },
    targetType: "user",
    targetId: null,
    detail: {},
    createdAt: at(minute),
  });

  it("folds only consecutive sign-ins by the same person, keeping the oldest time", () => {
    const rows = foldSignIns([
      ev("1", "auth.sign_in", "a", 50),
      ev("2", "auth.sign_in", "a", 40),
      ev("3", "plan.save", "a", 30),
      ev("4", "auth.sign_in", "a", 20),
      ev("5", "auth.sign_in", "b", 10),
    ]);
    expect(rows.map((r) => [r.event.id, r.count, r.since])).toEqual([
      ["1", 2, at(40)],
      ["3", 1, at(30)],
      ["4", 1, at(20)],
      ["5", 1, at(10)],
    ]);
  });

  it("names the file of an upload in the plan's activity", () => {
    expect(
      describeDetail({ attachment: "a1", kind: "seg2", fileName: "shot-12.sg2", revision: 2 }),
    ).toBe("file: shot-12.sg2 · revision: 2");
  });

  it("sorts actions into kinds a reader filters by", () => {
    expect(activityKind("attachment.upload")).toBe("files");
    expect(activityKind("picks.save")).toBe("files");
    expect(activityKind("plan.approve")).toBe("review");
    expect(activityKind("comment.resolve")).toBe("review");
    expect(activityKind("plan.save")).toBe("plans");
    expect(activityKind("auth.sign_in")).toBe("sign-ins");
    expect(activityKind("member.role_change")).toBe("team");
    expect(activityKind("site.rename")).toBe("sites");
    expect(describeAction("attachment.upload")).toBe("uploaded a file");
  });
});
