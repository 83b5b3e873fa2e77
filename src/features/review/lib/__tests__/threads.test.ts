import { describe, expect, it } from "vitest";
import {
  anchorThreadCounts,
  buildThreads,
  filterThreads,
  sameAnchor,
  threadCounts,
} from "../threads";
import { comment } from "../../testing/fixtures";

describe("buildThreads", () => {
  it("puts replies under their first comment in time order, threads in the order they started", () => {
    const a = comment({ body: "a", createdAt: "2026-11-20T10:00:00Z" });
    const b = comment({ body: "b", createdAt: "2026-11-20T11:00:00Z" });
    const a2 = comment({ body: "a2", parentId: a.id, createdAt: "2026-11-20T12:30:00Z" });
    const a1 = comment({ body: "a1", parentId: a.id, createdAt: "2026-11-20T12:00:00Z" });
    const threads = buildThreads([a2, b, a1, a]);
    expect(threads.map((t) => t.root.body)).toEqual(["a", "b"]);
    expect(threads[0].replies.map((r) => r.body)).toEqual(["a1", "a2"]);
    expect(threads[0].lastActivity).toBe("2026-11-20T12:30:00Z");
    expect(threads[1].replies).toEqual([]);
  });

  it("follows a reply to a reply up to the thread's root", () => {
    const root = comment({ body: "root" });
    const reply = comment({ body: "reply", parentId: root.id });
    const nested = comment({ body: "nested", parentId: reply.id });
    const threads = buildThreads([root, reply, nested]);
    expect(threads).toHaveLength(1);
    expect(threads[0].replies.map((r) => r.body)).toEqual(["reply", "nested"]);
  });

  it("keeps a reply whose parent is missing as a thread of its own, so nothing is hidden", () => {
    const orphan = comment({ body: "orphan", parentId: "c0000000-0000-4000-8000-999999999999" });
    expect(buildThreads([orphan]).map((t) => t.root.body)).toEqual(["orphan"]);
  });

  it("takes the resolved flag and the anchor from the first comment", () => {
    const root = comment({ resolved: true, anchor: { kind: "shot", model: 0, index: 1 } });
    const reply = comment({ parentId: root.id, resolved: false });
    const [thread] = buildThreads([root, reply]);
    expect(thread.resolved).toBe(true);
    expect(thread.anchor).toEqual({ kind: "shot", model: 0, index: 1 });
  });
});

describe("filterThreads and counts", () => {
  const open = comment({ anchor: { kind: "layer", model: 0, index: 1 } });
  const done = comment({ resolved: true, anchor: { kind: "layer", model: 1, index: 1 } });
  const plain = comment();
  const threads = buildThreads([open, done, plain]);

  it("filters open, resolved and all", () => {
    expect(filterThreads(threads, "open")).toHaveLength(2);
    expect(filterThreads(threads, "resolved").map((t) => t.root.id)).toEqual([done.id]);
    expect(filterThreads(threads, "all")).toHaveLength(3);
    expect(threadCounts(threads)).toEqual({ open: 2, resolved: 1 });
  });

  it("filters by anchor, telling models apart for layers; null means the whole plan", () => {
    expect(
      filterThreads(threads, "all", { kind: "layer", model: 0, index: 1 }).map((t) => t.root.id),
    ).toEqual([open.id]);
    expect(filterThreads(threads, "all", null).map((t) => t.root.id)).toEqual([plain.id]);
  });
});

describe("sameAnchor", () => {
  it("ignores the model index for shots only", () => {
    expect(
      sameAnchor({ kind: "shot", model: 0, index: 2 }, { kind: "shot", model: 3, index: 2 }),
    ).toBe(true);
    expect(
      sameAnchor(
        { kind: "refractor", model: 0, index: 2 },
        { kind: "refractor", model: 1, index: 2 },
      ),
    ).toBe(false);
    expect(
      sameAnchor({ kind: "layer", model: 0, index: 2 }, { kind: "refractor", model: 0, index: 2 }),
    ).toBe(false);
    expect(sameAnchor(null, null)).toBe(true);
    expect(sameAnchor(null, { kind: "layer", model: 0, index: 0 })).toBe(false);
  });
});

describe("anchorThreadCounts", () => {
  it("counts open and resolved threads per anchored place, a thread once however many replies", () => {
    const layer = { kind: "layer", model: 0, index: 1 } as const;
    const open = comment({ anchor: layer });
    const openReply = comment({ parentId: open.id });
    const resolved = comment({ anchor: layer, resolved: true });
    const shot = comment({ anchor: { kind: "shot", model: 0, index: 0 } });
    const whole = comment({});
    const counts = anchorThreadCounts(buildThreads([open, openReply, resolved, shot, whole]));
    expect(counts.get("layer:0:1")).toEqual({ open: 1, resolved: 1 });
    expect(counts.get("shot:0:0")).toEqual({ open: 1, resolved: 0 });
    expect(counts.size).toBe(2);
  });

  it("files a shot under the spread whatever model index the anchor carries", () => {
    const shot = comment({ anchor: { kind: "shot", model: 2, index: 1 } });
    expect(anchorThreadCounts(buildThreads([shot])).get("shot:0:1")).toEqual({
      open: 1,
      resolved: 0,
    });
  });

  it("keeps a layer and the refractor at its top apart", () => {
    const layer = comment({ anchor: { kind: "layer", model: 1, index: 2 } });
    const refractor = comment({ anchor: { kind: "refractor", model: 1, index: 2 } });
    const counts = anchorThreadCounts(buildThreads([layer, refractor]));
    expect(counts.get("layer:1:2")).toEqual({ open: 1, resolved: 0 });
    expect(counts.get("refractor:1:2")).toEqual({ open: 1, resolved: 0 });
  });
});
