import { useController, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import {
  commentCreateSchema,
  type CommentAnchor,
  type CommentCreateInput,
} from "@/contracts/plans";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { ErrorNotice } from "@/components/feedback";
import { anchorKey, parseAnchorKey } from "../lib/anchors";
import type { MentionCandidate } from "../lib/mentions";
import { MentionTextarea } from "./mention-textarea";

const commentFormSchema = z.object({
  body: commentCreateSchema.shape.body,
  anchor: z.string(),
});
type CommentForm = z.infer<typeof commentFormSchema>;

export interface AnchorChoice {
  group: string;
  options: Array<{ key: string; label: string }>;
}

/**
 * Writes a comment: a new thread (optionally anchored to a layer, refractor or shot) or a reply.
 * `onSubmit` gets the API body; the form clears when its promise resolves.
 */
export function CommentForm({
  label,
  submitLabel,
  members,
  anchorChoices,
  fixedAnchor,
  pending,
  error,
  onSubmit,
  onCancel,
  autoFocus,
}: {
  label: string;
  submitLabel: string;
  members: readonly MentionCandidate[];
  /** Offer a place to anchor the new thread; omit for replies and fixed anchors. */
  anchorChoices?: AnchorChoice[];
  fixedAnchor?: CommentAnchor | null;
  pending: boolean;
  error: unknown;
  onSubmit: (input: Omit<CommentCreateInput, "parentId">) => Promise<unknown>;
  onCancel?: () => void;
  autoFocus?: boolean;
}) {
  const form = useForm<CommentForm>({
    resolver: zodResolver(commentFormSchema),
    defaultValues: { body: "", anchor: fixedAnchor ? anchorKey(fixedAnchor) : "" },
  });
  const { field: body } = useController({ control: form.control, name: "body" });
  const submit = form.handleSubmit(async (values) => {
    const anchor = fixedAnchor ?? parseAnchorKey(values.anchor);
    try {
      await onSubmit({ body: values.body, ...(anchor ? { anchor } : {}) });
      // A fixed anchor stays; a chosen one goes back to "the whole plan" for the next comment.
      form.reset();
    } catch {
      // The mutation's error is shown below; keep what was typed.
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-2">
      <Field
        label={label}
        error={form.formState.errors.body?.message}
        hint="Type @ to mention a team member; they are told by e-mail and in their inbox."
      >
        <MentionTextarea
          className="field-input min-h-20 resize-y"
          rows={3}
          members={members}
          value={body.value}
          onChange={body.onChange}
          onBlur={body.onBlur}
          name={body.name}
          autoFocus={autoFocus}
          onKeyDown={(event) => {
            if (event.key === "Enter" && (event.ctrlKey || event.metaKey)) {
              event.preventDefault();
              void submit();
            }
          }}
        />
      </Field>
      {anchorChoices && !fixedAnchor ? (
        <Field label="Points at">
          <select className="field-input" {...form.register("anchor")}>
            <option value="">The whole plan</option>
            {anchorChoices.map((group) => (
              <optgroup key={group.group} label={group.group}>
                {group.options.map((option) => (
                  <option key={option.key} value={option.key}>
                    {option.label}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </Field>
      ) : null}
      {error ? <ErrorNotice error={error} title="Could not post the comment" /> : null}
      <div className="flex gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? "Posting…" : submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
