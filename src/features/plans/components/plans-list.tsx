import { useState } from "react";
import { Link, useNavigate, useParams } from "react-router-dom";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { can } from "@/contracts/common";
import type { MeResponse } from "@/contracts/auth";
import { PLAN_STATUS_LABELS, type PlanSummary } from "@/contracts/plans";
import { useMe } from "@/features/auth/api/me";
import { Button } from "@/components/button";
import { Field } from "@/components/field";
import { Card, EmptyState, ErrorNotice, Loading, Notice } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useSitePlans } from "../api/get-site-plans";
import { useCreatePlan } from "../api/create-plan";
import { useDuplicatePlan } from "../api/duplicate-plan";
import { useSite } from "@/features/sites/api/sites";
import { useUpdatePlan } from "../api/update-plan";
import { VerdictBadge } from "./verdict-badge";

const dateTime = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

const nameSchema = z.object({
  name: z
    .string()
    .trim()
    .min(1, "name is required")
    .max(120, "name must be at most 120 characters"),
});
type NameInput = z.infer<typeof nameSchema>;

/** What the signed-in user may do with a plan in the list (the server checks again). */
export function listPermissions(me: MeResponse | null | undefined, plan: PlanSummary) {
  if (!me) return { edit: false, duplicate: false };
  const own = plan.author.id === me.user.id;
  if (can.editPlans(me.role)) return { edit: !plan.sandbox || own, duplicate: true };
  if (can.useSandbox(me.role)) return { edit: plan.sandbox && own, duplicate: true };
  return { edit: false, duplicate: false };
}

/** May this user start a plan on a site? Leads and admins plan; trainees start sandbox scenarios. */
export const mayCreatePlan = (me: MeResponse | null | undefined) =>
  !!me && (can.editPlans(me.role) || can.useSandbox(me.role));

