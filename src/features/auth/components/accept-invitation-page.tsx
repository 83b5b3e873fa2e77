import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate, useParams } from "react-router-dom";
import { acceptInvitationSchema, type AcceptInvitationInput } from "@/contracts/auth";
import { ROLE_LABELS } from "@/contracts/common";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { ErrorNotice, Loading } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useAcceptInvitation, useInvitationPreview } from "../api/invitation";
import { AuthFrame } from "./auth-frame";
import { isLinkProblem, LinkProblem } from "./link-problem";
import { PasswordStrengthHint } from "./password-strength-hint";

export function AcceptInvitationPage() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation(token);
  const form = useForm<AcceptInvitationInput>({
    resolver: zodResolver(acceptInvitationSchema),
    defaultValues: { name: "", password: "" },
  });

  if (preview.isPending)
    return (
      <AuthFrame title="Join your team">
        <Loading label="Checking the invitation…" />
      </AuthFrame>
    );
  if (preview.isError)
    return (
      <AuthFrame title="Join your team">
        {isLinkProblem(preview.error) ? (
          <LinkProblem error={preview.error} kind="invitation" />
        ) : (
          <ErrorNotice
            error={preview.error}
            title="Could not check the invitation"
            onRetry={() => preview.refetch()}
          />
        )}
      </AuthFrame>
    );

  return (
    <AuthFrame title={`Join ${preview.data.teamName}`}>
      <p className="mb-4 text-sm text-ink-soft">
        You were invited as <strong className="text-ink">{ROLE_LABELS[preview.data.role]}</strong>{" "}
        with the address <strong className="text-ink">{preview.data.email}</strong>. Choose your
        name and a password.
      </p>
      <form
        noValidate
        className="flex flex-col gap-4"
        onSubmit={form.handleSubmit((values) =>
          accept.mutate(values, { onSuccess: () => navigate(paths.sites, { replace: true }) }),
        )}
      >
        <Field label="Your name" error={form.formState.errors.name?.message}>
          <input className="field-input" autoComplete="name" {...form.register("name")} />
        </Field>
        <Field
          label="Password"
          hint={
            <PasswordStrengthHint
              password={form.watch("password") ?? ""}
              userInputs={[preview.data.email, form.watch("name") ?? "", preview.data.teamName]}
            />
          }
          error={form.formState.errors.password?.message}
        >
          <input
            className="field-input"
            type="password"
            autoComplete="new-password"
            {...form.register("password")}
          />
        </Field>
        {accept.isError ? (
          isLinkProblem(accept.error) ? (
            <LinkProblem error={accept.error} kind="invitation" />
          ) : (
            <ErrorNotice error={accept.error} title="Could not join" />
          )
        ) : null}
        <Button type="submit" disabled={accept.isPending}>
          {accept.isPending ? "Joining…" : "Join the team"}
        </Button>
      </form>
    </AuthFrame>
  );
}
