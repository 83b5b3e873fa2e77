import type { Verdict } from "@/contracts/plans";

export const VERDICT_LABELS: Record<Verdict, string> = {
  resolved: "Resolved",
  "under-sampled": "Under-sampled",
  blind: "Blind",
  inverted: "Velocity inversion",
};

/** What each verdict means, in one line (design.md). */
export const VERDICT_MEANINGS: Record<Verdict, string> = {
  resolved: "its segment holds enough geophones to be picked",
  "under-sampled": "its segment holds fewer geophones than the plan's minimum",
  blind: "its head wave is never the first arrival: a layer in the blind zone",
  inverted: "it is not faster than a layer above, so it sends no head wave",
};

const TONE: Record<Verdict, string> = {
  resolved: "bg-moss-soft text-moss border-moss/40",
  "under-sampled": "bg-ochre-soft text-ink-deep border-ochre/60",
  blind: "bg-brick-soft text-brick border-brick/50",
  inverted: "bg-brick-soft text-brick border-brick/50",
};

const MARK: Record<Verdict, string> = {
  resolved: "●",
  "under-sampled": "◐",
  blind: "○",
  inverted: "⊘",
};

/** A verdict word with its colour and a shape, so colour is never the only cue. */
export function VerdictBadge({ verdict }: { verdict: Verdict | null | undefined }) {
  if (!verdict) {
    return <span className="text-xs text-ink-faint">not analysed</span>;
  }
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-medium whitespace-nowrap ${TONE[verdict]}`}
    >
      <span aria-hidden>{MARK[verdict]}</span>
      {VERDICT_LABELS[verdict]}
    </span>
  );
}
