import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { Link, useParams } from "react-router-dom";
import type {
  AttachmentSummary,
  AttachmentUploadResponse,
  FirstBreakPick,
} from "@/contracts/field";
import { PLAN_STATUS_LABELS, type PlanDetail } from "@/contracts/plans";
import type { MeResponse } from "@/contracts/auth";
import { paths } from "@/app/paths";
import { Button } from "@/components/button";
import { ErrorBoundary } from "@/components/error-boundary";
import { Card, EmptyState, ErrorNotice, Loading, Notice, PageHeader } from "@/components/feedback";
import { useMe } from "@/features/auth/api/me";
import { errorMessage } from "@/lib/api-client";
import type { PickQuality, PickerChoice, Seg2Record } from "../../../../workers/field/index";
import { isLayeredModel } from "@engine";
import { useAddCandidateModel } from "../api/add-model";
import { fetchAttachmentBytes, attachmentContentUrl } from "../api/attachment-content";
import { useDeleteAttachment } from "../api/delete-attachment";
import { useFieldPlan } from "../api/get-plan";
import { usePicks } from "../api/get-picks";
import { useAttachments } from "../api/list-attachments";
import { useSavePicks } from "../api/save-picks";
import type { Candidate, Comparison } from "../lib/comparison";
import { fieldWorker } from "../lib/field-worker";
import { length } from "../lib/format";
import { useFieldResult } from "../lib/use-field-result";
import {
  adjustPick,
  countByOrigin,
  mergePicks,
  nearestShot,
  placeTraces,
  samePicks,
} from "../lib/picks";
import { AttachmentList } from "./attachment-list";
import {
  FitTable,
  MisfitWarnings,
  ResidualChart,
  ResidualTable,
  TimeDistanceChart,
} from "./comparison-panel";
import { ExportLinks } from "./export-links";
import { InterpretationPanel } from "./interpretation-panel";
import { RecordSection, recordSpan, type SectionView } from "./record-section";
import { SegmentsPanel } from "./segments-panel";
import { UploadPanel } from "./upload-panel";

/** Who may change field data and who may export (design.md role table; the server decides too). */
export function fieldRights(plan: PlanDetail, me: MeResponse | null | undefined) {
  if (!me) return { edit: false, export: false };
  const own = plan.author.id === me.user.id;
  const edit =
    plan.status !== "archived" &&
    (plan.sandbox ? own && me.role !== "reviewer" : me.role === "admin" || me.role === "lead");
  const exporter = me.role !== "trainee" || (plan.sandbox && own);
  return { edit, export: exporter };
}

/** Pickers offered, by key (the key is saved with the picks). */
export const PICKERS: { key: string; label: string; choice: PickerChoice }[] = [
  {
    key: "onset",
    label: "Onset above the noise, checked against neighbours (recommended)",
    choice: { method: "onset" },
  },
  {
    key: "sta-lta+aic",
    label: "STA/LTA refined by AIC (Allen 1978; Maeda 1985)",
    choice: { method: "sta-lta", options: { refine: "aic" } },
  },
  { key: "sta-lta", label: "STA/LTA trigger (Allen 1978)", choice: { method: "sta-lta" } },
  {
    key: "energy-ratio",
    label: "Modified energy ratio (Han, Wong & Bancroft 2009)",
    choice: { method: "energy-ratio" },
  },
];

interface OpenRecord {
  attachment: AttachmentSummary;
  record: Seg2Record;
  /** Shot position the traces are placed against, m. */
  sourcePosition: number;
}

/** The *Field check* screen of a plan: route /plans/:planId/field. */
export function FieldCheckPage() {
  const { planId = "" } = useParams();
  const plan = useFieldPlan(planId);
  const attachments = useAttachments(planId);
  const saved = usePicks(planId);
  const me = useMe();
  if (plan.isPending || saved.isPending || attachments.isPending)
    return <Loading label="Loading the field check…" />;
  if (plan.isError) return <ErrorNotice error={plan.error} title="Cannot show this plan" />;
  if (saved.isError) return <ErrorNotice error={saved.error} title="Cannot load the saved picks" />;
  if (attachments.isError)
    return <ErrorNotice error={attachments.error} title="Cannot list the field data" />;
  return (
    <FieldCheck
      key={plan.data.id}
      plan={plan.data}
      attachments={attachments.data}
      savedPicks={saved.data.picks}
      savedAttachmentId={saved.data.attachmentId}
      me={me.data}
    />
  );
}

