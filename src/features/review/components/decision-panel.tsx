import { useEffect, useRef } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { useQueryClient } from "@tanstack/react-query";
import {
  decisionNoteSchema,
  requestChangesSchema,
  type PlanDetail,
  type PlanStatus,
} from "@/contracts/plans";
import { Button } from "@/components/button";
import { Field } from "@/components/field";
import { ErrorNotice, Notice } from "@/components/feedback";
import { ApiError } from "@/lib/api-client";
import { useApprovePlan } from "../api/approve-plan";
import { useRequestChanges } from "../api/request-changes";
import { useSubmitPlan } from "../api/submit-plan";
import { useReopenPlan } from "../api/reopen-plan";
import { reviewKeys } from "../api/review-keys";

type NoteForm = { note: string };
type Intent = "approve" | "request" | "submit";
type Errors = Record<string, never>;

/** What happens next, in plain words, when the user has no button for this status. */
const WAITING: Record<PlanStatus, string> = {
  draft: "The plan is a draft. A survey lead submits it for review when it is ready.",
  "in-review":
    "The plan is with the reviewers. A reviewer signs it off for mobilisation or returns it to the lead with notes.",
  "changes-requested":
    "A reviewer returned the plan with notes. A survey lead revises it and submits it again.",
  approved:
    "The plan is signed off for mobilisation and read-only. A survey lead can start a new revision.",
  archived: "The plan is archived.",
};

/** A sandbox scenario never enters the review workflow (docs/api.md, Plans). */
const SANDBOX =
  "This is a sandbox scenario: it stays with its author and is never submitted for review. An admin can adopt it by duplicating it as a team plan.";

/**
 * The workflow buttons this user may press right now, as the server's `permissions` say: submit
 * (leads), sign off for mobilisation (API: approve) or return to the lead with a required note
 * (API: request-changes) (reviewers), start a new revision of a signed-off plan (leads).
 */
export function DecisionPanel({ plan }: { plan: PlanDetail }) {
  const { permissions } = plan;
  const submit = useSubmitPlan(plan.id);
  const approve = useApprovePlan(plan.id);
  const request = useRequestChanges(plan.id);
  const reopen = useReopenPlan(plan.id);
  const intent = useRef<Intent>("approve");
  // Returning the plan needs a note; signing off or submitting takes an optional one.
  const resolver: Resolver<NoteForm> = (values) => {
    const schema = intent.current === "request" ? requestChangesSchema : decisionNoteSchema;
    const parsed = schema.safeParse(values);
    if (parsed.success) return { values: { note: parsed.data.note ?? "" }, errors: {} as Errors };
    const message = parsed.error.issues[0]?.message ?? "check the note";
    return { values: {} as Errors, errors: { note: { type: "validate", message } } };
  };
  const form = useForm<NoteForm>({ resolver, defaultValues: { note: "" } });
  const pending = submit.isPending || approve.isPending || request.isPending || reopen.isPending;
  const failed = [submit, approve, request, reopen].find((m) => m.isError);
  const done = [submit, approve, request, reopen].find((m) => m.isSuccess);
  // The plan moved on in another tab or by another reviewer: the server's refusal ("cannot
  // approve a plan that is …") is in the API's words; say it in ours and show where it stands.
  const movedOn =
    failed !== undefined &&
    failed.error instanceof ApiError &&
    failed.error.code === "illegal_transition";
  const queryClient = useQueryClient();
  useEffect(() => {
    if (movedOn) void queryClient.invalidateQueries({ queryKey: reviewKeys.plan(plan.id) });
  }, [movedOn, queryClient, plan.id]);

  const run = (which: Intent) => {
    intent.current = which;
    form.clearErrors();
    void form.handleSubmit(({ note }) => {
      const text = note?.trim() || undefined;
      const options = { onSuccess: () => form.reset({ note: "" }) };
      if (which === "request") request.mutate(text ?? "", options);
      else if (which === "approve") approve.mutate(text, options);
      else submit.mutate(text, options);
    })();
  };

  const withNote = permissions.decide || permissions.submit;
  const nothing = !permissions.decide && !permissions.submit && !permissions.reopen;

  return (
    <div className="flex flex-col gap-3">
      {nothing ? (
        <p className="text-sm text-ink-soft">
          {plan.sandbox && plan.status !== "archived" ? SANDBOX : WAITING[plan.status]}
        </p>
      ) : null}
      {withNote ? (
        <form noValidate onSubmit={(e) => e.preventDefault()} className="flex flex-col gap-3">
          <Field
            label={permissions.decide ? "Note for the survey lead" : "Note for the reviewers"}
            hint={
              permissions.decide
                ? "Required when you return the plan to the lead; optional when you sign it off."
                : "Optional: what changed, what to look at."
            }
            error={form.formState.errors.note?.message}
          >
            <textarea
              className="field-input min-h-20 resize-y"
              rows={3}
              {...form.register("note")}
            />
          </Field>
          <div className="flex flex-wrap gap-2">
            {permissions.decide ? (
              <>
                <Button
                  disabled={pending}
                  onClick={() => run("approve")}
                  className="bg-moss hover:bg-moss/90"
                >
                  ✓ Sign off for mobilisation
                </Button>
                <Button variant="danger" disabled={pending} onClick={() => run("request")}>
                  ↺ Return to lead with notes
                </Button>
              </>
            ) : null}
            {permissions.submit ? (
              <Button disabled={pending} onClick={() => run("submit")}>
                Submit for review
              </Button>
            ) : null}
          </div>
        </form>
      ) : null}
      {permissions.reopen ? (
        <div className="flex flex-col gap-2">
          <p className="text-sm text-ink-soft">
            Signed-off plans are read-only. A new revision returns the plan to draft so it can be
            edited and reviewed again.
          </p>
          <div>
            <Button variant="secondary" disabled={pending} onClick={() => reopen.mutate()}>
              Start a new revision
            </Button>
          </div>
        </div>
      ) : null}
      {movedOn ? (
        <Notice tone="caution">
          This step no longer applies: someone moved the plan on meanwhile. The screen now shows
          where it stands.
        </Notice>
      ) : failed ? (
        <ErrorNotice error={failed.error} title="The plan did not move on" />
      ) : null}
      {done && !failed ? (
        <Notice tone="success">Done: the plan is now {label(plan)}.</Notice>
      ) : null}
    </div>
  );
}

const label = (plan: PlanDetail) =>
  ({
    draft: "a draft",
    "in-review": "in review",
    "changes-requested": "back with the survey lead, with notes",
    approved: "signed off for mobilisation",
    archived: "archived",
  })[plan.status];
