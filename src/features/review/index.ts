/**
 * The Review feature's public surface: the Review screen route element, and the comment threads
 * other screens (the designer) may show beside a layer, refractor or shot.
 */
export { ReviewPage } from "./components/review-page";
export {
  CommentThreads,
  AnchorComments,
  type CommentThreadsProps,
} from "./components/comment-threads";
export { useAnchorThreadCounts, type AnchorThreadCount } from "./hooks/use-anchor-thread-counts";
export { PlanStatusBadge } from "./components/badges";
export { TeamActivityPage } from "./components/team-activity-page";
export { ReviewSlotsProvider, type ReviewSlots } from "./review-slots";
