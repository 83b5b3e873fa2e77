import type { AttachmentSummary } from "@/contracts/field";
import { attachmentContentUrl } from "../api/attachment-content";
import type { UnitSystem } from "@/lib/units";
import { fileSize, length, ms, speed } from "../lib/format";

/** The same day-and-time style as the rest of the app ("2 Nov 2026, 10:00"). */
const uploadedAt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** One line of what the content check read from a file, lengths and velocities in `units`. */
export function describeFacts(a: AttachmentSummary, units: UnitSystem): string {
  const f = a.facts;
  switch (f.kind) {
    case "seg2":
      return `${f.traces} traces × ${f.samples} samples at ${ms(f.sampleInterval, 3)}; ${
        f.sourcePositions.length
          ? `shot at ${f.sourcePositions.map((s) => length(s, units)).join(", ")}`
          : "no shot position"
      }`;
    case "picks":
      return `${f.picks} picks from ${f.shots.length} shot${f.shots.length === 1 ? "" : "s"} (times in ${f.timeUnit})`;
    case "borehole":
      return `${f.intervals} intervals → ${f.layers} layers (${f.model.layers
        .map((l) => `${l.name ?? "layer"} ${speed(l.velocity, units)}`)
        .join(", ")})`;
  }
}

const KIND_NAMES = { seg2: "Shot record", picks: "Picks CSV", borehole: "Borehole log" } as const;

/** The plan's uploaded files with what can be done with each. */
export function AttachmentList({
  attachments,
  openId,
  canEdit,
  inPlan,
  busyId,
  units,
  onOpen,
  onLoadPicks,
  onAddModel,
  onDelete,
}: {
  attachments: AttachmentSummary[];
  openId: string | null;
  canEdit: boolean;
  /** Names of the plan's ground models (a log already added shows so). */
  inPlan: readonly string[];
  busyId: string | null;
  units: UnitSystem;
  onOpen: (a: AttachmentSummary) => void;
  onLoadPicks: (a: AttachmentSummary) => void;
  onAddModel: (a: AttachmentSummary) => void;
  onDelete: (a: AttachmentSummary) => void;
}) {
  if (attachments.length === 0) {
    return <p className="text-sm text-ink-soft">No field data uploaded for this plan yet.</p>;
  }
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Uploaded field data</caption>
        <thead className="border-b border-rule text-xs tracking-wide text-ink-soft uppercase">
          <tr>
            <th className="py-2 pr-3 font-medium">File</th>
            <th className="py-2 pr-3 font-medium">What it holds</th>
            <th className="py-2 pr-3 font-medium">Revision</th>
            <th className="py-2 pr-3 font-medium">Uploaded</th>
            <th className="py-2 font-medium">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {attachments.map((a) => (
            <tr
              key={a.id}
              className={`border-b border-rule/60 ${a.id === openId ? "bg-ochre-soft/50" : ""}`}
            >
              <td className="py-2 pr-3 align-top">
                <span className="block font-medium text-ink-deep">{a.fileName}</span>
                <span className="text-xs text-ink-soft">
                  {KIND_NAMES[a.kind]} · {fileSize(a.size)}
                </span>
              </td>
              <td className="py-2 pr-3 align-top text-ink-soft">{describeFacts(a, units)}</td>
              <td className="py-2 pr-3 align-top font-mono text-xs">{a.revision}</td>
              <td className="py-2 pr-3 align-top text-xs text-ink-soft">
                {a.uploadedBy.name}
                <br />
                {uploadedAt.format(new Date(a.createdAt))}
              </td>
              <td className="py-2 align-top">
                <div className="flex flex-wrap justify-end gap-1">
                  {a.kind === "seg2" ? (
                    <button
                      type="button"
                      className="rounded-md bg-ink px-2.5 py-1 text-xs font-medium text-card hover:bg-ink-deep disabled:bg-ink-faint"
                      disabled={busyId === a.id}
                      onClick={() => onOpen(a)}
                      aria-label={`Open ${a.fileName}`}
                    >
                      {a.id === openId ? "Open" : busyId === a.id ? "Opening…" : "Open"}
                    </button>
                  ) : null}
                  {a.kind === "picks" ? (
                    <button
                      type="button"
                      className="rounded-md border border-ink-soft px-2.5 py-1 text-xs font-medium text-ink hover:bg-paper-deep"
                      onClick={() => onLoadPicks(a)}
                      aria-label={`Use the picks in ${a.fileName}`}
                    >
                      Use picks
                    </button>
                  ) : null}
                  {a.kind === "borehole" && a.facts.kind === "borehole" ? (
                    inPlan.includes(a.facts.model.name) ? (
                      <span className="px-2 py-1 text-xs text-moss">In the plan</span>
                    ) : canEdit ? (
                      <button
                        type="button"
                        className="rounded-md border border-ink-soft px-2.5 py-1 text-xs font-medium text-ink hover:bg-paper-deep"
                        onClick={() => onAddModel(a)}
                        aria-label={`Add the model of ${a.fileName} to the plan`}
                      >
                        Add to plan
                      </button>
                    ) : null
                  ) : null}
                  <a
                    href={attachmentContentUrl(a.id)}
                    download={a.fileName}
                    className="rounded-md px-2.5 py-1 text-xs font-medium text-ink underline hover:bg-paper-deep"
                  >
                    Download
                  </a>
                  {canEdit ? (
                    <button
                      type="button"
                      className="rounded-md px-2.5 py-1 text-xs font-medium text-brick hover:bg-brick-soft"
                      onClick={() => onDelete(a)}
                      aria-label={`Delete ${a.fileName}`}
                    >
                      Delete
                    </button>
                  ) : null}
                </div>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