function FieldCheck({
  plan,
  attachments,
  savedPicks,
  savedAttachmentId,
  me,
}: {
  plan: PlanDetail;
  attachments: AttachmentSummary[];
  savedPicks: FirstBreakPick[];
  savedAttachmentId: string | null;
  me: MeResponse | null | undefined;
}) {
  const rights = fieldRights(plan, me);
  const doc = plan.document;
  const [draft, setDraft] = useState<FirstBreakPick[] | null>(null);
  const picks = draft ?? savedPicks;
  const dirty = draft !== null && !samePicks(draft, savedPicks);
  const [open, setOpen] = useState<OpenRecord | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [notice, setNotice] = useState<{
    tone: "info" | "caution" | "success";
    text: string;
  } | null>(null);
  const [picker, setPicker] = useState(PICKERS[0].key);
  const [picking, setPicking] = useState(false);
  const [selected, setSelected] = useState<number | null>(null);
  const [view, setView] = useState<SectionView | null>(null);
  /** Quality word of the automatic picks, by "shot|geophone" (positions in m). */
  const [qualities, setQualities] = useState<Map<string, PickQuality>>(new Map());
  const units = me?.preferences.units ?? "metric";
  const save = useSavePicks(plan.id);
  const remove = useDeleteAttachment(plan.id);
  const addModel = useAddCandidateModel(plan);

  const candidates = useMemo<Candidate[]>(() => {
    // section models are not compared with field picks (yet): only layered ones
    const fromPlan = doc.models
      .filter(isLayeredModel)
      .map((m) => ({ name: m.name, model: m, source: "plan" as const }));
    const names = new Set(doc.models.map((m) => m.name));
    const fromLogs = attachments.flatMap((a) =>
      a.facts.kind === "borehole" && !names.has(a.facts.model.name)
        ? [{ name: a.facts.model.name, model: a.facts.model, source: "borehole" as const }]
        : [],
    );
    return [...fromPlan, ...fromLogs];
  }, [doc.models, attachments]);
  // Fits, misfit warnings and modelled times are computed in the field worker; an answer for
  // older picks or models is never shown as current.
  const compared = useFieldResult(
    "compare",
    useMemo(
      () => ({
        picks: picks.map((p) => ({
          sourcePosition: p.sourcePosition,
          receiverPosition: p.receiverPosition,
          time: p.time,
        })),
        candidates: candidates.map((c) => ({ name: c.name, model: c.model })),
        selected,
        pickError: doc.criteria.pickError,
      }),
      [picks, candidates, selected, doc.criteria.pickError],
    ),
    (i) => fieldWorker().compare(i.picks, i.candidates, i.selected, i.pickError),
  );
  const comparison: Comparison | null = compared.data
    ? { fits: compared.data.fits, best: compared.data.best }
    : null;
  const shown = compared.data?.shown ?? selected ?? 0;
  const shownCandidate = candidates[shown];
  const warnings = compared.data?.warnings ?? [];

  const placements = useMemo(
    () => (open ? placeTraces(open.record.traces, doc.spread, open.sourcePosition) : []),
    [open, doc.spread],
  );
  const modelledRun = useFieldResult(
    "modelled-times",
    useMemo(
      () =>
        open && shownCandidate
          ? {
              model: shownCandidate.model,
              pairs: placements.map((p) => [p.sourcePosition, p.receiverPosition]) as [
                number,
                number,
              ][],
            }
          : null,
      [open, placements, shownCandidate],
    ),
    (i) => fieldWorker().modelledTimes(i.model, i.pairs),
  );
  const modelled = open && shownCandidate ? (modelledRun.data ?? null) : null;
  // The record's first window waits for the modelled times (when there is a model to wait for).
  const modelledReady = !open || !shownCandidate || modelledRun.current;

  // A newly opened record starts with a window that shows its first breaks well.
  const windowFor = useRef<string | null>(null);
  useEffect(() => {
    if (!open || !modelledReady) return;
    const openKey = `${open.attachment.id}|${open.sourcePosition}`;
    if (windowFor.current === openKey) return;
    windowFor.current = openKey;
    const span = recordSpan(open.record);
    const latest = Math.max(0, ...(modelled ?? []).map((t) => t ?? 0));
    const end = latest > 0 ? Math.min(span[1], Math.max(0.05, latest * 2.2)) : span[1];
    setView({ mode: "both", gain: 1.5, clip: 1, scaling: "trace", window: [span[0], end] });
    // Only when another record (or shot) is opened, not when the model shown changes.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [open?.attachment.id, open?.sourcePosition, modelledReady]);

  const openRecord = useCallback(
    async (attachment: AttachmentSummary, bytes?: ArrayBuffer) => {
      setBusy(attachment.id);
      setNotice(null);
      try {
        const data = bytes ?? (await fetchAttachmentBytes(attachment.id));
        const record = await fieldWorker().readSeg2(data);
        const recorded =
          record.traces.find((t) => t.sourcePosition !== null)?.sourcePosition ?? null;
        const sourcePosition =
          recorded ?? doc.spread.shots[nearestShot(doc.spread.shots, null)].position;
        setOpen({ attachment, record, sourcePosition });
      } catch (error) {
        setNotice({
          tone: "caution",
          text: `Could not open ${attachment.fileName}: ${errorMessage(error)}`,
        });
      } finally {
        setBusy(null);
      }
    },
    [doc.spread.shots],
  );

  const loadCsvPicks = async (attachment: AttachmentSummary, given?: FirstBreakPick[]) => {
    setNotice(null);
    try {
      let incoming = given;
      if (!incoming) {
        const text = new TextDecoder().decode(await fetchAttachmentBytes(attachment.id));
        const unit = attachment.facts.kind === "picks" ? attachment.facts.timeUnit : "ms";
        const result = await fieldWorker().parsePicksCsv(text, { timeUnit: unit });
        if (!result.ok) throw new Error(result.errors.map((e) => e.message).join("; "));
        incoming = result.rows.map((r) => ({
          sourcePosition: r.shotPosition,
          receiverPosition: r.geophonePosition,
          time: r.time,
          origin: "csv" as const,
        }));
      }
      setDraft((d) => mergePicks(d ?? savedPicks, incoming));
      setNotice({
        tone: "info",
        text: `${incoming.length} picks from ${attachment.fileName} are on the chart${rights.edit ? "; save the picks to keep them" : ""}.`,
      });
    } catch (error) {
      setNotice({
        tone: "caution",
        text: `Could not use ${attachment.fileName}: ${errorMessage(error)}`,
      });
    }
  };

  const onUploaded = (response: AttachmentUploadResponse, file: File) => {
    const a = response.attachment;
    if (a.kind === "seg2") {
      void file.arrayBuffer().then((bytes) => openRecord(a, bytes));
    } else if (a.kind === "picks" && response.picks) {
      void loadCsvPicks(a, response.picks);
    } else if (a.kind === "borehole" && response.model) {
      setNotice({
        tone: "success",
        text: `${a.fileName} builds “${response.model.name}” (${response.model.layers.length} layers); it is compared with the picks below${rights.edit ? " and can be added to the plan as a candidate model" : ""}.`,
      });
    }
  };

  const autoPick = async () => {
    if (!open) return;
    setPicking(true);
    setNotice(null);
    try {
      const traces = open.record.traces.map((t) => ({
        index: t.index,
        samples: t.samples,
        sampleInterval: t.sampleInterval,
        delay: t.delay,
        channel: t.channel,
        receiverPosition: t.receiverPosition,
        sourcePosition: t.sourcePosition,
      }));
      const chosen = (PICKERS.find((p) => p.key === picker) ?? PICKERS[0]).choice;
      // The onset picker searches around the best-fitting model's arrivals when there is one.
      const choice: PickerChoice =
        chosen.method === "onset" && modelled
          ? { method: "onset", options: { predicted: modelled } }
          : chosen;
      const result = await fieldWorker().pickRecord(traces, choice);
      setQualities((q) => {
        const next = new Map(q);
        result.forEach((r, i) => {
          const place = placements[i];
          next.set(`${place.sourcePosition}|${place.receiverPosition}`, r.quality);
        });
        return next;
      });
      const incoming: FirstBreakPick[] = [];
      const missed: string[] = [];
      result.forEach((r, i) => {
        const place = placements[i];
        if (r.time === null) missed.push(`channel ${r.channel}: ${r.reason}`);
        else
          incoming.push({
            sourcePosition: place.sourcePosition,
            receiverPosition: place.receiverPosition,
            time: r.time,
            origin: "auto",
          });
      });
      setDraft((d) => mergePicks(d ?? savedPicks, incoming));
      const weak = result.filter((r) => r.quality === "weak").length;
      setNotice({
        tone: missed.length || weak ? "caution" : "success",
        text: `${incoming.length} of ${result.length} traces picked automatically${weak ? `, ${weak} of them weak (faint or off their neighbours' trend: check them)` : ""}.${missed.length ? ` No pick on ${missed.join("; ")}.` : ""} Click a trace to adjust its pick.`,
      });
    } catch (error) {
      setNotice({ tone: "caution", text: `Automatic picking failed: ${errorMessage(error)}` });
    } finally {
      setPicking(false);
    }
  };

  const savePicks = () => {
    save.mutate(
      {
        picks: picks.map((p) => ({ ...p })),
        attachmentId: open?.attachment.id ?? savedAttachmentId ?? null,
        picker,
      },
      {
        onSuccess: () => {
          setDraft(null);
          setNotice({ tone: "success", text: `${picks.length} picks saved to the plan.` });
        },
      },
    );
  };

  const counts = countByOrigin(picks);
  const siteLink = paths.site(plan.siteId);
  const spreadExtent: [number, number] = [
    doc.spread.firstGeophone,
    doc.spread.firstGeophone + (doc.spread.channels - 1) * doc.spread.spacing,
  ];
  const recordShots = open
    ? [
        ...new Set([
          ...open.record.traces.flatMap((t) =>
            t.sourcePosition === null ? [] : [t.sourcePosition],
          ),
          ...doc.spread.shots.map((s) => s.position),
        ]),
      ]
    : [];

  return (
    <div className="flex flex-col gap-6">
      <p className="-mb-4 text-sm">
        <Link to={siteLink} className="text-ink underline">
          {plan.siteName || "Site"}
        </Link>
        {" › "}
        <Link to={paths.plan(plan.id)} className="text-ink underline">
          {plan.name}
        </Link>
        {" › Field check"}
      </p>
      <PageHeader
        title="Field check"
        subtitle={`${plan.name} · revision ${plan.revision} · ${PLAN_STATUS_LABELS[plan.status]}${plan.sandbox ? " · sandbox" : ""}`}
        actions={rights.export ? <ExportLinks planId={plan.id} /> : undefined}
      />
      <p className="-mt-3 max-w-3xl text-sm text-ink-soft">
        Bring in a pilot shot and see at once whether the ground behaves as planned. A good fit
        supports the plan; it does not prove it — boreholes and a qualified geophysicist's review
        decide.
      </p>

      <ErrorBoundary title="The field data panel failed">
        <Card>
          <h2 className="mb-3 text-lg font-semibold text-ink-deep">Field data</h2>
          {rights.edit ? (
            <UploadPanel planId={plan.id} onUploaded={onUploaded} units={units} />
          ) : (
            <p className="mb-2 text-sm text-ink-soft">
              Your role may read and download this plan's field data; uploads are for the plan's
              editors.
            </p>
          )}
          <div className="mt-4">
            <AttachmentList
              attachments={attachments}
              openId={open?.attachment.id ?? null}
              canEdit={rights.edit}
              inPlan={doc.models.map((m) => m.name)}
              busyId={busy}
              units={units}
              onOpen={(a) => void openRecord(a)}
              onLoadPicks={(a) => void loadCsvPicks(a)}
              onAddModel={(a) => {
                if (a.facts.kind !== "borehole") return;
                addModel.mutate(a.facts.model, {
                  onSuccess: (p) =>
                    setNotice({
                      tone: "success",
                      text: `“${a.facts.kind === "borehole" ? a.facts.model.name : ""}” is now a candidate model of the plan (revision ${p.revision}).`,
                    }),
                  onError: (e) =>
                    setNotice({
                      tone: "caution",
                      text: `Could not add the model: ${errorMessage(e)}`,
                    }),
                });
              }}
              onDelete={(a) => {
                if (!window.confirm(`Delete ${a.fileName}? Saved picks stay.`)) return;
                remove.mutate(a.id, {
                  onSuccess: () => {
                    if (open?.attachment.id === a.id) setOpen(null);
                  },
                  onError: (e) =>
                    setNotice({
                      tone: "caution",
                      text: `Could not delete ${a.fileName}: ${errorMessage(e)}`,
                    }),
                });
              }}
            />
          </div>
          {notice ? (
            <div className="mt-3">
              <Notice tone={notice.tone}>{notice.text}</Notice>
            </div>
          ) : null}
        </Card>
      </ErrorBoundary>

      {open && view ? (
        <ErrorBoundary title="The shot record failed to draw">
          <Card>
            <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
              <div>
                <h2 className="text-lg font-semibold text-ink-deep">Shot record</h2>
                <p className="text-sm text-ink-soft">
                  {open.attachment.fileName} · {open.record.traces.length} traces
                  {placements.some((p) => p.receiverFrom === "plan")
                    ? " · geophones placed by channel on the plan's spread (the record states no RECEIVER_LOCATION)"
                    : ""}
                </p>
              </div>
              <div className="flex flex-wrap items-end gap-3">
                <label className="flex flex-col gap-1 text-sm">
                  <span className="font-medium text-ink">Shot point</span>
                  <select
                    className="field-input py-1"
                    value={open.sourcePosition}
                    onChange={(e) => setOpen({ ...open, sourcePosition: Number(e.target.value) })}
                  >
                    {recordShots.map((s) => {
                      const planShot = doc.spread.shots.find((x) => x.position === s);
                      return (
                        <option key={s} value={s}>
                          {length(s, units)}
                          {planShot?.label
                            ? ` (${planShot.label})`
                            : planShot
                              ? ""
                              : " (as recorded)"}
                        </option>
                      );
                    })}
                  </select>
                </label>
                {rights.edit ? (
                  <>
                    <label className="flex flex-col gap-1 text-sm">
                      <span className="font-medium text-ink">Picker</span>
                      <select
                        className="field-input py-1"
                        value={picker}
                        onChange={(e) => setPicker(e.target.value)}
                      >
                        {PICKERS.map((p) => (
                          <option key={p.key} value={p.key}>
                            {p.label}
                          </option>
                        ))}
                      </select>
                    </label>
                    <Button onClick={() => void autoPick()} disabled={picking}>
                      {picking ? "Picking…" : "Pick first breaks"}
                    </Button>
                  </>
                ) : null}
                <a
                  className="text-sm text-ink underline"
                  href={attachmentContentUrl(open.attachment.id)}
                  download={open.attachment.fileName}
                >
                  Download record
                </a>
              </div>
            </div>
            <RecordSection
              record={open.record}
              placements={placements}
              picks={picks}
              quality={placements.map(
                (p) => qualities.get(`${p.sourcePosition}|${p.receiverPosition}`) ?? null,
              )}
              modelled={modelled}
              modelName={shownCandidate?.name ?? null}
              view={view}
              onViewChange={setView}
              editable={rights.edit}
              units={units}
              onAdjust={(traceIndex, time) => {
                const p = placements[traceIndex];
                setDraft((d) =>
                  adjustPick(d ?? savedPicks, p.sourcePosition, p.receiverPosition, time),
                );
              }}
            />
            {modelled && shownCandidate ? (
              <p className="mt-2 text-xs text-ink-soft">
                Dashed ochre line: first arrivals of “{shownCandidate.name}” for this shot and these
                geophones.
              </p>
            ) : null}
            {placements.some((p) => qualities.has(`${p.sourcePosition}|${p.receiverPosition}`)) ? (
              <p className="mt-1 text-xs text-ink-soft">
                Automatic picks: a solid mark is clear; dashed with an ochre ring is weak (faint, or
                off its neighbours' trend — check it by eye); a brick × marks a trace without a
                pick.
              </p>
            ) : null}
          </Card>
        </ErrorBoundary>
      ) : null}

      <section
        aria-label="Picks"
        className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-rule bg-card px-5 py-3"
      >
        <p className="text-sm" aria-live="polite">
          <span className="font-semibold text-ink-deep">{picks.length} picks</span>{" "}
          <span className="text-ink-soft">
            ({counts.auto} automatic, {counts.adjusted} adjusted, {counts.csv} from CSV)
          </span>
          {dirty ? (
            <span className="ml-2 rounded-full bg-ochre-soft px-2 py-0.5 text-xs font-semibold text-ink-deep">
              unsaved changes
            </span>
          ) : picks.length ? (
            <span className="ml-2 text-xs text-moss">saved</span>
          ) : null}
          {save.isError ? (
            <span role="alert" className="ml-2 text-brick">
              {errorMessage(save.error)}
            </span>
          ) : null}
        </p>
        {rights.edit ? (
          <div className="flex gap-2">
            <Button
              variant="quiet"
              disabled={!dirty || save.isPending}
              onClick={() => setDraft(null)}
            >
              Discard changes
            </Button>
            <Button disabled={!dirty || save.isPending} onClick={savePicks}>
              {save.isPending ? "Saving…" : "Save picks"}
            </Button>
          </div>
        ) : null}
      </section>

      <ErrorBoundary title="The comparison with the plan failed">
        <Card>
          <h2 className="mb-1 text-lg font-semibold text-ink-deep">Against the plan</h2>
          {picks.length === 0 ? (
            <EmptyState title="No picks yet">
              Open a shot record and pick its first breaks, or upload picks as CSV.
            </EmptyState>
          ) : (
            <div className="flex flex-col gap-5">
              <p className="text-sm text-ink-soft">
                Observed picks against the modelled first arrivals of every candidate ground model
                for the same shots and geophones. The best fit has the lowest RMS residual among the
                models that give a time for the most picks.
              </p>
              {comparison === null ? (
                <p className="text-sm text-ink-soft" role="status">
                  Comparing the picks with the models…
                </p>
              ) : null}
              {comparison ? (
                <FitTable
                  comparison={comparison}
                  candidates={candidates}
                  selected={shown}
                  onSelect={setSelected}
                />
              ) : null}
              <TimeDistanceChart
                picks={picks}
                candidates={candidates}
                selected={shown}
                spreadExtent={spreadExtent}
                units={units}
              />
              {comparison?.fits[shown] ? (
                <div>
                  <h3 className="mb-1 text-sm font-semibold text-ink">
                    Residuals per geophone — {comparison.fits[shown].name}
                  </h3>
                  <ResidualChart
                    fit={comparison.fits[shown]}
                    pickError={doc.criteria.pickError}
                    units={units}
                  />
                  <ResidualTable fit={comparison.fits[shown]} units={units} />
                </div>
              ) : null}
              {comparison ? (
                <div>
                  <h3 className="mb-2 text-sm font-semibold text-ink">Misfit patterns</h3>
                  <MisfitWarnings
                    warnings={warnings}
                    modelName={shownCandidate?.name ?? "the model"}
                    units={units}
                  />
                </div>
              ) : null}
            </div>
          )}
        </Card>
      </ErrorBoundary>

      {picks.length > 0 ? (
        <ErrorBoundary title="The interpretation under the line failed">
          <Card>
            <h2 className="mb-1 text-lg font-semibold text-ink-deep">Under the line</h2>
            <p className="mb-3 text-sm text-ink-soft">
              Reversed shots interpreted geophone by geophone: each refractor's depth and elevation
              under every geophone with its uncertainty, and its velocity along the line. Assign the
              picks to refractors, choose the method and the datum.
            </p>
            <InterpretationPanel
              planId={plan.id}
              canSave={rights.edit}
              picks={picks}
              models={doc.models}
              candidates={candidates}
              pickError={doc.criteria.pickError}
              units={units}
            />
          </Card>
        </ErrorBoundary>
      ) : null}

      {picks.length > 0 ? (
        <ErrorBoundary title="The segment reading failed">
          <Card>
            <h2 className="mb-1 text-lg font-semibold text-ink-deep">
              Segments and intercept times
            </h2>
            <p className="mb-3 text-sm text-ink-soft">
              Choose the straight segments of one shot's picks: each gives an apparent velocity and
              an intercept time, and together they give the layer depths under the shot by the
              intercept-time method.
            </p>
            <SegmentsPanel
              picks={picks}
              candidate={shownCandidate}
              pickError={doc.criteria.pickError}
              units={units}
            />
          </Card>
        </ErrorBoundary>
      ) : null}
    </div>
  );
}
