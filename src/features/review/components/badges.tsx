import { PLAN_STATUS_LABELS, type PlanStatus, type Verdict } from "@/contracts/plans";

const STATUS_TONE: Record<PlanStatus, string> = {
  draft: "border-rule bg-card text-ink",
  "in-review": "border-ink/40 bg-paper-deep text-ink-deep",
  "changes-requested": "border-brick/50 bg-brick-soft text-brick",
  approved: "border-moss/50 bg-moss-soft text-moss",
  archived: "border-rule bg-paper text-ink-faint",
};

const STATUS_MARK: Record<PlanStatus, string> = {
  draft: "✎",
  "in-review": "◔",
  "changes-requested": "↺",
  approved: "✓",
  archived: "▫",
};

/** The plan's workflow status in our own words, with a shape so colour is not the only cue. */
export function PlanStatusBadge({ status }: { status: PlanStatus }) {
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full border px-2.5 py-0.5 text-xs font-semibold whitespace-nowrap ${STATUS_TONE[status]}`}
    >
      <span aria-hidden>{STATUS_MARK[status]}</span>
      <span>{PLAN_STATUS_LABELS[status]}</span>
    </span>
  );
}

export const VERDICT_WORDS: Record<Verdict, string> = {
  resolved: "Resolved",
  "under-sampled": "Under-sampled",
  blind: "Blind",
  inverted: "Velocity inversion",
};

const VERDICT_TONE: Record<Verdict, string> = {
  resolved: "bg-moss-soft text-moss border-moss/40",
  "under-sampled": "bg-ochre-soft text-ink-deep border-ochre/60",
  blind: "bg-brick-soft text-brick border-brick/50",
  inverted: "bg-brick-soft text-brick border-brick/50",
};

const VERDICT_MARK: Record<Verdict, string> = {
  resolved: "●",
  "under-sampled": "◐",
  blind: "○",
  inverted: "⊘",
};

/** A refractor verdict word with colour and shape. */
export function VerdictTag({ verdict }: { verdict: Verdict | null | undefined }) {
  if (!verdict) return <span className="text-xs text-ink-faint">not analysed</span>;
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 font-sans text-xs font-medium whitespace-nowrap ${VERDICT_TONE[verdict]}`}
    >
      <span aria-hidden>{VERDICT_MARK[verdict]}</span>
      {VERDICT_WORDS[verdict]}
    </span>
  );
}

const ANCHOR_MARK = { layer: "▤", refractor: "╱", shot: "✦" } as const;

/** Where a comment points, as a small chip (wrapping, never cut off). */
export function AnchorChip({ kind, label }: { kind: keyof typeof ANCHOR_MARK; label: string }) {
  return (
    <span
      className="inline-flex max-w-full items-start gap-1 rounded border border-ink-faint/50 bg-paper px-1.5 py-0.5 text-xs break-words text-ink"
      title={label}
    >
      <span aria-hidden className="text-ochre">
        {ANCHOR_MARK[kind]}
      </span>
      {label}
    </span>
  );
}