/** The plans of one site: a table with status, worst verdict and last change, and its actions. */
export function PlansList({
  siteId: siteIdProp,
  extraActions,
}: {
  siteId?: string;
  /** More actions beside "New plan" for those who may create plans (e.g. an import button). */
  extraActions?: React.ReactNode;
}) {
  const params = useParams();
  const siteId = siteIdProp ?? params.siteId ?? "";
  const { data: me } = useMe();
  const navigate = useNavigate();
  const plans = useSitePlans(siteId);
  const createPlan = useCreatePlan(siteId);
  const duplicatePlan = useDuplicatePlan();
  const updatePlan = useUpdatePlan();
  const [creating, setCreating] = useState(false);
  const [renamingId, setRenamingId] = useState<string | null>(null);
  const [showArchived, setShowArchived] = useState(false);
  const trainee = me ? can.useSandbox(me.role) : false;
  // An archived site takes no new plans (the server answers 409 site_archived): offer nothing
  // that would only fail, and say how to add plans again.
  const site = useSite(siteId);
  const siteArchived = site.data?.archived === true;
  const mayAdd = mayCreatePlan(me) && !siteArchived;

  const all = plans.data ?? [];
  const visible = all.filter((p) => showArchived || p.status !== "archived");
  const archivedCount = all.length - all.filter((p) => p.status !== "archived").length;

  return (
    <section aria-labelledby="plans-heading">
      <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="plans-heading" className="text-xl font-semibold text-ink-deep">
            Plans
          </h2>
          <p className="text-sm text-ink-soft">
            {trainee
              ? "Team plans to study, and your own scenarios in your sandbox."
              : "Survey designs for this site, each with its candidate ground models and spread."}
          </p>
        </div>
        {mayAdd && !creating ? (
          <div className="flex flex-wrap items-start gap-2">
            {extraActions}
            <Button onClick={() => setCreating(true)}>
              {trainee ? "New sandbox scenario" : "New plan"}
            </Button>
          </div>
        ) : null}
      </div>

      {siteArchived && mayCreatePlan(me) ? (
        <p className="mb-3 rounded-md border border-rule bg-paper-deep px-3 py-2 text-sm text-ink-soft">
          This site is archived: its plans can be read but no plans can be added or copied here.
          Restore the site on the Sites page to plan on it again.
        </p>
      ) : null}
      {creating ? (
        <Card className="mb-4">
          <h3 className="mb-3 font-semibold text-ink">
            {trainee ? "New sandbox scenario" : "New plan"}
          </h3>
          {trainee ? (
            <p className="mb-3 text-sm text-ink-soft">
              Scenarios live in your personal sandbox: only you edit them.
            </p>
          ) : null}
          <NameForm
            label="Plan name"
            submitLabel="Create plan"
            pending={createPlan.isPending}
            error={createPlan.error}
            onCancel={() => {
              setCreating(false);
              createPlan.reset();
            }}
            onSubmit={({ name }) =>
              createPlan.mutate({ name }, { onSuccess: (plan) => navigate(paths.plan(plan.id)) })
            }
          />
        </Card>
      ) : null}

      {plans.isPending ? <Loading label="Loading plans…" /> : null}
      {plans.isError ? (
        <ErrorNotice
          error={plans.error}
          title="Cannot list the plans"
          onRetry={() => plans.refetch()}
        />
      ) : null}
      {duplicatePlan.isError ? (
        <ErrorNotice error={duplicatePlan.error} title="Could not duplicate the plan" />
      ) : null}
      {updatePlan.isError && !renamingId ? (
        <ErrorNotice error={updatePlan.error} title="Could not change the plan" />
      ) : null}

      {plans.data && visible.length === 0 ? (
        <EmptyState title="No plans yet">
          {mayAdd
            ? "Start one to model the ground and try a spread."
            : "A survey lead starts the plans for a site."}
        </EmptyState>
      ) : null}

      {visible.length > 0 ? (
        <div className="overflow-x-auto rounded-lg border border-rule bg-card">
          {/* Below 640 px each plan reads as a small card (no sideways scroll on a phone). */}
          <table className="block w-full text-left text-sm sm:table">
            <thead className="hidden border-b border-rule bg-paper-deep/60 text-xs tracking-wide text-ink-soft uppercase sm:table-header-group">
              <tr>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Name
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Author
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Status
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Worst verdict
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  Last change
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody className="block sm:table-row-group">
              {visible.map((plan) => {
                const allowed = listPermissions(me, plan);
                const archived = plan.status === "archived";
                return (
                  <tr
                    key={plan.id}
                    className={`flex flex-wrap items-center gap-x-3 gap-y-1 border-b border-rule px-3 py-2.5 last:border-0 sm:table-row sm:p-0 ${archived ? "text-ink-faint" : ""}`}
                  >
                    <td className="basis-full sm:px-4 sm:py-2.5">
                      {renamingId === plan.id ? (
                        <NameForm
                          label={`New name for ${plan.name}`}
                          initial={plan.name}
                          submitLabel="Rename"
                          compact
                          pending={updatePlan.isPending}
                          error={updatePlan.error}
                          onCancel={() => {
                            setRenamingId(null);
                            updatePlan.reset();
                          }}
                          onSubmit={({ name }) =>
                            updatePlan.mutate(
                              { id: plan.id, name },
                              { onSuccess: () => setRenamingId(null) },
                            )
                          }
                        />
                      ) : (
                        <span className="flex flex-wrap items-center gap-2">
                          <Link
                            to={paths.plan(plan.id)}
                            className="font-medium text-ink-deep hover:underline"
                          >
                            {plan.name}
                          </Link>
                          {plan.sandbox ? (
                            <span className="rounded-full border border-ochre/60 bg-ochre-soft px-2 py-0.5 text-xs font-medium text-ink-deep">
                              Sandbox
                            </span>
                          ) : null}
                        </span>
                      )}
                    </td>
                    <td className="text-xs max-sm:before:content-['by_'] sm:px-4 sm:py-2.5 sm:text-sm">
                      {plan.author.name}
                    </td>
                    <td className="text-xs sm:px-4 sm:py-2.5 sm:text-sm">
                      {PLAN_STATUS_LABELS[plan.status]}
                    </td>
                    <td className="sm:px-4 sm:py-2.5">
                      <VerdictBadge verdict={plan.worstVerdict} />
                    </td>
                    <td className="font-mono text-xs whitespace-nowrap text-ink-soft sm:px-4 sm:py-2.5">
                      {dateTime.format(new Date(plan.updatedAt))} · rev {plan.revision}
                    </td>
                    <td className="basis-full sm:px-4 sm:py-2.5">
                      <div className="flex flex-wrap gap-1 sm:justify-end">
                        {allowed.duplicate && !archived && !siteArchived ? (
                          <Button
                            variant="quiet"
                            aria-label={`Duplicate ${plan.name}`}
                            disabled={duplicatePlan.isPending}
                            onClick={() =>
                              duplicatePlan.mutate(
                                { id: plan.id, name: `${plan.name} (copy)`.slice(0, 120) },
                                { onSuccess: (copy) => navigate(paths.plan(copy.id)) },
                              )
                            }
                          >
                            Duplicate
                          </Button>
                        ) : null}
                        {allowed.edit && !archived ? (
                          <Button
                            variant="quiet"
                            aria-label={`Rename ${plan.name}`}
                            onClick={() => setRenamingId(plan.id)}
                          >
                            Rename
                          </Button>
                        ) : null}
                        {allowed.edit ? (
                          <Button
                            variant="quiet"
                            aria-label={`${archived ? "Restore" : "Archive"} ${plan.name}`}
                            disabled={updatePlan.isPending}
                            onClick={() => updatePlan.mutate({ id: plan.id, archived: !archived })}
                          >
                            {archived ? "Restore" : "Archive"}
                          </Button>
                        ) : null}
                      </div>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}

      {archivedCount > 0 ? (
        <label className="mt-3 flex items-center gap-2 text-sm text-ink-soft">
          <input
            type="checkbox"
            checked={showArchived}
            onChange={(e) => setShowArchived(e.target.checked)}
          />
          Show {archivedCount} archived plan{archivedCount === 1 ? "" : "s"}
        </label>
      ) : null}
      {me && me.role === "reviewer" ? (
        <div className="mt-3">
          <Notice>Reviewers read plans and their analysis; a survey lead edits them.</Notice>
        </div>
      ) : null}
    </section>
  );
}

function NameForm({
  label,
  initial = "",
  submitLabel,
  compact = false,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  label: string;
  initial?: string;
  submitLabel: string;
  compact?: boolean;
  pending: boolean;
  error: unknown;
  onSubmit: (values: NameInput) => void;
  onCancel: () => void;
}) {
  const form = useForm<NameInput>({
    resolver: zodResolver(nameSchema),
    defaultValues: { name: initial },
  });
  return (
    <form
      noValidate
      className={compact ? "flex flex-col gap-2" : "flex max-w-lg flex-col gap-3"}
      onSubmit={form.handleSubmit(onSubmit)}
    >
      <Field label={label} error={form.formState.errors.name?.message}>
        <input className="field-input" autoFocus={compact} {...form.register("name")} />
      </Field>
      {error ? <ErrorNotice error={error} title="The server refused" /> : null}
      <div className="flex gap-2">
        <Button type="submit" disabled={pending}>
          {submitLabel}
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
