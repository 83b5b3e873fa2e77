import { useMemo } from "react";
import type { CommentAnchor } from "@/contracts/plans";
import { useComments } from "../api/comments";
import { anchorKey } from "../lib/anchors";
import { anchorThreadCounts, buildThreads } from "../lib/threads";

export interface AnchorThreadCount {
  open: number;
  resolved: number;
}

const NONE: AnchorThreadCount = { open: 0, resolved: 0 };

/**
 * Thread counts of one plan per anchored place, from the same comments query the threads use
 * (so posting or resolving updates them). Returns a lookup: zero counts for a place without
 * threads, and `null` while the comments load or when they cannot be loaded.
 */
export function useAnchorThreadCounts(
  planId: string,
): ((anchor: CommentAnchor) => AnchorThreadCount) | null {
  const comments = useComments(planId);
  return useMemo(() => {
    if (!comments.data) return null;
    const counts = anchorThreadCounts(buildThreads(comments.data));
    return (anchor: CommentAnchor) => counts.get(anchorKey(anchor)) ?? NONE;
  }, [comments.data]);
}
