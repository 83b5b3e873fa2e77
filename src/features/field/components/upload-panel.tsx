import { useRef, useState } from "react";
import {
  ATTACHMENT_EXTENSIONS,
  ATTACHMENT_KIND_LABELS,
  ATTACHMENT_LIMITS,
  type AttachmentKind,
  type AttachmentUploadResponse,
} from "@/contracts/field";
import { Button } from "@/components/button";
import { ApiError, errorMessage } from "@/lib/api-client";
import { useUploadAttachment } from "../api/upload-attachment";
import type { UnitSystem } from "@/lib/units";
import { fileSize } from "../lib/format";

const HINTS: Record<AttachmentKind, string> = {
  seg2: "One shot record in SEG-2 (formats 1–5, either byte order). Traces are placed by RECEIVER_LOCATION, or by channel on the plan's spread.",
  picks:
    "Columns: shot position (m), geophone position (m), time — name it time_ms or time_s, or choose the unit here.",
  borehole:
    "Columns: depth_from, depth_to (m), material, and optionally velocity (m/s). Missing velocities come from the material table.",
};

/** What a refused upload said, line by line (CSV lines and columns, SEG-2 byte offsets). */
export function uploadProblems(error: unknown): string[] {
  if (error instanceof ApiError && error.fields?.file?.length) return error.fields.file;
  return [errorMessage(error)];
}

/**
 * The upload form of the Field check: a SEG-2 shot record, a picks CSV or a borehole log.
 * The server checks the content; a refused file shows every problem it named.
 */
export function UploadPanel({
  planId,
  onUploaded,
  units = "metric",
}: {
  planId: string;
  onUploaded: (response: AttachmentUploadResponse, file: File) => void;
  /** The user's display unit: a feet user is told the files stay in metres. */
  units?: UnitSystem;
}) {
  const [kind, setKind] = useState<AttachmentKind>("seg2");
  const [timeUnit, setTimeUnit] = useState<"" | "ms" | "s">("");
  const [file, setFile] = useState<File | null>(null);
  const input = useRef<HTMLInputElement | null>(null);
  const upload = useUploadAttachment(planId);
  const tooBig = file !== null && file.size > ATTACHMENT_LIMITS[kind];

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    if (!file || tooBig) return;
    upload.mutate(
      { kind, file, ...(kind === "picks" && timeUnit ? { timeUnit } : {}) },
      {
        onSuccess: (response) => {
          onUploaded(response, file);
          setFile(null);
          if (input.current) input.current.value = "";
        },
      },
    );
  };

  return (
    <form onSubmit={submit} aria-label="Upload field data" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-ink">Kind of file</span>
          <select
            className="field-input"
            value={kind}
            onChange={(e) => {
              setKind(e.target.value as AttachmentKind);
              upload.reset();
            }}
          >
            {(Object.keys(ATTACHMENT_KIND_LABELS) as AttachmentKind[]).map((k) => (
              <option key={k} value={k}>
                {ATTACHMENT_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </label>
        {kind === "picks" ? (
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-medium text-ink">Unit of a bare time column</span>
            <select
              className="field-input"
              value={timeUnit}
              onChange={(e) => setTimeUnit(e.target.value as "" | "ms" | "s")}
            >
              <option value="">From the header</option>
              <option value="ms">Milliseconds</option>
              <option value="s">Seconds</option>
            </select>
          </label>
        ) : null}
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-ink">File to upload</span>
          <input
            ref={input}
            type="file"
            accept={ATTACHMENT_EXTENSIONS[kind].join(",")}
            className="field-input py-1 text-sm"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              upload.reset();
            }}
          />
        </label>
        <Button type="submit" disabled={!file || tooBig || upload.isPending}>
          {upload.isPending ? "Checking…" : "Upload"}
        </Button>
      </div>
      <p className="text-xs text-ink-soft">
        {HINTS[kind]}
        {units === "imperial" && kind !== "seg2"
          ? " Positions and depths in the file are in metres (m/s for velocities), whatever unit the screen shows."
          : ""}{" "}
        At most {fileSize(ATTACHMENT_LIMITS[kind])}.
      </p>
      {tooBig ? (
        <p role="alert" className="text-sm font-medium text-brick">
          {file?.name} is {fileSize(file?.size ?? 0)}; this kind of file may be at most{" "}
          {fileSize(ATTACHMENT_LIMITS[kind])}.
        </p>
      ) : null}
      {upload.isError ? (
        <div
          role="alert"
          className="rounded-md border border-brick/40 bg-brick-soft px-4 py-3 text-sm text-brick"
        >
          <p className="font-semibold">The file was not stored</p>
          <ul className="mt-1 list-disc pl-5 font-mono text-xs">
            {uploadProblems(upload.error).map((problem) => (
              <li key={problem}>{problem}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </form>
  );
}
