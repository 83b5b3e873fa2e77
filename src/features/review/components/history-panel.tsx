import { useState } from "react";
import type { RevisionSummary } from "@/contracts/plans";
import { Button } from "@/components/button";
import { EmptyState, ErrorNotice, Loading } from "@/components/feedback";
import type { UnitSystem } from "@/lib/units";
import { useRevisions } from "../api/get-revisions";
import { useDiff } from "../api/get-diff";
import { VerdictTag } from "./badges";
import { DiffView } from "./diff-view";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** Every revision of the plan, and what changed between any two of them. */
export function HistoryPanel({ planId, units }: { planId: string; units: UnitSystem }) {
  const revisions = useRevisions(planId);
  const [picked, setPicked] = useState<{ from: number; to: number } | null>(null);
  const list = revisions.data ?? [];
  const latest = list[0]?.number ?? null;
  const pair = picked ?? (latest !== null && latest >= 2 ? { from: latest - 1, to: latest } : null);

  if (revisions.isPending) return <Loading label="Loading the history…" />;
  if (revisions.isError)
    return (
      <ErrorNotice
        error={revisions.error}
        title="Cannot load the revisions"
        onRetry={() => revisions.refetch()}
      />
    );
  if (list.length === 0) return <EmptyState title="No revisions saved yet" />;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(16rem,1fr)_2fr]">
      <ol aria-label="Revisions" className="flex flex-col divide-y divide-rule/60">
        {list.map((rev) => (
          <RevisionRow
            key={rev.number}
            revision={rev}
            latest={rev.number === latest}
            comparing={pair?.to === rev.number}
            onCompare={
              rev.number > 1 ? () => setPicked({ from: rev.number - 1, to: rev.number }) : undefined
            }
          />
        ))}
      </ol>
      <div>
        {list.length < 2 || !pair ? (
          <EmptyState title="Only one revision">
            Every save makes a new revision; compare them here once there are two.
          </EmptyState>
        ) : (
          <>
            <div className="mb-3 flex flex-wrap items-end gap-3">
              <RevisionSelect
                label="From revision"
                value={pair.from}
                list={list}
                onChange={(from) => setPicked({ from, to: pair.to })}
              />
              <RevisionSelect
                label="To revision"
                value={pair.to}
                list={list}
                onChange={(to) => setPicked({ from: pair.from, to })}
              />
            </div>
            <DiffPane planId={planId} from={pair.from} to={pair.to} units={units} />
          </>
        )}
      </div>
    </div>
  );
}

function RevisionRow({
  revision,
  latest,
  comparing,
  onCompare,
}: {
  revision: RevisionSummary;
  latest: boolean;
  comparing: boolean;
  onCompare?: () => void;
}) {
  return (
    <li className={`py-2 text-sm ${comparing ? "bg-paper-deep/60" : ""}`}>
      <div className="flex items-center justify-between gap-2 px-1">
        <span className="font-semibold text-ink-deep">
          Revision {revision.number}
          {latest ? <span className="ml-1 text-xs font-normal text-ink-soft">(latest)</span> : null}
        </span>
        <VerdictTag verdict={revision.worstVerdict} />
      </div>
      <p className="px-1 text-xs text-ink-soft">
        {revision.author.name} ·{" "}
        <time dateTime={revision.createdAt}>{timeFormat.format(new Date(revision.createdAt))}</time>
      </p>
      {revision.message ? <p className="px-1 text-xs text-ink-deep">“{revision.message}”</p> : null}
      {onCompare ? (
        <Button
          variant="quiet"
          className="mt-0.5 px-1 py-0.5 text-xs"
          onClick={onCompare}
          aria-label={`Changes in revision ${revision.number}`}
        >
          Changes from {revision.number - 1}
        </Button>
      ) : null}
    </li>
  );
}

function RevisionSelect({
  label,
  value,
  list,
  onChange,
}: {
  label: string;
  value: number;
  list: RevisionSummary[];
  onChange: (n: number) => void;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm font-medium text-ink">
      {label}
      <select
        className="field-input w-40 py-1"
        value={value}
        onChange={(e) => onChange(Number(e.target.value))}
      >
        {list.map((rev) => (
          <option key={rev.number} value={rev.number}>
            Revision {rev.number}
          </option>
        ))}
      </select>
    </label>
  );
}

function DiffPane({
  planId,
  from,
  to,
  units,
}: {
  planId: string;
  from: number;
  to: number;
  units: UnitSystem;
}) {
  const diff = useDiff(planId, from, to);
  if (from === to) return <p className="text-sm text-ink-soft">Pick two different revisions.</p>;
  if (diff.isPending) return <Loading label="Comparing…" />;
  if (diff.isError)
    return <ErrorNotice error={diff.error} title="Cannot compare these revisions" />;
  return <DiffView diff={diff.data} units={units} />;
}
