import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, useParams } from "react-router-dom";
import { z } from "zod";
import { completeResetSchema, requestResetSchema } from "@/contracts/auth";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { ErrorNotice, Notice } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useCompleteReset, useRequestReset } from "../api/password-reset";
import { PasswordStrengthHint } from "./password-strength-hint";
import { AuthFrame } from "./auth-frame";
import { friendlierRateLimit, isLinkProblem, LinkProblem } from "./link-problem";

export function ForgotPasswordPage() {
  const request = useRequestReset();
  const form = useForm<z.input<typeof requestResetSchema>>({
    resolver: zodResolver(requestResetSchema),
    defaultValues: { email: "" },
  });
  return (
    <AuthFrame title="Reset your password">
      {request.isSuccess ? (
        <Notice tone="success">
          If that address belongs to a Spreadsight account, a reset link is on its way. The link
          works once and expires after an hour.
        </Notice>
      ) : (
        <form
          noValidate
          className="flex flex-col gap-4"
          onSubmit={form.handleSubmit((values) => request.mutate({ email: values.email }))}
        >
          <Field label="E-mail" error={form.formState.errors.email?.message}>
            <input
              className="field-input"
              type="email"
              autoComplete="username"
              {...form.register("email")}
            />
          </Field>
          {request.isError ? (
            <ErrorNotice
              error={friendlierRateLimit(request.error)}
              title="Could not send the reset link"
            />
          ) : null}
          <Button type="submit" disabled={request.isPending}>
            Send reset link
          </Button>
        </form>
      )}
      <Link to={paths.signIn} className="mt-4 inline-block text-sm text-ink underline">
        Back to sign in
      </Link>
    </AuthFrame>
  );
}

const newPasswordSchema = completeResetSchema
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, {
    path: ["confirm"],
    message: "the two passwords differ",
  });

export function ResetPasswordPage() {
  const { token = "" } = useParams();
  const complete = useCompleteReset(token);
  const form = useForm<z.input<typeof newPasswordSchema>>({
    resolver: zodResolver(newPasswordSchema),
    defaultValues: { password: "", confirm: "" },
  });
  return (
    <AuthFrame title="Choose a new password">
      {isLinkProblem(complete.error) ? (
        <LinkProblem error={complete.error} kind="reset" />
      ) : complete.isSuccess ? (
        <Notice tone="success">
          Your password is changed.{" "}
          <Link to={paths.signIn} className="underline">
            Sign in
          </Link>{" "}
          with it now.
        </Notice>
      ) : (
        <form
          noValidate
          className="flex flex-col gap-4"
          onSubmit={form.handleSubmit((values) => complete.mutate({ password: values.password }))}
        >
          <Field
            label="New password"
            hint={<PasswordStrengthHint password={form.watch("password") ?? ""} />}
            error={form.formState.errors.password?.message}
          >
            <input
              className="field-input"
              type="password"
              autoComplete="new-password"
              {...form.register("password")}
            />
          </Field>
          <Field label="Repeat the new password" error={form.formState.errors.confirm?.message}>
            <input
              className="field-input"
              type="password"
              autoComplete="new-password"
              {...form.register("confirm")}
            />
          </Field>
          {complete.isError ? (
            <ErrorNotice error={complete.error} title="Could not change the password" />
          ) : null}
          <Button type="submit" disabled={complete.isPending}>
            Set password
          </Button>
        </form>
      )}
    </AuthFrame>
  );
}
