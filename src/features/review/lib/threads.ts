/** Comment threads: a first comment with its replies, built from the flat list the API returns. */
import type { CommentAnchor, CommentView } from "@/contracts/plans";
import { anchorKey } from "./anchors";

export interface Thread {
  root: CommentView;
  /** Replies, oldest first. */
  replies: CommentView[];
  /** A thread is resolved or open as a whole (the flag lives on its first comment). */
  resolved: boolean;
  anchor: CommentAnchor | null;
  /** Time of the latest comment in the thread (ISO). */
  lastActivity: string;
}

export type ThreadFilter = "open" | "resolved" | "all";

const byTime = (a: CommentView, b: CommentView) =>
  a.createdAt < b.createdAt ? -1 : a.createdAt > b.createdAt ? 1 : a.id.localeCompare(b.id);

/**
 * Groups comments into threads. A reply names its thread's first comment; a reply to a reply
 * is followed up to its root, and a reply whose parent is missing starts its own thread so that
 * nothing is ever hidden. Threads come in the order they were started.
 */
export function buildThreads(comments: readonly CommentView[]): Thread[] {
  const byId = new Map(comments.map((c) => [c.id, c] as const));
  const rootOf = (comment: CommentView): CommentView => {
    let current = comment;
    const seen = new Set<string>();
    while (current.parentId && byId.has(current.parentId) && !seen.has(current.id)) {
      seen.add(current.id);
      current = byId.get(current.parentId)!;
    }
    return current;
  };
  const groups = new Map<string, CommentView[]>();
  for (const comment of [...comments].sort(byTime)) {
    const root = rootOf(comment);
    const list = groups.get(root.id) ?? [];
    if (comment.id !== root.id) list.push(comment);
    groups.set(root.id, list);
  }
  const threads: Thread[] = [];
  for (const [rootId, replies] of groups) {
    const root = byId.get(rootId)!;
    const last = replies.length > 0 ? replies[replies.length - 1] : root;
    threads.push({
      root,
      replies,
      resolved: root.resolved,
      anchor: root.anchor,
      lastActivity: last.createdAt > root.createdAt ? last.createdAt : root.createdAt,
    });
  }
  return threads.sort((a, b) => byTime(a.root, b.root));
}

/** Same place in the plan? Shots belong to the spread, so their model index does not count. */
export function sameAnchor(a: CommentAnchor | null, b: CommentAnchor | null): boolean {
  if (a === null || b === null) return a === b;
  if (a.kind !== b.kind || a.index !== b.index) return false;
  return a.kind === "shot" || (a.model ?? 0) === (b.model ?? 0);
}

/** Threads passing the open/resolved filter and, when given, anchored at `anchor`. */
export function filterThreads(
  threads: readonly Thread[],
  filter: ThreadFilter,
  anchor?: CommentAnchor | null,
): Thread[] {
  return threads.filter(
    (t) =>
      (filter === "all" || (filter === "open") === !t.resolved) &&
      (anchor === undefined || sameAnchor(t.anchor, anchor)),
  );
}

/** How many threads are open and resolved. */
export function threadCounts(threads: readonly Thread[]): { open: number; resolved: number } {
  const resolved = threads.filter((t) => t.resolved).length;
  return { open: threads.length - resolved, resolved };
}

/**
 * Open and resolved thread counts per anchored place, keyed by `anchorKey` ("layer:0:2",
 * "shot:0:1"); threads about the whole plan are left out.
 */
export function anchorThreadCounts(
  threads: readonly Thread[],
): Map<string, { open: number; resolved: number }> {
  const counts = new Map<string, { open: number; resolved: number }>();
  for (const thread of threads) {
    if (!thread.anchor) continue;
    const key = anchorKey(thread.anchor);
    const count = counts.get(key) ?? { open: 0, resolved: 0 };
    if (thread.resolved) count.resolved += 1;
    else count.open += 1;
    counts.set(key, count);
  }
  return counts;
}
